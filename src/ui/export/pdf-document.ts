/**
 * The file structure of a PDF (ISO 32000-1:2008, 7.5): a header `%PDF-1.4`, the numbered
 * indirect objects `n 0 obj ... endobj`, a cross-reference table giving each object's
 * byte offset (7.5.4: entries of exactly 20 bytes, `oooooooooo ggggg n` and a two-byte
 * line end), the trailer with /Size and /Root, `startxref` with the table's offset, and
 * `%%EOF`. Everything is written as ASCII (binary bytes in strings are octal escapes), so
 * a character offset is a byte offset.
 */

/** A stream object's body: dictionary entries (without << >>) and the data (ASCII). */
export function streamObject(dict: string, data: string): string {
  return `<< ${dict}${dict ? ' ' : ''}/Length ${data.length} >>\nstream\n${data}\nendstream`;
}

/** A PDF text string (7.9.2.2) for the document information: UTF-16BE with its byte-order mark, in hex. */
export function pdfTextString(text: string): string {
  let hex = 'FEFF';
  for (let i = 0; i < text.length; i++) hex += text.charCodeAt(i).toString(16).toUpperCase().padStart(4, '0');
  return `<${hex}>`;
}

/**
 * The file: `bodies[i]` is object i + 1; `root` the catalogue's number, `info` the
 * document information dictionary's (or 0 for none).
 */
export function assemblePdf(bodies: string[], root: number, info = 0): string {
  let out = '%PDF-1.4\n';
  const offsets: number[] = [];
  bodies.forEach((b, i) => {
    offsets.push(out.length);
    out += `${i + 1} 0 obj\n${b}\nendobj\n`;
  });
  if (/[^\x00-\x7f]/.test(out)) throw new Error('PDF: a non-ASCII character in the file body');
  const xref = out.length;
  out += `xref\n0 ${bodies.length + 1}\n0000000000 65535 f\r\n`;
  for (const o of offsets) out += `${String(o).padStart(10, '0')} 00000 n\r\n`;
  out += `trailer\n<< /Size ${bodies.length + 1} /Root ${root} 0 R${info ? ` /Info ${info} 0 R` : ''} >>\nstartxref\n${xref}\n%%EOF\n`;
  return out;
}
