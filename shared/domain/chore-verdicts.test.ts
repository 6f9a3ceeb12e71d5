import { describe, expect, it } from 'vitest';
import { choresToLoad, judgeChores, screenChores } from './chore-verdicts';

const SUBJECT = '7d3f8a52-0b7e-4c38-9d0e-2f1c6e0a9b11';
const OTHER = '0c2d4e6f-8a1b-4c3d-9e5f-7a9b1c3d5e7f';
const chore = (id: string, extra: Record<string, unknown> = {}) => ({
  id,
  subjectKind: 'colony',
  subjectId: SUBJECT,
  kind: 'feed',
  clientRecordedAt: '2026-12-03T09:00:00.000Z',
  ...extra,
});
const ID = (n: number) => `00000000-0000-4000-8000-00000000000${n}`;
const at = new Date('2026-12-03T09:01:00.000Z');
const keeper = {
  collectionId: 'c1',
  collectionName: 'Northlight',
  timeZone: 'Europe/London',
  role: 'keeper' as const,
  userId: 'u1',
  startsAt: null,
  endsAt: null,
  writesClosedAt: null,
};
const reading = (id: string, extra: Record<string, unknown> = {}) =>
  chore(id, {
    subjectKind: 'room',
    subjectId: 'Spare room',
    kind: 'reading',
    payload: { minCelsius: 23, maxCelsius: 30.5, humidity: 66 },
    ...extra,
  });
const messages = (raw: unknown[]) => {
  const { results } = screenChores(raw, at, at);
  return raw.map((_, i) => results[i]?.message ?? 'ok');
};

describe('a chore batch’s verdicts', () => {
  it('judges each chore on its own, in the order sent', () => {
    const screened = screenChores(
      [
        chore(ID(1)),
        chore(ID(1)),
        chore(ID(2), { kind: 'mist' }),
        chore(ID(3), { payload: { colour: 'red' } }),
        chore(ID(4), { subjectId: OTHER }),
        chore(ID(5)),
        chore(ID(6)),
        { nonsense: true },
      ],
      at,
      at,
    );
    expect(choresToLoad(screened.candidates).subjects.get('colony')).toEqual(
      new Set([SUBJECT, OTHER]),
    );
    const { results, accepted } = judgeChores(
      keeper,
      screened,
      {
        subjects: new Set([`colony:${SUBJECT}`]),
        stored: new Map([
          [ID(5), { collectionId: 'c1', subjectKind: 'colony', subjectId: SUBJECT, kind: 'feed' }],
          [ID(6), { collectionId: 'c2', subjectKind: 'colony', subjectId: SUBJECT, kind: 'feed' }],
        ]),
      },
      at,
    );
    expect(results.map((r) => [r.status, r.reason ?? null])).toEqual([
      ['accepted', null],
      ['duplicate', null],
      ['rejected', 'invalid'],
      ['rejected', 'invalid'],
      ['rejected', 'unknown_subject'],
      ['duplicate', null],
      ['rejected', 'id_conflict'],
      ['rejected', 'invalid'],
    ]);
    expect(results[2]!.message).toBe(
      'kind: A colony’s chore is one of: feed, water_gel, clean, split.',
    );
    expect(results[3]!.message).toMatch(/^payload/);
    expect(accepted.map((c) => c.chore.id)).toEqual([ID(1)]);
  });

  it('checks each subject kind’s id and payload: a colony by uuid, a room by its name', () => {
    expect(
      messages([
        chore(ID(1), { subjectId: 'Spare room' }),
        reading(ID(2), { subjectId: '   ' }),
        reading(ID(3), { subjectId: 'x'.repeat(41) }),
        reading(ID(4), { payload: { minCelsius: null, maxCelsius: null, humidity: null } }),
        reading(ID(5), { payload: { minCelsius: 31, maxCelsius: 24, humidity: null } }),
        reading(ID(6), { payload: { minCelsius: 23, maxCelsius: 25, humidity: 120 } }),
        reading(ID(7), { payload: { minCelsius: 23, maxCelsius: 25, humidity: 60, note: 'x' } }),
        reading(ID(8), { kind: 'feed' }),
        reading(ID(9)),
      ]),
    ).toEqual([
      'subjectId: This id is not valid.',
      'subjectId: Say which room.',
      'subjectId: Keep the room under 40 characters.',
      'payload: Give a temperature or the humidity.',
      'payload.minCelsius: The lowest temperature is above the highest. Swap them.',
      expect.stringMatching(/^payload\.humidity: /),
      expect.stringMatching(/^payload: /),
      'kind: A room’s chore is one of: reading.',
      'ok',
    ]);
    // A room's name is stored as the places write it, without the spaces around it.
    const [kept] = screenChores(
      [reading(ID(1), { subjectId: '  Spare room ' })],
      at,
      at,
    ).candidates;
    expect(kept!.chore.subjectId).toBe('Spare room');
    expect(kept!.chore.payload).toEqual({ minCelsius: 23, maxCelsius: 30.5, humidity: 66 });
  });

  it('lets a covering helper record a room’s reading but no colony care, and only in the cover', () => {
    const cover = {
      ...keeper,
      role: 'helper' as const,
      startsAt: new Date('2026-12-01T00:00:00Z'),
      endsAt: new Date('2026-12-05T00:00:00Z'),
    };
    const facts = {
      subjects: new Set([`colony:${SUBJECT}`, 'room:Spare room']),
      stored: new Map([
        [
          ID(4),
          { collectionId: 'c1', subjectKind: 'room', subjectId: 'Spare room', kind: 'reading' },
        ],
      ]),
    };
    const batch = [
      reading(ID(1)),
      chore(ID(2)),
      reading(ID(3), { subjectId: 'Loft' }),
      reading(ID(4)),
    ];
    const during = judgeChores(cover, screenChores(batch, at, at), facts, at);
    expect(during.results.map((r) => [r.status, r.reason ?? null])).toEqual([
      ['accepted', null],
      ['rejected', 'not_for_helpers'],
      ['rejected', 'unknown_subject'],
      ['duplicate', null],
    ]);
    expect(during.results[1]!.message).toBe(
      'Helpers do not record colony care; ask a keeper to record this.',
    );
    expect(during.results[2]!.message).toBe('There is no room called “Loft” among your places.');
    // Three days after the cover ended (more than the 48-hour grace): a new reading is refused,
    // the one stored during the cover is still a duplicate.
    const late = new Date('2026-12-08T09:00:00Z');
    const after = judgeChores(
      cover,
      screenChores(
        [reading(ID(1), { clientRecordedAt: late.toISOString() }), reading(ID(4))],
        late,
        late,
      ),
      facts,
      late,
    );
    expect(after.results.map((r) => [r.status, r.reason ?? null])).toEqual([
      ['rejected', 'outside_cover'],
      ['duplicate', null],
    ]);
    expect(after.results[0]!.message).toMatch(/more than 48 hours after your cover/);
  });
});
