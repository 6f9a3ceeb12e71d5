import { BACKUP_FORMAT, BACKUP_VERSION } from '#shared/schemas/backup';
import type { MemberCollection } from '../../access/memberships';
import type { Database } from '../../db/client';
import type { PhotosService } from '../photos/photos.service';
import * as repo from './data.repository';

/** Where a backup goes: a write resolves once the reader has room for more. */
export interface BackupSink {
  write(text: string): Promise<void>;
}

const PAGE = {
  places: 500,
  animals: 200,
  events: 1000,
  stockChanges: 1000,
  chores: 1000,
  readings: 1000,
};
/** Text gathered before it is handed to the sink: few writes, little memory. */
const CHUNK_CHARS = 256 * 1024;

/**
 * The whole collection as one JSON document, written piece by piece: places, animals, events,
 * stock changes, chores and climate readings are read a page at a time and each photo is read, encoded and written on its own, so
 * memory stays small however large the collection. One snapshot (repo.inSnapshot) holds every
 * page (no event without its animal); the name and zone are the ones the membership check
 * read. Each record sits on its own line; the members come in the order a restore reads them
 * (shared/schemas/backup.ts).
 */
export async function writeBackup(
  db: Database['db'],
  photos: PhotosService,
  c: MemberCollection,
  exportedAt: Date,
  sink: BackupSink,
) {
  const { collectionId } = c;
  let buffer: string[] = [];
  let buffered = 0;
  const emit = async (text: string) => {
    buffer.push(text);
    buffered += text.length;
    if (buffered >= CHUNK_CHARS) await flush();
  };
  const flush = async () => {
    if (!buffered) return;
    const text = buffer.join('');
    buffer = [];
    buffered = 0;
    await sink.write(text);
  };
  /** A record whose photo (base64) is appended as its last member, never held twice. */
  const withPhoto = async (record: object, photo: Buffer | null) => {
    const head = JSON.stringify(record).slice(0, -1);
    if (!photo) return emit(`${head},"photo":null}`);
    await emit(`${head},"photo":"`);
    await flush();
    await sink.write(photo.toString('base64'));
    await emit('"}');
  };
  const J = JSON.stringify;

  await repo.inSnapshot(db, async (tx) => {
    const rules = await repo.rulesOf(tx, collectionId);
    await emit(
      `{"format":${J(BACKUP_FORMAT)},"version":${BACKUP_VERSION},"exportedAt":${J(exportedAt.toISOString())},\n`,
    );
    await emit(
      `"collection":${J({ name: c.collectionName, timeZone: c.timeZone, rules })},\n"locations":[`,
    );

    let first = true;
    const separator = () => {
      const s = first ? '\n' : ',\n';
      first = false;
      return s;
    };
    for (let after: Parameters<typeof repo.placesPage>[2] = null; ;) {
      const page = await repo.placesPage(tx, collectionId, after, PAGE.places);
      for (const { id, room, rack, shelf, position, walkOrder } of page)
        await emit(separator() + J({ id, room, rack, shelf, position, walkOrder }));
      if (page.length < PAGE.places) break;
      after = page.at(-1)!;
    }

    await emit('],\n"animals":[');
    first = true;
    for (let after: string | null = null; ;) {
      const page = await repo.animalsPage(tx, collectionId, after, PAGE.animals);
      for (const a of page) {
        await emit(separator());
        const record = {
          id: a.id,
          labelCode: a.labelCode,
          name: a.name,
          scientificName: a.scientificName,
          commonName: a.commonName,
          group: a.group,
          lifeStage: a.lifeStage,
          sex: a.sex,
          sizeMm: a.sizeMm,
          locationId: a.locationId,
          hasWaterDish: a.hasWaterDish,
          preyType: a.preyType,
          preySize: a.preySize,
          preyCount: a.preyCount,
          diet: a.diet,
          intervalDays: a.intervalDays,
          mistEveryDays: a.mistEveryDays,
          moistenEveryDays: a.moistenEveryDays,
          spotCleanEveryDays: a.spotCleanEveryDays,
          enclosureLengthMm: a.enclosureLengthMm,
          enclosureWidthMm: a.enclosureWidthMm,
          enclosureHeightMm: a.enclosureHeightMm,
          doNotFeedUntil: a.doNotFeedUntil,
          cautions: a.cautions,
          cautionNote: a.cautionNote,
          status: a.status,
          statusDate: a.statusDate,
          acquiredOn: a.acquiredOn,
          source: a.source,
          clutch: a.clutch,
          notes: a.notes,
          settings: a.settings,
          createdAt: a.createdAt.toISOString(),
          updatedAt: a.updatedAt.toISOString(),
        };
        await withPhoto(
          record,
          a.photoKey ? await photos.readFull(collectionId, a.photoKey) : null,
        );
      }
      if (page.length < PAGE.animals) break;
      after = page.at(-1)!.labelCode;
    }

    await emit('],\n"eggSacs":[');
    first = true;
    for (const { collectionId: _c, createdAt, ...sac } of await repo.sacsOf(tx, collectionId)) {
      await emit(separator() + J({ ...sac, createdAt: createdAt.toISOString() }));
    }

    await emit('],\n"events":[');
    first = true;
    for (let after: { at: string; id: string } | null = null; ;) {
      const page = await repo.eventsPage(tx, collectionId, after, PAGE.events);
      for (const { e, photoKey } of page) {
        await emit(separator());
        const record = {
          id: e.id,
          animalId: e.animalId,
          kind: e.kind,
          payload: e.payload,
          recordedBy: e.recordedBy,
          deviceId: e.deviceId,
          clientRecordedAt: e.clientRecordedAt.toISOString(),
          clientSentAt: e.clientSentAt?.toISOString() ?? null,
          serverReceivedAt: e.serverReceivedAt.toISOString(),
          effectiveAt: e.effectiveAt.toISOString(),
          flags: e.flags,
        };
        await withPhoto(record, photoKey ? await photos.readFull(collectionId, photoKey) : null);
      }
      if (page.length < PAGE.events) break;
      const last = page.at(-1)!;
      after = { at: last.cursor, id: last.e.id };
    }

    // Feeder colonies (a handful) with their stock, then each one's stock history a page at a time.
    await emit('],\n"colonies":[');
    first = true;
    const colonies = await repo.coloniesOf(tx, collectionId);
    for (const { colony: k, stock } of colonies) {
      const record = {
        id: k.id,
        name: k.name,
        species: k.species,
        preyType: k.preyType,
        intervals: {
          feed: k.feedEvery,
          water_gel: k.waterGelEvery,
          clean: k.cleanEvery,
          split: k.splitEvery,
        },
        stock: stock.map(({ preySize, count, position }) => ({ preySize, count, position })),
        createdAt: k.createdAt.toISOString(),
        updatedAt: k.updatedAt.toISOString(),
      };
      await emit(separator() + J(record));
    }

    await emit('],\n"colonyStockChanges":[');
    first = true;
    for (const { colony } of colonies) {
      for (let after: { at: string; seq: number } | null = null; ;) {
        const page = await repo.stockChangesPage(tx, colony.id, after, PAGE.stockChanges);
        for (const { change: c } of page) {
          const record = {
            id: c.id,
            colonyId: c.colonyId,
            preySize: c.preySize,
            delta: c.delta,
            after: c.after,
            reason: c.reason,
            sourceEventId: c.sourceEventId,
            note: c.note,
            at: c.at.toISOString(),
          };
          await emit(separator() + J(record));
        }
        if (page.length < PAGE.stockChanges) break;
        const last = page.at(-1)!;
        after = { at: last.cursor, seq: last.change.seq };
      }
    }

    await emit('],\n"chores":[');
    first = true;
    for (let after: Parameters<typeof repo.choresPage>[2] = null; ;) {
      const page = await repo.choresPage(tx, collectionId, after, PAGE.chores);
      for (const c of page) {
        const record = {
          id: c.id,
          subjectKind: c.subjectKind,
          subjectId: String(c.subjectId),
          kind: c.kind,
          payload: c.payload,
          recordedBy: c.recordedBy,
          deviceId: c.deviceId,
          clientRecordedAt: c.clientRecordedAt.toISOString(),
          serverReceivedAt: c.serverReceivedAt.toISOString(),
          effectiveAt: c.effectiveAt.toISOString(),
        };
        await emit(separator() + J(record));
      }
      if (page.length < PAGE.chores) break;
      const last = page.at(-1)!;
      after = {
        subjectKind: last.subjectKind,
        subjectId: String(last.subjectId),
        kind: last.kind,
        id: last.id,
      };
    }

    await emit('],\n"roomTargets":[');
    first = true;
    for (const { collectionId: _c, updatedAt, ...t } of await repo.roomTargetsOf(
      tx,
      collectionId,
    )) {
      await emit(separator() + J({ ...t, updatedAt: updatedAt.toISOString() }));
    }

    await emit('],\n"climateReadings":[');
    first = true;
    for (let after: { room: string; at: string; id: string } | null = null; ;) {
      const page = await repo.readingsPage(tx, collectionId, after, PAGE.readings);
      for (const { reading: r } of page) {
        const record = {
          id: r.id,
          room: r.room,
          takenAt: r.takenAt.toISOString(),
          currentCelsius: r.currentCelsius,
          minCelsius: r.minCelsius,
          maxCelsius: r.maxCelsius,
          humidity: r.humidity,
          source: r.source,
          recordedBy: r.recordedBy,
          createdAt: r.createdAt.toISOString(),
        };
        await emit(separator() + J(record));
      }
      if (page.length < PAGE.readings) break;
      const last = page.at(-1)!;
      after = { room: last.reading.room, at: last.cursor, id: last.reading.id };
    }

    // Sales — S (version 3): settings, buyers, listings, sales, invoices, payments.
    const iso = (d: Date | null) => (d ? d.toISOString() : null);
    await emit('],\n"salesSettings":[');
    first = true;
    for (const x of await repo.salesSettingsOf(tx, collectionId)) {
      const record = {
        currency: x.currency,
        taxRateBp: x.taxRateBp,
        taxRounding: x.taxRounding,
        sellerDetails: x.sellerDetails,
        holdDays: x.holdDays,
        safeMinC: x.safeMinC,
        safeMaxC: x.safeMaxC,
        availabilityOn: x.availabilityOn,
        availabilityColumns: x.availabilityColumns,
        availabilityNote: x.availabilityNote,
        nextInvoiceNumber: x.nextInvoiceNumber,
        updatedAt: x.updatedAt.toISOString(),
      };
      await emit(separator() + J(record));
    }
    await emit('],\n"buyers":[');
    first = true;
    for (const { collectionId: _c, createdAt, updatedAt, ...b } of await repo.buyersOf(
      tx,
      collectionId,
    ))
      await emit(
        separator() +
          J({ ...b, createdAt: createdAt.toISOString(), updatedAt: updatedAt.toISOString() }),
      );
    await emit('],\n"saleListings":[');
    first = true;
    for (const l of await repo.listingsOf(tx, collectionId)) {
      const record = {
        animalId: l.animalId,
        priceMinor: l.priceMinor,
        currency: l.currency,
        description: l.description,
        listedPublicly: l.listedPublicly,
        listedAt: l.listedAt.toISOString(),
        updatedAt: l.updatedAt.toISOString(),
      };
      await emit(separator() + J(record));
    }
    await emit('],\n"sales":[');
    first = true;
    for (const { sale: x, animals: held } of await repo.salesOf(tx, collectionId)) {
      const record = {
        id: x.id,
        buyerId: x.buyerId,
        status: x.status,
        reservedUntil: x.reservedUntil,
        note: x.note,
        shipOn: x.shipOn,
        shipRoute: x.shipRoute,
        forecastLowC: x.forecastLowC,
        forecastHighC: x.forecastHighC,
        shipCheckConfirmedAt: iso(x.shipCheckConfirmedAt),
        shipCheckConcerns: x.shipCheckConcerns,
        packing: x.packing,
        carrier: x.carrier,
        tracking: x.tracking,
        shippedAt: iso(x.shippedAt),
        endedAt: iso(x.endedAt),
        createdAt: x.createdAt.toISOString(),
        updatedAt: x.updatedAt.toISOString(),
        animals: held.map(({ a }) => ({
          animalId: a.animalId,
          priceMinor: a.priceMinor,
          currency: a.currency,
          releasedAt: iso(a.releasedAt),
        })),
      };
      await emit(separator() + J(record));
    }
    await emit('],\n"invoices":[');
    first = true;
    for (const { invoice: x, lines } of await repo.invoicesOf(tx, collectionId)) {
      const record = {
        id: x.id,
        saleId: x.saleId,
        number: x.number,
        currency: x.currency,
        taxRateBp: x.taxRateBp,
        taxRounding: x.taxRounding,
        shippingMinor: x.shippingMinor,
        subtotalMinor: x.subtotalMinor,
        taxMinor: x.taxMinor,
        totalMinor: x.totalMinor,
        paidMinor: x.paidMinor,
        refundedMinor: x.refundedMinor,
        status: x.status,
        issuedOn: x.issuedOn,
        dueOn: x.dueOn,
        emailedAt: iso(x.emailedAt),
        cancelledAt: iso(x.cancelledAt),
        createdAt: x.createdAt.toISOString(),
        updatedAt: x.updatedAt.toISOString(),
        lines: lines.map((l) => ({
          position: l.position,
          animalId: l.animalId,
          description: l.description,
          quantity: l.quantity,
          unitMinor: l.unitMinor,
          netMinor: l.netMinor,
          taxMinor: l.taxMinor,
        })),
      };
      await emit(separator() + J(record));
    }
    await emit('],\n"payments":[');
    first = true;
    for (const { p } of await repo.paymentsOf(tx, collectionId))
      await emit(separator() + J({ ...p, at: p.at.toISOString() }));
    await emit('\n]}\n');
    await flush();
  });
}
