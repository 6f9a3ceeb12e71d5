import { describe, expect, it } from 'vitest';
import type { CertificateNames } from './addresses';
import { regenerationReason, RENEW_BEFORE_MS, type CertificateFacts } from './certificate-check';

const DAY = 86_400_000;
const now = new Date('2026-06-01T12:00:00Z');
const wanted: CertificateNames = {
  dns: ['localhost', 'keeper-pc', 'keeper-pc.local'],
  ips: ['127.0.0.1', '::1', '192.168.1.20', 'fd12::5'],
};
const cert = (over: Partial<CertificateFacts> = {}): CertificateFacts => ({
  dns: ['localhost', 'keeper-pc', 'keeper-pc.local'],
  ips: ['127.0.0.1', '::1', '192.168.1.20', 'fd12::5'],
  validFrom: new Date(now.getTime() - 10 * DAY),
  validTo: new Date(now.getTime() + 300 * DAY),
  ...over,
});

describe('whether the --lan certificate must be made again', () => {
  it('keeps a certificate that covers every name and is far from its end', () => {
    expect(regenerationReason(wanted, cert(), now)).toBeNull();
    // Covering more than wanted (an address the machine no longer has) is harmless.
    expect(regenerationReason(wanted, cert({ ips: [...wanted.ips, '10.0.0.9'] }), now)).toBeNull();
    // Names compare case-blind, addresses in any spelling.
    expect(
      regenerationReason({ dns: ['KEEPER-PC'], ips: ['FD12:0:0:0:0:0:0:5'] }, cert(), now),
    ).toBeNull();
  });

  it('makes it again when the machine has a new address or name, naming what is missing', () => {
    expect(
      regenerationReason({ ...wanted, ips: [...wanted.ips, '192.168.1.77'] }, cert(), now),
    ).toBe('it does not cover 192.168.1.77');
    expect(
      regenerationReason(
        { ...wanted, dns: ['localhost', 'rack-pi', 'rack-pi.local'] },
        cert(),
        now,
      ),
    ).toBe('it does not cover rack-pi, rack-pi.local');
  });

  it('makes it again within the renewal window before its end, and not a day earlier', () => {
    const end = new Date(now.getTime() + RENEW_BEFORE_MS);
    expect(
      regenerationReason(wanted, cert({ validTo: new Date(end.getTime() + DAY) }), now),
    ).toBeNull();
    expect(regenerationReason(wanted, cert({ validTo: new Date(end.getTime() - DAY) }), now)).toBe(
      `it ends on ${new Date(end.getTime() - DAY).toISOString().slice(0, 10)}`,
    );
    expect(
      regenerationReason(wanted, cert({ validTo: new Date(now.getTime() - DAY) }), now),
    ).toMatch(/^it ends on /);
  });

  it('makes it again when its validity starts in the future (the clock was wrong when it was made)', () => {
    expect(
      regenerationReason(wanted, cert({ validFrom: new Date(now.getTime() + 2 * DAY) }), now),
    ).toMatch(/^it only starts on /);
  });
});
