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

  it('never keep the public availability list’s link token', () => {
    // 24 random bytes in base64url, as the list's link is made (decision 022).
    const token = 'Qm9vbXNsYW5nLXRva2VuLWZvci10ZXN0aW5n';
    expect(redactUrl(`/api/available/${token}`)).toBe('/api/available/[redacted]');
    expect(redactUrl(`/api/available/${token}/list.csv`)).toBe(
      '/api/available/[redacted]/list.csv',
    );
    expect(redactUrl(`/api/available/${token}?v=2`)).toBe('/api/available/[redacted]?v=2');
    expect(redactUrl(`/available/${token}`)).toBe('/available/[redacted]');
    expect(redactUrl(`https://rack.example/available/${token}#top`)).toBe(
      'https://rack.example/available/[redacted]#top',
    );
    for (const line of [
      redactUrl(`/api/available/${token}/list.csv`),
      redactUrl(`/available/${token}`),
    ])
      expect(line).not.toContain(token);
    // A keeper's own sales list is no token.
    expect(redactUrl('/api/collections/1/sales/available')).toBe(
      '/api/collections/1/sales/available',
    );
    expect(redactUrl('/api/available')).toBe('/api/available');
  });
});
