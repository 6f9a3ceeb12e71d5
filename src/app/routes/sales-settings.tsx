import { Link } from 'react-router-dom';
import { NoCollection } from '@/app/layout/no-collection';
import { useShell } from '@/app/layout/use-shell';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { AvailabilitySettings } from '@/features/availability/components/availability-settings';
import { useSalesSettings, useSalesSettingsChange } from '@/features/sales/api/sales-api';
import { SalesSettingsForm } from '@/features/sales/components/settings-form';
import { useTemperatureUnit } from '@/lib/preferences';

/** Money, tax, invoices' seller details, holds and the safe shipping range. */
export function SalesSettingsRoute() {
  const { collection } = useShell();
  if (!collection) return <NoCollection />;
  if (collection.role === 'helper')
    return <Notice tone="info" title="Sales are kept by the collection’s owner and keepers." />;
  return <Settings collectionId={collection.collectionId} />;
}

function Settings({ collectionId }: { collectionId: string }) {
  const settings = useSalesSettings(collectionId);
  const save = useSalesSettingsChange(collectionId);
  const [unit] = useTemperatureUnit();
  if (settings.isPending) return <Loading />;
  if (settings.isError) return <Notice tone="error" title={settings.error.message} />;
  return (
    <div className="flex flex-col gap-4">
      <Link
        to="/sales"
        className="inline-flex min-h-target items-center font-bold underline underline-offset-4"
      >
        ← Sales
      </Link>
      <h1 className="text-3xl font-extrabold">Sales settings</h1>
      <SalesSettingsForm
        key={settings.dataUpdatedAt}
        settings={settings.data}
        unit={unit}
        busy={save.isPending}
        error={save.error?.message ?? null}
        saved={save.isSuccess}
        onSubmit={(body) => save.mutate(body)}
      />
      <AvailabilitySettings collectionId={collectionId} />
    </div>
  );
}
