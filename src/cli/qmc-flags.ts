/**
 * Flags of the quantum Monte Carlo commands (qmc, qmc-scan) beyond the cluster flags of
 * ed/vmc: temperature or the ground-state mode, the sweep budget, chains and workers, the
 * alpha grid of the self-consistent photon, and the momentum of the order parameter.
 * Their translation into the run settings of a QmcRequest (src/core/qmc/qmc-request.ts,
 * which checks the values).
 */
import { InputError } from '../core/input-error.ts';
import type { QmcRequest } from '../core/qmc/quantum-monte-carlo.ts';
import type { ClusterSpec } from '../core/cluster/spec.ts';
import { bool, int, num, str, type FlagSpec, type ParsedArgs } from './flags.ts';
import type { CliIo } from './io.ts';

export const QMC_FLAGS: readonly FlagSpec[] = [
  { name: 'temperature', kind: 'number', value: 'T', help: 'temperature T > 0 (units of g); beta = 1/T' },
  { name: 'ground', kind: 'bool', help: 'ground state instead: beta = 4, 8, 16, ... until the energy per site stops changing within its error' },
  { name: 'sweeps', kind: 'int', value: 'n', def: '4000', help: 'measurement sweeps per chain (the budget: a run never goes beyond it)' },
  { name: 'thermalization', kind: 'int', value: 'n', def: 'sweeps/4, >= 100', help: 'thermalisation sweeps per chain' },
  { name: 'bins', kind: 'int', value: 'n', def: '32', help: 'bins per chain (binning errors, jackknife)' },
  { name: 'seed', kind: 'int', value: 'n', def: '1', help: 'seed; chain c of a batch draws from its own stream' },
  { name: 'workers', kind: 'int', value: 'n', def: 'cores', help: 'worker threads (the result does not depend on it)' },
  { name: 'chains', kind: 'int', value: 'n', def: '--workers', help: 'independent Markov chains per alpha point (the result depends on it)' },
  { name: 'alpha-points', kind: 'int', value: 'n', def: '16', help: 'points of the coarse alpha grid of f(alpha) when self-consistent' },
  { name: 'order', kind: 'string', value: 'm1,m2', help: 'order parameter at k = m1 B1/Lx + m2 B2/Ly (integer labels; default: the peak of S(k))' },
];

/** --workers, checked (default: the machine's cores). */
export function qmcWorkers(a: ParsedArgs, io: CliIo): number {
  const w = int(a, 'workers') ?? io.defaultWorkers;
  if (!(w >= 1 && w <= 256)) throw new InputError(`--workers must be 1..256, got ${w}`, 'workers');
  return w;
}

/** --order m1,m2 as two integers. */
function orderFromArgs(a: ParsedArgs): [number, number] | undefined {
  const s = str(a, 'order');
  if (s === undefined) return undefined;
  const m = /^\s*([+-]?\d+)\s*,\s*([+-]?\d+)\s*$/.exec(s) ?? /^\s*([+-]?\d+)\s*$/.exec(s);
  if (!m) throw new InputError(`--order must be two integer momentum labels m1,m2 (like 3,0), got '${s}'`, 'order');
  return [Number(m[1]), Number(m[2] ?? 0)];
}

/**
 * Refuse an --order momentum that is not one of a periodic cluster's: labels are folded
 * into (-L/2, L/2] (src/core/qmc/qmc-geometry.ts), so on a ring of L sites k = pi is m1 = L/2.
 */
export function checkOrderMomentum(c: ClusterSpec, m: [number, number] | undefined): void {
  if (!m || c.kind !== 'periodic') return;
  const [Lx, Ly] = [c.size[0], c.size[1] ?? 1];
  const ok = (v: number, L: number) => v > -L / 2 && v <= L / 2;
  if (!ok(m[0], Lx) || !ok(m[1], Ly)) {
    throw new InputError(`--order ${m.join(',')} is not a momentum of the ${c.size.join('x')} cluster: labels m run over (-L/2, L/2]`, 'order');
  }
}

/** The run settings of the flags (everything of a QmcRequest but the cluster and the photon). */
export function qmcRunFromArgs(a: ParsedArgs, chains: number): Omit<QmcRequest, 'cluster' | 'mu' | 'alpha' | 'delta'> {
  const ground = bool(a, 'ground');
  const temperature = num(a, 'temperature');
  if (ground && temperature !== undefined) throw new InputError('give --temperature or --ground, not both', 'temperature');
  if (!ground && temperature === undefined && a.command === 'qmc') throw new InputError('qmc needs --temperature T > 0, or --ground for the ground state', 'temperature');
  const out: Omit<QmcRequest, 'cluster' | 'mu' | 'alpha' | 'delta'> = {
    ground, sweeps: int(a, 'sweeps'), thermalization: int(a, 'thermalization'), bins: int(a, 'bins'),
    chains, seed: int(a, 'seed') ?? 1, alphaPoints: int(a, 'alpha-points'), orderMomentum: orderFromArgs(a),
  };
  if (temperature !== undefined) out.temperature = temperature;
  for (const k of Object.keys(out) as (keyof typeof out)[]) if (out[k] === undefined) delete out[k];
  return out;
}
