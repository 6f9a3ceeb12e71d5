import { randomBytes } from 'node:crypto';
import {
  AVAILABILITY_COLUMNS,
  availabilityCsv,
  publicRows,
  type AvailabilityColumn,
} from '#shared/domain/sales/availability';
import type {
  AvailabilityBody,
  AvailabilitySettingsView,
  PublicAvailability,
} from '#shared/schemas/listings';
import type { MemberCollection } from '../../access/memberships';
import type { Db } from '../../db/client';
import { HttpError } from '../../middleware/errors';
import type { ListingsService } from '../listings/listings.service';
import { availabilityOf, publishedBy, saveAvailability } from './availability.repository';

/** 24 random bytes: 192 bits, base64url (RFC 4648 §5), far beyond guessing. */
const newToken = () => randomBytes(24).toString('base64url');

const DEFAULT_COLUMNS: AvailabilityColumn[] = ['species', 'stage', 'size', 'price', 'count'];

// Only whitelisted columns survive, whatever an older row holds.
const known = (columns: string[]) => AVAILABILITY_COLUMNS.filter((c) => columns.includes(c));

const view = (
  row: { on: boolean; token: string | null; columns: string[]; note: string } | null,
): AvailabilitySettingsView => ({
  on: row?.on ?? false,
  columns: row ? known(row.columns) : DEFAULT_COLUMNS,
  note: row?.note ?? '',
  path: row?.token ? `/available/${row.token}` : null,
});

/** One answer for a wrong link and a list that is off: the link says nothing either way. */
export const notPublished = () =>
  new HttpError(404, 'not_found', 'This list is not available. Ask the breeder for a new link.');

/**
 * The public availability list (sales part L): off until the keeper turns it on, reached only
 * by its own unguessable link, and built from grouped stock only — never an animal's code,
 * place, notes, id, history or anything about buyers.
 */
export function createAvailabilityService(
  db: Db,
  deps: { now: () => Date; listings: Pick<ListingsService, 'stock'> },
) {
  return {
    async settings(c: MemberCollection) {
      return view(await availabilityOf(db, c.collectionId));
    },

    /** Turning the list on makes its first link; the link stays the same until a new one. */
    async save(c: MemberCollection, body: AvailabilityBody) {
      const current = await availabilityOf(db, c.collectionId);
      const token = body.on && !current?.token ? newToken() : undefined;
      return view(
        await saveAvailability(
          db,
          c.collectionId,
          { on: body.on, columns: known(body.columns), note: body.note, token },
          deps.now(),
        ),
      );
    },

    /** A new link; the old one stops working at once. */
    async newLink(c: MemberCollection) {
      return view(await saveAvailability(db, c.collectionId, { token: newToken() }, deps.now()));
    },

    async published(token: string): Promise<PublicAvailability> {
      const list = await publishedBy(db, token);
      if (!list) throw notPublished();
      const columns = known(list.columns);
      return {
        collectionName: list.name,
        note: list.note,
        columns,
        rows: publicRows(await deps.listings.stock(list.collectionId), columns),
      };
    },

    async publishedCsv(token: string): Promise<{ name: string; csv: string }> {
      const list = await publishedBy(db, token);
      if (!list) throw notPublished();
      return {
        name: list.name,
        csv: availabilityCsv(await deps.listings.stock(list.collectionId), known(list.columns)),
      };
    },
  };
}
export type AvailabilityService = ReturnType<typeof createAvailabilityService>;
