/**
 * Reactive controller of the soft-mode lines drawn over the map: for each ticked
 * interaction range, the lines where the uniform condensate's and the normal state's own
 * solutions first go unstable (src/core/softmode/soft-lines.ts), one pool task per range
 * and phase (a 'soft-lines' scan of the one scan driver, as the CLI's softlines), traced
 * from a seed grid by bisection and continuation over the map's plane.
 * The tasks queue behind the map's own, so the map comes first. A change of model, axes or
 * ticks aborts the old traces; lines already traced for unchanged inputs are kept.
 */
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import type { ModelParams } from '../../core/model.ts';
import type { Axis } from '../../core/scan/axes.ts';
import { PLANE_AXES, type PlaneAxis, type PlaneAxisName } from '../../core/softmode/plane.ts';
import type { SoftLineRequest, SoftLineResult } from '../../core/softmode/soft-lines.ts';
import { type EngineClient, isAbort } from '../engine/engine-client.ts';
import type { SoftLineOverlay } from '../figures/phase-map-figure.ts';

/** The interaction ranges a user can tick, with a line style each (colour + dash). */
export const SOFT_RANGES: { key: string; label: string; stroke: string; dash?: string }[] = [
  { key: 'nn', label: 'nn', stroke: '#0b0b0b', dash: '2 3' },
  { key: 'vdw:1', label: 'vdw r\u22641', stroke: '#b3124e', dash: '7 3' },
  { key: 'vdw:2', label: 'vdw r\u22642', stroke: '#0c6e4f', dash: '4 2 1 2' },
  { key: 'vdw:3', label: 'vdw r\u22643', stroke: '#5a2ca0', dash: '9 2 2 2' },
  // teal, not ink: a solid near-black line is a first-order boundary on the map (figures/boundary-lines.ts)
  { key: 'vdw:inf', label: 'vdw full', stroke: '#0e7490' },
  { key: 'dipolar', label: 'dipolar', stroke: '#8a4b00', dash: '1 2' },
];

/**
 * The range token traced for a ticked box, in the model's own shape: a soft-core model
 * compares soft-core ranges (the vdw boxes stand for the same cuts of V0 / (1 + (r/Rc)^6));
 * nn and dipolar take a power-law strength a soft-core model does not have (null).
 */
export function rangeToken(key: string, shape: string): string | null {
  if (shape !== 'softcore') return key;
  return key.startsWith('vdw') ? key.replace('vdw', 'softcore') : null;
}

/** The box label of a range for the model's shape. */
export function rangeLabel(key: string, shape: string): string {
  const label = SOFT_RANGES.find((r) => r.key === key)?.label ?? key;
  return shape === 'softcore' ? label.replace('vdw', 'soft-core') : label;
}

/** Finished traces of the page by task key, the oldest dropped past SOFT_KEEP. */
const SOFT_RESULTS = new Map<string, SoftLineResult>();
const SOFT_KEEP = 96;

/** Phases whose own solutions are followed. */
export const FOLLOWED = ['condensate', 'normal'] as const;

/** Seed-grid nodes per axis of the trace (lines shorter than a seed spacing are missed). */
export const SOFT_SEED = 10;

export class SoftLinesController implements ReactiveController {
  status = '';
  /** Finished traces by task key (the page's, so they survive a tab switch). */
  private results = SOFT_RESULTS;
  private wanted: { key: string; range: string }[] = [];
  private ctrl: AbortController | null = null;
  private runningKey = '';

  constructor(private readonly host: ReactiveControllerHost, private readonly engine: () => EngineClient) {
    host.addController(this);
  }

  /** The plane axes of the map, or null when an axis is not a soft-line axis (density). */
  static plane(x: Axis, y: Axis): [PlaneAxis, PlaneAxis] | null {
    const ok = (a: Axis) => (PLANE_AXES as readonly string[]).includes(a.name);
    if (!ok(x) || !ok(y)) return null;
    const ax = (a: Axis): PlaneAxis => ({ name: a.name as PlaneAxisName, start: a.start, stop: a.stop, count: SOFT_SEED });
    return [ax(x), ax(y)];
  }

