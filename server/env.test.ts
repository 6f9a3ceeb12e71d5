import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readEnv, weakSecretReason } from './env';

/** As `openssl rand -hex 32` makes one. */
const STRONG = '9c41e07b5fd2a86e13b7c5904af6d28e71c3b95a0e4f68d2b17a3c95e0f4d86b';
const base = {
  DATABASE_URL: 'postgres://rackside@db.example/rackside',
  SESSION_SECRET: STRONG,
};
const production = {
  ...base,
  NODE_ENV: 'production',
  SMTP_URL: 'smtps://u:p@mail.example.org',
  PUBLIC_URL: 'https://rackside.example.org',
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

  it('names every missing production setting at once, a missing secret among them', () => {
    const message = (() => {
      try {
        readEnv({ DATABASE_URL: base.DATABASE_URL, NODE_ENV: 'production' });
      } catch (err) {
        return (err as Error).message;
      }
      return '';
    })();
    expect(message).toMatch(/SESSION_SECRET is required/);
    expect(message).toMatch(/SMTP_URL is required in production/);
    expect(message).toMatch(/PUBLIC_URL is required in production/);
  });

  it('refuses a production SESSION_SECRET that is short, an example, or barely random', () => {
    expect(() => readEnv({ ...production, SESSION_SECRET: STRONG.slice(0, 31) })).toThrow(
      /SESSION_SECRET must be at least 32 characters/,
    );
    for (const [secret, why] of [
      ['x'.repeat(40), /only 1 different characters/],
      ['abcdefabcdefabcdefabcdefabcdefabcdef', /only 6 different/],
      ['change-me-to-a-long-random-string-please', /contains "change"/],
      ['a-production-like-secret-of-forty-characters', /contains "secret"/],
      ['Rackside-Demo-0123456789-abcdefghijklmnop', /contains "rackside"/],
    ] as const) {
      expect(() => readEnv({ ...production, SESSION_SECRET: secret })).toThrow(why);
      expect(() => readEnv({ ...production, SESSION_SECRET: secret })).toThrow(
        /SESSION_SECRET is not strong enough for production[\s\S]*openssl rand -hex 32/,
      );
    }
    expect(readEnv(production).SESSION_SECRET).toBe(STRONG);
    // Outside production a local, made-up secret is fine (npm start makes a random one anyway).
    expect(readEnv({ ...base, SESSION_SECRET: 'x'.repeat(32) }).SESSION_SECRET).toHaveLength(32);
  });

  it('judges secrets by length, example words and variety', () => {
    expect(weakSecretReason(STRONG)).toBeNull();
    expect(weakSecretReason('short')).toMatch(/5 characters/);
    expect(weakSecretReason('correct-horse-battery-staple-violin-ocean')).toBeNull();
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

// Sales — payments.
describe('card payment keys', () => {
  it('takes both keys or neither, and names the missing one', () => {
    expect(readEnv(production).PAYMENT_SECRET_KEY).toBeUndefined();
    const both = readEnv({
      ...production,
      PAYMENT_SECRET_KEY: 'sk_live_abc',
      PAYMENT_WEBHOOK_SECRET: 'whsec_abc',
    });
    expect(both.PAYMENT_WEBHOOK_SECRET).toBe('whsec_abc');
    expect(() => readEnv({ ...production, PAYMENT_SECRET_KEY: 'sk_live_abc' })).toThrow(
      /PAYMENT_WEBHOOK_SECRET is required with PAYMENT_SECRET_KEY/,
    );
    expect(() =>
      readEnv({ ...production, PAYMENT_WEBHOOK_SECRET: 'whsec_abc', PAYMENT_SECRET_KEY: '' }),
    ).toThrow(/PAYMENT_SECRET_KEY is required with PAYMENT_WEBHOOK_SECRET/);
    expect(() => readEnv({ ...production, PAYMENT_API_URL: 'localhost:12111' })).toThrow(
      /PAYMENT_API_URL must/,
    );
  });
});
