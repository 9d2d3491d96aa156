/**
 * Rule marks: full-height vertical or full-width horizontal reference lines at data
 * values (zero lines, the chosen point, k*, the emitter line), with an optional label.
 */
import type { Frame, Mark } from './frame.ts';
import { el, esc } from './svg-markup.ts';

export interface RuleStyle { stroke: string; width?: number; dash?: string; label?: string }

/** Vertical line at x = value. */
export function ruleX(value: number, s: RuleStyle): Mark {
  return {
    clip: true,
    render(f: Frame) {
      if (!Number.isFinite(value)) return '';
      const X = f.x(value);
      return el('line', { x1: X, x2: X, y1: f.inner.y0, y2: f.inner.y1, stroke: s.stroke, 'stroke-width': s.width ?? 1, 'stroke-dasharray': s.dash })
        + (s.label ? el('text', { x: X + 4, y: f.inner.y0 + 12, fill: s.stroke, 'font-size': 11 }, esc(s.label)) : '');
    },
  };
}

/** Horizontal line at y = value. */
export function ruleY(value: number, s: RuleStyle): Mark {
  return {
    clip: true,
    render(f: Frame) {
      if (!Number.isFinite(value)) return '';
      const Y = f.y(value);
      return el('line', { x1: f.inner.x0, x2: f.inner.x1, y1: Y, y2: Y, stroke: s.stroke, 'stroke-width': s.width ?? 1, 'stroke-dasharray': s.dash })
        + (s.label ? el('text', { x: f.inner.x1 - 4, y: Y - 4, fill: s.stroke, 'font-size': 11, 'text-anchor': 'end' }, esc(s.label)) : '');
    },
  };
}
