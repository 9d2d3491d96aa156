/**
 * Mean-field scan speed (issue 2): points per second of a 1D vdw map with Mmax = 12 on one
 * worker and on two, measured alternately in one run (best of `--repeat`, default 2, so a
 * burst of other load hurts both alike); their ratio is the parallel efficiency. Then the
 * speed-up of continuation over cold starts, checking that both give the same answers;
 * then the time of a 200 x 200 map on two workers (skipped with --quick).
 */
import { nodeEnginePool } from '../workers/node-spawn.ts';
import { runScan } from '../workers/scan-driver.ts';
import type { Engine } from '../workers/engine.ts';
import type { WorkerPool } from '../workers/pool.ts';
import type { ScanPoint } from '../workers/protocol.ts';
import { parseAxis } from '../src/core/scan/axes.ts';
import type { ScanPlan } from '../src/core/scan/grid.ts';
import type { Bench } from './harness.ts';

function plan(nx: number, ny: number): ScanPlan {
  return {
    base: { lattice: 'chain', interaction: { shape: 'vdw' }, delta: 3, T: 0, maxCell: 12 },
    x: parseAxis(`mu=-1:2.5:${nx}`, 'x'),
    y: parseAxis(`rb=1:2:${ny}`, 'y'),
    seed: 1,
  };
}

/**
 * Wall time and CPU time of a scan. process.cpuUsage counts every thread of the process,
 * so cpu / wall is the number of cores the run actually obtained (below the worker count
 * when other work shares the machine).
 */
async function timed(pool: WorkerPool<Engine>, p: ScanPlan, continuation = true): Promise<{ s: number; cpu: number; pts: ScanPoint[] }> {
  const t0 = performance.now(), c0 = process.cpuUsage();
  const pts = (await runScan(pool, { kind: 'map', plan: p, continuation })).points;
  const c = process.cpuUsage(c0);
  return { s: (performance.now() - t0) / 1000, cpu: (c.user + c.system) / 1e6, pts };
}

/** Points where two runs disagree: phase, fraction, cell size, or Omega beyond 1e-9 relative. */
function differences(a: ScanPoint[], b: ScanPoint[]): number {
  let n = 0;
  a.forEach((p, i) => {
    const ps = p.state, qs = b[i].state;
    if (!ps || !qs) { if (ps !== qs) n++; return; }
    const dOmega = Math.abs(ps.grandPotential - qs.grandPotential);
    if (ps.phase !== qs.phase || ps.fraction !== qs.fraction ||
      ps.cellSize !== qs.cellSize || dOmega > 1e-9 * Math.max(1, Math.abs(ps.grandPotential))) n++;
  });
  return n;
}

const bench: Bench = {
  name: 'meanfield',
  title: '1D vdw map (mu x rb, detuning 3, T = 0, Mmax = 12): throughput, parallel efficiency, continuation',
  async run(ctx) {
    const nx = Number(ctx.option('nx') ?? 64), ny = Number(ctx.option('ny') ?? 24);
    const repeat = Number(ctx.option('repeat') ?? 2);
    const grid = plan(nx, ny);
    const one = nodeEnginePool(1), two = nodeEnginePool(2);
    try {
      // start the threads and let the JIT see the solver before timing
      for (const pool of [one, two]) {
        await pool.warm((r) => r.info());
        await runScan(pool, { kind: 'map', plan: plan(32, 2) });
      }
      let best1 = Infinity, best2 = Infinity, cpu1 = 0, cpu2 = 0;
      let ref: ScanPoint[] = [], par: ScanPoint[] = [];
      for (let i = 0; i < repeat; i++) {
        const a = await timed(one, grid);
        const b = await timed(two, grid);
        if (a.s < best1) [best1, cpu1] = [a.s, a.cpu];
        if (b.s < best2) [best2, cpu2] = [b.s, b.cpu];
        [ref, par] = [a.pts, b.pts];
      }
      const points = nx * ny;
      ctx.log(`${nx} x ${ny} = ${points} points, best of ${repeat}`);
      ctx.figure('1 worker', points / best1, 'points/s');
      ctx.figure('2 workers', points / best2, 'points/s');
      ctx.figure('parallel efficiency (2 workers over 1)', best1 / best2, 'x', { target: '>= 1.7' });
      ctx.log(`cores obtained (CPU time over wall time; below the worker count when others share the machine): ${(cpu1 / best1).toFixed(2)} of 1 (1 worker), ${(cpu2 / best2).toFixed(2)} of 2 (2 workers)`);
      const same = JSON.stringify(ref.map((p) => p.state)) === JSON.stringify(par.map((p) => p.state));
      ctx.log(`1 and 2 workers give identical answers: ${same ? 'yes' : 'NO'}`);

      let bestCold = Infinity, cold: ScanPoint[] = [];
      for (let i = 0; i < repeat; i++) {
        const c = await timed(two, grid, false);
        bestCold = Math.min(bestCold, c.s);
        cold = c.pts;
      }
      const diff = differences(par, cold);
      ctx.figure('continuation over cold starts', bestCold / best2, 'x', {
        note: `(answers equal at ${points - diff} of ${points} points)`,
      });

      if (!ctx.flag('quick')) {
        const big = await timed(two, plan(200, 200));
        ctx.figure('200 x 200 map on 2 workers', big.s, 's', { target: '< 60' });
        ctx.log(`200 x 200 map: ${(big.cpu / big.s).toFixed(2)} of 2 cores obtained, ${big.cpu.toFixed(1)} CPU-s` +
          ` (${(big.cpu / 2).toFixed(1)} s on two free cores)`);
      } else ctx.log('200 x 200 map skipped (--quick)');
    } finally {
      one.close();
      two.close();
    }
  },
};

export default bench;
