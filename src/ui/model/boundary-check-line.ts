/**
 * The line of a "check this boundary" on the phase map, as the user picks it and as the
 * QMC line scan runs it. Two picked points (x0, y0), (x1, y1) in map units are snapped to
 * the map axis along which they differ more (in units of each axis's span): the scan runs
 * that parameter from the lower to the higher end, the other held at the first point's
 * value. A QMC scan varies one parameter (workers/qmc-scan-plan.ts), so the line drawn is
 * exactly the line computed. Stored in the URL as "x0,y0;x1,y1".
 *
 * Also: where the mean-field phase changes along the line (from the map's own grid
 * states), to set beside the QMC Binder crossing.
 */
import type { AxisName } from '../../core/scan/axes.ts';
import type { QmcAxisName } from '../../../workers/protocol.ts';

/** Map axis -> QMC scan axis (the density axis has no QMC counterpart: QMC works at fixed mu). */
export const QMC_AXIS_OF: Partial<Record<AxisName, QmcAxisName>> = {
  mu: 'mu', temperature: 'temperature', detuning: 'detuning', rb: 'rb', v1: 'v1',
};

export interface CheckLine {
  /** Which map axis varies along the line. */
  along: 'x' | 'y';
  /** Its map and QMC names. */
  name: AxisName;
  qmcName: QmcAxisName;
  start: number;
  stop: number;
  /** The other map axis and its fixed value. */
  fixedName: AxisName;
  fixedQmcName: QmcAxisName;
  fixed: number;
}

/** "x0,y0;x1,y1" -> the two points (null while fewer than two are given or one is not finite). */
export function parseCheckEnds(text: string): [[number, number], [number, number]] | null {
  const pts = text.split(';').map((p) => p.trim()).filter(Boolean).map((p) => p.split(',').map((v) => Number(v.trim())));
  if (pts.length !== 2 || pts.some((p) => p.length !== 2 || !p.every(Number.isFinite))) return null;
  return [[pts[0][0], pts[0][1]], [pts[1][0], pts[1][1]]];
}

/** The stored ends after one more pick: a first pick starts a new line, a second completes it. */
export function addPick(text: string, x: number, y: number, first: boolean): string {
  const p = `${+x.toPrecision(6)},${+y.toPrecision(6)}`;
  if (first) return p;
  const a = text.split(';')[0]?.trim();
  return a ? `${a};${p}` : p;
}

/**
 * Snap the picked ends onto one axis. Throws an Error naming the reason when the line
 * cannot be scanned: equal ends, or an axis QMC has no counterpart for.
 */
export function checkLine(ends: [[number, number], [number, number]], x: { name: AxisName; span: number }, y: { name: AxisName; span: number }): CheckLine {
  const [[x0, y0], [x1, y1]] = ends;
  const dx = Math.abs(x1 - x0) / (Math.abs(x.span) || 1), dy = Math.abs(y1 - y0) / (Math.abs(y.span) || 1);
  if (dx === 0 && dy === 0) throw new Error('the two ends of the line are the same point: pick two different points');
  const along = dx >= dy ? 'x' : 'y';
  const [a, b, name, fixedName, fixed] = along === 'x' ? [x0, x1, x.name, y.name, y0] : [y0, y1, y.name, x.name, x0];
  const qmcName = QMC_AXIS_OF[name];
  if (!qmcName) throw new Error(`QMC cannot scan along ${name} (it works at fixed \u03bc): pick a line along the other axis, or map over \u03bc`);
  const fixedQmcName = QMC_AXIS_OF[fixedName];
  if (!fixedQmcName) throw new Error(`QMC cannot hold ${fixedName} fixed (it works at fixed \u03bc): map over \u03bc instead of the density`);
  return { along, name, qmcName, start: Math.min(a, b), stop: Math.max(a, b), fixedName, fixedQmcName, fixed };
}

/** Map coordinates of the point at parameter t along the line. */
export function lineToMap(l: CheckLine, t: number): [number, number] {
  return l.along === 'x' ? [t, l.fixed] : [l.fixed, t];
}

/**
 * Where a sequence of labels along the line changes: the midpoints between neighbouring
 * values of different label, with half the spacing as their uncertainty (the grid step
 * bounds a boundary located on a grid). Undefined labels (not computed) are skipped.
 */
export function labelChanges(values: readonly number[], labels: readonly (string | undefined)[]): { at: number; halfWidth: number; from: string; to: string }[] {
  const out: { at: number; halfWidth: number; from: string; to: string }[] = [];
  let prev = -1;
  for (let i = 0; i < values.length; i++) {
    if (labels[i] === undefined) continue;
    if (prev >= 0 && labels[i] !== labels[prev]) {
      out.push({ at: (values[prev] + values[i]) / 2, halfWidth: Math.abs(values[i] - values[prev]) / 2, from: labels[prev]!, to: labels[i]! });
    }
    prev = i;
  }
  return out;
}
