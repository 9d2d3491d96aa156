// The spectrum method group on real engine worker threads: a point's spectrum and
// soft-mode line traces (one task per interaction range) equal the same calls made in
// this thread, exactly (common practice, no source: the same code on the same inputs),
// and bad input comes back as an InputError by name.
import { afterAll, describe, expect, it } from 'vitest';
import { nodeEnginePool } from '../../workers/node-spawn.ts';
import { spectrumApi } from '../../workers/api/spectrum.ts';
import type { SoftLineRequest } from '../../src/core/softmode/soft-lines.ts';

const pool = nodeEnginePool(2);
afterAll(() => pool.close());

describe('spectrum group in the worker pool', () => {
  it('spectrum of one point equals the in-process call', async () => {
    const req = { params: { lattice: 'chain' as const, interaction: { shape: 'vdw' as const, Rb: 0.9 }, delta: 1, mu: 0.2, T: 0, maxCell: 4 }, points: 17 };
    const [remote] = await pool.run([req], (r, t) => r.spectrum.spectrum(t));
    expect(remote).toEqual(spectrumApi.spectrum(req));
    expect(remote.softMode.stable).toBe(true);
  });

  it('soft lines for several ranges, one task each, equal the in-process traces', async () => {
    const base: Omit<SoftLineRequest, 'range'> = {
      base: { lattice: 'chain', interaction: { shape: 'vdw', Rb: 1 }, mu: 0, delta: 1, T: 0 },
      x: { name: 'mu', start: -0.5, stop: 0.6, count: 5 }, y: { name: 'rb', start: 0.9, stop: 1.3, count: 5 },
      phase: 'condensate', tol: 1e-3,
    };
    const tasks = ['nn', 'vdw:2', 'dipolar'].map((range) => ({ ...base, range }));
    const remote = await pool.run(tasks, (r, t) => r.spectrum.softLines(t));
    remote.forEach((res, i) => expect(res).toEqual(spectrumApi.softLines(tasks[i])));
    expect(remote.every((r) => r.lines.length > 0)).toBe(true);
  });

  it('an unknown range is refused as an InputError', async () => {
    const bad: SoftLineRequest = {
      base: { lattice: 'chain', interaction: { shape: 'vdw', Rb: 1 }, mu: 0, delta: 1, T: 0 },
      x: { name: 'mu', start: -0.5, stop: 0.6, count: 5 }, y: { name: 'rb', start: 0.9, stop: 1.3, count: 5 },
      phase: 'condensate', range: 'yukawa',
    };
    await expect(pool.run([bad], (r, t) => r.spectrum.softLines(t))).rejects.toMatchObject({ name: 'InputError' });
  });
});
