/**
 * Metropolis sampling for the Jastrow wavefunction by single flips n_i -> 1 - n_i
 * (Metropolis, Rosenbluth, Rosenbluth, Teller and Teller, J. Chem. Phys. 21, 1087 (1953)).
 *
 * With s_i = 1 - 2 n_i (+1 adds an excitation) the amplitude ratio of a flip is
 *   t_i = psi(n^i)/psi(n) = exp( s_i (a_{g(i)} + G_i) ),   G_i = sum_j v_{d(i,j)} n_j.
 * The chain samples the guiding distribution
 *   P(n) = |psi(n)|^2 (1 + Q(n)/N),   Q(n) = sum_i t_i^2   (so |psi|^2 Q = sum_i |psi(n^i)|^2),
 * and averages carry the weight w(n) = 1/(1 + Q(n)/N) <= 1: <A> = sum w A / sum w. Near a
 * crystal |psi|^2 alone is concentrated on one configuration and its single-flip neighbours,
 * which carry the O(alpha) energy, are visited too rarely to be sampled (a heavy-tailed
 * local energy, Trail, Phys. Rev. E 77, 016703 (2008)); the guide gives them a fixed share
 * of the time with bounded weights. Elsewhere it costs little (w varies mildly).
 *
 * A flip of i changes t_i -> 1/t_i and t_j -> t_j exp(s_j s_i v_ij) at i's Jastrow
 * neighbours only, so Q(n'), the fields G, h = sum_j V_ij n_j, the diagonal energy
 * E_diag = -mu sum n_i + sum_{i<j} V_ij n_i n_j and the log-derivatives O_k are updated in
 * O(neighbours in range): independent of N at a fixed range.
 *
 * Local energy E_loc(n) = E_diag(n) - alpha sum_i t_i; sum_i t_i estimates <sum_i sigma^x_i>.
 */
import type { Ansatz } from './ansatz.ts';

export class JastrowChain {
  /** Occupations n_i. */
  readonly n: Uint8Array;
  /** Jastrow field G_i, interaction field h_i and flip ratios t_i. */
  readonly G: Float64Array;
  readonly h: Float64Array;
  readonly t: Float64Array;
  /** One-body counts sum_{i in g} n_i and Jastrow pair counts per shell. */
  readonly groupCount: Float64Array;
  readonly shellCount: Float64Array;
  /** sum_i t_i, Q = sum_i t_i^2, E_diag and the number of excitations. */
  ratioSum = 0;
  Q = 0;
  eDiag = 0;
  occupied = 0;
  attempted = 0;
  accepted = 0;
  private theta: Float64Array;
  /** exp(v_d), exp(-v_d) and their squares per Jastrow shell. */
  private ev = new Float64Array(0);
  private emv = new Float64Array(0);

  constructor(readonly ansatz: Ansatz, readonly mu: number, theta: Float64Array, n: Uint8Array) {
    const N = ansatz.N;
    this.n = Uint8Array.from(n);
    this.G = new Float64Array(N);
    this.h = new Float64Array(N);
    this.t = new Float64Array(N);
    this.groupCount = new Float64Array(ansatz.groups);
    this.shellCount = new Float64Array(ansatz.P - ansatz.groups);
    this.theta = Float64Array.from(theta);
    this.recompute();
  }

  /** Install new parameters (every field is rebuilt, O(N z)). */
  setParameters(theta: Float64Array): void {
    this.theta = Float64Array.from(theta);
    this.recompute();
  }

  /** Rebuild every incremental quantity from the occupations. */
  recompute(): void {
    const A = this.ansatz, N = A.N, G0 = A.groups, th = this.theta, S = A.P - G0;
    this.ev = Float64Array.from({ length: S }, (_, d) => Math.exp(th[G0 + d]));
    this.emv = this.ev.map((x) => 1 / x);
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
    this.refreshRatios();
  }

  /** Recompute t_i, sum t_i and Q from the fields (removes rounding drift; N exponentials). */
  refreshRatios(): void {
    const A = this.ansatz, th = this.theta;
    let sum = 0, Q = 0;
    for (let i = 0; i < A.N; i++) {
      const ti = Math.exp((1 - 2 * this.n[i]) * (th[A.group[i]] + this.G[i]));
      this.t[i] = ti; sum += ti; Q += ti * ti;
    }
    this.ratioSum = sum; this.Q = Q;
  }

