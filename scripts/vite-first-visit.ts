// Build steps for the first visit (P3): what the first screen needs arrives with or right after
// the page, and nothing it does not need stands in its way.
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { transform } from 'esbuild';
import type { OutputAsset, OutputBundle, OutputChunk } from 'rolldown';
import type { Plugin } from 'vite';

const root = path.resolve(import.meta.dirname, '..');

/** The chunks holding `modules` and the chunks they import, minus the entry's own. */
function chunksOf(bundle: OutputBundle, modules: string[]): string[] {
  const chunks = Object.values(bundle).filter((c): c is OutputChunk => c.type === 'chunk');
  const entry = chunks.find((c) => c.isEntry);
  const inEntry = new Set([entry?.fileName, ...(entry?.imports ?? [])]);
  const out = new Set<string>();
  const add = (file: string) => {
    if (out.has(file) || inEntry.has(file)) return;
    out.add(file);
    for (const dep of chunks.find((c) => c.fileName === file)?.imports ?? []) add(dep);
  };
  for (const m of modules) {
    const id = path.join(root, m);
    const chunk = chunks.find((c) => c.moduleIds.includes(id));
    if (!chunk) throw new Error(`vite-first-visit: no chunk holds ${m}`);
    add(chunk.fileName);
  }
  return [...out].map((f) => `/${f}`);
}

/**
 * The page's first-visit work, once the bundle is known:
 * src/first-visit.ts is built on its own (it asks for the first screen's data and lazy chunks
 *   while the app downloads) with the names of those chunks written in, and the page runs it
 *   before the app (`defer`, so it never holds up the page).
 */
export function firstVisit(): Plugin {
  return {
    name: 'rackside-first-visit',
    apply: 'build',
    enforce: 'post',
    async generateBundle(_options, bundle) {
      const page = bundle['index.html'] as OutputAsset | undefined;
      if (!page) throw new Error('vite-first-visit: the build has no index.html');
      const html = String(page.source);
      const chunks = {
        signIn: chunksOf(bundle, ['src/app/routes/sign-in.tsx']),
        signedIn: chunksOf(bundle, ['shared/schemas/auth.ts', 'shared/schemas/rounds.ts']),
      };
      const source = await readFile(path.join(root, 'src', 'first-visit.ts'), 'utf8');
      const { code } = await transform(source, {
        loader: 'ts',
        format: 'iife',
        target: 'es2020',
        minify: true,
        define: { __FIRST_VISIT_CHUNKS__: JSON.stringify(chunks) },
      });
      const ref = this.emitFile({ type: 'asset', name: 'first-visit.js', source: code });
      const script = `<script defer src="/${this.getFileName(ref)}"></script>`;
      if (!html.includes('<script type="module"'))
        throw new Error('vite-first-visit: index.html has no module script');
      page.source = html.replace('<script type="module"', `${script}\n    <script type="module"`);
    },
  };
}
