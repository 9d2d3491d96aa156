import { describe, it, expect } from 'vitest';
import { arrayCluster, parseSiteCsv } from '../../../src/core/cluster/site-array.ts';
import { InputError } from '../../../src/core/input-error.ts';
import { expectRel } from '../../references.ts';

describe('user arrays from CSV: open boundaries', () => {
  it('parses x,y lines with a header, comments, blank lines, CRLF and a spacing in um', () => {
    const text = 'x,y\r\n# a planned pattern\n0, 0\n\n5,0\r\n2.5 , 4.330127018922193\n';
    const pos = parseSiteCsv(text, 5);
    // exact: division by the spacing only.
    expect(pos).toEqual([0, 0, 1, 0, 0.5, 4.330127018922193 / 5]);
    expect(parseSiteCsv('1,2')).toEqual([1, 2]);
  });

  it('refuses bad CSV with a message naming the line', () => {
    const bad = (t: string, re: RegExp, spacing?: number) => {
      expect(() => parseSiteCsv(t, spacing)).toThrow(InputError);
      expect(() => parseSiteCsv(t, spacing)).toThrow(re);
    };
    bad('0,0\n1,2,3\n', /line 2: expected two numbers x,y/);
    bad('0,0\n1;2\n', /line 2/);
    bad('0,0\nfoo,1\n', /line 2: x is not a number: "foo"/);
    bad('0,0\n1,\n', /line 2: y is not a number/);
    bad('# nothing\n\n', /no sites/);
    bad('0,0', /spacing must be > 0/, 0);
    bad('0,0\n1,1e999\n', /line 2: y is not a number/);
  });

  it('refuses coincident sites and sites closer than 0.05 a, naming both and the threshold', () => {
    expect(() => arrayCluster('square', [0, 0, 1, 0, 0, 0], { shape: 'vdw', Rb: 1 })).toThrow(/sites 1 \(0, 0\) and 3 \(0, 0\).*0\.05/);
    // Issue 10: 1e-3 a apart gave a wrong ED energy, 1e-6 a NaN.
    for (const d of [1e-3, 1e-6, 0.049]) {
      expect(() => arrayCluster('square', [0, 0, 2, 0, d, 0], { shape: 'vdw', Rb: 1 })).toThrow(/sites 1 .* and 3 .*closer than 0\.05 a/);
    }
    expect(() => arrayCluster('square', [0, 0, 0.05, 0], { shape: 'vdw', Rb: 1 })).not.toThrow();
  });

  it('refuses arrays whose unit-spacing box is beyond 1e6 points (far apart in 2D, coordinates like 1e300)', () => {
    expect(() => arrayCluster('square', [0, 0, 1e4, 1e4], { shape: 'vdw', Rb: 1 })).toThrow(/momentum grid .* exceeds the limit of 1000000/);
    expect(() => arrayCluster('square', [0, 0, 1e300, 0], { shape: 'vdw', Rb: 1 })).toThrow(/exceeds the limit/);
    expect(() => arrayCluster('square', [-1e300, 0, 1e300, 1e300], { shape: 'vdw', Rb: 1 })).toThrow(/exceeds the limit/);
  });

  it('V_ij = 2 Rb^6 / r^6 with plain distances, no images (closed form)', () => {
    const Rb = 1.3, pos = [0, 0, 1, 0, 3, 0, 0, 2];
    const c = arrayCluster('square', pos, { shape: 'vdw', Rb });
    const r = (i: number, j: number) => Math.hypot(pos[2 * i] - pos[2 * j], pos[2 * i + 1] - pos[2 * j + 1]);
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) {
      // tolerance 1e-14: one power and a division.
      if (i === j) expect(c.V[i * 4 + j]).toBe(0);
      else expectRel(c.V[i * 4 + j], (2 * Rb ** 6) / r(i, j) ** 6, 1e-14);
    }
    // distinct distances 1, 2, 3, sqrt5, sqrt13 -> five shells.
    expect(Array.from(c.shells)).toHaveLength(5);
  });

  it('a full 3x2 rectangle gets the 3x2 momentum grid', () => {
    const pos = [0, 0, 1, 0, 2, 0, 0, 1, 1, 1, 2, 1];
    const c = arrayCluster('square', pos, { shape: 'nn', V1: 1 });
    expect(c.momenta.length / 2).toBe(6);
    const kx = new Set(Array.from({ length: 6 }, (_, q) => Math.round((c.momenta[2 * q] * 3) / (2 * Math.PI))));
    expect([...kx].sort()).toEqual([-1, 0, 1]);
  });
});
