// The set-up's decisions, over their inputs: no real root, sudo, Chromium or memory needed.
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { CHROMIUM_FALLBACK, lookUpChromium } from './chromium.mjs';
import { checkNodeVersion, minimumFromEngines } from './node-version.mjs';
import { pgMemorySettings } from './pg-memory.mjs';
import { decideDemo, demoAnswer, parseStartFlags, readRememberedDemo } from './start-flags.mjs';
import { aptCommandLine, installDecision } from './sudo.mjs';

const GB = 1024 ** 3;

describe('Node version check', () => {
  const need = minimumFromEngines('>=20.19')!;

  it('reads the minimum from package.json engines', () => {
    expect(need).toEqual([20, 19, 0]);
    expect(minimumFromEngines('>= 22.1.3')).toEqual([22, 1, 3]);
    expect(minimumFromEngines('^20')).toBeNull();
  });

  it('passes the minimum and anything newer', () => {
    for (const v of ['v20.19.0', 'v20.19.5', 'v20.20.0', 'v22.0.0', 'v24.3.1'])
      expect(checkNodeVersion(v, need)).toEqual({ ok: true });
  });

  it('refuses Debian 12’s Node 18 and an older 20, saying what to install', () => {
    for (const v of ['v18.19.0', 'v20.18.3', 'v12.22.12']) {
      const r = checkNodeVersion(v, need);
      expect(r.ok).toBe(false);
      if (r.ok) continue;
      expect(r.message).toContain(`this is Node.js ${v}`);
      expect(r.message).toContain('Node.js 20.19.0 or newer');
      expect(r.message).toContain('https://nodejs.org/en/download');
      expect(r.message).toContain('nvm install 22');
    }
  });

  it('refuses a version it cannot read', () => {
    expect(checkNodeVersion('', need).ok).toBe(false);
    expect(checkNodeVersion('banana', need).ok).toBe(false);
  });
});

describe('Debian packages: root, sudo, or the command to run', () => {
  const facts = { isRoot: false, hasSudo: true, sudoNeedsPassword: false, isTTY: false };

  it('runs apt-get directly as root, whatever else is true', () => {
    expect(installDecision({ ...facts, isRoot: true, hasSudo: false })).toBe('direct');
    expect(installDecision({ ...facts, isRoot: true, sudoNeedsPassword: true })).toBe('direct');
  });

  it('uses sudo without asking when it needs no password', () => {
    expect(installDecision(facts)).toBe('sudo');
    expect(installDecision({ ...facts, isTTY: true })).toBe('sudo');
  });

  it('asks first when sudo wants a password and someone is at the terminal', () => {
    const asking = { ...facts, sudoNeedsPassword: true, isTTY: true };
    expect(installDecision(asking)).toBe('ask');
    expect(installDecision({ ...asking, answer: 'y' })).toBe('sudo');
    expect(installDecision({ ...asking, answer: ' YES ' })).toBe('sudo');
    for (const answer of ['', 'n', 'no', 'maybe'])
      expect(installDecision({ ...asking, answer })).toBe('print');
  });

  it('prints the command when nobody can be asked or there is no sudo', () => {
    expect(installDecision({ ...facts, sudoNeedsPassword: true, isTTY: false })).toBe('print');
    expect(installDecision({ ...facts, hasSudo: false, isTTY: true })).toBe('print');
  });

  it('prints one command that does it all', () => {
    expect(aptCommandLine(['postgresql'])).toBe(
      'sudo apt-get update && sudo apt-get install -y --no-install-recommends postgresql',
    );
  });
});

