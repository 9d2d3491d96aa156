/**
 * The "check this boundary" drawn over the mean-field phase map: the picked ends, the
 * (snapped) line the QMC scan runs along, and each Binder crossing as a marker with its
 * error bar along the line, labelled with its pair of sizes. Rendered into the map
 * figure's own frame and clip path and appended to its SVG, so the map figure itself is
 * untouched and the exported SVG carries the check.
 */
import type { Frame, Mark } from '../plot/frame.ts';
import { line } from '../plot/line.ts';
import { dots } from '../plot/dot.ts';
import { el, esc } from '../plot/svg-markup.ts';
import type { RenderedFigure } from '../app/figure-panel.ts';
import { overlaid } from '../export/print-layout.ts';

export interface CrossingMarker {
  x: number;
  y: number;
  /** Half-widths of the error bar in map units (one of them zero: the bar lies along the line). */
  ex: number;
  ey: number;
  label: string;
}

export interface CheckOverlay {
  /** The ends picked so far (0 to 2), in map units. */
  ends: [number, number][];
  /** The line scanned (snapped onto one axis), or null before it is complete. */
  line: [[number, number], [number, number]] | null;
  markers: CrossingMarker[];
}

const INK = '#111111';
const MARK = '#e8f030';

/** Markers: a diamond at the crossing and a bar of +- error with caps, on a dark halo. */
function crossingMarks(list: CrossingMarker[]): Mark {
  return {
    clip: true,
    render(f: Frame) {
      let out = '';
      list.forEach((m, k) => {
        const X = f.x(m.x), Y = f.y(m.y);
        const xa = f.x(m.x - m.ex), xb = f.x(m.x + m.ex), ya = f.y(m.y - m.ey), yb = f.y(m.y + m.ey);
        const cap = 5, horizontal = m.ex > 0 || m.ey === 0;
        const bar = (stroke: string, w: number) => el('line', { x1: xa, x2: xb, y1: ya, y2: yb, stroke, 'stroke-width': w })
          + (horizontal
            ? el('line', { x1: xa, x2: xa, y1: Y - cap, y2: Y + cap, stroke, 'stroke-width': w }) + el('line', { x1: xb, x2: xb, y1: Y - cap, y2: Y + cap, stroke, 'stroke-width': w })
            : el('line', { x1: X - cap, x2: X + cap, y1: ya, y2: ya, stroke, 'stroke-width': w }) + el('line', { x1: X - cap, x2: X + cap, y1: yb, y2: yb, stroke, 'stroke-width': w }));
        const d = 6;
        out += el('g', { class: 'crossing-marker', 'data-x': String(m.x), 'data-y': String(m.y) }, `<title>${esc(m.label)}</title>`
          + bar(INK, 4.5) + bar(MARK, 2)
          + el('path', { d: `M${X},${Y - d}L${X + d},${Y}L${X},${Y + d}L${X - d},${Y}Z`, fill: MARK, stroke: INK, 'stroke-width': 1.5 })
          + el('text', { x: X + 8, y: Y - 8 - 13 * k, 'font-size': 11, fill: INK, stroke: '#ffffff', 'stroke-width': 3, 'paint-order': 'stroke', class: 'crossing-label' }, esc(m.label)));
      });
      return `<g class="crossing-markers">${out}</g>`;
    },
  };
}

/** The overlay's marks. */
export function checkMarks(o: CheckOverlay): Mark[] {
  const marks: Mark[] = [];
  if (o.line) marks.push(line([o.line[0][0], o.line[1][0]], [o.line[0][1], o.line[1][1]], { stroke: INK, width: 2, dash: '6 4', halo: '#ffffff' }));
  if (o.ends.length) marks.push(dots(o.ends.map(([x, y], i) => ({ x, y, r: 4.5, fill: '#ffffff', stroke: INK, strokeWidth: 2, title: `end ${i + 1} of the checked line` }))));
  if (o.markers.length) marks.push(crossingMarks(o.markers));
  return marks;
}

const cache = new WeakMap<RenderedFigure, { o: CheckOverlay; fig: RenderedFigure }>();

/** The map figure with the overlay drawn in (memoised per figure and overlay object). */
export function withBoundaryCheck(fig: RenderedFigure, o: CheckOverlay): RenderedFigure {
  const hit = cache.get(fig);
  if (hit && hit.o === o) return hit.fig;
  const f = fig.frame;
  const clipped = checkMarks(o).map((m) => m.render(f)).join('');
  const at = fig.svg.lastIndexOf('</svg>');
  const svg = `${fig.svg.slice(0, at)}<g class="boundary-check" clip-path="url(#${f.id}-clip)">${clipped}</g>${fig.svg.slice(at)}`;
  const out = overlaid(fig, { ...fig, svg }, (base) => withBoundaryCheck(base, o));
  cache.set(fig, { o, fig: out });
  return out;
}
