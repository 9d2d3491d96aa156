/**
 * `npm run bench [-- name... --quick --long --json]`: finds every bench/*.bench.ts,
 * runs those whose name contains one of the given words (all without any), and prints
 * their figures; a new benchmark is a new file, run.ts never needs editing. Speed
 * figures are measured here, never in unit tests.
 */
import { readdirSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { join } from 'node:path';
import { meets, show, type Bench, type BenchContext, type Figure } from './harness.ts';

const argv = process.argv.slice(2);
const words = argv.filter((a) => !a.startsWith('--'));
const dir = fileURLToPath(new URL('.', import.meta.url));
const files = readdirSync(dir).filter((f) => f.endsWith('.bench.ts')).sort();
const chosen = files.filter((f) => words.length === 0 || words.some((w) => f.includes(w)));
const json = argv.includes('--json');
const figures: Figure[] = [];
const say = (line: string) => (json ? process.stderr : process.stdout).write(line + '\n');

function context(bench: string): BenchContext {
  return {
    flag: (name) => argv.includes(`--${name}`),
    option(name) {
      const i = argv.findIndex((a) => a === `--${name}` || a.startsWith(`--${name}=`));
      if (i < 0) return undefined;
      return argv[i].includes('=') ? argv[i].slice(argv[i].indexOf('=') + 1) : argv[i + 1];
    },
    log: (line) => say(`  ${line}`),
    figure(label, value, unit, extra = {}) {
      const f: Figure = { bench, label, value, unit, ...extra };
      figures.push(f);
      say(`  ${label}: ${show(value)} ${unit}${f.target ? `   (target ${f.target}${verdict(f)})` : ''}${f.note ? `   ${f.note}` : ''}`);
    },
  };
}

function verdict(f: Figure): string {
  const ok = f.target ? meets(f.value, f.target) : undefined;
  return ok === undefined ? '' : ok ? ': met' : ': NOT met';
}

say(`Blockade Atlas benchmarks on ${cpus().length} cores (${cpus()[0]?.model ?? 'unknown CPU'}), Node ${process.version}`);
say(`load average at start ${loadavg()[0].toFixed(2)}: other work on the machine makes every figure pessimistic`);
if (chosen.length === 0) say(`no benchmark matches ${words.join(', ')} (have: ${files.join(', ')})`);
for (const file of chosen) {
  const mod = (await import(pathToFileURL(join(dir, file)).href)) as { default: Bench };
  const b = mod.default;
  say(`\n${b.name}: ${b.title}`);
  const t0 = performance.now();
  await b.run(context(b.name));
  say(`  (${((performance.now() - t0) / 1000).toFixed(1)} s)`);
}
if (json) process.stdout.write(JSON.stringify(figures, null, 2) + '\n');
else if (figures.length > 0) {
  say('\nSummary');
  const w = Math.max(...figures.map((f) => `${f.bench}: ${f.label}`.length));
  for (const f of figures) say(`  ${`${f.bench}: ${f.label}`.padEnd(w)}  ${show(f.value).padStart(8)} ${f.unit}${f.target ? `  (target ${f.target}${verdict(f)})` : ''}`);
}
