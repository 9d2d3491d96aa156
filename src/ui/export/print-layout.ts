/**
 * Figures laid out again at their printed width. A figure built for a ~940 px window and
 * scaled to a 3.4 in column prints its 12 px text at about 3 pt; built instead at
 * inches x 96 CSS px (CSS Values 3: 96 px per inch) and printed at that width, 1 px is
 * 0.75 pt and its 12 px text prints at 9 pt (journals ask for about 7-10 pt; common
 * practice, no source). A figure that can be laid out again carries `layout`; overlays
 * drawn over it carry theirs into the new layout (`overlaid`).
 */
import type { RenderedFigure } from '../app/figure-panel.ts';
import { CSS_PX_PER_INCH, type FigureSize, printedInches } from './figure-size.ts';

/** The figure `make` builds at w x h, able to be built again at another size (never narrower than minWidth, lower than minHeight). */
export function relayable(make: (w: number, h: number) => RenderedFigure, w: number, h: number, minWidth = 300, minHeight = 200): RenderedFigure {
  return { ...make(w, h), layout: (W, H) => make(Math.max(minWidth, W), Math.max(minHeight, H)) };
}

/**
 * `out` (an overlay drawn over `fig`) with a layout that lays `fig` out again and draws the
 * overlay over it with `again`; no layout when `fig` has none or `again` is null (a stale
 * one would drop the overlay). An overlay that adds height gets the base figure's share of the height asked for.
 */
export function overlaid(fig: RenderedFigure, out: RenderedFigure, again: ((base: RenderedFigure) => RenderedFigure) | null): RenderedFigure {
  const base = fig.layout;
  const share = fig.frame.height / out.frame.height;
  const { layout: _stale, ...rest } = out;
  return base && again ? { ...rest, layout: (w, h) => again(base(w, h * share)) } : rest;
}

const printed = new WeakMap<RenderedFigure, { key: string; fig: RenderedFigure }>();

/**
 * The figure to save at this size: at a print size, laid out again at inches x 96 px wide
 * with the on-screen aspect ratio when it can be; else the figure on screen (scaled).
 */
export function printFigure(fig: RenderedFigure, size: FigureSize): RenderedFigure {
  if (size.preset === 'screen' || !fig.layout) return fig;
  // to 0.01 px, so the SVG's numbers stay short (3.4 x 96 is 326.40000000000003 in binary floating point)
  const hundredths = (v: number) => Math.round(v * 100) / 100;
  const w = hundredths(printedInches(size, fig.frame.width) * CSS_PX_PER_INCH);
  const key = `${w}`;
  const hit = printed.get(fig);
  if (hit && hit.key === key) return hit.fig;
  const out = fig.layout(w, hundredths((w * fig.frame.height) / fig.frame.width));
  printed.set(fig, { key, fig: out });
  return out;
}
