/**
 * A small reader of the SVG markup the figures write (src/ui/plot/svg-markup.ts):
 * elements, attributes in quotes, text, the five XML entities and numeric character
 * references; comments, processing instructions and doctype are skipped. It runs without
 * a document, so the PDF export is the same code in the page and in Node tests.
 */

export interface SvgNode {
  tag: string;
  attrs: Record<string, string>;
  children: (SvgNode | string)[];
}

const ENTITIES: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', apos: "'" };

/** Undo XML escaping: named entities and &#NN; / &#xHH;. */
export function unescapeXml(text: string): string {
  return text.replace(/&(#x[0-9a-fA-F]+|#\d+|\w+);/g, (m, e: string) =>
    e[0] === '#' ? String.fromCodePoint(e[1] === 'x' ? parseInt(e.slice(2), 16) : Number(e.slice(1))) : ENTITIES[e] ?? m);
}

const TOKEN = /<!--[\s\S]*?-->|<\?[\s\S]*?\?>|<!DOCTYPE[^>]*>|<!\[CDATA\[([\s\S]*?)\]\]>|<\/([\w:.-]+)\s*>|<([\w:.-]+)((?:\s+[\w:.-]+\s*=\s*(?:"[^"]*"|'[^']*'))*)\s*(\/?)>|([^<]+)/g;
const ATTR = /([\w:.-]+)\s*=\s*(?:"([^"]*)"|'([^']*)')/g;

/** Parse markup to its root element; throws on markup that does not nest. */
export function parseSvg(markup: string): SvgNode {
  const root: SvgNode = { tag: '#document', attrs: {}, children: [] };
  const stack = [root];
  for (const m of markup.matchAll(TOKEN)) {
    const top = stack[stack.length - 1];
    if (m[1] !== undefined) top.children.push(m[1]);
    else if (m[2] !== undefined) {
      if (top.tag !== m[2]) throw new Error(`SVG: </${m[2]}> closes <${top.tag}>`);
      stack.pop();
    } else if (m[3] !== undefined) {
      const attrs: Record<string, string> = {};
      for (const a of (m[4] ?? '').matchAll(ATTR)) attrs[a[1]] = unescapeXml(a[2] ?? a[3] ?? '');
      const node: SvgNode = { tag: m[3], attrs, children: [] };
      top.children.push(node);
      if (m[5] !== '/') stack.push(node);
    } else if (m[6] !== undefined) top.children.push(unescapeXml(m[6]));
  }
  if (stack.length !== 1) throw new Error(`SVG: <${stack[stack.length - 1].tag}> is not closed`);
  const svg = root.children.find((c): c is SvgNode => typeof c !== 'string' && c.tag === 'svg');
  if (!svg) throw new Error('SVG: no <svg> element');
  return svg;
}
