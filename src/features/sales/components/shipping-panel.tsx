import { useState, type FormEvent } from 'react';
import {
  TEMPERATURE_SYMBOL,
  formatTemperatureRange,
  temperatureInUnit,
  temperatureToCelsius,
  type TemperatureUnit,
} from '#shared/domain/temperature';
import type { SaleDetail, ShippingBody } from '#shared/schemas/sales';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { concernText } from './sales-words';

type Shipping = SaleDetail['shipping'];

/** The shipping caution, always in sight where a keeper ships. */
export function ShippingCaution({ text }: { text: string }) {
  return (
    <Notice tone="warning" title="Live animals in the post">
      <p>{text}</p>
    </Notice>
  );
}

/**
 * The ship day and the route's forecast (typed in the person's unit, sent in °C), the carrier,
 * and the packing checklist. Saving a new day or forecast asks for the check again.
 */
export function ShippingForm({
  shipping,
  unit,
  busy,
  error,
  onSubmit,
}: {
  shipping: Shipping;
  unit: TemperatureUnit;
  busy: boolean;
  error: string | null;
  onSubmit: (body: ShippingBody) => void;
}) {
  const inUnit = (c: number | null) => (c === null ? '' : String(temperatureInUnit(c, unit)));
  const [shipOn, setShipOn] = useState(shipping.shipOn ?? '');
  const [route, setRoute] = useState(shipping.shipRoute ?? '');
  const [low, setLow] = useState(inUnit(shipping.forecastLowC));
  const [high, setHigh] = useState(inUnit(shipping.forecastHighC));
  const [carrier, setCarrier] = useState(shipping.carrier ?? '');
  const [tracking, setTracking] = useState(shipping.tracking ?? '');
  const [packing, setPacking] = useState<Record<string, boolean>>(
    Object.fromEntries(shipping.packing.map((p) => [p.key, p.done])),
  );
  const [problem, setProblem] = useState<string | null>(null);
  const symbol = TEMPERATURE_SYMBOL[unit];

  function submit(e: FormEvent) {
    e.preventDefault();
    const lo = Number(low.replace(',', '.'));
    const hi = Number(high.replace(',', '.'));
    if (low === '' || high === '' || !Number.isFinite(lo) || !Number.isFinite(hi))
      return setProblem(`Give the forecast low and high along the route in ${symbol}.`);
    setProblem(null);
    onSubmit({
      shipOn,
      shipRoute: route,
      forecastLowC: temperatureToCelsius(lo, unit),
      forecastHighC: temperatureToCelsius(hi, unit),
      packing,
      carrier,
      tracking,
    });
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
      <TextField
        label="Ship on"
        type="date"
        value={shipOn}
        onChange={(e) => setShipOn(e.target.value)}
      />
      <TextField
        label="Route"
        value={route}
        onChange={(e) => setRoute(e.target.value)}
        hint="From where to where, e.g. Toronto to Ottawa."
      />
      <div className="grid grid-cols-2 gap-2">
        <TextField
          label={`Forecast low (${symbol})`}
          inputMode="decimal"
          value={low}
          onChange={(e) => setLow(e.target.value)}
        />
        <TextField
          label={`Forecast high (${symbol})`}
          inputMode="decimal"
          value={high}
          onChange={(e) => setHigh(e.target.value)}
        />
      </div>
      <p className="text-sm text-muted">
        Your safe range is {formatTemperatureRange(shipping.safeMinC, shipping.safeMaxC, unit)}{' '}
        (Sales settings).
      </p>
      <TextField label="Carrier" value={carrier} onChange={(e) => setCarrier(e.target.value)} />
      <TextField
        label="Tracking number"
        value={tracking}
        onChange={(e) => setTracking(e.target.value)}
      />
      <fieldset className="flex flex-col gap-1">
        <legend className="mb-1 font-bold">Packing checklist</legend>
        {shipping.packing.map((p) => (
          <label
            key={p.key}
            className={`flex min-h-target cursor-pointer items-center gap-3 rounded-xl border-2 border-border bg-surface px-3 py-2 ${p.needed ? '' : 'opacity-80'}`}
          >
            <input
              type="checkbox"
              className="size-6 shrink-0"
              checked={packing[p.key] ?? false}
              onChange={(e) => setPacking({ ...packing, [p.key]: e.target.checked })}
            />
            <span>
              {p.words}
              {!p.needed && <span className="text-muted"> (not needed on this forecast)</span>}
            </span>
          </label>
        ))}
      </fieldset>
      {(problem ?? error) && <Notice tone="error" title={problem ?? error ?? ''} />}
      <Button type="submit" wide busy={busy}>
        Save shipping
      </Button>
    </form>
  );
}

/** The check the keeper confirms: the concerns in words, and "ship anyway" over them. */
export function ShippingCheck({
  shipping,
  unit,
  busy,
  error,
  onConfirm,
}: {
  shipping: Shipping;
  unit: TemperatureUnit;
  busy: boolean;
  error: string | null;
  onConfirm: (shipAnyway: boolean) => void;
}) {
  const [anyway, setAnyway] = useState(false);
  if (!shipping.concerns)
    return <p className="text-muted">Save the ship day and the forecast to check them.</p>;
  if (shipping.confirmedAt)
    return (
      <Notice tone="ok" title="Shipping check confirmed.">
        {shipping.confirmedOver?.length ? (
          <p>
            Confirmed over these concerns:{' '}
            {shipping.confirmedOver.map((c) => concernText(c, unit)).join(' ')}
          </p>
        ) : null}
      </Notice>
    );
  const concerns = shipping.concerns;
  return (
    <div className="flex flex-col gap-2">
      {concerns.length ? (
        <Notice tone="warning" title="This day needs a second look">
          <ul className="list-disc pl-5">
            {concerns.map((c) => (
              <li key={c.kind}>{concernText(c, unit)}</li>
            ))}
          </ul>
        </Notice>
      ) : (
        <Notice tone="ok" title="The forecast is within your safe range, early in the week." />
      )}
      {concerns.length > 0 && (
        <label className="flex min-h-target cursor-pointer items-center gap-3 rounded-xl border-2 border-border bg-surface px-3 py-2">
          <input
            type="checkbox"
            className="size-6 shrink-0"
            checked={anyway}
            onChange={(e) => setAnyway(e.target.checked)}
          />
          <span>I have weighed this and ship anyway</span>
        </label>
      )}
      {error && <Notice tone="error" title={error} />}
      <Button
        wide
        busy={busy}
        disabled={concerns.length > 0 && !anyway}
        onClick={() => onConfirm(anyway)}
      >
        Confirm the shipping check
      </Button>
    </div>
  );
}
