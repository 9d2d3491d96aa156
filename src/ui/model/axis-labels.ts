/**
 * Axis titles with their units for the scan parameters of src/core/scan/axes.ts.
 */
import type { AxisName } from '../../core/scan/axes.ts';

export const AXIS_LABELS: Record<AxisName, string> = {
  mu: 'chemical potential \u03bc (g)',
  density: 'excitation density \u03c1 (per site)',
  detuning: 'detuning \u03b4 (g)',
  temperature: 'temperature T (g)',
  rb: 'blockade radius Rb (a)',
  v1: 'nearest-neighbour V\u2081 (g)',
};

/** Short names for readouts and tables. */
export const AXIS_SYMBOLS: Record<AxisName, string> = {
  mu: '\u03bc', density: '\u03c1', detuning: '\u03b4', temperature: 'T', rb: 'Rb', v1: 'V\u2081',
};
