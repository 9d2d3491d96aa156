/**
 * The pool figures of the QMC benchmark (qmc.bench.ts): two workers over one on the same
 * self-consistent run, and the wall time to locate the T = 0 crystal-to-condensate
 * transition of the nearest-neighbour chain at mu = V1 with the cavity to +-0.01 in
 * delta - mu (one self-consistent run: its f(alpha) curve holds the threshold). The exact N -> infinity location is the free-fermion value (Pfeuty, Ann. Phys.
 * 57, 79 (1970)): the smallest delta - mu where alpha = 0 is the global minimum of
 * f(alpha) = (delta - mu) alpha^2 + e_TFIM(J = V1/4, h = alpha), computed here by quadrature.
 */
import type { QmcRequest } from '../src/core/qmc/quantum-monte-carlo.ts';
import { nodeEnginePool } from '../workers/node-spawn.ts';
import { quantumMonteCarloOnPool } from '../workers/qmc-run.ts';
import type { BenchContext } from './harness.ts';

/** e_TFIM(h) per site for J = 1/4: -(1/pi) int_0^pi sqrt(J^2 + h^2 - 2 J h cos k) dk (midpoint rule). */
function isingEnergy(h: number): number {
  const J = 0.25, n = 4000;
  let s = 0;
  for (let i = 0; i < n; i++) s += Math.sqrt(J * J + h * h - 2 * J * h * Math.cos((Math.PI * (i + 0.5)) / n));
  return -s / n;
}

/** Exact transition: largest x = delta - mu with a nonzero global minimum, by bisection on a fine alpha grid. */
function exactTransition(): number {
  const condensed = (x: number) => {
    for (let a = 0.005; a < 1; a += 0.005) if (x * a * a + isingEnergy(a) - isingEnergy(0) < 0) return true;
    return false;
  };
  let lo = 1, hi = 2;
  for (let k = 0; k < 30; k++) { const m = (lo + hi) / 2; if (condensed(m)) lo = m; else hi = m; }
  return (lo + hi) / 2;
}

export async function poolFigures(ctx: BenchContext, quick: boolean): Promise<void> {
  const ring = (L: number) => ({ kind: 'periodic' as const, lattice: 'chain' as const, size: [L], interaction: { shape: 'nn' as const, V1: 1 } });
  const one = nodeEnginePool(1), two = nodeEnginePool(2);
  try {
    const req: QmcRequest = { cluster: ring(64), mu: 1, delta: 2.1, temperature: 1 / 32, sweeps: quick ? 400 : 1600, bins: 16, chains: 2, alphaPoints: 8 };
    await quantumMonteCarloOnPool({ ...req, sweeps: 64, alphaPoints: 4 }, two); // warm both workers
    let t0 = performance.now();
    await quantumMonteCarloOnPool(req, one);
    const t1 = performance.now() - t0;
    t0 = performance.now();
    await quantumMonteCarloOnPool(req, two);
    const t2 = performance.now() - t0;
    ctx.figure('QMC self-consistent run, 2 workers over 1 (wall time)', t1 / t2, 'x', { target: '>= 1.8', note: `${(t1 / 1000).toFixed(1)} s and ${(t2 / 1000).toFixed(1)} s` });

    // One self-consistent run: f(alpha) - f(0) = (delta - mu) alpha^2 - I(alpha) with I independent
    // of delta, so the curve itself gives the threshold x_c = max I / alpha^2 (free-energy-scan.ts).
    const exact = exactTransition();
    t0 = performance.now();
    const r = await quantumMonteCarloOnPool({ cluster: ring(32), mu: 1, delta: 2.2, temperature: 1 / 64, sweeps: quick ? 1000 : 3000, bins: 16, chains: 2, alphaPoints: 16 }, two);
    const wall = (performance.now() - t0) / 1000;
    const th = r.condensateThreshold!;
    ctx.log(`T = 0 transition of the nn chain at mu = V1 (32-site ring, beta = 64): delta - mu = ${th.deltaMinusMu.value.toFixed(4)} +- ${th.deltaMinusMu.error.toFixed(4)}, alpha jumps to ${th.alpha.toFixed(3)}; exact (N -> infinity) ${exact.toFixed(4)}`);
    ctx.figure('error of the located transition', th.deltaMinusMu.error, 'in delta - mu', { target: '<= 0.01' });
    ctx.figure('wall time to locate it on 2 workers', wall, 's', { target: '< 60' });
  } finally {
    one.close(); two.close();
  }
}
