import type { CSSProperties } from 'react';
import type { LabelContent } from '#shared/domain/labels/label-content';
import {
  CUT_LINE_OFFSET_MM,
  CUT_LINE_WIDTH_MM,
  placeLabels,
  RULER_LENGTH_MM,
  type SheetLayout,
} from '#shared/domain/labels/sheet-layout';
import { PrintedLabel } from './printed-label';

const mm = (n: number) => `${n}mm`;

/** 50 mm with millimetre ticks: measured on the printout, it shows the print was not scaled. */
function Ruler({ sheet, page, pages }: { sheet: SheetLayout; page: number; pages: number }) {
  const { lengthMm } = sheet.ruler;
  // Relative to the print area, like the labels.
  const x = sheet.ruler.x - sheet.printArea.x;
  const y = sheet.ruler.y - sheet.printArea.y;
  const ticks = Array.from({ length: RULER_LENGTH_MM + 1 }, (_, i) => i);
  return (
    <div
      style={{
        position: 'absolute',
        left: mm(x),
        top: mm(y - 3),
        width: mm(sheet.printable.widthMm),
        height: mm(5),
      }}
    >
      <svg
        viewBox={`0 0 ${lengthMm} 3.2`}
        style={{
          position: 'absolute',
          left: 0,
          top: 0,
          width: mm(lengthMm),
          height: mm(3.2),
          overflow: 'visible',
        }}
        aria-hidden="true"
      >
        <path d={`M0 3H${lengthMm}`} stroke="#000" strokeWidth={0.18} />
        {ticks.map((t) => (
          <path
            key={t}
            d={`M${t} 3V${3 - (t % 10 === 0 ? 3 : t % 5 === 0 ? 2 : 1)}`}
            stroke="#000"
            strokeWidth={0.18}
          />
        ))}
      </svg>
      <p
        style={{
          position: 'absolute',
          left: mm(lengthMm + 3),
          top: 0,
          margin: 0,
          fontSize: mm(2.5),
          lineHeight: 1.2,
          whiteSpace: 'nowrap',
        }}
      >
        {RULER_LENGTH_MM} mm scale: if it measures otherwise, print at actual size (100 %). Sheet{' '}
        {page} of {pages}.
      </p>
    </div>
  );
}

interface Props {
  labels: readonly LabelContent[];
  sheet: SheetLayout;
  start: number;
  /** Cells before the start position, drawn faintly on screen so the keeper sees what is skipped. */
  showUsedCells?: boolean;
}

/**
 * The sheets at true size in CSS millimetres (CSS Values 4: 1in = 25.4mm = 96px). Positions
 * are from the page's corner; the `@page` margins (the print area's corner) are subtracted so
 * print and PDF match. The print area reaches past the printable one so that the clipping
 * below leaves the outer labels' cut lines whole.
 */
export function LabelSheets({ labels, sheet, start, showUsedCells = false }: Props) {
  const places = placeLabels(labels.length, start, sheet.perSheet);
  const pages = (places.at(-1)?.sheet ?? 0) + 1;
  const byPage: { label: LabelContent; cell: number }[][] = Array.from({ length: pages }, () => []);
  labels.forEach((label, i) => byPage[places[i]!.sheet]!.push({ label, cell: places[i]!.cell }));
  const { x: ox, y: oy } = sheet.printArea;
  const page: CSSProperties = {
    position: 'relative',
    width: mm(sheet.printArea.widthMm),
    // A hair under the page box, so rounding never spills a sheet onto a second page.
    height: mm(sheet.printArea.heightMm - 0.5),
    overflow: 'hidden',
    // Without containment Chromium paginates the clipped, absolutely placed labels as if they
    // still took room, and prints a blank page after the last sheet.
    contain: 'strict',
    background: '#fff',
    color: '#000',
  };
  return (
    <>
      {byPage.map((list, p) => (
        <section
          key={p}
          className="label-sheet"
          aria-label={`Sheet ${p + 1} of ${pages}`}
          style={page}
        >
          {showUsedCells &&
            p === 0 &&
            sheet.cells.slice(0, Math.max(0, start - 1)).map((c, i) => (
              <div
                key={`used-${i}`}
                className="print:hidden"
                style={{
                  position: 'absolute',
                  left: mm(c.x - ox),
                  top: mm(c.y - oy),
                  width: mm(sheet.label.widthMm),
                  height: mm(sheet.label.heightMm),
                  background: 'repeating-linear-gradient(45deg, #ddd 0 2mm, #fff 2mm 4mm)',
                }}
              />
            ))}
          {list.map(({ label, cell }) => {
            const c = sheet.cells[cell]!;
            return (
              <div
                key={label.animalId}
                data-animal-id={label.animalId}
                style={{
                  position: 'absolute',
                  left: mm(c.x - ox),
                  top: mm(c.y - oy),
                  width: mm(sheet.label.widthMm),
                  height: mm(sheet.label.heightMm),
                  // The cut line sits just outside the label, in the gap, never on the quiet zone.
                  outline: `${mm(CUT_LINE_WIDTH_MM)} dashed #9a9a9a`,
                  outlineOffset: mm(CUT_LINE_OFFSET_MM),
                  borderRadius: '1mm',
                }}
              >
                <PrintedLabel label={label} />
              </div>
            );
          })}
          <Ruler sheet={sheet} page={p + 1} pages={pages} />
        </section>
      ))}
    </>
  );
}
