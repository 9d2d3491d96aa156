/**
 * Invariants of the stochastic series expansion pieces, each checked directly (common
 * practice, no source: these are identities of the representation, not values of the model):
 *  - Walker's alias table reproduces its weights exactly (Walker, ACM TOMS 3, 253 (1977));
 *  - the torus couplings by displacement equal the dense periodic cluster's V_ij, an
 *    independent route (real-space Ewald sums on the cluster as a supercell), to 1e-10;
 *  - the operator decomposition returns the Hamiltonian: E0 - sum of the diagonal weights
 *    = E_diag(n) for any state (with alpha = 0 and every bond and field operator once);
 *  - the diagonal energy from Fourier components equals the direct pair sum, to 1e-10;
 *  - after any number of sweeps the string is periodic (every site flipped an even number
 *    of times), every operator sits where its weight is positive, and the vertex links are
 *    an involution that never leaves its site.
 */
import { describe, expect, it } from 'vitest';
import { aliasTable } from '../../../src/core/qmc/alias-table.ts';
import { qmcGeometry } from '../../../src/core/qmc/qmc-geometry.ts';
import { buildCluster, type ClusterSpec } from '../../../src/core/cluster/spec.ts';
import { sseTerms } from '../../../src/core/qmc/sse-terms.ts';
import { diagonalEnergy } from '../../../src/core/qmc/diagonal-energy.ts';
import { densityFourier } from '../../../src/core/qmc/density-fourier.ts';
import { adjustCutoff, diagonalUpdate, emptyConfig } from '../../../src/core/qmc/operator-string.ts';
import { linkVertices, readBackState, vertexLinks } from '../../../src/core/qmc/vertex-links.ts';
import { clusterScratch, clusterUpdate } from '../../../src/core/qmc/cluster-update.ts';
import { lineScratch, lineUpdate } from '../../../src/core/qmc/line-update.ts';
import { sweepStream } from '../../../src/core/qmc/xoshiro-stream.ts';
import { SLOT } from '../../../src/core/qmc/slots.ts';

const EXACT = 1e-10; // exact arithmetic up to rounding of sums of O(100) terms

describe('alias table', () => {
  it('each outcome receives exactly its share w_t / sum w of the columns', () => {
    const w = [0.5, 3, 0, 1.25, 7, 0.01];
    const t = aliasTable(w), T = w.length, total = w.reduce((a, b) => a + b, 0);
    const share = new Float64Array(T);
    for (let c = 0; c < T; c++) { share[c] += t.prob[c] / T; share[t.alias[c]] += (1 - t.prob[c]) / T; }
    w.forEach((x, k) => expect(Math.abs(share[k] - x / total)).toBeLessThan(EXACT));
  });
});

describe('torus couplings', () => {
  for (const spec of [
    { kind: 'periodic', lattice: 'chain', size: [10], interaction: { shape: 'vdw', Rb: 1.3 } },
    { kind: 'periodic', lattice: 'square', size: [4, 4], interaction: { shape: 'dipolar', Rb: 1.1 } },
    { kind: 'periodic', lattice: 'triangular', size: [3, 4], interaction: { shape: 'vdw', Rb: 1.2, rmax: 2.5 } },
  ] as ClusterSpec[]) {
    it(`${spec.kind === 'periodic' ? spec.lattice : ''}: V_d equals the dense cluster's V_0d and every V_ij is V_(j - i)`, () => {
      const g = qmcGeometry(spec), dense = buildCluster(spec), N = dense.N, t = g.torus!;
      const scale = Math.max(...Array.from(dense.V).map(Math.abs));
      for (let i = 0; i < N; i++) {
        for (let j = 0; j < N; j++) {
          if (i === j) continue;
          const dx = ((j % t.Lx) - (i % t.Lx) + t.Lx) % t.Lx, dy = (Math.floor(j / t.Lx) - Math.floor(i / t.Lx) + t.Ly) % t.Ly;
          expect(Math.abs(t.Vd[dx + t.Lx * dy] - dense.V[i * N + j])).toBeLessThan(EXACT * scale);
        }
      }
    });
  }
});

