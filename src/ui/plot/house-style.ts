/**
 * The house style of the atlas's figures, in one place: open axes (a left and a bottom
 * spine, each set a few pixels off the plot area, nothing on the top or right), ticks
 * pointing into that gap by default, axis titles at the far end of their axis (where the
 * values grow), dotted guide lines instead of a grid, the key in a row above the plot,
 * a condensed sans-serif for the text, warm paper behind. Colours are literal sRGB hex
 * (no CSS variables), so the SVG a figure renders is the file it exports.
 *
 * SERIES is the categorical palette of lines and points, chosen here: every pair stays
 * at least 18 CIEDE2000 apart under simulated protanopia, deuteranopia and tritanopia, and
 * each colour has at least 3:1 contrast against PAPER (tests/ui/plot/palette-vision.test.ts).
 */

/** Text, spines and ticks. */
export const INK = '#1f2430';
/** Tick labels and secondary text (7.9:1 on PAPER). */
export const INK_SOFT = '#4a5263';
/** The figure's ground. */
export const PAPER = '#fcfbf7';
/** Dotted guide lines at the ticks of a value axis. */
export const GUIDE = '#b9b2a4';
/** Outlines of light swatches. */
export const SWATCH_EDGE = '#8a8f99';
/** Notes of something left out or clipped. */
export const ALERT_INK = '#7a1f1f';

/** A condensed humanist sans first, then the condensed face every Linux has, then any sans. */
export const FIGURE_FONT = "'IBM Plex Sans Condensed', 'Roboto Condensed', 'Arial Narrow', 'DejaVu Sans Condensed', sans-serif";

/** Lines and points of several series, in the order they are taken: indigo, ochre, teal, garnet, lilac, ink. */
export const SERIES = ['#3a3f9e', '#b57a10', '#2f7f78', '#8e1f2c', '#a07ce6', '#1f2430'] as const;

/** Which way ticks point from a spine: into the gap towards the plot, or away from it. */
export type TickDirection = 'in' | 'out';

/** Spine distance from the plot area (px), tick length (px), the default tick direction. */
export const SPINE_GAP = 6;
export const TICK_LENGTH = 4;
export const TICK_DIRECTION: TickDirection = 'in';
