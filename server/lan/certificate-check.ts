// Whether the `--lan` certificate still fits this machine: pure over what the certificate says
// and the names wanted now (docs/decisions/017-home-network-https.md).
import { X509Certificate } from 'node:crypto';
import { canonicalIp, type CertificateNames } from './addresses';

/** A server certificate is renewed this long before it ends, so a phone never meets an expired one. */
export const RENEW_BEFORE_MS = 30 * 24 * 60 * 60 * 1000;

export interface CertificateFacts extends CertificateNames {
  validFrom: Date;
  validTo: Date;
}

/**
 * The names a PEM certificate's subjectAltName carries, and its validity. Node writes the
 * extension as `DNS:a, IP Address:1.2.3.4, IP Address:FD00:0:0:0:0:0:0:1`.
 */
export function certificateFacts(pem: string | Buffer): CertificateFacts {
  const cert = new X509Certificate(pem);
  const dns: string[] = [];
  const ips: string[] = [];
  for (const entry of (cert.subjectAltName ?? '').split(/,\s*/)) {
    if (entry.startsWith('DNS:')) dns.push(entry.slice(4).toLowerCase());
    else if (entry.startsWith('IP Address:')) ips.push(canonicalIp(entry.slice(11)));
  }
  return { dns, ips, validFrom: new Date(cert.validFrom), validTo: new Date(cert.validTo) };
}

/**
 * Why the certificate must be made again, or null when it still serves: a name or address of
 * this machine it does not cover (the machine moved networks or got a new address), or an end
 * of validity within `renewBeforeMs` of `now` (or a start still in the future).
 */
export function regenerationReason(
  wanted: CertificateNames,
  cert: CertificateFacts,
  now: Date,
  renewBeforeMs = RENEW_BEFORE_MS,
): string | null {
  const missing = [
    ...wanted.dns.filter((n) => !cert.dns.includes(n.toLowerCase())),
    ...wanted.ips.filter((ip) => !cert.ips.includes(canonicalIp(ip))),
  ];
  if (missing.length) return `it does not cover ${missing.join(', ')}`;
  if (cert.validTo.getTime() - now.getTime() < renewBeforeMs)
    return `it ends on ${cert.validTo.toISOString().slice(0, 10)}`;
  if (cert.validFrom.getTime() > now.getTime())
    return `it only starts on ${cert.validFrom.toISOString().slice(0, 10)}`;
  return null;
}
