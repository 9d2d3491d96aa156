/**
 * The vector PDF of a figure. Structure against ISO 32000-1:2008 (Document management,
 * Portable document format, Part 1: PDF 1.7): the file starts with the header %PDF-
 * (7.5.2), ends with %%EOF (7.5.5), `startxref` gives the byte offset of the `xref`
 * keyword, the cross-reference table has one 20-byte entry per object whose offset points
 * at that object's `n 0 obj` line (7.5.4), and a stream's /Length is its byte count
 * (7.3.8.1). Text is text: text objects shown with Tj in standard fonts (9.4.3, 9.6.2.2),
 * no image anywhere. Glyph widths: Adobe's Helvetica metrics (AFM, Helvetica.afm: A 667,
 * B 667, C 722, space 278 per 1000 em; from memory, and the same numbers the package reads).
 */
import { describe, it, expect } from 'vitest';
import { renderFigure } from '../../../src/ui/plot/figure.ts';
import type { Mark } from '../../../src/ui/plot/frame.ts';
import { svgToPdf } from '../../../src/ui/export/svg-to-pdf.ts';
import { parseTransform } from '../../../src/ui/export/svg-geometry.ts';
import { parseColour } from '../../../src/ui/export/svg-paint.ts';

const mark = (render: () => string, clip = false): Mark => ({ clip, render } as unknown as Mark);

/** A 400 x 300 px figure with text (Greek, minus, centred, rotated, bold, haloed), a texture, a clip and opacity. */
function figure(): string {
  return renderFigure({
    id: 't', width: 400, height: 300, x: [0, 1], y: [0, 1], title: 'Test \u03bc figure', marks: [
      mark(() => '<rect x="0" y="0" width="400" height="300" fill="url(#t-hatch)"/><rect x="10" y="10" width="50" height="50" fill="#ff0000" fill-opacity="0.5"/>', true),
      mark(() => '<path d="M10 10L100 100" stroke="hsl(120 100% 25%)" stroke-dasharray="4 2"/>'
        + '<text x="100" y="50" text-anchor="middle" font-size="10">ABC</text>'
        + '<text x="20" y="200" transform="rotate(-90 20 200)">chemical potential \u03bc \u2212 \u0394</text>'
        + '<text x="5" y="5" font-weight="bold" stroke="#ffffff" stroke-width="3" paint-order="stroke">1/2</text>'
        + '<rect x="300" y="10" width="60" height="10" fill="url(#t-grad)"/>'),
    ],
    defs: () => '<pattern id="t-hatch" width="7" height="7" patternUnits="userSpaceOnUse" patternTransform="rotate(45)"><line x1="0" y1="0" x2="0" y2="7" stroke="#000" stroke-opacity="0.5"/></pattern>'
      + '<linearGradient id="t-grad" x1="0" x2="1" y1="0" y2="0"><stop offset="0%" stop-color="#000"/><stop offset="50%" stop-color="#fff"/><stop offset="100%" stop-color="#f00"/></linearGradient>',
  } as Parameters<typeof renderFigure>[0]).svg;
}

/** The objects of a PDF by number, read through its cross-reference table, checking each offset. */
function readXref(pdf: string): Map<number, string> {
  const start = Number(/startxref\n(\d+)\n%%EOF\n?$/.exec(pdf)?.[1]);
  expect(pdf.slice(start, start + 4)).toBe('xref');
  const head = /^xref\n0 (\d+)\n/.exec(pdf.slice(start));
  expect(head).not.toBeNull();
  const n = Number(head![1]);
  const size = Number(/\/Size (\d+)/.exec(pdf.slice(pdf.lastIndexOf('trailer')))?.[1]);
  expect(size).toBe(n);
  const table = pdf.slice(start + head![0].length, start + head![0].length + 20 * n);
  const objects = new Map<number, string>();
  for (let i = 0; i < n; i++) {
    const entry = table.slice(20 * i, 20 * i + 20);
    expect(entry).toMatch(/^\d{10} \d{5} [nf](\r\n| \n| \r)$/);
    if (i === 0) { expect(entry.slice(11, 16)).toBe('65535'); continue; }
    const offset = Number(entry.slice(0, 10));
    expect(pdf.slice(offset).startsWith(`${i} 0 obj`)).toBe(true);
    const end = pdf.indexOf('endobj', offset);
    objects.set(i, pdf.slice(offset, end));
  }
  return objects;
}

