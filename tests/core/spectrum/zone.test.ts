/**
 * Crystal momentum in a supercell's zone (src/core/spectrum/zone.ts), checked by properties
 * stated from the definitions (common practice, no source): fractional coordinates
 * f_i = k . A_i / 2 pi invert k = f1 B1 + f2 B2 (A_i . B_j = 2 pi delta_ij); reciprocal
 * superlattice vectors are zone centres; the reduced k differs from k or -k by a reciprocal
 * superlattice vector and is no longer than any such representative (brute search here).
 * Named points: the chain's zone edge pi/M, the square lattice's M = (pi, pi) and the
 * triangular lattice's K = (4 pi/3, 0) (standard Brillouin-zone geometry, e.g. Ashcroft and
 * Mermin, Solid State Physics (1976), ch. 5).
 */
import { describe, it, expect } from 'vitest';
import seedrandom from 'seedrandom';
import { fractional, fromFractional, isZoneCentre, kOut, reduceToZone } from '../../../src/core/spectrum/zone.ts';
import { lattice } from '../../../src/core/lattice/geometry.ts';
import { period, supercell } from '../../../src/core/lattice/supercells.ts';
import { expectAbs } from '../../references.ts';

const PI = Math.PI;

describe('zone of a supercell', () => {
  const cases = [
    { l: lattice('square'), cell: supercell(2, 1, 3) },
    { l: lattice('triangular'), cell: supercell(3, 2, 2) },
    { l: lattice('square'), cell: supercell(1, 0, 1) },
  ];

  it('fractional and fromFractional are inverse; integer f is a zone centre, half-integer is not', () => {
    for (const { l, cell } of cases) {
      for (const f of [[0.3, -0.7], [1.25, 2], [0, 0.5]] as [number, number][]) {
        const g = fractional(l, cell, fromFractional(l, cell, f));
        // a 2x2 change of basis and back: rounding ~1e-15 of entries ~ 10; 1e-12
        expectAbs(g[0], f[0], 1e-12); expectAbs(g[1], f[1], 1e-12);
      }
      expect(isZoneCentre(l, cell, fromFractional(l, cell, [2, -3]))).toBe(true);
      expect(isZoneCentre(l, cell, [0, 0])).toBe(true);
      expect(isZoneCentre(l, cell, fromFractional(l, cell, [0.5, 0]))).toBe(false);
    }
  });

  it('reduceToZone: equivalent to k or -k, and the shortest such vector (brute search)', () => {
    const rng = seedrandom('zone');
    for (const { l, cell } of cases) {
      for (let t = 0; t < 40; t++) {
        const k: [number, number] = [20 * rng() - 10, 20 * rng() - 10];
        const q = reduceToZone(l, cell, k);
        const fk = fractional(l, cell, k), fq = fractional(l, cell, q);
        const integer = (x: number) => Math.abs(x - Math.round(x)) < 1e-9;
        const same = integer(fq[0] - fk[0]) && integer(fq[1] - fk[1]);
        const opposite = integer(fq[0] + fk[0]) && integer(fq[1] + fk[1]);
        expect(same || opposite).toBe(true);
        let shortest = Infinity;
        for (const sg of [1, -1]) for (let i = -15; i <= 15; i++) for (let j = -15; j <= 15; j++) {
          const p = fromFractional(l, cell, [sg * fk[0] - i, sg * fk[1] - j]);
          shortest = Math.min(shortest, Math.hypot(p[0], p[1]));
        }
        expectAbs(Math.hypot(q[0], q[1]), shortest, 1e-9);
      }
    }
  });

  it('chain: |k| folded into [0, pi/M]', () => {
    const l = lattice('chain'), cell = period(3);
    for (const k of [0.2, -0.2, 2.2, 7.3, -100]) {
      const [q, qy] = reduceToZone(l, cell, [k, 0]);
      expect(qy).toBe(0);
      expect(q).toBeGreaterThanOrEqual(0);
      expect(q).toBeLessThanOrEqual(PI / 3 + 1e-12);
      // k = +-q modulo 2 pi / 3
      const r = (x: number) => Math.abs(x / ((2 * PI) / 3) - Math.round(x / ((2 * PI) / 3)));
      expect(Math.min(r(k - q), r(k + q))).toBeLessThan(1e-9);
    }
    expect(kOut(l, [0.5, 0])).toBe(0.5);
  });

  it('named zone corners: square M = (pi, pi), triangular K = (4 pi/3, 0)', () => {
    const sq = lattice('square'), tri = lattice('triangular'), one = supercell(1, 0, 1);
    for (const k of [[PI, -PI], [-PI, PI], [3 * PI, PI]] as [number, number][]) {
      const q = reduceToZone(sq, one, k);
      expectAbs(q[0], PI, 1e-12); expectAbs(q[1], PI, 1e-12);
    }
    // K of the triangular lattice is at |k| = 4 pi/3 (the zone is a hexagon of that circumradius).
    const q = reduceToZone(tri, one, [-4 * PI / 3, 0]);
    expectAbs(q[0], (4 * PI) / 3, 1e-12); expectAbs(q[1], 0, 1e-12);
    expect(kOut(tri, q)).toEqual([q[0], q[1]]);
  });
});
