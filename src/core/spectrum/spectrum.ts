/**
 * The fluctuation spectrum of a state along the zone path (DESIGN.md, "Fluctuations and
 * soft modes"): the positive branches omega_n(k) of the linearised time-dependent
 * mean-field equations at each point of zone-path.ts, the photon weight of each branch at
 * k = 0, and whether any eigenvalue has a positive real part (dynamical instability,
 * reported rather than dropped). Frequencies are in the frame of the grand-canonical
 * Hamiltonian K (the rotating frame of the chemical potential), units of g.
 */
import { type Background, type FluctuationInput, background } from './background.ts';
import { modesAt } from './modes.ts';
import { zonePath } from './zone-path.ts';
import { kOut } from './zone.ts';

export interface BranchPoint {
  /** A number in 1D, [kx, ky] in 2D. */
  k: number | [number, number];
  /** Arc length along the path. */
  s: number;
  /** Positive branches, ascending. */
  omega: number[];
  /** Largest growth rate Re lambda at this k (0: stable). */
  growth: number;
}

export interface Spectrum {
  branches: BranchPoint[];
  /** Corners of the path (labels and arc length). */
  ticks: { label: string; s: number }[];
  /** Branches at k = 0 with the photon weight of each (Hopfield coefficient in the normal state). */
  zoneCentre: { omega: number[]; photonWeight: number[] };
  dynamicallyStable: boolean;
  /** Largest growth rate along the path. */
  growth: number;
  /** Distance of the input from stationarity (background.ts). */
  residual: { emitter: number; photon: number };
}

export interface SpectrumOptions {
  /** Points along the path (default 129). */
  points?: number;
}

/** Branches of a state (plain description or a prepared background) along the zone path. */
export function fluctuationSpectrum(state: FluctuationInput | Background, o: SpectrumOptions = {}): Spectrum {
  const bg = 'frame' in state ? state : background(state);
  const path = zonePath(bg.l, o.points ?? 129);
  const branches: BranchPoint[] = [];
  let growth = 0;
  for (let i = 0; i < path.k.length; i++) {
    const m = modesAt(bg, path.k[i]);
    growth = Math.max(growth, m.growth);
    branches.push({ k: kOut(bg.l, path.k[i]), s: path.s[i], omega: m.omega, growth: m.growth });
  }
  const c = modesAt(bg, [0, 0], true);
  return {
    branches, ticks: path.ticks,
    zoneCentre: { omega: c.omega, photonWeight: c.photonWeight ?? c.omega.map(() => 0) },
    dynamicallyStable: growth === 0 && c.growth === 0,
    growth: Math.max(growth, c.growth),
    residual: bg.residual,
  };
}
