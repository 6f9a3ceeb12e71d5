// Sales fixtures for API tests: listings are helper L's feature, so tests list animals straight
// into the table the reservation reads; payments are helper P's, so a paid invoice is written
// as P's webhook leaves it (paid amount and status).
import { eq } from 'drizzle-orm';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { invoices, saleListings } from '../../server/db/schema/sales';
import { createAnimal } from '../factories';

/** `count` slings of one clutch, each listed at `priceMinor` in `currency`. */
export async function listedClutch(
  db: NodePgDatabase,
  collectionId: string,
  { count = 3, clutch = 'H. formosus sac 1', priceMinor = 2500, currency = 'CAD' } = {},
) {
  const ids: string[] = [];
  for (let i = 0; i < count; i++) {
    const animal = await createAnimal(db, collectionId, {
      name: `Sling ${i + 1}`,
      scientificName: 'Hapalopus formosus',
      lifeStage: 'sling',
      sizeMm: 12,
      clutch,
    });
    await db.insert(saleListings).values({
      animalId: animal.id,
      collectionId,
      priceMinor,
      currency,
      description: 'Hand-raised from our own sac.',
    });
    ids.push(animal.id);
  }
  return ids;
}

/** Money received on an invoice, as the payments feature records it. */
export async function receivePayment(
  db: NodePgDatabase,
  invoiceId: string,
  paidMinor: number,
  status: 'part_paid' | 'paid',
) {
  await db.update(invoices).set({ paidMinor, status }).where(eq(invoices.id, invoiceId));
}
