// Every repository path a comment or document names must exist, and every rule code (R1…) used
// in code or docs must be defined in docs/care-rules.md. Run by `npm test` (stage "references").
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const files = execFileSync('git', ['ls-files', '-co', '--exclude-standard'], {
  cwd: root,
  encoding: 'utf8',
})
  .split('\n')
  .filter(
    (f) =>
      /\.(ts|tsx|mjs|js|md)$/.test(f) &&
      !f.startsWith('drizzle/') &&
      fs.existsSync(path.join(root, f)),
  );

// A path is cited when it starts at a top-level folder of the repository.
const TOP = [
  'src',
  'server',
  'shared',
  'tests',
  'scripts',
  'docs',
  'bench',
  'drizzle',
  'public',
  '.ci',
];
const PATH_RE = new RegExp(
  `(?<![\\w./@#-])((?:${TOP.map((t) => t.replace('.', '\\.')).join('|')})/[\\w./-]*[\\w-])`,
  'g',
);
const RULE_RE = /\bR(\d{1,2})\b/g;

const careRules = fs.readFileSync(path.join(root, 'docs/care-rules.md'), 'utf8');
const definedRules = new Set([...careRules.matchAll(/^### R(\d+) /gm)].map((m) => Number(m[1])));

const problems = [];
for (const file of files) {
  const text = fs.readFileSync(path.join(root, file), 'utf8');
  const isDoc = file.endsWith('.md');
  // In code, only comments cite paths; in documents, everything does.
  const cited = isDoc ? text : (text.match(/\/\/.*$|\/\*[\s\S]*?\*\//gm) ?? []).join('\n');
  for (const [, ref] of cited.matchAll(PATH_RE)) {
    const clean = ref.replace(/[.]+$/, '');
    if (/[*{}<>]/.test(clean) || clean.includes('…')) continue; // globs and placeholders
    const exists = [clean, `${clean}.ts`, `${clean}.tsx`].some((p) =>
      fs.existsSync(path.join(root, p)),
    );
    // Generated or ignored outputs that appear after a build or run.
    const generated =
      /^(dist|dist-server|bench\/results|bench\/\.minimal-dist|test-results)\b/.test(clean);
    if (!exists && !generated)
      problems.push(`${file}: names ${clean}, which is not in the repository`);
  }
  for (const [, n] of cited.matchAll(RULE_RE)) {
    if (!definedRules.has(Number(n)))
      problems.push(`${file}: cites rule R${n}, not defined in docs/care-rules.md`);
  }
}

if (problems.length) {
  console.error([...new Set(problems)].join('\n'));
  process.exit(1);
}
console.log(`references: ${files.length} files checked, every cited path and rule exists`);
