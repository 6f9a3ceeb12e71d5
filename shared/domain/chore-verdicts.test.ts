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
    const { results, accepted } = judgeChores('c1', screened, {
      subjects: new Set([`colony:${SUBJECT}`]),
      stored: new Map([
        [ID(5), { collectionId: 'c1', subjectKind: 'colony', subjectId: SUBJECT, kind: 'feed' }],
        [ID(6), { collectionId: 'c2', subjectKind: 'colony', subjectId: SUBJECT, kind: 'feed' }],
      ]),
    });
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
});
