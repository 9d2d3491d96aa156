/**
 * Building SVG markup as strings, so figures render without a document (in a worker, in
 * Node for tests) and export as standalone files. Coordinates are rounded to 0.01 px:
 * finer than any screen, and it keeps the files small and snapshot-stable.
 */

/** Escape text for use inside SVG/XML content or a double-quoted attribute. */
export function esc(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

/** A pixel coordinate rounded to 0.01 px. */
export function px(v: number): string {
  return String(Math.round(v * 100) / 100);
}

/** Attributes from an object; undefined and null are left out, numbers rounded like px. */
export function attrs(a: Record<string, string | number | undefined | null>): string {
  let out = '';
  for (const [k, v] of Object.entries(a)) {
    if (v === undefined || v === null) continue;
    out += ` ${k}="${typeof v === 'number' ? px(v) : esc(v)}"`;
  }
  return out;
}

/** An element with attributes and optional content. */
export function el(tag: string, a: Record<string, string | number | undefined | null>, content?: string): string {
  return content === undefined ? `<${tag}${attrs(a)}/>` : `<${tag}${attrs(a)}>${content}</${tag}>`;
}
