/**
 * `vmc`: variational Monte Carlo of a periodic cluster or a user's array with the Jastrow
 * wavefunction, optimised by stochastic reconfiguration (alpha alongside with --detuning),
 * one Markov chain per worker; the seed and --workers fix every number.
 */
import { InputError } from '../../core/input-error.ts';
import type { OneBodySpec } from '../../core/vmc/ansatz.ts';
import type { VmcRequest } from '../../core/vmc/variational-monte-carlo.ts';
import { variationalMonteCarloOnPool } from '../../../workers/vmc-chains.ts';
import { HELP_FLAG, type Command } from '../command.ts';
import { bool, int, num, str, type FlagSpec, type ParsedArgs } from '../flags.ts';
import { CLUSTER_FLAGS, clusterFromArgs, photonFromArgs } from '../cluster-flags.ts';
import { vmcJson, vmcText } from '../correlated-format.ts';
import { Progress } from '../progress.ts';

const VMC_FLAGS: readonly FlagSpec[] = [
  { name: 'seed', kind: 'int', value: 'n', def: '1', help: 'seed; chain c draws from the stream (seed, c)' },
  { name: 'workers', kind: 'int', value: 'n', def: 'cores', help: 'Markov chains, one per worker thread (the result depends on it)' },
  { name: 'one-body', kind: 'string', value: 'site|uniform|M|a,b,c', def: 'site', help: 'one-body amplitudes: per site, one, or per sublattice of a cell (chain period M; 2D Hermite form a,b,c)' },
  { name: 'jastrow-range', kind: 'number', value: 'r', help: 'Jastrow shells up to distance r (default: the interaction range; all shells for full range)' },
  { name: 'steps', kind: 'int', value: 'n', def: '200', help: 'stochastic-reconfiguration steps' },
  { name: 'sweeps-per-step', kind: 'int', value: 'n', def: '200', help: 'sweeps per optimisation step, over all chains' },
  { name: 'sweeps', kind: 'int', value: 'n', def: '8192', help: 'measurement sweeps, over all chains' },
  { name: 'exchange', kind: 'number', value: 'f', def: '0.25', help: 'fraction of Metropolis proposals that exchange an excitation with an empty nearest neighbour' },
  { name: 'learning-rate', kind: 'number', value: 'eta', def: '0.05', help: 'SR imaginary-time step' },
  { name: 'json', kind: 'bool', help: 'print JSON (with the optimisation trace) instead of a table' },
];

/** --one-body: 'site', 'uniform', a chain period 'M' or a 2D cell 'a,b,c'. */
function oneBodyFromArgs(a: ParsedArgs): OneBodySpec {
  const s = (str(a, 'one-body') ?? 'site').trim();
  if (s === 'site' || s === 'uniform') return s;
  const cell = s.split(',').map((x) => (/^\s*\d+\s*$/.test(x) ? Number(x) : NaN));
  if (cell.some(Number.isNaN)) throw new InputError(`--one-body must be site, uniform, M or a,b,c, got '${s}'`, 'one-body');
  return { cell };
}

export const vmcCommand: Command = {
  name: 'vmc',
  summary: 'variational Monte Carlo of a finite cluster or array (Jastrow, SR)',
  usage: 'vmc (--size L|LXxLY | --sites file.csv) --mu mu (--alpha a | --detuning delta) [--rb Rb ...] [--seed n] [flags]',
  description:
    'Optimises psi(n) = exp(sum_i a_s(i) n_i + sum_{i<j} v(d_ij) n_i n_j) by stochastic reconfiguration and\n' +
    'measures energy per site, density, <sigma^x>, per-site densities, S(k) and C(r), each with its error\n' +
    '(jackknife over bins), the acceptance, tau_int and the optimisation trace. With --detuning and no\n' +
    '--alpha the photon amplitude is optimised alongside (Hellmann-Feynman). The energy is a variational\n' +
    'upper bound; compare with `ed` on clusters up to 20 sites. One Markov chain per worker; the seed and\n' +
    '--workers fix the result bit for bit.',
  flags: [...CLUSTER_FLAGS, ...VMC_FLAGS, HELP_FLAG],
  examples: [
    'vmc --lattice chain --size 12 --interaction vdw --rb 1.5 --mu 1.5 --alpha 0.3 --seed 7 --json',
    'vmc --lattice square --size 8x8 --rb 1.2 --range 2 --mu 1 --detuning 2 --workers 2',
    'vmc --sites my-array.csv --spacing 4.5 --rb 1.3 --mu 1 --alpha 0.2 --one-body site',
  ],
  async run(args, io) {
    const cluster = clusterFromArgs(args, io);
    const workers = int(args, 'workers') ?? io.defaultWorkers;
    if (workers < 1) throw new InputError(`--workers must be >= 1, got ${workers}`, 'workers');
    const req: VmcRequest = {
      cluster, ...photonFromArgs(args), seed: int(args, 'seed') ?? 1, chains: workers,
      ansatz: { oneBody: oneBodyFromArgs(args), jastrowRange: num(args, 'jastrow-range') },
      steps: int(args, 'steps'), sweepsPerStep: int(args, 'sweeps-per-step'), sweeps: int(args, 'sweeps'),
      learningRate: num(args, 'learning-rate'), exchange: num(args, 'exchange'),
    };
    const { pool, release } = io.pool(workers);
    const progress = new Progress(io, 'vmc', (req.steps ?? 200) + 1, 'steps');
    let done = 0;
    try {
      const r = await variationalMonteCarloOnPool(req, pool, { signal: io.interrupt, onProgress: (d) => { done = d; progress.update(d); } });
      progress.finish(done, `, ${workers} worker(s)`);
      io.stdout(bool(args, 'json') ? JSON.stringify(vmcJson(cluster, r)) + '\n' : vmcText(cluster, r));
      return 0;
    } finally {
      release();
    }
  },
};
