import { describe, it } from 'vitest';
import { erfc, expint1, gammaHalfInteger, upperGamma } from '../../../src/core/numerics/incomplete-gamma.ts';
import { expectRel } from '../../references.ts';

// Check values: closed forms computed here, and handbook values of Abramowitz and Stegun
// (Handbook of Mathematical Functions, 1964), tables 7.1 and 5.1, quoted from memory to
// the digits shown. Tolerances: 1e-14 relative for closed forms (rounding), the quoted
// digits for table values.
describe('special functions for the Ewald sums', () => {
  it('erfc matches handbook values on both sides of the series/continued-fraction switch', () => {
    expectRel(erfc(0.5), 0.4795001221869535, 1e-14); // A&S table 7.1: erf(0.5) = 0.5204998778130465
    expectRel(erfc(1), 0.15729920705028513, 1e-14); // erf(1) = 0.8427007929497149
    expectRel(erfc(3), 2.209049699858544e-5, 1e-13);
    expectRel(erfc(-1), 2 - 0.15729920705028513, 1e-15);
    // continuity at the switch x = 2.5 against the asymptotic series e^{-x^2}/(x sqrt pi) (1 - 1/(2x^2) + 3/(4x^4) - 15/(8x^6) + 105/(16x^8))
    const x = 6, x2 = x * x;
    const asym = (Math.exp(-x2) / (x * Math.sqrt(Math.PI))) * (1 - 1 / (2 * x2) + 3 / (4 * x2 ** 2) - 15 / (8 * x2 ** 3) + 105 / (16 * x2 ** 4));
    expectRel(erfc(x), asym, 1e-6); // first omitted term 945/(32 x^10) ~ 5e-7 relative bounds the error
  });

  it('E1 matches handbook values (A&S 5.1)', () => {
    expectRel(expint1(0.5), 0.5597735947761608, 1e-14);
    expectRel(expint1(1), 0.21938393439552029, 1e-14);
    expectRel(expint1(2), 0.04890051070806112, 1e-13);
  });

  it('Gamma(a, x) equals its closed forms for integer and half-integer a', () => {
    for (const x of [0.01, 0.7, 3, 20]) {
      expectRel(upperGamma(3, x), Math.exp(-x) * (x * x + 2 * x + 2), 1e-13);
      expectRel(upperGamma(1.5, x), Math.sqrt(x) * Math.exp(-x) + (Math.sqrt(Math.PI) / 2) * erfc(Math.sqrt(x)), 1e-13);
      // Gamma(-1/2, x) = 2 e^{-x}/sqrt(x) - 2 sqrt(pi) erfc(sqrt x)   (A&S 6.5.22 recurrence)
      expectRel(upperGamma(-0.5, x), (2 * Math.exp(-x)) / Math.sqrt(x) - 2 * Math.sqrt(Math.PI) * erfc(Math.sqrt(x)), 1e-10);
      // Gamma(-1, x) = e^{-x}/x - E1(x)
      expectRel(upperGamma(-1, x), Math.exp(-x) / x - expint1(x), 1e-10);
    }
    expectRel(gammaHalfInteger(3), 2, 1e-15);
    expectRel(gammaHalfInteger(2.5), 0.75 * Math.sqrt(Math.PI), 1e-15);
  });
});