describe('Chromium look-up', () => {
  const at =
    (...files: string[]) =>
    (f: string) =>
      files.includes(f);
  const PATH = ['/home/k/bin', '/usr/local/bin', '/usr/bin'].join(path.delimiter);

  it('takes CHROMIUM_PATH first, and says so when nothing is there', () => {
    expect(
      lookUpChromium({
        envPath: '/opt/c/chrome',
        pathVar: PATH,
        isExecutable: at('/opt/c/chrome', '/usr/bin/chromium'),
      }),
    ).toEqual({ path: '/opt/c/chrome' });
    const missing = lookUpChromium({
      envPath: '/opt/c/chrome',
      pathVar: PATH,
      isExecutable: at('/usr/bin/chromium'),
    });
    expect(missing.error).toMatch(/CHROMIUM_PATH is \/opt\/c\/chrome/);
  });

  it('then finds it by name on PATH, chromium before chromium-browser', () => {
    expect(
      lookUpChromium({
        envPath: undefined,
        pathVar: PATH,
        isExecutable: at('/usr/bin/chromium-browser', '/usr/local/bin/chromium'),
      }),
    ).toEqual({ path: '/usr/local/bin/chromium' });
    expect(
      lookUpChromium({
        envPath: '',
        pathVar: PATH,
        isExecutable: at('/usr/bin/chromium-browser'),
      }),
    ).toEqual({ path: '/usr/bin/chromium-browser' });
  });

  it('then Debian’s place, even off PATH; else an error naming what it tried', () => {
    expect(
      lookUpChromium({ envPath: undefined, pathVar: '', isExecutable: at(CHROMIUM_FALLBACK) }),
    ).toEqual({ path: CHROMIUM_FALLBACK });
    const none = lookUpChromium({ envPath: undefined, pathVar: PATH, isExecutable: at() });
    expect(none.error).toMatch(/chromium, chromium-browser.*CHROMIUM_PATH/);
  });
});

describe('private cluster memory', () => {
  it('keeps a 1 GB box small', () => {
    expect(pgMemorySettings(1 * GB)).toEqual({ sharedBuffers: '64MB', maxConnections: 50 });
    expect(pgMemorySettings(0.5 * GB)).toEqual({ sharedBuffers: '32MB', maxConnections: 50 });
  });

  it('grows with the machine', () => {
    expect(pgMemorySettings(2 * GB)).toEqual({ sharedBuffers: '128MB', maxConnections: 100 });
    expect(pgMemorySettings(4 * GB)).toEqual({ sharedBuffers: '256MB', maxConnections: 200 });
  });

  it('gives a 24 GB machine (CI’s) what it had before: 512 MB and 200 connections', () => {
    expect(pgMemorySettings(24 * GB)).toEqual({ sharedBuffers: '512MB', maxConnections: 200 });
    expect(pgMemorySettings(256 * GB).sharedBuffers).toBe('512MB');
  });
});

describe('npm start flags and the demo choice', () => {
  it('reads --demo, --no-demo and --lan, and refuses anything else', () => {
    expect(parseStartFlags([])).toEqual({ demo: undefined, lan: false });
    expect(parseStartFlags(['--demo'])).toEqual({ demo: true, lan: false });
    expect(parseStartFlags(['--no-demo', '--lan'])).toEqual({ demo: false, lan: true });
    expect(parseStartFlags(['--demo', '--no-demo']).error).toMatch(/cannot both/);
    expect(parseStartFlags(['--dmeo']).error).toMatch(/Unknown option --dmeo[\s\S]*Usage/);
  });

  const none = {
    envDemoMode: undefined,
    flag: undefined,
    remembered: undefined,
    isTTY: false,
    production: false,
  };

  it('asks once at a terminal on a fresh machine, then remembers', () => {
    expect(decideDemo({ ...none, isTTY: true })).toEqual({ ask: true });
    expect(decideDemo({ ...none, isTTY: true, remembered: false })).toEqual({
      demo: false,
      source: 'remembered',
    });
  });

  it('without a terminal or an answer, starts the demo and says it chose', () => {
    expect(decideDemo(none)).toEqual({ demo: true, source: 'default' });
    expect(decideDemo({ ...none, production: true })).toEqual({ demo: false, source: 'default' });
  });

  it('lets the flag beat the remembered answer, and DEMO_MODE beat both', () => {
    expect(decideDemo({ ...none, remembered: true, flag: false })).toEqual({
      demo: false,
      source: 'flag',
    });
    expect(decideDemo({ ...none, flag: true, envDemoMode: 'false' })).toEqual({
      demo: false,
      source: 'env',
    });
  });

  it('reads answers and the remembered file', () => {
    expect(demoAnswer('')).toBe(true);
    expect(demoAnswer(' Y ')).toBe(true);
    expect(demoAnswer('no')).toBe(false);
    expect(demoAnswer('perhaps')).toBeUndefined();
    expect(readRememberedDemo('demo\n')).toBe(true);
    expect(readRememberedDemo('no-demo')).toBe(false);
    expect(readRememberedDemo('')).toBeUndefined();
  });
});
