// Quantum Monte Carlo on real worker threads: the pool changes no number. The run on one
// worker, on two, and in this thread (quantumMonteCarlo) are equal bit for bit for the same
// seed and chain count (every chain is fixed by its seed and index; the pool returns results
// in task order), through every batch of a self-consistent run (grid, refinement,
// measurement). A scan's points equal the same runs made one by one. Source of the check
// values: the in-thread core itself (equality, no tolerance).
import { afterAll, describe, expect, it } from 'vitest';
import { nodeEnginePool } from '../../workers/node-spawn.ts';
import { quantumMonteCarloOnPool } from '../../workers/qmc-run.ts';
import { qmcScanOnPool } from '../../workers/qmc-scan.ts';
import { qmcScanTasks } from '../../workers/qmc-scan-plan.ts';
import { quantumMonteCarlo, type QmcRequest } from '../../src/core/qmc/quantum-monte-carlo.ts';
import type { QmcProgress, QmcScanRequest } from '../../workers/protocol.ts';

const ring = { kind: 'periodic' as const, lattice: 'chain' as const, size: [6], interaction: { shape: 'nn' as const, V1: 1 } };
const req: QmcRequest = { cluster: ring, mu: 0.6, delta: 1.8, temperature: 0.5, sweeps: 128, bins: 8, thermalization: 32, alphaPoints: 4, chains: 2, seed: 11 };

const one = nodeEnginePool(1), two = nodeEnginePool(2);
afterAll(() => { one.close(); two.close(); });

describe('quantumMonteCarloOnPool', () => {
  it('1 worker, 2 workers and this thread give the same result bit for bit', async () => {
    const stages: QmcProgress['stage'][] = [];
    const [a, b] = await Promise.all([
      quantumMonteCarloOnPool(req, one),
      quantumMonteCarloOnPool(req, two, { onProgress: (p) => { if (!stages.includes(p.stage)) stages.push(p.stage); } }),
    ]);
    const direct = quantumMonteCarlo(req);
    expect(a).toEqual(direct);
    expect(b).toEqual(direct);
    expect(direct.alphaScan?.length).toBeGreaterThan(4); // the grid and its refinement were both run
    expect(stages).toEqual(['grid', 'refine', 'measure']);
  }, 20_000);

  it('an aborted signal ends the run with an AbortError', async () => {
    await expect(quantumMonteCarloOnPool(req, one, { signal: AbortSignal.abort() })).rejects.toMatchObject({ name: 'AbortError' });
  });
});

describe('qmcScanOnPool', () => {
  it('each point equals the same run in this thread; a shard holds index mod n = k - 1', async () => {
    const scan: QmcScanRequest = {
      base: { cluster: ring, mu: 0.5, alpha: 0.3, sweeps: 128, bins: 8, thermalization: 32, seed: 5 },
      sizes: [4, 6], axis: { name: 'temperature', values: [0.4, 0.8] },
    };
    const points = await qmcScanOnPool(scan, two);
    expect(points.map((p) => [p.index, p.size, p.value])).toEqual([[0, 4, 0.4], [1, 4, 0.8], [2, 6, 0.4], [3, 6, 0.8]]);
    for (const t of qmcScanTasks(scan)) expect(points[t.index].result).toEqual(quantumMonteCarlo(t.request));
    expect(qmcScanTasks({ ...scan, shard: { k: 2, n: 3 } }).map((t) => t.index)).toEqual([1]);
  }, 20_000);
});
