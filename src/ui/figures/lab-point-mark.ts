/**
 * The lab's operating point drawn over a finished figure: a marker at the point and its
 * one-sigma tolerance box (first-order, src/core/lab/operating-point.ts) where the figure's
 * two axes are quantities the point fixes; a band with a line where only the horizontal
 * one is (the staircase's mu, the map's other axis being the density); a boxed note where
 * the figure's axes are none of them (the spectrum over k, the cluster drawing). Rendered
 * into the figure's own frame and appended to its SVG (as the boundary check is), so the
 * exported file carries it, with a legend entry of its own.
 */
import type { Frame } from '../plot/frame.ts';
import { el, esc } from '../plot/svg-markup.ts';
import type { RenderedFigure } from '../app/figure-panel.ts';
import { overlaid } from '../export/print-layout.ts';
import type { AxisValue } from '../state/lab-point.ts';

const INK = '#000000', HALO = '#ffffff', BOX_FILL = 'rgba(255,255,255,0.18)';

/** What to draw: the point's value on each axis (null: the axis is a quantity it does not fix). */
export interface LabMark {
  x: AxisValue | null;
  y: AxisValue | null;
  /** Draw the x tolerance as a band over the full height, the marker at (x, y) if y is given (the staircase). */
  band?: boolean;
  /** Tooltip and legend detail: the point in words. */
  text: string;
}

/** An overlay's legend entry: a swatch drawn by the caller's kind and its wrapped text. */
export interface OverlayEntry { swatch: 'lab' | 'dashed'; stroke?: string; lines: string[] }

/** Split text into lines of at most `n` characters at spaces or after commas. */
export function wrapText(text: string, n: number): string[] {
  const out: string[] = [];
  let line = '';
  for (const word of text.split(' ')) {
    if (line && line.length + 1 + word.length > n) { out.push(line); line = word; } else line = line ? `${line} ${word}` : word;
  }
  if (line) out.push(line);
  return out;
}

/** The marker: a ring with a cross, black on a white halo, readable over any fill. */
function marker(X: number, Y: number): string {
  const r = 6.5;
  const cross = `M${X - r - 4},${Y}H${X + r + 4}M${X},${Y - r - 4}V${Y + r + 4}`;
  return el('path', { d: cross, stroke: HALO, 'stroke-width': 4.5, fill: 'none' })
    + el('circle', { cx: X, cy: Y, r, fill: 'none', stroke: HALO, 'stroke-width': 4.5 })
    + el('path', { d: cross, stroke: INK, 'stroke-width': 1.6, fill: 'none' })
    + el('circle', { cx: X, cy: Y, r, fill: 'none', stroke: INK, 'stroke-width': 2 });
}

/** The clipped drawing of the point in a frame (empty when no axis is the point's). */
export function labPointSvg(f: Frame, m: LabMark): string {
  const title = `<title>${esc(`lab point (one-sigma box, first order): ${m.text}`)}</title>`;
  const dashed = (a: Record<string, string | number>) => el('rect', { ...a, fill: 'none', stroke: HALO, 'stroke-width': 4 })
    + el('rect', { ...a, fill: BOX_FILL, stroke: INK, 'stroke-width': 1.6, 'stroke-dasharray': '5 3' });
  let out = '';
  if (m.x && (m.band || !m.y)) {
    const a = f.x(m.x.value - m.x.sigma), b = f.x(m.x.value + m.x.sigma), X = f.x(m.x.value);
    const W = Math.max(0, Math.abs(b - a));
    if (W > 0) out += dashed({ x: Math.min(a, b), y: f.inner.y0, width: W, height: f.inner.y1 - f.inner.y0 });
    out += el('line', { x1: X, x2: X, y1: f.inner.y0, y2: f.inner.y1, stroke: INK, 'stroke-width': 1.4 });
    if (m.y) out += marker(X, f.y(m.y.value));
  } else if (m.x && m.y) {
    const x0 = f.x(m.x.value - m.x.sigma), x1 = f.x(m.x.value + m.x.sigma);
    const y0 = f.y(m.y.value - m.y.sigma), y1 = f.y(m.y.value + m.y.sigma);
    out += dashed({ x: Math.min(x0, x1), y: Math.min(y0, y1), width: Math.abs(x1 - x0), height: Math.abs(y1 - y0) });
    out += marker(f.x(m.x.value), f.y(m.y.value));
  } else if (m.y) {
    const a = f.y(m.y.value - m.y.sigma), b = f.y(m.y.value + m.y.sigma), Y = f.y(m.y.value);
    const H = Math.abs(b - a);
    if (H > 0) out += dashed({ x: f.inner.x0, y: Math.min(a, b), width: f.inner.x1 - f.inner.x0, height: H });
    out += el('line', { x1: f.inner.x0, x2: f.inner.x1, y1: Y, y2: Y, stroke: INK, 'stroke-width': 1.4 });
  }
  return out ? `<g class="lab-point" data-x="${m.x?.value ?? ''}" data-y="${m.y?.value ?? ''}">${title}${out}</g>` : '';
}

/**
 * Overlay legend entries, stacked upwards from the bottom of the right margin when the
 * figure keeps one (at least 150 px), else inside the plot area's top-left corner on a
 * white ground. `slot` moves an entry up past the entries of other overlays (rows of 14 px).
 */
