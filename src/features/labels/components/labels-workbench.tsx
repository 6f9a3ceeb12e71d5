import { useEffect, useMemo, useState } from 'react';
import { createPortal } from 'react-dom';
import { labelContent, printProblem } from '#shared/domain/labels/label-content';
import { LABEL_FIELD_WORDS } from '#shared/domain/labels/label-layout';
import {
  CUSTOM_SIZE_LIMITS,
  PRINT_BLEED_MM,
  PRINT_MARGIN_MM,
  sheetCount,
  sheetLayout,
  SHEETS,
} from '#shared/domain/labels/sheet-layout';
import type { AnimalSummary } from '#shared/schemas/animals';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { useOnline } from '@/lib/use-online';
import { nfcAvailable } from '@/lib/web-nfc';
import { downloadLabelsPdf } from '../api/download-pdf';
import {
  isLabelSize,
  loadSettings,
  saveSettings,
  sizeOf,
  type PrintSettings,
} from '../print-settings';
import { AnimalChooser } from './animal-chooser';
import { LabelSheets } from './label-sheets';
import { NfcTagBatch } from './nfc-tag-batch';
import { PrintOptions } from './print-options';

interface Props {
  collectionId: string;
  labelTag: string;
  timeZone: string;
  /** The collection's animals in walk order. */
  animals: readonly AnimalSummary[];
  /** Animals chosen before arriving (from the collection list or an animal's page). */
  preselected: readonly string[];
}

/** The page's own scale, so a whole A4 sheet fits a phone screen without sideways scrolling. */
function useFitScale(pageWidthMm: number) {
  const [el, setEl] = useState<HTMLDivElement | null>(null);
  const [scale, setScale] = useState(1);
  useEffect(() => {
    if (!el) return;
    const pxPerMm = 96 / 25.4; // CSS Values 4, 6.2
    const observer = new ResizeObserver(([entry]) =>
      setScale(Math.min(1, entry!.contentRect.width / (pageWidthMm * pxPerMm))),
    );
    observer.observe(el);
    return () => observer.disconnect();
  }, [el, pageWidthMm]);
  return [setEl, scale] as const;
}

