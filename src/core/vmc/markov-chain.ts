/**
 * Metropolis sampling of |psi(n)|^2 for the Jastrow wavefunction by single flips n_i -> 1 - n_i
 * (Metropolis, Rosenbluth, Rosenbluth, Teller and Teller, J. Chem. Phys. 21, 1087 (1953)).
 *
 * With s_i = 1 - 2 n_i (+1 adds an excitation) the amplitude ratio of a flip is
 *   psi(n')/psi(n) = exp( s_i (a_{g(i)} + G_i) ),   G_i = sum_j v_{d(i,j)} n_j,
 * accepted with probability min(1, ratio^2). The fields G_i, h_i = sum_j V_ij n_j, the
 * diagonal energy E_diag = -mu sum n_i + sum_{i<j} V_ij n_i n_j and the log-derivatives O_k
 * are kept incrementally: an accepted flip of i changes them only at i's neighbours, so a
 * flip attempt costs O(1) and an accepted flip O(neighbours in range).
 *
 * Local energy E_loc(n) = E_diag(n) - alpha sum_i psi(n with i flipped)/psi(n), and
 * sum_i psi(n^i)/psi(n) estimates <sum_i sigma^x_i>.
 */
import type { Ansatz } from './ansatz.ts';

export class JastrowChain {
  /** Occupations n_i. */
  readonly n: Uint8Array;
  /** Jastrow field G_i and interaction field h_i. */
  readonly G: Float64Array;
  readonly h: Float64Array;
  /** One-body counts sum_{i in g} n_i and Jastrow pair counts per shell. */
  readonly groupCount: Float64Array;
  readonly shellCount: Float64Array;
  eDiag = 0;
  occupied = 0;
  attempted = 0;
  accepted = 0;
  private theta: Float64Array;

  constructor(readonly ansatz: Ansatz, readonly mu: number, theta: Float64Array, n: Uint8Array) {
    const N = ansatz.N;
    this.n = Uint8Array.from(n);
    this.G = new Float64Array(N);
    this.h = new Float64Array(N);
    this.groupCount = new Float64Array(ansatz.groups);
    this.shellCount = new Float64Array(ansatz.P - ansatz.groups);
    this.theta = Float64Array.from(theta);
    this.recompute();
  }

  /** Install new parameters (the fields G_i are rebuilt, O(N z)). */
  setParameters(theta: Float64Array): void {
    this.theta = Float64Array.from(theta);
    this.recompute();
  }

  /** Rebuild every incremental quantity from the occupations. */
  private recompute(): void {
    const A = this.ansatz, N = A.N, G0 = A.groups, th = this.theta;
    this.G.fill(0); this.h.fill(0); this.groupCount.fill(0); this.shellCount.fill(0);
    let e = 0, occ = 0;
    for (let i = 0; i < N; i++) {
      if (!this.n[i]) continue;
      occ++; e -= this.mu; this.groupCount[A.group[i]]++;
      for (let p = A.nbrStart[i]; p < A.nbrStart[i + 1]; p++) {
        const j = A.nbrSite[p], d = A.nbrShell[p];
        this.h[j] += A.nbrV[p];
        if (d >= 0) this.G[j] += th[G0 + d];
        if (this.n[j] && j < i) { e += A.nbrV[p]; if (d >= 0) this.shellCount[d]++; }
      }
    }
    this.eDiag = e; this.occupied = occ;
  }

  /** N Metropolis flip attempts at uniformly random sites. */
  sweep(rng: () => number): void {
    const A = this.ansatz, N = A.N, G0 = A.groups, th = this.theta;
    const n = this.n, G = this.G, h = this.h, start = A.nbrStart, site = A.nbrSite, V = A.nbrV, shell = A.nbrShell;
    for (let t = 0; t < N; t++) {
      const i = Math.floor(rng() * N);
      const s = 1 - 2 * n[i];
      const logRatio2 = 2 * s * (th[A.group[i]] + G[i]);
      this.attempted++;
      if (logRatio2 < 0 && rng() >= Math.exp(logRatio2)) continue;
      this.accepted++;
      this.eDiag += s * (h[i] - this.mu);
      this.occupied += s;
      this.groupCount[A.group[i]] += s;
      n[i] ^= 1;
      for (let p = start[i]; p < start[i + 1]; p++) {
        const j = site[p], d = shell[p];
        h[j] += s * V[p];
        if (d >= 0) { G[j] += s * th[G0 + d]; if (n[j]) this.shellCount[d] += s; }
      }
    }
  }

  /** sum_i psi(n^i)/psi(n): the local estimator of sum_i sigma^x_i. */
  flipRatioSum(): number {
    const A = this.ansatz, th = this.theta, n = this.n, G = this.G;
    let sum = 0;
    for (let i = 0; i < A.N; i++) sum += Math.exp((1 - 2 * n[i]) * (th[A.group[i]] + G[i]));
    return sum;
  }

  /** E_loc = E_diag - alpha sum_i psi(n^i)/psi(n), given that sum. */
  localEnergy(alpha: number, ratioSum: number): number {
    return this.eDiag - alpha * ratioSum;
  }

  /** O_k = d ln psi / d theta_k into `out` (length P). */
  logDerivatives(out: Float64Array): void {
    out.set(this.groupCount, 0);
    out.set(this.shellCount, this.ansatz.groups);
  }
}
