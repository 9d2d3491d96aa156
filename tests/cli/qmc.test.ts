// The qmc and qmc-scan commands in this process (real worker threads).
// - Refusals: one line on stderr, exit code 2, before any work (T <= 0 without --ground,
//   mu >= delta, two sites at one place, a momentum not on the cluster).
// - A 6-site nearest-neighbour ring at fixed alpha and finite T against exact
//   diagonalisation computed here: the full 64 x 64 matrix of
//   H = sum_i [-mu n_i - alpha sigma^x_i] + V1 sum_i n_i n_(i+1) diagonalised with ml-matrix
//   (a general-purpose library), thermal averages sum_n w_n <n|A|n> / Z. The Monte Carlo
//   values must agree within 4 of their error bars (common practice for Monte Carlo checks).
// - qmc-scan: one CSV row per size and axis value, the JSON's crossings, the stderr summary.
import { describe, expect, it } from 'vitest';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { cli } from './test-io.ts';

const RING = ['--lattice', 'chain', '--size', '6', '--interaction', 'nn', '--v1', '1'];

function oneLineError(r: { code: number; err: string }, pattern: RegExp): void {
  expect(r.code).toBe(2);
  expect(r.err.trimEnd().split('\n')).toHaveLength(1);
  expect(r.err).toMatch(/^atlas: /);
  expect(r.err).toMatch(pattern);
}

/** Thermal <H>/N, <n>, <sigma^x>/N of the L-site nn ring by full diagonalisation. */
function exactRing(L: number, V1: number, mu: number, alpha: number, T: number) {
  const D = 1 << L;
  const H = Matrix.zeros(D, D);
  for (let s = 0; s < D; s++) {
    let d = 0;
    for (let i = 0; i < L; i++) {
      const ni = (s >> i) & 1, nj = (s >> ((i + 1) % L)) & 1;
      d += -mu * ni + V1 * ni * nj;
      H.set(s ^ (1 << i), s, -alpha);
    }
    H.set(s, s, d);
  }
  const eig = new EigenvalueDecomposition(H, { assumeSymmetric: true });
  const E = eig.realEigenvalues, V = eig.eigenvectorMatrix;
  const E0 = Math.min(...E);
  let Z = 0, e = 0, n = 0, x = 0;
  for (let k = 0; k < D; k++) {
    const w = Math.exp(-(E[k] - E0) / T);
    let nk = 0, xk = 0;
    for (let s = 0; s < D; s++) {
      const v = V.get(s, k);
      let pop = 0;
      for (let i = 0; i < L; i++) { pop += (s >> i) & 1; xk += v * V.get(s ^ (1 << i), k); }
      nk += v * v * pop;
    }
    Z += w; e += w * E[k]; n += w * nk; x += w * xk;
  }
  return { energy: e / Z / L, density: n / Z / L, sigmaX: x / Z / L };
}

describe('qmc refusals', () => {
  it('T <= 0 without --ground, no temperature at all, mu >= delta', async () => {
    oneLineError(await cli(['qmc', ...RING, '--mu', '0.5', '--alpha', '0.3', '--temperature', '0']), /temperature must be > 0/);
    oneLineError(await cli(['qmc', ...RING, '--mu', '0.5', '--alpha', '0.3', '--temperature', '-1']), /temperature must be > 0/);
    oneLineError(await cli(['qmc', ...RING, '--mu', '0.5', '--alpha', '0.3']), /--temperature T > 0, or --ground/);
    oneLineError(await cli(['qmc', ...RING, '--mu', '2', '--detuning', '2', '--temperature', '1']), /must be below the detuning/);
    oneLineError(await cli(['qmc', ...RING, '--mu', 'one', '--alpha', '0.3', '--temperature', '1']), /--mu must be a finite number/);
    oneLineError(await cli(['qmc', ...RING, '--mu', '1', '--alpha', '0.3', '--temperature', '1', '--order', '4']), /not a momentum/);
  });

  it('an array with two sites at the same place; a cluster too large for memory', async () => {
    const files = new Map([['a.csv', 'x,y\n0,0\n1,0\n1,0\n']]);
    oneLineError(await cli(['qmc', '--sites', 'a.csv', '--interaction', 'nn', '--v1', '1', '--mu', '1', '--alpha', '0.3', '--temperature', '1'], files), /sites 2 .* and 3 .*apart/);
    oneLineError(await cli(['qmc', '--lattice', 'square', '--size', '128x128', '--interaction', 'nn', '--v1', '1', '--mu', '1', '--alpha', '0.3', '--temperature', '0.001']), /operator slots, above the limit/);
  });
});

