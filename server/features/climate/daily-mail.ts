import { dailyMail } from '#shared/domain/climate/daily';
import { instantsOfWallTime } from '#shared/domain/climate/logger-times';
import type { RoomTargets } from '#shared/domain/climate/ranges';
import { addDays, localDateOf, type LocalDate } from '#shared/domain/local-dates';
import type { Db } from '../../db/client';
import type { Logger } from '../../logger';
import type { Mailer } from '../../mail/mailer';
import {
  collectionsWithTargets,
  ownersOf,
  readingsBetween,
  targetsOf,
  withUnsentDailyMail,
} from './climate.repository';
import { alertsOf } from './climate.service';

/** The collection's morning: the daily e-mail goes out from 07:00 local time. */
export const MORNING_HOUR = 7;

/** 07:00 on `date` in `zone` (the first such instant; a zone never skips its 07:00 in practice). */
export function morningOf(date: LocalDate, zone: string): Date {
  const [year, month, day] = date.split('-').map(Number) as [number, number, number];
  const wall = { year, month, day, hour: MORNING_HOUR, minute: 0, second: 0 };
  return (
    instantsOfWallTime(wall, zone)[0] ??
    instantsOfWallTime({ ...wall, hour: MORNING_HOUR + 1 }, zone)[0]!
  );
}

/**
 * Each owner's morning e-mail: the rooms out of range between yesterday's morning and this
 * one (so every reading is reported on exactly one morning), in the owner's unit. Sent only
 * when there is something to say, once per owner and day (daily_mails), and tried again on
 * the next run if the mail server refused it. Safe to run as often as wanted.
 */
export function createDailyMail(
  db: Db,
  deps: { mailer: Mailer; now: () => Date; publicUrl: (p: string) => string; logger?: Logger },
) {
  return {
    async runDue(): Promise<number> {
      const at = deps.now();
      let sent = 0;
      for (const c of await collectionsWithTargets(db)) {
        const today = localDateOf(at, c.timeZone);
        const morning = morningOf(today, c.timeZone);
        if (at < morning) continue;
        try {
          const from = morningOf(addDays(today, -1), c.timeZone);
          const targets = new Map<string, RoomTargets>(
            (await targetsOf(db, c.id)).map((t) => [t.room, t]),
          );
          const alerts = alertsOf(await readingsBetween(db, c.id, from, morning), targets);
          if (!alerts.length) continue;
          for (const owner of await ownersOf(db, c.id)) {
            const mail = dailyMail({
              collectionName: c.name,
              date: today,
              alerts,
              unit: owner.temperatureUnit,
              link: deps.publicUrl('/places'),
            })!;
            const done = await withUnsentDailyMail(
              db,
              { collectionId: c.id, userId: owner.userId, localDate: today },
              () => deps.mailer.send({ to: owner.email, subject: mail.subject, text: mail.text }),
              at,
            );
            if (done) sent += 1;
          }
        } catch (err) {
          // One collection's failure (or a refused mail) holds back no other; the next run retries.
          deps.logger?.warn({ err, collectionId: c.id }, 'daily e-mail not sent; retried');
        }
      }
      return sent;
    },
  };
}
export type DailyMail = ReturnType<typeof createDailyMail>;
