/**
 * A finite cluster drawn to scale: each site at its position (units of a), shaded by its
 * measured density <n_i> (white = empty, ink = excited), with the site index as tooltip.
 * Periodic clusters are marked as such (their edges wrap round).
 */
import { renderFigure } from '../plot/figure.ts';
import { dots } from '../plot/dot.ts';
import { axisX, axisY } from '../plot/axis.ts';
import { legend } from '../plot/legend.ts';
import { densityGrey } from './pattern-figure.ts';
import type { RenderedFigure } from '../app/figure-panel.ts';

export function clusterFigure(positions: ArrayLike<number>, densities: number[] | null, periodic: boolean, width: number, height: number): RenderedFigure {
  const N = positions.length / 2;
  const xs = Array.from({ length: N }, (_, i) => positions[2 * i]), ys = Array.from({ length: N }, (_, i) => positions[2 * i + 1]);
  const pad = 0.8;
  const x: [number, number] = [Math.min(...xs) - pad, Math.max(...xs) + pad];
  const y: [number, number] = [Math.min(...ys) - pad, Math.max(...ys) + pad];
  let nearest = Infinity;
  for (let i = 0; i < N; i++) for (let j = i + 1; j < N; j++) nearest = Math.min(nearest, Math.hypot(xs[i] - xs[j], ys[i] - ys[j]));
  const span = Math.max(x[1] - x[0], (y[1] - y[0]) * ((width - 76) / Math.max(1, height - 100)));
  const pxPerA = (width - 76) / span;
  const r = Math.max(2.5, Math.min(13, 0.38 * (Number.isFinite(nearest) ? nearest : 1) * pxPerA));
  const list = xs.map((px, i) => ({
    x: px, y: ys[i], r, fill: densities ? densityGrey(densities[i]) : '#ffffff', stroke: '#3b4350', strokeWidth: 1,
    title: `site ${i} at (${px.toFixed(3)}, ${ys[i].toFixed(3)})${densities ? `: <n> = ${densities[i].toFixed(4)}` : ''}`,
  }));
  const title = `${periodic ? 'Periodic cluster' : 'Array'} of ${N} sites${densities ? ', shaded by <n_i>' : ''}`;
  const { svg, frame } = renderFigure({
    id: 'cluster', width, height, margin: { right: 24, left: 52 }, x, y, equalAspect: true, title,
    marks: [dots(list), axisX({ label: 'x (a)' }), axisY({ label: 'y (a)' }), legend([
      { label: '\u27e8n\u27e9 = 0', swatch: { kind: 'dot', fill: densityGrey(0) } },
      { label: '\u27e8n\u27e9 = 0.5', swatch: { kind: 'dot', fill: densityGrey(0.5) } },
      { label: '\u27e8n\u27e9 = 1', swatch: { kind: 'dot', fill: densityGrey(1) } },
    ], { title: periodic ? 'Sites (periodic)' : 'Sites (open edges)' })],
  });
  return { svg, frame, name: 'cluster', title };
}
