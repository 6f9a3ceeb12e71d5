import { randomUUID } from 'node:crypto';
import { roomAlerts, summariseByDay } from '#shared/domain/climate/daily';
import { hasTargets, NO_TARGETS, type RoomTargets } from '#shared/domain/climate/ranges';
import { addDays, localDateOf, startOfLocalDate } from '#shared/domain/local-dates';
import type {
  ClimateToday,
  LoggerImportBody,
  Reading,
  RoomReadingPayload,
  RoomTargetsInput,
} from '#shared/schemas/climate';
import type { MemberCollection, Membership } from '../../access/memberships';
import type { Db } from '../../db/client';
import { HttpError } from '../../middleware/errors';
import {
  insertLoggerRows,
  insertTypedReadings,
  latestPerRoom,
  newestOfRoom,
  readingsBetween,
  renameRoom,
  roomNames,
  roomOfAnimal,
  roomsWithReadings,
  targetsOf,
  upsertTargets,
  type ReadingRow,
  type TargetsRow,
} from './climate.repository';

const DAY_MS = 86_400_000;

export function toReading(r: ReadingRow): Reading {
  return {
    id: r.id,
    room: r.room,
    takenAt: r.takenAt.toISOString(),
    currentCelsius: r.currentCelsius,
    minCelsius: r.minCelsius,
    maxCelsius: r.maxCelsius,
    humidity: r.humidity,
    source: r.source,
  };
}

const targetsOfRow = (t: TargetsRow | undefined): RoomTargets =>
  t
    ? {
        minCelsius: t.minCelsius,
        maxCelsius: t.maxCelsius,
        minHumidity: t.minHumidity,
        maxHumidity: t.maxHumidity,
      }
    : NO_TARGETS;

const noRoom = () =>
  new HttpError(404, 'not_found', 'There is no room of that name among your places.');

/** Rooms' targets by name. */
async function targetMap(db: Db, collectionId: string) {
  return new Map((await targetsOf(db, collectionId)).map((t) => [t.room, targetsOfRow(t)]));
}

/** Rooms out of range among `readings`, each with its targets. */
export function alertsOf(readings: readonly ReadingRow[], targets: Map<string, RoomTargets>) {
  const byRoom = new Map<string, Reading[]>();
  for (const r of readings) {
    const list = byRoom.get(r.room) ?? [];
    list.push(toReading(r));
    byRoom.set(r.room, list);
  }
  return roomAlerts(
    [...byRoom].map(([room, list]) => ({
      room,
      targets: targets.get(room) ?? NO_TARGETS,
      readings: list,
    })),
  );
}

/**
 * Room climate: targets per room, readings typed on the round or imported from a data
 * logger, what is out of range, and a room's (or an animal's room's) days.
 */
