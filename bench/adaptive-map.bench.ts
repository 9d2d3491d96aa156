/**
 * The adaptive map against the dense one (issue 9), side by side in one run on two workers.
 *
 * 1D: the vdw chain map (delta 4, Mmax 12, mu -1..3.9, Rb 1..2.5) at 100 x 100 (--quick:
 * 50 x 50; --nx/--ny override; the figure is 200 x 200).
 * 2D: the square-lattice vdw map (delta 4, Mmax 8, mu 0..3.9, Rb 1..2) at 64 x 64 (--quick:
 * 32 x 32; --long: the 128 x 128, whose dense half takes minutes). The ranges show
 * the crystals 1/2 (checkerboard), 1/3, 1/4, 1/5, 1/6 and 1/8 in one picture, their
 * supersolid edges and the superradiant onset near mu = 0.3: mu from 0 (below 0 the map is
 * empty, nothing to refine) to 3.9 (just below delta), Rb from 1 (where 1/2 is the largest
 * plateau) to 2 (where the dilute 1/8 crystal takes over; the largest cell is Mmax = 8).
 * --only 1d | 2d runs one of them.
 *
 * Figures of each: full solves of each and their ratio, wall and CPU time (process.cpuUsage
 * counts the worker threads) and their ratio, pixels differing (every CSV field compared;
 * must be 0), and the boundaries found.
 */
import { nodeEnginePool } from '../workers/node-spawn.ts';
import { runScan } from '../workers/scan-driver.ts';
import { parseAxis } from '../src/core/scan/axes.ts';
import { mapCsv, mapHeader } from '../src/formats/map-columns.ts';
import type { ScanPlan } from '../src/core/scan/grid.ts';
import type { MapScanResult } from '../workers/protocol.ts';
import type { WorkerPool } from '../workers/pool.ts';
import type { Engine } from '../workers/engine.ts';
import type { Bench, BenchContext } from './harness.ts';

/** Dense and adaptive runs of one plan, one after the other on the pool, with their figures. */
async function compare(ctx: BenchContext, pool: WorkerPool<Engine>, tag: string, plan: ScanPlan, wallTarget?: string): Promise<void> {
  const nx = plan.x.count, ny = plan.y?.count ?? 1;
  const timed = async (dense: boolean) => {
    const t0 = performance.now(), c0 = process.cpuUsage();
    const r: MapScanResult = await runScan(pool, { kind: 'map', plan, dense });
    const c = process.cpuUsage(c0);
    return { r, s: (performance.now() - t0) / 1000, cpu: (c.user + c.system) / 1e6 };
  };
  const d = await timed(true);
  const a = await timed(false);
  const h = mapHeader(plan);
  const dl = mapCsv(h, d.r.points).split('\n'), al = mapCsv(h, a.r.points).split('\n');
  const differing = dl.filter((l, i) => l !== al[i]).length + Math.abs(dl.length - al.length);
  ctx.log(`${tag}: ${nx} x ${ny} = ${nx * ny} pixels`);
  ctx.figure(`${tag} dense solves`, d.r.solves ?? nx * ny, 'points');
  ctx.figure(`${tag} adaptive solves`, a.r.solves ?? NaN, 'points');
  ctx.figure(`${tag} of which locating boundaries`, a.r.boundarySolves ?? NaN, 'points');
  ctx.figure(`${tag} pixel solves (without boundaries), adaptive over dense`, ((a.r.solves ?? NaN) - (a.r.boundarySolves ?? 0)) / (d.r.solves ?? nx * ny), 'x', { target: '<= 0.2' });
  ctx.figure(`${tag} solves, adaptive over dense`, (a.r.solves ?? NaN) / (d.r.solves ?? nx * ny), 'x');
  ctx.figure(`${tag} dense wall time`, d.s, 's');
  ctx.figure(`${tag} adaptive wall time`, a.s, 's', wallTarget ? { target: wallTarget } : undefined);
  ctx.figure(`${tag} dense CPU time`, d.cpu, 's');
  ctx.figure(`${tag} adaptive CPU time`, a.cpu, 's');
  ctx.figure(`${tag} CPU time, adaptive over dense`, a.cpu / d.cpu, 'x');
  ctx.figure(`${tag} adaptive CPU over wall (2 workers: at most 2)`, a.cpu / a.s, 'x');
  ctx.figure(`${tag} pixels differing`, differing, 'pixels', { target: '= 0' });
  const b = a.r.boundaries ?? [];
  ctx.log(`${tag} boundaries: ${b.length} lines, ${b.filter((x) => x.firstOrder).length} exact first-order lines between crystals`);
}

const bench: Bench = {
  name: 'adaptive-map',
  title: 'adaptive against dense maps on two workers: 1D vdw (Mmax 12) and square-lattice vdw (Mmax 8)',
  async run(ctx) {
    const only = ctx.option('only');
    const n = ctx.flag('quick') ? 50 : 100;
    const nx = Number(ctx.option('nx') ?? n), ny = Number(ctx.option('ny') ?? n);
    const chain: ScanPlan = {
      base: { lattice: 'chain', interaction: { shape: 'vdw', Rb: 1.5 }, delta: 4, T: 0, maxCell: 12 },
      x: parseAxis(`mu=-1:3.9:${nx}`, 'x'), y: parseAxis(`rb=1:2.5:${ny}`, 'y'), seed: 1,
    };
    const m = ctx.flag('long') ? 128 : ctx.flag('quick') ? 32 : 64;
    const square: ScanPlan = {
      base: { lattice: 'square', interaction: { shape: 'vdw', Rb: 1.5 }, delta: 4, T: 0, maxCell: 8 },
      x: parseAxis(`mu=0:3.9:${m}`, 'x'), y: parseAxis(`rb=1:2:${m}`, 'y'), seed: 1,
    };
    const pool = nodeEnginePool(2);
    try {
      await pool.warm((r) => r.info());
      // both paths warmed on small maps first, so each timed run measures the map, not the
      // workers' first compilation of its code (without the adaptive warm-up its first
      // 200 x 200 run took about 0.4 s longer than the next)
      await runScan(pool, { kind: 'map', plan: { ...chain, x: parseAxis('mu=-1:3.9:16', 'x'), y: parseAxis('rb=1:2.5:2', 'y') }, dense: true });
      await runScan(pool, { kind: 'map', plan: { ...chain, x: parseAxis('mu=-1:3.9:40', 'x'), y: parseAxis('rb=1:2.5:40', 'y') } });
      if (only !== '2d') await compare(ctx, pool, '1D', chain, '< 5 (200 x 200)');
      if (only !== '1d') await compare(ctx, pool, '2D', square);
    } finally {
      pool.close();
    }
  },
};

export default bench;
