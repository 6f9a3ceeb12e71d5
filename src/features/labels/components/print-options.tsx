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
import type { PrintSettings } from '../print-settings';

interface Props {
  settings: PrintSettings;
  onChange: (settings: PrintSettings) => void;
  perSheet: number;
}

const SIZE_OPTIONS = [...LABEL_SIZE_IDS, 'custom'] as const;
const mmValue = (raw: string) => (raw === '' ? Number.NaN : Number(raw));

export function PrintOptions({ settings, onChange, perSheet }: Props) {
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
        options={SIZE_OPTIONS}
        onChange={(size) => set({ size, start: 1 })}
        render={(s) => (s === 'custom' ? 'Other size' : LABEL_SIZES[s].name)}
      />
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
