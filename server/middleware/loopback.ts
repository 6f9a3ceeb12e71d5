import type { IncomingMessage } from 'node:http';
import { isIP } from 'node:net';

/**
 * IPv4 127.0.0.0/8 (RFC 1122, 3.2.1.3), IPv6 ::1 (RFC 4291, 2.5.3) and the IPv4-mapped form of
 * the former (RFC 4291, 2.5.5.2), as Node reports a dual-stack socket's peer.
 */
export function isLoopbackAddress(address: string | undefined): boolean {
  if (!address) return false;
  const bare = address.replace(/^\[|\]$/g, '');
  const v4 = bare.toLowerCase().startsWith('::ffff:') ? bare.slice(7) : bare;
  if (isIP(v4) === 4) return v4.startsWith('127.');
  return isIP(bare) === 6 && /^(0{0,4}:){2,7}0{0,3}1$|^::1$/.test(bare);
}

/** Every client address a proxy in front of us says it forwarded for (X-Forwarded-For, Forwarded, X-Real-IP). */
function forwardedFor(req: IncomingMessage): string[] | null {
  const h = req.headers;
  if (!h['x-forwarded-for'] && !h.forwarded && !h['x-real-ip']) return null;
  const list: string[] = [];
  for (const value of [h['x-forwarded-for'], h['x-real-ip']].flat())
    if (value) list.push(...value.split(',').map((s) => s.trim()));
  // RFC 7239, 4 and 6: for="[2001:db8::1]:47011" or for=192.0.2.60:8080; obfuscated names are not loopback.
  for (const m of (h.forwarded ?? '').matchAll(/for=("?)([^;,"]*)\1/gi)) {
    const raw = m[2]!.trim();
    list.push(raw.startsWith('[') ? raw.slice(1, raw.indexOf(']')) : raw.replace(/:\d+$/, ''));
  }
  return list;
}

/**
 * True only for a request from this machine: its socket's peer is loopback and, if a proxy on
 * this machine forwarded it, so was every client the proxy names. Express's `req.ip` is not
 * used: with "trust proxy" unset behind a local proxy it would call everyone loopback.
 */
export function fromLoopback(req: IncomingMessage): boolean {
  if (!isLoopbackAddress(req.socket.remoteAddress)) return false;
  const forwarded = forwardedFor(req);
  return forwarded === null || forwarded.every(isLoopbackAddress);
}
