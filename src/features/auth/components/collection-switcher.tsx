import type { MembershipSummary } from '#shared/schemas/auth';

const ROLE_WORD = { owner: 'Owner', keeper: 'Keeper', helper: 'Helper' } as const;

/** Lets a person who belongs to several collections choose which one this device works in. */
export function CollectionSwitcher({
  memberships,
  currentId,
  onChoose,
}: {
  memberships: MembershipSummary[];
  currentId: string | undefined;
  onChoose: (id: string) => void;
}) {
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="mb-1 font-bold">Collection on this device</legend>
      {memberships.map((m) => (
        <label
          key={m.collectionId}
          className="flex min-h-target cursor-pointer items-center gap-3 rounded-xl border-2 border-border bg-surface px-3"
        >
          <input
            type="radio"
            name="collection"
            className="h-6 w-6 accent-[var(--c-primary)]"
            checked={m.collectionId === currentId}
            onChange={() => onChoose(m.collectionId)}
          />
          <span className="flex-1">
            <span className="font-bold">{m.collectionName}</span>
            <span className="block text-sm text-muted">
              {ROLE_WORD[m.role]} · {m.timeZone}
            </span>
          </span>
        </label>
      ))}
    </fieldset>
  );
}