export function createClimateService(db: Db, now: () => Date) {
  async function requireRoom(collectionId: string, room: string) {
    if (!(await roomNames(db, collectionId)).includes(room)) throw noRoom();
  }

  return {
    /**
     * Today for this person: every room with targets (or readings before) and whether its
     * typed reading is still due today, and the rooms out of range in the last day. A helper
     * sees only what they typed themselves beyond the rooms they are asked to read.
     */
    async today(m: Membership, userId: string): Promise<ClimateToday> {
      const at = now();
      const today = localDateOf(at, m.timeZone);
      const dayStart = startOfLocalDate(today, m.timeZone);
      const [names, targets, withReadings, recent] = await Promise.all([
        roomNames(db, m.collectionId),
        targetMap(db, m.collectionId),
        roomsWithReadings(db, m.collectionId),
        readingsBetween(
          db,
          m.collectionId,
          new Date(at.getTime() - DAY_MS),
          new Date(at.getTime() + 1),
          m.role === 'helper' ? { recordedBy: userId } : {},
        ),
      ]);
      const readSince = await readingsBetween(
        db,
        m.collectionId,
        dayStart,
        new Date(at.getTime() + 1),
      );
      const typedToday = new Set(readSince.filter((r) => r.source === 'typed').map((r) => r.room));
      const tracked = new Set(withReadings);
      const rooms = names
        .filter((room) => hasTargets(targets.get(room) ?? NO_TARGETS) || tracked.has(room))
        .map((room) => ({
          room,
          targets: targets.get(room) ?? NO_TARGETS,
          due: !typedToday.has(room),
        }));
      return { rooms, alerts: alertsOf(recent, targets) };
    },

    /** Which of these names are rooms of the collection's places (the room chores' look-up). */
    async roomsIn(collectionId: string, names: string[]): Promise<ReadonlySet<string>> {
      const rooms = new Set(await roomNames(db, collectionId));
      return new Set(names.filter((n) => rooms.has(n)));
    },

    /**
     * Room chores newly stored (decision 020, wired in server/app.ts): each becomes the room's
     * typed reading, with the chore's id and taken at its effective time, in the chores'
     * transaction. The chores feature stores a chore once, and the reading's id is the chore's.
     */
    async storeTypedReadings(
      tx: Db,
      collectionId: string,
      chores: readonly {
        id: string;
        subjectId: string;
        payload: Record<string, unknown>;
        effectiveAt: Date;
        recordedBy: string;
      }[],
    ) {
      await insertTypedReadings(
        tx,
        chores.map((c) => {
          // Parsed by the chore's payload schema (roomReadingPayload) at the edge.
          const p = c.payload as RoomReadingPayload;
          return {
            id: c.id,
            collectionId,
            room: c.subjectId,
            takenAt: c.effectiveAt,
            currentCelsius: null,
            minCelsius: p.minCelsius,
            maxCelsius: p.maxCelsius,
            humidity: p.humidity,
            source: 'typed' as const,
            recordedBy: c.recordedBy,
          };
        }),
      );
    },

    async setTargets(collectionId: string, body: RoomTargetsInput) {
      await requireRoom(collectionId, body.room);
      const row = await upsertTargets(db, { collectionId, ...body }, now());
      return { room: row.room, ...targetsOfRow(row) };
    },

    /** Every room of the places with its targets and newest reading. */
    async rooms(collectionId: string) {
      const [names, targets, latest] = await Promise.all([
        roomNames(db, collectionId),
        targetMap(db, collectionId),
        latestPerRoom(db, collectionId),
      ]);
      const newest = new Map(latest.map((r) => [r.room, toReading(r)]));
      return {
        rooms: names.map((room) => ({
          room,
          targets: targets.get(room) ?? NO_TARGETS,
          latest: newest.get(room) ?? null,
        })),
      };
    },

    /** A room's last `days` days summed up per day (the chart), and its ten newest readings. */
    async history(m: MemberCollection, room: string, days: number) {
      await requireRoom(m.collectionId, room);
      const at = now();
      const from = startOfLocalDate(addDays(localDateOf(at, m.timeZone), 1 - days), m.timeZone);
      const [readings, targets, latest] = await Promise.all([
        readingsBetween(db, m.collectionId, from, new Date(at.getTime() + 1), { room }),
        targetMap(db, m.collectionId),
        newestOfRoom(db, m.collectionId, room, 10),
      ]);
      return {
        room,
        targets: targets.get(room) ?? NO_TARGETS,
        days: summariseByDay(readings.map(toReading), m.timeZone),
        latest: latest.map(toReading),
      };
    },

    /** A logger's rows (read and converted on the phone): each instant of a room once. */
    async importLogger(collectionId: string, body: LoggerImportBody) {
      await requireRoom(collectionId, body.room);
      const added = await insertLoggerRows(
        db,
        body.rows.map((r) => ({
          id: randomUUID(),
          collectionId,
          room: body.room,
          takenAt: new Date(r.takenAt),
          currentCelsius: r.celsius,
          minCelsius: null,
          maxCelsius: null,
          humidity: r.humidity,
          source: 'logger' as const,
          recordedBy: null,
        })),
      );
      return { added, alreadyThere: body.rows.length - added };
    },

    /** The animal's room and its last 30 days, one line per day, for its timeline. */
    async animalClimate(m: MemberCollection, animalId: string) {
      const found = await roomOfAnimal(db, m.collectionId, animalId);
      if (!found) throw new HttpError(404, 'not_found', 'We could not find that animal.');
      if (!found.room) return { room: null, targets: null, days: [] };
      const history = await this.history(m, found.room, 30);
      return { room: found.room, targets: history.targets, days: history.days };
    },

    /** Wired into the places' room rename (server/app.ts): targets and readings follow. */
    renameRoom: (tx: Db, collectionId: string, from: string, to: string) =>
      renameRoom(tx, collectionId, from, to),
  };
}
export type ClimateService = ReturnType<typeof createClimateService>;