describe('qmc against exact diagonalisation', () => {
  it('6-site nn ring, mu 0.5, alpha 0.3, T 0.5: energy, <n>, <sigma^x> within 4 sigma', async () => {
    const r = await cli(['qmc', ...RING, '--mu', '0.5', '--alpha', '0.3', '--temperature', '0.5', '--sweeps', '4000', '--chains', '2', '--workers', '2', '--seed', '3', '--json']);
    expect(r.code).toBe(0);
    expect(r.err).toMatch(/^qmc: 2 chains in [\d.]+ s on 2 worker\(s\)\n$/);
    const j = JSON.parse(r.out);
    for (const k of ['energyPerSite', 'density', 'sigmaX', 'alpha', 'photonDensity', 'binder', 'orderParameter', 'compressibility']) {
      expect(j[k]).toHaveProperty('value');
      expect(j[k]).toHaveProperty('error');
    }
    expect(j.structureFactor).toHaveLength(6);
    expect(Object.keys(j.structureFactor[0]).sort()).toEqual(['error', 'k', 'm', 'value']);
    for (const k of ['correlation', 'phase', 'alphaScan', 'minima', 'autocorrelation', 'drift', 'notes', 'params']) expect(j).toHaveProperty(k);
    expect(j.params).toMatchObject({ mu: 0.5, alpha: 0.3, temperature: 0.5, chains: 2, seed: 3, workers: 2 });
    const ed = exactRing(6, 1, 0.5, 0.3, 0.5);
    expect(Math.abs(j.energyPerSite.value - ed.energy)).toBeLessThan(4 * j.energyPerSite.error);
    expect(Math.abs(j.density.value - ed.density)).toBeLessThan(4 * j.density.error);
    expect(Math.abs(j.sigmaX.value - ed.sigmaX)).toBeLessThan(4 * j.sigmaX.error);
    expect(j.energyPerSite.error).toBeLessThan(0.01); // a test that could fail: the bars are not vacuous
  }, 15_000);
});

describe('qmc-scan', () => {
  const SCAN = ['qmc-scan', '--x', 'alpha=0.2..0.6x3', '--sizes', '4,6', '--interaction', 'nn', '--v1', '1', '--mu', '1', '--temperature', '0.5', '--sweeps', '200', '--bins', '8', '--workers', '2'];

  it('CSV: one row per size and axis value, every observable with its error; crossings on stderr', async () => {
    const r = await cli(SCAN);
    expect(r.code).toBe(0);
    const lines = r.out.trimEnd().split('\n');
    expect(lines[0]).toBe('index,size,alphaAxis,energy,energyError,density,densityError,sigmaX,sigmaXError,alpha,alphaError,photonDensity,photonDensityError,orderParameter,orderParameterError,binder,binderError,phase,error');
    expect(lines).toHaveLength(1 + 6);
    expect(lines.slice(1).map((l) => l.split(',').slice(0, 3).map(Number))).toEqual([[0, 4, 0.2], [1, 4, 0.4], [2, 4, 0.6], [3, 6, 0.2], [4, 6, 0.4], [5, 6, 0.6]]);
    expect(r.err).toMatch(/^qmc-scan: 6 of 6 runs in .*\nBinder crossings along alpha: L 4\/6 /);
  }, 15_000);

  it('--json has the points and the crossings; --shard 2/4 takes index 1 and 5', async () => {
    const j = JSON.parse((await cli([...SCAN, '--json'])).out);
    expect(j.points).toHaveLength(6);
    expect(j.points[0]).toMatchObject({ index: 0, size: 4, value: 0.2, alpha: { value: 0.2, error: 0 } });
    expect(j.points[0].energy).toHaveProperty('error');
    expect(Array.isArray(j.crossings)).toBe(true);
    const s = await cli([...SCAN.slice(0, -2), '--workers', '1', '--shard', '2/4']);
    const rows = s.out.trimEnd().split('\n');
    expect(rows[0]).toBe('# blockade-atlas qmc-scan shard=2/4 points=6');
    expect(rows.slice(2).map((l) => Number(l.split(',')[0]))).toEqual([1, 5]);
  }, 15_000);
});
