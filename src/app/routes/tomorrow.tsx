import { Link } from 'react-router-dom';
import { formatLocalDate } from '#shared/domain/date-words';
import { addDays, describeInstant, localDateOf } from '#shared/domain/local-dates';
import { NoCollection } from '@/app/layout/no-collection';
import { useShell } from '@/app/layout/use-shell';
import { PrepListPanel } from '@/app/panels/prep-list-panel';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { useRound } from '@/features/rounds/api/get-round';
import { RoundList } from '@/features/rounds/components/round-list';
import { RoundUnavailable } from '@/features/rounds/components/round-unavailable';

export function TomorrowRoute() {
  const { me, collection } = useShell();
  if (!collection) return <NoCollection />;
  if (collection.role === 'helper')
    return <Notice tone="info" title="Helpers see today’s round only." />;
  return <Tomorrow userId={me.user.id} collectionId={collection.collectionId} />;
}

function Tomorrow({ userId, collectionId }: { userId: string; collectionId: string }) {
  const { local, server } = useRound(userId, collectionId, 'tomorrow', { buildsOffline: true });
  if (local.isPending || (!local.data && server.isPending))
    return <Loading label="Working out tomorrow…" />;
  if (!local.data) return <RoundUnavailable error={server.error} what="tomorrow’s preview" />;
  const { round: r, builtOnPhone, fetchedAt } = local.data;
  // A preview kept from an earlier day is for a day that has begun: never called "tomorrow".
  const isTomorrow = r.date === addDays(localDateOf(new Date(), r.timeZone), 1);
  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-3xl font-extrabold">
        {isTomorrow ? 'Tomorrow' : 'Preview'} · {formatLocalDate(r.date)}
      </h1>
      {!isTomorrow && (
        <Notice
          tone="warning"
          title={`This preview was made for ${formatLocalDate(r.date)}, which has begun.`}
        >
          Tomorrow’s preview comes with the next signal. Today’s round is on the Today page.
        </Notice>
      )}
      {builtOnPhone && isTomorrow && (
        <Notice tone="info" title="Built on this phone">
          Worked out here from the records this phone had on{' '}
          {describeInstant(fetchedAt, r.timeZone)} and the taps made since.
        </Notice>
      )}
      <p className="text-muted print:hidden">
        A preview: what is recorded today still changes it. The round is fixed when its day begins.
      </p>
      <section
        aria-labelledby="prep-heading"
        className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3 print:border-black"
      >
        <h2 id="prep-heading" className="text-xl font-extrabold">
          Prep list · {r.items.length} animals
        </h2>
        <PrepListPanel collectionId={collectionId} lines={r.prepList} />
        <Link
          to="/colonies"
          className="inline-flex min-h-target items-center font-bold underline underline-offset-4 print:hidden"
        >
          Feeder colonies
        </Link>
        <Button variant="secondary" className="print:hidden" onClick={() => window.print()}>
          Print prep list
        </Button>
      </section>
      <div className="print:hidden">
        <RoundList items={r.items} timeZone={r.timeZone} openRecord />
      </div>
    </div>
  );
}
