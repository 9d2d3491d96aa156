/**
 * How a solved state is printed: a short table for people, a JSON object for programs
 * (every field of MeanFieldState, plus coexistence and notes). The notes carry the model's
 * limits where they bite (DESIGN.md): a 1D crystal at T > 0 is a mean-field artefact.
 */
import type { SolveResult } from '../core/meanfield/ground-state.ts';
import type { MeanFieldState } from '../core/meanfield/state.ts';
import type { ModelParams } from '../core/model.ts';
import { paramsJson } from '../formats/map-columns.ts';

/** The limits of mean-field that apply to this state, as sentences. */
export function stateNotes(p: ModelParams, s: MeanFieldState): string[] {
  const notes: string[] = [];
  if (p.lattice === 'chain' && p.T > 0 && (s.phase === 'density-wave' || s.phase === 'supersolid')) {
    notes.push('in 1D no density wave survives at T > 0: mean-field overstates the order here (compare with vmc/ed)');
  }
  return notes;
}

/** The JSON object `solve --json` prints. */
export function stateJson(p: ModelParams, s: SolveResult): Record<string, unknown> {
  return { ...s, coexistence: s.coexistence ?? null, params: paramsJson(p), notes: stateNotes(p, s) };
}

function phaseName(s: MeanFieldState): string {
  const label = s.phase.replace('-', ' ');
  return s.fraction ? `${label} ${s.fraction}` : label;
}

const fmt = (x: number) => (Math.abs(x) < 1e-13 ? '0' : Number(x.toPrecision(10)).toString());
const list = (xs: number[]) => xs.map((x) => Number(x.toFixed(6)).toString()).join('  ');

/** The human-readable table `solve` prints. */
export function stateText(p: ModelParams, s: SolveResult): string {
  const c = s.cell;
  const rows: [string, string][] = [
    ['phase', phaseName(s)],
    ['supercell', `M = ${s.cellSize}` + (p.lattice === 'chain' ? '' : ` (Hermite normal form a=${c.a} b=${c.b} c=${c.c})`)],
    ['sublattice density', list(s.sublatticeDensities)],
    ['sublattice <sx>', list(s.sublatticeCoherences)],
    ['photon alpha', `${fmt(s.alpha)}   (alpha^2 = ${fmt(s.photonDensity)})`],
    ['emitter density', fmt(s.emitterDensity)],
    ['excitation density', fmt(s.excitationDensity)],
    ['grand potential', `${fmt(s.grandPotential)} per site`],
    ['mu', `${fmt(s.mu)}   (detuning ${fmt(s.delta)}, T ${fmt(s.T)})`],
  ];
  if (s.coexistence) {
    const [a, b] = s.coexistence.phases, [xa, xb] = s.coexistence.fractions;
    rows.push(['coexistence', `${(100 * xa).toFixed(1)}% ${phaseName(a)} (rho ${fmt(a.excitationDensity)}) + ` +
      `${(100 * xb).toFixed(1)}% ${phaseName(b)} (rho ${fmt(b.excitationDensity)})`]);
  }
  const w = Math.max(...rows.map(([k]) => k.length));
  const notes = stateNotes(p, s).map((n) => `note: ${n}\n`).join('');
  return rows.map(([k, v]) => `${k.padEnd(w)}  ${v}\n`).join('') + notes;
}
