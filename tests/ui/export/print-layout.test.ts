/**
 * Figures exported at a journal size are laid out again at the printed width. A CSS px is
 * 1/96 in (CSS Values 3) and a point 1/72 in, so a figure laid out inches x 96 px wide and
 * printed inches wide sets its text at 0.75 pt per px. Journals ask for text of about
 * 7-10 pt at print size (common practice, no source); the figure laid out for a ~940 px
 * window and scaled to one 3.4 in column (common practice, no source: 8.6 cm) sets its
 * 12.5 px axis titles at 12.5 x 3.4 x 72 / 940 = 3.3 pt, which this layout is for.
 */
import { describe, it, expect } from 'vitest';
import { phaseMapFigure, type PhaseMapInput } from '../../../src/ui/figures/phase-map-figure.ts';
import { withLabNote, withLabPoint } from '../../../src/ui/figures/lab-point-mark.ts';
import { withBoundaryCheck } from '../../../src/ui/figures/boundary-check-overlay.ts';
import { printFigure, relayable } from '../../../src/ui/export/print-layout.ts';
import { pdfFile, svgFile } from '../../../src/ui/export/figure-image.ts';
import type { FigureSize } from '../../../src/ui/export/figure-size.ts';
import type { SolveResult } from '../../../src/core/meanfield/ground-state.ts';

const wave = (M: number) => ({
  phase: 'density-wave', fraction: `1/${M}`, cellSize: M, sublatticeDensities: [1, ...Array(M - 1).fill(0)],
  photonDensity: 0, emitterDensity: 1 / M, excitationDensity: 1 / M, coexistence: null,
} as unknown as SolveResult);
const half = wave(2), third = wave(3);
const map = (width: number, height: number) => phaseMapFigure({
  grid: { nx: 24, ny: 16, x: [0, 2], y: [0, 1] }, stateAt: (i) => (i < 12 ? half : third), xLabel: 'μ (g)', yLabel: 'δ (g)',
  shade: 'phase', lines: [], width, height, title: 'map',
} satisfies PhaseMapInput);

const single: FigureSize = { preset: 'single', inches: 5, dpi: 300 };
/** Points per CSS px of a document `viewBoxWidth` px wide printed `inches` wide. */
const ptPerPx = (inches: number, viewBoxWidth: number) => (inches * 72) / viewBoxWidth;

/** The root's width attribute, viewBox and the axis titles' font sizes in px. */
function read(svg: string) {
  const root = /^(?:<\?xml[^>]*>\s*)?(<svg\b[^>]*>)/.exec(svg)![1];
  const viewBox = /viewBox="([^"]+)"/.exec(root)![1].split(/\s+/).map(Number);
  const titles = [...svg.matchAll(/<text class="axis-title"[^>]*font-size="([\d.]+)"/g)].map((m) => Number(m[1]));
  return { width: /\swidth="([^"]+)"/.exec(root)![1], viewBox, titles };
}

describe('export at a print size', () => {
  it('lays the map out again at 3.4 in x 96 px for one column, its axis titles at >= 7 pt, overlays kept', async () => {
    const screen = relayable(map, 940, 470, 320);
    const lab = withLabPoint(screen, { x: { value: 1.3, sigma: 0.1 }, y: { value: 0.4, sigma: 0.05 }, text: 'lab' });
    const fig = withBoundaryCheck(lab, { line: [[0.2, 0.2], [1.8, 0.8]], ends: [[0.2, 0.2], [1.8, 0.8]], markers: [] });
    const printed = printFigure(fig, single);
    const out = read(await svgFile(printed.svg, single, printed.frame.width, printed.frame.height).text());
    expect(out.width).toBe('3.4in');
    // 3.4 in x 96 px/in = 326.4 px of layout (exact to the 0.01 px the layout width is rounded to)
    expect(out.viewBox[2]).toBe(326.4);
    expect(out.titles).toHaveLength(2);
    for (const px of out.titles) expect(px * ptPerPx(3.4, out.viewBox[2])).toBeGreaterThanOrEqual(7);
    // the lab point and the checked line are drawn over the new layout too
    expect(printed.svg).toContain('class="lab-point"');
    expect(printed.svg).toContain('class="boundary-check"');
    expect(printed.frame.width).toBe(326.4);

    // the same figure without a layout is the screen figure scaled: its titles print below 7 pt
    const { layout: _none, ...fixed } = map(940, 470);
    const scaled = read(await svgFile(printFigure(fixed, single).svg, single, 940, fixed.frame.height).text());
    expect(scaled.viewBox[2]).toBe(940);
    for (const px of scaled.titles) expect(px * ptPerPx(3.4, scaled.viewBox[2])).toBeLessThan(7);
  });

  it('keeps a note strip added under the figure (it is laid out again at the new width, below the new figure)', () => {
    const fig = withLabNote(relayable(map, 940, 470, 320), 'Rb = 1.5 ± 0.1 a, μ = 0.3 ± 0.05 g', true);
    const printed = printFigure(fig, single);
    expect(printed.frame.width).toBe(326.4);
    expect(printed.svg).toContain('class="lab-point-note"');
    // the note's strip starts at the bottom of the re-laid-out map: its first rect at y = map height
    const base = printFigure(relayable(map, 940, 470, 320), single);
    const strip = /<g class="lab-point-note"><rect x="0" y="([\d.]+)"/.exec(printed.svg);
    expect(Number(strip![1])).toBeGreaterThan(0);
    expect(printed.frame.height).toBeGreaterThan(Number(strip![1]));
    expect(Number(strip![1])).toBeLessThanOrEqual(base.frame.height);
  });

  it('sets the PDF page to the printed width (3.4 in = 244.8 pt) from the re-laid-out figure', async () => {
    const fig = printFigure(relayable(map, 940, 470, 320), single);
    const pdf = await (await pdfFile(fig.svg, fig.title, single, fig.frame.width)).text();
    const box = /\/MediaBox \[([^\]]+)\]/.exec(pdf)![1].trim().split(/\s+/).map(Number);
    expect(box[2] - box[0]).toBeCloseTo(3.4 * 72, 6);
    // page height over width is the laid-out figure's (1e-3: the page size is written to 0.001 pt)
    expect((box[3] - box[1]) / (box[2] - box[0])).toBeCloseTo(fig.frame.height / fig.frame.width, 3);
  });
});
