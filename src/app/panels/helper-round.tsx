import { useCallback, useMemo, useState } from 'react';
import { CAUTIONS } from '#shared/domain/animal-facts';
import { describeLocalDate, localDateOf } from '#shared/domain/local-dates';
import type { MeResponse, MembershipSummary } from '#shared/schemas/auth';
import type { RoundItemView } from '#shared/schemas/rounds';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { ClimateToday } from '@/features/climate/components/climate-today';
import { useAcknowledgeSafety, useHelperCover } from '@/features/cover/api/cover-api';
import { CoverHeader } from '@/features/cover/components/general-note';
import { HelperItemExtras } from '@/features/cover/components/helper-item-extras';
import { ReportProblemForm } from '@/features/cover/components/report-problem-form';
import { RoundCautions } from '@/features/cover/components/round-cautions';
import { SafetyPage } from '@/features/cover/components/safety-page';
import { useRound } from '@/features/rounds/api/get-round';
import { TodayRoundPanel } from './today-round-panel';

/**
 * The helper's round (cover + rounds): the safety page once per cover, then the round with the
 * handover notes and cautions on each item.
 */
export function HelperRound({ me, collection }: { me: MeResponse; collection: MembershipSummary }) {
  const { collectionId, timeZone } = collection;
  const cover = useHelperCover(collectionId, me.user.id);
  const { local } = useRound(me.user.id, collectionId, 'today');
  const acknowledge = useAcknowledgeSafety(collectionId, me.user.id);
  const [reporting, setReporting] = useState(false);
  const cautions = useMemo(
    () =>
      CAUTIONS.filter((c) => local.data?.round.items.some((i) => i.animal.cautions.includes(c))),
    [local.data],
  );
  const view = cover.data;
  const extras = useCallback(
    (item: RoundItemView) =>
      view ? <HelperItemExtras item={item} cover={view} timeZone={timeZone} /> : null,
    [view, timeZone],
  );

  if (cover.isPending) return <Loading label="Loading your cover…" />;
  if (cover.isError) return <Notice tone="error" title={cover.error.message} />;
  if (!cover.data.safetyAcknowledgedAt) {
    return (
      <SafetyPage
        cautions={cautions.length ? cautions : CAUTIONS}
        busy={acknowledge.isPending}
        error={acknowledge.error?.message ?? null}
        onAcknowledge={() => acknowledge.mutate()}
      />
    );
  }
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">
        Today · {describeLocalDate(localDateOf(new Date(), timeZone))}
      </h1>
      <CoverHeader cover={cover.data} />
      {reporting ? (
        <section
          aria-labelledby="report-heading"
          className="flex flex-col gap-3 rounded-2xl border-2 border-danger bg-surface p-3"
        >
          <h2 id="report-heading" className="text-xl font-extrabold">
            Tell the owner
          </h2>
          <ReportProblemForm
            collectionId={collectionId}
            animals={local.data?.round.items.map((i) => i.animal) ?? []}
            onClose={() => setReporting(false)}
          />
        </section>
      ) : (
        <Button variant="danger" wide onClick={() => setReporting(true)}>
          Report a problem or leave a note
        </Button>
      )}
      <ClimateToday
        userId={me.user.id}
        collectionId={collection.collectionId}
        timeZone={collection.timeZone}
      />
      <RoundCautions items={local.data?.round.items ?? []} />
      <TodayRoundPanel
        userId={me.user.id}
        myName={me.user.displayName}
        collectionId={collectionId}
        extras={extras}
      />
    </div>
  );
}
