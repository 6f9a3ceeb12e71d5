import fs from 'node:fs';
import path from 'node:path';

export interface Figure {
  id: string;
  what: string;
  value: number;
  unit: string;
  target: number | string;
  baseline?: number;
  ratio?: number;
  pass: boolean;
}

const root = path.resolve(import.meta.dirname, '..');

/** Updates bench/results/latest.json and appends the run to docs/benchmarks.md (the history). */
export function recordFigures(figures: Figure[], command: string, notes: string[]) {
  const dir = path.join(root, 'bench', 'results');
  fs.mkdirSync(dir, { recursive: true });
  // The newest figures of every benchmark: this run's replace those with the same ids, the
  // others stay from their own latest run.
  const file = path.join(dir, 'latest.json');
  const ran = new Set(figures.map((f) => f.id));
  const kept = fs.existsSync(file)
    ? (JSON.parse(fs.readFileSync(file, 'utf8')) as Figure[]).filter((f) => !ran.has(f.id))
    : [];
  const all = [...kept, ...figures].sort((a, b) =>
    a.id.localeCompare(b.id, 'en', { numeric: true }),
  );
  fs.writeFileSync(file, `${JSON.stringify(all, null, 2)}\n`);
  const history = path.join(root, 'docs', 'benchmarks.md');
  if (!fs.existsSync(history)) {
    fs.writeFileSync(
      history,
      '# Benchmarks\n\nEvery run of `npm run bench` appends its figures here (newest last). Targets are in the budgets document; medians over several runs on a shared 2-core machine.\n',
    );
  }
  const rows = figures.map(
    (f) =>
      `| ${f.id} | ${f.what} | ${f.value} ${f.unit} | ${f.target} | ${f.baseline ?? ''} | ${f.ratio ?? ''} | ${f.pass ? 'pass' : '**FAIL**'} |`,
  );
  const block = [
    '',
    `## ${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC — \`${command}\``,
    '',
    '| id | what | value | target | baseline | ratio | result |',
    '| --- | --- | --- | --- | --- | --- | --- |',
    ...rows,
    '',
    ...notes.map((n) => `- ${n}`),
    '',
  ].join('\n');
  fs.appendFileSync(history, block);
}

export function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  return s.length % 2 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
}
