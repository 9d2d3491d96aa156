// The scan host (workers/scan-host.ts, the page's coordinating worker) over a
// MessageChannel: a map and a staircase run through it give exactly what the scan driver
// gives when called directly on a pool (points, boundary lines, solves, plateaus), points
// arrive in blocks of many (not one message a point), and a cancelled scan rejects with an
// AbortError at once. Exact equality is the check (common practice, no source): the host
// runs the same driver on the same kind of pool, and blocks carry float64 values unrounded.
import { afterAll, describe, expect, it } from 'vitest';
import { MessageChannel } from 'node:worker_threads';
import { nodeEnginePool } from '../../workers/node-spawn.ts';
import { runScan } from '../../workers/scan-driver.ts';
import { serveScans, type HostPort } from '../../workers/scan-host.ts';
import { ScanHostClient } from '../../workers/scan-host-client.ts';
import { parseAxis } from '../../src/core/scan/axes.ts';
import { gridPoint, pointSeed, type ScanPlan, type ScanPoint } from '../../src/core/scan/grid.ts';
import { solveGroundState } from '../../src/core/meanfield/ground-state.ts';

// a small vdw chain map crossing empty, condensate and density-wave regions (Mmax 6: fast)
const plan: ScanPlan = {
  base: { lattice: 'chain', interaction: { shape: 'vdw', Rb: 1.3 }, delta: 3, T: 0, maxCell: 6 },
  x: parseAxis('mu=-1..2.5 x24', 'x'),
  y: parseAxis('rb=1..1.6 x9', 'y'),
  seed: 1,
};

const direct = nodeEnginePool(2), hosted = nodeEnginePool(2);
const channel = new MessageChannel();
serveScans(channel.port1 as unknown as HostPort, hosted);
const client = new ScanHostClient(channel.port2 as unknown as HostPort);
// count the messages that carry points
let pointMessages = 0;
channel.port2.addEventListener('message', (e) => { if ((e as MessageEvent).data.block) pointMessages++; });
afterAll(() => { direct.close(); hosted.close(); channel.port1.close(); channel.port2.close(); });

describe('scans through the scan host', () => {
  it('an adaptive map: the same points, lines and solves as the driver called directly, in blocks', async () => {
    const want = await runScan(direct, { kind: 'map', plan, order: 'spread' });
    const streamed: ScanPoint[] = [], preview: ScanPoint[] = [];
    pointMessages = 0;
    const got = await client.scan({ kind: 'map', plan, order: 'spread' }, { onItem: (p) => streamed.push(p), onPreview: (ps) => preview.push(...ps) });
    expect(got.points).toStrictEqual(want.points);
    expect(got.boundaries).toStrictEqual(want.boundaries);
    expect(got.solves).toBe(want.solves);
    expect(new Set(streamed.map((p) => p.index)).size).toBe(plan.x.count * 9);
    expect(new Set(want.points.map((p) => p.state?.phase)).size).toBeGreaterThanOrEqual(3);
    // 216 points: the map's bands (coarse rows 0, 8: two bands) come as a few blocks
    expect(pointMessages).toBeGreaterThanOrEqual(1);
    expect(pointMessages).toBeLessThanOrEqual(10);
    // the preview: grid points solved cold (the refinement corners), each the point solved
    // alone with its grid seed and no guess; at least the coarse grid's corners (columns
    // 0, 12, 23: the segment starts of a 24-point row and its end; rows 0 and 8: six points)
    expect(preview.length).toBeGreaterThanOrEqual(6);
    for (const p of preview.slice(0, 12)) {
      expect(p.index).toBe(p.iy * plan.x.count + p.ix);
      expect(p.state).toStrictEqual(solveGroundState(gridPoint(plan, p.ix, p.iy), { seed: pointSeed(plan.seed, p.index) }));
    }
  });

  it('known points answer the cold solves at their grid points: the same map, fewer solves', async () => {
    const want = await runScan(direct, { kind: 'map', plan, order: 'spread' });
    // every second column of every fourth row (rows 0, 4, 8 hold the coarse corners)
    const known = want.points.filter((p) => p.iy % 4 === 0 && p.ix % 2 === 0);
    const got = await client.scan({ kind: 'map', plan, order: 'spread' }, { known });
    expect(got.points).toStrictEqual(want.points);
    expect(got.boundaries).toStrictEqual(want.boundaries);
    const note = (got.notes ?? []).find((n) => n.includes('taken from the map'));
    const reused = Number(/^(\d+)/.exec(note ?? '')?.[1]);
    expect(reused).toBeGreaterThan(0);
    // fewer solves, though not all `reused` fewer: a known corner that is not certified and has
    // a guess in its row is solved again by the row fill (its winning search cell is unknown)
    expect(got.solves).toBeLessThan(want.solves as number);
    expect(got.solves).toBeGreaterThanOrEqual((want.solves as number) - reused);
  });

  it('a staircase: the same points and plateaus', async () => {
    const line: ScanPlan = { base: { ...plan.base, interaction: { shape: 'vdw', Rb: 1.5 } }, x: parseAxis('mu=-1..2.5 x60', 'x'), seed: 1 };
    const want = await runScan(direct, { kind: 'staircase', plan: line });
    const got = await client.scan({ kind: 'staircase', plan: line });
    expect(got).toStrictEqual(want);
    expect(want.plateaus.length).toBeGreaterThanOrEqual(2);
  });

  it('a cancelled scan rejects with an AbortError, and the host serves the next one', async () => {
    const ac = new AbortController();
    const big: ScanPlan = { ...plan, x: parseAxis('mu=-1..2.5 x120', 'x'), y: parseAxis('rb=1..1.6 x40', 'y') };
    const run = client.scan({ kind: 'map', plan: big, dense: true }, { signal: ac.signal });
    setTimeout(() => ac.abort(), 300);
    await expect(run).rejects.toMatchObject({ name: 'AbortError' });
    const again = await client.scan({ kind: 'map', plan: { ...plan, y: parseAxis('rb=1.2..1.2 x1', 'y') }, dense: true });
    expect(again.points).toHaveLength(plan.x.count);
  });
});
