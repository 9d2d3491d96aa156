/**
 * Dot mark: circles at data positions with per-dot fill, stroke and radius in pixels
 * (lattice sites shaded by density, the chosen point on a map).
 */
import type { Frame, Mark } from './frame.ts';
import { el, esc } from './svg-markup.ts';

export interface Dot {
  x: number;
  y: number;
  r: number;
  fill: string;
  stroke?: string;
  strokeWidth?: number;
  dash?: string;
  /** Tooltip text. */
  title?: string;
}

/** Circles for each dot. */
export function dots(list: Dot[], clip = true): Mark {
  return {
    clip,
    render(f: Frame) {
      return `<g class="dots">${list.map((d) => el('circle', {
        cx: f.x(d.x), cy: f.y(d.y), r: d.r, fill: d.fill, stroke: d.stroke, 'stroke-width': d.strokeWidth, 'stroke-dasharray': d.dash,
      }, d.title ? `<title>${esc(d.title)}</title>` : '')).join('')}</g>`;
    },
  };
}
