/**
 * `qmc`: unbiased quantum Monte Carlo (stochastic series expansion) of a periodic cluster
 * or a user's array at temperature T or in the ground state, with the photon amplitude
 * fixed (--alpha) or self-consistent from the global minimum of f(alpha) (--detuning):
 * src/core/qmc/quantum-monte-carlo.ts run on the worker pool (workers/qmc-run.ts). The
 * seed and --chains fix every number; --workers only the speed. Ctrl-C stops it (130).
 */
import { InputError } from '../../core/input-error.ts';
import type { QmcRequest } from '../../core/qmc/quantum-monte-carlo.ts';
import { quantumMonteCarloOnPool } from '../../../workers/qmc-run.ts';
import { HELP_FLAG, type Command } from '../command.ts';
import { bool, int, type FlagSpec } from '../flags.ts';
import { CLUSTER_FLAGS, clusterFromArgs, photonFromArgs } from '../cluster-flags.ts';
import { interruptible } from '../io.ts';
import { checkOrderMomentum, QMC_FLAGS, qmcRunFromArgs, qmcWorkers } from '../qmc-flags.ts';
import { qmcJson, qmcText } from '../qmc-format.ts';
import { QmcProgressLine } from '../qmc-progress.ts';

const JSON_FLAG: FlagSpec = { name: 'json', kind: 'bool', help: 'print JSON (every observable as {value, error}, S(k), C(r), the f(alpha) scan, notes, params)' };

export const qmcCommand: Command = {
  name: 'qmc',
  summary: 'unbiased quantum Monte Carlo (SSE) of a cluster or array, any T, cavity self-consistent',
  usage: 'qmc (--size L|LXxLY | --sites file.csv) --mu mu (--alpha a | --detuning delta) (--temperature T | --ground) [flags]',
  description:
    'Samples H(alpha) = sum_i [-mu n_i - alpha sigma^x_i] + sum_{i<j} V_ij n_i n_j without bias by stochastic\n' +
    'series expansion (diagonal, cluster and line updates; O(1) bond sampling from alias tables) and reports\n' +
    'energy per site, <n>, <sigma^x>, compressibility, S(k) at every momentum, C(r), the order parameter and\n' +
    'its Binder cumulant, each with a binning error, tau_int and the drift between the halves of the run.\n' +
    'With --detuning and no --alpha the photon amplitude minimises f(alpha) = (delta - mu) alpha^2 + f_spin(alpha),\n' +
    'exact as N -> infinity: f is integrated from <sigma^x> over an alpha grid, so first-order jumps are found\n' +
    'and competing minima reported. --ground doubles beta until the energy is converged. Independent chains\n' +
    'run on the worker threads; the seed and --chains fix the result bit for bit, whatever --workers.',
  flags: [...CLUSTER_FLAGS, ...QMC_FLAGS, JSON_FLAG, HELP_FLAG],
  examples: [
    'qmc --lattice chain --size 16 --interaction nn --v1 1 --mu 1 --alpha 0.25 --temperature 0.1 --json',
    'qmc --lattice chain --size 32 --interaction nn --v1 1 --mu 1 --detuning 2 --ground --workers 2',
    'qmc --lattice square --size 16x16 --rb 1.2 --range 2 --mu 1 --alpha 0.3 --temperature 0.2 --order 8,8',
    'qmc --sites my-array.csv --spacing 4.5 --rb 1.3 --mu 1 --alpha 0.2 --temperature 0.05',
  ],
  async run(args, io) {
    const cluster = clusterFromArgs(args, io);
    const workers = qmcWorkers(args, io);
    const chains = int(args, 'chains') ?? workers;
    if (!(chains >= 1)) throw new InputError(`--chains must be >= 1, got ${chains}`, 'chains');
    const req: QmcRequest = { cluster, ...photonFromArgs(args), ...qmcRunFromArgs(args, chains) };
    checkOrderMomentum(cluster, req.orderMomentum);
    const progress = new QmcProgressLine(io, 'qmc');
    const run = await interruptible(io, workers, (pool, signal) => quantumMonteCarloOnPool(req, pool, { signal, onProgress: (p) => progress.update(p) }));
    if (!run.complete) {
      progress.finish(', interrupted');
      io.stderr('interrupted: no result (a QMC run gives its numbers only at the end)\n');
      return 130;
    }
    progress.finish(` on ${workers} worker(s)`);
    io.stdout(bool(args, 'json') ? JSON.stringify(qmcJson(cluster, run.value, req, workers)) + '\n' : qmcText(cluster, run.value, workers));
    return 0;
  },
};
