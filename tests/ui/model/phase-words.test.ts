// A locked filling against a pattern's period (issue 11, item 6): the page's words and the
// map's new lockedFilling column. States built by hand; the expected words follow from
// DESIGN.md's phase table and plateau rule (closed-form densities, exact comparison).
import { describe, it, expect } from 'vitest';
import type { MeanFieldState } from '../../../src/core/meanfield/state.ts';
import { phaseWords, regionWord } from '../../../src/ui/model/phase-words.ts';
import { mapCsv, mapHeader, mapJson } from '../../../src/formats/map-columns.ts';
import { parseAxis } from '../../../src/core/scan/axes.ts';

function state(phase: MeanFieldState['phase'], fraction: string | null, m: number[], photonDensity: number): MeanFieldState {
  const emitterDensity = m.reduce((a, b) => a + b, 0) / m.length;
  return {
    phase, fraction, cellSize: m.length, cell: { a: m.length, b: 0, c: 1 }, sublatticeDensities: m,
    sublatticeCoherences: m.map(() => 0), alpha: Math.sqrt(photonDensity), emitterDensity, photonDensity,
    excitationDensity: emitterDensity + photonDensity, grandPotential: -1, mu: 1, delta: 3, T: 0,
  };
}

// a T = 0 crystal: every sublattice empty or full, no condensate -> density locked at 1/2
const locked = state('density-wave', '1/2', [1, 0], 0);
// a supersolid of period 2 with rho = 0.26: "1/2" is the pattern, not a filling
const supersolid = state('supersolid', '1/2', [0.4, 0.1], 0.01);
// a thermal density wave (T > 0): sublattices 0.8 and 0.04, rho = 0.42, not locked
const thermal = { ...state('density-wave', '1/2', [0.8, 0.04], 0), T: 0.2 };

describe('phase words', () => {
  it('a locked density is a filling; a supersolid or thermal pattern is a pattern', () => {
    expect(phaseWords(locked, 12)).toBe('density wave, filling 1/2');
    expect(phaseWords(supersolid, 12)).toBe('supersolid, pattern 1/2');
    expect(phaseWords(thermal, 12)).toBe('density wave, pattern 1/2');
    expect(regionWord(locked, 12)).toBe('1/2');
    expect(regionWord(supersolid, 12)).toBe('p 1/2');
  });

  it('the map CSV and JSON carry lockedFilling beside an unchanged fraction', () => {
    const x = parseAxis('mu=0:1:3', 'x');
    const plan = { base: { lattice: 'chain' as const, interaction: { shape: 'vdw' as const, Rb: 1.5 }, delta: 3, T: 0, maxCell: 12 }, x, seed: 1 };
    const pts = [locked, supersolid, thermal].map((s, i) => ({ index: i, ix: i, iy: 0, state: s }));
    const [head, ...rows] = mapCsv(mapHeader(plan), pts).trimEnd().split('\n');
    const names = head.split(',');
    const col = (r: string, n: string) => r.split(',')[names.indexOf(n)];
    expect(rows.map((r) => col(r, 'fraction'))).toEqual(['1/2', '1/2', '1/2']);
    expect(rows.map((r) => col(r, 'lockedFilling'))).toEqual(['1/2', '', '']);
    const doc = JSON.parse(mapJson(mapHeader(plan), pts, true)) as { points: { fraction: string; lockedFilling: string | null }[] };
    expect(doc.points.map((p) => p.lockedFilling)).toEqual(['1/2', null, null]);
    expect(doc.points.map((p) => p.fraction)).toEqual(['1/2', '1/2', '1/2']);
  });
});
