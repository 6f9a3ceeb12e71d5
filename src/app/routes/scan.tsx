import { useCallback, useMemo, useState } from 'react';
import { EVENT_WORDS, type EventKind } from '#shared/domain/event-kinds';
import { readLabel, type LabelReading } from '#shared/domain/labels/label-payload';
import type { MembershipSummary } from '#shared/schemas/auth';
import type { RecordedEvent } from '#shared/schemas/events';
import type { RoundItemView } from '#shared/schemas/rounds';
import { NoCollection } from '@/app/layout/no-collection';
import { useShell } from '@/app/layout/use-shell';
import { LabelTargetPanel } from '@/app/panels/label-target-panel';
import { useAnimalList } from '@/features/animals/api/list-animals';
import { useRound } from '@/features/rounds/api/get-round';
import { useRecordOutcome } from '@/features/rounds/api/record-outcome';
import { UndoToast } from '@/features/rounds/components/undo-toast';
import { NfcReader } from '@/features/scan/components/nfc-reader';
import { PhotoScan } from '@/features/scan/components/photo-scan';
import { QrCamera } from '@/features/scan/components/qr-camera';
import { TypeCodeForm } from '@/features/scan/components/type-code-form';
import { resolveLabel, type LabelSource, type LabelTarget } from '@/features/scan/resolve-label';
import { nfcAvailable } from '@/lib/web-nfc';

interface LastTap {
  event: RecordedEvent;
  animal: RoundItemView['animal'];
}

/** What a scan or a typed code can lead to that is no animal: the code box stays for another try. */
const FAILED = new Set<LabelTarget['kind']>([
  'unknown_code',
  'not_on_round',
  'list_missing',
  'malformed',
  'foreign',
]);

/** A short buzz where the phone can (Vibration API; not on iOS), so the keeper need not look. */
const buzz = () => navigator.vibrate?.(60);

export function ScanRoute() {
  const { me, collection, chooseCollection } = useShell();
  if (!collection) return <NoCollection />;
  return (
    <Scanner
      userId={me.user.id}
      myName={me.user.displayName}
      memberships={me.memberships}
      collection={collection}
      chooseCollection={chooseCollection}
    />
  );
}

interface ScannerProps {
  userId: string;
  myName: string;
  memberships: MembershipSummary[];
  collection: MembershipSummary;
  chooseCollection: (collectionId: string) => void;
}

function Scanner({ userId, myName, memberships, collection, chooseCollection }: ScannerProps) {
  const { collectionId, timeZone } = collection;
  const { local } = useRound(userId, collectionId, 'today');
  const keeper = collection.role !== 'helper';
  const directory = useAnimalList(collectionId, keeper);
  const record = useRecordOutcome({ userId, byName: myName, collectionId });
  const [reading, setReading] = useState<LabelReading | null>(null);
  const [via, setVia] = useState<LabelSource>('qr');
  const [nfc] = useState(nfcAvailable);
  const [walkMode, setWalkMode] = useState(true);
  const [last, setLast] = useState<LastTap | null>(null);
  const closeToast = useCallback(() => setLast(null), []);

  const target = useMemo(
    () =>
      reading &&
      resolveLabel(reading, {
        collection,
        memberships,
        roundItems: local.data?.round.items ?? [],
        animals: keeper ? directory.data?.animals : null,
      }),
    [reading, collection, memberships, local.data, keeper, directory.data],
  );

  const failed = !!target && FAILED.has(target.kind);

  const onScan = useCallback((text: string) => {
    buzz();
    setVia('qr');
    setReading(readLabel(text));
  }, []);

  // A tag opens what its label's QR opens: the same reading, resolved the same way. The next
  // tag replaces whatever is open, as walking on to the next enclosure does.
  const onTag = useCallback((tagReading: LabelReading) => {
    buzz();
    setVia('nfc');
    setReading(tagReading);
  }, []);

  const onRecord = (item: RoundItemView, kind: EventKind, payload?: Record<string, unknown>) => {
    void record(item.animal, kind, payload).then((event) => {
      buzz();
      setLast({ event, animal: item.animal });
      // Walk mode: one tap, then straight back to the camera for the next enclosure.
      if (walkMode) setReading(null);
    });
  };

  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">Scan</h1>
      <label className="flex min-h-target cursor-pointer items-center gap-3 font-bold">
        <input
          type="checkbox"
          checked={walkMode}
          onChange={(e) => setWalkMode(e.target.checked)}
          className="size-6 accent-[var(--c-primary)]"
        />
        Walk mode: back to the camera after each tap
      </label>
      {nfc && <NfcReader onReading={onTag} />}
      {target && (
        <section aria-label="Scanned label" className="flex flex-col gap-3">
          <LabelTargetPanel
            key={`${via}:${JSON.stringify(reading)}`}
            target={target}
            via={via}
            timeZone={timeZone}
            myName={myName}
            onRecord={onRecord}
            onNext={() => setReading(null)}
            onSwitchCollection={chooseCollection}
            openRecord={keeper}
            nextWord="Scan next"
          />
        </section>
      )}
      {/* After a code that leads nowhere, the code box stays, with what was typed, to correct it. */}
      <div className={target && !failed ? 'hidden' : 'flex flex-col gap-3'}>
        <div className={target ? 'hidden' : 'contents'}>
          <QrCamera active={!target} onScan={onScan} />
        </div>
        <TypeCodeForm
          clear={!reading}
          onCode={(text) => {
            setVia('qr');
            setReading(readLabel(text));
          }}
        />
        <div className={target ? 'hidden' : 'contents'}>
          <PhotoScan onScan={onScan} />
        </div>
      </div>
      {last && (
        <UndoToast
          message={`${EVENT_WORDS[last.event.kind]} · ${last.animal.name} (${last.animal.labelCode})`}
          onUndo={() => void record(last.animal, 'void', { targetId: last.event.id })}
          onClose={closeToast}
        />
      )}
    </div>
  );
}
