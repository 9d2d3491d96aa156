/**
 * Colour science for the palette checks, written from the sources (test code only):
 *
 * - sRGB to linear light and to CIE XYZ (D65): IEC 61966-2-1:1999, the sRGB standard
 *   (transfer function and its RGB -> XYZ matrix).
 * - CIELAB from XYZ with the D65 white (Xn, Yn, Zn) = (95.047, 100, 108.883):
 *   CIE 15:2004, Colorimetry, 3rd ed., section 8.2.1 (f(t) = t^(1/3) above (6/29)^3,
 *   t / (3 (6/29)^2) + 4/29 below).
 * - CIEDE2000 colour difference: CIE 142-2001, in the form of G. Sharma, W. Wu and
 *   E. N. Dalal, "The CIEDE2000 color-difference formula: implementation notes,
 *   supplementary test data, and mathematical observations", Color Res. Appl. 30, 21 (2005),
 *   equations (1)-(22) with kL = kC = kH = 1.
 * - Colour-vision deficiency simulation: G. M. Machado, M. M. Oliveira and L. A. F.
 *   Fernandes, "A physiologically-based model for simulation of color vision deficiency",
 *   IEEE TVCG 15(6), 1291 (2009): the severity 1.0 matrices of protanopia, deuteranopia
 *   and tritanopia from the paper's table of matrices, applied to linear RGB. Transcribed
 *   from the published table (from memory of it; each row sums to 1 to 1e-6, as the paper's
 *   matrices keep white and greys unchanged, and the test checks that).
 * - WCAG 2.1 relative luminance and contrast ratio (W3C Recommendation 2018, definitions
 *   "relative luminance" and "contrast ratio"): (L1 + 0.05) / (L2 + 0.05).
 */

export type Rgb = [number, number, number];
export type Lab = [number, number, number];

/** #rrggbb to sRGB components in [0, 1]. */
export function hexRgb(hex: string): Rgb {
  const m = /^#([0-9a-f]{6})$/i.exec(hex);
  if (!m) throw new Error(`not a #rrggbb colour: ${hex}`);
  const n = parseInt(m[1], 16);
  return [(n >> 16) / 255, ((n >> 8) & 255) / 255, (n & 255) / 255];
}

/** #rrggbb of a CSS `hsl(h s% l%)` colour (CSS Color Module Level 4, section 7.1, hsl to sRGB). */
export function hslToHex(css: string): string {
  const m = /^hsl\((-?[\d.]+)\s+([\d.]+)%\s+([\d.]+)%\)$/.exec(css);
  if (!m) throw new Error(`not an hsl() colour: ${css}`);
  const h = Number(m[1]), S = Number(m[2]) / 100, L = Number(m[3]) / 100;
  const a = S * Math.min(L, 1 - L);
  const f = (n: number) => { const k = (n + h / 30) % 12; return L - a * Math.max(-1, Math.min(k - 3, 9 - k, 1)); };
  return '#' + [f(0), f(8), f(4)].map((c) => Math.round(c * 255).toString(16).padStart(2, '0')).join('');
}

