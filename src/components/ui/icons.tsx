// Rackside's own symbols: simple strokes that read at a glance and in greyscale.
import type { SVGProps } from 'react';

function Svg(props: SVGProps<SVGSVGElement>) {
  return (
    <svg viewBox="0 0 24 24" width="28" height="28" fill="none" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" strokeLinejoin="round" aria-hidden="true" {...props} />
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

/** Potent venom: a drop. */
export function VenomIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <path d="M12 3c3 4.5 6 8 6 11a6 6 0 0 1-12 0c0-3 3-6.5 6-11z" />
      <path d="M10 14.5a2 2 0 0 0 2 2" />
    </Svg>
  );
}

/** Urticating hairs: short bristles flying off a curve. */
export function HairsIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <path d="M4 19c4-1 7-4 8-9" />
      <path d="M12 5l1-3M16 7l3-2M17 11l3 0M15 15l2 2M9 8L7 5" />
    </Svg>
  );
}

/** Fast or defensive: a zigzag dash. */
export function FastIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <path d="M13 2L5 13h6l-1 9 8-11h-6z" />
    </Svg>
  );
}

/** Escape risk: an arrow leaving a box. */
export function EscapeIcon(props: SVGProps<SVGSVGElement>) {
  return (
    <Svg {...props}>
      <path d="M10 4H4v16h16v-6" />
      <path d="M13 11l8-8M15 3h6v6" />
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