describe('vector PDF of a figure', () => {
  const pdf = svgToPdf(figure());

  it('is a well-formed PDF: header, cross-reference table of byte offsets, trailer, %%EOF', () => {
    expect(pdf.startsWith('%PDF-1.')).toBe(true);
    expect(pdf.trimEnd().endsWith('%%EOF')).toBe(true);
    const objects = readXref(pdf);
    expect(objects.size).toBeGreaterThanOrEqual(9);
    // every stream's /Length is the count of bytes between "stream\n" and "\nendstream"
    for (const body of objects.values()) {
      const len = /\/Length (\d+)/.exec(body);
      if (!len) continue;
      const data = body.slice(body.indexOf('stream\n') + 7, body.indexOf('\nendstream'));
      expect(data.length).toBe(Number(len[1]));
    }
    // the file is ASCII, so characters are bytes and the offsets above are byte offsets
    expect(new TextEncoder().encode(pdf).length).toBe(pdf.length);
  });

  it('keeps the text as text in standard fonts, with Greek from Symbol, and no image', () => {
    expect(pdf).not.toMatch(/\/Image|\/XObject|\/DCTDecode/);
    expect(pdf).toMatch(/\/BaseFont \/Helvetica /);
    expect(pdf).toMatch(/\/BaseFont \/Helvetica-Bold /);
    expect(pdf).toMatch(/\/BaseFont \/Symbol >>/);
    // "chemical potential mu - Delta": Latin in Helvetica (F1), mu, minus, Delta as Symbol's m, -, D
    expect(pdf).toContain('/F1 12 Tf (chemical potential ) Tj /F3 12 Tf (m) Tj /F1 12 Tf ( ) Tj /F3 12 Tf (-) Tj /F1 12 Tf ( ) Tj /F3 12 Tf (D) Tj');
    // the bold label with its halo: stroked first (mode 1), then filled (mode 0)
    expect(pdf).toMatch(/BT 1 Tr 1 0 0 -1 5 5 Tm \/F2 12 Tf \(1\/2\) Tj ET\nBT 0 Tr 1 0 0 -1 5 5 Tm \/F2 12 Tf \(1\/2\) Tj ET/);
  });

  it('centres text by the Helvetica widths', () => {
    // "ABC" at 10 pt is (667 + 667 + 722) / 1000 * 10 = 20.56 wide: centred on x = 100 it starts at 89.72
    expect(pdf).toContain('BT 0 Tr 1 0 0 -1 89.72 50 Tm /F1 10 Tf (ABC) Tj ET');
  });

  it('maps the figure onto the page: 0.75 pt per px, y flipped, or a printed width', () => {
    expect(pdf).toContain('/MediaBox [0 0 300 225]');
    expect(pdf).toContain('0.75 0 0 -0.75 0 225 cm');
    const single = svgToPdf(figure(), { widthPt: 3.4 * 72 });
    // 3.4 in = 244.8 pt; the height keeps the 4:3 aspect: 183.6 pt
    expect(single).toContain('/MediaBox [0 0 244.8 183.6]');
  });

  it('draws the texture as a tiling pattern, opacity as graphics state, the plot area as a clip', () => {
    expect(pdf).toMatch(/\/Type \/Pattern \/PatternType 1 \/PaintType 1 \/TilingType 1 \/BBox \[0 0 7 7\] \/XStep 7 \/YStep 7/);
    expect(pdf).toMatch(/\/Pattern cs \/P0 scn/);
    expect(pdf).toMatch(/\/GS\d+ << \/Type \/ExtGState \/ca 0\.5 \/CA 1 >>/);
    expect(pdf).toMatch(/ re\nW n/);
    expect(pdf).toContain('[4 2] 0 d');
    // hsl(120 100% 25%) is rgb(0, 127.5, 0) (CSS Color 3, 4.2.4)
    expect(pdf).toContain('0 0.5 0 RG');
  });
});

describe('a linear gradient as an axial shading', () => {
  it('shades the shape\'s box from the first stop to the last (ISO 32000-1, 8.7.4.5.3; SVG 1.1, 13.2.2)', () => {
    const pdf = svgToPdf(figure());
    // two linear pieces (black to white, white to red) stitched at the middle stop
    expect(pdf).toContain('/ShadingType 2 /ColorSpace /DeviceRGB /Coords [0 0 1 0] /Domain [0 1] /Function << /FunctionType 3 /Domain [0 1] '
      + '/Functions [<< /FunctionType 2 /Domain [0 1] /C0 [0 0 0] /C1 [1 1 1] /N 1 >> << /FunctionType 2 /Domain [0 1] /C0 [1 1 1] /C1 [1 0 0] /N 1 >>] /Bounds [0.5]');
    // clipped to the rect, the unit square mapped onto its box (x 300, y 10, 60 x 10)
    expect(pdf).toContain('300 10 60 10 re\nW n\n60 0 0 10 300 10 cm\n/Sh0 sh');
    expect(pdf).toMatch(/\/Shading << \/Sh0 \d+ 0 R >>/);
  });
});

describe('SVG pieces the PDF writer reads', () => {
  it('rotate(a cx cy) turns about (cx, cy), clockwise on screen for a > 0 (SVG 1.1, 7.6)', () => {
    const [m] = parseTransform('rotate(90 10 20)');
    const at = (x: number, y: number) => [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]].map((v) => Math.round(v * 1e12) / 1e12);
    expect(at(10, 20)).toEqual([10, 20]);
    expect(at(11, 20)).toEqual([10, 21]);
  });

  it('reads CSS colours', () => {
    expect(parseColour('#1d2430')?.rgb.map((v) => Math.round(v * 255))).toEqual([0x1d, 0x24, 0x30]);
    expect(parseColour('#fff')?.rgb).toEqual([1, 1, 1]);
    expect(parseColour('none')).toBeNull();
    expect(parseColour('rgba(255, 0, 0, 0.25)')).toEqual({ rgb: [1, 0, 0], alpha: 0.25 });
  });
});
