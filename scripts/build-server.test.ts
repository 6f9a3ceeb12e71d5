// The server bundle runs with production dependencies only (`npm ci --omit=dev`, as the
// Dockerfile's runtime stage installs): everything it imports at run time is a Node built-in
// or a package in package.json "dependencies".
import fs from 'node:fs';
import { builtinModules } from 'node:module';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { bundleImports, buildServer } from './build-server';

const root = path.resolve(import.meta.dirname, '..');
const pkg = JSON.parse(fs.readFileSync(path.join(root, 'package.json'), 'utf8')) as {
  dependencies: Record<string, string>;
  devDependencies: Record<string, string>;
  scripts: Record<string, string>;
};
const outDir = path.join(root, 'dist-server', `unit-${process.pid}`);

afterAll(() => fs.rmSync(outDir, { recursive: true, force: true }));

/** "pg-boss" from "pg-boss", "@date-fns/tz" from "@date-fns/tz/x", "drizzle-orm" from "drizzle-orm/pg-core". */
const packageOf = (specifier: string) =>
  specifier
    .split('/')
    .slice(0, specifier.startsWith('@') ? 2 : 1)
    .join('/');
const isBuiltin = (specifier: string) =>
  specifier.startsWith('node:') || builtinModules.includes(specifier);

describe('the server bundle', () => {
  it('imports only Node built-ins and production dependencies', async () => {
    const imports = await bundleImports();
    const packages = [...new Set(imports.filter((s) => !isBuiltin(s)).map(packageOf))];
    // The database driver and the web framework at least: the list is real.
    expect(packages).toEqual(expect.arrayContaining(['pg', 'express', 'drizzle-orm']));
    const notProduction = packages.filter((p) => !(p in pkg.dependencies));
    expect(notProduction).toEqual([]);
  });

  it('as built: the files import the same, and the mail fake’s packages only lazily', async () => {
    await buildServer(path.join(outDir, 'index.mjs'));
    for (const file of ['index.mjs', 'cli.mjs']) {
      const text = fs.readFileSync(path.join(outDir, file), 'utf8');
      const staticImports = [
        ...text.matchAll(
          /^\s*(?:import|export)\b[^;'"]*?from\s*["']([^"']+)["']|^\s*import\s*["']([^"']+)["']/gm,
        ),
      ].map((m) => m[1] ?? m[2]!);
      const dynamicImports = [...text.matchAll(/\bimport\(\s*["']([^"']+)["']\s*\)/g)].map(
        (m) => m[1]!,
      );
      expect(staticImports.length).toBeGreaterThan(3);
      for (const s of [...staticImports, ...dynamicImports])
        expect(isBuiltin(s) || packageOf(s) in pkg.dependencies, `${file} imports ${s}`).toBe(true);
      // smtp-server and mailparser load only when the local fake starts (no SMTP_URL).
      for (const lazy of ['smtp-server', 'mailparser'])
        expect(staticImports.map(packageOf), `${file} imports ${lazy} at start`).not.toContain(
          lazy,
        );
    }
    expect(fs.readFileSync(path.join(outDir, 'index.mjs'), 'utf8')).toMatch(
      /import\(\s*"smtp-server"\s*\)/,
    );
  });

  it('is built by `npm run build`, with the client', () => {
    expect(pkg.scripts.build).toMatch(/vite build/);
    expect(pkg.scripts.build).toMatch(/scripts\/build-server\.ts/);
    // The builder is a build-time tool only.
    expect(pkg.devDependencies.esbuild).toBeDefined();
  });
});
