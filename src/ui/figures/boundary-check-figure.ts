/**
 * The Binder cumulants of a "check this boundary" against the line's parameter: one curve
 * with error bars per cluster size, the crossings of consecutive sizes (the finite-size
 * transition) and the mean-field boundary along the same line as vertical rules, so the
 * distance between mean field and QMC reads off the axis.
 */
import type { QmcScanPoint } from '../../../workers/protocol.ts';
import type { BinderCrossing } from '../../core/qmc/binder-crossing.ts';
import type { RenderedFigure } from '../app/figure-panel.ts';
import { seriesFigure, type Reference, type Series } from './series-figure.ts';
import { SERIES } from '../plot/house-style.ts';

/** Size colours: the house series palette (colour-blind safe, tests/ui/plot/palette-vision.test.ts). */
const COLOURS = SERIES;

export interface BinderFigureInput {
  points: readonly QmcScanPoint[];
  crossings: readonly BinderCrossing[];
  /** Mean-field boundaries along the line (parameter values). */
  meanField: readonly number[];
  /** Axis title of the line's parameter, with its unit. */
  xLabel: string;
  width: number;
}

export function binderFigure(o: BinderFigureInput): RenderedFigure {
  const sizes = [...new Set(o.points.map((p) => p.size))].sort((a, b) => a - b);
  const series: Series[] = sizes.map((L, i) => {
    const pts = o.points.filter((p) => p.size === L && p.result?.binder).sort((a, b) => a.value - b.value);
    return {
      label: `L = ${L}`, x: pts.map((p) => p.value), y: pts.map((p) => p.result!.binder!.value), err: pts.map((p) => p.result!.binder!.error),
      stroke: COLOURS[i % COLOURS.length], points: true,
    };
  });
  const refs: Reference[] = [
    ...o.crossings.map((c) => ({ axis: 'x' as const, value: c.at, label: `QMC L ${c.sizes.join('/')}: ${+c.at.toPrecision(4)}\u00b1${+c.error.toPrecision(2)}`, stroke: '#111111' })),
    ...o.meanField.map((x) => ({ axis: 'x' as const, value: x, label: `mean field: ${+x.toPrecision(4)}`, stroke: SERIES[3], dash: '2 3' })),
  ];
  return seriesFigure({
    id: 'binder', name: 'boundary-check-binder', title: 'Binder cumulant U = 1 \u2212 \u27e8m\u2074\u27e9/3\u27e8m\u00b2\u27e9\u00b2 along the checked line, by cluster size',
    width: o.width, height: 300, series, refs, x: { label: o.xLabel }, y: { label: 'Binder cumulant U (dimensionless)' },
  });
}
