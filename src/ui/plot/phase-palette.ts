/**
 * The phase palette of the atlas, chosen for it. The three phases without an order are
 * quiet, light fills told apart by lightness and warmth (empty paper, normal sand, filled
 * slate), so the dark boundary lines drawn over them stay the strongest thing on the map;
 * the ordered phases carry colour: superradiant gold, supersolid rose, density waves an
 * indigo ramp shaded by filling (denser = darker) with the fraction written on them. Phases
 * that carry two orders at once get a texture over their colour: the supersolid
 * (condensate + crystal) white diagonal hatching, a phase-separated mixture (two
 * coexisting phases inside a first-order jump) cross-hatching. Every pair of these fills
 * stays at least 10 CIEDE2000 apart under simulated protanopia, deuteranopia and
 * tritanopia, the density-wave shades included (tests/ui/plot/palette-vision.test.ts).
 */
import type { PhaseLabel } from '../../core/meanfield/state.ts';
import type { Frame } from './frame.ts';
import type { LegendEntry } from './legend.ts';
import { INK } from './house-style.ts';

export const PHASE_COLOURS: Record<PhaseLabel, string> = {
  empty: '#f0eee7',
  filled: '#a7b2bf',
  normal: '#e6cfa8',
  'density-wave': '#4c58a9',
  superradiant: '#ecab13',
  supersolid: '#cb4d6d',
};

/** Readable names for legends and readouts. */
export const PHASE_NAMES: Record<PhaseLabel, string> = {
  empty: 'empty',
  filled: 'filled',
  normal: 'normal (thermal)',
  'density-wave': 'density wave',
  superradiant: 'superradiant',
  supersolid: 'supersolid',
};

/** Value of a fraction string "p/q" (NaN for null). */
export function fractionValue(fr: string | null | undefined): number {
  if (!fr) return NaN;
  const [p, q] = fr.split('/').map(Number);
  return q ? p / q : p;
}

/** Hue (deg), saturation and the lightness at filling 0 and 1 (%, HSL) of the density-wave ramp. */
export const DENSITY_WAVE_RAMP = { hue: 232, saturation: 38, light0: 70, light1: 26 } as const;

/** #rrggbb of an HSL colour (CSS Color 4, 'hsl()' to sRGB). */
function hslHex(h: number, s: number, l: number): string {
  const S = s / 100, L = l / 100, a = S * Math.min(L, 1 - L);
  const f = (n: number) => { const k = (n + h / 30) % 12; return L - a * Math.max(-1, Math.min(k - 3, 9 - k, 1)); };
  return '#' + [f(0), f(8), f(4)].map((c) => Math.round(c * 255).toString(16).padStart(2, '0')).join('');
}

/** Density-wave indigo, lighter for sparse crystals: HSL lightness 70% at filling 0 to 26% at 1. */
export function densityWaveColour(filling: number): string {
  const f = Number.isFinite(filling) ? Math.min(1, Math.max(0, filling)) : 0.5;
  const r = DENSITY_WAVE_RAMP;
  return hslHex(r.hue, r.saturation, Math.round(r.light0 - (r.light0 - r.light1) * f));
}

export const TEXTURE_IDS = { supersolid: 'tex-ss', coexistence: 'tex-mix' } as const;

/** Pattern definitions for the textures (ids prefixed by the figure id). */
export function textureDefs(f: Frame): string {
  const ss = `${f.id}-${TEXTURE_IDS.supersolid}`, mix = `${f.id}-${TEXTURE_IDS.coexistence}`;
  return `<pattern id="${ss}" width="7" height="7" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">`
    + '<line x1="0" y1="0" x2="0" y2="7" stroke="#ffffff" stroke-width="2.2" stroke-opacity="0.75"/></pattern>'
    + `<pattern id="${mix}" width="8" height="8" patternUnits="userSpaceOnUse">`
    + `<path d="M0 0L8 8M8 0L0 8" stroke="${INK}" stroke-width="1" stroke-opacity="0.55"/></pattern>`;
}

/** The texture fill of a phase (url(#...)), if it has one. */
export function phaseTexture(figId: string, phase: PhaseLabel, coexisting = false): string | undefined {
  if (coexisting) return `url(#${figId}-${TEXTURE_IDS.coexistence})`;
  return phase === 'supersolid' ? `url(#${figId}-${TEXTURE_IDS.supersolid})` : undefined;
}

/** Fill colour of a phase; density waves and supersolids shaded by their fraction. */
export function phaseFill(phase: PhaseLabel, fraction: string | null): string {
  if (phase === 'density-wave') return densityWaveColour(fractionValue(fraction));
  return PHASE_COLOURS[phase];
}

/** Legend entries for the phases present (in the fixed order of PhaseLabel). */
export function phaseLegend(figId: string, present: Iterable<PhaseLabel>, coexistence = false): LegendEntry[] {
  const set = new Set(present);
  const order: PhaseLabel[] = ['empty', 'normal', 'superradiant', 'density-wave', 'supersolid', 'filled'];
  const out: LegendEntry[] = order.filter((p) => set.has(p)).map((p) => ({
    label: PHASE_NAMES[p],
    swatch: { kind: 'fill', fill: p === 'density-wave' ? densityWaveColour(0.5) : PHASE_COLOURS[p], texture: phaseTexture(figId, p) },
  }));
  if (coexistence) out.push({ label: 'two phases coexist', swatch: { kind: 'fill', fill: PHASE_COLOURS.empty, texture: phaseTexture(figId, 'normal', true) } });
  return out;
}
