// `staircase` end to end: the plateau JSON shape and invariants, and its values in a case
// with closed forms: the nearest-neighbour chain (V1 = 1) far detuned (delta = 50).
// - The empty plateau ends where the condensate appears, at the lower polariton energy
//   mu_c = delta/2 - sqrt(delta^2/4 + 1) (Hopfield 1958; the empty state feels no V). A
//   plateau ends where alpha^2 reaches the condensate tolerance 1e-8 of DESIGN.md; alpha^2
//   grows from mu_c with slope d(alpha^2)/dmu ~ -mu_c/2 ~ 1/delta = 0.02 (from the T = 0
//   photon condition (delta - mu) = 1/(2E)), so that point lies ~1e-6 above mu_c; the
//   check allows 1e-5 (and the edge must not lie below mu_c by more than the 1e-9
//   bisection tolerance).
// - Classical nn chain (alpha = 0, T = 0): empty for mu < 0, half filling for
//   0 < mu < 2 V1 (two neighbours), filled above (common practice, no source). The cavity
//   moves these edges by O(g^2/delta) = 0.02, so they are checked to 3/delta = 0.06.
import { beforeAll, describe, expect, it } from 'vitest';
import { cli } from './test-io.ts';
import { SOURCES } from '../references.ts';

const delta = 50;
const args = ['staircase', '--mu=-0.5..3x36', '--interaction', 'nn', '--v1', '1', '--detuning', String(delta), '--max-cell', '4'];

describe('staircase', () => {
  let doc: any, code = -1;
  beforeAll(async () => {
    const r = await cli([...args, '--json']);
    code = r.code;
    doc = JSON.parse(r.out);
  });

  it(`finds the nn chain plateaus at their closed-form edges (${SOURCES.hopfield})`, async () => {
    expect(code).toBe(0);
    expect(doc.complete).toBe(true);
    expect(doc.points.length).toBe(36);
    const fr = doc.plateaus.map((p: { fraction: string }) => p.fraction);
    expect(fr).toEqual(['0/1', '1/2', '1/1']);
    const [empty, half, filled] = doc.plateaus;
    const muC = delta / 2 - Math.sqrt(delta ** 2 / 4 + 1);
    expect(empty.muHigh).toBeGreaterThan(muC - 1e-9);
    expect(empty.muHigh - muC).toBeLessThan(1e-5);
    expect(Math.abs(half.muLow - 0)).toBeLessThan(3 / delta);
    expect(Math.abs(half.muHigh - 2)).toBeLessThan(3 / delta);
    expect(Math.abs(filled.muLow - 2)).toBeLessThan(3 / delta);
    expect(empty.openLow && filled.openHigh && !half.openLow && !half.openHigh).toBe(true);
  });

  it('plateaus are ordered, disjoint, with width = muHigh - muLow, and hold their grid points', async () => {
    const ps = doc.plateaus as { fraction: string; muLow: number; muHigh: number; width: number; points: number }[];
    ps.forEach((p, i) => {
      expect(p.muLow).toBeLessThanOrEqual(p.muHigh);
      expect(p.width).toBe(p.muHigh - p.muLow);
      if (i > 0) expect(p.muLow).toBeGreaterThan(ps[i - 1].muHigh);
      const inside = doc.points.filter((s: { mu: number }) => s.mu >= p.muLow && s.mu <= p.muHigh);
      expect(inside.length).toBe(p.points);
      const [num, den] = p.fraction.split('/').map(Number);
      // on a plateau the filling is the fraction (saturation tolerance 1e-6 of DESIGN.md)
      for (const s of inside) expect(Math.abs(s.emitterDensity - num / den)).toBeLessThan(1e-6);
    });
  });

  it('prints a table for people; grid edges lie inside the bisected ones', async () => {
    const txt = await cli(args);
    expect(txt.out).toMatch(/^fraction\s+muLow\s+muHigh\s+width/m);
    expect(txt.out).toMatch(/^1\/2\s/m);
    const coarse = JSON.parse((await cli([...args, '--json', '--grid-edges'])).out);
    const fine = doc;
    coarse.plateaus.forEach((p: { muLow: number; muHigh: number }, i: number) => {
      expect(fine.plateaus[i].muLow).toBeLessThanOrEqual(p.muLow);
      expect(fine.plateaus[i].muHigh).toBeGreaterThanOrEqual(p.muHigh);
    });
  });

  it('refuses --density and a missing range', async () => {
    const a = await cli(['staircase', '--rb', '1', '--detuning', '3', '--density', '0.3', '--mu=0..1x3']);
    expect(a.code).toBe(2);
    expect(a.err).toMatch(/unknown flag --density for staircase/);
    const b = await cli(['staircase', '--rb', '1', '--detuning', '3']);
    expect(b.err).toMatch(/staircase needs --mu=START\.\.STOPxN/);
    const c = await cli(['staircase', '--rb', '1', '--detuning', '3', '--mu=0..1x0']);
    expect(c.err.trim()).toBe('atlas: --mu is an empty range (count 0)');
  });
});
