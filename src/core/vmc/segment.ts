/**
 * One segment of one Markov chain: resume (or start) chain c, discard some sweeps, then
 * sample `sweeps` sweeps with one measurement per sweep, returning either the sums that
 * stochastic reconfiguration needs ('optimise') or binned observables ('measure'), and the
 * chain's state (occupations and random stream) so the next segment continues it on any
 * worker. Everything is plain data; a segment is a pure function of its request.
 *
 * One measurement per sweep, weighted by w = 1/(1 + Q/N) of the guiding distribution
 * (markov-chain.ts): e = E_loc/N, x = (1/N) sum_i psi(n^i)/psi(n) (estimates mean <sigma^x_i>),
 * rho = (1/N) sum_i n_i and O_k; for 'measure' also n_i, the Fourier sums
 * n_k = sum_i e^{i k.r_i} n_i on the cluster momenta and the pair counts
 * sum_{i != j in shell d} n_i n_j of every shell. All sums below are weighted sums.
 */
import type { ClusterSpec } from '../cluster/spec.ts';
import { buildCluster } from '../cluster/spec.ts';
import type { Cluster } from '../cluster/cluster.ts';
import { type Ansatz, type AnsatzSpec, buildAnsatz } from './ansatz.ts';
import { JastrowChain } from './markov-chain.ts';
import { type StreamState, chainStream, resumeStream } from './random-stream.ts';

export interface VmcProblem {
  cluster: ClusterSpec;
  mu: number;
  ansatz: AnsatzSpec;
}

/** A chain between segments: occupations and random-stream state. */
export interface ChainState {
  n: Uint8Array;
  stream: StreamState;
}

export interface SegmentRequest {
  problem: VmcProblem;
  seed: number | string;
  chain: number;
  /** null: start the chain from its stream. */
  state: ChainState | null;
  theta: Float64Array;
  alpha: number;
  discard: number;
  sweeps: number;
  mode: 'optimise' | 'measure';
  /** Number of bins of a 'measure' segment (sweeps divisible by it). */
  bins?: number;
  /** Fraction of Metropolis proposals that are nearest-neighbour exchanges (default 0). */
  exchange?: number;
}

/** Weighted sums for stochastic reconfiguration: W = sum w, W2 = sum w^2, E the total local energy. */
export interface OptimiseSums {
  samples: number;
  W: number; W2: number;
  E: number; E2: number; X: number;
  O: Float64Array; OO: Float64Array; EO: Float64Array;
}

/** Per-bin weighted sums of a 'measure' segment (each bin holds `perBin` consecutive sweeps). */
export interface MeasureBins {
  bins: number; perBin: number;
  w: Float64Array; e: Float64Array; x: Float64Array; rho: Float64Array;
  /** sum w^2, sum w^2 e, sum w^2 e^2 over all samples (the naive variance of the energy). */
  w2: number; w2e: number; w2e2: number;
  /** [bin * N + i] */ site: Float64Array;
  /** [bin * K + q] */ nkRe: Float64Array; nkIm: Float64Array; nk2: Float64Array;
  /** [bin * shells + d] */ pairs: Float64Array;
}

export interface SegmentResult {
  chain: number;
  state: ChainState;
  attempted: number;
  accepted: number;
  optimise?: OptimiseSums;
  measure?: MeasureBins;
}

/** A problem's cluster, ansatz and Fourier tables, built once and reused by segments. */
export interface VmcSystem {
  readonly cluster: Cluster;
  readonly ansatz: Ansatz;
  readonly mu: number;
  /** cos and sin of k_q . r_i at [q * N + i], built on first use. */
  fourier?: { cos: Float64Array; sin: Float64Array };
}

export function vmcSystem(p: VmcProblem): VmcSystem {
  const cluster = buildCluster(p.cluster);
  return { cluster, ansatz: buildAnsatz(cluster, p.ansatz), mu: p.mu };
}

/** Run one segment. */
export function runSegment(sys: VmcSystem, req: SegmentRequest): SegmentResult {
  const A = sys.ansatz, N = A.N;
  const theta = Float64Array.from(req.theta);
  const stream = req.state ? resumeStream(req.state.stream) : chainStream(req.seed, req.chain);
  let n0 = req.state?.n;
  if (!n0) {
    n0 = new Uint8Array(N);
    for (let i = 0; i < N; i++) n0[i] = stream.next() < 1 / (1 + Math.exp(-2 * theta[A.group[i]])) ? 1 : 0;
  }
  const chain = new JastrowChain(A, sys.mu, theta, n0);
  for (let t = 0; t < req.discard; t++) chain.sweep(stream.next, req.exchange);
  chain.attempted = 0; chain.accepted = 0;
  const out: SegmentResult = { chain: req.chain, state: { n: chain.n, stream: stream.state() }, attempted: 0, accepted: 0 };
  if (req.mode === 'optimise') out.optimise = sampleOptimise(chain, req, stream.next);
  else out.measure = sampleMeasure(sys, chain, req, stream.next);
  out.state = { n: Uint8Array.from(chain.n), stream: stream.state() };
  out.attempted = chain.attempted; out.accepted = chain.accepted;
  return out;
}

