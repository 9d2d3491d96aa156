/**
 * Legend mark: a column of entries to the right of the plot area, each a swatch (filled
 * box with optional texture, a line style, or a dot) and its label.
 */
import type { Frame, Mark } from './frame.ts';
import { el, esc } from './svg-markup.ts';

export type Swatch =
  | { kind: 'fill'; fill: string; texture?: string; outline?: string }
  | { kind: 'line'; stroke: string; width?: number; dash?: string }
  | { kind: 'dot'; fill: string; stroke?: string };

export interface LegendEntry { label: string; swatch: Swatch }

export interface LegendOptions {
  title?: string;
  /** Left edge in px from the plot area's right edge. */
  gap?: number;
  /** Rows under the x axis instead of a column at the right (narrow figures); reserve legendBelowHeight(). */
  below?: boolean;
  /** Px below the plot area's top where the column starts (room for a colour bar above it). */
  top?: number;
}

const ENTRY_W = 150, ROW_H = 18;

/** Bottom space a legend below the axis needs for `n` entries in a figure `width` wide. */
export function legendBelowHeight(n: number, width: number): number {
  const perRow = Math.max(1, Math.floor((width - 16) / ENTRY_W));
  return Math.ceil(n / perRow) * ROW_H + 8;
}

/** The legend column. Reserve about 150 px of right margin for it. */
export function legend(entries: LegendEntry[], o: LegendOptions = {}): Mark {
  return {
    clip: false,
    render(f: Frame) {
      let x = f.inner.x1 + (o.gap ?? 14);
      let y = f.inner.y0 + 4 + (o.top ?? 0), out = '';
      const perRow = Math.max(1, Math.floor((f.width - 16) / ENTRY_W));
      if (o.below) y = f.inner.y1 + 48;
      else if (o.title) { out += el('text', { x, y: y + 10, 'font-weight': 'bold', fill: '#1d2430' }, esc(o.title)); y += 20; }
      entries.forEach((e, n) => {
        if (o.below) { x = 8 + (n % perRow) * ENTRY_W; y = f.inner.y1 + 48 + Math.floor(n / perRow) * ROW_H; }
        const s = e.swatch;
        if (s.kind === 'fill') {
          out += el('rect', { x, y, width: 18, height: 14, fill: s.fill, stroke: s.outline ?? '#5b6577', 'stroke-width': 0.8 });
          if (s.texture) out += el('rect', { x, y, width: 18, height: 14, fill: s.texture });
        } else if (s.kind === 'line') {
          out += el('line', { x1: x, x2: x + 18, y1: y + 7, y2: y + 7, stroke: s.stroke, 'stroke-width': s.width ?? 2, 'stroke-dasharray': s.dash });
        } else {
          out += el('circle', { cx: x + 9, cy: y + 7, r: 5, fill: s.fill, stroke: s.stroke ?? '#1d2430' });
        }
        out += el('text', { x: x + 24, y: y + 11, fill: '#1d2430', 'font-size': 11.5 }, esc(e.label));
        if (!o.below) y += 20;
      });
      return `<g class="legend">${out}</g>`;
    },
  };
}
