/**
 * Pinned results for comparing parameter sets: the phase map's boundaries and the
 * staircase's curves kept as plain data when the user pins them, so that after the model
 * changes the new figure can draw the pinned one over itself. One pin a kind, held for the
 * page's life (not in the URL: a pin is a snapshot of computed results, not an input), and
 * shared by every view element the page creates. Views follow it through PinsController.
 */
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import type { AxisName } from '../../core/scan/axes.ts';
import type { ModelInputs } from './app-state.ts';

export interface PinnedGrid { nx: number; ny: number; x: [number, number]; y: [number, number] }

/** A pinned map: its axes, its phase categories by cell, and the boundary lines the scan located (null: none yet). */
export interface PinnedMap {
  xName: AxisName;
  yName: AxisName;
  grid: PinnedGrid;
  /** Phase category of cell (ix, iy) at index iy * nx + ix (null: not computed). */
  keys: (string | null)[];
  boundaries: { points: number[][]; firstOrder: boolean }[] | null;
  /** The pinned model's parameters in words (those not on the axes). */
  label: string;
}

export interface PinnedStaircase {
  label: string;
  series: { label: string; mu: number[]; rho: number[]; filling: number[] }[];
}

const SYMBOL: Partial<Record<string, string>> = {
  rb: 'Rb', v1: 'V\u2081', v2: 'V\u2082', v0: 'V\u2080', rc: 'Rc', detuning: '\u03b4', mu: '\u03bc', density: '\u03c1', temperature: 'T',
  range: 'r max', 'max-cell': 'Mmax',
};

/**
 * The model's entries in words, leaving out those the axes set (and the ones its
 * interaction or pump does not use): "chain, vdw, Rb = 1.5, δ = 3, T = 0, Mmax = 12".
 */
export function pinLabel(m: ModelInputs, onAxes: readonly string[] = []): string {
  const strength: Record<string, string[]> = {
    nn: ['v1', 'v2'], vdw: [m.strength === 'v1' ? 'v1' : 'rb'], dipolar: [m.strength === 'v1' ? 'v1' : 'rb'], softcore: ['v0', 'rc'],
  };
  const keys = [...(strength[m.interaction] ?? []), 'range', 'detuning', m.pump === 'density' ? 'density' : 'mu', 'temperature', 'max-cell'];
  const axisKeys = new Set(onAxes.flatMap((a) => (a === 'rb' || a === 'v1' ? ['rb', 'v1'] : a === 'mu' || a === 'density' ? ['mu', 'density'] : [a])));
  const parts = [m.lattice, m.interaction];
  for (const k of keys) {
    if (axisKeys.has(k)) continue;
    const v = (m[k as keyof ModelInputs] ?? '').trim();
    if (k === 'range' && v === '') continue;
    parts.push(`${SYMBOL[k] ?? k} = ${v}`);
  }
  return parts.join(', ');
}

/** The page's pins, with a change event for the views showing them. */
export class PinStore extends EventTarget {
  map: PinnedMap | null = null;
  staircase: PinnedStaircase | null = null;

  pinMap(p: PinnedMap | null): void { this.map = p; this.dispatchEvent(new Event('change')); }
  pinStaircase(p: PinnedStaircase | null): void { this.staircase = p; this.dispatchEvent(new Event('change')); }
}

/** The page's one pin store. */
export const pins = new PinStore();

/** Re-renders its host whenever a pin is set or removed. */
export class PinsController implements ReactiveController {
  private readonly onChange = () => this.host.requestUpdate();
  constructor(private readonly host: ReactiveControllerHost, readonly store: PinStore = pins) { host.addController(this); }
  hostConnected(): void { this.store.addEventListener('change', this.onChange); }
  hostDisconnected(): void { this.store.removeEventListener('change', this.onChange); }
}
