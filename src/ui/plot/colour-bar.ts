/**
 * Colour-bar mark: a vertical bar of `levels` steps of a colour function in the right
 * margin, ticks with values at five positions, and the words "clipped" at an end whose
 * values run past the bar. Drawn outside the plot area, beside the legend's column.
 */
import type { Frame, Mark } from './frame.ts';
import { el, esc } from './svg-markup.ts';

export interface ColourBarOptions {
  title: string;
  /** Colour at t in [0, 1]. */
  colour: (t: number) => string;
  /** Tick label at t. */
  label: (t: number) => string;
  levels?: number;
  clippedLow?: boolean;
  clippedHigh?: boolean;
  /** Height of the bar in px (default 160). */
  height?: number;
}

/** Vertical space the bar takes, title and end notes included (for marks placed below it). */
export function colourBarHeight(o: Pick<ColourBarOptions, 'height'>): number {
  return (o.height ?? 160) + 52;
}

export function colourBar(o: ColourBarOptions): Mark {
  return {
    clip: false,
    render(f: Frame) {
      const x = f.inner.x1 + 14, top = f.inner.y0 + 30, h = o.height ?? 160, w = 16;
      const n = o.levels ?? 24;
      let out = el('text', { x, y: f.inner.y0 + 14, 'font-weight': 'bold', fill: '#1d2430' }, esc(o.title));
      for (let i = 0; i < n; i++) {
        // level i covers t in [i/n, (i+1)/n], drawn bottom (t = 0) to top (t = 1)
        out += el('rect', { x, y: top + h - ((i + 1) * h) / n, width: w, height: h / n + 0.3, fill: o.colour((i + 0.5) / n) });
      }
      out += el('rect', { x, y: top, width: w, height: h, fill: 'none', stroke: '#5b6577', 'stroke-width': 0.8 });
      for (const t of [0, 0.25, 0.5, 0.75, 1]) {
        const y = top + h - t * h;
        out += el('line', { x1: x + w, x2: x + w + 4, y1: y, y2: y, stroke: '#1d2430' });
        out += el('text', { x: x + w + 7, y: y + 4, fill: '#1d2430', 'font-size': 11 }, esc(o.label(t)));
      }
      if (o.clippedHigh) out += el('text', { class: 'clipped-high', x, y: top - 4, fill: '#7a1f1f', 'font-size': 10.5 }, 'above: clipped');
      if (o.clippedLow) out += el('text', { class: 'clipped-low', x, y: top + h + 14, fill: '#7a1f1f', 'font-size': 10.5 }, 'below: clipped');
      return `<g class="colour-bar">${out}</g>`;
    },
  };
}
