// The scan driver on real engine worker threads: a map's answers equal the same
// segments solved serially in this thread, bit for bit, on one worker and on two
// (determinism: the result is fixed by the plan, not by the worker count or sharding).
// Exact equality is the check (common practice, no source): the same code runs on the
// same inputs in every case.
import { afterAll, describe, expect, it } from 'vitest';
import { nodeEnginePool } from '../../workers/node-spawn.ts';
import { runScan } from '../../workers/scan-driver.ts';
import { meanfieldApi } from '../../workers/api/meanfield.ts';
import { parseAxis } from '../../src/core/scan/axes.ts';
import { gridPoint, pointSeed, segments, type ScanPlan } from '../../src/core/scan/grid.ts';
import { solveGroundState, type SolveResult } from '../../src/core/meanfield/ground-state.ts';

// A small vdw chain map crossing empty, condensate and density-wave regions; Mmax = 6
// keeps it fast.
const plan: ScanPlan = {
  base: { lattice: 'chain', interaction: { shape: 'vdw', Rb: 1.3 }, delta: 3, T: 0, maxCell: 6 },
  x: parseAxis('mu=-1:2.5:20', 'x'),
  y: parseAxis('rb=1:1.4:2', 'y'),
  seed: 7,
};
const nx = plan.x.count, ny = 2;

function serial(continuation: boolean): SolveResult[] {
  const out: SolveResult[] = [];
  for (const s of segments(nx, ny)) {
    const points = [], seeds = [];
    for (let i = 0; i < s.length; i++) {
      points.push(gridPoint(plan, s.ix0 + i, s.iy));
      seeds.push(pointSeed(plan.seed, s.iy * nx + s.ix0 + i));
    }
    meanfieldApi.solveRun({ points, seeds, continuation }).forEach((r, i) => (out[s.iy * nx + s.ix0 + i] = r.state as SolveResult));
  }
  return out;
}

const pools = [nodeEnginePool(1), nodeEnginePool(2)];
afterAll(() => pools.forEach((p) => p.close()));

describe('mean-field scan in the worker pool', () => {
  const reference = serial(true);

  it('covers the range of phases the check needs', () => {
    const phases = new Set(reference.map((s) => s.phase));
    expect(phases.size).toBeGreaterThanOrEqual(3);
  });

  it.each([1, 2])('equals the serial answers exactly on %i worker(s)', async (size) => {
    const streamed: number[] = [];
    const { points: got } = await runScan(pools[size - 1], { kind: 'map', plan }, { onItem: (p) => streamed.push(p.index) });
    expect(got.map((p) => p.index)).toEqual(Array.from({ length: nx * ny }, (_, i) => i));
    expect(new Set(streamed).size).toBe(nx * ny);
    expect(got.map((p) => p.state)).toEqual(reference);
    expect(got.every((p) => p.index === p.iy * nx + p.ix)).toBe(true);
  });

  it('two shards together equal the whole scan', async () => {
    const a = (await runScan(pools[1], { kind: 'map', plan, shard: { k: 1, n: 2 } })).points;
    const b = (await runScan(pools[1], { kind: 'map', plan, shard: { k: 2, n: 2 } })).points;
    const merged: SolveResult[] = [];
    for (const p of [...a, ...b]) merged[p.index] = p.state as SolveResult;
    expect(merged).toEqual(reference);
  });

  it('cold runs equal each point solved alone', async () => {
    const { points: got } = await runScan(pools[1], { kind: 'map', plan, continuation: false });
    got.forEach((p) => {
      expect(p.state).toEqual(solveGroundState(gridPoint(plan, p.ix, p.iy), { seed: pointSeed(plan.seed, p.index) }));
    });
  });

  it('cancels mid-scan with an AbortError and keeps the finished points', async () => {
    const ac = new AbortController();
    const done: number[] = [];
    const big: ScanPlan = { ...plan, x: parseAxis('mu=-1:2.5:200', 'x') };
    // The dense path delivers points segment by segment (the adaptive map hands out a band of
    // rows at once, so its points arrive together: its cancellation is checked below).
    const run = runScan(pools[1], { kind: 'map', plan: big, dense: true }, {
      signal: ac.signal,
      onItem: (p) => {
        done.push(p.index);
        if (done.length === 10) ac.abort();
      },
    });
    await expect(run).rejects.toMatchObject({ name: 'AbortError' });
    expect(done.length).toBeGreaterThanOrEqual(10);
    expect(done.length).toBeLessThan(400);
    // the pool still works after the cancellation
    const again = await runScan(pools[1], { kind: 'map', plan: { ...plan, y: undefined, x: parseAxis('mu=0:1:3', 'x') } });
    expect(again.points.length).toBe(3);
  });

  it('cancels an adaptive map between its solves with an AbortError', async () => {
    const ac = new AbortController();
    let reports = 0;
    const big: ScanPlan = { ...plan, x: parseAxis('mu=-1:2.5:200', 'x') };
    const run = runScan(pools[1], { kind: 'map', plan: big }, {
      signal: ac.signal,
      onProgress: () => { if (++reports === 3) ac.abort(); },
    });
    await expect(run).rejects.toMatchObject({ name: 'AbortError' });
    const again = await runScan(pools[1], { kind: 'map', plan: { ...plan, y: undefined, x: parseAxis('mu=0:1:3', 'x') } });
    expect(again.points.length).toBe(3);
  });

  it('the spread order hands out rows coarse to fine and changes no answer', async () => {
    const tall: ScanPlan = { ...plan, x: parseAxis('mu=-1:2.5:6', 'x'), y: parseAxis('rb=1:1.4:9', 'y') };
    const order: number[] = [];
    // (the dense path: the adaptive map spreads bands of 16 rows, and this map is one band)
    const spread = await runScan(pools[0], { kind: 'map', plan: tall, order: 'spread', dense: true }, { onItem: (p) => order.push(p.iy) });
    const rows = await runScan(pools[0], { kind: 'map', plan: tall, dense: true });
    expect(spread.points).toEqual(rows.points);
    // one worker takes the segments in order: first and last row, then stride 8, 4, 2, 1
    expect([...new Set(order)]).toEqual([0, 8, 4, 2, 6, 1, 3, 5, 7]);
  });

  it('reports a point that cannot be solved in its row and writes the others', async () => {
    // mu = 3 is at the detuning: validateModel refuses it (photon number unbounded), the
    // neighbours along the row are ordinary points
    const edge: ScanPlan = { ...plan, x: parseAxis('mu=2:3:3', 'x'), y: undefined };
    const { points } = await runScan(pools[1], { kind: 'map', plan: edge });
    expect(points.map((p) => p.error === undefined)).toEqual([true, true, false]);
    expect(points[2].error).toMatch(/mu .*below|unbounded/);
    expect(points[2].state).toBeUndefined();
    expect(points[0].state?.phase).toBeDefined();
  });
});
