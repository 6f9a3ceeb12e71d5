import { describe, expect, it } from 'vitest';
import { packingChecklist, packingLeft, PACKING_KEYS } from './packing';
import { shippingConcerns } from './shipping-check';

describe('the packing checklist', () => {
  it('asks for no heat or cold pack on a mild route', () => {
    const lines = packingChecklist(shippingConcerns('2026-12-08', { lowC: 12, highC: 22 }), {});
    expect(lines.filter((l) => !l.needed).map((l) => l.key)).toEqual(['heat_pack', 'cold_pack']);
    expect(lines.map((l) => l.key)).toEqual(PACKING_KEYS);
  });

  it('asks for a heat pack on a frosty route and a cold pack on a hot one', () => {
    const frosty = packingChecklist(shippingConcerns('2026-12-08', { lowC: -3, highC: 4 }), {});
    expect(frosty.find((l) => l.key === 'heat_pack')!.needed).toBe(true);
    expect(frosty.find((l) => l.key === 'cold_pack')!.needed).toBe(false);
    const hot = packingChecklist(shippingConcerns('2026-07-07', { lowC: 20, highC: 34 }), {});
    expect(hot.find((l) => l.key === 'cold_pack')!.needed).toBe(true);
  });

  it('lists what is left: needed items not ticked, in order', () => {
    const ticked = Object.fromEntries(PACKING_KEYS.map((k) => [k, true]));
    const mild = packingChecklist([], { ...ticked, padding: false });
    expect(packingLeft(mild)).toEqual(['padding']);
    // An unneeded heat pack left unticked does not hold the parcel back.
    expect(packingLeft(packingChecklist([], { ...ticked, heat_pack: false }))).toEqual([]);
  });
});
