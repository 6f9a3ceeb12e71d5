import { useMemo } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import { readLabel, labelUrl } from '#shared/domain/labels/label-payload';
import { useShell } from '@/app/layout/use-shell';
import { LabelTargetPanel } from '@/app/panels/label-target-panel';
import { Loading } from '@/components/ui/spinner';
import { useAnimalList } from '@/features/animals/api/list-animals';
import { useRound } from '@/features/rounds/api/get-round';
import { useRecordOutcome } from '@/features/rounds/api/record-outcome';
import { resolveLabel } from '@/features/scan/resolve-label';

/**
 * Where a label's URL lands when a phone's own camera app opens it: the same item, ready for
 * a tap, then back to today's round.
 */
export function LabelLinkRoute() {
  const { me, collection, chooseCollection } = useShell();
  const { tag = '', code = '' } = useParams();
  const navigate = useNavigate();
  const collectionId = collection?.collectionId ?? '';
  const keeper = !!collection && collection.role !== 'helper';
  const { local } = useRound(me.user.id, collectionId, 'today');
  const directory = useAnimalList(collectionId, keeper);
  const record = useRecordOutcome({
    userId: me.user.id,
    byName: me.user.displayName,
    collectionId,
  });
  const target = useMemo(
    () =>
      collection &&
      resolveLabel(readLabel(labelUrl(window.location.origin, tag, code)), {
        collection,
        memberships: me.memberships,
        roundItems: local.data?.round.items ?? [],
        animals: keeper ? directory.data?.animals : null,
      }),
    [collection, me.memberships, tag, code, local.data, keeper, directory.data],
  );
  if (!collection || !target || local.isPending || (keeper && directory.isPending))
    return <Loading label="Opening the label…" />;
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">Label {code.toUpperCase()}</h1>
      <LabelTargetPanel
        target={target}
        timeZone={collection.timeZone}
        myName={me.user.displayName}
        onRecord={(item, kind, payload) =>
          void record(item.animal, kind, payload).then(() => navigate('/today'))
        }
        onNext={() => navigate('/today')}
        onSwitchCollection={chooseCollection}
        openRecord={keeper}
        nextWord="Back to today’s round"
      />
    </div>
  );
}