describe('operator decomposition and diagonal energy', () => {
  const specs: ClusterSpec[] = [
    { kind: 'periodic', lattice: 'chain', size: [8], interaction: { shape: 'vdw', Rb: 1.4 } },
    { kind: 'periodic', lattice: 'chain', size: [6], interaction: { shape: 'nn', V1: 0 } },
    { kind: 'array', lattice: 'square', positions: [0, 0, 1, 0, 0, 1, 2.5, 0.5, 3, 3], interaction: { shape: 'vdw', Rb: 1.2 } },
  ];
  for (const spec of specs) {
    it(`${spec.kind} ${JSON.stringify(spec.interaction)}: E0 - sum W = E_diag = the Fourier form, for random states`, () => {
      const g = qmcGeometry(spec), N = g.N, mu = 0.7;
      const t = sseTerms(g.couplings, mu, 0);
      const V = spec.kind === 'array' ? g.cluster!.V : null;
      const fourier = densityFourier(g), diag = diagonalEnergy(g, mu);
      const re = new Float64Array(fourier.K), im = new Float64Array(fourier.K);
      const rng = sweepStream(3, 0);
      for (let trial = 0; trial < 20; trial++) {
        const n = Uint8Array.from({ length: N }, () => (rng() < 0.5 ? 1 : 0));
        let direct = 0;
        for (let i = 0; i < N; i++) {
          if (!n[i]) continue;
          direct -= mu;
          for (let j = i + 1; j < N; j++) if (n[j]) direct += V ? V[i * N + j] : g.torus!.Vd[((j - i) % N + N) % N];
        }
        let weights = 0;
        if (t.kind === 'torus') {
          for (let i = 0; i < N; i++) for (let d = 1; d < N; d++) weights += t.bondW[4 * d + 2 * n[i] + n[(i + d) % N]] / 2;
        } else {
          for (let b = 0; b < t.pairI.length; b++) weights += t.bondW[4 * b + 2 * n[t.pairI[b]] + n[t.pairJ[b]]];
        }
        for (const i of t.fieldSites) weights += t.fieldW[n[i]];
        fourier.transform(n, re, im);
        expect(Math.abs(t.E0 - weights - direct)).toBeLessThan(EXACT * (1 + Math.abs(direct)));
        expect(Math.abs(diag(n, re, im) - direct)).toBeLessThan(EXACT * (1 + Math.abs(direct)));
      }
    });
  }
});

describe('sweeps keep a valid string', () => {
  it('periodic flips, positive weights, links an involution along each site line', () => {
    const spec: ClusterSpec = { kind: 'periodic', lattice: 'square', size: [4, 4], interaction: { shape: 'vdw', Rb: 1.2, rmax: 2 } };
    const g = qmcGeometry(spec), N = g.N, beta = 3, alpha = 0.4;
    const t = sseTerms(g.couplings, 1.2, alpha);
    const rng = sweepStream(5, 1);
    const cfg = emptyConfig(Uint8Array.from({ length: N }, () => (rng() < 0.5 ? 1 : 0)), 64);
    const links = vertexLinks(N, cfg.L), cs = clusterScratch(cfg.L), ls = lineScratch(8);
    for (let s = 0; s < 60; s++) {
      diagonalUpdate(cfg, t, beta, rng);
      linkVertices(cfg, links);
      clusterUpdate(cfg, t, links, cs, rng);
      lineUpdate(cfg, t, links, ls, rng);
      readBackState(cfg, links);
      adjustCutoff(cfg);
    }
    linkVertices(cfg, links);
    const cur = Uint8Array.from(cfg.state);
    let ops = 0;
    for (let p = 0; p < cfg.L; p++) {
      const k = cfg.kind[p];
      if (k === SLOT.EMPTY) continue;
      ops++;
      if (k === SLOT.BOND) expect(t.bondW[4 * cfg.cls[p] + 2 * cur[cfg.siteA[p]] + cur[cfg.siteB[p]]]).toBeGreaterThan(0);
      if (k === SLOT.FLIP) cur[cfg.siteA[p]] ^= 1;
    }
    expect(ops).toBe(cfg.n);
    expect(ops).toBeGreaterThan(0);
    expect(Array.from(cur)).toEqual(Array.from(cfg.state));
    for (let p = 0; p < cfg.L; p++) {
      const k = cfg.kind[p];
      if (k === SLOT.EMPTY) continue;
      for (const leg of k === SLOT.BOND ? [0, 1, 2, 3] : [0, 2]) {
        const v = 4 * p + leg, w = links.link[v];
        expect(links.link[w]).toBe(v);
        const site = (x: number) => ((x & 1) === 0 ? cfg.siteA[x >> 2] : cfg.siteB[x >> 2]);
        expect(site(w)).toBe(site(v));
      }
    }
  });
});
