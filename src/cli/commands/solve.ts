/**
 * `solve`: the mean-field ground state of one point (lowest grand potential over every
 * supercell up to Mmax), printed as a table or, with --json, as one JSON object.
 * Solved in the main thread: one point does not pay for starting a worker.
 */
import { solveGroundState } from '../../core/meanfield/ground-state.ts';
import { validateModel } from '../../core/model.ts';
import { HELP_FLAG, type Command } from '../command.ts';
import { bool, type FlagSpec } from '../flags.ts';
import { MODEL_FLAGS, modelFromArgs, seedFromArgs } from '../model-flags.ts';
import { stateJson, stateText } from '../state-format.ts';

export const OUTPUT_FLAGS: readonly FlagSpec[] = [
  { name: 'json', kind: 'bool', help: 'print JSON instead of a table' },
];

export const solveCommand: Command = {
  name: 'solve',
  summary: 'the mean-field ground state of one point',
  usage: 'solve --detuning delta (--mu mu | --density rho) [--rb Rb | --v1 V1 ...] [flags]',
  description:
    'Finds the state of lowest grand potential over every supercell up to --max-cell sublattices\n' +
    '(sublattice mean-field at temperature T) and prints its phase, filling fraction, sublattice\n' +
    'densities and coherences, photon, emitter and excitation densities and grand potential.\n' +
    'Energies are in units of the collective coupling g, lengths in the lattice spacing a.\n' +
    'With --density the chemical potential is solved for; inside a first-order jump the two\n' +
    'coexisting phases and their lever-rule fractions are reported.',
  flags: [...MODEL_FLAGS, ...OUTPUT_FLAGS, HELP_FLAG],
  examples: [
    'solve --lattice chain --interaction vdw --rb 1.5 --detuning 3 --mu 0.5',
    'solve --rb 1.5 --detuning 3 --density 0.4 --json',
    'solve --lattice square --interaction nn --v1 2 --detuning 1 --mu 0.2 --cell 1',
  ],
  async run(args, io) {
    const p = modelFromArgs(args);
    validateModel(p);
    const s = solveGroundState(p, { seed: seedFromArgs(args) });
    io.stdout(bool(args, 'json') ? JSON.stringify(stateJson(p, s)) + '\n' : stateText(p, s));
    return 0;
  },
};
