/**
 * Line mark (also the polyline of a traced curve, e.g. a soft-mode line): points in data
 * coordinates joined in order; a non-finite coordinate breaks the line. Optional point
 * markers for sparse data.
 */
import type { Frame, Mark } from './frame.ts';
import { el, px } from './svg-markup.ts';

export interface LineStyle {
  stroke: string;
  width?: number;
  dash?: string;
  /** Draw a small marker of this radius at each point. */
  marker?: number;
  /** Halo drawn under the line for contrast over a coloured map. */
  halo?: string;
  /** Interpolate as a step function (value held until the next x): plateaus read true. */
  step?: boolean;
}

/** SVG path data of the points, broken at non-finite values. */
export function pathData(f: Frame, xs: ArrayLike<number>, ys: ArrayLike<number>, step = false): string {
  let d = '', pen = false;
  for (let i = 0; i < xs.length; i++) {
    const x = xs[i], y = ys[i];
    if (!Number.isFinite(x) || !Number.isFinite(y)) { pen = false; continue; }
    const X = f.x(x), Y = f.y(y);
    if (!pen) d += `M${px(X)} ${px(Y)}`;
    else if (step) d += `H${px(X)}V${px(Y)}`;
    else d += `L${px(X)} ${px(Y)}`;
    pen = true;
  }
  return d;
}

/** The line through (xs[i], ys[i]). */
export function line(xs: ArrayLike<number>, ys: ArrayLike<number>, s: LineStyle): Mark {
  return {
    clip: true,
    render(f: Frame) {
      const d = pathData(f, xs, ys, s.step);
      if (!d) return '';
      const w = s.width ?? 1.5;
      let out = s.halo ? el('path', { d, fill: 'none', stroke: s.halo, 'stroke-width': w + 3, 'stroke-linejoin': 'round', 'stroke-opacity': 0.85 }) : '';
      out += el('path', { d, fill: 'none', stroke: s.stroke, 'stroke-width': w, 'stroke-dasharray': s.dash, 'stroke-linejoin': 'round' });
      if (s.marker) {
        for (let i = 0; i < xs.length; i++) {
          if (Number.isFinite(xs[i]) && Number.isFinite(ys[i])) {
            out += el('circle', { cx: f.x(xs[i]), cy: f.y(ys[i]), r: s.marker, fill: s.stroke });
          }
        }
      }
      return out;
    },
  };
}
