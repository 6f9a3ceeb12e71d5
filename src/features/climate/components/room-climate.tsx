import { lazy, Suspense } from 'react';
import { describeHumidityRange, describeTemperatureRange } from '#shared/domain/climate/ranges';
import { formatLocalDate } from '#shared/domain/date-words';
import {
  formatHumidity,
  formatTemperature,
  type TemperatureUnit,
} from '#shared/domain/temperature';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { useRoomHistory } from '../api/climate-api';

const ClimateChart = lazy(() => import('./climate-chart'));

/** A room's last 30 days: the chart with its range, and the same days as a table. */
export function RoomClimate({
  collectionId,
  room,
  unit,
}: {
  collectionId: string;
  room: string;
  unit: TemperatureUnit;
}) {
  const history = useRoomHistory(collectionId, room, 30);
  if (history.isPending) return <Loading />;
  if (history.isError) return <Notice tone="error" title={history.error.message} />;
  const { days, targets } = history.data;
  const range = [describeTemperatureRange(targets, unit), describeHumidityRange(targets)]
    .filter(Boolean)
    .join(' · ');
  return (
    <div className="flex flex-col gap-3">
      <p>
        <span className="font-bold">Target: </span>
        {range || 'no range set (set one on the Places screen)'}
      </p>
      {days.length === 0 ? (
        <p className="text-muted">No readings in the last 30 days.</p>
      ) : (
        <>
          <Suspense fallback={<Loading />}>
            <ClimateChart days={days} targets={targets} unit={unit} measure="temperature" />
            {days.some((d) => d.lowHumidity !== null) && (
              <ClimateChart days={days} targets={targets} unit={unit} measure="humidity" />
            )}
          </Suspense>
          <table className="w-full text-left">
            <caption className="text-left font-bold">Each day’s lowest and highest</caption>
            <thead>
              <tr>
                <th scope="col">Day</th>
                <th scope="col">Temperature</th>
                <th scope="col">Humidity</th>
              </tr>
            </thead>
            <tbody>
              {[...days].reverse().map((d) => (
                <tr key={d.date} className="border-t border-border">
                  <td>{formatLocalDate(d.date, undefined, { weekday: false })}</td>
                  <td>
                    {d.lowCelsius === null
                      ? '—'
                      : `${formatTemperature(d.lowCelsius, unit)} – ${formatTemperature(d.highCelsius, unit)}`}
                  </td>
                  <td>
                    {d.lowHumidity === null
                      ? '—'
                      : `${formatHumidity(d.lowHumidity)} – ${formatHumidity(d.highHumidity)}`}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </>
      )}
    </div>
  );
}
