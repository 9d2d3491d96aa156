import { describe, it, expect } from 'vitest';
import {
  KB_OVER_H_MHZ_PER_K, blockadeRadiusUm, collectiveCouplingMHz, labToModel, modelToLab,
} from '../../../src/core/lab/units.ts';
import { sitesInsideBlockade, shellsInsideBlockade } from '../../../src/core/lab/regime.ts';
import { InputError } from '../../../src/core/input-error.ts';
import { expectRel } from '../../references.ts';

// Exact SI constants (BIPM SI Brochure, 9th ed., 2019): k_B = 1.380649e-23 J/K, h = 6.62607015e-34 J s.
// k_B/h = 20.83661912 GHz/K; quoted to 10 digits, so 1e-9 relative.
describe('lab units', () => {
  it('k_B/h is the exact SI ratio', () => {
    expectRel(KB_OVER_H_MHZ_PER_K, 20836.61912, 1e-9);
  });

  it('collective coupling g = g0 sqrt(N) or half the splitting', () => {
    // closed form computed here; exact arithmetic up to one rounding, 1e-14.
    expectRel(collectiveCouplingMHz({ kind: 'single', g0MHz: 0.25, emitters: 400 }), 5, 1e-14);
    expectRel(collectiveCouplingMHz({ kind: 'collective', splittingMHz: 12 }), 6, 1e-14);
  });

  it('Rb = (C6/(2g))^(1/6) with C6 in GHz um^6 and g in MHz', () => {
    // C6/h = 64 GHz um^6 = 64000 MHz um^6, g = 500 MHz: C6/(2g) = 64 um^6, Rb = 2 um (closed form).
    expectRel(blockadeRadiusUm(64, 500), 2, 1e-14);
  });

  it('lab -> model: V(Rb) = 2g, V1 = 2 (Rb/a)^6, energies in g, T via k_B/h', () => {
    const lab = {
      c6GHzUm6: 140, spacingUm: 3, coupling: { kind: 'single' as const, g0MHz: 0.5, emitters: 100 },
      detuningMHz: 15, muMHz: -2.5, temperatureK: 1e-4,
    };
    const m = labToModel(lab);
    expectRel(m.gMHz, 5, 1e-14);
    // Independent check of the defining property: C6/Rb^6 in MHz equals 2g (1e-12: one pow and a root).
    expectRel((lab.c6GHzUm6 * 1e3) / Math.pow(m.rbUm, 6), 2 * m.gMHz, 1e-12);
    // V(a)/g = C6/(a^6 g) computed directly.
    expectRel(m.V1, (lab.c6GHzUm6 * 1e3) / Math.pow(lab.spacingUm, 6) / m.gMHz, 1e-12);
    expectRel(m.delta, 3, 1e-14);
    expectRel(m.mu, -0.5, 1e-14);
    // 100 uK: k_B T/h = 2.0836619 MHz, over g = 5 MHz.
    expectRel(m.T, 2.083661912 / 5, 1e-9);
  });

  it('model -> lab inverts lab -> model', () => {
    const lab = {
      c6GHzUm6: 870, spacingUm: 4.2, coupling: { kind: 'collective' as const, splittingMHz: 9 },
      detuningMHz: -3, muMHz: -7, temperatureK: 2.5e-5,
    };
    const m = labToModel(lab);
    const back = modelToLab(m, lab.c6GHzUm6, m.gMHz);
    // round trip through pow(x, 1/6) and back: 1e-12 relative.
    expectRel(back.spacingUm, lab.spacingUm, 1e-12);
    expectRel(back.detuningMHz, lab.detuningMHz, 1e-12);
    expectRel(back.muMHz, lab.muMHz, 1e-12);
    expectRel(back.temperatureK, lab.temperatureK, 1e-12);
  });

  it('refuses bad lab input with the field named', () => {
    const ok = {
      c6GHzUm6: 100, spacingUm: 3, coupling: { kind: 'single' as const, g0MHz: 1, emitters: 10 },
      detuningMHz: 1, muMHz: 0, temperatureK: 0,
    };
    const field = (f: () => unknown) => { try { f(); } catch (e) { return (e as InputError).field; } return null; };
    expect(field(() => labToModel({ ...ok, spacingUm: 0 }))).toBe('spacing');
    expect(field(() => labToModel({ ...ok, c6GHzUm6: -1 }))).toBe('c6');
    expect(field(() => labToModel({ ...ok, temperatureK: -1 }))).toBe('temperature');
    expect(field(() => labToModel({ ...ok, coupling: { kind: 'single', g0MHz: 1, emitters: 2.5 } }))).toBe('emitters');
    expect(field(() => labToModel({ ...ok, detuningMHz: NaN }))).toBe('detuning');
  });
});

describe('blockade regime', () => {
  it('counts the sites inside the blockade disc', () => {
    // Coordination shells by hand (common practice, no source): chain 2 per shell at r = 1, 2, ...;
    // square 4 at 1, 4 at sqrt 2, 4 at 2; triangular 6 at 1, 6 at sqrt 3, 6 at 2.
    expect(sitesInsideBlockade('chain', 0.9)).toBe(0);
    expect(sitesInsideBlockade('chain', 2.5)).toBe(4);
    expect(sitesInsideBlockade('square', 1.5)).toBe(8);
    expect(sitesInsideBlockade('square', 2.1)).toBe(12);
    expect(sitesInsideBlockade('triangular', 1.8)).toBe(12);
    expect(shellsInsideBlockade('triangular', 2.1).length).toBe(3);
  });
});
