/**
 * Text mark: labels at data positions with a light halo so they read over any fill
 * (the fraction written on each density-wave region).
 */
import type { Frame, Mark } from './frame.ts';
import { el, esc } from './svg-markup.ts';
import { INK } from './house-style.ts';

export interface TextLabel { x: number; y: number; text: string; size?: number; fill?: string; halo?: string }

/** Labels centred on their positions. */
export function textLabels(list: TextLabel[], className = 'labels'): Mark {
  return {
    clip: true,
    render(f: Frame) {
      return `<g class="${className}">${list.map((t) => el('text', {
        x: f.x(t.x), y: f.y(t.y) + (t.size ?? 12) * 0.35, 'text-anchor': 'middle', 'font-size': t.size ?? 12,
        'font-weight': 'bold', fill: t.fill ?? INK, stroke: t.halo ?? '#ffffff', 'stroke-width': 3,
        'paint-order': 'stroke', 'stroke-linejoin': 'round',
      }, esc(t.text))).join('')}</g>`;
    },
  };
}
