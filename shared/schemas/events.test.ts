import { describe, expect, it } from 'vitest';
import { EVENT_KINDS } from '../domain/event-kinds';
import { EVENT_PAYLOADS, recordedEvent } from './events';

const base = {
  id: '6f1c7b8e-2c7e-4b6a-9a53-0c2a4f1e9b10',
  animalId: '0e6a0d8c-7f5e-4c1b-8f4a-3c2b1a0d9e8f',
  clientRecordedAt: '2026-03-08T06:59:00-05:00',
};

describe('recorded events', () => {
  it('has a payload schema for every kind the engine understands', () => {
    expect(Object.keys(EVENT_PAYLOADS).sort()).toEqual([...EVENT_KINDS].sort());
  });
  it('accepts a meal with its offer and a molt with its size', () => {
    expect(
      recordedEvent.safeParse({
        ...base,
        kind: 'ate',
        payload: { preyType: 'cricket', preySize: 'large', count: 2 },
      }).success,
    ).toBe(true);
    expect(
      recordedEvent.safeParse({ ...base, kind: 'molted', payload: { sizeMm: 130 } }).success,
    ).toBe(true);
  });
  it('refuses payload fields that do not belong to the kind, with a readable path', () => {
    const r = recordedEvent.safeParse({ ...base, kind: 'watered', payload: { sizeMm: 3 } });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0]!.path).toEqual(['payload']);
    const v = recordedEvent.safeParse({ ...base, kind: 'void', payload: {} });
    expect(v.error!.issues[0]!.path).toEqual(['payload', 'targetId']);
  });
  it('refuses breeding facts sent as taps: the sac, case or brood record on the Breeding page is their truth', () => {
    for (const kind of [
      'sac_laid',
      'sac_pulled',
      'sac_hatched',
      'case_laid',
      'brood_started',
      'brood_dispersed',
    ]) {
      const r = recordedEvent.safeParse({ ...base, kind, payload: {} });
      expect(r.success).toBe(false);
      expect(r.error!.issues[0]!.message).toMatch(/Breeding page/);
    }
  });
  it('needs a client id that is a UUID and a time with its offset (RFC 3339)', () => {
    expect(recordedEvent.safeParse({ ...base, id: 'not-a-uuid', kind: 'ate' }).success).toBe(false);
    expect(
      recordedEvent.safeParse({ ...base, clientRecordedAt: 'yesterday', kind: 'ate' }).success,
    ).toBe(false);
  });
});
