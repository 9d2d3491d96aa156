/**
 * Bad input to the model (common practice, no source): each throws an InputError whose
 * one-line message names the problem, from validateModel and from the solver's entry.
 */
import { describe, expect, it } from 'vitest';
import { defaultMaxCell, validateModel, type ModelParams } from '../../src/core/model.ts';
import { InputError } from '../../src/core/input-error.ts';
import { solveGroundState } from '../../src/core/meanfield/ground-state.ts';

const good: ModelParams = {
  lattice: 'chain', interaction: { shape: 'vdw', Rb: 1.5 }, delta: 1, T: 0, mu: 0, maxCell: 12,
};

/** Both entries refuse p with an InputError whose message matches `text` and is one line. */
function refused(p: ModelParams, text: RegExp, field?: string): void {
  for (const f of [() => validateModel(p), () => solveGroundState(p)]) {
    let err: unknown;
    try { f(); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(InputError);
    const e = err as InputError;
    expect(e.message).toMatch(text);
    expect(e.message).not.toContain('\n');
    if (field) expect(e.field).toBe(field);
  }
}

describe('model input', () => {
  it('accepts a good model and knows the default cell sizes', () => {
    expect(() => validateModel(good)).not.toThrow();
    expect(defaultMaxCell('chain')).toBe(12);
    expect(defaultMaxCell('square')).toBe(8);
  });

  it('refuses NaN and infinite numbers', () => {
    refused({ ...good, delta: NaN }, /detuning must be a finite number, got NaN/, 'detuning');
    refused({ ...good, mu: NaN }, /mu must be a finite number, got NaN/, 'mu');
    refused({ ...good, T: Infinity }, /temperature must be a finite number/, 'temperature');
    refused({ ...good, mu: undefined, rho: NaN }, /density must be a finite number/, 'density');
    refused({ ...good, interaction: { shape: 'vdw', Rb: NaN } }, /rb must be a finite number/, 'rb');
    refused({ ...good, interaction: { shape: 'nn', V1: NaN } }, /v1 must be a finite number/, 'v1');
  });

  it('refuses a negative temperature or density', () => {
    refused({ ...good, T: -0.1 }, /temperature must be >= 0, got -0.1/, 'temperature');
    refused({ ...good, mu: undefined, rho: -1 }, /density must be >= 0/, 'density');
  });

  it('refuses mu >= delta and says why', () => {
    refused({ ...good, mu: 1 }, /mu = 1 must be below the detuning 1: for mu >= delta the photon number is unbounded/, 'mu');
    refused({ ...good, mu: 3 }, /photon number is unbounded/, 'mu');
  });

  it('refuses both or neither of mu and density', () => {
    refused({ ...good, rho: 0.3 }, /exactly one of mu .* or density/);
    refused({ ...good, mu: undefined }, /exactly one of mu .* or density/);
  });

  it('refuses a power law without rb or v1, or with both', () => {
    refused({ ...good, interaction: { shape: 'vdw' } }, /the vdw shape needs rb or v1/, 'rb');
    refused({ ...good, interaction: { shape: 'dipolar' } }, /the dipolar shape needs rb or v1/, 'rb');
    refused({ ...good, interaction: { shape: 'vdw', Rb: 1, V1: 2 } }, /either the blockade radius rb or the strength v1/, 'rb');
    refused({ ...good, interaction: { shape: 'vdw', Rb: -1 } }, /rb must be > 0/, 'rb');
    refused({ ...good, interaction: { shape: 'nn' } }, /v1 must be a finite number/, 'v1');
  });

  it('refuses a bad max-cell or cell', () => {
    refused({ ...good, maxCell: 0 }, /max-cell must be an integer 1\.\.32 on the chain lattice, got 0/, 'max-cell');
    refused({ ...good, maxCell: 2.5 }, /max-cell must be an integer/, 'max-cell');
    refused({ ...good, maxCell: 33 }, /max-cell must be an integer 1\.\.32/, 'max-cell');
    refused({ ...good, lattice: 'square', maxCell: 13 }, /max-cell must be an integer 1\.\.12 on the square lattice/, 'max-cell');
    refused({ ...good, maxCell: NaN }, /max-cell must be an integer/, 'max-cell');
    refused({ ...good, cell: 0 }, /cell must be an integer/, 'cell');
  });

  it('refuses unknown names', () => {
    refused({ ...good, lattice: 'hexagon' as never }, /unknown lattice hexagon/, 'lattice');
    refused({ ...good, interaction: { shape: 'yukawa' as never, V1: 1 } }, /unknown interaction yukawa/, 'interaction');
  });
});
