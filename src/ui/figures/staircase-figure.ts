/**
 * The staircase: excitation density rho(mu) and emitter filling <n>(mu) for two
 * interaction ranges (solid and dashed), the first range's plateaus shaded over the full
 * height and labelled with their fraction, the second range's as a labelled strip along
 * the bottom, the detuning as a rule (mu must stay below it). Neighbouring plateaus are
 * shaded alternately light and dark so two that touch stay apart, and labels are set in
 * up to LABEL_ROWS rows so they never overlap; a label with no room in any row is left out
 * (the plateau table lists every plateau) and the plateau keeps it as a tooltip.
 */
import type { Plateau } from '../../core/meanfield/plateaus.ts';
import { renderFigure } from '../plot/figure.ts';
import { line } from '../plot/line.ts';
import { bandsX, type Band } from '../plot/band.ts';
import { ruleX } from '../plot/rule.ts';
import { axisX, axisY } from '../plot/axis.ts';
import { legend, legendBelowHeight } from '../plot/legend.ts';
import { ALERT_INK, SERIES } from '../plot/house-style.ts';
import type { Frame, Mark } from '../plot/frame.ts';
import { el, esc } from '../plot/svg-markup.ts';
import type { RenderedFigure } from '../app/figure-panel.ts';

export interface StaircaseSeries {
  label: string;
  mu: number[];
  rho: number[];
  filling: number[];
  plateaus: Plateau[];
}

/** The model's range in the house indigo, the comparison range in ochre (house-style.ts SERIES). */
const MAIN = SERIES[0], SECOND = SERIES[1];
/** Rows of plateau labels (over the full height: at the top; on the strip: above it). */
export const LABEL_ROWS = 3;
/** Width (px) a label of n characters takes at 11 px (DejaVu Sans averages ~6.6 px a character). */
const labelWidth = (text: string) => text.length * 6.6 + 6;

interface PlateauLabel { x0: number; x1: number; text: string }

/**
 * Plateau labels placed without overlap: each (in order of mu) goes to the first row whose
 * last label ends left of it; rows count down from `top` (px) by 13 px, or up from `bottom`.
 */
export function placeLabels(f: Frame, list: PlateauLabel[], at: { top?: number; bottom?: number }): { x: number; y: number; text: string }[] {
  const ends = new Array<number>(LABEL_ROWS).fill(-Infinity);
  const out: { x: number; y: number; text: string }[] = [];
  for (const l of [...list].sort((a, b) => a.x0 - b.x0)) {
    const cx = (f.x(l.x0) + f.x(l.x1)) / 2, w = labelWidth(l.text);
    const left = Math.max(f.inner.x0, Math.min(cx - w / 2, f.inner.x1 - w));
    const row = ends.findIndex((e) => e + 2 <= left);
    if (row < 0) continue;
    ends[row] = left + w;
    const y = at.top !== undefined ? at.top + 11 + 13 * row : at.bottom! - 4 - 13 * row;
    out.push({ x: left + w / 2, y, text: l.text });
  }
  return out;
}

/** The labels of one series' plateaus (class band-label), on a white halo. */
function plateauLabels(list: PlateauLabel[], strip: boolean, colour: string): Mark {
  return {
    clip: true,
    render(f: Frame) {
      const h = f.inner.y1 - f.inner.y0;
      const at = strip ? { bottom: f.inner.y1 - h * 0.1 } : { top: f.inner.y0 + 2 };
      return `<g class="plateau-labels">${placeLabels(f, list, at).map((p) => el('text', {
        x: p.x, y: p.y, 'text-anchor': 'middle', 'font-size': 11, fill: colour, class: 'band-label',
        stroke: '#ffffff', 'stroke-width': 3, 'paint-order': 'stroke', 'stroke-linejoin': 'round',
      }, esc(p.text))).join('')}</g>`;
    },
  };
}

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
  const shown = (s: StaircaseSeries) => s.plateaus
    .filter((p) => p.fraction !== '0/1' || !p.openLow || p.points > 1)
    .sort((p, q) => p.muLow - q.muLow);
  // neighbours alternate light and dark, so two plateaus that touch read as two
  const bands = (s: StaircaseSeries, fill: string, strip: boolean): Band[] => shown(s).map((p, i) => ({
    x0: p.muLow - step / 2, x1: p.muHigh + step / 2, fill,
    ...(strip ? { from: 0, to: 0.1, opacity: i % 2 ? 0.75 : 0.4 } : { opacity: i % 2 ? 0.3 : 0.13 }),
  }));
  const labels = (s: StaircaseSeries): PlateauLabel[] => shown(s).map((p) => ({ x0: p.muLow - step / 2, x1: p.muHigh + step / 2, text: plateauLabel(p.fraction) }));
  const marks: Mark[] = [
    bandsX(bands(a, MAIN, false)),
    ...(b ? [bandsX(bands(b, SECOND, true))] : []),
    ruleX(delta, { stroke: ALERT_INK, dash: '3 3', label: '\u03bc = \u03b4' }),
  ];
  for (const [s, colour, dash] of [[a, MAIN, undefined], ...(b ? [[b, SECOND, '6 3']] : [])] as [StaircaseSeries, string, string | undefined][]) {
    marks.push(line(s.mu, s.rho, { stroke: colour, width: 2, dash }));
    marks.push(line(s.mu, s.filling, { stroke: colour, width: 1.2, dash: dash ?? '1 2' }));
  }
  marks.push(plateauLabels(labels(a), false, '#262a6e'));
  if (b) marks.push(plateauLabels(labels(b), true, '#6b4500'));
  marks.push(axisX({ label: 'chemical potential \u03bc (g)' }), axisY({ label: 'density per site', grid: true }));
  // narrow figures (a phone, a 420 px window) take the legend under the axis and keep the plot's width
  const narrow = width < 560;
  marks.push(legend([
    { label: `\u03c1, ${a.label}`, swatch: { kind: 'line', stroke: MAIN, width: 2 } },
    { label: `\u27e8n\u27e9, ${a.label}`, swatch: { kind: 'line', stroke: MAIN, width: 1.2, dash: '1 2' } },
    { label: `plateaus, ${a.label}`, swatch: { kind: 'fill', fill: 'rgba(58,63,158,0.22)' } },
    ...(b ? [
      { label: `\u03c1, ${b.label}`, swatch: { kind: 'line' as const, stroke: SECOND, width: 2, dash: '6 3' } },
      { label: `\u27e8n\u27e9, ${b.label}`, swatch: { kind: 'line' as const, stroke: SECOND, width: 1.2, dash: '6 3' } },
      { label: `plateau, ${b.label} (strip)`, swatch: { kind: 'fill' as const, fill: 'rgba(181,122,16,0.55)' } },
    ] : []),
  ], narrow ? { below: true } : { title: 'Staircase' }));
  const title = `Staircase \u03c1(\u03bc) and filling, ${all.map((s) => s.label).join(' vs ')}`;
  const below = narrow ? legendBelowHeight(b ? 6 : 3, width) : 0;
  const { svg, frame } = renderFigure({
    id: 'staircase', width, height: height + below, margin: narrow ? { right: 14, bottom: 48 + below } : { right: 24 }, x, y, marks, title,
  });
  return { svg, frame, name: 'staircase', title };
}
