// Bundles the server into dist-server/index.mjs (and its database chores, `migrate` and `seed`,
// into dist-server/cli.mjs) for production: plain node runs them, with no TypeScript loader
// thread in memory (about 47 MB less resident, P7) and a faster start. Packages stay external:
// node_modules is installed beside them, production dependencies only (checked by
// scripts/build-server.test.ts). `npm run build` runs this after vite's build.
import path from 'node:path';
import { build } from 'esbuild';

export const serverBundle = path.resolve(import.meta.dirname, '..', 'dist-server', 'index.mjs');

const server = path.resolve(import.meta.dirname, '..', 'server');
const entryPoints = { index: path.join(server, 'index.ts'), cli: path.join(server, 'cli.ts') };
const options = {
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  packages: 'external',
} as const;

/** Every module the bundles import at run time (packages and node: built-ins), as esbuild sees them. */
export async function bundleImports(): Promise<string[]> {
  const result = await build({
    ...options,
    entryPoints,
    outdir: '/nonexistent',
    write: false,
    metafile: true,
    logLevel: 'silent',
  });
  const found = new Set<string>();
  for (const output of Object.values(result.metafile.outputs))
    for (const i of output.imports) if (i.external) found.add(i.path);
  return [...found].sort();
}

/** `outfile` must stay inside the repository: the server finds its files from there. */
export async function buildServer(outfile = serverBundle): Promise<string> {
  if (path.basename(outfile) !== 'index.mjs') throw new Error('The bundle is named index.mjs.');
  await build({
    ...options,
    entryPoints,
    outdir: path.dirname(outfile),
    outExtension: { '.js': '.mjs' },
    sourcemap: true,
    logLevel: 'warning',
  });
  return outfile;
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(import.meta.filename))
  await buildServer();
