/**
 * Phase labels (the table of DESIGN.md, "Phase labels"), pattern fractions, continued
 * fractions and the reduction of a state to its primitive cell. Check values: the table
 * itself with its stated tolerances; continued-fraction convergents of pi (355/113, a
 * classical value, e.g. Hardy and Wright, An Introduction to the Theory of Numbers, ch. X);
 * hand-built patterns whose period is known by construction (common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { bestRational, classifyPhase, patternFraction } from '../../../src/core/meanfield/phase.ts';
import { reduceToPrimitive, isPrimitive, sameUpToTranslation } from '../../../src/core/meanfield/pattern.ts';
import { period, supercell } from '../../../src/core/lattice/supercells.ts';
import { solveGroundState } from '../../../src/core/meanfield/ground-state.ts';
import { SOURCES } from '../../references.ts';

describe('phase labels (DESIGN.md table, default tolerances)', () => {
  it('labels each row of the table at its thresholds', () => {
    expect(classifyPhase([0, 0], 0)).toEqual({ phase: 'empty', fraction: null });
    expect(classifyPhase([9.9e-7, 5e-7], 0).phase).toBe('empty');
    expect(classifyPhase([1, 1 - 9e-7], 0).phase).toBe('filled');
    expect(classifyPhase([2e-6, 2e-6], 0).phase).toBe('normal'); // above the empty threshold
    expect(classifyPhase([0.3, 0.3 + 0.9e-4], 0).phase).toBe('normal'); // modulation below 1e-4
    expect(classifyPhase([1, 0, 0], 0)).toEqual({ phase: 'density-wave', fraction: '1/3' });
    expect(classifyPhase([0.3, 0.3], 1e-8)).toEqual({ phase: 'superradiant', fraction: null });
    expect(classifyPhase([0.3, 0.3], 0.99e-8).phase).toBe('normal'); // alpha^2 below 1e-8
    expect(classifyPhase([0.9, 0.1, 0.9, 0.1], 0.02)).toEqual({ phase: 'supersolid', fraction: '1/2' });
  });

  it('tolerances are settable', () => {
    expect(classifyPhase([0.3, 0.3], 1e-6, { condensate: 1e-5 }).phase).toBe('normal');
    expect(classifyPhase([0.3, 0.301], 0, { modulation: 1e-2 }).phase).toBe('normal');
    expect(classifyPhase([1e-4, 1e-4], 0, { saturation: 1e-3 }).phase).toBe('empty');
  });

  it('names the pattern fraction (# m_s > 1/2)/M, reduced', () => {
    expect(patternFraction([1, 0, 1, 0, 0, 0])).toBe('1/3');
    expect(patternFraction([1, 1, 0, 1, 1, 0, 1, 0, 0, 1, 0, 1])).toBe('7/12');
    // Dilute supersolid with no sublattice above 1/2: the sublattices above the midpoint.
    expect(patternFraction([0.0003, 0.29])).toBe('1/2');
  });
});

describe('continued fractions', () => {
  it('best rational approximations', () => {
    expect(bestRational(Math.PI, 200)).toEqual([355, 113]); // classical convergent of pi
    expect(bestRational(Math.PI, 100)).toEqual([311, 99]); // semiconvergent (best with q <= 100)
    expect(bestRational(5 / 12, 12)).toEqual([5, 12]);
    expect(bestRational(0.4166666666, 12)).toEqual([5, 12]);
    expect(bestRational(0, 12)).toEqual([0, 1]);
    expect(bestRational(1, 12)).toEqual([1, 1]);
  });
});

describe('primitive cells', () => {
  it('a 12-site 1D pattern of period 3 reduces to the period-3 cell', () => {
    const m = Array.from({ length: 12 }, (_, s) => [0.9, 0.1, 0.1][s % 3]);
    const r = reduceToPrimitive(period(12), [m], 1e-12);
    expect(r.cell.M).toBe(3);
    expect(r.arrays[0]).toEqual([0.9, 0.1, 0.1]);
    expect(isPrimitive(period(12), [m])).toBe(false);
    expect(isPrimitive(period(3), [[0.9, 0.1, 0.1]])).toBe(true);
  });

  it('a 2D checkerboard in a 2x2 cell reduces to the 2-site cell [[2,1],[0,1]]', () => {
    const cell = supercell(2, 0, 2); // sites (0,0), (1,0), (0,1), (1,1)
    const m = [1, 0, 0, 1]; // occupied where i + j is even
    const r = reduceToPrimitive(cell, [m], 1e-12);
    expect(r.cell).toMatchObject({ M: 2, a: 2, b: 1, c: 1 });
    expect(r.arrays[0]).toEqual([1, 0]);
    // A stripe along x in the same cell reduces to [[1,0],[0,2]].
    const stripe = reduceToPrimitive(cell, [[1, 1, 0, 0]], 1e-12);
    expect(stripe.cell).toMatchObject({ M: 2, a: 1, b: 0, c: 2 });
  });

  it('translations are recognised', () => {
    expect(sameUpToTranslation(period(4), [1, 0, 0, 0], [0, 0, 1, 0], 0)).toBe(true);
    expect(sameUpToTranslation(period(4), [1, 1, 0, 0], [1, 0, 1, 0], 0)).toBe(false);
  });

  it('the solver reports a state on its primitive cell with its fraction', () => {
    // Classical limit at the middle of the 1/3 plateau (SOURCES.wignerLattice): a period-3
    // state, found also in the 6, 9 and 12 cells, is reported with cellSize 3.
    const s = solveGroundState({ lattice: 'chain', interaction: { shape: 'vdw', Rb: 1.5 }, delta: 1e6, T: 0, mu: 0.5, maxCell: 12 });
    expect(s.cellSize, SOURCES.wignerLattice).toBe(3);
    expect(s.fraction).toBe('1/3');
    expect([...s.sublatticeDensities].sort()).toEqual([0, 0, 1]);
  });
});
