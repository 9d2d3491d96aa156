/**
 * The phase palette of the atlas. Hues are spread so they stay apart under the common
 * colour-vision deficiencies (they also differ in lightness, which every viewer sees),
 * and the phases that carry two orders at once get a texture on top of their colour:
 * the supersolid (condensate + crystal) diagonal hatching, a phase-separated mixture
 * (two coexisting phases inside a first-order jump) cross-hatching. Density waves are
 * shaded by their filling (denser = darker) and carry their fraction as text.
 */
import type { PhaseLabel } from '../../core/meanfield/state.ts';
import type { Frame } from './frame.ts';
import type { LegendEntry } from './legend.ts';

export const PHASE_COLOURS: Record<PhaseLabel, string> = {
  empty: '#f4f1e9',
  filled: '#30333b',
  normal: '#d3cab4',
  'density-wave': '#3d78a8',
  superradiant: '#e3923a',
  supersolid: '#8a5ea6',
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

/** Density-wave blue, lighter for sparse crystals: lightness 78% at filling 0 to 36% at 1. */
export function densityWaveColour(filling: number): string {
  const f = Number.isFinite(filling) ? Math.min(1, Math.max(0, filling)) : 0.5;
  return `hsl(207 52% ${Math.round(78 - 42 * f)}%)`;
}

export const TEXTURE_IDS = { supersolid: 'tex-ss', coexistence: 'tex-mix' } as const;

/** Pattern definitions for the textures (ids prefixed by the figure id). */
export function textureDefs(f: Frame): string {
  const ss = `${f.id}-${TEXTURE_IDS.supersolid}`, mix = `${f.id}-${TEXTURE_IDS.coexistence}`;
  return `<pattern id="${ss}" width="7" height="7" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">`
    + '<line x1="0" y1="0" x2="0" y2="7" stroke="#ffffff" stroke-width="2.2" stroke-opacity="0.75"/></pattern>'
    + `<pattern id="${mix}" width="8" height="8" patternUnits="userSpaceOnUse">`
    + '<path d="M0 0L8 8M8 0L0 8" stroke="#1d2430" stroke-width="1" stroke-opacity="0.55"/></pattern>';
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
    swatch: { kind: 'fill', fill: p === 'density-wave' ? densityWaveColour(0.4) : PHASE_COLOURS[p], texture: phaseTexture(figId, p) },
  }));
  if (coexistence) out.push({ label: 'two phases coexist', swatch: { kind: 'fill', fill: '#c8c3d6', texture: phaseTexture(figId, 'normal', true) } });
  return out;
}
