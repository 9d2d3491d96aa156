// The ed and vmc commands in this process (real worker threads): the JSON holds the fields
// the issue names and equals the core result exactly (the pool changes nothing: VMC on two
// worker threads is bit for bit the in-process run with two chains), user arrays from CSV,
// and one-line errors with exit code 2.
import { describe, expect, it } from 'vitest';
import { cli } from './test-io.ts';
import { exactDiagonalisation } from '../../src/core/ed/exact-diagonalisation.ts';
import { variationalMonteCarlo } from '../../src/core/vmc/variational-monte-carlo.ts';
import { parseSiteCsv } from '../../src/core/cluster/site-array.ts';

const RING = ['--lattice', 'chain', '--size', '8', '--interaction', 'vdw', '--rb', '1.5', '--mu', '1.5'];
const ringSpec = { kind: 'periodic' as const, lattice: 'chain' as const, size: [8], interaction: { shape: 'vdw' as const, Rb: 1.5 } };

describe('ed command', () => {
  it('--alpha --json: energyPerSite, density, structureFactor [{k, value}], correlation, siteDensities', async () => {
    const r = await cli(['ed', ...RING, '--alpha', '0.3', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    const direct = exactDiagonalisation({ cluster: ringSpec, mu: 1.5, alpha: 0.3 });
    expect(j.energyPerSite).toBe(direct.energyPerSite);
    expect(j.density).toBe(direct.density);
    expect(j.siteDensities).toEqual(direct.siteDensities);
    expect(j.structureFactor).toHaveLength(8);
    expect(typeof j.structureFactor[0].k).toBe('number');
    expect(j.structureFactor.map((p: { value: number }) => p.value)).toEqual(direct.structureFactor.map((p) => p.value));
    expect(j.correlation[0]).toHaveProperty('r', 1);
  });

  it('--detuning without --alpha: self-consistent e and alpha; a table without --json', async () => {
    const r = await cli(['ed', ...RING, '--detuning', '2.2', '--json']);
    const j = JSON.parse(r.out);
    expect(j.selfConsistent).toBe(true);
    expect(j.energyPerSite).toBe(exactDiagonalisation({ cluster: ringSpec, mu: 1.5, delta: 2.2 }).energyPerSite);
    const t = await cli(['ed', ...RING, '--alpha', '0.3']);
    expect(t.out).toMatch(/energy per site\s+-0\.6/);
  });

  it('--sites CSV in um with --spacing', async () => {
    const csv = 'x,y\n0,0\n5,0\n10,0\n0,5\n5,5\n';
    const r = await cli(['ed', '--sites', 'a.csv', '--spacing', '5', '--lattice', 'square', '--rb', '1.2', '--mu', '1', '--alpha', '0.3', '--json'], new Map([['a.csv', csv]]));
    expect(r.code).toBe(0);
    const direct = exactDiagonalisation({ cluster: { kind: 'array', lattice: 'square', positions: parseSiteCsv(csv, 5), interaction: { shape: 'vdw', Rb: 1.2 } }, mu: 1, alpha: 0.3 });
    expect(JSON.parse(r.out).energyPerSite).toBe(direct.energyPerSite);
  });
});

describe('vmc command', () => {
  it('--workers 2 --seed 7 --json equals the in-process run with 2 chains, bit for bit', async () => {
    const args = ['vmc', ...RING, '--alpha', '0.3', '--seed', '7', '--workers', '2', '--steps', '20', '--sweeps', '1024', '--json'];
    const r = await cli(args);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    const direct = variationalMonteCarlo({ cluster: ringSpec, mu: 1.5, alpha: 0.3, seed: 7, chains: 2, steps: 20, sweeps: 1024, ansatz: { oneBody: 'site' } });
    expect(j.energyPerSite).toEqual(direct.energyPerSite);
    expect(j.siteDensities).toEqual(direct.siteDensities);
    expect(j.trace).toEqual(direct.trace);
    for (const k of ['energyPerSite', 'density', 'sigmaX']) expect(j[k]).toHaveProperty('error');
    expect(j.structureFactor[0]).toHaveProperty('error');
    expect(r.err).toMatch(/^vmc: 21 of 21 steps/);
  });

  it.each([
    [['vmc', ...RING, '--alpha', '0.3', '--one-body', 'x'], /--one-body must be/],
    [['vmc', ...RING, '--alpha', '0.3', '--workers', '0'], /--workers must be >= 1/],
    [['ed', ...RING], /needs --alpha .* or --detuning/],
    [['ed', '--size', '22', '--rb', '1', '--mu', '1', '--alpha', '1'], /limited to N <= 20/],
    [['ed', '--sites', 'b.csv', '--rb', '1', '--mu', '1', '--alpha', '1'], /sites line 2: x is not a number/],
    [['ed', '--size', '8', '--spacing', '3', '--rb', '1', '--mu', '1', '--alpha', '1'], /--spacing applies to --sites/],
  ])('bad input %# exits 2 with one line', async (argv, re) => {
    const r = await cli(argv as string[], new Map([['b.csv', '0,0\nq,1\n']]));
    expect(r.code).toBe(2);
    expect(r.err.trimEnd().split('\n')).toHaveLength(1);
    expect(r.err).toMatch(re);
  });
});
