/**
 * Brent's bounded minimiser (src/core/ed/bounded-minimum.ts) on functions whose minimum is
 * known in closed form (elementary calculus, no source).
 */
import { describe, it, expect } from 'vitest';
import { boundedMinimum } from '../../../src/core/ed/bounded-minimum.ts';
import { expectAbs } from '../../references.ts';

describe('bounded minimum (Brent, Algorithms for Minimization without Derivatives (1973), ch. 5)', () => {
  it('parabola with vertex at x = 0.3, f = 1 + 2 (x - 0.3)^2', () => {
    const r = boundedMinimum((x) => 1 + 2 * (x - 0.3) ** 2, 0, 1, 1e-10, 1e-12);
    // |x - x*| <= 2 (rel |x| + abs) ~ 1e-10 by the stopping rule; the parabola is found exactly by the
    // interpolation step, so 1e-9 leaves margin. f is quadratic there: 1e-15 + rounding.
    expectAbs(r.x, 0.3, 1e-9);
    expectAbs(r.fx, 1, 1e-14);
    expect(r.evaluations).toBeLessThan(200); // converged before the evaluation cap
  });

  it('cos x on [2, 4] has its minimum -1 at pi', () => {
    const r = boundedMinimum(Math.cos, 2, 4, 1e-10, 1e-12);
    // f = -1 + dx^2/2 is flat: f is rounded to eps ~ 1e-16, so x is determined only to
    // sqrt(2 eps) ~ 1.5e-8 (Brent, ch. 5); 1e-7 allows that.
    expectAbs(r.x, Math.PI, 1e-7);
    expectAbs(r.fx, -1, 1e-15);
  });

  it('a monotone function: the minimum sits at the bracket end', () => {
    const r = boundedMinimum((x) => x, 1, 2, 1e-10, 1e-10);
    expect(r.x).toBeGreaterThanOrEqual(1);
    expectAbs(r.x, 1, 1e-8); // within a few tol(x) = 1e-10 |x| + 1e-10 of the end
  });
});