export function overlayLegend(f: Frame, entries: OverlayEntry[], slot: number): string {
  const wide = f.margin.right >= 150;
  const rows = entries.reduce((n, e) => n + e.lines.length, 0);
  const x = wide ? f.inner.x1 + 14 : f.inner.x0 + 6;
  let y = wide ? f.inner.y1 - 14 * (rows + slot) - 4 : f.inner.y0 + 6 + 14 * slot;
  let out = wide ? '' : el('rect', { x: x - 3, y: y - 2, width: 210, height: 14 * rows + 4, fill: HALO, 'fill-opacity': 0.85, stroke: '#5b6577', 'stroke-width': 0.6 });
  for (const e of entries) {
    const cy = y + 7;
    out += e.swatch === 'lab'
      ? el('rect', { x: x + 1, y: cy - 5, width: 16, height: 10, fill: 'none', stroke: INK, 'stroke-width': 1.4, 'stroke-dasharray': '4 2' })
        + el('circle', { cx: x + 9, cy, r: 3, fill: 'none', stroke: INK, 'stroke-width': 1.4 })
      : el('line', { x1: x, x2: x + 18, y1: cy, y2: cy, stroke: e.stroke ?? INK, 'stroke-width': 2, 'stroke-dasharray': '6 3' });
    e.lines.forEach((t, i) => { out += el('text', { x: x + 24, y: y + 11 + 14 * i, 'font-size': 11, fill: '#1d2430' }, esc(t)); });
    y += 14 * e.lines.length;
  }
  return out;
}

const memo = new WeakMap<RenderedFigure, Map<string, RenderedFigure>>();

/**
 * The figure with `clipped` drawn inside its plot area and `free` around it, memoised per
 * figure and `key` (the page re-renders on every pointer move; the figure string is large).
 * `again` draws the same overlay over the figure laid out again for print (print-layout.ts).
 */
export function appendToFigure(fig: RenderedFigure, key: string, clipped: string, free: string,
  again?: (base: RenderedFigure) => RenderedFigure): RenderedFigure {
  let m = memo.get(fig);
  const hit = m?.get(key);
  if (hit) return hit;
  if (!m) memo.set(fig, m = new Map());
  const f = fig.frame;
  const at = fig.svg.lastIndexOf('</svg>');
  const svg = `${fig.svg.slice(0, at)}<g clip-path="url(#${f.id}-clip)">${clipped}</g>${free}${fig.svg.slice(at)}`;
  const out = overlaid(fig, { ...fig, svg }, again ?? null);
  m.clear();
  m.set(key, out);
  return out;
}

/** Characters a legend line holds in the right margin (11 px text, about 6.3 px a character). */
const lineChars = (f: Frame) => Math.max(18, Math.floor((f.margin.right >= 150 ? f.margin.right - 30 : 200) / 6.3));

/** The figure with the lab point drawn over it and its legend entry (the figure itself when m is null). */
export function withLabPoint(fig: RenderedFigure, m: LabMark | null, slot = 0): RenderedFigure {
  if (!m) return fig;
  const f = fig.frame;
  const drawn = labPointSvg(f, m);
  const lines = drawn ? ['lab point, \u00b11\u03c3 box'] : ['lab point: not on these axes', ...wrapText(m.text, lineChars(f))];
  return appendToFigure(fig, `lab|${slot}|${JSON.stringify(m)}`, drawn, `<g class="lab-point-legend">${overlayLegend(f, [{ swatch: 'lab', lines }], slot)}</g>`,
    (base) => withLabPoint(base, m, slot));
}

/**
 * A figure whose axes are none of the point's quantities (the spectrum over k, the
 * cluster): the point, and whether the model's point lies in its box, as a note in a strip
 * added under the figure (so it covers neither the data nor the legend, at any size).
 */
export function withLabNote(fig: RenderedFigure, text: string, inside: boolean): RenderedFigure {
  const key = `note|${text}|${inside}`;
  let m = memo.get(fig);
  const hit = m?.get(key);
  if (hit) return hit;
  if (!m) memo.set(fig, m = new Map());
  const f = fig.frame;
  const lines = wrapText(`${inside ? 'At the lab point' : 'NOT at the lab point'} (\u00b11\u03c3 box): ${text}`, Math.max(30, Math.floor((f.width - 40) / 6.3)));
  const extra = 14 * lines.length + 10, H = f.height + extra;
  let note = el('rect', { x: 0, y: f.height, width: f.width, height: extra, fill: HALO })
    + el('rect', { x: 8, y: f.height + 4, width: 16, height: 10, fill: 'none', stroke: INK, 'stroke-width': 1.4, 'stroke-dasharray': '4 2' })
    + el('circle', { cx: 16, cy: f.height + 9, r: 3, fill: 'none', stroke: INK, 'stroke-width': 1.4 });
  lines.forEach((t, i) => { note += el('text', { x: 30, y: f.height + 13 + 14 * i, 'font-size': 11, fill: '#1d2430' }, esc(t)); });
  // the document grows by the strip: its height and viewBox, then the note before the end
  const head = fig.svg.replace(/^(<svg[^>]*?) height="[^"]*"/, `$1 height="${H}"`).replace(/^(<svg[^>]*?) viewBox="0 0 ([^ "]+) [^"]*"/, `$1 viewBox="0 0 $2 ${H}"`);
  const at = head.lastIndexOf('</svg>');
  const out = overlaid(fig, { ...fig, svg: `${head.slice(0, at)}<g class="lab-point-note">${note}</g>${head.slice(at)}`, frame: { ...f, height: H } },
    (base) => withLabNote(base, text, inside));
  m.clear();
  m.set(key, out);
  return out;
}
