import { describe, expect, it } from 'vitest';
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
});
