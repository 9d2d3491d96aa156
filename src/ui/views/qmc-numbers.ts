/**
 * The numbers of a quantum Monte Carlo result in the correlated check: display rows
 * (value +- error beside the mean-field state of the same inputs at the same T) and the
 * export table. Energies per site of the grand-canonical K: e = (delta - mu) alpha^2 +
 * <H(alpha)>/N when alpha is self-consistent, <H(alpha)>/N when it is fixed. At T > 0 the
 * QMC number is the energy <K>/N, the mean-field Omega a free energy: they are shown side
 * by side only at T = 0 (ground-state mode), where both are energies.
 */
import type { SolveResult } from '../../core/meanfield/ground-state.ts';
import type { QmcResult } from '../../core/qmc/quantum-monte-carlo.ts';
import type { Table } from '../export/table.ts';

/** A number to `d` significant digits, a dash for none. */
export const fmt = (x: number | null | undefined, d = 6): string =>
  (x === null || x === undefined || !Number.isFinite(x) ? '\u2014' : Number(x.toPrecision(d)).toString());

/**
 * "value \u00b1 error", the value to the error's second significant digit (6 digits when
 * the error is zero or at rounding level, as for a chain frozen in one configuration).
 */
export function plusMinus(value: number, error: number): string {
  if (!Number.isFinite(value)) return '\u2014';
  // an error at rounding level (a chain frozen in one configuration) is shown as none
  if (!(error > 1e-12 * Math.max(1, Math.abs(value)))) return `${fmt(value)} \u00b1 0`;
  const digits = Math.max(1, Math.min(12, Math.floor(Math.log10(Math.abs(value) || error)) - Math.floor(Math.log10(error)) + 2));
  return `${fmt(value, digits)} \u00b1 ${fmt(error, 2)}`;
}

/** The estimates of a result by export name (value, error), in display order. */
export function qmcEstimates(r: QmcResult): [string, number, number][] {
  const out: [string, number, number][] = [
    ['energyPerSite', r.energyPerSite.value, r.energyPerSite.error],
    ['density', r.density.value, r.density.error],
    ['sigmaX', r.sigmaX.value, r.sigmaX.error],
    ['alpha', r.alpha.value, r.alpha.error],
    ['photonDensity', r.photonDensity.value, r.photonDensity.error],
    ['compressibility', r.compressibility.value, r.compressibility.error],
  ];
  if (r.binder) out.push(['binder', r.binder.value, r.binder.error]);
  if (r.orderParameter) out.push(['orderParameter', r.orderParameter.value, r.orderParameter.error]);
  return out;
}

/** Wavevector as text: k on a ring, (kx, ky) in 2D. */
function kText(k: [number, number]): string {
  return k[1] === 0 ? fmt(k[0], 4) : `(${fmt(k[0], 4)}, ${fmt(k[1], 4)})`;
}

/** Rows [quantity, QMC (cluster), mean field (infinite lattice)]. */
export function qmcRows(r: QmcResult, mf: SolveResult | undefined): [string, string, string][] {
  const pm = (e: { value: number; error: number }) => plusMinus(e.value, e.error);
  const ground = r.temperature === null;
  const mfSigmaX = mf ? mf.sublatticeCoherences.reduce((a, b) => a + b, 0) / mf.sublatticeCoherences.length : NaN;
  const energyLabel = r.selfConsistent ? 'energy per site e (g)' : 'energy per site \u27e8H(\u03b1)\u27e9/N (g)';
  const energyMf = !r.selfConsistent ? 'not comparable: \u03b1 fixed'
    : ground ? fmt(mf?.grandPotential, 10) : `\u03a9 = ${fmt(mf?.grandPotential)} (a free energy at T > 0)`;
  const rows: [string, string, string][] = [
    [energyLabel, pm(r.energyPerSite), energyMf],
    ['emitter density \u27e8n\u27e9', pm(r.density), fmt(mf?.emitterDensity)],
    ['coherence |\u27e8\u03c3x\u27e9|', plusMinus(Math.abs(r.sigmaX.value), r.sigmaX.error), fmt(Math.abs(mfSigmaX))],
    [r.selfConsistent ? 'photon amplitude \u03b1 (self-consistent)' : 'photon amplitude \u03b1 (fixed)', pm(r.alpha), fmt(mf?.alpha)],
    ['photon density \u03b1\u00b2', pm(r.photonDensity), fmt(mf?.photonDensity)],
    ['compressibility d\u27e8n\u27e9/d\u03bc', pm(r.compressibility), ''],
  ];
  if (r.orderParameter) rows.push([`order parameter m\u00b2 at k* = ${kText(r.orderParameter.k)}`, pm(r.orderParameter), '']);
  if (r.binder) rows.push(['Binder cumulant U = 1 \u2212 \u27e8m\u2074\u27e9/3\u27e8m\u00b2\u27e9\u00b2', pm(r.binder), '']);
  rows.push(
    ['finite-cluster phase', r.phase.replace('-', ' '), mf ? mf.phase.replace('-', ' ') + (mf.fraction ? ' ' + mf.fraction : '') : '\u2026'],
    ['temperature', ground ? `ground state (\u03b2 = ${fmt(r.beta, 4)}${r.ground?.converged ? '' : ', not converged'})` : `T = ${fmt(r.temperature)} (\u03b2 = ${fmt(r.beta, 4)})`, ground ? 'T = 0' : `T = ${fmt(mf?.T)}`],
    ['chains \u00d7 sweeps', `${r.chains} \u00d7 ${r.sweeps} (+ ${r.thermalization} to thermalise)`, ''],
    ['\u03c4_int of e, \u27e8n\u27e9, \u27e8\u03c3x\u27e9 (sweeps)', [r.autocorrelation.energy, r.autocorrelation.density, r.autocorrelation.sigmaX].map((t) => fmt(t, 3)).join(', '), ''],
    ['sites N', String(r.sites), '\u221e'],
  );
  return rows;
}

/** Export table: quantity, value, error (the estimates, then S(k), C(r), f(alpha) and site densities). */
export function qmcTable(r: QmcResult): Table {
  const rows: Table['rows'] = qmcEstimates(r).map(([k, v, e]) => [k, v, e]);
  for (const p of r.structureFactor) rows.push([`S(k=${kText(p.k)})`, p.value, p.error]);
  for (const p of r.correlation) rows.push([`C(r=${fmt(p.r, 6)})`, p.value, p.error]);
  for (const p of r.alphaScan ?? []) rows.push([`f(alpha=${fmt(p.alpha, 6)})-f(0)`, p.f.value, p.f.error]);
  (r.siteDensities ?? []).forEach((d, i) => rows.push([`siteDensity[${i}]`, d.value, d.error]));
  return { columns: ['quantity', 'value', 'error'], rows };
}
