import { LABEL_FIELDS, type LabelField } from '#shared/domain/labels/label-layout';
import {
  CUSTOM_SIZE_LIMITS,
  LABEL_SIZES,
  type LabelSize,
  type LabelSizeId,
  type SheetId,
} from '#shared/domain/labels/sheet-layout';

export interface PrintSettings {
  sheet: SheetId;
  size: LabelSizeId | 'custom';
  custom: LabelSize;
  fields: LabelField[];
  start: number;
}

const STORE_KEY = 'rackside.label-settings';

/** Letter where it is the usual paper (the United States, Canada, Mexico…), A4 elsewhere (from memory). */
export function defaultSheet(language: string): SheetId {
  return /^(en-(US|CA)|es-(US|MX)|fr-CA)$/i.test(language) ? 'letter' : 'a4';
}

export function defaultSettings(language: string): PrintSettings {
  return {
    sheet: defaultSheet(language),
    size: 'square-38',
    custom: { widthMm: 40, heightMm: 30 },
    fields: [...LABEL_FIELDS],
    start: 1,
  };
}

export function sizeOf(settings: Pick<PrintSettings, 'size' | 'custom'>): LabelSize {
  return settings.size === 'custom' ? settings.custom : LABEL_SIZES[settings.size];
}

/** A size the server would accept too (see `labelPdfBody`). */
export function isLabelSize(size: LabelSize): boolean {
  const { minMm, maxMm } = CUSTOM_SIZE_LIMITS;
  return [size.widthMm, size.heightMm].every((v) => Number.isFinite(v) && v >= minMm && v <= maxMm);
}

/** The keeper's label stock rarely changes, so the last choices come back (not the start cell). */
export function loadSettings(storage: Pick<Storage, 'getItem'>, language: string): PrintSettings {
  const fallback = defaultSettings(language);
  try {
    const saved = JSON.parse(storage.getItem(STORE_KEY) ?? 'null') as Partial<PrintSettings> | null;
    if (!saved) return fallback;
    return {
      sheet: saved.sheet === 'a4' || saved.sheet === 'letter' ? saved.sheet : fallback.sheet,
      size:
        saved.size === 'custom' || (saved.size && saved.size in LABEL_SIZES)
          ? saved.size
          : fallback.size,
      custom: saved.custom ?? fallback.custom,
      fields: Array.isArray(saved.fields)
        ? saved.fields.filter((f): f is LabelField =>
            (LABEL_FIELDS as readonly string[]).includes(f),
          )
        : fallback.fields,
      start: 1,
    };
  } catch {
    return fallback;
  }
}

export function saveSettings(storage: Pick<Storage, 'setItem'>, settings: PrintSettings) {
  try {
    storage.setItem(STORE_KEY, JSON.stringify({ ...settings, start: undefined }));
  } catch {
    // Private mode or a full disk: the settings just are not remembered.
  }
}