  /** The tasks for these inputs. */
  static tasks(p: ModelParams, x: Axis, y: Axis, ticked: string): SoftLineRequest[] | null {
    const plane = SoftLinesController.plane(x, y);
    if (!plane || p.mu === undefined && x.name !== 'mu' && y.name !== 'mu') return null;
    const base = { lattice: p.lattice, interaction: p.interaction, mu: p.mu ?? 0, delta: p.delta, T: p.T };
    const ranges = ticked.split(',').filter(Boolean).map((k) => rangeToken(k, p.interaction.shape)).filter((t): t is string => t !== null);
    return ranges.flatMap((range) => FOLLOWED.map((phase) => ({ base, x: plane[0], y: plane[1], range, phase, tol: 1e-3 })));
  }

  /** Inputs changed: trace what is ticked and not yet known (aborting older work). */
  update(p: ModelParams, x: Axis, y: Axis, ticked: string): void {
    const tasks = SoftLinesController.tasks(p, x, y, ticked);
    if (!ticked) { this.cancel(); this.wanted = []; this.status = ''; return; }
    if (tasks && tasks.length === 0) {
      this.cancel();
      this.wanted = [];
      this.status = 'the nn and dipolar lines need a power-law interaction; tick a range cut for the soft-core lines';
      return;
    }
    if (!tasks) {
      this.cancel();
      this.wanted = [];
      this.status = 'soft-mode lines need axes among mu, detuning, temperature, rb, v1 and a fixed mu';
      return;
    }
    const keyed = tasks.map((t) => ({ key: JSON.stringify(t), range: t.range, t }));
    this.wanted = keyed.map(({ key, range }) => ({ key, range }));
    const todo = keyed.filter((k) => !this.results.has(k.key));
    const runKey = todo.map((k) => k.key).join('|');
    if (runKey === this.runningKey && this.ctrl) return;
    this.cancel();
    if (!todo.length) { this.status = this.summary(); return; }
    const ctrl = new AbortController();
    this.ctrl = ctrl;
    this.runningKey = runKey;
    this.status = `tracing ${todo.length} soft-mode line sets\u2026`;
    this.engine().scan({ kind: 'soft-lines', lines: todo.map((k) => k.t) }, {
      signal: ctrl.signal,
      onItem: ({ index, result }) => {
        this.results.set(todo[index].key, result);
        if (this.results.size > SOFT_KEEP) this.results.delete(this.results.keys().next().value as string);
        this.host.requestUpdate();
      },
    }).then(() => {
      if (this.ctrl !== ctrl) return;
      this.ctrl = null;
      this.runningKey = '';
      this.status = this.summary();
      this.host.requestUpdate();
    }, (e: unknown) => {
      if (this.ctrl !== ctrl) return;
      this.ctrl = null;
      this.runningKey = '';
      this.status = isAbort(e) ? '' : `soft-mode lines failed: ${e instanceof Error ? e.message : String(e)}`;
      this.host.requestUpdate();
    });
  }

  private summary(): string {
    const n = this.current().reduce((a, r) => a + r.lines.length, 0);
    return `${n} soft-mode line${n === 1 ? '' : 's'}`;
  }

  /** Finished results of the inputs now wanted. */
  current(): SoftLineResult[] {
    return this.wanted.map((w) => this.results.get(w.key)).filter((r): r is SoftLineResult => !!r);
  }

  /** Stop tracing (finished lines stay). */
  cancel(): void {
    if (this.ctrl) { const c = this.ctrl; this.ctrl = null; this.runningKey = ''; c.abort(); }
  }

  hostDisconnected(): void {
    this.cancel();
  }

  /** The lines to draw: one polyline per traced line, broken where the margin jumps. */
  overlays(): SoftLineOverlay[] {
    const out: SoftLineOverlay[] = [];
    for (const r of this.current()) {
      const key = r.range.replace('softcore', 'vdw');
      const found = SOFT_RANGES.find((s) => s.key === key);
      const style = found ? { ...found, label: rangeLabel(key, r.range.startsWith('softcore') ? 'softcore' : '') } : { label: r.range, stroke: '#000000' };
      for (const L of r.lines) {
        const x: number[] = [], y: number[] = [];
        for (const p of L.points) {
          if (p.jump) { x.push(NaN); y.push(NaN); continue; }
          x.push(p.x); y.push(p.y);
        }
        out.push({ label: style.label, stroke: style.stroke, dash: (style as { dash?: string }).dash, x, y });
      }
    }
    return out;
  }
}
