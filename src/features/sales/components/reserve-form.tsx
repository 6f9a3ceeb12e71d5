import { useMemo, useState, type FormEvent } from 'react';
import { SEX_LABEL, STAGE_LABEL } from '#shared/domain/animal-facts';
import type { AvailableAnimal, BuyerView } from '#shared/schemas/sales';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { money } from './sales-words';

export interface ReserveChoice {
  /** An existing buyer, or the name (and e-mail) of a new one. */
  buyer: { id: string } | { name: string; email: string };
  animalIds: string[];
  reservedUntil: string;
}

const NEW_BUYER = 'new';

/** Available animals by clutch ("Single animals" for the rest), in label order. */
function byClutch(animals: readonly AvailableAnimal[]) {
  const groups = new Map<string, AvailableAnimal[]>();
  for (const a of animals) {
    const key = a.clutch ?? '';
    groups.set(key, [...(groups.get(key) ?? []), a]);
  }
  return [...groups.entries()].sort(([a], [b]) =>
    a === '' ? 1 : b === '' ? -1 : a.localeCompare(b),
  );
}

/**
 * Reserve: choose animals from what is available — by clutch, with "take N" for slings that
 * are all alike — and a buyer, existing or new; the hold's last day defaults from the settings.
 */
export function ReserveForm({
  available,
  buyers,
  defaultUntil,
  busy,
  error,
  onSubmit,
}: {
  available: readonly AvailableAnimal[];
  buyers: readonly BuyerView[];
  defaultUntil: string;
  busy: boolean;
  error: string | null;
  onSubmit: (choice: ReserveChoice) => void;
}) {
  const [chosen, setChosen] = useState<ReadonlySet<string>>(new Set());
  const [buyerId, setBuyerId] = useState(buyers[0]?.id ?? NEW_BUYER);
  const [newName, setNewName] = useState('');
  const [newEmail, setNewEmail] = useState('');
  const [until, setUntil] = useState(defaultUntil);
  const [take, setTake] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);
  const groups = useMemo(() => byClutch(available), [available]);
  const total = available.filter((a) => chosen.has(a.id)).reduce((s, a) => s + a.priceMinor, 0);
  const currency = available[0]?.currency ?? 'EUR';

  const toggle = (id: string) =>
    setChosen((prev) => {
      const next = new Set(prev);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });

  function takeFrom(key: string, animals: AvailableAnimal[]) {
    const n = Number(take[key] ?? '');
    if (!Number.isInteger(n) || n < 1) return setProblem('Say how many to take, e.g. 3.');
    const free = animals.filter((a) => !chosen.has(a.id));
    if (n > free.length)
      return setProblem(`Only ${free.length} more available in ${key || 'single animals'}.`);
    setProblem(null);
    setChosen((prev) => new Set([...prev, ...free.slice(0, n).map((a) => a.id)]));
  }

  function submit(e: FormEvent) {
    e.preventDefault();
    if (!chosen.size) return setProblem('Choose at least one animal.');
    if (buyerId === NEW_BUYER && !newName.trim()) return setProblem('Give the new buyer’s name.');
    setProblem(null);
    onSubmit({
      buyer: buyerId === NEW_BUYER ? { name: newName, email: newEmail } : { id: buyerId },
      animalIds: [...chosen],
      reservedUntil: until,
    });
  }

  if (!available.length)
    return (
      <Notice tone="info" title="Nothing is available to reserve.">
        <p>List animals for sale on the stock page first.</p>
      </Notice>
    );
  return (
    <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
      {groups.map(([key, animals]) => (
        <fieldset key={key} className="flex flex-col gap-2 rounded-2xl border-2 border-border p-3">
          <legend className="px-1 text-lg font-extrabold">
            {key || 'Single animals'} · {animals.length} available
          </legend>
          {animals.length > 1 && (
            <div className="flex items-end gap-2">
              <TextField
                label={`How many from ${key || 'these'}`}
                inputMode="numeric"
                className="w-40"
                value={take[key] ?? ''}
                onChange={(e) => setTake({ ...take, [key]: e.target.value })}
              />
              <Button variant="secondary" onClick={() => takeFrom(key, animals)}>
                Take them
              </Button>
            </div>
          )}
          <ul className="flex flex-col gap-1">
            {animals.map((a) => (
              <li key={a.id}>
                <label className="flex min-h-target cursor-pointer items-center gap-3 rounded-xl border-2 border-border bg-surface px-3 py-2">
                  <input
                    type="checkbox"
                    className="size-6 shrink-0"
                    checked={chosen.has(a.id)}
                    onChange={() => toggle(a.id)}
                  />
                  <span className="flex flex-1 flex-col">
                    <span className="font-bold">
                      {a.labelCode} · <i>{a.scientificName}</i>
                    </span>
                    <span className="text-sm text-muted">
                      {STAGE_LABEL[a.lifeStage]} · {SEX_LABEL[a.sex]}
                      {a.sizeMm !== null ? ` · ${a.sizeMm} mm` : ''}
                    </span>
                  </span>
                  <span className="font-bold">{money(a.priceMinor, a.currency)}</span>
                </label>
              </li>
            ))}
          </ul>
        </fieldset>
      ))}
      <p className="text-lg font-bold" aria-live="polite">
        {chosen.size} chosen · {money(total, currency)}
      </p>
      <SelectField
        label="Buyer"
        value={buyerId}
        onChange={(e) => setBuyerId(e.target.value)}
        options={[
          ...buyers.map((b) => ({ value: b.id, label: b.name })),
          { value: NEW_BUYER, label: 'A new buyer…' },
        ]}
      />
      {buyerId === NEW_BUYER && (
        <>
          <TextField
            label="New buyer’s name"
            value={newName}
            onChange={(e) => setNewName(e.target.value)}
            autoComplete="off"
          />
          <TextField
            label="New buyer’s e-mail"
            type="email"
            value={newEmail}
            onChange={(e) => setNewEmail(e.target.value)}
            autoComplete="off"
          />
        </>
      )}
      <TextField
        label="Hold until (last day)"
        type="date"
        value={until}
        onChange={(e) => setUntil(e.target.value)}
        hint="The hold ends after this day unless money has come in; the animals are then free again."
      />
      {(problem ?? error) && <Notice tone="error" title={problem ?? error ?? ''} />}
      <Button type="submit" wide busy={busy}>
        Reserve {chosen.size || ''} {chosen.size === 1 ? 'animal' : 'animals'}
      </Button>
    </form>
  );
}
