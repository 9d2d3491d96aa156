/**
 * Resident memory of a streamed map against its size (issue 12): the built CLI runs a
 * 1D map (chain, --max-cell 4) of 100 x 100 and of 1000 x 1000 points to a file, and the
 * peak resident set of the process (its worker threads included) is read from
 * /proc/<pid>/status (VmHWM, the high-water mark) every 100 ms while it runs. Side by side,
 * and their ratio: a map streamed to disk should need no more memory when it is 100 times
 * bigger (target: ratio under 1.5). Both ways a map is computed: the default (adaptive)
 * and --dense. --quick: 50 x 50 against 300 x 300. Sizes: --small=N --big=N (points a
 * side); --mode=adaptive or --mode=dense runs one of the two.
 */
import { execFileSync, spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Bench } from './harness.ts';

const root = fileURLToPath(new URL('..', import.meta.url));

/**
 * The node flags of `npm run atlas` (package.json), so the map runs as a user runs it: a
 * small young generation and an old-generation limit far above the main thread's live
 * heap (10-20 MB), which keeps V8 from growing the heap with the length of a run.
 */
const ATLAS_NODE_FLAGS = (() => {
  const script = (JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { scripts: Record<string, string> }).scripts.atlas;
  return script.split(/\s+/).filter((w) => w.startsWith('--'));
})();

/** VmHWM of a live process in MB (undefined once it is gone). */
function peakMb(pid: number): number | undefined {
  try {
    const m = /VmHWM:\s+(\d+)\s+kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
    return m ? Number(m[1]) / 1024 : undefined;
  } catch {
    return undefined;
  }
}

/** Run one map of side n into dir; resolves with the peak RSS (MB) seen and the wall time (s). */
function measure(n: number, dir: string, dense: boolean): Promise<{ mb: number; seconds: number }> {
  return new Promise((resolve, reject) => {
    const argv = [...ATLAS_NODE_FLAGS, join(root, 'dist', 'cli', 'atlas.mjs'), 'map', '--x', `mu=-1..2x${n}`, '--y', `rb=1..1.5x${n}`, '--detuning', '3',
      '--max-cell', '4', '--workers', '2', ...(dense ? ['--dense'] : []), '--out', join(dir, `map-${n}.csv`)];
    const t0 = performance.now();
    const child = spawn(process.execPath, argv, { stdio: ['ignore', 'ignore', 'pipe'], env: { ...process.env, ATLAS_PROGRESS: '' } });
    let peak = 0, err = '';
    child.stderr.on('data', (d: Buffer) => void (err += d.toString()));
    const poll = setInterval(() => {
      const mb = child.pid === undefined ? undefined : peakMb(child.pid);
      if (mb !== undefined) peak = Math.max(peak, mb);
    }, 100);
    child.on('close', (code) => {
      clearInterval(poll);
      if (code !== 0) reject(new Error(`map ${n} x ${n} exited ${code}: ${err}`));
      else resolve({ mb: peak, seconds: (performance.now() - t0) / 1000 });
    });
  });
}

const bench: Bench = {
  name: 'stream-memory',
  title: 'peak resident memory of a streamed map: 100 x 100 against 1000 x 1000 (1D, --max-cell 4), adaptive and --dense, side by side',
  async run(ctx) {
    execFileSync(process.execPath, ['scripts/build-cli.mjs', '--quiet'], { cwd: root });
    const quick = ctx.flag('quick');
    const small = Number(ctx.option('small') ?? (quick ? 50 : 100));
    const big = Number(ctx.option('big') ?? (quick ? 300 : 1000));
    const dir = mkdtempSync(join(tmpdir(), 'atlas-stream-bench-'));
    try {
      const mode = ctx.option('mode');
      for (const dense of [false, true]) {
        const name = dense ? 'dense' : 'adaptive';
        if (mode !== undefined && mode !== name) continue;
        const a = await measure(small, dir, dense);
        ctx.log(`${name} map ${small} x ${small}: peak RSS ${a.mb.toFixed(1)} MB in ${a.seconds.toFixed(1)} s`);
        const b = await measure(big, dir, dense);
        ctx.log(`${name} map ${big} x ${big}: peak RSS ${b.mb.toFixed(1)} MB in ${b.seconds.toFixed(1)} s`);
        ctx.figure(`peak RSS, ${name} ${small} x ${small} map`, a.mb, 'MB');
        ctx.figure(`peak RSS, ${name} ${big} x ${big} map`, b.mb, 'MB');
        ctx.figure(`RSS ratio ${big}^2 / ${small}^2, ${name}`, b.mb / a.mb, 'x', { target: '< 1.5' });
      }
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  },
};

export default bench;
