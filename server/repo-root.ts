import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

/**
 * The folder holding package.json, found from this module's own place: the same answer from
 * `server/` under tsx and from the bundled `dist-server/index.mjs` in production.
 */
export function repoRoot(from = path.dirname(fileURLToPath(import.meta.url))): string {
  for (let dir = from; ; dir = path.dirname(dir)) {
    if (fs.existsSync(path.join(dir, 'package.json'))) return dir;
    if (path.dirname(dir) === dir) throw new Error(`No package.json above ${from}.`);
  }
}
