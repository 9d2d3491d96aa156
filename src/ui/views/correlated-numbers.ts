/**
 * The numbers of a correlated result (ED or VMC) beside the mean-field state of the same
 * inputs, as display rows and as an export table. Energies per site of the grand-canonical
 * K: e = (delta - mu) alpha^2 + <H(alpha)>/N for ED/VMC, Omega for mean field (the same
 * quantity; mean field is an upper bound on the infinite lattice, ED exact on the cluster).
 */
import type { SolveResult } from '../../core/meanfield/ground-state.ts';
import type { Table } from '../export/table.ts';
import type { Correlated } from './correlated-view.ts';

const f = (x: number | null | undefined, d = 6) => (x === null || x === undefined || !Number.isFinite(x) ? '\u2014' : Number(x.toPrecision(d)).toString());
const pm = (v: number, e: number) => `${f(v)} \u00b1 ${f(e, 2)}`;

/** Plain values (value, error) of the quantities both methods report. */
function values(v: Correlated): Record<string, [number, number] | null> {
  if (v.kind === 'ed') {
    const r = v.r;
    return {
      energyPerSite: [r.energyPerSite, 0], density: [r.density, 0], photonDensity: [r.photonDensity, 0],
      alpha: [r.alpha, 0], sigmaX: [r.sigmaX, 0],
    };
  }
  const r = v.r;
  return {
    energyPerSite: [r.energyPerSite.value, r.energyPerSite.error], density: [r.density.value, r.density.error],
    photonDensity: [r.photonDensity.value, r.photonDensity.error], alpha: [r.alpha.value, r.alpha.error],
    sigmaX: [r.sigmaX.value, r.sigmaX.error],
  };
}

/** Rows [quantity, correlated, mean field]. */
export function comparisonRows(v: Correlated | undefined, mf: SolveResult | undefined, fixedAlpha = false): [string, string, string][] {
  const x = v ? values(v) : null;
  const show = (k: string) => {
    const e = x?.[k];
    if (!e) return '\u2026';
    return e[1] > 0 ? pm(e[0], e[1]) : f(e[0], 10);
  };
  const mfSigmaX = mf ? mf.sublatticeCoherences.reduce((a, b) => a + b, 0) / mf.sublatticeCoherences.length : NaN;
  return [
    fixedAlpha
      ? ['energy per site \u27e8H(\u03b1)\u27e9/N (g)', show('energyPerSite'), 'not comparable: \u03b1 fixed']
      : ['energy per site e (g)', show('energyPerSite'), f(mf?.grandPotential, 10)],
    ['emitter density \u27e8n\u27e9', show('density'), f(mf?.emitterDensity)],
    ['photon amplitude \u03b1', show('alpha'), f(mf?.alpha)],
    ['photon density \u03b1\u00b2', show('photonDensity'), f(mf?.photonDensity)],
    ['coherence |\u27e8\u03c3x\u27e9|', x?.sigmaX ? f(Math.abs(x.sigmaX[0])) : '\u2026', f(Math.abs(mfSigmaX))],
    ...(v?.kind === 'vmc' ? [['acceptance', f(v.r.acceptance, 3), ''] as [string, string, string], ['\u03c4_int (sweeps)', f(v.r.tauInt, 3), ''] as [string, string, string]] : []),
    ...(v ? [['sites N', String(v.r.sites), '\u221e'] as [string, string, string]] : []),
  ];
}

/** Export table: quantity, value, error. */
export function correlatedTable(v: Correlated): Table {
  const x = values(v);
  const rows: Table['rows'] = Object.entries(x).map(([k, e]) => [k, e ? e[0] : null, e ? e[1] : null]);
  const dens = v.kind === 'ed' ? v.r.siteDensities.map((d) => [d, 0]) : v.r.siteDensities.map((d) => [d.value, d.error]);
  dens.forEach(([d, e], i) => rows.push([`siteDensity[${i}]`, d, e]));
  return { columns: ['quantity', 'value', 'error'], rows };
}
