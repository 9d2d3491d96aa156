/**
 * SVG linear gradients (SVG 1.1, 13.2.2) as PDF axial shadings (ISO 32000-1:2008, 8.7.4.5.3:
 * ShadingType 2 with a stitching function, 7.10.4, of linear interpolations, 7.10.3, one
 * per pair of stops), so a continuous colour scale stays a vector gradient. The shading
 * runs over the gradient vector in the shape's bounding box (gradientUnits
 * objectBoundingBox, the default) or in user space (userSpaceOnUse).
 */
import type { SvgNode } from './svg-tree.ts';
import { num } from './svg-geometry.ts';
import { parseColour, properties } from './svg-paint.ts';

/** Colour stops of a gradient: offset in [0, 1] (increasing) and r, g, b. */
export function gradientStops(g: SvgNode): { offset: number; rgb: [number, number, number] }[] {
  const out: { offset: number; rgb: [number, number, number] }[] = [];
  for (const c of g.children) {
    if (typeof c === 'string' || c.tag !== 'stop') continue;
    const p = properties(c);
    const raw = (p.offset ?? '0').trim();
    let offset = raw.endsWith('%') ? Number.parseFloat(raw) / 100 : Number.parseFloat(raw);
    offset = Math.min(1, Math.max(Number.isFinite(offset) ? offset : 0, out.length ? out[out.length - 1].offset : 0));
    out.push({ offset, rgb: parseColour(p['stop-color'] ?? 'black')?.rgb ?? [0, 0, 0] });
  }
  return out;
}

/** The shading dictionary of a linear gradient, or null when it has fewer than one stop. */
export function axialShading(g: SvgNode): string | null {
  const stops = gradientStops(g);
  if (!stops.length) return null;
  const c = (v: [number, number, number]) => `[${v.map(num).join(' ')}]`;
  const a = (k: string, d: string) => {
    const v = (g.attrs[k] ?? d).trim();
    return v.endsWith('%') ? Number.parseFloat(v) / 100 : Number.parseFloat(v);
  };
  const coords = [a('x1', '0'), a('y1', '0'), a('x2', '1'), a('y2', '0')].map(num).join(' ');
  const pairs = stops.length === 1 ? [[stops[0], stops[0]]] : stops.slice(1).map((s, i) => [stops[i], s]);
  const fns = pairs.map(([s0, s1]) => `<< /FunctionType 2 /Domain [0 1] /C0 ${c(s0.rgb)} /C1 ${c(s1.rgb)} /N 1 >>`);
  const bounds = pairs.slice(0, -1).map(([, s1]) => num(s1.offset));
  const lo = stops[0].offset, hi = Math.max(stops[stops.length - 1].offset, lo + 1e-6);
  const fn = fns.length === 1 ? fns[0]
    : `<< /FunctionType 3 /Domain [${num(lo)} ${num(hi)}] /Functions [${fns.join(' ')}] /Bounds [${bounds.join(' ')}] /Encode [${pairs.map(() => '0 1').join(' ')}] >>`;
  return `<< /ShadingType 2 /ColorSpace /DeviceRGB /Coords [${coords}] /Domain [${num(lo)} ${num(hi)}] /Function ${fn} /Extend [true true] >>`;
}

/** Whether the gradient's coordinates are fractions of the shape's bounding box. */
export function onBoundingBox(g: SvgNode): boolean {
  return (g.attrs.gradientUnits ?? 'objectBoundingBox') !== 'userSpaceOnUse';
}

/** The bounding box [x, y, width, height] of a shape, for rects, circles and ellipses; null for others. */
export function shapeBox(n: SvgNode): [number, number, number, number] | null {
  const a = (k: string) => Number.parseFloat(n.attrs[k] ?? '0') || 0;
  if (n.tag === 'rect') return [a('x'), a('y'), a('width'), a('height')];
  if (n.tag === 'circle') return [a('cx') - a('r'), a('cy') - a('r'), 2 * a('r'), 2 * a('r')];
  if (n.tag === 'ellipse') return [a('cx') - a('rx'), a('cy') - a('ry'), 2 * a('rx'), 2 * a('ry')];
  return null;
}
