/**
 * A figure's SVG as a one-page vector PDF (ISO 32000-1:2008): every mark a path painted
 * with the SVG's colours (8.5), every label a text object in a standard font (9.4, 9.6;
 * see pdf-fonts.ts), textures as tiling patterns (8.7.3.1), opacities as graphics-state
 * parameters /ca and /CA (8.4.5), the plot area's clip as a clipping path (8.5.4). Nothing
 * is rasterised; a linear gradient becomes an axial shading (8.7.4.5.3, svg-gradient.ts). The page is the figure's viewBox scaled to `widthPt` points (default:
 * 1 CSS px = 0.75 pt, the figure's size on a 96 dpi screen); the SVG's y axis runs down,
 * so the page transform flips it once and text is set with a flipped text matrix.
 */
import { parseSvg, type SvgNode } from './svg-tree.ts';
import { assemblePdf, pdfTextString, streamObject } from './pdf-document.ts';
import { PDF_FONTS, pdfString, runsWidth, textRuns } from './pdf-fonts.ts';
import { IDENTITY, type Matrix, compose, num, parseTransform, shapePath } from './svg-geometry.ts';
import { INITIAL_PAINT, type Paint, cascade, paintServer, parseColour, properties } from './svg-paint.ts';
import { axialShading, gradientStops, onBoundingBox, shapeBox } from './svg-gradient.ts';

/** CSS pixels to PDF points: 72 pt per inch over 96 px per inch. */
export const PT_PER_PX = 72 / 96;

/** Elements that are never painted where they stand. */
const NOT_DRAWN = new Set(['title', 'desc', 'defs', 'clipPath', 'pattern', 'marker', 'style', 'metadata', 'symbol', 'mask', 'linearGradient', 'radialGradient', 'script']);

/** The drawing context: definitions by id, and the resources the content uses. */
class Context {
  readonly defs = new Map<string, SvgNode>();
  readonly alphas = new Map<string, string>();
  readonly patterns = new Map<string, { name: string; obj: number }>();
  readonly shadings = new Map<string, { name: string; obj: number }>();
  readonly objects: string[] = [];
  constructor(readonly root: SvgNode, readonly rootPaint: Paint, readonly page: Matrix, readonly resourcesObj: number, readonly firstFree: number) {
    const walk = (n: SvgNode) => { if (n.attrs.id) this.defs.set(n.attrs.id, n); for (const c of n.children) if (typeof c !== 'string') walk(c); };
    walk(root);
  }

  /** Graphics-state name setting fill and stroke alpha. */
  alpha(fill: number, stroke: number): string {
    const key = `${num(fill)} ${num(stroke)}`;
    let name = this.alphas.get(key);
    if (!name) { name = `GS${this.alphas.size}`; this.alphas.set(key, name); }
    return name;
  }

  /** Shading name of <linearGradient id>, or null when there is no such gradient. */
  shading(id: string): string | null {
    const have = this.shadings.get(id);
    if (have) return have.name;
    const node = this.defs.get(id);
    const dict = node && node.tag === 'linearGradient' ? axialShading(node) : null;
    if (!dict) return null;
    const name = `Sh${this.shadings.size}`;
    const obj = this.firstFree + this.objects.length;
    this.objects.push(dict);
    this.shadings.set(id, { name, obj });
    return name;
  }

  /** Pattern name of <pattern id> used under user-space matrix `ctm`, or null when there is no such pattern. */
  pattern(id: string, ctm: Matrix): string | null {
    const node = this.defs.get(id);
    if (!node || node.tag !== 'pattern') return null;
    const key = `${id}|${ctm.map(num).join(' ')}`;
    const have = this.patterns.get(key);
    if (have) return have.name;
    const name = `P${this.patterns.size}`;
    const obj = this.firstFree + this.objects.length;
    this.objects.push('');
    this.patterns.set(key, { name, obj });
    const a = (k: string) => Number.parseFloat(node.attrs[k] ?? '0') || 0;
    const w = a('width'), h = a('height');
    let m: Matrix = [1, 0, 0, 1, a('x'), a('y')];
    for (const t of parseTransform(node.attrs.patternTransform)) m = compose(m, t);
    m = compose(m, ctm);
    const ops: string[] = [];
    for (const c of node.children) if (typeof c !== 'string') draw(this, c, this.rootPaint, IDENTITY, ops);
    this.objects[obj - this.firstFree] = streamObject(
      `/Type /Pattern /PatternType 1 /PaintType 1 /TilingType 1 /BBox [0 0 ${num(w)} ${num(h)}] /XStep ${num(w)} /YStep ${num(h)} /Matrix [${m.map(num).join(' ')}] /Resources ${this.resourcesObj} 0 R`,
      ops.join('\n'));
    return name;
  }
}

