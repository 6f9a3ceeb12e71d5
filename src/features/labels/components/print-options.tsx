import { useMemo } from 'react';
import { labelCapacity, type LabelCapacity } from '#shared/domain/labels/label-content';
import {
  LABEL_FIELD_WORDS,
  LABEL_FIELDS,
  type LabelField,
} from '#shared/domain/labels/label-layout';
import {
  CUSTOM_SIZE_LIMITS,
  LABEL_SIZE_IDS,
  LABEL_SIZES,
  SHEET_IDS,
  SHEETS,
} from '#shared/domain/labels/sheet-layout';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { TextField } from '@/components/ui/text-field';
import { isLabelSize, sizeOf, type PrintSettings } from '../print-settings';

interface Props {
  settings: PrintSettings;
  onChange: (settings: PrintSettings) => void;
  perSheet: number;
  /** The app's address, which the QR holds: its length decides what fits. */
  origin: string;
}

const FIELD_WORD: Record<LabelField, string> = {
  name: 'name',
  scientificName: 'species',
  stage: 'stage',
  cautions: 'cautions',
};

/** "Code, name, species" — what a size carries, in short, under its name. */
function carries(c: LabelCapacity): string {
  const words = c.fields.filter((f) => f !== 'cautions').map((f) => FIELD_WORD[f]);
  return words.length ? `Code, ${words.join(', ')}` : 'Code only';
}

/** The whole story of the chosen size, in a sentence or two. */
function capacitySentence(c: LabelCapacity): string {
  if (!c.fits)
    return `Too small: the QR’s squares would be ${c.moduleMm.toFixed(2)} mm, under the 0.5 mm that prints and scans reliably.`;
  const fields = c.fields.map((f) => FIELD_WORD[f]);
  const text = `Prints the code${fields.length ? ` with ${fields.join(', ')}` : ''}; QR squares ${c.moduleMm.toFixed(2)} mm.`;
  return c.short
    ? `${text} The QR holds only the collection and the code: Rackside’s Scan screen opens the animal, a phone’s own camera app shows the code as text.`
    : `${text} The QR opens the animal from any phone camera.`;
}
const mmValue = (raw: string) => (raw === '' ? Number.NaN : Number(raw));

export function PrintOptions({ settings, onChange, perSheet, origin }: Props) {
  // Only sizes that print a readable QR for this app's address are offered.
  const capacities = useMemo(
    () => new Map(LABEL_SIZE_IDS.map((id) => [id, labelCapacity(LABEL_SIZES[id], origin)])),
    [origin],
  );
  const sizeOptions = useMemo(
    () => [...LABEL_SIZE_IDS.filter((id) => capacities.get(id)!.fits), 'custom' as const],
    [capacities],
  );
  const chosenSize = sizeOf(settings);
  const chosen = isLabelSize(chosenSize) ? labelCapacity(chosenSize, origin) : null;
  const set = (patch: Partial<PrintSettings>) => onChange({ ...settings, ...patch });
  const toggleField = (f: LabelField) =>
    set({
      fields: settings.fields.includes(f)
        ? settings.fields.filter((x) => x !== f)
        : LABEL_FIELDS.filter((x) => x === f || settings.fields.includes(x)),
    });
  const { minMm, maxMm } = CUSTOM_SIZE_LIMITS;
  const customError = (v: number) =>
    Number.isFinite(v) && v >= minMm && v <= maxMm ? undefined : `${minMm}–${maxMm} mm`;

  return (
    <section aria-labelledby="sheet-heading" className="flex flex-col gap-3">
      <h2 id="sheet-heading" className="text-xl font-extrabold">
        2 · Sheet and labels
      </h2>
      <ChoiceGroup
        legend="Paper"
        className="grid-cols-2"
        value={settings.sheet}
        options={SHEET_IDS}
        onChange={(sheet) => set({ sheet, start: 1 })}
        render={(s) => SHEETS[s].name}
      />
      <ChoiceGroup
        legend="Label size"
        className="grid-cols-2 min-[400px]:grid-cols-3"
        value={settings.size}
        options={sizeOptions}
        onChange={(size) => set({ size, start: 1 })}
        render={(s) =>
          s === 'custom' ? (
            <span>Other size</span>
          ) : (
            <>
              <span>{LABEL_SIZES[s].name}</span>
              <span className="text-xs font-normal">{carries(capacities.get(s)!)}</span>
            </>
          )
        }
      />
      {chosen && (
        <p aria-live="polite" className="text-sm text-muted">
          {capacitySentence(chosen)}
        </p>
      )}
      {settings.size === 'custom' && (
        <div className="grid grid-cols-2 gap-2">
          <TextField
            label="Width (mm)"
            type="number"
            inputMode="decimal"
            min={minMm}
            max={maxMm}
            value={Number.isNaN(settings.custom.widthMm) ? '' : settings.custom.widthMm}
            error={customError(settings.custom.widthMm)}
            onChange={(e) =>
              set({ custom: { ...settings.custom, widthMm: mmValue(e.target.value) }, start: 1 })
            }
          />
          <TextField
            label="Height (mm)"
            type="number"
            inputMode="decimal"
            min={minMm}
            max={maxMm}
            value={Number.isNaN(settings.custom.heightMm) ? '' : settings.custom.heightMm}
            error={customError(settings.custom.heightMm)}
            onChange={(e) =>
              set({ custom: { ...settings.custom, heightMm: mmValue(e.target.value) }, start: 1 })
            }
          />
        </div>
      )}
      <fieldset className="flex flex-col gap-1">
        <legend className="mb-1 font-bold">On each label</legend>
        <p className="text-sm text-muted">
          The code is always printed, large, so it can be typed when a label will not scan.
        </p>
        {LABEL_FIELDS.map((f) => (
          <label
            key={f}
            className="flex min-h-target cursor-pointer items-center gap-3 has-[:focus-visible]:outline has-[:focus-visible]:outline-4"
          >
            <input
              type="checkbox"
              checked={settings.fields.includes(f)}
              onChange={() => toggleField(f)}
              className="size-6 accent-[var(--c-primary)]"
            />
            {LABEL_FIELD_WORDS[f]}
          </label>
        ))}
      </fieldset>
      <TextField
        label="Start at position"
        hint={`On a partly used sheet: position 1 is the top left, counting across. This sheet holds ${perSheet}.`}
        type="number"
        inputMode="numeric"
        min={1}
        max={Math.max(1, perSheet)}
        value={settings.start}
        error={
          settings.start >= 1 && settings.start <= perSheet
            ? undefined
            : `Choose a position from 1 to ${perSheet}.`
        }
        onChange={(e) => set({ start: Math.floor(Number(e.target.value)) || 0 })}
      />
    </section>
  );
}
