import { memo, type CSSProperties } from 'react';
import type { LabelContent } from '#shared/domain/labels/label-content';
import { qrPath } from '#shared/domain/labels/qr-symbol';
import { CautionIcon } from '@/components/ui/icons';

const mm = (n: number) => `${n}mm`;
const at = (x: number, y: number, w: number, h: number): CSSProperties => ({
  position: 'absolute',
  left: mm(x),
  top: mm(y),
  width: mm(w),
  height: mm(h),
});
const ELLIPSIS: CSSProperties = {
  whiteSpace: 'nowrap',
  overflow: 'hidden',
  textOverflow: 'ellipsis',
};

function Cautions({ label, sizeMm }: { label: LabelContent; sizeMm: number }) {
  return (
    <span style={{ display: 'inline-flex', gap: mm(0.6) }}>
      {label.cautions.map((c) => (
        <CautionIcon key={c} caution={c} style={{ width: mm(sizeMm), height: mm(sizeMm) }} />
      ))}
    </span>
  );
}

/**
 * One label drawn in millimetres from the shared layout, so screen, browser print and the
 * server's PDF agree. Black on white whatever the app theme: it is paper.
 */
export const PrintedLabel = memo(function PrintedLabel({ label }: { label: LabelContent }) {
  const { layout, symbol } = label;
  return (
    <>
      <svg
        role="img"
        aria-label={`QR code for ${label.code}`}
        viewBox={`0 0 ${symbol.size} ${symbol.size}`}
        shapeRendering="crispEdges"
        style={at(layout.symbol.x, layout.symbol.y, layout.symbol.widthMm, layout.symbol.heightMm)}
      >
        <path d={qrPath(symbol)} fill="#000" />
      </svg>
      {layout.lines.map((line) => {
        const box = at(layout.text.x, line.y, layout.text.widthMm, line.sizeMm * 1.2);
        if (line.field === 'cautions') {
          return (
            <div key="cautions" style={box}>
              <Cautions label={label} sizeMm={line.sizeMm} />
            </div>
          );
        }
        const words = line.field === 'code' ? label.code : label[line.field];
        return (
          <div
            key={line.field}
            style={{ ...box, display: 'flex', alignItems: 'flex-start', gap: mm(0.6) }}
          >
            <span
              lang={line.field === 'scientificName' ? 'la' : undefined}
              style={{
                ...ELLIPSIS,
                flex: 1,
                fontSize: mm(line.sizeMm),
                lineHeight: 1.15,
                fontWeight: line.field === 'code' ? 800 : 600,
                fontStyle: line.field === 'scientificName' ? 'italic' : 'normal',
                letterSpacing: line.field === 'code' ? '0.04em' : undefined,
              }}
            >
              {words}
            </span>
            {line.field === 'code' && layout.cautionsBesideCode && (
              <Cautions label={label} sizeMm={line.sizeMm} />
            )}
          </div>
        );
      })}
    </>
  );
});
