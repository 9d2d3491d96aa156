/**
 * The QMC line scan of a "check this boundary" (workers/protocol.ts QmcScanRequest) built
 * from the model form, the snapped line and the check's entries, and the `qmc-scan` command
 * line that computes the same runs. The model comes from scanBase with both map axes left
 * out (as the CLI gets it from the form's flags without them), the fixed axis is applied by
 * the scan plan's own applyQmcAxis and the line's values come from the CLI's own parser
 * (parseQmcAxis), so page and command agree value for value.
 */
import { InputError } from '../../core/input-error.ts';
import { formatRange } from '../../core/scan/axes.ts';
import type { QmcScanRequest } from '../../../workers/protocol.ts';
import { applyQmcAxis, parseQmcAxis, parseSizes } from '../../../workers/qmc-scan-plan.ts';
import type { ModelInputs } from '../state/app-state.ts';
import { scanBase } from './model-inputs.ts';
import { parseNumber } from './model-inputs.ts';
import type { CheckLine } from './boundary-check-line.ts';
import { cliLine, modelFlags } from '../export/cli-command.ts';

/** The check's own entries as typed (the atlas section's keys). */
export interface CheckEntries { sizes: string; cpoints: string; csweeps: string; ctemp: string; cground: string }

/** Points of the alpha grid of each run (self-consistent photon), seed and chains per run. */
export const CHECK_RUN = { alphaPoints: 8, seed: 1, chains: 1 } as const;

/** The QMC temperature of the check: the fixed axis when it is T, else the entry (null: ground state). */
function qmcTemperature(line: CheckLine, e: CheckEntries): number | null {
  if (line.fixedName === 'temperature') return line.fixed > 0 ? line.fixed : null;
  if (line.name === 'temperature') return 1; // set per point by the axis
  if (e.cground === '1') return null;
  const T = parseNumber(e.ctemp);
  if (!(T > 0)) throw new InputError(`the check's temperature must be > 0 (got "${e.ctemp}"), or tick the ground state`, 'ctemp');
  return T;
}

/** `line` axis text for parseQmcAxis / the CLI's --x. */
export function axisText(line: CheckLine, count: number): string {
  return `${line.qmcName}=${formatRange({ start: line.start, stop: line.stop, count })}`;
}

/** The scan request; InputError names the entry at fault. */
export function checkRequest(inputs: ModelInputs, line: CheckLine, e: CheckEntries): QmcScanRequest {
  const p = scanBase(inputs, [line.name, line.fixedName]);
  if (!p) throw new InputError('the model has an invalid entry', 'model');
  const count = parseNumber(e.cpoints), sweeps = parseNumber(e.csweeps);
  if (!Number.isInteger(count) || count < 2 || count > 101) throw new InputError(`points along the line must be a whole number from 2 to 101, got "${e.cpoints}"`, 'cpoints');
  if (!Number.isInteger(sweeps) || sweeps < 64) throw new InputError(`sweeps must be a whole number >= 64, got "${e.csweeps}"`, 'csweeps');
  const sizes = parseSizes(e.sizes);
  const T = qmcTemperature(line, e);
  let base: QmcScanRequest['base'] = {
    cluster: { kind: 'periodic', lattice: p.lattice, size: [2], interaction: p.interaction },
    mu: p.mu ?? 0,
    ...(line.name === 'detuning' || line.fixedName === 'detuning' ? {} : { delta: p.delta }),
    ...(T === null ? { ground: true } : { temperature: T }),
    sweeps, chains: CHECK_RUN.chains, seed: CHECK_RUN.seed, alphaPoints: CHECK_RUN.alphaPoints,
  };
  if (p.mu === undefined && line.name !== 'mu' && line.fixedName !== 'mu') throw new InputError('QMC works at fixed \u03bc: set the pump as a chemical potential', 'mu');
  if (line.fixedName !== 'temperature') base = applyQmcAxis(base, line.fixedQmcName, line.fixed);
  return { base, sizes, axis: parseQmcAxis(axisText(line, count)) };
}

/** The `qmc-scan` command line of the same runs. */
export function checkCommand(inputs: ModelInputs, line: CheckLine, req: QmcScanRequest): string {
  const drop = new Set(['--temperature', '--max-cell', '--density', '--cell']);
  const model = modelFlags(inputs, [line.name, line.fixedName]);
  const flags: string[] = [];
  for (let i = 0; i < model.length; i += 2) if (!drop.has(model[i])) flags.push(model[i], model[i + 1]);
  const b = req.base;
  if (line.fixedName !== 'temperature') flags.push(`--${line.fixedName}`, String(line.fixed));
  const T = b.ground ? ['--ground'] : line.name === 'temperature' ? [] : ['--temperature', String(b.temperature)];
  return cliLine('qmc-scan', [...flags, ...T, '--x', axisText(line, req.axis.values.length), '--sizes', req.sizes.join(','),
    '--sweeps', String(b.sweeps), '--alpha-points', String(b.alphaPoints), '--chains', String(b.chains), '--seed', String(b.seed), '--json']);
}
