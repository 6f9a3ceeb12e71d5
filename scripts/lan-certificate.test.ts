import { createPrivateKey, X509Certificate } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { certificateNames } from '../server/lan/addresses';
import { certificateFacts, regenerationReason } from '../server/lan/certificate-check';
import { ensureLanCertificate } from './lan-certificate';
import { lanEnv, lanFiles } from './lib/lan.mjs';

const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'rackside-lan-cert-'));
afterAll(() => fs.rmSync(tmp, { recursive: true, force: true }));
const DAY = 86_400_000;

describe('the --lan certificate', () => {
  const files = lanFiles(path.join(tmp, 'lan'));
  const names = certificateNames(['192.168.1.20', 'fd12:3456::5'], 'keeper-pc');

  it('is made on first run for the given names, signed by a home authority, keys private', async () => {
    const made = await ensureLanCertificate(names, { files });
    expect(made.made).toMatch(/no home authority.*no server certificate/);
    const served = new X509Certificate(fs.readFileSync(files.cert));
    const authority = new X509Certificate(fs.readFileSync(files.caCert));
    const facts = certificateFacts(fs.readFileSync(files.cert));
    expect(facts.dns).toEqual(['localhost', 'keeper-pc', 'keeper-pc.local']);
    expect(facts.ips).toEqual(['127.0.0.1', '::1', '192.168.1.20', 'fd12:3456::5']);
    expect(regenerationReason(names, facts, new Date())).toBeNull();
    expect(authority.ca).toBe(true);
    expect(served.ca).toBe(false);
    expect(served.checkIssued(authority)).toBe(true);
    expect(served.verify(authority.publicKey)).toBe(true);
    expect(served.keyUsage).toContain('1.3.6.1.5.5.7.3.1'); // serverAuth
    // At most 397 days: what iOS accepts for a server certificate.
    expect(facts.validTo.getTime() - Date.now()).toBeLessThanOrEqual(397 * DAY);
    expect(made.serverFingerprint).toBe(served.fingerprint256);
    expect(made.caFingerprint).toBe(authority.fingerprint256);
    for (const key of [files.key, files.caKey]) expect(fs.statSync(key).mode & 0o777).toBe(0o600);
    // Each key belongs to its certificate.
    expect(served.checkPrivateKey(createPrivateKey(fs.readFileSync(files.key)))).toBe(true);
    expect(authority.checkPrivateKey(createPrivateKey(fs.readFileSync(files.caKey)))).toBe(true);
  });

  it('is kept while it fits, and made again (same authority) when the machine gets a new address', async () => {
    const before = fs.readFileSync(files.cert, 'utf8');
    const ca = fs.readFileSync(files.caCert, 'utf8');
    const again = await ensureLanCertificate(names, { files });
    expect(again.made).toBeNull();
    expect(fs.readFileSync(files.cert, 'utf8')).toBe(before);

    const moved = certificateNames(['192.168.1.77'], 'keeper-pc');
    const renewed = await ensureLanCertificate(moved, { files });
    expect(renewed.made).toBe('it does not cover 192.168.1.77');
    expect(fs.readFileSync(files.cert, 'utf8')).not.toBe(before);
    expect(certificateFacts(fs.readFileSync(files.cert)).ips).toContain('192.168.1.77');
    // The phone trusts the authority once: it is not made again for a new address.
    expect(fs.readFileSync(files.caCert, 'utf8')).toBe(ca);
    expect(renewed.caFingerprint).toBe(again.caFingerprint);
  });

  it('is made again near its end, and by a new authority when that one nears its own', async () => {
    const ca = fs.readFileSync(files.caCert, 'utf8');
    const names2 = certificateNames(['192.168.1.77'], 'keeper-pc');
    const inAYear = await ensureLanCertificate(names2, {
      files,
      now: new Date(Date.now() + 380 * DAY),
    });
    expect(inAYear.made).toMatch(/^it ends on /);
    expect(fs.readFileSync(files.caCert, 'utf8')).toBe(ca);
    const late = await ensureLanCertificate(names2, {
      files,
      now: new Date(Date.now() + 3400 * DAY),
    });
    expect(late.made).toMatch(/home authority was near its end.*not signed by the home authority/);
    expect(fs.readFileSync(files.caCert, 'utf8')).not.toBe(ca);
  });
});

describe('what npm start -- --lan tells the server', () => {
  it('HTTPS with the made files on every address, unless HOST says otherwise', () => {
    const files = lanFiles('/srv/rackside/.data/lan');
    expect(lanEnv({}, files)).toEqual({
      LAN_MODE: 'true',
      HOST: '0.0.0.0',
      HTTPS_CERT_FILE: '/srv/rackside/.data/lan/server.crt',
      HTTPS_KEY_FILE: '/srv/rackside/.data/lan/server.key',
      HTTPS_CA_FILE: '/srv/rackside/.data/lan/home-ca.crt',
    });
    expect(lanEnv({ HOST: '::' }, files).HOST).toBe('::');
  });
});
