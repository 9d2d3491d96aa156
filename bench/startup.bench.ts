/**
 * Start-up of the command line: `node -e 0` (Node itself) against `--help` of the built CLI
 * run directly (node dist/cli/atlas.mjs), through its launcher (scripts/atlas.mjs, which
 * first checks the build is fresh) and through `npm run -s atlas --` (npm's own start
 * included; `npm --version` shows what npm alone costs), side by side, each the median of `--repeat` runs (default 10) taken in turn
 * so that a burst of load elsewhere hits them all alike.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import type { Bench } from './harness.ts';

const root = fileURLToPath(new URL('..', import.meta.url));

function millis(cmd: string, args: string[]): number {
  const t0 = performance.now();
  const r = spawnSync(cmd, args, { cwd: root, stdio: ['ignore', 'ignore', 'pipe'] });
  const t = performance.now() - t0;
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')} exited ${r.status}: ${r.stderr.toString()}`);
  return t;
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
}

const bench: Bench = {
  name: 'startup',
  title: 'CLI start-up: `--help` against `node -e 0`, median wall time, side by side',
  async run(ctx) {
    execFileSync(process.execPath, ['scripts/build-cli.mjs', '--quiet'], { cwd: root });
    const repeat = Math.max(3, Number(ctx.option('repeat') ?? 10));
    const runs: [string, string, string[]][] = [
      ['node -e 0', process.execPath, ['-e', '0']],
      ['node dist/cli/atlas.mjs --help', process.execPath, ['dist/cli/atlas.mjs', '--help']],
      ['node scripts/atlas.mjs --help', process.execPath, ['scripts/atlas.mjs', '--help']],
      ['npm run -s atlas -- --help', 'npm', ['run', '-s', 'atlas', '--', '--help']],
      ['npm --version (npm alone)', 'npm', ['--version']],
    ];
    const times = runs.map(() => [] as number[]);
    for (const [, cmd, args] of runs) millis(cmd, args); // warm the file cache
    for (let i = 0; i < repeat; i++) runs.forEach(([, cmd, args], k) => times[k].push(millis(cmd, args)));
    const med = times.map(median);
    const base = med[0];
    runs.forEach(([label], k) => ctx.log(`${label.padEnd(32)} ${med[k].toFixed(0).padStart(5)} ms   ${(med[k] / base).toFixed(2)} x node -e 0`));
    // Targets are ratios: on a loaded machine every absolute time grows, Node's own start too.
    ctx.figure('node -e 0', base, 'ms');
    ctx.figure('node dist/cli/atlas.mjs --help', med[1], 'ms');
    ctx.figure('built CLI --help / node -e 0', med[1] / base, 'x', { target: '< 2' });
    ctx.figure('npm run -s atlas -- --help', med[3], 'ms', { note: `npm alone (npm --version) ${med[4].toFixed(0)} ms` });
    ctx.figure('npm run -s atlas -- --help / node -e 0', med[3] / base, 'x');
  },
};

export default bench;