/** Stroke settings of a paint (line width, dash, cap, join). */
function strokeState(p: Paint): string[] {
  const out = [`${num(p.strokeWidth)} w`];
  const dash = p.dash === 'none' ? [] : (p.dash.match(/[\d.]+/g) ?? []).map(Number).filter((v) => v >= 0);
  if (dash.length && dash.some((v) => v > 0)) out.push(`[${(dash.length % 2 ? [...dash, ...dash] : dash).map(num).join(' ')}] 0 d`);
  out.push(`${({ round: 1, square: 2 } as Record<string, number>)[p.cap] ?? 0} J`, `${({ round: 1, bevel: 2 } as Record<string, number>)[p.join] ?? 0} j`);
  return out;
}

/** Set fill (or stroke) paint: a colour, or a pattern; returns its alpha, or null when nothing is painted. */
function setPaint(ctx: Context, value: string, stroke: boolean, ctm: Matrix, ops: string[]): number | null {
  const server = paintServer(value);
  if (server) {
    const name = stroke ? null : ctx.pattern(server.id, ctm);
    if (name) { ops.push(`/Pattern cs /${name} scn`); return 1; }
    return setPaint(ctx, server.fallback, stroke, ctm, ops);
  }
  const c = parseColour(value);
  if (!c) return null;
  ops.push(`${c.rgb.map(num).join(' ')} ${stroke ? 'RG' : 'rg'}`);
  return c.alpha;
}

/**
 * Fill a shape with a linear gradient: clip to the path, map the gradient's space (the
 * shape's box or user space) and paint the shading; true when done. A gradient on a
 * shape whose box is unknown is painted in its middle stop's colour by the caller.
 */
function paintGradient(ctx: Context, p: Paint, n: SvgNode, path: string, ops: string[]): boolean {
  const server = paintServer(p.fill);
  const g = server ? ctx.defs.get(server.id) : undefined;
  if (!g || g.tag !== 'linearGradient') return false;
  const box = onBoundingBox(g) ? shapeBox(n) : null;
  const name = (!onBoundingBox(g) || box) ? ctx.shading(server!.id) : null;
  if (!name) return false;
  const alpha = p.fillOpacity * p.opacity;
  ops.push('q', ...(alpha < 1 ? [`/${ctx.alpha(alpha, 1)} gs`] : []), path, 'W n', ...(box ? [`${num(box[2])} 0 0 ${num(box[3])} ${num(box[0])} ${num(box[1])} cm`] : []), `/${name} sh`, 'Q');
  return true;
}

/** A gradient's middle stop as a colour, for shapes a shading cannot be fitted to. */
function gradientFallback(ctx: Context, fill: string): string {
  const server = paintServer(fill);
  const g = server ? ctx.defs.get(server.id) : undefined;
  if (!g || g.tag !== 'linearGradient') return fill;
  const stops = gradientStops(g);
  const mid = stops[Math.floor(stops.length / 2)];
  return mid ? `rgb(${mid.rgb.map((v) => Math.round(v * 255)).join(',')})` : server!.fallback;
}

/**
 * Set the graphics state of a fill and/or stroke (colours, opacities, line state); null
 * when neither is painted. fa, sa: the fill's and the stroke's own alpha (null: not painted).
 */
