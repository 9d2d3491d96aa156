/**
 * Newton steps on a function whose Hessian H may be indefinite (a mean-field energy near a
 * saddle or a maximum): the Levenberg-Marquardt shift (Levenberg, Q. Appl. Math. 2, 164
 * (1944); Nocedal and Wright, Numerical Optimization, 2nd ed. (2006), sec. 3.4) and the
 * direction of most negative curvature by inverse iteration with the shifted factor
 * (Nocedal and Wright, sec. 4.3). H is symmetric, row-major, n x n.
 */
import { ConvergenceError } from '../convergence-error.ts';
import { cholesky, choleskySolve } from './dense-solve.ts';

/** Quadruplings of the shift tried before giving up (1e-8 |H| * 4^200 is far past any |H|). */
const MAX_SHIFT_TRIES = 200;

/**
 * Factor H + shift I = L L^T with the least shift (up to a factor 4, then doubled for a
 * margin) that makes it positive definite, starting at 1e-8 max|H_ii|; 0 when H is. A
 * non-finite H (an interaction beyond what double precision holds) is a ConvergenceError,
 * as is a shift that never succeeds: the loop is capped.
 */
export function levenbergFactor(H: Float64Array, n: number, L: Float64Array): number {
  let diagMax = 0;
  for (let i = 0; i < n * n; i++) {
    if (!Number.isFinite(H[i])) throw new ConvergenceError('Newton step', `the Hessian holds a non-finite entry (${H[i]})`);
  }
  for (let i = 0; i < n; i++) diagMax = Math.max(diagMax, Math.abs(H[i * n + i]));
  if (cholesky(H, n, 0, L)) return 0;
  let shift = 1e-8 * (diagMax + 1e-300);
  for (let k = 0; !cholesky(H, n, shift, L); k++) {
    if (k >= MAX_SHIFT_TRIES || !Number.isFinite(shift)) {
      throw new ConvergenceError('Newton step', `no shift up to ${shift} makes the Hessian positive definite`);
    }
    shift *= 4;
  }
  cholesky(H, n, 2 * shift, L);
  return 2 * shift;
}

/**
 * Softest direction of the shifted factor L (of H + shift I): `sweeps` steps of inverse
 * iteration from a vector with no symmetry, 1 + sin(1.3 i + 0.7)/2 (so a symmetric
 * subspace is left), normalised to unit max-norm, into v; signed downhill along `grad`
 * (grad . v <= 0).
 */
export function softestDirection(L: Float64Array, n: number, grad: ArrayLike<number>, sweeps: number, v: Float64Array): Float64Array {
  for (let i = 0; i < n; i++) v[i] = 1 + 0.5 * Math.sin(1.3 * i + 0.7);
  for (let k = 0; k < sweeps; k++) {
    choleskySolve(L, n, v);
    let nv = 0;
    for (let i = 0; i < n; i++) nv = Math.max(nv, Math.abs(v[i]));
    if (!(nv > 0) || !Number.isFinite(nv)) break;
    for (let i = 0; i < n; i++) v[i] /= nv;
  }
  let gv = 0;
  for (let i = 0; i < n; i++) gv += grad[i] * v[i];
  if (gv > 0) for (let i = 0; i < n; i++) v[i] = -v[i];
  return v;
}
