/**
 * The phase boundaries a map scan returns (MapScanResult.boundaries, located by the scan:
 * src/core/scan/boundaries.ts) drawn as vector polylines over the filled map. Lines whose
 * every crossing is a confirmed first-order jump between crystals (`firstOrder: true`,
 * placed exactly) are drawn heavy and solid; the others (known to about half a pixel) thin
 * and dashed. Each line's tooltip names the two phases and the density jump. Only draws
 * what the scan found: no quantity is computed here.
 */
import type { Boundary } from '../../core/scan/boundaries.ts';
import type { Mark } from '../plot/frame.ts';
import type { LegendEntry } from '../plot/legend.ts';
import { polylines, type PolylineStyle } from '../plot/polyline-mark.ts';

/** Stroke of a first-order (exactly located) boundary. */
export const FIRST_ORDER_STYLE: PolylineStyle = { stroke: '#111827', width: 2.2, halo: '#ffffff' };
/** Stroke of a boundary placed to about half a pixel (not a confirmed crystal-crystal jump). */
export const APPROXIMATE_STYLE: PolylineStyle = { stroke: '#111827', width: 1, dash: '4 2.5', halo: '#ffffff' };

const LEGEND_LABELS = { first: 'boundary, first order', approx: 'boundary, \u00b1\u00bd pixel' } as const;

/** Tooltip of a line: its phases, and the density jump where first order. */
function describe(b: Boundary): string {
  const pair = `${b.phases[0]} | ${b.phases[1]}`;
  if (b.firstOrder !== true) return `${pair}: located to about half a pixel`;
  const jump = b.densityJump !== null ? `, \u0394\u03c1 = ${Number(b.densityJump.toPrecision(3))}` : '';
  return `${pair}: first order${jump}`;
}

/** The boundary mark and its legend entries (one per kind of line present). */
export function boundaryLines(boundaries: readonly Boundary[]): { mark: Mark; legend: LegendEntry[] } {
  const drawn = boundaries.filter((b) => b.points.length >= 2);
  // approximate lines first, so a heavy first-order line is drawn over them where they meet
  const ordered = [...drawn.filter((b) => b.firstOrder !== true), ...drawn.filter((b) => b.firstOrder === true)];
  const mark = polylines(ordered.map((b) => ({
    points: b.points, style: b.firstOrder === true ? FIRST_ORDER_STYLE : APPROXIMATE_STYLE, title: describe(b),
  })), 'boundaries');
  const legend: LegendEntry[] = [];
  const swatch = (s: PolylineStyle) => ({ kind: 'line' as const, stroke: s.stroke, width: s.width, dash: s.dash });
  if (drawn.some((b) => b.firstOrder === true)) legend.push({ label: LEGEND_LABELS.first, swatch: swatch(FIRST_ORDER_STYLE) });
  if (drawn.some((b) => b.firstOrder !== true)) legend.push({ label: LEGEND_LABELS.approx, swatch: swatch(APPROXIMATE_STYLE) });
  return { mark, legend };
}
