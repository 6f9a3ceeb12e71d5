// `npm start -- --lan`: the certificate for HTTPS on the home network, made on first run and
// made again when it no longer fits (docs/decisions/017-home-network-https.md).
//
// A small certificate authority of this machine's own signs the server's certificate: the
// phone trusts the authority once, and the server certificate can then be renewed (new
// address, near its end) without touching the phone again. iOS trusts a certificate for
// websites only when it is installed as a profile *and* switched on as a root in Certificate
// Trust Settings, which it offers for authorities (basicConstraints CA) — from memory of
// Apple's profile behaviour, no published source checked here. The certificates themselves are
// made by the `selfsigned` package (WebCrypto underneath); nothing here does cryptography.
import { X509Certificate } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { generate } from 'selfsigned';
import { certificateNames, lanAddresses, type CertificateNames } from '../server/lan/addresses';
import { certificateFacts, regenerationReason } from '../server/lan/certificate-check';
import { lanFiles, type LanFiles } from './lib/lan.mjs';

const DAY = 24 * 60 * 60 * 1000;
/** The authority lasts ten years: the phone trusts it once. */
const CA_DAYS = 3650;
/**
 * The server certificate lasts 397 days: iOS refuses server certificates valid for longer than
 * 825 days, and 398 days for those under the public roots (Apple's "requirements for trusted
 * certificates in iOS 13" and its 2020 note on certificate lifetimes, from memory).
 */
const SERVER_DAYS = 397;
/** The authority is made again when it could not outlast a new server certificate. */
const CA_RENEW_MS = (SERVER_DAYS + 30) * DAY;

export interface LanCertificate {
  files: LanFiles;
  /** Why new certificates were made on this run (null: the ones on disk still fit). */
  made: string | null;
  /** SHA-256 fingerprints, as `AB:CD:…`. */
  caFingerprint: string;
  serverFingerprint: string;
}

function readIfThere(file: string): string | null {
  try {
    return fs.readFileSync(file, 'utf8');
  } catch {
    return null;
  }
}

/** Writes a file readable by this user only (a private key), whatever the umask. */
function writePrivate(file: string, text: string) {
  fs.writeFileSync(file, text, { mode: 0o600 });
  fs.chmodSync(file, 0o600);
}

// EC P-256 with SHA-256: accepted by Android, iOS and every current browser, and made in
// milliseconds where RSA keys take seconds on a small board.
const KEY = { keyType: 'ec', curve: 'P-256', algorithm: 'sha256' } as const;

async function makeAuthority(now: Date, label: string) {
  return generate(
    [
      { name: 'commonName', value: `Rackside home ${label}` },
      { name: 'organizationName', value: 'Rackside on this computer' },
    ],
    {
      ...KEY,
      notBeforeDate: new Date(now.getTime() - DAY),
      notAfterDate: new Date(now.getTime() + CA_DAYS * DAY),
      extensions: [
        // pathLen 0: it signs server certificates, never another authority.
        { name: 'basicConstraints', cA: true, pathLenConstraint: 0, critical: true },
        { name: 'keyUsage', keyCertSign: true, cRLSign: true, critical: true },
      ],
    },
  );
}

async function makeServerCertificate(
  names: CertificateNames,
  ca: { key: string; cert: string },
  now: Date,
) {
  return generate([{ name: 'commonName', value: names.dns[1] ?? 'localhost' }], {
    ...KEY,
    ca,
    // An hour back: a phone whose clock runs a little behind still accepts it.
    notBeforeDate: new Date(now.getTime() - 60 * 60 * 1000),
    notAfterDate: new Date(now.getTime() + SERVER_DAYS * DAY),
    extensions: [
      { name: 'basicConstraints', cA: false, critical: true },
      { name: 'keyUsage', digitalSignature: true, critical: true },
      { name: 'extKeyUsage', serverAuth: true },
      {
        name: 'subjectAltName',
        altNames: [
          ...names.dns.map((value) => ({ type: 2 as const, value })),
          ...names.ips.map((ip) => ({ type: 7 as const, ip })),
        ],
      },
    ],
  });
}

/**
 * The authority and server certificate in `files.dir`, made or made again as needed: the
 * authority when missing or within a server certificate's life of its end; the server
 * certificate when missing, not signed by the authority, not covering `names`, or near its end.
 */
export async function ensureLanCertificate(
  names: CertificateNames,
  options: { files?: LanFiles; now?: Date } = {},
): Promise<LanCertificate> {
  const files = options.files ?? lanFiles();
  const now = options.now ?? new Date();
  fs.mkdirSync(files.dir, { recursive: true, mode: 0o700 });
  const reasons: string[] = [];

  let caCert = readIfThere(files.caCert);
  let caKey = readIfThere(files.caKey);
  const caFacts = caCert && caKey ? certificateFacts(caCert) : null;
  if (!caFacts || caFacts.validTo.getTime() - now.getTime() < CA_RENEW_MS) {
    reasons.push(caFacts ? 'the home authority was near its end' : 'there was no home authority');
    const made = await makeAuthority(now, `authority ${now.toISOString().slice(0, 10)}`);
    caCert = made.cert;
    caKey = made.private;
    writePrivate(files.caKey, caKey);
    fs.writeFileSync(files.caCert, caCert);
  }
  const authority = new X509Certificate(caCert!);

  const cert = readIfThere(files.cert);
  const key = readIfThere(files.key);
  let why: string | null = cert && key ? null : 'there was no server certificate';
  if (!why) {
    const served = new X509Certificate(cert!);
    if (!served.checkIssued(authority) || !served.verify(authority.publicKey))
      why = 'the server certificate was not signed by the home authority';
    else why = regenerationReason(names, certificateFacts(cert!), now);
  }
  if (why) {
    reasons.push(why);
    const made = await makeServerCertificate(names, { key: caKey!, cert: caCert! }, now);
    writePrivate(files.key, made.private);
    fs.writeFileSync(files.cert, made.cert);
  }
  return {
    files,
    made: reasons.length ? reasons.join('; ') : null,
    caFingerprint: authority.fingerprint256,
    serverFingerprint: new X509Certificate(fs.readFileSync(files.cert)).fingerprint256,
  };
}

// `tsx scripts/lan-certificate.ts` (npm start -- --lan): this machine's names, now.
if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(import.meta.filename)) {
  const names = certificateNames(lanAddresses(os.networkInterfaces()), os.hostname());
  const result = await ensureLanCertificate(names);
  const say = (m: string) => process.stdout.write(`\x1b[1m[rackside]\x1b[0m ${m}\n`);
  if (result.made) say(`Made a new certificate for the home network (${result.made}).`);
  else say('Using the home-network certificate made earlier (it still fits this machine).');
  say(`It covers ${[...names.dns, ...names.ips].join(', ')}.`);
}