function paintState(ctx: Context, p: Paint, ctm: Matrix, ops: string[]): { fa: number | null; sa: number | null } | null {
  const set: string[] = [];
  const fa = setPaint(ctx, p.fill, false, ctm, set);
  const sa = p.strokeWidth > 0 ? setPaint(ctx, p.stroke, true, ctm, set) : null;
  if (fa === null && sa === null) return null;
  const f = (fa ?? 1) * p.fillOpacity * p.opacity, s = (sa ?? 1) * p.strokeOpacity * p.opacity;
  if (f < 1 || s < 1) ops.push(`/${ctx.alpha(f, s)} gs`);
  ops.push(...set);
  if (sa !== null) ops.push(...strokeState(p));
  return { fa, sa };
}

/** Paint a path: fill and/or stroke with their opacities. */
function paintPath(ctx: Context, p: Paint, path: string, ctm: Matrix, ops: string[], n?: SvgNode): void {
  if (!path) return;
  if (n && paintGradient(ctx, p, n, path, ops)) p = { ...p, fill: 'none' };
  else p = { ...p, fill: gradientFallback(ctx, p.fill) };
  const painted = paintState(ctx, p, ctm, ops);
  if (!painted) return;
  const { fa, sa } = painted;
  const even = p.fillRule === 'evenodd' ? '*' : '';
  ops.push(path, fa !== null && sa !== null ? `B${even}` : fa !== null ? `f${even}` : 'S');
}

/** The text of an element with its tspans, whitespace collapsed (xml:space default). */
function textOf(n: SvgNode): string {
  const out = n.children.map((c) => (typeof c === 'string' ? c : c.tag === 'title' ? '' : textOf(c))).join('');
  return out.replace(/\s+/g, ' ');
}

/** A text element as text objects in the standard fonts. */
function paintText(ctx: Context, p: Paint, n: SvgNode, ctm: Matrix, ops: string[]): void {
  const text = textOf(n).trim();
  if (!text) return;
  const runs = textRuns(text, p.fontWeight === 'bold' || Number(p.fontWeight) >= 600);
  const w = runsWidth(runs, p.fontSize);
  let x = Number.parseFloat((n.attrs.x ?? '0').split(/[\s,]+/)[0]) || 0;
  let y = Number.parseFloat((n.attrs.y ?? '0').split(/[\s,]+/)[0]) || 0;
  x += Number.parseFloat(n.attrs.dx ?? '0') || 0;
  y += Number.parseFloat(n.attrs.dy ?? '0') || 0;
  if (p.anchor === 'middle') x -= w / 2; else if (p.anchor === 'end') x -= w;
  if (p.baseline === 'middle' || p.baseline === 'central') y += 0.35 * p.fontSize;
  else if (p.baseline === 'hanging' || p.baseline === 'text-before-edge') y += 0.75 * p.fontSize;
  const painted = paintState(ctx, p, ctm, ops);
  if (!painted) return;
  const { fa, sa } = painted;
  const body = runs.map((r) => `/${r.font} ${num(p.fontSize)} Tf ${pdfString(r.codes)} Tj`).join(' ');
  const at = `1 0 0 -1 ${num(x)} ${num(y)} Tm`;
  // render modes (9.3.6): 0 fill, 1 stroke, 2 fill then stroke; a halo (paint-order: stroke) goes under the fill
  const modes = sa === null ? [0] : fa === null ? [1] : p.paintOrder.startsWith('stroke') ? [1, 0] : [2];
  for (const mode of modes) ops.push(`BT ${mode} Tr ${at} ${body} ET`);
}

/** The clipping path of a `clip-path="url(#id)"`, or '' for none. */
function clipOps(ctx: Context, ref: string | undefined): string {
  const server = ref ? paintServer(ref) : null;
  const node = server ? ctx.defs.get(server.id) : undefined;
  if (!node || node.tag !== 'clipPath') return '';
  const paths = node.children.filter((c): c is SvgNode => typeof c !== 'string').map(shapePath).filter(Boolean);
  return paths.length ? `${paths.join('\n')}\nW n` : '';
}

