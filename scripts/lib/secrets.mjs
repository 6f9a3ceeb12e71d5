import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { repoRoot } from './setup.mjs';

/** A session secret kept in .data/ so sign-ins survive restarts of a local install. */
export function localSessionSecret() {
  const file = path.join(repoRoot, '.data', 'session-secret');
  if (!fs.existsSync(file)) {
    fs.mkdirSync(path.dirname(file), { recursive: true });
    fs.writeFileSync(file, randomBytes(32).toString('base64url'), { mode: 0o600 });
  }
  return fs.readFileSync(file, 'utf8').trim();
}
