import { describe, it, expect } from 'vitest';
import { variationalMonteCarlo, type VmcRequest } from '../../../src/core/vmc/variational-monte-carlo.ts';
import { InputError } from '../../../src/core/input-error.ts';

const ok: VmcRequest = { cluster: { kind: 'periodic', lattice: 'chain', size: [6], interaction: { shape: 'nn', V1: 1 } }, mu: 1, alpha: 0.3, seed: 1, steps: 2, sweeps: 64 };
const refuse = async (req: VmcRequest, re: RegExp) => {
  expect(() => variationalMonteCarlo(req)).toThrow(InputError);
  expect(() => variationalMonteCarlo(req)).toThrow(re);
};

describe('VMC refuses bad input with InputError', () => {
  it('photon and pump', async () => {
    await refuse({ ...ok, alpha: -1 }, /alpha must be >= 0/);
    await refuse({ ...ok, alpha: undefined }, /give alpha/);
    await refuse({ ...ok, alpha: undefined, delta: 0.5 }, /photon number is unbounded/);
  });
  it('run sizes', async () => {
    await refuse({ ...ok, chains: 0 }, /chains must be an integer >= 1/);
    await refuse({ ...ok, steps: 1.5 }, /steps/);
    await refuse({ ...ok, bins: 1 }, /bins must be an integer >= 2/);
  });
  it('optimiser settings (issue 10: a negative learning rate was taken silently)', async () => {
    await refuse({ ...ok, learningRate: -1 }, /learning-rate must be > 0/);
    await refuse({ ...ok, learningRate: 0 }, /learning-rate must be > 0/);
    await refuse({ ...ok, shift: -1e-3 }, /shift must be >= 0/);
  });
  it('one-body cells', async () => {
    await refuse({ ...ok, ansatz: { oneBody: { cell: [4] } } }, /does not tile the 6x1 cluster/);
    await refuse({ ...ok, ansatz: { oneBody: { cell: [2, 0, 1] } } }, /cell must be \[M\]/);
    await refuse({ ...ok, cluster: { kind: 'array', lattice: 'square', positions: [0, 0, 1, 0], interaction: { shape: 'nn', V1: 1 } }, ansatz: { oneBody: { cell: [2] } } }, /needs a periodic cluster/);
  });
});
