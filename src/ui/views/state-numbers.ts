/**
 * The numbers of a mean-field state as table rows (label, value, unit) for the point
 * panel, and as CSV/JSON records.
 */
import type { SolveResult } from '../../core/meanfield/ground-state.ts';
import type { Table } from '../export/table.ts';

const f = (x: number, d = 6) => (Number.isFinite(x) ? Number(x.toPrecision(d)).toString() : '\u2014');

/** Summary rows of one state. */
export function stateRows(s: SolveResult): [string, string, string][] {
  const rows: [string, string, string][] = [
    ['phase', s.phase + (s.fraction ? ` ${s.fraction}` : ''), ''],
    ['sublattices M', String(s.cellSize), ''],
    ['supercell [[a, b], [0, c]]', `[[${s.cell.a}, ${s.cell.b}], [0, ${s.cell.c}]]`, ''],
    ['photon amplitude \u03b1', f(s.alpha), ''],
    ['photon density \u03b1\u00b2', f(s.photonDensity), 'per site'],
    ['emitter density \u27e8n\u27e9', f(s.emitterDensity), 'per site'],
    ['excitation density \u03c1', f(s.excitationDensity), 'per site'],
    ['grand potential \u03a9', f(s.grandPotential, 10), 'g per site'],
    ['\u03bc', f(s.mu), 'g'],
    ['\u03b4', f(s.delta), 'g'],
    ['T', f(s.T), 'g'],
  ];
  if (s.coexistence) {
    const [a, b] = s.coexistence.phases, [xa, xb] = s.coexistence.fractions;
    rows.push(['coexisting phases', `${a.phase}${a.fraction ? ' ' + a.fraction : ''} (${f(xa, 3)}) + ${b.phase}${b.fraction ? ' ' + b.fraction : ''} (${f(xb, 3)})`, 'lever rule']);
  }
  return rows;
}

/** Per-sublattice densities and coherences as a table. */
export function sublatticeTable(s: SolveResult): Table {
  return {
    columns: ['sublattice', 'm', 'sigma_x'],
    rows: s.sublatticeDensities.map((m, i) => [i, m, s.sublatticeCoherences[i]]),
  };
}