/** sRGB companding undone (IEC 61966-2-1). */
export function toLinear(c: number): number {
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

/** Linear sRGB to XYZ (D65, Y of white = 100), IEC 61966-2-1 matrix. */
export function linearToXyz([r, g, b]: Rgb): [number, number, number] {
  return [
    100 * (0.4124 * r + 0.3576 * g + 0.1805 * b),
    100 * (0.2126 * r + 0.7152 * g + 0.0722 * b),
    100 * (0.0193 * r + 0.1192 * g + 0.9505 * b),
  ];
}

const WHITE = [95.047, 100, 108.883];

/** XYZ to CIELAB, D65 (CIE 15:2004). */
export function xyzToLab([X, Y, Z]: [number, number, number]): Lab {
  const d = 6 / 29;
  const f = (t: number) => (t > d ** 3 ? Math.cbrt(t) : t / (3 * d * d) + 4 / 29);
  const fx = f(X / WHITE[0]), fy = f(Y / WHITE[1]), fz = f(Z / WHITE[2]);
  return [116 * fy - 16, 500 * (fx - fy), 200 * (fy - fz)];
}

/** Machado et al. (2009), severity 1.0, rows applied to linear RGB. */
export const MACHADO_2009: Record<'protanopia' | 'deuteranopia' | 'tritanopia', number[][]> = {
  protanopia: [
    [0.152286, 1.052583, -0.204868],
    [0.114503, 0.786281, 0.099216],
    [-0.003882, -0.048116, 1.051998],
  ],
  deuteranopia: [
    [0.367322, 0.860646, -0.227968],
    [0.280085, 0.672501, 0.047413],
    [-0.011820, 0.042940, 0.968881],
  ],
  tritanopia: [
    [1.255528, -0.076749, -0.178779],
    [-0.078411, 0.930809, 0.147602],
    [0.004733, 0.691367, 0.303900],
  ],
};

export type Vision = 'normal' | keyof typeof MACHADO_2009;
export const VISIONS: Vision[] = ['normal', 'protanopia', 'deuteranopia', 'tritanopia'];

/** CIELAB of a #rrggbb colour as seen with `v` (simulated in linear RGB, clipped to the gamut). */
export function labAs(hex: string, v: Vision = 'normal'): Lab {
  const lin = hexRgb(hex).map(toLinear) as Rgb;
  let rgb = lin;
  if (v !== 'normal') {
    const M = MACHADO_2009[v];
    rgb = M.map((row) => Math.min(1, Math.max(0, row[0] * lin[0] + row[1] * lin[1] + row[2] * lin[2]))) as Rgb;
  }
  return xyzToLab(linearToXyz(rgb));
}

/** CIE76 colour difference: Euclidean distance in CIELAB. */
export function deltaE76(a: Lab, b: Lab): number {
  return Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
}

/** CIEDE2000 (Sharma, Wu and Dalal 2005, eqs. 1-22; kL = kC = kH = 1). */
export function deltaE2000([L1, a1, b1]: Lab, [L2, a2, b2]: Lab): number {
  const rad = Math.PI / 180;
  const C1 = Math.hypot(a1, b1), C2 = Math.hypot(a2, b2);
  const Cbar = (C1 + C2) / 2;
  const G = 0.5 * (1 - Math.sqrt(Cbar ** 7 / (Cbar ** 7 + 25 ** 7)));
  const ap1 = (1 + G) * a1, ap2 = (1 + G) * a2;
  const Cp1 = Math.hypot(ap1, b1), Cp2 = Math.hypot(ap2, b2);
  const hp = (b: number, ap: number) => (b === 0 && ap === 0 ? 0 : ((Math.atan2(b, ap) / rad) + 360) % 360);
  const hp1 = hp(b1, ap1), hp2 = hp(b2, ap2);
  const dLp = L2 - L1, dCp = Cp2 - Cp1;
  let dhp = 0;
  if (Cp1 * Cp2 !== 0) {
    dhp = hp2 - hp1;
    if (dhp > 180) dhp -= 360;
    else if (dhp < -180) dhp += 360;
  }
  const dHp = 2 * Math.sqrt(Cp1 * Cp2) * Math.sin((dhp / 2) * rad);
  const Lbp = (L1 + L2) / 2, Cbp = (Cp1 + Cp2) / 2;
  let hbp = hp1 + hp2;
  if (Cp1 * Cp2 !== 0) {
    if (Math.abs(hp1 - hp2) <= 180) hbp = (hp1 + hp2) / 2;
    else hbp = hp1 + hp2 < 360 ? (hp1 + hp2 + 360) / 2 : (hp1 + hp2 - 360) / 2;
  }
  const T = 1 - 0.17 * Math.cos((hbp - 30) * rad) + 0.24 * Math.cos(2 * hbp * rad)
    + 0.32 * Math.cos((3 * hbp + 6) * rad) - 0.2 * Math.cos((4 * hbp - 63) * rad);
  const dTheta = 30 * Math.exp(-(((hbp - 275) / 25) ** 2));
  const RC = 2 * Math.sqrt(Cbp ** 7 / (Cbp ** 7 + 25 ** 7));
  const SL = 1 + (0.015 * (Lbp - 50) ** 2) / Math.sqrt(20 + (Lbp - 50) ** 2);
  const SC = 1 + 0.045 * Cbp, SH = 1 + 0.015 * Cbp * T;
  const RT = -Math.sin(2 * dTheta * rad) * RC;
  return Math.sqrt((dLp / SL) ** 2 + (dCp / SC) ** 2 + (dHp / SH) ** 2 + RT * (dCp / SC) * (dHp / SH));
}

/** WCAG 2.1 relative luminance of a #rrggbb colour. */
export function relativeLuminance(hex: string): number {
  const [r, g, b] = hexRgb(hex).map((c) => (c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** WCAG 2.1 contrast ratio, >= 1. */
export function contrastRatio(a: string, b: string): number {
  const [hi, lo] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}
