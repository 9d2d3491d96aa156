/**
 * PNG exports at a print size. Pixel width = printed width in inches x dpi (the meaning
 * of dots per inch); one column is 3.4 in and two 7.0 in (common practice, no source).
 * The resolution travels in the pHYs chunk (PNG, W3C Recommendation, 2nd ed. 2003,
 * 11.3.5.3: pixels per unit x and y, unit 1 = metre; 1 in = 0.0254 m), placed before
 * IDAT (5.6), each chunk with its CRC-32 (5.5), checked here with Node's own zlib.crc32.
 */
import { describe, it, expect } from 'vitest';
import { crc32 as zlibCrc32, deflateSync } from 'node:zlib';
import { crc32, readPngSize, withDpi, pixelsPerMetre } from '../../../src/ui/export/png-density.ts';
import { bodyTextPoints, pngPixels, pngProblem } from '../../../src/ui/export/figure-size.ts';

/** A minimal valid greyscale PNG of w x h pixels built here (IHDR, IDAT of zlib data, IEND). */
function tinyPng(w: number, h: number): Uint8Array {
  const chunk = (type: string, data: Uint8Array) => {
    const out = Buffer.alloc(12 + data.length);
    out.writeUInt32BE(data.length, 0);
    out.write(type, 4, 'latin1');
    Buffer.from(data).copy(out, 8);
    out.writeUInt32BE(zlibCrc32(out.subarray(4, 8 + data.length)), 8 + data.length);
    return out;
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(w, 0); ihdr.writeUInt32BE(h, 4); ihdr[8] = 8; ihdr[9] = 0;
  const raw = Buffer.alloc(h * (w + 1), 0x80); // mid grey; each row starts with filter type 0
  for (let y = 0; y < h; y++) raw[y * (w + 1)] = 0;
  return new Uint8Array(Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk('IHDR', ihdr), chunk('IDAT', deflateSync(raw)), chunk('IEND', new Uint8Array())]));
}

/** The chunks of a PNG: type and whether its CRC (by zlib) matches. */
function chunks(png: Uint8Array): { type: string; crcOk: boolean }[] {
  const b = Buffer.from(png);
  const out: { type: string; crcOk: boolean }[] = [];
  for (let at = 8; at < b.length; at += 12 + b.readUInt32BE(at)) {
    const len = b.readUInt32BE(at);
    out.push({ type: b.toString('latin1', at + 4, at + 8), crcOk: zlibCrc32(b.subarray(at + 4, at + 8 + len)) === b.readUInt32BE(at + 8 + len) });
  }
  return out;
}

describe('PNG print size', () => {
  it('a single-column figure at 300 dpi is 3.4 x 300 = 1020 px wide; double at 600 dpi 4200 px', () => {
    expect(pngPixels({ preset: 'single', inches: 0, dpi: 300 }, 800, 500)).toEqual({ width: 1020, height: 638 }); // 1020 * 5/8 = 637.5
    expect(pngPixels({ preset: 'double', inches: 0, dpi: 600 }, 800, 400)).toEqual({ width: 4200, height: 2100 });
    expect(pngPixels({ preset: 'custom', inches: 2.5, dpi: 150 }, 640, 480)).toEqual({ width: 375, height: 281 }); // 281.25
    // as on screen: the CSS size at 96 px per inch (CSS Values 3), so 960 px -> 10 in -> 1500 px at 150 dpi
    expect(pngPixels({ preset: 'screen', inches: 0, dpi: 150 }, 960, 480).width).toBe(1500);
  });

  it('says how big the 12 px text prints: 9 pt as on screen (12 x 72/96)', () => {
    expect(bodyTextPoints({ preset: 'screen', inches: 0, dpi: 300 }, 800)).toBeCloseTo(9, 12);
    expect(bodyTextPoints({ preset: 'single', inches: 0, dpi: 300 }, 816)).toBeCloseTo(3.6, 12); // 12 * 3.4 * 72 / 816
    expect(pngProblem({ preset: 'custom', inches: 20, dpi: 600 }, 800, 800)).toMatch(/too big/);
  });

  it('CRC-32 agrees with zlib, and the IEND chunk has its well-known CRC AE 42 60 82', () => {
    const bytes = new TextEncoder().encode('pHYs and some data');
    expect(crc32(bytes)).toBe(zlibCrc32(bytes));
    expect(crc32(new TextEncoder().encode('IEND'))).toBe(0xae426082);
  });

  it('carries the dpi in a pHYs chunk after IHDR, every chunk CRC intact', () => {
    const png = withDpi(tinyPng(1020, 3), 300);
    expect(chunks(png)).toEqual([
      { type: 'IHDR', crcOk: true }, { type: 'pHYs', crcOk: true }, { type: 'IDAT', crcOk: true }, { type: 'IEND', crcOk: true },
    ]);
    // 300 dpi = 300 / 0.0254 = 11811.02 px per metre, stored rounded, unit metre
    expect(readPngSize(png)).toEqual({ width: 1020, height: 3, phys: [11811, 11811, 1] });
    expect(pixelsPerMetre(600)).toBe(23622);
    // a second pass replaces the chunk rather than adding one
    expect(chunks(withDpi(png, 150)).filter((c) => c.type === 'pHYs')).toHaveLength(1);
    expect(readPngSize(withDpi(png, 150)).phys).toEqual([5906, 5906, 1]);
  });
});
