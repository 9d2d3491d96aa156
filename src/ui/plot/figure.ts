/**
 * A figure is a frame plus a list of marks, rendered to one standalone SVG document
 * (inline styles only, so the same string is shown on the page and saved as a file).
 * Clipped marks are drawn inside the plot area; the rest (axes, key) around it. A mark
 * that asks for room above the plot (the key) gets it: the figure grows by that much.
 */
import { DEFAULT_MARGIN, type Frame, type FrameSpec, type Mark, makeFrame } from './frame.ts';
import { el, esc } from './svg-markup.ts';
import { FIGURE_FONT, INK, PAPER } from './house-style.ts';

export { FIGURE_FONT } from './house-style.ts';

export interface FigureSpec extends FrameSpec {
  marks: Mark[];
  /** Pattern and marker definitions the marks refer to (url(#id)). */
  defs?: (f: Frame) => string;
  /** Accessible title of the figure (also the file's <title>). */
  title: string;
  /** Longer description for screen readers. */
  description?: string;
}

/** Render the figure to SVG markup. */
export function renderFigure(spec: FigureSpec): { svg: string; frame: Frame } {
  const margin = { ...DEFAULT_MARGIN, ...spec.margin };
  const extra = spec.marks.reduce((n, m) => Math.max(n, m.reserveTop?.(spec.width, margin) ?? 0), 0);
  const f = makeFrame(extra > 0 ? { ...spec, height: spec.height + extra, margin: { ...margin, top: margin.top + extra } } : spec);
  const clipId = `${f.id}-clip`;
  const { x0, x1, y0, y1 } = f.inner;
  const clipped: string[] = [], free: string[] = [];
  for (const m of spec.marks) (m.clip ? clipped : free).push(m.render(f));
  const defs = el('clipPath', { id: clipId }, el('rect', { x: x0, y: y0, width: x1 - x0, height: y1 - y0 }))
    + (spec.defs ? spec.defs(f) : '');
  const svg = `<svg xmlns="http://www.w3.org/2000/svg"${[
    ` width="${f.width}" height="${f.height}" viewBox="0 0 ${f.width} ${f.height}"`,
    ` font-family="${esc(FIGURE_FONT)}" font-size="12" fill="${INK}" role="img" aria-labelledby="${f.id}-title"`,
  ].join('')}>`
    + `<title id="${f.id}-title">${esc(spec.title)}</title>`
    + (spec.description ? `<desc>${esc(spec.description)}</desc>` : '')
    + `<defs>${defs}</defs>`
    + el('rect', { x: 0, y: 0, width: f.width, height: f.height, fill: PAPER })
    + `<g clip-path="url(#${clipId})">${clipped.join('')}</g>`
    + free.join('')
    + '</svg>';
  return { svg, frame: f };
}