/** Draw node `n` (and its children) under paint `up` and user-space matrix `ctm`, appending operators to `ops`. */
function draw(ctx: Context, n: SvgNode, up: Paint, ctm: Matrix, ops: string[]): void {
  if (NOT_DRAWN.has(n.tag)) return;
  const props = properties(n);
  if (props.display === 'none') return;
  const p = cascade(up, n);
  const inner: string[] = [];
  let m = ctm;
  for (const t of parseTransform(n.attrs.transform)) { inner.push(`${t.map(num).join(' ')} cm`); m = compose(t, m); }
  const clip = clipOps(ctx, props['clip-path']);
  if (clip) inner.push(clip);
  const drawn = inner.length;
  if (n.tag === 'g' || n.tag === 'svg' || n.tag === 'a' || n.tag === 'switch') {
    for (const c of n.children) if (typeof c !== 'string') draw(ctx, c, p, m, inner);
  } else if (p.visibility !== 'hidden' && p.visibility !== 'collapse') {
    if (n.tag === 'text') paintText(ctx, p, n, m, inner);
    else paintPath(ctx, p, shapePath(n), m, inner, n);
  }
  if (inner.length > drawn) ops.push('q', ...inner, 'Q');
}

export interface PdfOptions {
  /** Page width in points; the height follows the figure's aspect ratio. */
  widthPt?: number;
  /** Document title (the figure's title). */
  title?: string;
}

/** The figure's SVG markup as the bytes (ASCII text) of a one-page PDF file. */
export function svgToPdf(svg: string, opts: PdfOptions = {}): string {
  const root = parseSvg(svg);
  const vb = (root.attrs.viewBox ?? '').split(/[\s,]+/).map(Number);
  const [vx, vy, vw, vh] = vb.length === 4 && vb.every(Number.isFinite) && vb[2] > 0 && vb[3] > 0
    ? vb : [0, 0, Number.parseFloat(root.attrs.width ?? '') || 600, Number.parseFloat(root.attrs.height ?? '') || 400];
  const cssWidth = Number.parseFloat(root.attrs.width ?? '') || vw;
  const W = opts.widthPt ?? cssWidth * PT_PER_PX;
  const k = W / vw, H = vh * k;
  // objects: 1 catalogue, 2 pages, 3 page, 4 content, 5 resources, 6 info, 7-9 fonts, 10.. patterns and shadings
  const page: Matrix = [k, 0, 0, -k, -k * vx, H + k * vy];
  const rootPaint = cascade(INITIAL_PAINT, { tag: 'g', attrs: { ...root.attrs, transform: '' }, children: [] });
  const ctx = new Context(root, rootPaint, page, 5, 10);
  const ops: string[] = [`${page.map(num).join(' ')} cm`];
  draw(ctx, { ...root, attrs: { ...root.attrs, transform: '' } }, INITIAL_PAINT, page, ops);
  const fonts = Object.keys(PDF_FONTS).map((f, i) => `/${f} ${7 + i} 0 R`).join(' ');
  const alphas = [...ctx.alphas].map(([key, name]) => { const [f, s] = key.split(' '); return `/${name} << /Type /ExtGState /ca ${f} /CA ${s} >>`; }).join(' ');
  const patterns = [...ctx.patterns.values()].map((v) => `/${v.name} ${v.obj} 0 R`).join(' ');
  const shadings = [...ctx.shadings.values()].map((v) => `/${v.name} ${v.obj} 0 R`).join(' ');
  const bodies = [
    '<< /Type /Catalog /Pages 2 0 R >>',
    '<< /Type /Pages /Kids [3 0 R] /Count 1 >>',
    `<< /Type /Page /Parent 2 0 R /MediaBox [0 0 ${num(W)} ${num(H)}] /Resources 5 0 R /Contents 4 0 R >>`,
    streamObject('', ops.join('\n')),
    `<< /ProcSet [/PDF /Text] /Font << ${fonts} >> /ExtGState << ${alphas} >> /Pattern << ${patterns} >> /Shading << ${shadings} >> >>`,
    `<< /Title ${pdfTextString(opts.title ?? textOf(root.children.find((c): c is SvgNode => typeof c !== 'string' && c.tag === 'title') ?? { tag: 'title', attrs: {}, children: [] }).trim())} /Producer (blockade-atlas) >>`,
    ...Object.values(PDF_FONTS).map((f) => `<< /Type /Font /Subtype /Type1 /BaseFont /${f}${f === 'Symbol' ? '' : ' /Encoding /WinAnsiEncoding'} >>`),
    ...ctx.objects,
  ];
  return assemblePdf(bodies, 1, 6);
}
