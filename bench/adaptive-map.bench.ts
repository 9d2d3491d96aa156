/**
 * The adaptive map against the dense one (issue 9), side by side in one run on two workers:
 * the 1D vdw map (delta 4, Mmax 12, mu -1..3.9, Rb 1..2.5) at 100 x 100 (--quick: 50 x 50;
 * --nx/--ny override). Figures: full solves of each and their ratio, wall and CPU time
 * (process.cpuUsage counts the worker threads) and their ratio, pixels differing (every CSV
 * field compared; must be 0), and the boundaries found.
 */
import { nodeEnginePool } from '../workers/node-spawn.ts';
import { runScan } from '../workers/scan-driver.ts';
import { parseAxis } from '../src/core/scan/axes.ts';
import { mapCsv, mapHeader } from '../src/core/scan/map-columns.ts';
import type { ScanPlan } from '../src/core/scan/grid.ts';
import type { MapScanResult } from '../workers/protocol.ts';
import type { Bench } from './harness.ts';

const bench: Bench = {
  name: 'adaptive-map',
  title: '1D vdw map (delta 4, Mmax 12, mu -1..3.9, Rb 1..2.5): adaptive against dense on two workers',
  async run(ctx) {
    const n = ctx.flag('quick') ? 50 : 100;
    const nx = Number(ctx.option('nx') ?? n), ny = Number(ctx.option('ny') ?? n);
    const plan: ScanPlan = {
      base: { lattice: 'chain', interaction: { shape: 'vdw', Rb: 1.5 }, delta: 4, T: 0, maxCell: 12 },
      x: parseAxis(`mu=-1:3.9:${nx}`, 'x'), y: parseAxis(`rb=1:2.5:${ny}`, 'y'), seed: 1,
    };
    const pool = nodeEnginePool(2);
    try {
      await pool.warm((r) => r.info());
      await runScan(pool, { kind: 'map', plan: { ...plan, x: parseAxis('mu=-1:3.9:16', 'x'), y: parseAxis('rb=1:2.5:2', 'y') }, dense: true });
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
      ctx.log(`${nx} x ${ny} = ${nx * ny} pixels`);
      ctx.figure('dense solves', d.r.solves ?? nx * ny, 'points');
      ctx.figure('adaptive solves', a.r.solves ?? NaN, 'points');
      ctx.figure('of which locating boundaries', a.r.boundarySolves ?? NaN, 'points');
      ctx.figure('pixel solves (without boundaries), adaptive over dense', ((a.r.solves ?? NaN) - (a.r.boundarySolves ?? 0)) / (d.r.solves ?? nx * ny), 'x', { target: '<= 0.2' });
      ctx.figure('solves, adaptive over dense', (a.r.solves ?? NaN) / (d.r.solves ?? nx * ny), 'x');
      ctx.figure('dense wall time', d.s, 's');
      ctx.figure('adaptive wall time', a.s, 's', { target: '< 5 (200 x 200)' });
      ctx.figure('CPU time, adaptive over dense', a.cpu / d.cpu, 'x');
      ctx.figure('pixels differing', differing, 'pixels', { target: '= 0' });
      const b = a.r.boundaries ?? [];
      ctx.log(`boundaries: ${b.length} lines, ${b.filter((x) => x.firstOrder).length} exact first-order lines between crystals`);
    } finally {
      pool.close();
    }
  },
};

export default bench;