function sampleOptimise(chain: JastrowChain, req: SegmentRequest, rng: () => number): OptimiseSums {
  const P = chain.ansatz.P, O = new Float64Array(P);
  const s: OptimiseSums = { samples: 0, W: 0, W2: 0, E: 0, E2: 0, X: 0, O: new Float64Array(P), OO: new Float64Array(P * P), EO: new Float64Array(P) };
  for (let t = 0; t < req.sweeps; t++) {
    chain.sweep(rng, req.exchange);
    const w = chain.weight(), E = chain.localEnergy(req.alpha);
    chain.logDerivatives(O);
    s.samples++; s.W += w; s.W2 += w * w; s.E += w * E; s.E2 += w * E * E; s.X += w * chain.ratioSum;
    for (let k = 0; k < P; k++) {
      const wO = w * O[k];
      s.O[k] += wO; s.EO[k] += E * wO;
      for (let l = k; l < P; l++) s.OO[k * P + l] += wO * O[l];
    }
  }
  for (let k = 0; k < P; k++) for (let l = 0; l < k; l++) s.OO[k * P + l] = s.OO[l * P + k];
  return s;
}

function sampleMeasure(sys: VmcSystem, chain: JastrowChain, req: SegmentRequest, rng: () => number): MeasureBins {
  const c = sys.cluster, N = c.N, K = c.momenta.length / 2, S = c.shells.length;
  const B = req.bins ?? 1;
  if (req.sweeps % B !== 0 || req.sweeps < B) throw new Error(`sweeps ${req.sweeps} not a positive multiple of bins ${B}`);
  const L = req.sweeps / B;
  const f = fourierTables(sys);
  const m: MeasureBins = {
    bins: B, perBin: L, w: new Float64Array(B), e: new Float64Array(B), x: new Float64Array(B), rho: new Float64Array(B),
    w2: 0, w2e: 0, w2e2: 0,
    site: new Float64Array(B * N), nkRe: new Float64Array(B * K), nkIm: new Float64Array(B * K), nk2: new Float64Array(B * K),
    pairs: new Float64Array(B * S),
  };
  const occ = new Int32Array(N);
  for (let t = 0; t < req.sweeps; t++) {
    chain.sweep(rng, req.exchange);
    const b = Math.floor(t / L), w = chain.weight();
    const e = chain.localEnergy(req.alpha) / N;
    m.w[b] += w; m.e[b] += w * e; m.x[b] += (w * chain.ratioSum) / N; m.rho[b] += (w * chain.occupied) / N;
    m.w2 += w * w; m.w2e += w * w * e; m.w2e2 += w * w * e * e;
    let no = 0;
    for (let i = 0; i < N; i++) if (chain.n[i]) { occ[no++] = i; m.site[b * N + i] += w; }
    for (let q = 0; q < K; q++) {
      let re = 0, im = 0;
      const row = q * N;
      for (let a = 0; a < no; a++) { re += f.cos[row + occ[a]]; im += f.sin[row + occ[a]]; }
      m.nkRe[b * K + q] += w * re; m.nkIm[b * K + q] += w * im; m.nk2[b * K + q] += w * (re * re + im * im);
    }
    for (let a = 0; a < no; a++) {
      const row = occ[a] * N;
      for (let q = 0; q < a; q++) m.pairs[b * S + c.shellOf[row + occ[q]]] += 2 * w;
    }
  }
  return m;
}

function fourierTables(sys: VmcSystem): { cos: Float64Array; sin: Float64Array } {
  if (sys.fourier) return sys.fourier;
  const c = sys.cluster, N = c.N, K = c.momenta.length / 2;
  const cos = new Float64Array(K * N), sin = new Float64Array(K * N);
  for (let q = 0; q < K; q++) {
    for (let i = 0; i < N; i++) {
      const ph = c.momenta[2 * q] * c.positions[2 * i] + c.momenta[2 * q + 1] * c.positions[2 * i + 1];
      cos[q * N + i] = Math.cos(ph); sin[q * N + i] = Math.sin(ph);
    }
  }
  sys.fourier = { cos, sin };
  return sys.fourier;
}
