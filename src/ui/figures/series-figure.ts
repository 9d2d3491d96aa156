/**
 * A generic x-y figure of one or more series (lines, dots, error bars) with reference
 * rules: the optimisation trace, S(k) and C(r) of the correlated check, the stability
 * margin of the modes view. Composed from marks only.
 */
import { renderFigure } from '../plot/figure.ts';
import { line } from '../plot/line.ts';
import { errorBars } from '../plot/error-bars.ts';
import { ruleX, ruleY } from '../plot/rule.ts';
import { axisX, axisY, type AxisOptions } from '../plot/axis.ts';
import { legend, type LegendEntry } from '../plot/legend.ts';
import type { Mark } from '../plot/frame.ts';
import type { RenderedFigure } from '../app/figure-panel.ts';

export interface Series {
  label: string;
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  err?: ArrayLike<number>;
  stroke: string;
  dash?: string;
  /** Draw points (with error bars when err is given) instead of, or with, a line. */
  points?: boolean;
  noLine?: boolean;
}

export interface Reference { axis: 'x' | 'y'; value: number; label: string; stroke: string; dash?: string }

export interface SeriesFigureSpec {
  id: string;
  name: string;
  title: string;
  series: Series[];
  refs?: Reference[];
  x: AxisOptions;
  y: AxisOptions;
  width: number;
  height: number;
  /** Fixed domains; by default the data (and references) with 5% padding. */
  xDomain?: [number, number];
  yDomain?: [number, number];
}

function extent(vals: number[], pad = 0.05): [number, number] {
  const v = vals.filter(Number.isFinite);
  if (!v.length) return [0, 1];
  let lo = Math.min(...v), hi = Math.max(...v);
  if (lo === hi) { lo -= Math.abs(lo) * 0.1 || 1; hi += Math.abs(hi) * 0.1 || 1; }
  const d = (hi - lo) * pad;
  return [lo - d, hi + d];
}

export function seriesFigure(o: SeriesFigureSpec): RenderedFigure {
  const xs: number[] = [], ys: number[] = [];
  for (const s of o.series) {
    for (let i = 0; i < s.x.length; i++) {
      xs.push(s.x[i]);
      const e = s.err ? Math.abs(s.err[i]) || 0 : 0;
      ys.push(s.y[i] - e, s.y[i] + e);
    }
  }
  for (const r of o.refs ?? []) (r.axis === 'x' ? xs : ys).push(r.value);
  const marks: Mark[] = [];
  const entries: LegendEntry[] = [];
  for (const r of o.refs ?? []) {
    marks.push((r.axis === 'x' ? ruleX : ruleY)(r.value, { stroke: r.stroke, dash: r.dash ?? '5 3', width: 1.5 }));
    entries.push({ label: r.label, swatch: { kind: 'line', stroke: r.stroke, dash: r.dash ?? '5 3', width: 1.5 } });
  }
  for (const s of o.series) {
    if (!s.noLine) marks.push(line(s.x, s.y, { stroke: s.stroke, dash: s.dash, width: 1.8 }));
    if (s.points) marks.push(errorBars(s.x, s.y, s.err ?? new Float64Array(s.x.length), { stroke: s.stroke }));
    entries.push({ label: s.label, swatch: s.noLine ? { kind: 'dot', fill: s.stroke, stroke: s.stroke } : { kind: 'line', stroke: s.stroke, dash: s.dash, width: 1.8 } });
  }
  marks.push(axisX(o.x), axisY({ grid: true, ...o.y }), legend(entries));
  const { svg, frame } = renderFigure({
    id: o.id, width: o.width, height: o.height, margin: { right: 24, left: 66 },
    x: o.xDomain ?? extent(xs, 0.02), y: o.yDomain ?? extent(ys), marks, title: o.title,
  });
  return { svg, frame, name: o.name, title: o.title };
}
