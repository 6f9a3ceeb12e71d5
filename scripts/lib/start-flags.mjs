// `npm start -- [--demo | --no-demo] [--lan]`: the command line and the remembered choice.
// Plain Node with no dependencies.

export const START_USAGE = 'Usage: npm start [-- --demo | --no-demo] [--lan]';

/** The flags given to scripts/start.mjs. Returns { demo: true|false|undefined, lan } or { error }. */
export function parseStartFlags(argv) {
  const flags = { demo: undefined, lan: false };
  for (const arg of argv) {
    if (arg === '--lan') {
      flags.lan = true;
      continue;
    }
    if (arg === '--demo' || arg === '--no-demo') {
      const value = arg === '--demo';
      if (flags.demo !== undefined && flags.demo !== value)
        return { error: `--demo and --no-demo cannot both be given.\n${START_USAGE}` };
      flags.demo = value;
    } else return { error: `Unknown option ${arg}.\n${START_USAGE}` };
  }
  return flags;
}

/**
 * Demo or not, first match wins: DEMO_MODE in the environment (operators), the flag, the
 * answer remembered in .data/, a question when someone is at the terminal, else the demo
 * (someone trying the README wants to see it) — except in production, which is never a demo
 * unless DEMO_MODE says so. Returns { demo, source } or { ask: true }.
 */
export function decideDemo({ envDemoMode, flag, remembered, isTTY, production }) {
  if (envDemoMode !== undefined && envDemoMode !== '')
    return { demo: /^(true|1|yes)$/i.test(envDemoMode), source: 'env' };
  if (flag !== undefined) return { demo: flag, source: 'flag' };
  if (remembered !== undefined) return { demo: remembered, source: 'remembered' };
  if (production) return { demo: false, source: 'default' };
  if (isTTY) return { ask: true };
  return { demo: true, source: 'default' };
}

/** What the person typed at "Start with the demo collection? [Y/n]". */
export function demoAnswer(typed) {
  const t = (typed || '').trim().toLowerCase();
  if (t === '' || t === 'y' || t === 'yes') return true;
  if (t === 'n' || t === 'no') return false;
  return undefined;
}

/** The remembered choice's file contents, read back (anything else counts as not remembered). */
export function readRememberedDemo(text) {
  const t = (text || '').trim();
  return t === 'demo' ? true : t === 'no-demo' ? false : undefined;
}
