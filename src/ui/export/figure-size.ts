/**
 * Sizes of exported figures. A journal column sets a figure's printed width: about
 * 3.4 in for one column and 7.0 in for two in the two-column physics journals (common
 * practice, no source: authors' guides give 8.6 cm and 17.8 cm). The height keeps the
 * figure's aspect ratio. A PNG at `dpi` is inches x dpi pixels wide; the PDF page is
 * inches x 72 points wide; "as on screen" keeps the figure's CSS size (96 px per inch).
 */

export type SizePreset = 'screen' | 'single' | 'double' | 'custom';

export interface FigureSize {
  preset: SizePreset;
  /** Printed width in inches for 'custom' (the presets fix their own). */
  inches: number;
  /** PNG resolution in dots per inch. */
  dpi: number;
}

/** Printed widths of the presets, in inches. */
export const PRESET_INCHES: Record<Exclude<SizePreset, 'screen' | 'custom'>, number> = { single: 3.4, double: 7.0 };

/** What each preset is, in the page's words. */
export const PRESET_LABELS: Record<SizePreset, string> = {
  screen: 'as on screen',
  single: 'single column, 3.4 in (8.6 cm) wide',
  double: 'double column, 7.0 in (17.8 cm) wide',
  custom: 'custom width',
};

export const DPI_CHOICES = [150, 300, 600] as const;

/** CSS pixels per inch (CSS Values 3: 1 in = 96 px). */
export const CSS_PX_PER_INCH = 96;

/** Limits of the custom width: a stamp to a poster column. */
export const CUSTOM_INCHES = { min: 1, max: 20 } as const;

export const DEFAULT_SIZE: FigureSize = { preset: 'screen', inches: 5, dpi: 300 };

/** Printed width in inches of a figure `cssWidth` px wide at this size. */
export function printedInches(size: FigureSize, cssWidth: number): number {
  if (size.preset === 'screen') return cssWidth / CSS_PX_PER_INCH;
  if (size.preset === 'custom') return size.inches;
  return PRESET_INCHES[size.preset];
}

/** Pixel size of the PNG: width = inches x dpi, height by the figure's aspect ratio. */
export function pngPixels(size: FigureSize, cssWidth: number, cssHeight: number): { width: number; height: number } {
  const width = Math.round(printedInches(size, cssWidth) * size.dpi);
  return { width, height: Math.round((width * cssHeight) / cssWidth) };
}

/** Size in points of the figure's 12 px body text when printed at this size (1 in = 72 pt). */
export function bodyTextPoints(size: FigureSize, cssWidth: number, bodyPx = 12): number {
  return (bodyPx * printedInches(size, cssWidth) * 72) / cssWidth;
}

/** A problem with the custom width in the page's words, or '' when it is good. */
export function customWidthProblem(text: string): string {
  const v = Number(text.trim());
  if (text.trim() === '' || !Number.isFinite(v)) return 'the width must be a number of inches';
  if (v < CUSTOM_INCHES.min || v > CUSTOM_INCHES.max) return `the width must be between ${CUSTOM_INCHES.min} and ${CUSTOM_INCHES.max} in`;
  return '';
}

/** Largest PNG written, in pixels (a canvas this big needs about 200 MB). */
export const MAX_PNG_PIXELS = 50e6;

/** A problem with the PNG's size in the page's words, or ''. */
export function pngProblem(size: FigureSize, cssWidth: number, cssHeight: number): string {
  const { width, height } = pngPixels(size, cssWidth, cssHeight);
  return width * height > MAX_PNG_PIXELS
    ? `a ${width} \u00d7 ${height} px PNG is too big for the browser: choose a lower resolution or a smaller width`
    : '';
}
