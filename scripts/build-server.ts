// Bundles the server into dist-server/index.mjs for production: plain node runs it, with no
// TypeScript loader thread in memory (about 47 MB less resident, P7) and a faster start.
// Packages stay external: node_modules is installed beside it.
import path from 'node:path';
import { build } from 'esbuild';

export const serverBundle = path.resolve(import.meta.dirname, '..', 'dist-server', 'index.mjs');

/** `outfile` must stay inside the repository: the server finds its files from there. */
export async function buildServer(outfile = serverBundle): Promise<string> {
  await build({
    entryPoints: [path.resolve(import.meta.dirname, '..', 'server', 'index.ts')],
    outfile,
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    packages: 'external',
    sourcemap: true,
    logLevel: 'warning',
  });
  return outfile;
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(import.meta.filename))
  await buildServer();
