/**
 * How `qmc-scan` prints: CSV with one row per cluster size and axis value (index, size, the
 * axis value (column named after the axis; 'alphaAxis' for alpha), then energy, density, sigmaX, alpha, photonDensity, orderParameter and binder,
 * each followed by its error, then the phase and, for a failed run, why), or JSON with the
 * same per point (the axis value as `value`) plus the notes and the Binder crossings; and the crossings in one line.
 */
import type { BinderCrossing } from '../core/qmc/binder-crossing.ts';
import type { QmcScanPoint, QmcScanRequest } from '../../workers/protocol.ts';

type Estimate = { value: number; error: number };

/** Observables of a row, in column order (each with an error column after it). */
const OBSERVABLES = ['energy', 'density', 'sigmaX', 'alpha', 'photonDensity', 'orderParameter', 'binder'] as const;

/** One point's observables as { value, error } (null where the run has none). */
export function pointSummary(p: QmcScanPoint): Record<(typeof OBSERVABLES)[number], Estimate | null> {
  const r = p.result;
  const e = (x: Estimate | null | undefined) => (x ? { value: x.value, error: x.error } : null);
  return {
    energy: e(r?.energyPerSite), density: e(r?.density), sigmaX: e(r?.sigmaX), alpha: e(r?.alpha),
    photonDensity: e(r?.photonDensity), orderParameter: e(r?.orderParameter), binder: e(r?.binder),
  };
}

/** The CSV column of the axis: its name, but 'alphaAxis' beside the observable alpha. */
export function axisColumn(name: string): string {
  return name === 'alpha' ? 'alphaAxis' : name;
}

function field(v: number | string | null | undefined): string {
  if (v === null || v === undefined) return '';
  const s = String(v);
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** The CSV head: a '# ...' line naming the shard when sharded, then the column names (ends with a line end). */
export function qmcScanCsvHead(req: QmcScanRequest): string {
  const head = ['index', 'size', axisColumn(req.axis.name), ...OBSERVABLES.flatMap((o) => [o, `${o}Error`]), 'phase', 'error'];
  const tag = req.shard ? `# blockade-atlas qmc-scan shard=${req.shard.k}/${req.shard.n} points=${req.sizes.length * req.axis.values.length}\n` : '';
  return tag + head.join(',') + '\n';
}

/** One point's CSV row (no line end). */
export function qmcScanCsvRow(p: QmcScanPoint): string {
  const s = pointSummary(p);
  return [p.index, p.size, p.value, ...OBSERVABLES.flatMap((o) => [s[o]?.value, s[o]?.error]), p.result?.phase, p.error].map(field).join(',');
}

/** The CSV: head, then one row a point. */
export function qmcScanCsv(req: QmcScanRequest, points: readonly QmcScanPoint[]): string {
  return qmcScanCsvHead(req) + points.map((p) => qmcScanCsvRow(p) + '\n').join('');
}

/** The fields of the JSON document before its points (the scan's identity, checked by --resume). */
export function qmcScanJsonFields(req: QmcScanRequest): Record<string, unknown> {
  const { cluster, ...run } = req.base;
  return { axis: req.axis, sizes: req.sizes, shard: req.shard ?? null, params: { lattice: cluster.lattice, interaction: cluster.interaction, ...run } };
}

/** One point of the JSON document. */
export function qmcScanJsonPoint(p: QmcScanPoint): Record<string, unknown> {
  return {
    index: p.index, size: p.size, ix: p.ix, value: p.value, ...pointSummary(p), phase: p.result?.phase ?? null,
    orderMomentum: p.result?.orderParameter?.m ?? null, notes: p.result?.notes ?? [], ...(p.error !== undefined ? { error: p.error } : {}),
  };
}

/** The crossings as the JSON writes them. */
export function crossingsJson(crossings: readonly BinderCrossing[]): Record<string, unknown>[] {
  return crossings.map((c) => ({ sizes: c.sizes, at: c.at, error: c.error, between: c.between }));
}

/** The whole JSON document at once (one line; the streamed one, qmc-scan-stream.ts, has the same values). */
export function qmcScanJson(req: QmcScanRequest, points: readonly QmcScanPoint[], crossings: BinderCrossing[], complete: boolean): string {
  const { axis, sizes, shard, params } = qmcScanJsonFields(req);
  return JSON.stringify({ axis, sizes, shard, complete, params, points: points.map(qmcScanJsonPoint), crossings: crossingsJson(crossings) }) + '\n';
}

/** "Binder crossings along mu: L 8/16 at 0.512 +- 0.004; L 16/32 none in the range". */
export function crossingLine(req: QmcScanRequest, crossings: BinderCrossing[]): string {
  const parts: string[] = [];
  for (let i = 0; i + 1 < req.sizes.length; i++) {
    const [a, b] = [req.sizes[i], req.sizes[i + 1]];
    const cs = crossings.filter((c) => c.sizes[0] === a && c.sizes[1] === b);
    parts.push(cs.length === 0 ? `L ${a}/${b} none in the range`
      : `L ${a}/${b} at ${cs.map((c) => `${Number(c.at.toPrecision(6))} +- ${Number(c.error.toPrecision(2))}`).join(' and ')}`);
  }
  return `Binder crossings along ${req.axis.name}: ${parts.length ? parts.join('; ') : 'need two sizes or more'}${req.shard ? ' (this shard only)' : ''}\n`;
}