  /** Weight w = 1/(1 + Q/N) of the current configuration. */
  weight(): number {
    return 1 / (1 + this.Q / this.ansatz.N);
  }

  /** E_loc = E_diag - alpha sum_i t_i. */
  localEnergy(alpha: number): number {
    return this.eDiag - alpha * this.ratioSum;
  }

  /**
   * N Metropolis attempts of the guiding distribution: single flips at uniformly random
   * sites and, with probability `exchange` each, exchanges n_i <-> n_j across a random
   * nearest-neighbour bond (a symmetric proposal that moves an excitation, so crystal
   * patterns of the same density can turn into one another). t, sum t and Q are exact after it.
   */
  sweep(rng: () => number, exchange = 0): void {
    const N = this.ansatz.N, bonds = this.ansatz.bonds, nb = bonds.length / 2, n = this.n;
    for (let step = 0; step < N; step++) {
      this.attempted++;
      if (exchange > 0 && nb > 0 && rng() < exchange) {
        const b = Math.floor(rng() * nb);
        let i = bonds[2 * b], j = bonds[2 * b + 1];
        if (n[i] === n[j]) continue;
        if (!n[i]) [i, j] = [j, i];
        // Remove at i, then add at j: the product of the two ratios, with Q of the end state.
        const Q0 = this.Q, sum0 = this.ratioSum, ti = this.t[i];
        this.propose(i); this.flip(i);
        const tj = this.t[j];
        this.propose(j);
        const ratio = (ti * ti * tj * tj * (1 + this.Qn / N)) / (1 + Q0 / N);
        if (ratio >= 1 || rng() < ratio) { this.flip(j); this.accepted++; continue; }
        this.propose(i); this.flip(i);
        this.Q = Q0; this.ratioSum = sum0;
        continue;
      }
      const i = Math.floor(rng() * N), ti = this.t[i];
      this.propose(i);
      const ratio = ti * ti * (1 + this.Qn / N) / (1 + this.Q / N);
      if (ratio < 1 && rng() >= ratio) continue;
      this.accepted++;
      this.flip(i);
    }
    this.refreshRatios();
  }

  /** Q and sum t after a flip of i, into Qn and sumN: only i and its Jastrow neighbours change. */
  private Qn = 0;
  private sumN = 0;
  private propose(i: number): void {
    const A = this.ansatz, n = this.n, t = this.t, ev = this.ev, emv = this.emv, start = A.nbrStart, site = A.nbrSite, shell = A.nbrShell;
    const s = 1 - 2 * n[i], ti = t[i];
    let Qn = this.Q - ti * ti + 1 / (ti * ti), sumN = this.ratioSum - ti + 1 / ti;
    for (let p = start[i]; p < start[i + 1]; p++) {
      const d = shell[p];
      if (d < 0) continue;
      const j = site[p], f = (1 - 2 * n[j]) * s > 0 ? ev[d] : emv[d], tj = t[j];
      sumN += tj * (f - 1); Qn += tj * tj * (f * f - 1);
    }
    this.Qn = Qn; this.sumN = sumN;
  }

  /** Flip n_i, taking Q and sum t from the last propose(i), and update every field at i's neighbours. */
  private flip(i: number): void {
    const A = this.ansatz, G0 = A.groups, th = this.theta, ev = this.ev, emv = this.emv;
    const n = this.n, G = this.G, h = this.h, t = this.t, start = A.nbrStart, site = A.nbrSite, V = A.nbrV, shell = A.nbrShell;
    const s = 1 - 2 * n[i];
    this.eDiag += s * (h[i] - this.mu);
    this.occupied += s;
    this.groupCount[A.group[i]] += s;
    this.Q = this.Qn; this.ratioSum = this.sumN;
    t[i] = 1 / t[i];
    n[i] ^= 1;
    for (let p = start[i]; p < start[i + 1]; p++) {
      const j = site[p], d = shell[p];
      h[j] += s * V[p];
      if (d < 0) continue;
      G[j] += s * th[G0 + d];
      t[j] *= (1 - 2 * n[j]) * s > 0 ? ev[d] : emv[d];
      if (n[j]) this.shellCount[d] += s;
    }
  }

  /** O_k = d ln psi / d theta_k into `out` (length P). */
  logDerivatives(out: Float64Array): void {
    out.set(this.groupCount, 0);
    out.set(this.shellCount, this.ansatz.groups);
  }
}
