import { describe, expect, it } from 'vitest';
import { clockOffsetMs, effectiveTime } from './clock';

const at = (iso: string) => new Date(iso);

describe('effectiveTime', () => {
  it('moves a slow phone’s taps by the batch offset', () => {
    // Phone clock 10 minutes slow: it says it sent at 08:50, the server got it at 09:00.
    const sent = at('2026-12-01T08:50:00Z');
    const received = at('2026-12-01T09:00:00Z');
    expect(clockOffsetMs(sent, received)).toBe(600_000);
    const { effectiveAt, flags } = effectiveTime(at('2026-12-01T08:20:00Z'), sent, received);
    expect(effectiveAt.toISOString()).toBe('2026-12-01T08:30:00.000Z');
    expect(flags).toEqual(['clock_corrected']);
  });

  it('leaves network latency alone and raises no flag', () => {
    const { effectiveAt, flags } = effectiveTime(
      at('2026-12-01T08:00:00Z'),
      at('2026-12-01T09:00:00Z'),
      at('2026-12-01T09:00:00.300Z'),
    );
    expect(effectiveAt.toISOString()).toBe('2026-12-01T08:00:00.300Z');
    expect(flags).toEqual([]);
  });

  it('never files a tap after the server received it', () => {
    const received = at('2026-12-01T09:00:00Z');
    const { effectiveAt, flags } = effectiveTime(
      at('2026-12-01T12:00:00Z'),
      at('2026-12-01T09:00:00Z'),
      received,
    );
    expect(effectiveAt).toEqual(received);
    expect(flags).toEqual(['recorded_after_sent', 'future_clamped']);
  });

  it('flags taps older than a month', () => {
    const { flags } = effectiveTime(
      at('2026-10-01T08:00:00Z'),
      at('2026-12-01T09:00:00Z'),
      at('2026-12-01T09:00:01Z'),
    );
    expect(flags).toEqual(['very_old']);
  });
});
