/**
 * Colour-bar mark: a vertical bar of `levels` steps of a colour function in the right
 * margin, tick labels at five positions (or at the positions given), and the words
 * "clipped" at an end whose values run past the bar. Drawn outside the plot area, above
 * the column of overlay notes. Also the scale of the density-wave shades of the phase map
 * (fill against filling, ticks at the fillings on the map).
 */
import type { Frame, Mark } from './frame.ts';
import { el, esc } from './svg-markup.ts';
import { ALERT_INK, INK, INK_SOFT, SWATCH_EDGE } from './house-style.ts';

export interface ColourBarOptions {
  title: string;
  /** Colour at t in [0, 1]. */
  colour: (t: number) => string;
  /** Tick label at t. */
  label: (t: number) => string;
  /** Tick positions (default 0, 1/4, 1/2, 3/4, 1). */
  ticks?: number[];
  levels?: number;
  clippedLow?: boolean;
  clippedHigh?: boolean;
  /** Height of the bar in px (default 160). */
  height?: number;
  /** Px below the plot area's top where the title stands (default 0). */
  top?: number;
}

/** Vertical space the bar takes, title and end notes included (for marks placed below it). */
export function colourBarHeight(o: Pick<ColourBarOptions, 'height'>): number {
  return (o.height ?? 160) + 66;
}

/** Words of `text` in lines of at most `n` characters (a longer word stands alone). */
function wrap(text: string, n: number): string[] {
  const out: string[] = [];
  for (const word of text.split(' ')) {
    const last = out.length - 1;
    if (last >= 0 && out[last].length + 1 + word.length <= n) out[last] += ' ' + word;
    else out.push(word);
  }
  return out;
}

export function colourBar(o: ColourBarOptions): Mark {
  return {
    clip: false,
    render(f: Frame) {
      const x = f.inner.x1 + 16, y0 = f.inner.y0 + (o.top ?? 0), h = o.height ?? 160, w = 12;
      // the title in lines that fit the margin (about 6.6 px a character at 11 px bold)
      const lines = wrap(o.title, Math.max(12, Math.floor((f.width - x - 4) / 6.6)));
      const top = y0 + 14 * lines.length + 16;
      const n = o.levels ?? 24;
      let out = lines.map((t, i) => el('text', { x, y: y0 + 11 + 14 * i, 'font-weight': 'bold', fill: INK, 'font-size': 11 }, esc(t))).join('');
      for (let i = 0; i < n; i++) {
        // level i covers t in [i/n, (i+1)/n], drawn bottom (t = 0) to top (t = 1)
        out += el('rect', { x, y: top + h - ((i + 1) * h) / n, width: w, height: h / n + 0.3, fill: o.colour((i + 0.5) / n) });
      }
      out += el('rect', { x, y: top, width: w, height: h, fill: 'none', stroke: SWATCH_EDGE, 'stroke-width': 0.6 });
      let lastLabel = Infinity;
      for (const t of [...(o.ticks ?? [0, 0.25, 0.5, 0.75, 1])].sort((p, q) => p - q)) {
        const y = top + h - t * h;
        out += el('line', { x1: x + w, x2: x + w + 4, y1: y, y2: y, stroke: INK });
        // labels at least 11 px apart (ticks closer than that keep their mark only)
        if (lastLabel - y >= 11) { out += el('text', { x: x + w + 7, y: y + 4, fill: INK_SOFT, 'font-size': 11 }, esc(o.label(t))); lastLabel = y; }
      }
      if (o.clippedHigh) out += el('text', { class: 'clipped-high', x, y: top - 4, fill: ALERT_INK, 'font-size': 10.5 }, 'above: clipped');
      if (o.clippedLow) out += el('text', { class: 'clipped-low', x, y: top + h + 14, fill: ALERT_INK, 'font-size': 10.5 }, 'below: clipped');
      return `<g class="colour-bar">${out}</g>`;
    },
  };
}
