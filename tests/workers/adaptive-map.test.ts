// The adaptive map on real worker threads against the dense scan of the same plan (the
// reference: docs/certified-maps.md promises the same pixels). Exact equality of every
// printed field is the check (common practice, no source): a pixel differing in any digit
// is a failure.
import { afterAll, describe, expect, it } from 'vitest';
import { nodeEnginePool } from '../../workers/node-spawn.ts';
import { runScan } from '../../workers/scan-driver.ts';
import { parseAxis } from '../../src/core/scan/axes.ts';
import { mapCsv, mapHeader } from '../../src/formats/map-columns.ts';
import { crystalOf } from '../../src/core/scan/crystal.ts';
import { solveGroundState } from '../../src/core/meanfield/ground-state.ts';
import { applyAxis } from '../../src/core/scan/axes.ts';
import type { ScanPlan } from '../../src/core/scan/grid.ts';

const pool = nodeEnginePool(2);
afterAll(() => pool.close());

const vdw: ScanPlan = {
  base: { lattice: 'chain', interaction: { shape: 'vdw', Rb: 1.3 }, delta: 4, T: 0, maxCell: 6 },
  x: parseAxis('mu=-1:3.9:40', 'x'), y: parseAxis('rb=1:2:20', 'y'), seed: 3,
};

async function both(plan: ScanPlan) {
  const dense = await runScan(pool, { kind: 'map', plan, dense: true });
  const adaptive = await runScan(pool, { kind: 'map', plan });
  const h = mapHeader(plan);
  const rows = (pts: typeof dense.points) => mapCsv(h, pts).split('\n');
  const d = rows(dense.points), a = rows(adaptive.points);
  const differing = d.filter((line, i) => line !== a[i]).length + Math.abs(d.length - a.length);
  return { dense, adaptive, differing };
}

