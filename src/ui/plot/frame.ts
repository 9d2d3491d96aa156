/**
 * The shared frame every mark draws into: the figure size, the plot area inside the
 * margins, and the x and y scales from data to pixels (y grows upwards on screen).
 */
import { type LinearScale, linearScale } from './scale.ts';

export interface Margins { top: number; right: number; bottom: number; left: number }

export interface Frame {
  readonly width: number;
  readonly height: number;
  readonly margin: Margins;
  /** Plot area in pixels. */
  readonly inner: { x0: number; x1: number; y0: number; y1: number };
  readonly x: LinearScale;
  readonly y: LinearScale;
  /** Id prefix unique to the figure (clip paths, patterns). */
  readonly id: string;
}

/** A mark renders one kind of thing into a frame; `clip` keeps it inside the plot area. */
export interface Mark {
  readonly clip: boolean;
  render(f: Frame): string;
  /**
   * Extra top margin (px) the mark needs in a figure `width` wide with these margins (a key
   * above the plot); the figure grows by it, so the plot area keeps its size.
   */
  reserveTop?(width: number, margin: Margins): number;
}

export interface FrameSpec {
  width: number;
  height: number;
  margin?: Partial<Margins>;
  x: readonly [number, number];
  y: readonly [number, number];
  /** Equal data units per pixel on both axes (lattice drawings); the domains are widened. */
  equalAspect?: boolean;
  id?: string;
}

export const DEFAULT_MARGIN: Margins = { top: 16, right: 16, bottom: 48, left: 60 };

/** Build the frame: plot area = size minus margins, scales onto it. */
export function makeFrame(spec: FrameSpec): Frame {
  const margin = { ...DEFAULT_MARGIN, ...spec.margin };
  const inner = { x0: margin.left, x1: spec.width - margin.right, y0: margin.top, y1: spec.height - margin.bottom };
  let x = spec.x, y = spec.y;
  if (spec.equalAspect) {
    const w = inner.x1 - inner.x0, h = inner.y1 - inner.y0;
    const dx = Math.abs(x[1] - x[0]) || 1, dy = Math.abs(y[1] - y[0]) || 1;
    const perPx = Math.max(dx / w, dy / h);
    const cx = (x[0] + x[1]) / 2, cy = (y[0] + y[1]) / 2;
    x = [cx - (perPx * w) / 2, cx + (perPx * w) / 2];
    y = [cy - (perPx * h) / 2, cy + (perPx * h) / 2];
  }
  return {
    width: spec.width, height: spec.height, margin, inner,
    x: linearScale(x, [inner.x0, inner.x1]),
    y: linearScale(y, [inner.y1, inner.y0]),
    id: spec.id ?? 'fig',
  };
}
