/**
 * Band mark: shaded x-intervals over the full height of the plot (plateaus of the
 * staircase), each optionally labelled at its top.
 */
import type { Frame, Mark } from './frame.ts';
import { el, esc } from './svg-markup.ts';
import { INK } from './house-style.ts';

export interface Band {
  x0: number; x1: number; fill: string; label?: string; opacity?: number;
  /** Vertical extent as fractions of the plot height from the bottom (default 0..1). */
  from?: number; to?: number;
}

/** Shade each interval [x0, x1]; labels too wide for their band are rotated upright. */
export function bandsX(bands: Band[]): Mark {
  return {
    clip: true,
    render(f: Frame) {
      let out = '';
      for (const b of bands) {
        const a = f.x(b.x0), c = f.x(b.x1);
        const X = Math.min(a, c), W = Math.max(1, Math.abs(c - a));
        const [top, bottom] = extent(f, b);
        out += el('rect', { x: X, y: top, width: W, height: bottom - top, fill: b.fill, 'fill-opacity': b.opacity ?? 0.35 });
      }
      for (const b of bands) {
        if (!b.label) continue;
        const a = f.x(b.x0), c = f.x(b.x1);
        const cx = (a + c) / 2, W = Math.abs(c - a);
        const upright = W < b.label.length * 7 + 4;
        const y = extent(f, b)[0] + 6;
        out += upright
          ? `<text x="${cx + 4}" y="${y}" transform="rotate(90 ${cx + 4} ${y})" font-size="11" fill="${INK}" class="band-label">${esc(b.label)}</text>`
          : el('text', { x: cx, y: y + 10, 'text-anchor': 'middle', 'font-size': 11, fill: INK, class: 'band-label' }, esc(b.label));
      }
      return `<g class="bands">${out}</g>`;
    },
  };
}

/** Pixel top and bottom of a band. */
function extent(f: Frame, b: Band): [number, number] {
  const h = f.inner.y1 - f.inner.y0;
  return [f.inner.y1 - h * (b.to ?? 1), f.inner.y1 - h * (b.from ?? 0)];
}
