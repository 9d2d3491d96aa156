/**
 * The staircase: excitation density rho(mu) and emitter filling <n>(mu) for two
 * interaction ranges (solid and dashed), the first range's plateaus shaded over the full
 * height and labelled with their fraction, the second range's as a labelled strip along
 * the bottom, the detuning as a rule (mu must stay below it).
 */
import type { Plateau } from '../../core/meanfield/plateaus.ts';
import { renderFigure } from '../plot/figure.ts';
import { line } from '../plot/line.ts';
import { bandsX, type Band } from '../plot/band.ts';
import { ruleX } from '../plot/rule.ts';
import { axisX, axisY } from '../plot/axis.ts';
import { legend } from '../plot/legend.ts';
import type { Mark } from '../plot/frame.ts';
import type { RenderedFigure } from '../app/figure-panel.ts';

export interface StaircaseSeries {
  label: string;
  mu: number[];
  rho: number[];
  filling: number[];
  plateaus: Plateau[];
}

const MAIN = '#165a78', SECOND = '#b3124e';

/** Label of a plateau: its fraction, "empty" and "filled" for 0/1 and 1/1. */
export function plateauLabel(f: string): string {
  return f === '0/1' ? 'empty' : f === '1/1' ? 'filled' : f;
}

export function staircaseFigure(a: StaircaseSeries, b: StaircaseSeries | null, delta: number, width: number, height: number): RenderedFigure {
  const all = [a, ...(b ? [b] : [])];
  const mus = all.flatMap((s) => s.mu);
  const ys = all.flatMap((s) => [...s.rho, ...s.filling]);
  const x: [number, number] = [Math.min(...mus), Math.max(...mus)];
  const y: [number, number] = [0, Math.max(0.55, Math.min(1.05, Math.max(...ys) * 1.08))];
  const step = (x[1] - x[0]) / Math.max(1, a.mu.length - 1);
  const bands = (s: StaircaseSeries, fill: string, strip: boolean): Band[] => s.plateaus
    .filter((p) => p.fraction !== '0/1' || !p.openLow || p.points > 1)
    .map((p) => ({
      x0: p.muLow - step / 2, x1: p.muHigh + step / 2, fill, label: plateauLabel(p.fraction),
      ...(strip ? { from: 0, to: 0.1, opacity: 0.55 } : { opacity: 0.22 }),
    }));
  const marks: Mark[] = [
    bandsX(bands(a, MAIN, false)),
    ...(b ? [bandsX(bands(b, SECOND, true))] : []),
    ruleX(delta, { stroke: '#8a2b0f', dash: '3 3', label: '\u03bc = \u03b4' }),
  ];
  for (const [s, colour, dash] of [[a, MAIN, undefined], ...(b ? [[b, SECOND, '6 3']] : [])] as [StaircaseSeries, string, string | undefined][]) {
    marks.push(line(s.mu, s.rho, { stroke: colour, width: 2, dash }));
    marks.push(line(s.mu, s.filling, { stroke: colour, width: 1.2, dash: dash ?? '1 2' }));
  }
  marks.push(axisX({ label: 'chemical potential \u03bc (g)' }), axisY({ label: 'density per site', grid: true }));
  marks.push(legend([
    { label: `\u03c1, ${a.label}`, swatch: { kind: 'line', stroke: MAIN, width: 2 } },
    { label: `\u27e8n\u27e9, ${a.label}`, swatch: { kind: 'line', stroke: MAIN, width: 1.2, dash: '1 2' } },
    { label: `plateau, ${a.label}`, swatch: { kind: 'fill', fill: 'rgba(22,90,120,0.22)' } },
    ...(b ? [
      { label: `\u03c1, ${b.label}`, swatch: { kind: 'line' as const, stroke: SECOND, width: 2, dash: '6 3' } },
      { label: `\u27e8n\u27e9, ${b.label}`, swatch: { kind: 'line' as const, stroke: SECOND, width: 1.2, dash: '6 3' } },
      { label: `plateau, ${b.label} (strip)`, swatch: { kind: 'fill' as const, fill: 'rgba(179,18,78,0.55)' } },
    ] : []),
  ], { title: 'Staircase' }));
  const title = `Staircase \u03c1(\u03bc) and filling, ${all.map((s) => s.label).join(' vs ')}`;
  const { svg, frame } = renderFigure({ id: 'staircase', width, height, margin: { right: 210 }, x, y, marks, title });
  return { svg, frame, name: 'staircase', title };
}
