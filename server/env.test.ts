import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readEnv } from './env';

const base = {
  DATABASE_URL: 'postgres://rackside@db.example/rackside',
  SESSION_SECRET: 'x'.repeat(32),
};

describe('configuration', () => {
  it('refuses production without SMTP_URL and PUBLIC_URL, naming both', () => {
    expect(() => readEnv({ ...base, NODE_ENV: 'production' })).toThrow(
      /SMTP_URL is required in production[\s\S]*PUBLIC_URL is required in production/,
    );
    expect(() =>
      readEnv({ ...base, NODE_ENV: 'production', SMTP_URL: 'smtps://u:p@mail.example.org' }),
    ).toThrow(/PUBLIC_URL is required in production/);
    expect(() =>
      readEnv({ ...base, NODE_ENV: 'production', PUBLIC_URL: 'https://rackside.example.org' }),
    ).toThrow(/SMTP_URL is required in production/);
    // An empty value is no value.
    expect(() =>
      readEnv({
        ...base,
        NODE_ENV: 'production',
        SMTP_URL: '',
        PUBLIC_URL: 'https://rackside.example.org',
      }),
    ).toThrow(/SMTP_URL is required/);
  });

  it('starts production with both, and development or tests without them', () => {
    const env = readEnv({
      ...base,
      NODE_ENV: 'production',
      SMTP_URL: 'smtps://u:p@mail.example.org',
      PUBLIC_URL: 'https://rackside.example.org/',
    });
    expect(env.SMTP_URL).toBe('smtps://u:p@mail.example.org');
    // Links are PUBLIC_URL + "/path": a trailing slash would double it.
    expect(env.PUBLIC_URL).toBe('https://rackside.example.org');
    expect(readEnv({ ...base }).SMTP_URL).toBeUndefined();
    expect(readEnv({ ...base, NODE_ENV: 'test', SMTP_URL: '' }).SMTP_URL).toBeUndefined();
  });

  it('wants links that a phone can open', () => {
    expect(() => readEnv({ ...base, PUBLIC_URL: 'ftp://rackside.example.org' })).toThrow(
      /PUBLIC_URL must start with http:\/\/ or https:\/\//,
    );
    expect(() => readEnv({ ...base, PUBLIC_URL: 'rackside.example.org' })).toThrow(
      /PUBLIC_URL must be a URL/,
    );
  });

  describe('HTTPS and LAN mode', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'rackside-env-'));
    afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));
    const cert = path.join(dir, 'server.crt');
    const key = path.join(dir, 'server.key');
    fs.writeFileSync(cert, 'pem');
    fs.writeFileSync(key, 'pem');

    it('listens on loopback over HTTP unless told otherwise', () => {
      const env = readEnv({ ...base });
      expect(env.HOST).toBe('127.0.0.1');
      expect(env.LAN_MODE).toBe(false);
      expect(env.HTTPS_CERT_FILE).toBeUndefined();
    });

    it('takes a readable certificate and key, and names a file it cannot read', () => {
      const env = readEnv({
        ...base,
        LAN_MODE: 'true',
        HTTPS_CERT_FILE: cert,
        HTTPS_KEY_FILE: key,
      });
      expect([env.LAN_MODE, env.HTTPS_CERT_FILE, env.HTTPS_KEY_FILE]).toEqual([true, cert, key]);
      const missing = path.join(dir, 'nope.crt');
      expect(() => readEnv({ ...base, HTTPS_CERT_FILE: missing, HTTPS_KEY_FILE: key })).toThrow(
        `HTTPS_CERT_FILE: HTTPS_CERT_FILE (${missing}) cannot be read: no such file.`,
      );
      expect(() =>
        readEnv({ ...base, HTTPS_CERT_FILE: cert, HTTPS_KEY_FILE: key, HTTPS_CA_FILE: dir }),
      ).toThrow(`HTTPS_CA_FILE (${dir}) cannot be read: it is not a file.`);
    });

    it('wants the certificate and key together, and LAN mode only with them', () => {
      expect(() => readEnv({ ...base, HTTPS_CERT_FILE: cert })).toThrow(
        /HTTPS_KEY_FILE: HTTPS_CERT_FILE and HTTPS_KEY_FILE go together/,
      );
      expect(() => readEnv({ ...base, LAN_MODE: 'true' })).toThrow(
        /HTTPS_CERT_FILE: LAN_MODE needs HTTPS_CERT_FILE and HTTPS_KEY_FILE/,
      );
    });
  });
});
