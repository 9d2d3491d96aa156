/**
 * The operating point's tolerances: first-order propagation of uncorrelated uncertainties,
 * sigma_f^2 = sum (df/dx_i)^2 sigma_i^2 (JCGM 100:2008, eq. 10; common practice). The
 * expected values are worked out by hand beside each check, at inputs chosen so the
 * arithmetic is exact; a central difference of labToModel checks the derivatives
 * independently of the closed forms.
 */
import { describe, it, expect } from 'vitest';
import { LINEAR_LIMIT, operatingPoint } from '../../../src/core/lab/operating-point.ts';
import { labToModel, type LabNumbers } from '../../../src/core/lab/units.ts';
import { InputError } from '../../../src/core/input-error.ts';
import { expectRel } from '../../references.ts';

// C6/h = 64 GHz um^6 and 2g = 1000 MHz: Rb = (64000 / 1000)^(1/6) = 2 um (closed form).
const LAB: LabNumbers = {
  c6GHzUm6: 64, spacingUm: 1, coupling: { kind: 'collective', splittingMHz: 1000 },
  detuningMHz: 1500, muMHz: 250, temperatureK: 0,
};

describe('operating point: first-order tolerances', () => {
  it('matches the hand-worked closed forms', () => {
    const p = operatingPoint(LAB, { spacingUm: 0.01, detuningMHz: 50, muMHz: 10 });
    // Rb/a = 2 / 1 = 2, sigma = 2 * 0.01 / 1 = 0.02. A pow and a root: 1e-14.
    expectRel(p.rbOverA.value, 2, 1e-14);
    expectRel(p.rbOverA.sigma, 0.02, 1e-14);
    // V1 = 2 * 2^6 = 128, sigma = 6 * 128 * 0.01 = 7.68. Rounding of the sixth power: 1e-13.
    expectRel(p.V1.value, 128, 1e-13);
    expectRel(p.V1.sigma, 7.68, 1e-13);
    // g = 500 MHz: delta = 1500/500 = 3 +- 50/500 = 0.1; mu = 250/500 = 0.5 +- 10/500 = 0.02.
    expectRel(p.delta.value, 3, 1e-15);
    expectRel(p.delta.sigma, 0.1, 1e-15);
    expectRel(p.mu.value, 0.5, 1e-15);
    expectRel(p.mu.sigma, 0.02, 1e-15);
    // 6 * 0.01 = 0.06 is below the linear limit 0.2.
    expect(p.linear).toBe(true);
  });

  it('derivatives agree with a central difference of the unit conversion', () => {
    const a = 3.7, sa = 0.05, h = 1e-4;
    const lab = { ...LAB, spacingUm: a };
    const p = operatingPoint(lab, { spacingUm: sa, detuningMHz: 0, muMHz: 0 });
    const at = (x: number) => labToModel({ ...lab, spacingUm: x });
    // central difference: truncation error f''' h^2 / 6 relative ~ (7*8/6) (h/a)^2 ~ 7e-9 for V1 ~ a^-6; 1e-7 allows for it and rounding.
    const dRb = (at(a + h).rbOverA - at(a - h).rbOverA) / (2 * h);
    const dV1 = (at(a + h).V1 - at(a - h).V1) / (2 * h);
    expectRel(p.rbOverA.sigma, Math.abs(dRb) * sa, 1e-7);
    expectRel(p.V1.sigma, Math.abs(dV1) * sa, 1e-7);
    // exact uncertainties of zero give zero widths
    expect(p.delta.sigma).toBe(0);
    expect(p.mu.sigma).toBe(0);
  });

  it('is first order: the exact half-interval differs by O((sigma/a)^2)', () => {
    // V1 ~ a^-6: [V1(a - s) - V1(a + s)] / 2 = V1 (6 r + 56 r^3 + ...) with r = s/a, so the
    // first-order box is short by 56/6 r^2 relative: 9.33e-4 at r = 0.01 (Taylor series by hand).
    const p = operatingPoint(LAB, { spacingUm: 0.01, detuningMHz: 0, muMHz: 0 });
    const half = (labToModel({ ...LAB, spacingUm: 0.99 }).V1 - labToModel({ ...LAB, spacingUm: 1.01 }).V1) / 2;
    // the next term, 252 r^5, changes that correction by (252/56) r^2 = 4.5e-4 of itself: 1e-2 relative is ample
    expectRel(half / p.V1.sigma - 1, (56 / 6) * 1e-4, 1e-2);
  });

  it('flags a spacing uncertainty too large for the linear box, and refuses bad entries by field', () => {
    // 6 * 0.04 = 0.24 > LINEAR_LIMIT = 0.2
    expect(LINEAR_LIMIT).toBe(0.2);
    expect(operatingPoint(LAB, { spacingUm: 0.04, detuningMHz: 0, muMHz: 0 }).linear).toBe(false);
    const field = (u: { spacingUm: number; detuningMHz: number; muMHz: number }) => {
      try { operatingPoint(LAB, u); return null; } catch (e) { expect(e).toBeInstanceOf(InputError); return (e as InputError).field; }
    };
    expect(field({ spacingUm: -0.1, detuningMHz: 0, muMHz: 0 })).toBe('dspacing');
    expect(field({ spacingUm: 1, detuningMHz: 0, muMHz: 0 })).toBe('dspacing');
    expect(field({ spacingUm: 0, detuningMHz: NaN, muMHz: 0 })).toBe('ddetuning');
    expect(field({ spacingUm: 0, detuningMHz: 0, muMHz: -1 })).toBe('dmu');
  });
});
