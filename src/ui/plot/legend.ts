/**
 * Legend mark, the figure's key. In the house style it is a row of entries above the plot
 * area, flowing onto more rows when the plot is narrow (the figure grows to hold it); it
 * can also stand as a column right of the plot (`place: 'right'`) or in rows under the x
 * axis (`below`, narrow figures that reserve legendBelowHeight()). Each entry is a swatch
 * (a filled chip with optional texture, a line style, or a dot) and its label.
 */
import type { Frame, Margins, Mark } from './frame.ts';
import { el, esc } from './svg-markup.ts';
import { INK, SWATCH_EDGE } from './house-style.ts';

export type Swatch =
  | { kind: 'fill'; fill: string; texture?: string; outline?: string }
  | { kind: 'line'; stroke: string; width?: number; dash?: string }
  | { kind: 'dot'; fill: string; stroke?: string };

export interface LegendEntry { label: string; swatch: Swatch }

export interface LegendOptions {
  title?: string;
  /** Where the key stands: a row above the plot (default) or a column at the right. */
  place?: 'above' | 'right';
  /** Column: left edge in px from the plot area's right edge. */
  gap?: number;
  /** Rows under the x axis instead (narrow figures); reserve legendBelowHeight(). */
  below?: boolean;
  /** Column: px below the plot area's top where it starts (room for a colour bar above it). */
  top?: number;
}

const ENTRY_W = 150, ROW_H = 18, SWATCH_W = 20, FONT = 11.5;
/** Width a label takes (px): about 0.55 em a character in the condensed faces of FIGURE_FONT. */
const textWidth = (s: string) => s.length * FONT * 0.55;
/** Width of one entry in a row above the plot. */
const entryWidth = (e: LegendEntry) => SWATCH_W + 6 + textWidth(e.label) + 16;

/** Bottom space a legend below the axis needs for `n` entries in a figure `width` wide. */
export function legendBelowHeight(n: number, width: number): number {
  const perRow = Math.max(1, Math.floor((width - 16) / ENTRY_W));
  return Math.ceil(n / perRow) * ROW_H + 8;
}

/**
 * The entries (and title) laid out in rows no wider than `w`, in columns of one width (the
 * widest entry's), so the entries of every row line up: x offsets and row index.
 */
function rows(entries: LegendEntry[], title: string | undefined, w: number): { at: { x: number; row: number }[]; n: number } {
  const titleW = title ? textWidth(title) * 1.08 + 12 : 0;
  const col = Math.min(Math.max(0, ...entries.map(entryWidth)), Math.max(60, w - titleW));
  const perRow = Math.max(1, Math.floor((w - titleW) / col));
  const at = entries.map((_, k) => ({ x: titleW + (k % perRow) * col, row: Math.floor(k / perRow) }));
  return { at, n: Math.ceil(entries.length / perRow) };
}

/** Width of the row above the plot (the plot area's width). */
const rowWidth = (width: number, m: Margins) => Math.max(120, width - m.left - m.right);

/** The swatch of an entry with its top left corner at (x, y), 14 px high. */
function swatch(s: Swatch, x: number, y: number): string {
  if (s.kind === 'fill') {
    return el('rect', { x, y: y + 1, width: SWATCH_W - 4, height: 12, rx: 2, fill: s.fill, stroke: s.outline ?? SWATCH_EDGE, 'stroke-width': 0.6 })
      + (s.texture ? el('rect', { x, y: y + 1, width: SWATCH_W - 4, height: 12, rx: 2, fill: s.texture }) : '');
  }
  if (s.kind === 'line') {
    return el('line', { x1: x, x2: x + SWATCH_W, y1: y + 7, y2: y + 7, stroke: s.stroke, 'stroke-width': s.width ?? 2, 'stroke-dasharray': s.dash, 'stroke-linecap': 'butt' });
  }
  return el('circle', { cx: x + SWATCH_W / 2, cy: y + 7, r: 4.5, fill: s.fill, stroke: s.stroke ?? INK, 'stroke-width': 1 });
}

/** The key. Above the plot (default), a column at the right, or rows below the axis. */
export function legend(entries: LegendEntry[], o: LegendOptions = {}): Mark {
  const above = !o.below && o.place !== 'right';
  return {
    clip: false,
    reserveTop: above ? (width, m) => rows(entries, o.title, rowWidth(width, m)).n * ROW_H + 6 : undefined,
    render(f: Frame) {
      let out = '';
      if (above) {
        const { at, n } = rows(entries, o.title, f.inner.x1 - f.inner.x0);
        const top = 6; // the figure's top edge: the room reserveTop added sits between the key and the plot
        if (o.title && n) out += el('text', { x: f.inner.x0, y: top + 11, 'font-weight': 'bold', fill: INK, 'font-size': FONT }, esc(o.title));
        entries.forEach((e, k) => {
          const x = f.inner.x0 + at[k].x, y = top + at[k].row * ROW_H;
          out += swatch(e.swatch, x, y) + el('text', { x: x + SWATCH_W + 5, y: y + 11, fill: INK, 'font-size': FONT }, esc(e.label));
        });
        return `<g class="legend" data-place="above">${out}</g>`;
      }
      let x = f.inner.x1 + (o.gap ?? 14);
      let y = f.inner.y0 + 4 + (o.top ?? 0);
      const perRow = Math.max(1, Math.floor((f.width - 16) / ENTRY_W));
      if (o.below) y = f.inner.y1 + 50;
      else if (o.title) { out += el('text', { x, y: y + 10, 'font-weight': 'bold', fill: INK, 'font-size': FONT }, esc(o.title)); y += 20; }
      entries.forEach((e, n) => {
        if (o.below) { x = 8 + (n % perRow) * ENTRY_W; y = f.inner.y1 + 50 + Math.floor(n / perRow) * ROW_H; }
        out += swatch(e.swatch, x, y) + el('text', { x: x + SWATCH_W + 5, y: y + 11, fill: INK, 'font-size': FONT }, esc(e.label));
        if (!o.below) y += 20;
      });
      return `<g class="legend">${out}</g>`;
    },
  };
}

