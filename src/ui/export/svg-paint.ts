/**
 * The SVG painting properties the figures use, cascaded as SVG 1.1 (6.4, 6.7) does:
 * presentation attributes and the `style` attribute, inherited down the tree except
 * opacity (multiplied into the children here, exact for marks that do not overlap),
 * transform and clip-path. Colours: #rgb, #rrggbb, rgb(), hsl() (with alpha) and a few names.
 */
import type { SvgNode } from './svg-tree.ts';

export interface Paint {
  fill: string; stroke: string; strokeWidth: number; dash: string; cap: string; join: string;
  fillOpacity: number; strokeOpacity: number; opacity: number; fillRule: string;
  fontSize: number; fontWeight: string; anchor: string; baseline: string; paintOrder: string; visibility: string;
}

/** SVG's initial values (SVG 1.1, Appendix N): black fill, no stroke, width 1. */
export const INITIAL_PAINT: Paint = {
  fill: '#000000', stroke: 'none', strokeWidth: 1, dash: 'none', cap: 'butt', join: 'miter',
  fillOpacity: 1, strokeOpacity: 1, opacity: 1, fillRule: 'nonzero',
  fontSize: 16, fontWeight: 'normal', anchor: 'start', baseline: 'auto', paintOrder: 'normal', visibility: 'visible',
};

/** Attributes with the `style` attribute's declarations laid over them. */
export function properties(n: SvgNode): Record<string, string> {
  const p = { ...n.attrs };
  for (const decl of (n.attrs.style ?? '').split(';')) {
    const at = decl.indexOf(':');
    if (at > 0) p[decl.slice(0, at).trim()] = decl.slice(at + 1).trim();
  }
  return p;
}

const float = (v: string | undefined, d: number) => {
  const x = Number.parseFloat(v ?? '');
  return Number.isFinite(x) ? x : d;
};

/** The paint of node `n` inside a parent painted `up`. */
export function cascade(up: Paint, n: SvgNode): Paint {
  const p = properties(n);
  return {
    fill: p.fill ?? up.fill, stroke: p.stroke ?? up.stroke, strokeWidth: float(p['stroke-width'], up.strokeWidth),
    dash: p['stroke-dasharray'] ?? up.dash, cap: p['stroke-linecap'] ?? up.cap, join: p['stroke-linejoin'] ?? up.join,
    fillOpacity: float(p['fill-opacity'], up.fillOpacity), strokeOpacity: float(p['stroke-opacity'], up.strokeOpacity),
    opacity: up.opacity * float(p.opacity, 1), fillRule: p['fill-rule'] ?? up.fillRule,
    fontSize: float(p['font-size'], up.fontSize), fontWeight: p['font-weight'] ?? up.fontWeight,
    anchor: p['text-anchor'] ?? up.anchor, baseline: p['dominant-baseline'] ?? up.baseline,
    paintOrder: p['paint-order'] ?? up.paintOrder, visibility: p.visibility ?? up.visibility,
  };
}

const NAMED: Record<string, [number, number, number]> = {
  black: [0, 0, 0], white: [255, 255, 255], red: [255, 0, 0], green: [0, 128, 0], blue: [0, 0, 255],
  gray: [128, 128, 128], grey: [128, 128, 128], currentcolor: [0, 0, 0],
};

/** A colour as r, g, b in 0..1 and an alpha; null for none or transparent. */
export function parseColour(text: string): { rgb: [number, number, number]; alpha: number } | null {
  const t = text.trim().toLowerCase();
  if (t === 'none' || t === 'transparent' || t === '') return null;
  let m = /^#([0-9a-f]{3})$/.exec(t);
  if (m) return { rgb: [...m[1]].map((h) => parseInt(h + h, 16) / 255) as [number, number, number], alpha: 1 };
  m = /^#([0-9a-f]{6})([0-9a-f]{2})?$/.exec(t);
  if (m) {
    const v = [0, 2, 4].map((i) => parseInt(m![1].slice(i, i + 2), 16) / 255) as [number, number, number];
    return { rgb: v, alpha: m[2] ? parseInt(m[2], 16) / 255 : 1 };
  }
  m = /^rgba?\(([^)]*)\)$/.exec(t);
  if (m) {
    const v = m[1].split(/[\s,/]+/).filter(Boolean).map((s) => (s.endsWith('%') ? (parseFloat(s) / 100) * 255 : parseFloat(s)));
    return { rgb: [v[0] / 255, v[1] / 255, v[2] / 255], alpha: v.length > 3 ? (m[1].split(/[\s,/]+/).filter(Boolean)[3].endsWith('%') ? v[3] / 255 : v[3]) : 1 };
  }
  m = /^hsla?\(([^)]*)\)$/.exec(t);
  if (m) {
    const v = m[1].split(/[\s,/]+/).filter(Boolean);
    const [h, sat, l] = [parseFloat(v[0]), parseFloat(v[1]) / 100, parseFloat(v[2]) / 100];
    const a = v.length > 3 ? (v[3].endsWith('%') ? parseFloat(v[3]) / 100 : parseFloat(v[3])) : 1;
    return { rgb: hslToRgb(h, sat, l), alpha: a };
  }
  const n = NAMED[t];
  return n ? { rgb: [n[0] / 255, n[1] / 255, n[2] / 255], alpha: 1 } : { rgb: [0, 0, 0], alpha: 1 };
}

/** HSL (CSS Color 3, 4.2.4: hue in degrees, saturation and lightness in 0..1) to r, g, b in 0..1. */
export function hslToRgb(h: number, s: number, l: number): [number, number, number] {
  const f = (n: number) => {
    const k = (n + (((h % 360) + 360) % 360) / 30) % 12;
    return l - s * Math.min(l, 1 - l) * Math.max(-1, Math.min(k - 3, 9 - k, 1));
  };
  return [f(0), f(8), f(4)];
}

/** The id of a `url(#id)` reference and its fallback colour, or null for a plain colour. */
export function paintServer(text: string): { id: string; fallback: string } | null {
  const m = /^url\(\s*['"]?#([^'")]+)['"]?\s*\)\s*(.*)$/.exec(text.trim());
  return m ? { id: m[1], fallback: m[2] || 'none' } : null;
}
