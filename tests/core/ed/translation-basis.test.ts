/**
 * The k = 0 sector of a periodic cluster: invariants (orbits partition the 2^N states, the
 * reduced H is symmetric) and equality with the whole 2^N basis for the ground state, whose
 * positivity (Perron-Frobenius, alpha > 0) puts it in that sector.
 */
import { describe, it, expect } from 'vitest';
import { buildCluster, type ClusterSpec } from '../../../src/core/cluster/spec.ts';
import { clusterTranslations, translationBasis, translationProduct } from '../../../src/core/ed/translation-basis.ts';
import { edSystem } from '../../../src/core/ed/exact-ground-state.ts';
import { exactDiagonalisation } from '../../../src/core/ed/exact-diagonalisation.ts';
import { chainStream } from '../../../src/core/vmc/random-stream.ts';
import { expectAbs } from '../../references.ts';

const tri: ClusterSpec = { kind: 'periodic', lattice: 'triangular', size: [3, 4], interaction: { shape: 'vdw', Rb: 1.1 } };
const ring: ClusterSpec = { kind: 'periodic', lattice: 'chain', size: [14], interaction: { shape: 'dipolar', Rb: 1.3 } };

describe('translation-invariant sector', () => {
  it('orbits partition the states; |O_R| divides the number of translations; H is symmetric', () => {
    const c = buildCluster(tri), T = clusterTranslations(c)!;
    expect(T).toHaveLength(12);
    const b = translationBasis(c.N, T);
    const sizes = Array.from(b.sqrtSize, (x) => Math.round(x * x));
    expect(sizes.reduce((a, x) => a + x, 0)).toBe(2 ** 12);
    for (const n of sizes) expect(12 % n).toBe(0);
    const sys = edSystem(c, 0.7);
    const H = translationProduct(b, c.N, sys.diag, 0.35), D = b.dimension, rng = chainStream('sym', 0).next;
    const x = Float64Array.from({ length: D }, rng), y = Float64Array.from({ length: D }, rng);
    const Hx = new Float64Array(D), Hy = new Float64Array(D);
    H(x, Hx); H(y, Hy);
    let a = 0, b2 = 0;
    for (let k = 0; k < D; k++) { a += y[k] * Hx[k]; b2 += x[k] * Hy[k]; }
    // <y|Hx> = <Hy|x> to rounding of D ~ 400 terms of order 10.
    expectAbs(a, b2, 1e-9);
  });

  it.each([['triangular 3x4 vdw', tri], ['dipolar ring of 14', ring]])('%s: energy and observables equal the whole-basis run', (_, cluster) => {
    const s = exactDiagonalisation({ cluster, mu: 0.7, alpha: 0.35 });
    const f = exactDiagonalisation({ cluster, mu: 0.7, alpha: 0.35, symmetric: false });
    expect(s.basis).toBe('translation');
    expect(f.basis).toBe('full');
    expect(s.dimension).toBeLessThan(f.dimension / 5);
    // 1e-10 on the energy (both Lanczos to residual 1e-10), 1e-8 on ground-vector observables.
    expectAbs(s.energyPerSite, f.energyPerSite, 1e-10);
    s.siteDensities.forEach((d, i) => expectAbs(d, f.siteDensities[i], 1e-8));
    s.structureFactor.forEach((p, q) => expectAbs(p.value, f.structureFactor[q].value, 1e-8));
    s.correlation.forEach((p, q) => expectAbs(p.value, f.correlation[q].value, 1e-8));
  });
});
