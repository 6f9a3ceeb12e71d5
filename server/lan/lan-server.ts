// Serving over HTTPS when given a certificate, and what LAN mode tells people (the terminal's
// QR code, the Settings page): docs/decisions/017-home-network-https.md.
import { X509Certificate } from 'node:crypto';
import fs from 'node:fs';
import http from 'node:http';
import https from 'node:https';
import os from 'node:os';
import QRCode from 'qrcode';
import { LAN_CERTIFICATE_PATH } from '#shared/schemas/lan';
import type { Env } from '../env';
import { lanAddresses, lanUrl, type Interfaces } from './addresses';

export interface LanInfo {
  /** The address phones open (PUBLIC_URL when set, else the first LAN address). */
  url: string;
  /** The certificate to install on a phone: the home authority (HTTPS_CA_FILE), else the server's own. */
  caPem: string;
  caFingerprint: string;
  serverFingerprint: string;
}

/** LAN mode's facts, or undefined outside it. Reads the certificate files env.ts checked. */
export function loadLan(
  env: Env,
  // Read only in LAN mode: listing interfaces needs netlink sockets, which the systemd unit's
  // RestrictAddressFamilies forbids (deploy/rackside.service), and loopback serving needs none.
  readMachine: () => { interfaces: Interfaces; hostname: string } = () => ({
    interfaces: os.networkInterfaces(),
    hostname: os.hostname(),
  }),
): LanInfo | undefined {
  if (!env.LAN_MODE || !env.HTTPS_CERT_FILE) return undefined;
  const machine = readMachine();
  const served = fs.readFileSync(env.HTTPS_CERT_FILE, 'utf8');
  const caPem = env.HTTPS_CA_FILE ? fs.readFileSync(env.HTTPS_CA_FILE, 'utf8') : served;
  return {
    url: env.PUBLIC_URL ?? lanUrl(lanAddresses(machine.interfaces), machine.hostname, env.PORT),
    caPem,
    caFingerprint: new X509Certificate(caPem).fingerprint256,
    serverFingerprint: new X509Certificate(served).fingerprint256,
  };
}

/** An HTTPS server when env names a certificate, else plain HTTP (behind a proxy, or loopback). */
export function createHttpServer(handler: http.RequestListener, env: Env): http.Server {
  if (!env.HTTPS_CERT_FILE || !env.HTTPS_KEY_FILE) return http.createServer(handler);
  return https.createServer(
    {
      cert: fs.readFileSync(env.HTTPS_CERT_FILE),
      key: fs.readFileSync(env.HTTPS_KEY_FILE),
    },
    handler,
  );
}

/** What the terminal shows in LAN mode: the address, its QR code, and the fingerprints. */
export async function lanBanner(lan: LanInfo): Promise<string> {
  const qr = await QRCode.toString(lan.url, { type: 'terminal', small: true });
  return [
    `  On your phone (same Wi-Fi), scan this or open ${lan.url}`,
    qr
      .split('\n')
      // The package ends with a line of colour codes only.
      // eslint-disable-next-line no-control-regex
      .filter((line) => line.replace(/\u001b\[[\d;]*m/g, '').length > 0)
      .map((line) => `  ${line}`)
      .join('\n'),
    `  First trust this computer's certificate on the phone: Settings → "Use Rackside on your phone",`,
    `  or download it at ${lan.url}${LAN_CERTIFICATE_PATH}`,
    `  Certificate to install (SHA-256): ${lan.caFingerprint}`,
    `  This server's certificate (SHA-256): ${lan.serverFingerprint}`,
  ].join('\n');
}
