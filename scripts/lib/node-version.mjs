// The first check of `npm start`, `npm test` and the db scripts: is this Node new enough?
// Plain Node with no dependencies and no modern syntax, so it runs (and explains) on an old
// Node before `npm ci` fails on engine-strict with a less helpful message.

/** package.json "engines.node" as `>=major.minor[.patch]`: the minimum it names. */
export function minimumFromEngines(range) {
  const m = /^\s*>=\s*v?(\d+)(?:\.(\d+))?(?:\.(\d+))?\s*$/.exec(range || '');
  if (!m) return null;
  return [Number(m[1]), Number(m[2] || 0), Number(m[3] || 0)];
}

function parse(version) {
  const m = /^v?(\d+)\.(\d+)\.(\d+)/.exec(version || '');
  return m ? [Number(m[1]), Number(m[2]), Number(m[3])] : null;
}

function compare(a, b) {
  for (let i = 0; i < 3; i++) if (a[i] !== b[i]) return a[i] - b[i];
  return 0;
}

/**
 * Whether `version` (process.version, e.g. "v18.19.0") meets `minimum` ([20, 19, 0]), and if
 * not, what to do. Pure: the caller prints the message and stops.
 */
export function checkNodeVersion(version, minimum) {
  const have = parse(version);
  const need = minimum.join('.');
  if (have && compare(have, minimum) >= 0) return { ok: true };
  // Debian 12's own nodejs package is 18.19 and Debian 13's is 20.19 (from memory; see
  // packages.debian.org/bookworm/nodejs and /trixie/nodejs). Node's downloads: nodejs.org/en/download.
  const message = [
    `Rackside needs Node.js ${need} or newer; this is Node.js ${version || 'of an unknown version'}.`,
    `Install Node.js ${need} or newer, then run the command again:`,
    "  - on Debian 13 or newer, Debian's own is new enough:  sudo apt-get install nodejs npm",
    '  - on Debian 12 (its own is 18) or elsewhere: Node.js 22, the long-term-support line, from',
    '    https://nodejs.org/en/download (unpack it and put its bin/ folder first on your PATH),',
    '    or with nvm: nvm install 22',
    'Then check with `node --version`.',
  ].join('\n');
  return { ok: false, message };
}
