import { useCallback, useMemo } from 'react';
import { CAUTIONS } from '#shared/domain/animal-facts';
import { describeLocalDate, localDateOf } from '#shared/domain/local-dates';
import type { RoundItemView } from '#shared/schemas/rounds';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { useAcknowledgeSafety, useHelperCover } from '@/features/cover/api/cover-api';
import { CoverHeader } from '@/features/cover/components/general-note';
import { HelperItemExtras } from '@/features/cover/components/helper-item-extras';
import { SafetyPage } from '@/features/cover/components/safety-page';
import { useRound } from '@/features/rounds/api/get-round';
import { useShell } from './shell';
import { TodayRound } from './today';

/** The helper's round: the safety page once per cover, then the round with everything they need. */
export function HelperToday() {
  const { me, collection } = useShell();
  const collectionId = collection!.collectionId;
  const cover = useHelperCover(collectionId, me.user.id);
  const { local } = useRound(me.user.id, collectionId, 'today');
  const acknowledge = useAcknowledgeSafety(collectionId, me.user.id);
  const cautions = useMemo(() => CAUTIONS.filter((c) => local.data?.round.items.some((i) => i.animal.cautions.includes(c))), [local.data]);
  const view = cover.data;
  const extras = useCallback((item: RoundItemView) => (view ? <HelperItemExtras item={item} cover={view} timeZone={collection!.timeZone} /> : null), [view, collection]);

  if (cover.isPending) return <Loading label="Loading your cover…" />;
  if (cover.isError) return <Notice tone="error" title={cover.error.message} />;
  if (!cover.data.safetyAcknowledgedAt) {
    return <SafetyPage cautions={cautions.length ? cautions : CAUTIONS} busy={acknowledge.isPending} error={acknowledge.error?.message ?? null} onAcknowledge={() => acknowledge.mutate()} />;
  }
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">Today · {describeLocalDate(localDateOf(new Date(), collection!.timeZone))}</h1>
      <CoverHeader cover={cover.data} />
      <TodayRound userId={me.user.id} myName={me.user.displayName} collectionId={collectionId} extras={extras} />
    </div>
  );
}
