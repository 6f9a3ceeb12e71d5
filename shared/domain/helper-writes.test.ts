import { describe, expect, it } from 'vitest';
import { HELPER_SYNC_GRACE_MS, judgeHelperWrite } from './helper-writes';

const cover = {
  startsAt: new Date('2026-11-20T05:00:00Z'),
  endsAt: new Date('2026-11-27T05:00:00Z'),
  writesClosedAt: null,
};
const during = new Date('2026-11-26T18:00:00Z');
const at = (iso: string) => new Date(iso);

describe('a helper’s write', () => {
  it('is taken during the cover and up to 48 hours after it, if made during it', () => {
    expect(HELPER_SYNC_GRACE_MS).toBe(48 * 60 * 60 * 1000);
    expect(judgeHelperWrite(cover, during, at('2026-11-26T18:01:00Z'))).toBe('ok');
    expect(judgeHelperWrite(cover, during, at('2026-11-29T04:59:59Z'))).toBe('ok');
  });

  it('is refused once the server receives it 48 hours or more after the end, whatever its date', () => {
    expect(judgeHelperWrite(cover, during, at('2026-11-29T05:00:00Z'))).toBe('too_late');
    expect(judgeHelperWrite(cover, during, at('2027-03-01T12:00:00Z'))).toBe('too_late');
  });

  it('is refused when dated outside the cover’s days, even inside the grace', () => {
    expect(judgeHelperWrite(cover, at('2026-11-27T06:00:00Z'), at('2026-11-27T07:00:00Z'))).toBe(
      'outside_cover',
    );
    expect(judgeHelperWrite(cover, at('2026-11-19T23:00:00Z'), at('2026-11-20T06:00:00Z'))).toBe(
      'outside_cover',
    );
  });

  it('has no grace after the owner ended the cover early', () => {
    const ended = {
      ...cover,
      endsAt: at('2026-11-24T10:00:00Z'),
      writesClosedAt: at('2026-11-24T10:00:00Z'),
    };
    expect(judgeHelperWrite(ended, at('2026-11-24T09:00:00Z'), at('2026-11-24T09:30:00Z'))).toBe(
      'ok',
    );
    expect(judgeHelperWrite(ended, at('2026-11-24T09:00:00Z'), at('2026-11-24T10:00:01Z'))).toBe(
      'closed_by_owner',
    );
  });
});
