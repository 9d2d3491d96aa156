/**
 * Figures of a quantum Monte Carlo result that ED and VMC do not have: the free-energy
 * curve f(alpha) - f(0) per site of a self-consistent run, with error bars, its local
 * minima and the measured alpha* marked. f is integrated from <sigma^x> over the alpha
 * grid (src/core/qmc/free-energy-scan.ts); the figure only draws it.
 */
import type { QmcResult } from '../../core/qmc/quantum-monte-carlo.ts';
import type { RenderedFigure } from '../app/figure-panel.ts';
import { seriesFigure, type Reference } from './series-figure.ts';
import { SERIES } from '../plot/house-style.ts';

/** f(alpha) - f(0) against alpha with error bars; null when alpha was fixed. */
export function freeEnergyFigure(r: QmcResult, width: number): RenderedFigure | null {
  const scan = r.alphaScan;
  if (!scan || scan.length === 0) return null;
  const pts = [...scan].sort((a, b) => a.alpha - b.alpha);
  const refs: Reference[] = [
    { axis: 'x', value: r.alpha.value, label: `\u03b1* = ${Number(r.alpha.value.toPrecision(4))}`, stroke: SERIES[3] },
    { axis: 'y', value: 0, label: 'f(0)', stroke: '#7d8798', dash: '2 2' },
  ];
  const minima = (r.minima ?? []).filter((m) => Math.abs(m.alpha - r.alpha.value) > 1e-12);
  return seriesFigure({
    id: 'qmc-f', name: 'qmc-free-energy', title: 'QMC free energy f(\u03b1) \u2212 f(0) per site against the photon amplitude', width, height: 280,
    series: [
      { label: 'f(\u03b1) \u2212 f(0), QMC', x: pts.map((p) => p.alpha), y: pts.map((p) => p.f.value), err: pts.map((p) => p.f.error), stroke: SERIES[0], points: true },
      ...(minima.length ? [{ label: 'other local minima', x: minima.map((m) => m.alpha), y: minima.map((m) => m.f.value), err: minima.map((m) => m.f.error), stroke: SERIES[1], points: true, noLine: true }] : []),
    ],
    refs, x: { label: 'photon amplitude \u03b1 (\u27e8a\u27e9 = \u221aN \u03b1)' }, y: { label: 'f(\u03b1) \u2212 f(0) per site (g)' },
  });
}
