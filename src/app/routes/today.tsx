import { lazy, Suspense } from 'react';
import { formatLocalDate } from '#shared/domain/date-words';
import { localDateOf } from '#shared/domain/local-dates';
import { NoCollection } from '@/app/layout/no-collection';
import { useShell } from '@/app/layout/use-shell';
import { TodayRoundPanel } from '@/app/panels/today-round-panel';
import { Loading } from '@/components/ui/spinner';

// Owners see a notice when a helper reported something; loaded after the round, off the first bundle.
const RecentHelperReports = lazy(() =>
  import('@/features/cover/components/helper-reports-list').then((m) => ({
    default: m.RecentHelperReports,
  })),
);

// Room climate (alerts and the day's readings), loaded after the round, off the first bundle.
const ClimateToday = lazy(() =>
  import('@/features/climate/components/climate-today').then((m) => ({
    default: m.ClimateToday,
  })),
);
// Feeder colonies' care and today's prep list, for keepers: off the first bundle too.
const TodayColoniesPanel = lazy(() => import('@/app/panels/today-colonies-panel'));

// A helper's round adds the safety page, handover notes and cautions: loaded only for helpers.
const HelperRound = lazy(() =>
  import('@/app/panels/helper-round').then((m) => ({ default: m.HelperRound })),
);

export function TodayRoute() {
  const { me, collection } = useShell();
  if (!collection) return <NoCollection />;
  if (collection.role === 'helper') {
    return (
      <Suspense fallback={<Loading />}>
        <HelperRound me={me} collection={collection} />
      </Suspense>
    );
  }
  // The heading needs only the collection's zone, so it paints before the round is read (P2).
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-3xl font-extrabold">
        Today · {formatLocalDate(localDateOf(new Date(), collection.timeZone))}
      </h1>
      {collection.role === 'owner' && (
        <Suspense fallback={null}>
          <RecentHelperReports
            collectionId={collection.collectionId}
            timeZone={collection.timeZone}
          />
        </Suspense>
      )}
      <Suspense fallback={null}>
        <ClimateToday
          userId={me.user.id}
          collectionId={collection.collectionId}
          timeZone={collection.timeZone}
        />
        <TodayColoniesPanel
          userId={me.user.id}
          collectionId={collection.collectionId}
          timeZone={collection.timeZone}
        />
      </Suspense>
      <TodayRoundPanel
        userId={me.user.id}
        myName={me.user.displayName}
        collectionId={collection.collectionId}
        collectionName={collection.collectionName}
        openRecord
        buildsOffline
        photos
        keeper
      />
    </div>
  );
}
