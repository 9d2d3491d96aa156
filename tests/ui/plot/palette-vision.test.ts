/**
 * The house palette stays apart for every viewer. Colours are simulated as seen with
 * protanopia, deuteranopia and tritanopia (Machado, Oliveira and Fernandes, IEEE TVCG 15,
 * 1291 (2009), severity 1.0, linear RGB), converted to CIELAB (CIE 15:2004, D65), and every
 * pair of categorical colours must stay at least MIN_DE CIEDE2000 apart (Sharma, Wu and
 * Dalal, Color Res. Appl. 30, 21 (2005)). Text colours must reach the WCAG 2.1 contrast
 * ratio 4.5:1 on their ground (success criterion 1.4.3), lines and swatches 3:1 (1.4.11).
 *
 * Threshold: one CIEDE2000 unit is about a just-noticeable difference; colours meant to name
 * different things at a glance are commonly kept 10 or more apart (common practice, no
 * source). The colour science itself is checked first against published values.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import {
  contrastRatio, deltaE2000, hslToHex, labAs, linearToXyz, MACHADO_2009, VISIONS, xyzToLab, hexRgb, toLinear, type Lab,
} from './colour-science.ts';
import { densityWaveColour, PHASE_COLOURS } from '../../../src/ui/plot/phase-palette.ts';
import { ALERT_INK, INK, INK_SOFT, PAPER, SERIES } from '../../../src/ui/plot/house-style.ts';
import { rampColour } from '../../../src/ui/figures/sequential-ramp.ts';

const MIN_DE = 10;

describe('colour science against published values', () => {
  it('CIEDE2000 reproduces the test pairs of Sharma, Wu and Dalal (2005), Table 1 (values from memory of the table)', () => {
    const pairs: [Lab, Lab, number][] = [
      [[50, 2.6772, -79.7751], [50, 0, -82.7485], 2.0425],
      [[50, 3.1571, -77.2803], [50, 0, -82.7485], 2.8615],
      [[50, 0, 0], [50, -1, 2], 2.3669],
      [[50, 2.49, -0.001], [50, -2.49, 0.0009], 7.1792],
      [[50, 2.5, 0], [73, 25, -18], 27.1492],
      [[50, 2.5, 0], [61, -5, 29], 22.8977],
      [[50, 2.5, 0], [56, -27, -3], 31.903],
      [[50, 2.5, 0], [58, 24, 15], 19.4535],
      [[60.2574, -34.0099, 36.2677], [60.4626, -34.1751, 39.4387], 1.2644],
      [[2.0776, 0.0795, -1.135], [0.9033, -0.0636, -0.5514], 0.9082],
    ];
    // the table gives 4 decimals: agreement to 1e-4 (half a unit of the last place, plus rounding)
    for (const [a, b, d] of pairs) {
      expect(Math.abs(deltaE2000(a, b) - d)).toBeLessThan(1e-4);
      expect(Math.abs(deltaE2000(b, a) - d)).toBeLessThan(1e-4); // symmetric
    }
  });

  it('sRGB white is L* = 100 and pure red is (53.24, 80.09, 67.20) in CIELAB (D65; common reference value)', () => {
    const lab = (hex: string) => xyzToLab(linearToXyz(hexRgb(hex).map(toLinear) as [number, number, number]));
    const w = lab('#ffffff');
    // the sRGB matrix's white row sums to 95.05 against Xn = 95.047: a* and b* within 0.05
    expect(Math.abs(w[0] - 100)).toBeLessThan(1e-9);
    expect(Math.hypot(w[1], w[2])).toBeLessThan(0.05);
    const r = lab('#ff0000');
    for (const [got, want] of [[r[0], 53.24], [r[1], 80.09], [r[2], 67.2]]) expect(Math.abs(got - want)).toBeLessThan(0.05);
  });

  it("the deficiency matrices keep white and greys (each row of the paper's matrices sums to 1)", () => {
    for (const M of Object.values(MACHADO_2009)) for (const row of M) expect(Math.abs(row[0] + row[1] + row[2] - 1)).toBeLessThan(2e-6);
    for (const v of VISIONS) expect(Math.abs(labAs('#808080', v)[0] - labAs('#808080')[0])).toBeLessThan(1e-3);
  });

  it('hsl() to sRGB as CSS Color 4: hsl(120 100% 25%) is rgb(0, 128, 0) rounded, hsl(0 0% 50%) mid grey', () => {
    expect(hslToHex('hsl(120 100% 25%)')).toBe('#008000');
    expect(hslToHex('hsl(0 0% 50%)')).toBe('#808080');
  });

  it('WCAG 2.1 contrast: black on white is 21:1, a colour on itself 1:1', () => {
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 10);
    expect(contrastRatio('#777777', '#777777')).toBe(1);
  });
});

/** The smallest CIEDE2000 over the pairs (i, j) asked for, under every vision, and where. */
function closest(colours: Record<string, string>, pairs: [string, string][]): { d: number; where: string } {
  let d = Infinity, where = '';
  for (const v of VISIONS) for (const [a, b] of pairs) {
    const e = deltaE2000(labAs(colours[a], v), labAs(colours[b], v));
    if (e < d) { d = e; where = `${a} / ${b} (${v})`; }
  }
  return { d, where };
}

