/**
 * A figure's SVG markup as a file: SVG (at its screen size or with a printed width in
 * inches), vector PDF (svg-to-pdf.ts, loaded when first asked for) or PNG drawn through a
 * canvas at inches x dpi pixels, carrying its dpi (png-density.ts).
 */
import { type FigureSize, printedInches, pngPixels } from './figure-size.ts';
import { withDpi } from './png-density.ts';

/** The root <svg> with its width and height replaced (the viewBox keeps the drawing). */
export function resizeSvg(svg: string, width: string, height: string): string {
  return svg.replace(/^<svg\b[^>]*>/, (tag) => tag.replace(/\swidth="[^"]*"/, ` width="${width}"`).replace(/\sheight="[^"]*"/, ` height="${height}"`));
}

/** The SVG document text with an XML prolog; at a print size its width and height are in inches. */
export function svgFile(svg: string, size?: FigureSize, cssWidth?: number, cssHeight?: number): Blob {
  let doc = svg;
  if (size && size.preset !== 'screen' && cssWidth && cssHeight) {
    const w = printedInches(size, cssWidth);
    doc = resizeSvg(svg, `${+w.toFixed(4)}in`, `${+((w * cssHeight) / cssWidth).toFixed(4)}in`);
  }
  return new Blob([`<?xml version="1.0" encoding="UTF-8"?>\n${doc}`], { type: 'image/svg+xml' });
}

/** The figure as a vector PDF whose page is the figure at its printed width (72 pt per inch). */
export async function pdfFile(svg: string, title: string, size: FigureSize, cssWidth: number): Promise<Blob> {
  const { svgToPdf } = await import('./svg-to-pdf.ts');
  return new Blob([svgToPdf(svg, { title, widthPt: printedInches(size, cssWidth) * 72 })], { type: 'application/pdf' });
}

/** Rasterise the SVG markup to a PNG Blob of inches x dpi pixels with its dpi recorded. */
export async function pngFile(svg: string, cssWidth: number, cssHeight: number, size: FigureSize): Promise<Blob> {
  const { width, height } = pngPixels(size, cssWidth, cssHeight);
  // the image's own size is the target size, so the browser draws the vectors at full resolution
  const url = URL.createObjectURL(new Blob([resizeSvg(svg, String(width), String(height))], { type: 'image/svg+xml' }));
  try {
    const img = new Image();
    img.decoding = 'async';
    const loaded = new Promise<void>((resolve, reject) => {
      img.onload = () => resolve();
      img.onerror = () => reject(new Error('the figure could not be rasterised'));
    });
    img.src = url;
    await loaded;
    const canvas = document.createElement('canvas');
    canvas.width = width;
    canvas.height = height;
    const ctx = canvas.getContext('2d');
    if (!ctx) throw new Error('no 2D canvas available');
    ctx.fillStyle = '#ffffff';
    ctx.fillRect(0, 0, width, height);
    ctx.drawImage(img, 0, 0, width, height);
    const blob = await new Promise<Blob>((resolve, reject) =>
      canvas.toBlob((b) => (b ? resolve(b) : reject(new Error('PNG encoding failed'))), 'image/png'));
    return new Blob([withDpi(new Uint8Array(await blob.arrayBuffer()), size.dpi)], { type: 'image/png' });
  } finally {
    URL.revokeObjectURL(url);
  }
}
