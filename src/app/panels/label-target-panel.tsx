import { useState } from 'react';
import type { EventKind } from '#shared/domain/event-kinds';
import type { RoundItemView } from '#shared/schemas/rounds';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { OutcomeButtons } from '@/features/rounds/components/outcome-buttons';
import { RoundItemCard } from '@/features/rounds/components/round-item-card';
import { targetMessage, type LabelSource, type LabelTarget } from '@/features/scan/resolve-label';

interface Props {
  target: LabelTarget;
  timeZone: string;
  myName: string;
  onRecord: (item: RoundItemView, kind: EventKind, payload?: Record<string, unknown>) => void;
  /** Back to scanning (or wherever the person came from). */
  onNext: () => void;
  nextWord: string;
  /** Switches the app to another of the person's collections (a label from there). */
  onSwitchCollection: (collectionId: string) => void;
  /** Whether the person may open the animal's page (not helpers: the server keeps it from them). */
  openRecord: boolean;
  /** How the label came in, for the words when it opens nothing. */
  via?: LabelSource;
}

/** What a scanned label opens (scan + rounds): the item ready for one tap, or a plain reason why not. */
export function LabelTargetPanel({
  target,
  timeZone,
  myName,
  onRecord,
  onNext,
  nextWord,
  onSwitchCollection,
  openRecord,
  via = 'qr',
}: Props) {
  const [recordAnyway, setRecordAnyway] = useState(false);
  const next = (
    <Button variant="secondary" wide onClick={onNext}>
      {nextWord}
    </Button>
  );
  if (target.kind !== 'on_round' && target.kind !== 'not_due') {
    const { title, body } = targetMessage(target, via);
    return (
      <div className="flex flex-col gap-3">
        <Notice tone="warning" title={title}>
          <p>{body}</p>
          {target.kind === 'other_collection' && target.collectionId && (
            <Button className="mt-2" onClick={() => onSwitchCollection(target.collectionId!)}>
              Switch to {target.collectionName}
            </Button>
          )}
        </Notice>
        {next}
      </div>
    );
  }
  const { item } = target;
  const ready = target.kind === 'on_round' || recordAnyway;
  return (
    <div className="flex flex-col gap-3">
      {!ready && (
        <Notice tone="warning" title={`${item.animal.name} is not due today — record anyway?`}>
          <p>Nothing is planned for this animal today. A meal recorded now moves its next feed.</p>
          <Button className="mt-2" onClick={() => setRecordAnyway(true)}>
            Record anyway
          </Button>
        </Notice>
      )}
      <RoundItemCard item={item} timeZone={timeZone} myName={myName} openRecord={openRecord}>
        {ready && (
          <OutcomeButtons item={item} onRecord={(kind, payload) => onRecord(item, kind, payload)} />
        )}
      </RoundItemCard>
      {next}
    </div>
  );
}