const allPairs = (keys: string[]) => keys.flatMap((a, i) => keys.slice(i + 1).map((b) => [a, b] as [string, string]));

describe('the phase palette', () => {
  // density waves at every simple filling p/q (q <= 6) between 1/6 and 5/6: the crystals the maps show
  const fillings = [...new Set([2, 3, 4, 5, 6].flatMap((q) => Array.from({ length: q - 1 }, (_, p) => (p + 1) / q)))].sort();
  const fixed: Record<string, string> = {
    empty: PHASE_COLOURS.empty, normal: PHASE_COLOURS.normal, filled: PHASE_COLOURS.filled,
    superradiant: PHASE_COLOURS.superradiant, supersolid: PHASE_COLOURS.supersolid,
  };
  const shades: Record<string, string> = Object.fromEntries(fillings.map((f) => [`density wave ${f.toFixed(3)}`, densityWaveColour(f)]));

  it(`the five phase fills stay ${MIN_DE} apart for every viewer`, () => {
    const r = closest(fixed, allPairs(Object.keys(fixed)));
    expect(r.d, r.where).toBeGreaterThanOrEqual(MIN_DE);
  });

  it(`every density-wave shade from filling 1/6 to 5/6 stays ${MIN_DE} apart from every other phase, for every viewer`, () => {
    const all = { ...fixed, ...shades };
    const r = closest(all, Object.keys(fixed).flatMap((a) => Object.keys(shades).map((b) => [a, b] as [string, string])));
    expect(r.d, r.where).toBeGreaterThanOrEqual(MIN_DE);
  });

  it('density-wave shades darken with filling for every viewer (the legend scale reads one way)', () => {
    for (const v of VISIONS) {
      const L = fillings.map((f) => labAs(densityWaveColour(f), v)[0]);
      for (let i = 1; i < L.length; i++) expect(L[i]).toBeLessThan(L[i - 1]);
    }
  });

  it('the quiet fills (empty, normal, filled) are light: the boundary ink over them has 4.5:1 or more', () => {
    for (const k of ['empty', 'normal', 'filled'] as const) expect(contrastRatio(INK, PHASE_COLOURS[k])).toBeGreaterThanOrEqual(4.5);
  });
});

describe('the continuous ramp (density and photon colourings)', () => {
  it('darkens monotonically from end to end for every viewer, so values read in order without hue', () => {
    for (const v of VISIONS) {
      const L = Array.from({ length: 25 }, (_, i) => labAs(hslToHex(rampColour(i / 24)), v)[0]);
      for (let i = 1; i < L.length; i++) expect(L[i], `${v} at ${i}/24`).toBeLessThan(L[i - 1]);
    }
  });
});

describe('the series palette and the text', () => {
  it(`the ${SERIES.length} series colours stay ${MIN_DE} apart for every viewer and have 3:1 on the paper`, () => {
    const cols = Object.fromEntries(SERIES.map((c, i) => [`series ${i} ${c}`, c]));
    const r = closest(cols, allPairs(Object.keys(cols)));
    expect(r.d, r.where).toBeGreaterThanOrEqual(MIN_DE);
    for (const c of SERIES) expect(contrastRatio(c, PAPER), c).toBeGreaterThanOrEqual(3);
  });

  it('figure text reaches 4.5:1 on the paper', () => {
    for (const c of [INK, INK_SOFT, ALERT_INK]) expect(contrastRatio(c, PAPER), c).toBeGreaterThanOrEqual(4.5);
  });

  it('page text reaches 4.5:1 on its grounds (shared-styles.ts)', () => {
    const css = readFileSync(new URL('../../../src/ui/app/shared-styles.ts', import.meta.url), 'utf8');
    const v = (name: string) => {
      const m = new RegExp(`--${name}: (#[0-9a-fA-F]{6})`).exec(css);
      if (!m) throw new Error(`--${name} not found`);
      return m[1];
    };
    for (const [text, ground] of [['ink', 'paper'], ['muted', 'paper'], ['ink', 'panel'], ['muted', 'panel'], ['warn', 'paper'], ['warn', 'warn-bg'], ['ok', 'paper'], ['accent-ink', 'accent'], ['accent', 'panel']]) {
      expect(contrastRatio(v(text), v(ground)), `${text} on ${ground}`).toBeGreaterThanOrEqual(4.5);
    }
  });
});
