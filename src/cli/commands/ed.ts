/**
 * `ed`: exact diagonalisation of a periodic cluster or a user's array (N <= 20 on the full
 * basis, more with --blockade), fixed --alpha or self-consistent alpha with --detuning.
 * Runs in one engine worker, so Ctrl-C stays responsive during a long Lanczos run.
 */
import type { EdRequest } from '../../core/ed/exact-diagonalisation.ts';
import { HELP_FLAG, type Command } from '../command.ts';
import { bool, num, type FlagSpec } from '../flags.ts';
import { CLUSTER_FLAGS, clusterFromArgs, photonFromArgs } from '../cluster-flags.ts';
import { edJson, edText } from '../correlated-format.ts';

const ED_FLAGS: readonly FlagSpec[] = [
  { name: 'blockade', kind: 'number', value: 'Vb', help: 'truncated basis: drop states with an excited pair of V_ij >= Vb (e.g. 2 = V(Rb)); allows N up to 30' },
  { name: 'json', kind: 'bool', help: 'print JSON instead of a table' },
];

export const edCommand: Command = {
  name: 'ed',
  summary: 'exact ground state of a finite cluster or array (Lanczos)',
  usage: 'ed (--size L|LXxLY | --sites file.csv) --mu mu (--alpha a | --detuning delta) [--rb Rb ...] [flags]',
  description:
    'Ground state of H(alpha) = sum_i [-mu n_i - alpha sigma^x_i] + sum_{i<j} V_ij n_i n_j by Lanczos on the\n' +
    '2^N occupation basis (N <= 20), on a periodic cluster (V_ij summed over all images) or your own array\n' +
    '(open boundaries). With --alpha the photon amplitude is fixed and energyPerSite = <H(alpha)>/N; with\n' +
    '--detuning and no --alpha, alpha minimises e = (delta - mu) alpha^2 + E0/N and energyPerSite = e.\n' +
    'Prints density, <sigma^x>, per-site densities, S(k) = (1/N) sum_ij e^{ik(ri-rj)} (<ninj> - <ni><nj>)\n' +
    'on the cluster momenta and C(r) on the distance shells.',
  flags: [...CLUSTER_FLAGS, ...ED_FLAGS, HELP_FLAG],
  examples: [
    'ed --lattice chain --size 12 --interaction vdw --rb 1.5 --mu 1.5 --alpha 0.3 --json',
    'ed --lattice square --size 4x4 --rb 1.2 --range 2 --mu 1 --detuning 2',
    'ed --sites my-array.csv --spacing 4.5 --rb 1.3 --mu 1 --alpha 0.2',
  ],
  async run(args, io) {
    const cluster = clusterFromArgs(args, io);
    const req: EdRequest = { cluster, ...photonFromArgs(args) };
    const blockade = num(args, 'blockade');
    if (blockade !== undefined) req.blockade = blockade;
    const { pool, release } = io.pool(1);
    try {
      const r = await pool.run([req], (remote, q) => remote.correlated.ed(q), { signal: io.interrupt });
      io.stdout(bool(args, 'json') ? JSON.stringify(edJson(cluster, r[0])) + '\n' : edText(cluster, r[0]));
      return 0;
    } finally {
      release();
    }
  },
};
