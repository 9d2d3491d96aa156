/**
 * Seeded random inputs for the core's entry points (issue 10, "No hangs, anywhere"): the
 * mean-field solve at fixed mu and at fixed density, the fluctuation spectrum, the softest
 * mode, exact diagonalisation of small clusters and short VMC runs. Edge values are drawn on
 * purpose: V1 = 0, huge and tiny Rb, T tiny and huge (down to the smallest double), mu just
 * below delta and far below, density 0, 1 and above 1, a range below 1, softcore with large
 * Rc, dipolar in 2D, arrays with close or far-apart sites. Some inputs are invalid (mu >=
 * delta, limits passed) and must be refused with an InputError. A case is plain data, so
 * it crosses to the worker thread that runs it (fuzz-driver.ts).
 */
import seedrandom from 'seedrandom';
import type { ModelParams } from '../../src/core/model.ts';
import type { InteractionSpec } from '../../src/core/interaction/potential.ts';
import type { LatticeName } from '../../src/core/lattice/geometry.ts';
import type { ClusterSpec } from '../../src/core/cluster/spec.ts';

export type FuzzCase =
  | { kind: 'solve'; params: ModelParams }
  | { kind: 'spectrum'; params: ModelParams; points: number }
  | { kind: 'softmode'; params: ModelParams }
  | { kind: 'ed'; cluster: ClusterSpec; mu: number; alpha?: number; delta?: number }
  | { kind: 'vmc'; cluster: ClusterSpec; mu: number; alpha?: number; delta?: number; seed: number };

type Rng = () => number;

const pick = <T>(rng: Rng, xs: readonly T[]): T => xs[Math.floor(rng() * xs.length)];
const uniform = (rng: Rng, a: number, b: number) => a + (b - a) * rng();

/** An interaction: V = 0 often (the closed forms apply), else every shape at edge strengths. */
function interaction(rng: Rng, dim: number): InteractionSpec {
  const u = rng();
  if (u < 0.3) return { shape: 'nn', V1: 0, V2: rng() < 0.5 ? 0 : undefined };
  if (u < 0.45) return { shape: 'nn', V1: pick(rng, [1e-12, 0.5, 1, 2.5, -0.7, 1e6]), V2: rng() < 0.3 ? uniform(rng, -0.5, 1) : undefined };
  const rmax = rng() < 0.6 ? undefined : pick(rng, [0.5, 0.99, 1, 1.5, 2, 3.3, dim === 2 ? 1e4 : 50]);
  if (u < 0.75) {
    const shape = rng() < 0.6 ? 'vdw' : 'dipolar';
    return rng() < 0.8
      ? { shape, Rb: pick(rng, [1e-3, 0.3, 0.8, 1, 1.3, 2, 50, 1000, 1e15, 1e60]), rmax }
      : { shape, V1: pick(rng, [0, 1e-9, 1, 4, 1e308]), rmax };
  }
  return { shape: 'softcore', V0: pick(rng, [0, 0.4, 1, 3]), Rc: pick(rng, [0.3, 1, 1.7, 5, 25, 300, 1e6]), rmax };
}

/** A temperature: zero half the time, else from the smallest double to 1e6. */
function temperature(rng: Rng): number {
  return rng() < 0.5 ? 0 : pick(rng, [5e-324, 1e-13, 1e-6, 0.05, 0.3, 1, 10, 1e6]);
}

/** A chemical potential: below the lower polariton, near it, just below delta, far below, or invalid. */
function chemicalPotential(rng: Rng, delta: number): number {
  const muC = delta / 2 - Math.sqrt(delta * delta / 4 + 1);
  const u = rng();
  if (u < 0.05) return delta + pick(rng, [0, 1e-12, 1]); // refused: mu >= delta
  if (u < 0.15) return delta - pick(rng, [1e-9, 1e-6, 1e-3]);
  if (u < 0.25) return muC + uniform(rng, -1e-3, 1e-3);
  if (u < 0.3) return pick(rng, [-50, -1e4]);
  return uniform(rng, Math.min(muC - 2, delta - 3), delta - 1e-3);
}

/** Model parameters at fixed mu (or fixed density with `density`). */
function model(rng: Rng, density: boolean, quick: boolean): ModelParams {
  const lattice = pick(rng, ['chain', 'chain', 'square', 'triangular'] as const);
  const dim = lattice === 'chain' ? 1 : 2;
  const delta = pick(rng, [0, 2, 3, -1, uniform(rng, -3, 5)]);
  const maxCell = dim === 1 ? 1 + Math.floor(rng() * (quick ? 4 : 8)) : 1 + Math.floor(rng() * (quick ? 2 : 4));
  const p: ModelParams = { lattice, interaction: interaction(rng, dim), delta, T: temperature(rng), maxCell };
  if (rng() < 0.15) p.cell = 1;
  if (density) p.rho = pick(rng, [0, 1, 0.5, 1.7, 3, uniform(rng, 0, 2)]);
  else p.mu = chemicalPotential(rng, delta);
  return p;
}

/** A small cluster: a ring or torus, or a user array (sometimes with a pair too close or far apart). */
function cluster(rng: Rng, quick: boolean): ClusterSpec {
  const u = rng();
  const lattice: LatticeName = u < 0.5 ? 'chain' : 'square';
  const inter = interaction(rng, lattice === 'chain' ? 1 : 2);
  if (rng() < 0.7) {
    const size = lattice === 'chain' ? [pick(rng, quick ? [4, 6, 8] : [4, 6, 8, 10, 12])] : [2, pick(rng, [2, 3])];
    return { kind: 'periodic', lattice, size, interaction: inter };
  }
  const n = 2 + Math.floor(rng() * (quick ? 5 : 8));
  const positions: number[] = [];
  for (let i = 0; i < n; i++) positions.push(i * uniform(rng, 0.7, 1.5), rng() < 0.5 ? 0 : Math.floor(rng() * 3));
  const w = rng();
  if (w < 0.1) positions.push(positions[0] + pick(rng, [1e-6, 1e-3, 0.04]), positions[1]);
  else if (w < 0.15) positions.push(pick(rng, [1e4, 1e300]), pick(rng, [1e4, 0]));
  return { kind: 'array', lattice: 'square', positions, interaction: inter };
}

/** The i-th case of the stream `seed` (quick: smaller cells and clusters, for npm test). */
export function drawCase(seed: number, i: number, quick: boolean): FuzzCase {
  const rng = seedrandom(`fuzz:${seed}:${i}`);
  const u = rng();
  if (u < 0.35) return { kind: 'solve', params: model(rng, false, quick) };
  if (u < 0.5) return { kind: 'solve', params: model(rng, true, quick) };
  if (u < 0.68) return { kind: 'spectrum', params: model(rng, false, quick), points: pick(rng, [9, 17, 33]) };
  if (u < 0.78) return { kind: 'softmode', params: model(rng, false, quick) };
  const c = cluster(rng, quick);
  const mu = uniform(rng, -2, 2);
  const fixed = rng() < 0.6;
  const photon = fixed ? { alpha: pick(rng, [0, 1e-9, 0.2, 0.7, 3]) } : { delta: mu + pick(rng, [1e-6, 0.5, 2, 10]) };
  if (u < 0.92) return { kind: 'ed', cluster: c, mu, ...photon };
  return { kind: 'vmc', cluster: c, mu, ...photon, seed: i };
}
