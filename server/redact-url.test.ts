import { describe, expect, it } from 'vitest';
import { redactUrl } from './redact-url';

describe('request URLs in logs', () => {
  it('never keep a one-time token', () => {
    expect(redactUrl('/api/cover-invites/preview?token=abcDEF_123-x')).toBe(
      '/api/cover-invites/preview?token=[redacted]',
    );
    expect(redactUrl('/x?a=1&token=secret&b=2')).toBe('/x?a=1&token=[redacted]&b=2');
    expect(redactUrl('/api/collections/1/rounds/today')).toBe('/api/collections/1/rounds/today');
  });
});