export function LabelsWorkbench({ collectionId, labelTag, timeZone, animals, preselected }: Props) {
  const [chosen, setChosen] = useState<Set<string>>(() => new Set(preselected));
  const [settings, setSettings] = useState<PrintSettings>(() =>
    loadSettings(localStorage, navigator.language),
  );
  const [trueSize, setTrueSize] = useState(false);
  const [pdf, setPdf] = useState<{ busy: boolean; error: string | null }>({
    busy: false,
    error: null,
  });
  const online = useOnline();
  const change = (next: PrintSettings) => {
    setSettings(next);
    saveSettings(localStorage, next);
  };

  const size = useMemo(
    () => sizeOf({ size: settings.size, custom: settings.custom }),
    [settings.size, settings.custom],
  );
  const sizeValid = isLabelSize(size);
  const sheet = useMemo(
    () => (sizeValid ? sheetLayout(settings.sheet, size) : null),
    [settings.sheet, size, sizeValid],
  );
  const origin = window.location.origin;
  const labels = useMemo(
    () =>
      sizeValid
        ? animals
            .filter((a) => chosen.has(a.id))
            .map((a) => labelContent(a, labelTag, origin, size, settings.fields))
        : [],
    [animals, chosen, labelTag, origin, settings.fields, size, sizeValid],
  );
  const perSheet = sheet?.perSheet ?? 0;
  const startValid = settings.start >= 1 && settings.start <= perSheet;
  const problem = !sizeValid
    ? `Give a label size from ${CUSTOM_SIZE_LIMITS.minMm} to ${CUSTOM_SIZE_LIMITS.maxMm} mm.`
    : printProblem(labels);
  const canPrint = labels.length > 0 && !problem && startValid && !!sheet;
  const dropped = labels[0]?.layout.dropped ?? [];
  const pages = sheet ? sheetCount(labels.length, settings.start, perSheet) : 0;
  // The sheet as drawn: the print area, a little wider than the printable one.
  const [fitRef, fitScale] = useFitScale(
    SHEETS[settings.sheet].widthMm - 2 * (PRINT_MARGIN_MM - PRINT_BLEED_MM),
  );

  const printPdf = async () => {
    setPdf({ busy: true, error: null });
    try {
      await downloadLabelsPdf(collectionId, {
        animalIds: labels.map((l) => l.animalId),
        sheet: settings.sheet,
        size,
        fields: settings.fields,
        start: settings.start,
        origin,
      });
      setPdf({ busy: false, error: null });
    } catch (err) {
      setPdf({
        busy: false,
        error: err instanceof ApiError ? err.message : 'The PDF could not be made. Try again.',
      });
    }
  };

  return (
    <div className="flex flex-col gap-6">
      <AnimalChooser animals={animals} timeZone={timeZone} chosen={chosen} onChange={setChosen} />
      <PrintOptions settings={settings} onChange={change} perSheet={perSheet} origin={origin} />

      <section aria-labelledby="preview-heading" className="flex flex-col gap-3">
        <h2 id="preview-heading" className="text-xl font-extrabold">
          3 · Preview and print
        </h2>
        {problem && labels.length > 0 && <Notice tone="error" title={problem} />}
        {labels.length === 0 && (
          <p className="text-muted">Choose animals above to see their labels.</p>
        )}
        {canPrint && (
          <p aria-live="polite" className="font-bold">
            {labels.length} {labels.length === 1 ? 'label' : 'labels'} on {pages}{' '}
            {pages === 1 ? 'sheet' : 'sheets'} of {SHEETS[settings.sheet].name} · QR{' '}
            {labels[0]!.layout.symbol.widthMm} mm, squares {labels[0]!.layout.moduleMm.toFixed(2)}{' '}
            mm{labels.some((l) => l.short) && ' · short QR for the Scan screen'}
          </p>
        )}
        {canPrint && dropped.length > 0 && (
          <p className="text-sm text-muted">
            No room on this size for:{' '}
            {dropped.map((f) => LABEL_FIELD_WORDS[f].toLowerCase()).join(', ')}.
          </p>
        )}
        <div className="flex flex-col gap-2">
          <Button wide disabled={!canPrint} onClick={() => window.print()}>
            Print labels
          </Button>
          <Button
            wide
            variant="secondary"
            disabled={!canPrint || !online}
            busy={pdf.busy}
            onClick={() => void printPdf()}
          >
            Download PDF
          </Button>
          <p className="text-sm text-muted">
            {online
              ? 'Print with scale at 100 % (“actual size”), not “fit to page”, then measure the 50 mm ruler on the sheet. The PDF is for browsers that ignore the page size; open it and print it at actual size too.'
              : 'The PDF is made on the server and needs a connection. Printing from this page works offline.'}
          </p>
          {pdf.error && <Notice tone="error" title={pdf.error} />}
        </div>
        {labels.length > 0 && nfcAvailable() && (
          <NfcTagBatch labels={labels} labelTag={labelTag} origin={origin} />
        )}
        {canPrint && sheet && (
          <>
            <label className="flex min-h-target cursor-pointer items-center gap-3">
              <input
                type="checkbox"
                checked={trueSize}
                onChange={(e) => setTrueSize(e.target.checked)}
                className="size-6 accent-[var(--c-primary)]"
              />
              Show at true size (scroll sideways)
            </label>
            <div
              ref={fitRef}
              className="overflow-x-auto rounded-xl border-2 border-border bg-[#888] p-2"
              role="region"
              tabIndex={0}
              aria-label="Label preview"
            >
              <div className="flex flex-col gap-4" style={{ zoom: trueSize ? 1 : fitScale }}>
                <LabelSheets labels={labels} sheet={sheet} start={settings.start} showUsedCells />
              </div>
            </div>
          </>
        )}
      </section>

      {canPrint &&
        sheet &&
        createPortal(
          <div id="print-labels">
            {/* CSS Paged Media 3, 7.1: the sheet's size and margins go to the printer. */}
            <style>{`@page { size: ${SHEETS[settings.sheet].widthMm}mm ${SHEETS[settings.sheet].heightMm}mm; margin: ${sheet.printArea.y}mm ${sheet.printArea.x}mm; }`}</style>
            <LabelSheets labels={labels} sheet={sheet} start={settings.start} />
          </div>,
          document.body,
        )}
    </div>
  );
}
