import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { buyers, salesSettings } from '../db/schema/sales';

type Tx = Parameters<Parameters<NodePgDatabase['transaction']>[0]>[0];

/**
 * Sales — S: Northlight Inverts sells in Canadian dollars with Ontario's 13 % HST
 * (Government of Canada, GST/HST rates — from memory), and has one buyer on file (invented).
 * Helper L's seed lists the clutch; nothing is reserved, so the demo starts with a clean slate.
 */
export async function seedSales(tx: Tx, collectionId: string) {
  await tx.insert(salesSettings).values({
    collectionId,
    currency: 'CAD',
    taxRateBp: 1300,
    taxRounding: 'per_invoice',
    sellerDetails:
      'Northlight Inverts\n118 Ossington Avenue\nToronto ON M6J 2Z5\nHST no. 00000 0000 RT0001',
    holdDays: 7,
    safeMinC: 5,
    safeMaxC: 30,
  });
  await tx.insert(buyers).values({
    collectionId,
    name: 'Maren Lindqvist',
    email: 'maren.lindqvist@example.test',
    phone: '+1 613 555 0142',
    address: '27 Elgin Street\nOttawa ON K1P 5K7',
    notes: 'Keeps Hapalopus already; prefers shipping early in the week.',
  });
}
