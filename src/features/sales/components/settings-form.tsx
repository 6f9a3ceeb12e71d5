import { useState, type FormEvent } from 'react';
import { CURRENCY_CODES } from '#shared/domain/sales/money';
import {
  TEMPERATURE_SYMBOL,
  temperatureInUnit,
  temperatureToCelsius,
  type TemperatureUnit,
} from '#shared/domain/temperature';
import type { SalesSettings, SalesSettingsBody } from '#shared/schemas/sales';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextAreaField } from '@/components/ui/text-area-field';
import { TextField } from '@/components/ui/text-field';

const ROUNDING_WORDS = {
  per_invoice:
    'Per invoice: the lines are added up first and the tax on the sum is rounded once to the cent.',
  per_line: 'Per line: each line’s tax is rounded to the cent, and the invoice adds those up.',
} as const;

/** The tax rate typed as a percent ("13" or "7.5") → basis points; null when it is not one. */
function percentToBp(text: string): number | null {
  const match = /^\s*(\d{1,3})(?:[.,](\d{1,2}))?\s*$/.exec(text);
  if (!match) return null;
  const bp = Number(match[1]) * 100 + Number((match[2] ?? '').padEnd(2, '0') || '0');
  return bp <= 10_000 ? bp : null;
}

/**
 * Money, tax, seller details, the default hold and the safe shipping range. Temperatures are
 * typed in the person's unit and sent in °C.
 */
export function SalesSettingsForm({
  settings,
  unit,
  busy,
  error,
  saved,
  onSubmit,
}: {
  settings: SalesSettings;
  unit: TemperatureUnit;
  busy: boolean;
  error: string | null;
  saved: boolean;
  onSubmit: (body: SalesSettingsBody) => void;
}) {
  const [currency, setCurrency] = useState(settings.currency);
  const [rate, setRate] = useState(String(settings.taxRateBp / 100));
  const [rounding, setRounding] = useState<SalesSettings['taxRounding']>(settings.taxRounding);
  const [seller, setSeller] = useState(settings.sellerDetails);
  const [holdDays, setHoldDays] = useState(String(settings.holdDays));
  const [min, setMin] = useState(String(temperatureInUnit(settings.safeMinC, unit)));
  const [max, setMax] = useState(String(temperatureInUnit(settings.safeMaxC, unit)));
  const [problem, setProblem] = useState<string | null>(null);
  const symbol = TEMPERATURE_SYMBOL[unit];

  function submit(e: FormEvent) {
    e.preventDefault();
    const taxRateBp = percentToBp(rate);
    if (taxRateBp === null) return setProblem('Give the tax rate as a percent, e.g. 13 or 7.5.');
    const low = Number(min.replace(',', '.'));
    const high = Number(max.replace(',', '.'));
    if (!Number.isFinite(low) || !Number.isFinite(high) || min === '' || max === '')
      return setProblem(`Give the safe range in ${symbol}.`);
    setProblem(null);
    onSubmit({
      currency,
      taxRateBp,
      taxRounding: rounding,
      sellerDetails: seller,
      holdDays: Number(holdDays),
      safeMinC: temperatureToCelsius(low, unit),
      safeMaxC: temperatureToCelsius(high, unit),
    });
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
      <SelectField
        label="Currency"
        value={currency}
        onChange={(e) => setCurrency(e.target.value)}
        options={CURRENCY_CODES.map((c) => ({ value: c, label: c }))}
      />
      <TextField
        label="Tax rate (%)"
        inputMode="decimal"
        value={rate}
        onChange={(e) => setRate(e.target.value)}
        hint="0 when you charge no tax. What applies to live animals is yours to check."
      />
      <ChoiceGroup
        legend="Tax rounding"
        className="grid-cols-2"
        value={rounding}
        onChange={setRounding}
        options={['per_invoice', 'per_line'] as const}
        render={(o) => (o === 'per_invoice' ? 'Per invoice' : 'Per line')}
      />
      <p className="text-muted">{ROUNDING_WORDS[rounding]}</p>
      <TextAreaField
        label="Seller details (top of each invoice)"
        value={seller}
        onChange={(e) => setSeller(e.target.value)}
        hint="Your name or business, address, tax number."
        rows={4}
      />
      <TextField
        label="Hold reservations for (days)"
        inputMode="numeric"
        value={holdDays}
        onChange={(e) => setHoldDays(e.target.value)}
      />
      <fieldset className="flex flex-col gap-2">
        <legend className="font-bold">Safe shipping range ({symbol})</legend>
        <p className="text-sm text-muted">
          Many shippers hold parcels below about 5 °C or above about 30 °C along the route (common
          practice). Use your own range.
        </p>
        <div className="grid grid-cols-2 gap-2">
          <TextField
            label={`Lowest (${symbol})`}
            inputMode="decimal"
            value={min}
            onChange={(e) => setMin(e.target.value)}
          />
          <TextField
            label={`Highest (${symbol})`}
            inputMode="decimal"
            value={max}
            onChange={(e) => setMax(e.target.value)}
          />
        </div>
      </fieldset>
      {(problem ?? error) && <Notice tone="error" title={problem ?? error ?? ''} />}
      {saved && !error && !problem && <Notice tone="ok" title="Sales settings saved." />}
      <Button type="submit" wide busy={busy}>
        Save sales settings
      </Button>
    </form>
  );
}
