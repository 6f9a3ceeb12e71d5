import { describe, expect, it } from 'vitest';
import { IDLE_STATUS, STARTING_STATUS, type SyncStatus } from '@/lib/sync';
import { describeSync } from './describe-sync';

const base = IDLE_STATUS;
const now = new Date('2026-12-01T10:00:00Z');
const words = (s: Partial<SyncStatus>) => describeSync({ ...base, ...s }, now).words;

describe('the sync indicator’s words', () => {
  it('says what the issue asks for in each state', () => {
    expect(words({ phase: 'offline', waiting: 7, failures: 1 })).toBe('Offline · 7 waiting');
    expect(words({ phase: 'saving', waiting: 7, progress: { sent: 2, total: 7 } })).toBe(
      'Saving 7…',
    );
    expect(words({ lastSavedAt: '2026-12-01T09:58:00Z' })).toBe('All saved · 2 min ago');
    expect(words({ attention: 3, waiting: 0 })).toBe('3 need attention');
    expect(words({ attention: 1 })).toBe('1 needs attention');
    expect(words({ phase: 'signed_out', waiting: 4 })).toBe('Sign in again to save 4 taps');
    expect(words({ phase: 'failing', waiting: 2 })).toBe('Server trouble · 2 waiting');
  });

  it('claims nothing is waiting only once the outbox has been counted', () => {
    expect(words(STARTING_STATUS)).toBe('Checking taps…');
    expect(words({ ...STARTING_STATUS, waiting: 1 })).not.toMatch(/saved/);
  });

  it('says why taps are waiting after an answer without verdicts, and that they stay', () => {
    const text = describeSync(
      {
        ...base,
        phase: 'failing',
        waiting: 3,
        failures: 2,
        reason: 'The server did not take the taps (error 404).',
      },
      now,
    );
    expect(text.words).toBe('Server trouble · 3 waiting');
    expect(text.detail).toBe(
      'The server did not take the taps (error 404). Your taps stay on this phone and are sent again by themselves.',
    );
    expect(
      describeSync({ ...base, phase: 'offline', waiting: 3, reason: 'No answer' }, now).detail,
    ).toBeNull();
    expect(describeSync({ ...base, lastSavedAt: '2026-12-01T09:58:00Z' }, now).detail).toBeNull();
  });
});
