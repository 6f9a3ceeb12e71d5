import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { saleListings } from '../db/schema/sales';

// Sales — L: the demo's stock for sale. Half the Hapalopus formosus clutch (tray C1) is offered
// at CAD 25.00; the public availability list stays off until the keeper turns it on.

export const DEMO_CLUTCH = 'H. formosus sac 1';
export const DEMO_LISTED = 12;
export const DEMO_PRICE = { priceMinor: 2500, currency: 'CAD' } as const;

export async function seedSalesStock(
  tx: NodePgDatabase,
  collectionId: string,
  ownerId: string,
  animalIds: readonly string[],
) {
  await tx.insert(saleListings).values(
    animalIds.slice(0, DEMO_LISTED).map((animalId) => ({
      animalId,
      collectionId,
      ...DEMO_PRICE,
      description:
        'Captive bred here from our own pair. Feeding on pinhead crickets, kept on damp coco fibre with a little moss.',
      listedPublicly: true,
      listedBy: ownerId,
    })),
  );
}
