/**
 * Text in a PDF with the standard fonts every PDF reader has (ISO 32000-1:2008, 9.6.2.2:
 * the "standard 14" fonts, used without embedding): Helvetica and Helvetica-Bold in
 * WinAnsiEncoding for Latin text, and Symbol in its built-in encoding for the Greek
 * letters and mathematical signs the figures use (mu, Delta, minus, <= ...). A string is
 * split into runs of one font; widths come from the fonts' Adobe metrics (AFM), carried
 * by @pdf-lib/standard-fonts, so centred and right-aligned labels sit where they do on
 * screen. Characters neither encoding has fall back to a near ASCII form.
 */
import { Encodings, Font } from '@pdf-lib/standard-fonts';

/** Resource names of the three fonts and their base font names. */
export const PDF_FONTS = { F1: 'Helvetica', F2: 'Helvetica-Bold', F3: 'Symbol' } as const;
export type PdfFontName = keyof typeof PDF_FONTS;

/** One run of text in one font: the codes (bytes of the font's encoding) and its advance in 1/1000 em. */
export interface TextRun { font: PdfFontName; codes: number[]; width: number }

/** Code points drawn as another the encodings have (mathematical angle brackets as Symbol's). */
const ALIAS: Record<number, number> = { 0x27e8: 0x2329, 0x27e9: 0x232a, 0x3008: 0x2329, 0x3009: 0x232a, 0x2010: 0x2d, 0x2011: 0x2d };

/** Characters with no glyph in either encoding, written in ASCII. */
function fallback(cp: number): string {
  if (cp >= 0x2080 && cp <= 0x2089) return String(cp - 0x2080); // subscript digits
  if (cp === 0x2070 || (cp >= 0x2074 && cp <= 0x2079)) return `^${cp === 0x2070 ? 0 : cp - 0x2070}`; // superscript digits
  if (cp === 0x0127) return 'h'; // h-bar
  if (cp === 0x00a0 || (cp >= 0x2000 && cp <= 0x200a)) return ' ';
  return '?';
}

const metrics = new Map<PdfFontName, Font>();
function font(name: PdfFontName): Font {
  let f = metrics.get(name);
  if (!f) { f = Font.load(PDF_FONTS[name]); metrics.set(name, f); }
  return f;
}

/** Split `text` into font runs: Helvetica (bold when asked) where WinAnsi has the character, else Symbol. */
export function textRuns(text: string, bold = false): TextRun[] {
  const latin: PdfFontName = bold ? 'F2' : 'F1';
  const runs: TextRun[] = [];
  const put = (f: PdfFontName, code: number, glyph: string) => {
    const w = font(f).getWidthOfGlyph(glyph) ?? 500;
    const last = runs[runs.length - 1];
    if (last && last.font === f) { last.codes.push(code); last.width += w; } else runs.push({ font: f, codes: [code], width: w });
  };
  const one = (cp: number): boolean => {
    const c = ALIAS[cp] ?? cp;
    if (Encodings.WinAnsi.canEncodeUnicodeCodePoint(c)) { const e = Encodings.WinAnsi.encodeUnicodeCodePoint(c); put(latin, e.code, e.name); return true; }
    if (Encodings.Symbol.canEncodeUnicodeCodePoint(c)) { const e = Encodings.Symbol.encodeUnicodeCodePoint(c); put('F3', e.code, e.name); return true; }
    return false;
  };
  for (const ch of text) {
    const cp = ch.codePointAt(0)!;
    if (!one(cp)) for (const a of fallback(cp)) one(a.codePointAt(0)!);
  }
  return runs;
}

/** Advance of the runs at `size` (user units per em). */
export function runsWidth(runs: TextRun[], size: number): number {
  return runs.reduce((w, r) => w + r.width, 0) * size / 1000;
}

/** A PDF literal string of one run's codes (ISO 32000-1, 7.3.4.2): ( ) \ escaped, bytes outside printable ASCII as octal. */
export function pdfString(codes: number[]): string {
  let s = '(';
  for (const c of codes) {
    if (c === 0x28 || c === 0x29 || c === 0x5c) s += '\\' + String.fromCharCode(c);
    else if (c < 0x20 || c > 0x7e) s += '\\' + c.toString(8).padStart(3, '0');
    else s += String.fromCharCode(c);
  }
  return s + ')';
}
