import { useState, type FormEvent } from 'react';
import {
  CURRENCY_CODES,
  isCurrencyCode,
  minorToDecimal,
  parseAmount,
  type CurrencyCode,
} from '#shared/domain/sales/money';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextAreaField } from '@/components/ui/text-area-field';
import { TextField } from '@/components/ui/text-field';

export interface OfferValues {
  priceMinor: number;
  currency: CurrencyCode;
  description: string;
  listedPublicly: boolean;
}

/** The money of the reader's region, when we sell in it; euro otherwise. */
export function localCurrency(): CurrencyCode {
  const region = new Intl.Locale(navigator.language).maximize().region ?? '';
  const byRegion: Record<string, CurrencyCode> = {
    AU: 'AUD',
    CA: 'CAD',
    CH: 'CHF',
    CZ: 'CZK',
    DK: 'DKK',
    GB: 'GBP',
    IS: 'ISK',
    JP: 'JPY',
    NO: 'NOK',
    NZ: 'NZD',
    PL: 'PLN',
    SE: 'SEK',
    US: 'USD',
  };
  return byRegion[region] ?? 'EUR';
}

/**
 * A price typed as text in the currency's main unit ("25" or "25.00"), read with parseAmount
 * into whole minor units (never a float), the words for the buyer and whether the public list
 * shows it.
 */
export function OfferForm({
  initial,
  defaultCurrency,
  submitLabel,
  busy,
  error,
  onSubmit,
}: {
  initial?: OfferValues;
  defaultCurrency: CurrencyCode;
  submitLabel: string;
  busy: boolean;
  error: string | null;
  onSubmit: (values: OfferValues) => void;
}) {
  const [currency, setCurrency] = useState<CurrencyCode>(initial?.currency ?? defaultCurrency);
  const [price, setPrice] = useState(
    initial ? minorToDecimal(initial.priceMinor, initial.currency) : '',
  );
  const [description, setDescription] = useState(initial?.description ?? '');
  const [listedPublicly, setListedPublicly] = useState(initial?.listedPublicly ?? true);
  const [priceError, setPriceError] = useState<string | undefined>();

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const minor = parseAmount(price, currency);
    if (minor === null) {
      setPriceError(
        currency === 'JPY' || currency === 'ISK'
          ? `Type a whole amount in ${currency}, such as 2500.`
          : `Type an amount in ${currency}, such as 25 or 25.00.`,
      );
      return;
    }
    setPriceError(undefined);
    onSubmit({ priceMinor: minor, currency, description, listedPublicly });
  };

  return (
    <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
      <div className="grid grid-cols-[minmax(0,1fr)_7rem] gap-2">
        <TextField
          label="Price"
          inputMode="decimal"
          autoComplete="off"
          value={price}
          onChange={(e) => setPrice(e.target.value)}
          error={priceError}
          className="min-w-0"
          required
        />
        <SelectField
          label="Currency"
          className="min-w-0"
          value={currency}
          onChange={(e) => isCurrencyCode(e.target.value) && setCurrency(e.target.value)}
          options={CURRENCY_CODES.map((c) => ({ value: c, label: c }))}
        />
      </div>
      <TextAreaField
        label="For the buyer"
        hint="A line or two: how it eats, what it is kept on. Shown on its care sheet."
        value={description}
        maxLength={500}
        rows={2}
        onChange={(e) => setDescription(e.target.value)}
      />
      <label className="flex min-h-target items-center gap-3 text-lg">
        <input
          type="checkbox"
          className="size-6"
          checked={listedPublicly}
          onChange={(e) => setListedPublicly(e.target.checked)}
        />
        Show on the public list
      </label>
      {error && <Notice tone="error" title={error} />}
      <Button type="submit" busy={busy} wide>
        {submitLabel}
      </Button>
    </form>
  );
}
