// Rackside's own symbols: simple strokes that read at a glance and in greyscale.
import type { SVGProps } from 'react';
import type { Caution } from '#shared/domain/animal-facts';
import { CAUTION_SYMBOL_PATHS } from '#shared/domain/caution-symbols';

function Svg(props: SVGProps<SVGSVGElement>) {
  return (
    <svg
      viewBox="0 0 24 24"
      width="28"
      height="28"
      fill="none"
      stroke="currentColor"
      strokeWidth="2.2"
      strokeLinecap="round"
      strokeLinejoin="round"
      aria-hidden="true"
      {...props}
    />
  );
}

/** Today: a checklist on a shelf. */
export function RoundIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <path d="M4 6.5l2 2 3.5-4M12 7h8M4 14l2 2 3.5-4M12 14.5h8M3 21h18" />
    </Svg>
  );
}

/** Scan: a viewfinder's corners around a dot. */
export function ScanIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <path d="M3 8V3h5M16 3h5v5M21 16v5h-5M8 21H3v-5" />
      <path d="M8 8h3v3H8zM13 13h3v3h-3zM13 8h3M8 16h3" />
    </Svg>
  );
}

/** Animals: three stacked enclosures. */
export function RackIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <rect x="3" y="3" width="18" height="18" rx="2" />
      <path d="M3 9h18M3 15h18M9 3v18" />
    </Svg>
  );
}

/** Settings: a dial. */
export function DialIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <circle cx="12" cy="12" r="8" />
      <path d="M12 12l4-4M12 2v2M12 20v2M2 12h2M20 12h2" />
    </Svg>
  );
}

/** A caution's own symbol (shared with printed labels). */
export function CautionIcon({ caution, ...props }: SVGProps<SVGSVGElement> & { caution: Caution }) {
  return (
    <Svg {...props}>
      {CAUTION_SYMBOL_PATHS[caution].map((d) => (
        <path key={d} d={d} />
      ))}
    </Svg>
  );
}

export function MailIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <rect x="3" y="5" width="18" height="14" rx="2" />
      <path d="M3 7l9 6 9-6" />
    </Svg>
  );
}

/** Remove prey: tongs lifting something out of a box. */
export function RemovePreyIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <path d="M4 12v8h16v-8" />
      <path d="M12 16V3M8 7l4-4 4 4" />
    </Svg>
  );
}

/** Feed: tongs closing on prey. */
export function FeedIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <path d="M3 3l9 12M9 3l3 12" />
      <ellipse cx="15.5" cy="18" rx="4.5" ry="2.5" />
    </Svg>
  );
}

/** Water: a drop over a dish. */
export function WaterIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <path d="M12 3c2.5 3.5 4.5 6 4.5 8.5a4.5 4.5 0 0 1-9 0C7.5 9 9.5 6.5 12 3z" />
      <path d="M3 19h18l-2 2H5z" />
    </Svg>
  );
}

/** Mist: a spray nozzle and three droplets. */
export function MistIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <path d="M3 10h6v6H3zM9 12h3" />
      <path d="M15 8v.01M18 12v.01M15 16v.01M21 8v.01M21 16v.01" strokeWidth={3} />
    </Svg>
  );
}

/** Moisten substrate: a drop over a layered ground line. */
export function MoistenIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <path d="M12 3c2 2.8 3.5 4.8 3.5 6.7a3.5 3.5 0 0 1-7 0C8.5 7.8 10 5.8 12 3z" />
      <path d="M3 16h18M5 20h14" />
    </Svg>
  );
}

/** Spot-clean: tongs lifting a small ball. */
export function SpotCleanIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <path d="M4 3l8 13M10 3l3 13" />
      <circle cx="13.5" cy="18.5" r="2.5" />
      <path d="M3 21h18" />
    </Svg>
  );
}

/** Rehouse: a small box with an arrow into a bigger one. */
export function RehouseIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <rect x="2" y="11" width="7" height="7" rx="1" />
      <rect x="12" y="5" width="10" height="15" rx="1" />
      <path d="M7 8h8M12.5 5.5L15 8l-2.5 2.5" />
    </Svg>
  );
}

/** Check: an eye. */
export function CheckIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <path d="M2 12s3.5-6 10-6 10 6 10 6-3.5 6-10 6S2 12 2 12z" />
      <circle cx="12" cy="12" r="2.5" />
    </Svg>
  );
}

/** Leave alone: a raised flat hand (stop). */
export function LeaveAloneIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <circle cx="12" cy="12" r="9" />
      <path d="M9.5 8.5v7M14.5 8.5v7" />
    </Svg>
  );
}

/** Sales — S: a price tag on a string. */
export function TagIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <path d="M3 12.5V4a1 1 0 0 1 1-1h8.5L21 11.5 12.5 20z" />
      <circle cx="7.5" cy="7.5" r="1.5" />
    </Svg>
  );
}

/** Tomorrow: a calendar page with an arrow. */
export function TomorrowIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <rect x="3" y="5" width="18" height="16" rx="2" />
      <path d="M3 10h18M8 3v4M16 3v4M10 15.5h5M13 13l2.5 2.5L13 18" />
    </Svg>
  );
}

/** Held: an open hand raised, "stop" (a withdrawn task, food withheld). */
export function HoldIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <path d="M7 12V6.5a1.5 1.5 0 013 0V11M10 10.5V5a1.5 1.5 0 013 0v5.5M13 10.5V6a1.5 1.5 0 013 0v6" />
      <path d="M16 12V9.5a1.5 1.5 0 013 0V15a6 6 0 01-6 6h-1a6 6 0 01-5-2.7L4.5 14.5a1.5 1.5 0 012.5-1.7L7 13" />
    </Svg>
  );
}
