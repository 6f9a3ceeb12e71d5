import { useState, type FormEvent } from 'react';
import {
  COLONY_CARE_KINDS,
  COLONY_CARE_WORDS,
  DEFAULT_COLONY_INTERVALS,
} from '#shared/domain/colonies/care';
import { sameType, type Feeder } from '#shared/domain/rounds/feeders';
import type { ColonyInput, ColonyView } from '#shared/schemas/colonies';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';

/**
 * A colony's name, species, prey type and sizes (from the collection's feeder catalogue, so
 * the prep list can draw on it) and its care intervals in days (empty: never on the round).
 */
export function ColonyForm({
  feeders,
  initial,
  busy,
  error,
  submitLabel,
  onSubmit,
}: {
  feeders: readonly Feeder[];
  initial?: ColonyView;
  busy: boolean;
  error: string | null;
  submitLabel: string;
  onSubmit: (input: ColonyInput) => void;
}) {
  const types = [...new Set(feeders.map((f) => f.preyType))];
  const [name, setName] = useState(initial?.name ?? '');
  const [species, setSpecies] = useState(initial?.species ?? '');
  const [preyType, setPreyType] = useState(initial?.preyType ?? types[0] ?? '');
  const catalogueSizes = feeders
    .filter((f) => sameType(f.preyType, preyType))
    .map((f) => f.preySize);
  const [sizes, setSizes] = useState<string[]>(
    initial?.stock.map((s) => s.preySize) ?? catalogueSizes,
  );
  const [every, setEvery] = useState<Record<string, string>>(() =>
    Object.fromEntries(
      COLONY_CARE_KINDS.map((k) => {
        const v = initial ? initial.intervals[k] : DEFAULT_COLONY_INTERVALS[k];
        return [k, v === null ? '' : String(v)];
      }),
    ),
  );
  const shownSizes = [...new Set([...catalogueSizes, ...sizes])];

  const submit = (e: FormEvent) => {
    e.preventDefault();
    onSubmit({
      name,
      species,
      preyType,
      sizes: shownSizes.filter((s) => sizes.includes(s)),
      intervals: Object.fromEntries(
        COLONY_CARE_KINDS.map((k) => [k, every[k]?.trim() ? Number(every[k]) : null]),
      ) as ColonyInput['intervals'],
    });
  };

  return (
    <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
      <TextField
        label="Name"
        value={name}
        onChange={(e) => setName(e.target.value)}
        hint="How you tell it apart, such as “Dubia bin A”."
        required
      />
      <TextField
        label="Species"
        value={species}
        onChange={(e) => setSpecies(e.target.value)}
        hint="Optional, such as Blaptica dubia."
      />
      <SelectField
        label="Prey type"
        value={preyType}
        onChange={(e) => {
          setPreyType(e.target.value);
          setSizes(
            feeders.filter((f) => sameType(f.preyType, e.target.value)).map((f) => f.preySize),
          );
        }}
        options={types.map((t) => ({ value: t, label: t }))}
        hint="From the feeder catalogue in Settings → Care rules."
      />
      <fieldset className="flex flex-col gap-1">
        <legend className="mb-1 font-bold">Sizes it holds</legend>
        {shownSizes.map((s) => (
          <label
            key={s}
            className="flex min-h-target cursor-pointer items-center gap-3 rounded-xl border-2 border-border px-3"
          >
            <input
              type="checkbox"
              className="h-6 w-6"
              checked={sizes.includes(s)}
              onChange={(e) =>
                setSizes((now) => (e.target.checked ? [...now, s] : now.filter((x) => x !== s)))
              }
            />
            {s}
          </label>
        ))}
      </fieldset>
      <fieldset className="grid grid-cols-2 gap-2">
        <legend className="mb-1 font-bold">Care every … days (empty: not on the round)</legend>
        {COLONY_CARE_KINDS.map((k) => (
          <TextField
            key={k}
            label={COLONY_CARE_WORDS[k]}
            inputMode="numeric"
            value={every[k] ?? ''}
            onChange={(e) => setEvery((now) => ({ ...now, [k]: e.target.value }))}
          />
        ))}
      </fieldset>
      {error && <Notice tone="error" title={error} />}
      <Button type="submit" busy={busy} wide>
        {submitLabel}
      </Button>
    </form>
  );
}