describe('adaptive map = dense map, pixel for pixel', () => {
  it('1D vdw chain over mu x Rb: zero differing pixels, fewer solves, exact crystal boundaries', async () => {
    const { adaptive, differing } = await both(vdw);
    expect(differing).toBe(0);
    expect(adaptive.points).toHaveLength(800);
    expect(adaptive.solves).toBeLessThan(800);
    // confirming boundaries costs far less than the pixels (one solve per line side, not per crossing)
    const boundarySolves = adaptive.boundarySolves as number;
    expect(boundarySolves).toBeGreaterThan(0);
    expect(boundarySolves).toBeLessThan(((adaptive.solves as number) - boundarySolves) / 3);
    const exact = (adaptive.boundaries ?? []).filter((b) => b.firstOrder);
    expect(exact.length).toBeGreaterThan(0);
    for (const b of exact) {
      // a jump between crystals: rho changes by a difference of fractions with q <= Mmax (6)
      expect(Math.abs(b.densityJump as number)).toBeGreaterThanOrEqual(1 / 30 - 1e-12);
    }
    // a point of an exact line confirmed without its own solve is still a tie of its two
    // crystals: a full solve there finds one of them (no third state below)
    // (crossings sit on a grid line; a block centre joining a lone crossing does not)
    const onGrid = (pt: number[]) => vdw.x.values.includes(pt[0]) || (vdw.y as NonNullable<typeof vdw.y>).values.includes(pt[1]);
    const pts = exact.flatMap((b) => b.points.filter(onGrid).map((pt) => ({ b, pt }))).filter((_, i) => i % 7 === 3).slice(0, 12);
    expect(pts.length).toBeGreaterThan(3);
    for (const { b, pt } of pts) {
      const p = applyAxis(applyAxis(vdw.base, 'mu', pt[0]), 'rb', pt[1]);
      const s = solveGroundState(p, { seed: 1 });
      expect(b.phases).toContain(s.fraction ? `${s.phase} ${s.fraction}` : s.phase);
    }
  }, 300_000);

  it('the band pipeline does not depend on timing: one worker and two give the same solves, lines and pixels', async () => {
    // refinement, fill and boundary location overlap across bands; what they share is
    // touched in one fixed order, so the counts are those of any schedule (common practice)
    const plan: ScanPlan = { ...vdw, x: parseAxis('mu=-1:3.9:30', 'x'), y: parseAxis('rb=1:2:40', 'y') };
    const one = nodeEnginePool(1);
    try {
      const a = await runScan(one, { kind: 'map', plan });
      const b = await runScan(pool, { kind: 'map', plan });
      expect(b.solves).toBe(a.solves);
      expect(b.boundarySolves).toBe(a.boundarySolves);
      expect(JSON.stringify(b.boundaries)).toBe(JSON.stringify(a.boundaries));
      const h = mapHeader(plan);
      expect(mapCsv(h, b.points)).toBe(mapCsv(h, a.points));
    } finally {
      one.close();
    }
  }, 300_000);

  it('nn chain over mu x V1 with Mmax 4, and a line: zero differing pixels', async () => {
    const nn: ScanPlan = {
      base: { lattice: 'chain', interaction: { shape: 'nn', V1: 2 }, delta: 3, T: 0, maxCell: 4 },
      x: parseAxis('mu=-1:2.9:34', 'x'), y: parseAxis('v1=0.5:4:18', 'y'), seed: 5,
    };
    expect((await both(nn)).differing).toBe(0);
    expect((await both({ ...vdw, y: undefined, x: parseAxis('mu=-1:3.9:61', 'x') })).differing).toBe(0);
  }, 300_000);

  it('square lattice vdw over mu x Rb (Mmax 4): zero differing pixels', async () => {
    const sq: ScanPlan = {
      base: { lattice: 'square', interaction: { shape: 'vdw', Rb: 1.2 }, delta: 4, T: 0, maxCell: 4 },
      x: parseAxis('mu=-0.5:3.5:20', 'x'), y: parseAxis('rb=1:1.6:10', 'y'), seed: 2,
    };
    expect((await both(sq)).differing).toBe(0);
  }, 300_000);

  it('a T > 0 map is refined without certification: a note says so, every pixel solved in full or in its region\'s cell, pixels equal here', async () => {
    const warm: ScanPlan = { ...vdw, base: { ...vdw.base, T: 0.05 }, x: parseAxis('mu=0:2:17', 'x'), y: parseAxis('rb=1:2:9', 'y') };
    const { adaptive, differing } = await both(warm);
    // not guaranteed (a pocket touching no coarse point would be missed), but none exists on this map
    expect(differing).toBe(0);
    expect((adaptive.solves as number) + (adaptive.cellSolves as number)).toBe(17 * 9);
    expect(adaptive.solves).toBeLessThan(17 * 9);
    expect(adaptive.notes?.[0]).toMatch(/not certified \(at T > 0/);
  }, 300_000);

  it('a fixed-density map is refined without certification: fewer full solves, every phase, density and energy of the dense map', async () => {
    // not the dense lines in every digit (mu on a plateau, sublattice order and rounding may
    // differ: the density solver's trial mus follow the guess), so the physics is compared:
    // phase and pattern, rho to 1e-9, and the energy Omega + mu rho to 1e-9 (common practice)
    const dens: ScanPlan = { ...vdw, base: { ...vdw.base, rho: 0.3 }, x: parseAxis('density=0.05..0.9 x24', 'x'), y: parseAxis('rb=1..2 x12', 'y') };
    const dense = await runScan(pool, { kind: 'map', plan: dens, dense: true });
    const adaptive = await runScan(pool, { kind: 'map', plan: dens });
    expect(adaptive.notes?.[0]).toMatch(/not certified \(the density axis/);
    expect(adaptive.cellSolves as number).toBeGreaterThan(0);
    expect(adaptive.solves as number).toBeLessThan(24 * 12);
    let coexisting = 0;
    for (let i = 0; i < dense.points.length; i++) {
      const d = dense.points[i].state, a = adaptive.points[i].state;
      expect(a && d).toBeTruthy();
      if (!a || !d) continue;
      expect(`${a.phase} ${a.fraction}`).toBe(`${d.phase} ${d.fraction}`);
      expect(Math.abs(a.excitationDensity - d.excitationDensity)).toBeLessThan(1e-9);
      expect(Math.abs(a.grandPotential + a.mu * a.excitationDensity - d.grandPotential - d.mu * d.excitationDensity)).toBeLessThan(1e-9);
      expect(!!a.coexistence).toBe(!!d.coexistence);
      if (d.coexistence) coexisting++;
    }
    expect(coexisting).toBeGreaterThan(0);
  }, 300_000);

  it('shards: each adaptive (fewer solves than its pixels), merged they equal the dense map pixel for pixel', async () => {
    const dense = await runScan(pool, { kind: 'map', plan: vdw, dense: true });
    const parts = [];
    for (let k = 1; k <= 2; k++) {
      const part = await runScan(pool, { kind: 'map', plan: vdw, shard: { k, n: 2 } });
      expect(part.points.length).toBe(400);
      expect(part.solves as number).toBeLessThan(part.points.length);
      parts.push(...part.points);
    }
    parts.sort((a, b) => a.index - b.index);
    const h = mapHeader(vdw);
    expect(mapCsv(h, parts)).toBe(mapCsv(h, dense.points));
  }, 300_000);

  it('random off-grid points inside certified regions carry the certified crystal', async () => {
    const { adaptive } = await both({ ...vdw, x: parseAxis('mu=-1:3.9:24', 'x'), y: parseAxis('rb=1:2:12', 'y') });
    // neighbouring pixels with one crystal: the cell between them is certified by the argument
    let checked = 0, seed = 11;
    const pts = adaptive.points;
    for (let k = 0; k < pts.length && checked < 10; k += 7) {
      const p = pts[k];
      if (p.ix + 1 >= 24 || p.iy + 1 >= 12) continue;
      const quad = [k, k + 1, k + 24, k + 25].map((i) => crystalOf(pts[i].state)?.key);
      if (!quad[0] || quad.some((q) => q !== quad[0])) continue;
      const t = ((seed = (seed * 48271) % 2147483647) % 1000) / 1000, u = ((seed = (seed * 48271) % 2147483647) % 1000) / 1000;
      const mu = vdw.x.start + (p.ix + t) * 4.9 / 23, rb = 1 + (p.iy + u) / 11;
      const s = solveGroundState(applyAxis(applyAxis(vdw.base, 'mu', mu), 'rb', rb), { seed: k });
      expect(crystalOf(s)?.key).toBe(quad[0]);
      checked++;
    }
    expect(checked).toBeGreaterThan(3);
  }, 300_000);
});
