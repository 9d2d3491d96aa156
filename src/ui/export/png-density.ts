/**
 * The print size of a PNG: its pHYs chunk (PNG, W3C Recommendation 2003, 11.3.5.3) holds
 * pixels per unit on x and y and a unit byte (1 = metre), so a 300 dpi figure reads as
 * 300 dpi in a journal's pipeline and in a word processor. A browser's canvas writes no
 * pHYs; it is inserted right after IHDR (the chunk must precede IDAT), with its CRC-32
 * over type and data (PNG 5.5; ISO 3309 polynomial 0xEDB88320, reflected).
 */

/** Inches per metre: 1 in = 0.0254 m exactly (international inch, 1959). */
export const METRES_PER_INCH = 0.0254;

/** Pixels per metre of a resolution in dots per inch, rounded to whole pixels as pHYs stores it. */
export function pixelsPerMetre(dpi: number): number {
  return Math.round(dpi / METRES_PER_INCH);
}

let table: Uint32Array | null = null;
/** CRC-32 of bytes (PNG 5.5, sample code of Annex D). */
export function crc32(bytes: Uint8Array): number {
  if (!table) {
    table = new Uint32Array(256);
    for (let n = 0; n < 256; n++) {
      let c = n;
      for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
      table[n] = c >>> 0;
    }
  }
  let c = 0xffffffff;
  for (const b of bytes) c = table[(c ^ b) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

const SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

/** One chunk: length, type, data, CRC. */
function chunk(type: string, data: Uint8Array): Uint8Array {
  const out = new Uint8Array(12 + data.length);
  const v = new DataView(out.buffer);
  v.setUint32(0, data.length);
  for (let i = 0; i < 4; i++) out[4 + i] = type.charCodeAt(i);
  out.set(data, 8);
  v.setUint32(8 + data.length, crc32(out.subarray(4, 8 + data.length)));
  return out;
}

/** The PNG with a pHYs chunk of `dpi` on both axes (an existing pHYs is replaced). */
export function withDpi(png: Uint8Array, dpi: number): Uint8Array<ArrayBuffer> {
  if (SIGNATURE.some((b, i) => png[i] !== b)) throw new Error('not a PNG file');
  const v = new DataView(png.buffer, png.byteOffset, png.byteLength);
  const parts: Uint8Array[] = [png.subarray(0, 8)];
  const ppm = pixelsPerMetre(dpi);
  const data = new Uint8Array(9);
  new DataView(data.buffer).setUint32(0, ppm);
  new DataView(data.buffer).setUint32(4, ppm);
  data[8] = 1;
  let at = 8;
  while (at + 12 <= png.length) {
    const len = v.getUint32(at);
    const type = String.fromCharCode(...png.subarray(at + 4, at + 8));
    const end = at + 12 + len;
    if (type !== 'pHYs') parts.push(png.subarray(at, end));
    if (type === 'IHDR') parts.push(chunk('pHYs', data));
    at = end;
  }
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let o = 0;
  for (const p of parts) { out.set(p, o); o += p.length; }
  return out;
}

/** Width, height and pixels per metre (x, y, unit) read back from a PNG's IHDR and pHYs. */
export function readPngSize(png: Uint8Array): { width: number; height: number; phys: [number, number, number] | null } {
  const v = new DataView(png.buffer, png.byteOffset, png.byteLength);
  let phys: [number, number, number] | null = null;
  for (let at = 8; at + 12 <= png.length; at += 12 + v.getUint32(at)) {
    if (String.fromCharCode(...png.subarray(at + 4, at + 8)) === 'pHYs') phys = [v.getUint32(at + 8), v.getUint32(at + 12), png[at + 16]];
  }
  return { width: v.getUint32(16), height: v.getUint32(20), phys };
}
