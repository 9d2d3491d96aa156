/**
 * Exact diagonalisation of a cluster as one plain-data request and result (crosses to a
 * worker, printed by the CLI). With `alpha` the photon amplitude is fixed and
 * energyPerSite = E0(alpha)/N = <H(alpha)>/N; with `delta` and no `alpha` it is
 * self-consistent and energyPerSite = e = (delta - mu) alpha^2 + E0/N at the minimising alpha.
 * Observables of the ground vector: density, <sigma^x>, per-site densities, S(k) on the
 * cluster momenta, C(r) on the distance shells.
 */
import { InputError, requireBelowDetuning, requireFinite } from '../input-error.ts';
import type { Cluster } from '../cluster/cluster.ts';
import { type ClusterSpec, buildCluster } from '../cluster/spec.ts';
import { type CorrelationPoint, type StructureFactorPoint, densityCorrelation, densityWaveOrder, structureFactor } from '../cluster/correlations.ts';
import { edSystem, fullVector, groundState, type GroundState } from './exact-ground-state.ts';
import { selfConsistentGround } from './self-consistent-alpha.ts';
import { groundExpectations } from './ground-observables.ts';

export interface EdRequest {
  cluster: ClusterSpec;
  mu: number;
  /** Fixed photon amplitude alpha >= 0. */
  alpha?: number;
  /** Cavity detuning; without alpha, alpha is found self-consistently. */
  delta?: number;
  /** Blockade threshold Vb of the truncated basis (omit for the full 2^N basis). */
  blockade?: number;
  /** Use the k = 0 sector of a periodic cluster (default true; false: the whole 2^N basis). */
  symmetric?: boolean;
}

export interface EdResult {
  method: 'ed';
  sites: number;
  /** 'translation': the k = 0 sector of the full basis of a periodic cluster. */
  basis: 'full' | 'translation' | 'blockade';
  /** Number of basis states Lanczos works in. */
  dimension: number;
  mu: number;
  delta: number | null;
  alpha: number;
  selfConsistent: boolean;
  /** <H(alpha)>/N (fixed alpha) or e (self-consistent). */
  energyPerSite: number;
  /** E0(alpha)/N. */
  hamiltonianPerSite: number;
  /** e = (delta - mu) alpha^2 + E0/N when delta is known. */
  grandPotentialPerSite: number | null;
  /** de/dalpha = 2 (delta - mu) alpha - <sigma^x> (zero at an interior self-consistent alpha). */
  dEdAlpha: number | null;
  density: number;
  photonDensity: number;
  sigmaX: number;
  siteDensities: number[];
  structureFactor: StructureFactorPoint[];
  /** m^2 = <|n_k*|^2>/N^2 at the k* != 0 maximising it (correlations.ts). */
  orderParameter: { k: [number, number]; m: [number, number]; value: number } | null;
  correlation: CorrelationPoint[];
  lanczos: { iterations: number; residual: number; evaluations: number };
}

/**
 * Largest |V_ij| of a pair the basis holds: 1e8 g. Lanczos resolves the ground energy only to
 * about eps |H| (2e-8 g here, against the 1e-6 relative at which lanczos.ts gives up); a
 * stronger pair is blockaded to every purpose and belongs outside the basis (the
 * blockade-truncated basis drops pairs with V_ij >= Vb). A ring with Rb = 1000 (V ~ 1e18)
 * gave a residual of 1e6.
 */
export const ED_MAX_PAIR = 1e8;

/** Refuse a basis holding a pair beyond ED_MAX_PAIR, saying how to drop it. */
function checkResolvable(cluster: Cluster, blockade: number | undefined): void {
  const N = cluster.N;
  let worst = 0;
  for (let i = 0; i < N * N; i++) {
    const v = cluster.V[i];
    if (blockade !== undefined && v >= blockade) continue;
    worst = Math.max(worst, Math.abs(v));
  }
  if (worst > ED_MAX_PAIR) {
    throw new InputError(
      `a pair interaction of ${worst.toExponential(3)} g in the basis is beyond what Lanczos resolves (${ED_MAX_PAIR} g); give a blockade threshold (e.g. 2) to drop blockaded pairs`, 'blockade');
  }
}

/** Run exact diagonalisation; `cluster` may be passed pre-built (it must match request.cluster). */
export function exactDiagonalisation(req: EdRequest, cluster: Cluster = buildCluster(req.cluster)): EdResult {
  const mu = requireFinite(req.mu, 'mu');
  if (req.alpha === undefined && req.delta === undefined) {
    throw new InputError('give alpha (a fixed photon amplitude) or the detuning (alpha found self-consistently)', 'alpha');
  }
  if (req.delta !== undefined) requireBelowDetuning(mu, req.delta);
  checkResolvable(cluster, req.blockade);
  const sys = edSystem(cluster, mu, req.blockade, req.symmetric ?? true);
  let g: GroundState, evaluations = 1;
  if (req.alpha !== undefined) g = groundState(sys, req.alpha);
  else {
    const sc = selfConsistentGround(sys, req.delta as number);
    g = sc.ground; evaluations = sc.evaluations;
  }
  const N = cluster.N;
  const ex = groundExpectations(sys.basis, fullVector(sys, g), sys.flips);
  const mean = (a: Float64Array) => a.reduce((s, v) => s + v, 0) / N;
  const sigmaX = mean(ex.sigmaX), hPerSite = g.energy / N;
  const gap = req.delta === undefined ? null : req.delta - mu;
  const grand = gap === null ? null : gap * g.alpha * g.alpha + hPerSite;
  return {
    method: 'ed', sites: N, basis: sys.sector ? 'translation' : sys.basis.states === null ? 'full' : 'blockade', dimension: sys.diag.length,
    mu, delta: req.delta ?? null, alpha: g.alpha, selfConsistent: req.alpha === undefined,
    energyPerSite: req.alpha === undefined ? (grand as number) : hPerSite,
    hamiltonianPerSite: hPerSite, grandPotentialPerSite: grand,
    dEdAlpha: gap === null ? null : 2 * gap * g.alpha - sigmaX,
    density: mean(ex.density), photonDensity: g.alpha * g.alpha, sigmaX,
    siteDensities: Array.from(ex.density),
    structureFactor: structureFactor(cluster, ex.density, ex.pair),
    orderParameter: densityWaveOrder(cluster, ex.density, ex.pair),
    correlation: densityCorrelation(cluster, ex.density, ex.pair),
    lanczos: { iterations: g.iterations, residual: g.residual, evaluations },
  };
}
