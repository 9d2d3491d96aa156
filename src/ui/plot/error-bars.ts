/**
 * Error-bar mark: a vertical bar of +- err about each point, with short caps, and a dot
 * at the value (Monte Carlo estimates with their binning errors).
 */
import type { Frame, Mark } from './frame.ts';
import { el } from './svg-markup.ts';

export interface ErrorBarStyle { stroke: string; cap?: number; dot?: number }

/** Bars y_i +- err_i at x_i. */
export function errorBars(xs: ArrayLike<number>, ys: ArrayLike<number>, errs: ArrayLike<number>, s: ErrorBarStyle): Mark {
  return {
    clip: true,
    render(f: Frame) {
      const cap = s.cap ?? 3;
      let out = '';
      for (let i = 0; i < xs.length; i++) {
        const x = xs[i], y = ys[i], e = Math.abs(errs[i]);
        if (!Number.isFinite(x) || !Number.isFinite(y)) continue;
        const X = f.x(x), Y = f.y(y);
        if (Number.isFinite(e) && e > 0) {
          const Ya = f.y(y - e), Yb = f.y(y + e);
          out += el('line', { x1: X, x2: X, y1: Ya, y2: Yb, stroke: s.stroke });
          out += el('line', { x1: X - cap, x2: X + cap, y1: Ya, y2: Ya, stroke: s.stroke });
          out += el('line', { x1: X - cap, x2: X + cap, y1: Yb, y2: Yb, stroke: s.stroke });
        }
        out += el('circle', { cx: X, cy: Y, r: s.dot ?? 2.5, fill: s.stroke });
      }
      return `<g class="error-bars">${out}</g>`;
    },
  };
}
