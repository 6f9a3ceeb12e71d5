import { CAUTION_LABEL, type Caution } from '#shared/domain/animal-facts';
import { CAUTION_GUIDANCE, GENERAL_SAFETY } from '#shared/domain/safety';
import { Button } from '@/components/ui/button';
import { CautionIcon } from '@/components/ui/icons';
import { Notice } from '@/components/ui/notice';

/** Read once per cover, before the first round: what can hurt you here, and what to do. */
export function SafetyPage({
  cautions,
  onAcknowledge,
  busy,
  error,
}: {
  cautions: readonly Caution[];
  onAcknowledge: () => void;
  busy: boolean;
  error: string | null;
}) {
  return (
    <section aria-labelledby="safety-heading" className="flex flex-col gap-3">
      <h1 id="safety-heading" className="text-3xl font-extrabold">
        Before your first round
      </h1>
      <p>
        Some animals on this round can hurt you. Read this once; the round shows the same warnings
        on each animal.
      </p>
      {cautions.map((c) => (
        <div key={c} className="flex gap-3 rounded-2xl border-4 border-danger bg-surface p-3">
          <CautionIcon caution={c} width={36} height={36} className="shrink-0 text-danger" />
          <div>
            <h2 className="text-lg font-extrabold text-danger">{CAUTION_GUIDANCE[c].title}</h2>
            <p className="sr-only">{CAUTION_LABEL[c]}</p>
            <p>{CAUTION_GUIDANCE[c].text}</p>
          </div>
        </div>
      ))}
      <ul className="flex list-disc flex-col gap-1 pl-5">
        {GENERAL_SAFETY.map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
      {error && <Notice tone="error" title={error} />}
      <Button busy={busy} onClick={onAcknowledge}>
        I have read this and will work safely
      </Button>
    </section>
  );
}
