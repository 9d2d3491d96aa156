/**
 * Polyline mark: many open polylines in data coordinates, one `<path>` each, drawn as
 * vector strokes at the exact coordinates given (not snapped to a grid), so they stay sharp
 * at any zoom and in the exported SVG. Each line may carry its own style and a `<title>`
 * (a tooltip on the page, a description in the file). A point with a non-finite coordinate
 * breaks the line (pathData of line.ts); a line of fewer than two points draws nothing.
 */
import type { Frame, Mark } from './frame.ts';
import { pathData } from './line.ts';
import { el, esc } from './svg-markup.ts';

export interface PolylineStyle {
  stroke: string;
  width: number;
  dash?: string;
  /** Halo drawn under the line for contrast over a coloured map. */
  halo?: string;
}

export interface Polyline {
  /** Points [x, y] in data coordinates, in order. */
  points: readonly (readonly number[])[];
  style: PolylineStyle;
  /** Tooltip text of the line. */
  title?: string;
}

/** The polylines, grouped in `<g class="polylines {cls}">`; halos first, so no halo covers a neighbouring line. */
export function polylines(lines: readonly Polyline[], cls = ''): Mark {
  return {
    clip: true,
    render(f: Frame) {
      let halos = '', strokes = '';
      for (const l of lines) {
        if (l.points.length < 2) continue;
        const d = pathData(f, l.points.map((p) => p[0]), l.points.map((p) => p[1]));
        if (!d.includes('L')) continue;
        const s = l.style;
        if (s.halo) {
          halos += el('path', {
            d, fill: 'none', stroke: s.halo, 'stroke-width': s.width + 2.5, 'stroke-opacity': 0.8,
            'stroke-linejoin': 'round', 'stroke-linecap': 'round',
          });
        }
        strokes += el('path', {
          d, fill: 'none', stroke: s.stroke, 'stroke-width': s.width, 'stroke-dasharray': s.dash,
          'stroke-linejoin': 'round', 'stroke-linecap': 'round', 'shape-rendering': 'geometricPrecision',
        }, l.title !== undefined ? `<title>${esc(l.title)}</title>` : '');
      }
      if (!strokes) return '';
      return `<g class="polylines${cls ? ' ' + esc(cls) : ''}">${halos}${strokes}</g>`;
    },
  };
}
