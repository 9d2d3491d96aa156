/**
 * Axis marks in the house style (house-style.ts): an open spine set SPINE_GAP px off the
 * plot area, ticks into that gap (or outwards), tick labels in the soft ink, the title
 * with its unit at the far end of the axis. `grid` draws dotted guides across the plot at
 * the ticks instead of a grid. Every figure gets one per axis.
 */
import type { Frame, Mark } from './frame.ts';
import { el, esc, px } from './svg-markup.ts';
import { GUIDE, INK, INK_SOFT, SPINE_GAP, TICK_DIRECTION, TICK_LENGTH, type TickDirection } from './house-style.ts';

export interface AxisOptions {
  /** Title including the unit, e.g. "mu (g)". */
  label: string;
  ticks?: number;
  /** Dotted guides across the plot at the ticks. */
  grid?: boolean;
  /** Ticks into the gap between spine and plot (default) or away from the plot. */
  tickDirection?: TickDirection;
  /** Custom tick positions and labels (e.g. high-symmetry points of a path). */
  tickValues?: { value: number; label: string }[];
}

const guide = { stroke: GUIDE, 'stroke-width': 1, 'stroke-dasharray': '1 3', 'stroke-linecap': 'round' };

/** The x axis under the plot area. */
export function axisX(o: AxisOptions): Mark {
  return {
    clip: false,
    render(f: Frame) {
      const { x0, x1, y0, y1 } = f.inner;
      const n = o.ticks ?? Math.max(2, Math.round((x1 - x0) / 80));
      const ticks = o.tickValues ?? f.x.ticks(n).map((v) => ({ value: v, label: f.x.format(v, n) }));
      const Y = y1 + SPINE_GAP, dir = (o.tickDirection ?? TICK_DIRECTION) === 'in' ? -1 : 1;
      let out = el('line', { x1: x0, x2: x1, y1: Y, y2: Y, stroke: INK });
      for (const t of ticks) {
        const X = f.x(t.value);
        if (X < x0 - 0.5 || X > x1 + 0.5) continue;
        if (o.grid) out += el('line', { x1: X, x2: X, y1: y0, y2: y1, ...guide });
        out += el('line', { x1: X, x2: X, y1: Y, y2: Y + dir * TICK_LENGTH, stroke: INK });
        out += el('text', { x: X, y: Y + (dir > 0 ? TICK_LENGTH : 0) + 13, 'text-anchor': 'middle', fill: INK_SOFT, 'font-size': 11.5 }, esc(t.label));
      }
      out += el('text', { class: 'axis-title', x: x1, y: Y + 32, 'text-anchor': 'end', fill: INK, 'font-size': 12.5 }, esc(o.label));
      return `<g class="axis axis-x">${out}</g>`;
    },
  };
}

/** The y axis left of the plot area. */
export function axisY(o: AxisOptions): Mark {
  return {
    clip: false,
    render(f: Frame) {
      const { x0, x1, y0, y1 } = f.inner;
      const n = o.ticks ?? Math.max(2, Math.round((y1 - y0) / 50));
      const ticks = o.tickValues ?? f.y.ticks(n).map((v) => ({ value: v, label: f.y.format(v, n) }));
      const X = x0 - SPINE_GAP, dir = (o.tickDirection ?? TICK_DIRECTION) === 'in' ? 1 : -1;
      let out = el('line', { x1: X, x2: X, y1: y0, y2: y1, stroke: INK });
      for (const t of ticks) {
        const Y = f.y(t.value);
        if (Y < y0 - 0.5 || Y > y1 + 0.5) continue;
        if (o.grid) out += el('line', { x1: x0, x2: x1, y1: Y, y2: Y, ...guide });
        out += el('line', { x1: X, x2: X + dir * TICK_LENGTH, y1: Y, y2: Y, stroke: INK });
        out += el('text', { x: X - (dir < 0 ? TICK_LENGTH : 0) - 4, y: Y + 4, 'text-anchor': 'end', fill: INK_SOFT, 'font-size': 11.5 }, esc(t.label));
      }
      // the title reads upwards, its end at the top of the axis
      out += `<text class="axis-title" x="14" y="${px(y0)}" text-anchor="end" fill="${INK}" font-size="12.5" transform="rotate(-90 14 ${px(y0)})">${esc(o.label)}</text>`;
      return `<g class="axis axis-y">${out}</g>`;
    },
  };
}
