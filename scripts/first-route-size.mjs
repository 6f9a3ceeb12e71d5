// P4: the gzip size of the JavaScript the first route needs: the entry script and every chunk
// index.html preloads (lazy routes are left out; they load on first use).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';

export function firstRouteJs(distDir) {
  const html = readFileSync(join(distDir, 'index.html'), 'utf8');
  const files = [
    ...html.matchAll(/<(?:script[^>]*src|link[^>]*rel="modulepreload"[^>]*href)="([^"]+\.js)"/g),
  ].map((m) => m[1]);
  const sizes = files.map((f) => ({
    file: f,
    gzipBytes: gzipSync(readFileSync(join(distDir, f.replace(/^\//, '')))).length,
  }));
  return { files: sizes, gzipBytes: sizes.reduce((sum, s) => sum + s.gzipBytes, 0) };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const result = firstRouteJs(process.argv[2] ?? 'dist');
  for (const f of result.files)
    console.log(`${(f.gzipBytes / 1024).toFixed(1).padStart(7)} KB  ${f.file}`);
  console.log(
    `${(result.gzipBytes / 1024).toFixed(1).padStart(7)} KB  first-route JavaScript (gzip)`,
  );
}
