import { useSearchParams } from 'react-router-dom';
import { useShell } from '@/app/layout/use-shell';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { Loading } from '@/components/ui/spinner';
import { useClimateRooms } from '@/features/climate/api/climate-api';
import { LoggerImport } from '@/features/climate/components/logger-import';
import { RoomClimate } from '@/features/climate/components/room-climate';
import { useTemperatureUnit } from '@/lib/preferences';

/** One room's climate: its chart and days, and a data logger's file imported into it (keepers). */
export function ClimateRoute() {
  const { collection } = useShell();
  const [params, setParams] = useSearchParams();
  const [unit] = useTemperatureUnit();
  const keeper = !!collection && collection.role !== 'helper';
  const rooms = useClimateRooms(keeper ? collection.collectionId : '');
  if (!collection || !keeper)
    return <Notice tone="info" title="Room climate is kept by the collection’s keepers." />;
  if (rooms.isPending) return <Loading />;
  if (rooms.isError) return <Notice tone="error" title={rooms.error.message} />;
  const names = rooms.data.rooms.map((r) => r.room);
  const room = names.includes(params.get('room') ?? '') ? params.get('room')! : (names[0] ?? '');
  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-3xl font-extrabold">Room climate</h1>
      {!room ? (
        <p>Add a place first: rooms come from your places.</p>
      ) : (
        <>
          <SelectField
            label="Room"
            options={names.map((n) => ({ value: n, label: n }))}
            value={room}
            onChange={(e) => setParams({ room: e.target.value }, { replace: true })}
          />
          <section aria-labelledby="days-heading" className="flex flex-col gap-2">
            <h2 id="days-heading" className="text-2xl font-extrabold">
              The last 30 days
            </h2>
            <RoomClimate collectionId={collection.collectionId} room={room} unit={unit} />
          </section>
          <section aria-labelledby="logger-heading" className="flex flex-col gap-2">
            <h2 id="logger-heading" className="text-2xl font-extrabold">
              Import a data logger’s file
            </h2>
            <LoggerImport
              collectionId={collection.collectionId}
              room={room}
              timeZone={collection.timeZone}
              unit={unit}
            />
          </section>
        </>
      )}
    </div>
  );
}
