// Where Chromium is: for `npm test`'s set-up, the end-to-end tests, the benchmarks and
// scripts/make-icons.mjs. Plain Node with no dependencies.
import fs from 'node:fs';
import path from 'node:path';

/** Debian's package puts it here; other systems name it chromium-browser. */
export const CHROMIUM_NAMES = ['chromium', 'chromium-browser'];
export const CHROMIUM_FALLBACK = '/usr/bin/chromium';

/**
 * CHROMIUM_PATH if set (a missing file there is an error, not a reason to look elsewhere),
 * then each name in each PATH folder, then Debian's place. Pure over its inputs.
 * Returns { path } or { error }.
 */
export function lookUpChromium({ envPath, pathVar, isExecutable }) {
  if (envPath) {
    return isExecutable(envPath)
      ? { path: envPath }
      : { error: `CHROMIUM_PATH is ${envPath}, but there is no program there.` };
  }
  const dirs = (pathVar || '').split(path.delimiter).filter(Boolean);
  for (const name of CHROMIUM_NAMES)
    for (const dir of dirs) {
      const candidate = path.join(dir, name);
      if (isExecutable(candidate)) return { path: candidate };
    }
  if (isExecutable(CHROMIUM_FALLBACK)) return { path: CHROMIUM_FALLBACK };
  return {
    error: `Chromium was not found (looked for ${CHROMIUM_NAMES.join(', ')} on PATH and ${CHROMIUM_FALLBACK}). Install it, or set CHROMIUM_PATH to the program.`,
  };
}

function isExecutable(file) {
  try {
    fs.accessSync(file, fs.constants.X_OK);
    return fs.statSync(file).isFile();
  } catch {
    return false;
  }
}

/** This machine's Chromium, or null. */
export function findChromium(env = process.env) {
  return (
    lookUpChromium({ envPath: env.CHROMIUM_PATH, pathVar: env.PATH, isExecutable }).path ?? null
  );
}

/** This machine's Chromium; throws with what to do when there is none. */
export function chromiumPath(env = process.env) {
  const found = lookUpChromium({ envPath: env.CHROMIUM_PATH, pathVar: env.PATH, isExecutable });
  if (found.error) throw new Error(found.error);
  return found.path;
}
