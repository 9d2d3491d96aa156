/**
 * `spectrum`: the fluctuation spectrum and static stability of one point. Solves the
 * mean-field state as `solve` does (--cell M restricts it to supercells of M sites, e.g.
 * the uniform condensate's own spectrum where it is not the ground state), then prints the
 * positive branches omega_n(k) along the zone path, the photon weight of each branch at
 * k = 0, the stability margin along the path, the softest mode over the zone and whether
 * the state is dynamically stable. One point runs in this process.
 */
import { InputError } from '../../core/input-error.ts';
import { validateModel } from '../../core/model.ts';
import { stateSpectrum, type StateSpectrum } from '../../core/spectrum/state-spectrum.ts';
import type { ModelParams } from '../../core/model.ts';
import { HELP_FLAG, type Command } from '../command.ts';
import { bool, int, type FlagSpec } from '../flags.ts';
import { MODEL_FLAGS, modelFromArgs, seedFromArgs } from '../model-flags.ts';
import { stateJson, stateText } from '../state-format.ts';
import { OUTPUT_FLAGS } from './solve.ts';

const SPECTRUM_FLAGS: readonly FlagSpec[] = [
  { name: 'points', kind: 'int', value: 'n', def: '129', help: 'points along the zone path (1D 0..pi; square Gamma-X-M-Gamma; triangular Gamma-M-K-Gamma)' },
];

export const spectrumCommand: Command = {
  name: 'spectrum',
  summary: 'fluctuation spectrum, stability margin and softest mode of one point',
  usage: 'spectrum --detuning delta (--mu mu | --density rho) [--rb Rb | --v1 V1 ...] [--cell M] [--points n] [--json]',
  description:
    'Solves the mean-field state of the point (as solve; --cell M keeps it to supercells of M sites)\n' +
    'and linearises the time-dependent mean-field equations about it: the positive branches\n' +
    'omega_n(k) along the zone path (frequencies in the frame rotating at mu, units of g; a state\n' +
    'of M sublattices shows M branches folded into the primitive zone, plus the photon at k = 0),\n' +
    'the photon weight of each branch at k = 0, and complex eigenvalues as a dynamical\n' +
    'instability (growth rate). The static stability is the lowest eigenvalue of 1 - chi0 U(k)\n' +
    '(the scaled Hessian of the mean-field grand potential): 1 for free emitters, > 0 stable,\n' +
    'its minimum over the zone is the margin of the softest mode at k* (kind density or photon).',
  flags: [...SPECTRUM_FLAGS, ...MODEL_FLAGS, ...OUTPUT_FLAGS, HELP_FLAG],
  examples: [
    'spectrum --lattice chain --interaction vdw --rb 1.2 --detuning 1 --mu 0.2 --cell 1',
    'spectrum --interaction nn --v1 2 --detuning 1 --mu -1 --points 33 --json',
    'spectrum --lattice triangular --interaction vdw --rb 1 --detuning 2 --mu 0.5 --temperature 0.1 --max-cell 3',
  ],
  async run(args, io) {
    const p = modelFromArgs(args);
    validateModel(p);
    const points = int(args, 'points') ?? 129;
    if (!(points >= 2 && points <= 20000)) throw new InputError(`--points must be 2..20000, got ${points}`, 'points');
    const r = stateSpectrum(p, { seed: seedFromArgs(args), points });
    io.stdout(bool(args, 'json') ? JSON.stringify(spectrumJson(p, r)) + '\n' : spectrumText(p, r));
    return 0;
  },
};

/** The JSON object `spectrum --json` prints. */
export function spectrumJson(p: ModelParams, r: StateSpectrum): Record<string, unknown> {
  return {
    state: stateJson(p, r.state),
    branches: r.branches.map((b, i) => ({ k: b.k, s: b.s, omega: b.omega, growth: b.growth, margin: r.margins[i] })),
    ticks: r.ticks,
    zoneCentre: r.zoneCentre,
    softMode: r.softMode,
    dynamicallyStable: r.dynamicallyStable,
    growth: r.growth,
    residual: r.residual,
  };
}

const f = (x: number) => (Math.abs(x) < 1e-12 ? '0' : Number(x.toPrecision(6)).toString());
const kText = (k: number | [number, number]) => (typeof k === 'number' ? f(k) : `(${f(k[0])}, ${f(k[1])})`);

/** The table `spectrum` prints for people: the state, the soft mode, then the branches at up to 17 path points. */
export function spectrumText(p: ModelParams, r: StateSpectrum): string {
  const sm = r.softMode;
  const lines = [
    stateText(p, r.state).trimEnd(),
    `soft mode           k* = ${kText(sm.k)}  margin ${f(sm.margin)} (${sm.kind}; ${sm.stable ? 'stable' : 'UNSTABLE'})`,
    `dynamics            ${r.dynamicallyStable ? 'stable (real frequencies)' : `UNSTABLE: growth rate ${f(r.growth)}`}`,
    `k = 0 branches      ${r.zoneCentre.omega.map((w, i) => `${f(w)} (photon ${f(r.zoneCentre.photonWeight[i])})`).join('  ')}`,
    '',
    `${'k'.padEnd(20)}  ${'margin'.padEnd(10)}  omega_n`,
  ];
  const n = r.branches.length, step = Math.max(1, Math.floor((n - 1) / 16));
  for (let i = 0; i < n; i += i + step >= n - 1 && i !== n - 1 ? n - 1 - i : step) {
    const b = r.branches[i];
    lines.push(`${kText(b.k).padEnd(20)}  ${f(r.margins[i]).padEnd(10)}  ${b.omega.map(f).join('  ')}${b.growth > 0 ? `   growth ${f(b.growth)}` : ''}`);
    if (i === n - 1) break;
  }
  return lines.join('\n') + '\n';
}
