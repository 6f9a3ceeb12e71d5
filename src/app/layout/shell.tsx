import { useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { NavLink, Navigate, Outlet, ScrollRestoration, useLocation } from 'react-router-dom';
import { coverWindowMessage, coverWindowState } from '#shared/domain/roles';
import type { MembershipSummary } from '#shared/schemas/auth';
import {
  DialIcon,
  RackIcon,
  RoundIcon,
  ScanIcon,
  TagIcon,
  TomorrowIcon,
} from '@/components/ui/icons';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { animalListQueryOptions } from '@/features/animals/api/list-animals';
import { useMe } from '@/features/auth/api/get-me';
import { useCurrentCollection } from '@/features/auth/hooks/use-current-collection';
import { SyncIndicator } from '@/features/sync/components/sync-indicator';
import { ApiError } from '@/lib/api-client';
import { forgetEarlyAnswers } from '@/lib/early-requests';
import { followTemperatureUnit } from '@/lib/preferences';
import { queryKeys } from '@/lib/query-keys';
import { startSync } from '@/lib/sync-driver';
import type { ShellContext } from './use-shell';

const NAV = [
  { to: '/today', label: 'Today', Icon: RoundIcon, helper: true },
  { to: '/scan', label: 'Scan', Icon: ScanIcon, helper: true },
  { to: '/tomorrow', label: 'Tomorrow', Icon: TomorrowIcon, helper: false },
  { to: '/animals', label: 'Animals', Icon: RackIcon, helper: false },
  // Sales — S: owners and keepers only (helpers never see prices, buyers or sales).
  { to: '/sales', label: 'Sales', Icon: TagIcon, helper: false },
  { to: '/settings', label: 'Settings', Icon: DialIcon, helper: true },
];

/**
 * A helper sees the round, the scanner and their settings; nothing of the collection's records.
 * Phones get a tab bar at thumb reach; from 1024 px wide the same links stand in a side column.
 */
function MainNav({ helper }: { helper: boolean }) {
  return (
    <nav
      aria-label="Main"
      className="print:hidden fixed inset-x-0 bottom-0 z-20 border-t-2 border-border bg-surface pb-[env(safe-area-inset-bottom)] lg:inset-x-auto lg:inset-y-0 lg:left-0 lg:w-52 lg:border-r-2 lg:border-t-0 lg:pb-0 lg:pt-16"
    >
      <ul className="mx-auto flex max-w-xl lg:max-w-none lg:flex-col lg:gap-1 lg:px-2">
        {NAV.filter((n) => n.helper || !helper).map(({ to, label, Icon }) => (
          <li key={to} className="flex-1 lg:flex-none">
            <NavLink
              to={to}
              className={({ isActive }) =>
                `flex min-h-16 flex-col items-center justify-center gap-0.5 text-sm font-bold lg:min-h-target lg:flex-row lg:justify-start lg:gap-3 lg:rounded-xl lg:px-3 lg:text-lg ${isActive ? 'text-text underline decoration-4 underline-offset-4 lg:bg-bg' : 'text-muted'}`
              }
            >
              <Icon />
              {label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}

/** Pages that are mostly a table: the whole width of a desktop screen. */
const WIDE_PAGES = new Set(['/animals']);

const DIRECTORY_DELAY_MS = 3000;

/**
 * A keeper's phone keeps the collection's animal list, fetched a moment after the first screen
 * so it never competes with it: scans and label printing then work with no signal.
 */
function useKeepAnimalListOffline(collection: MembershipSummary | null) {
  const queryClient = useQueryClient();
  const collectionId = collection && collection.role !== 'helper' ? collection.collectionId : null;
  useEffect(() => {
    if (!collectionId) return;
    const timer = setTimeout(
      () => void queryClient.prefetchQuery(animalListQueryOptions(collectionId)),
      DIRECTORY_DELAY_MS,
    );
    return () => clearTimeout(timer);
  }, [collectionId, queryClient]);
}

/** Everything behind sign-in: the header with the collection's name and the thumb-reach nav. */
export function Shell() {
  const me = useMe();
  const location = useLocation();
  const membershipList = me.data?.memberships ?? [];
  const { current, choose } = useCurrentCollection(membershipList);
  const queryClient = useQueryClient();
  const userId = me.data?.user.id;
  // The temperature unit is the person's own setting: this device follows it.
  const temperatureUnit = me.data?.user.temperatureUnit;
  useEffect(() => followTemperatureUnit(temperatureUnit), [temperatureUnit]);
  // The signed-in person's outbox syncs while the app is open; saved taps refresh the rounds.
  useEffect(
    () =>
      userId
        ? startSync(userId, () => {
            // What the page fetched before these taps arrived must not be shown after them.
            forgetEarlyAnswers();
            void queryClient.invalidateQueries({ queryKey: queryKeys.rounds.everywhere() });
            // A synced molt can change an animal's size and sex.
            void queryClient.invalidateQueries({ queryKey: queryKeys.animals.everywhere() });
            // Synced meals take from the feeder colonies; synced chores change what is due,
            // settle on this phone, and a room's reading changes its climate.
            void queryClient.invalidateQueries({ queryKey: queryKeys.colonies.everywhere() });
            void queryClient.invalidateQueries({ queryKey: queryKeys.chores.everywhere() });
            void queryClient.invalidateQueries({ queryKey: queryKeys.climate.everywhere() });
          })
        : undefined,
    [userId, queryClient],
  );

  useKeepAnimalListOffline(current);

  if (me.isPending) return <Loading />;
  if (me.error instanceof ApiError && me.error.status === 401) {
    return <Navigate to="/sign-in" replace state={{ from: location.pathname }} />;
  }
  if (me.isError) {
    return (
      <main className="mx-auto max-w-xl p-4">
        <Notice tone="error" title={me.error.message} />
      </main>
    );
  }
  // Lists and tables use a wide screen's width; forms and cards keep a readable column.
  const width = WIDE_PAGES.has(location.pathname) ? 'max-w-xl lg:max-w-6xl' : 'max-w-xl';
  const context: ShellContext = { me: me.data, collection: current, chooseCollection: choose };
  const helper = current?.role === 'helper';
  // Outside the cover a helper sees when it runs, on every screen but Settings (to leave it).
  const outside =
    helper &&
    current &&
    coverWindowState(
      new Date(),
      current.startsAt ? new Date(current.startsAt) : null,
      current.endsAt ? new Date(current.endsAt) : null,
    ) !== 'during' &&
    location.pathname !== '/settings';
  return (
    <div className="min-h-dvh pb-24 lg:pb-8 lg:pl-52">
      {/* New pages open at their top; back and forward return to where the person was. */}
      <ScrollRestoration />
      <header className="print:hidden border-b-2 border-border bg-surface px-4 py-2">
        <div className={`mx-auto flex flex-col gap-1 ${width}`}>
          <p className="truncate text-sm font-bold text-muted">
            Rackside ·{' '}
            <span className="text-text">{current?.collectionName ?? 'No collection'}</span>
          </p>
          <SyncIndicator />
        </div>
      </header>
      <main className={`mx-auto px-4 pt-3 ${width}`}>
        {outside && current ? (
          <Notice
            tone="info"
            title={coverWindowMessage(
              {
                ...current,
                startsAt: current.startsAt ? new Date(current.startsAt) : null,
                endsAt: current.endsAt ? new Date(current.endsAt) : null,
              },
              new Date(),
            )}
          >
            <p>Outside those days there is nothing to do here.</p>
          </Notice>
        ) : (
          <Outlet context={context} />
        )}
      </main>
      <MainNav helper={helper} />
    </div>
  );
}
