/**
 * <phase-atlas-view>: the phase map over any two parameters, computed coarse to fine in
 * the scan workers with a progress bar and cancel; the phase (or a density) under the
 * cursor; a click (or Enter) opens the point. Soft-mode lines for the ticked interaction
 * ranges are drawn over the map (soft-mode-lines.ts).
 */
import { HostWidthController } from '../controllers/host-width.ts';
import { LitElement, html, css, nothing } from 'lit';
import { scanBase, type ParsedModel } from '../model/model-inputs.ts';
import type { AppState, ModelInputs } from '../state/app-state.ts';
import { AXIS_NAMES, type AxisName, cliRange, parseAxis, parseRange, rangeNote, type Axis } from '../../core/scan/axes.ts';
import { checkAxes } from '../../core/scan/grid.ts';
import { defaultRange, planProblem, type AxisProblem } from '../model/axis-ranges.ts';
import { phaseWords } from '../model/phase-words.ts';
import { inPageWords } from '../model/page-words.ts';
import { term, termStyles } from '../app/term-tip.ts';
import { parseColourRange } from '../figures/colour-scale.ts';
import { InputError } from '../../core/input-error.ts';
import { MAX_CELL_LIMIT } from '../../core/model.ts';
import { atSearchLimit } from '../../core/meanfield/plateaus.ts';
import type { EngineClient } from '../engine/engine-client.ts';
import { MapScanController, type MapGrid } from '../controllers/map-scan.ts';
import { DragZoomController, type ZoomBox } from '../controllers/drag-zoom.ts';
import { zoomAxis } from '../model/zoom-axes.ts';
import { mapExportJson, mapExportTable } from '../export/map-export.ts';
import { phaseMapFigure, type MapShade } from '../figures/phase-map-figure.ts';
import { AXIS_LABELS, AXIS_SYMBOLS } from '../model/axis-labels.ts';
import { PHASE_NAMES } from '../plot/phase-palette.ts';
import { sharedStyles } from '../app/shared-styles.ts';
import { cliLine, modelFlags } from '../export/cli-command.ts';
import { SoftLinesController, SOFT_RANGES, rangeLabel } from '../controllers/soft-lines.ts';
import '../app/figure-panel.ts';
import type { RenderedFigure } from '../app/figure-panel.ts';
import '../app/data-export.ts';
import '../app/limits-note.ts';
import './point-detail.ts';
import './boundary-check-panel.ts';
import { withBoundaryCheck, type CheckOverlay } from '../figures/boundary-check-overlay.ts';
import { addPick } from '../model/boundary-check-line.ts';
import { type LabPoint, labOnAxis, labPointText } from '../state/lab-point.ts';
import { PinsController, pinLabel, pins } from '../state/pinned-results.ts';
import { phaseKey } from '../figures/phase-map-figure.ts';
import { withLabPoint } from '../figures/lab-point-mark.ts';
import { withPinnedMap } from '../figures/pinned-overlay.ts';
import { relayable } from '../export/print-layout.ts';

type AtlasSection = AppState['atlas'];

const fmt = (v: number) => Number(v.toPrecision(4)).toString();

export class PhaseAtlasView extends LitElement {
  static override properties = {
    section: { attribute: false }, model: { attribute: false }, inputs: { attribute: false }, engine: { attribute: false },
    hover: { state: true }, labPoint: { attribute: false },
  };
  declare section: AtlasSection;
  declare model: ParsedModel;
  declare inputs: ModelInputs;
  declare engine: EngineClient;
  declare hover: [number, number] | null;
  /** The lab's operating point, marked with its tolerance box (null: none). */
  declare labPoint: LabPoint | null;
  /** Pinned results (a pinned map's boundaries are drawn over this one). */
  private pinned = new PinsController(this);
  /** What the overlays drew last: the lab point marker, the pinned boundaries. */
  private overlayState = { lab: '', pinned: '' };
  /** "Check this boundary": which end the map's next select picks (0: none), and its overlay on the map. */
  private checkPick = 0;
  private checkOverlay: CheckOverlay | null = null;
  private scan = new MapScanController(this, () => this.engine);
  /** Drag a box on the map to zoom into it (a new map of that box); Escape or Back returns. */
  private zoomStack: Array<{ x: string; y: string }> = [];
  private zoom = new DragZoomController(this, {
    panel: () => this.renderRoot.querySelector<HTMLElement>('figure-panel.map'),
    frame: () => this.fig?.frame,
    onZoom: (box) => this.zoomTo(box),
    onBack: () => this.zoomBack(false),
  });
  private soft = new SoftLinesController(this, () => this.engine);
  private axisErrors: { x?: string; y?: string } = {};
  private fig: RenderedFigure | null = null;
  private figKey = '';
  private size = new HostWidthController(this);

  constructor() {
    super();
    this.hover = null;
  }

  static override styles = [sharedStyles, termStyles, css`
    :host { display: block; }
    .controls { display: flex; flex-wrap: wrap; gap: 10px 18px; align-items: flex-end; margin-bottom: 8px; }
    .axis { display: flex; flex-direction: column; gap: 2px; }
    .axis .pair { display: flex; gap: 4px; }
    .axis input { width: 140px; }
    fieldset.lines { border: 1px solid var(--line); border-radius: 6px; padding: 2px 8px 4px; margin: 0; }
    fieldset.lines label { margin-right: 8px; font-size: 13px; white-space: nowrap; }
    .status { display: flex; gap: 10px; align-items: center; margin: 4px 0; min-height: 28px; flex-wrap: wrap; }
    progress { width: 220px; height: 14px; }
    .readout { font-family: 'DejaVu Sans Mono', monospace; font-size: 13px; min-height: 20px; padding: 3px 6px; background: #f1f3f6; border-radius: 4px; }
  `];

  private limitKey = '';
  private limitCount = 0;

  /**
   * On a finished map with points at the search limit (their pattern uses the largest cell
   * searched, so a longer period may win there), offer the next larger Mmax.
   */
  private limitOffer(g: MapGrid) {
    if (!g.complete) return nothing;
    const M = g.plan.base.maxCell;
    if (this.limitKey !== g.key) {
      this.limitKey = g.key;
      this.limitCount = g.done().filter((p) => p.state && atSearchLimit(p.state, M)).length;
    }
    const cap = g.plan.base.lattice === 'chain' ? MAX_CELL_LIMIT.chain : MAX_CELL_LIMIT.plane;
    if (this.limitCount === 0 || M >= cap) return nothing;
    const next = Math.min(cap, g.plan.base.lattice === 'chain' ? 2 * M : M + 4);
    return html`<p class="limit-offer">${this.limitCount} point${this.limitCount === 1 ? '' : 's'} (dotted) use the largest pattern searched (Mmax = ${M}):
      <button class="raise-mmax" @click=${() => this.dispatchEvent(new CustomEvent('model-input', { detail: { key: 'max-cell', value: String(next) }, bubbles: true, composed: true }))}>Search up to Mmax = ${next}</button></p>`;
  }

  private patch(p: Partial<AtlasSection>) {
    this.dispatchEvent(new CustomEvent('section-change', { detail: { section: 'atlas', patch: p }, bubbles: true, composed: true }));
  }

  private axesKey = '';
  private axesValue: { x: Axis; y: Axis } | null = null;

  /** The axes as typed (parsed again only when their text changes), or null with the reasons in axisErrors. */
  private axes(): { x: Axis; y: Axis } | null {
    const key = `${this.section.x}|${this.section.y}`;
    if (key !== this.axesKey) {
      this.axesKey = key;
      this.axesValue = this.parseAxes();
    }
    return this.axesValue;
  }

  private parseAxes(): { x: Axis; y: Axis } | null {
    this.axisErrors = {};
    let x: Axis | undefined, y: Axis | undefined;
    try { x = parseAxis(this.section.x, 'x'); } catch (e) { this.axisErrors.x = (e as Error).message; }
    try { y = parseAxis(this.section.y, 'y'); } catch (e) { this.axisErrors.y = (e as Error).message; }
    if (!x || !y) return null;
    try {
      checkAxes(x, y);
      if (x.count * y.count > 250_000) throw new InputError('more than 250 000 points: use the command line (copy as command) for a map this big', 'y');
    } catch (e) { this.axisErrors.y = (e as Error).message; return null; }
    return { x, y };
  }

  private updateStart = 0;
  private lastInputs: readonly unknown[] | null = null;

  /** The plan's first refused point (as the CLI refuses it), shown beside its axis; null while the plan is good. */
  private planError: AxisProblem | null = null;
  /** Key of the latest valid inputs (the map on screen is out of date when it belongs to others). */
  private wantedKey = '';

  override willUpdate() {
    this.updateStart = performance.now();
    const axes = this.axes();
    // a pointer move re-renders with the same inputs: nothing to check, restart or re-key
    // (and a cancelled scan stays cancelled until the inputs change or Resume is pressed)
    const inputs = [JSON.stringify([this.model.params, this.section.x, this.section.y, this.section.lines, this.inputs]), this.engine] as const;
    if (this.lastInputs && inputs.every((v, i) => v === this.lastInputs![i])) return;
    this.lastInputs = inputs;
    this.planError = null;
    if (!axes || !this.model.params || !this.engine) { this.wantedKey = ''; return; } // invalid: the last map stays, marked
    const base = scanBase(this.inputs, [axes.x.name, axes.y.name]);
    if (!base) { this.wantedKey = ''; return; }
    this.planError = planProblem(base, axes.x, axes.y);
    if (this.planError) { this.wantedKey = ''; this.scan.cancel(); this.soft.cancel(); return; }
    const plan = { base, x: axes.x, y: axes.y };
    this.wantedKey = JSON.stringify(plan);
    this.scan.run(plan, this.wantedKey);
    this.soft.update(this.model.params, axes.x, axes.y, this.section.lines);
  }

  /** The out-of-date mark of the map: empty while it shows the latest valid inputs. */
  private staleText(): string {
    const g = this.scan.shown;
    if (!g) return '';
    if (!this.wantedKey) return 'out of date: an entry is invalid';
    if (g.key === this.wantedKey) return '';
    return this.scan.status === 'running' ? 'out of date, recomputing\u2026' : 'out of date (not recomputed)';
  }

  override updated() {
    // rendering is synchronous up to here; layout and paint of the new SVG follow in the same task
    this.scan.reportRender(performance.now() - this.updateStart);
    // the scan's state on the element, for scripts and tests driving the page
    this.dataset.scan = this.scan.status;
    this.dataset.stale = this.staleText() ? 'yes' : 'no';
    this.dataset.cached = String(this.scan.fromCache);
    this.dataset.points = String(this.scan.current?.count ?? 0);
    this.dataset.started = String(this.scan.started);
    this.dataset.cancelled = String(this.scan.cancelled);
    this.dataset.firstMs = this.scan.firstPictureMs === null ? '' : this.scan.firstPictureMs.toFixed(1);
    this.dataset.startMs = this.scan.startedAt.toFixed(1);
    this.dataset.totalMs = this.scan.totalMs === null ? '' : this.scan.totalMs.toFixed(1);
    this.dataset.lab = this.overlayState.lab;
    this.dataset.pinned = this.overlayState.pinned;
  }

  /** Grid cell nearest to data point (x, y). */
  private cellAt(g: MapGrid, x: number, y: number): [number, number] {
    const { x: ax, y: ay } = g.plan;
    const ix = Math.round(((x - ax.start) / (ax.stop - ax.start || 1)) * (ax.count - 1));
    const iy = Math.round(((y - ay.start) / (ay.stop - ay.start || 1)) * (ay.count - 1));
    return [Math.min(ax.count - 1, Math.max(0, ix)), Math.min(ay.count - 1, Math.max(0, iy))];
  }

  private readout(g: MapGrid) {
    if (!this.hover) return html`<span class="muted">Move the pointer over the map (or focus it and use the arrow keys).</span>`;
    const [ix, iy] = this.cellAt(g, this.hover[0], this.hover[1]);
    const s = g.paint(ix, iy);
    const own = g.own(ix, iy);
    const xv = g.plan.x.values[ix], yv = g.plan.y.values[iy];
    const where = `${AXIS_SYMBOLS[g.plan.x.name]} = ${fmt(xv)}, ${AXIS_SYMBOLS[g.plan.y.name]} = ${fmt(yv)}`;
    if (!s) return html`${where}: not computed yet`;
    const maxCell = g.plan.base.maxCell;
    const limit = atSearchLimit(s, maxCell) ? html` <span class="at-limit">(the largest cell searched: may be an artefact of Mmax)</span>` : nothing;
    const c = s.coexistence;
    if (c) {
      // inside a first-order jump at fixed density: two phases in the lever rule's proportions
      const [a, b] = c.phases, [xa, xb] = c.fractions;
      return html`${where}: <strong class="readout-phase coexistence">coexistence</strong> (lever rule) of
        ${phaseWords(a, maxCell)} (\u03c1 = ${fmt(a.excitationDensity)}, share ${fmt(xa)}) and
        ${phaseWords(b, maxCell)} (\u03c1 = ${fmt(b.excitationDensity)}, share ${fmt(xb)}):
        \u03c1 = ${fmt(xa * a.excitationDensity + xb * b.excitationDensity)}${own ? '' : ' (coarse preview)'}`;
    }
    return html`${where}: <strong class="readout-phase">${s.phase === 'supersolid' ? term('supersolid', phaseWords(s, maxCell)) : phaseWords(s, maxCell)}</strong>,
      \u03c1 = ${fmt(s.excitationDensity)}, \u03b1\u00b2 = ${fmt(s.photonDensity)}, M = ${s.cellSize}${limit}${own ? '' : ' (coarse preview)'}`;
  }

  /** The pinned map's boundaries and the lab point drawn over the map (in the exported SVG too). */
  private overlays(fig: RenderedFigure, g: MapGrid): RenderedFigure {
    let out = fig, slot = 0;
    this.overlayState = { lab: '', pinned: '' };
    if (pins.map) {
      const r = withPinnedMap(out, pins.map, { x: g.plan.x.name, y: g.plan.y.name });
      out = r.fig; slot = r.rows;
      this.overlayState.pinned = r.drawn ? 'drawn' : 'other-axes';
    }
    const lab = this.labPoint;
    if (lab) {
      const x = labOnAxis(lab, g.plan.x.name), y = labOnAxis(lab, g.plan.y.name);
      out = withLabPoint(out, { x, y, text: labPointText(lab) }, slot);
      this.overlayState.lab = x && y ? 'box' : x || y ? 'band' : 'off-axes';
    }
    return out;
  }

  /** Pin the map on show: its axes, phase categories and located boundaries, named by the model's other entries. */
  private pinMap(g: MapGrid) {
    const keys: (string | null)[] = new Array(g.nx * g.ny);
    for (let j = 0; j < g.ny; j++) for (let i = 0; i < g.nx; i++) keys[j * g.nx + i] = phaseKey(g.paint(i, j));
    pins.pinMap({
      xName: g.plan.x.name, yName: g.plan.y.name,
      grid: { nx: g.nx, ny: g.ny, x: [g.plan.x.start, g.plan.x.stop], y: [g.plan.y.start, g.plan.y.stop] },
      keys, boundaries: g.boundaries?.map((b) => ({ points: b.points.map((p) => [p[0], p[1]]), firstOrder: b.firstOrder === true })) ?? null,
      label: pinLabel(this.inputs, [g.plan.x.name, g.plan.y.name]),
    });
  }

  private axisControl(which: 'x' | 'y') {
    const text = this.section[which];
    const eq = text.indexOf('=');
    const name = eq >= 0 ? text.slice(0, eq) : 'mu', range = eq >= 0 ? text.slice(eq + 1) : text;
    const raw = this.axisErrors[which] ?? (this.planError?.axis === which ? this.planError.message : undefined);
    const err = raw === undefined ? undefined : inPageWords(raw);
    return html`<div class="axis">
      <label for="ax-${which}-name">${which === 'x' ? 'Horizontal' : 'Vertical'} axis</label>
      <div class="pair">
        <select id="ax-${which}-name" name="axis-${which}" @change=${(e: Event) => this.chooseAxis(which, (e.target as HTMLSelectElement).value as AxisName, range)}>
          ${AXIS_NAMES.map((n) => html`<option value=${n} ?selected=${n === name}>${AXIS_LABELS[n]}</option>`)}
        </select>
        <input id="ax-${which}-range" name="range-${which}" aria-label="${which} range start..stop xN (N points, both ends included)" .value=${range}
          aria-invalid=${err ? 'true' : 'false'} aria-describedby="ax-${which}-msg ax-${which}-note"
          @input=${(e: Event) => this.patch({ [which]: `${name}=${(e.target as HTMLInputElement).value}` })}>
      </div>
      <div class="err" id="ax-${which}-msg" role=${err ? 'alert' : nothing}>${err ?? ''}</div>
      <div class="muted range-note" id="ax-${which}-note">${err ? '' : rangeNote(range, true) ?? ''}</div>
    </div>`;
  }

  /** A new parameter on an axis gets a range of its own, inside the model's domain. */
  private chooseAxis(which: 'x' | 'y', name: AxisName, range: string) {
    let count = which === 'x' ? 64 : 40;
    try { count = parseRange(range, which).count; } catch { /* a fresh count */ }
    const otherText = this.section[which === 'x' ? 'y' : 'x'];
    let other: Axis | null = null;
    try { other = parseAxis(otherText, which === 'x' ? 'y' : 'x'); } catch { /* its own error shows */ }
    this.patch({ [which]: `${name}=${defaultRange(name, this.inputs, count, other)}` });
  }

/** The map of the dragged box: axes snapped to the shown map's grid, refined so its points are reused (zoom-axes.ts). */
  private zoomTo(box: ZoomBox) {
    const g = this.scan.shown;
    if (!g) return;
    const x = zoomAxis(g.plan.x, box.x[0], box.x[1]), y = zoomAxis(g.plan.y, box.y[0], box.y[1]);
    if (!x || !y) return;
    this.zoomStack = [...this.zoomStack, { x: this.section.x, y: this.section.y }];
    this.patch({ x, y, point: '' });
  }

  /** Back one zoom (all the way with full). */
  private zoomBack(full: boolean) {
    const to = full ? this.zoomStack[0] : this.zoomStack[this.zoomStack.length - 1];
    if (!to) return;
    this.zoomStack = full ? [] : this.zoomStack.slice(0, -1);
    this.patch({ x: to.x, y: to.y, point: '' });
  }

  private toggleLine(r: string, on: boolean) {
    const set = new Set(this.section.lines.split(',').filter(Boolean));
    if (on) set.add(r); else set.delete(r);
    this.patch({ lines: SOFT_RANGES.map((x) => x.key).filter((k) => set.has(k)).join(',') });
  }

  override render() {
    const g = this.scan.shown;
    const running = this.scan.status === 'running';
    const ticked = new Set(this.section.lines.split(',').filter(Boolean));
    const sel = this.section.point ? this.section.point.split(',').map(Number) as [number, number] : null;
    const w = Math.max(320, Math.min(this.size.width, 1100));
    const lines = this.soft.overlays();
    // the figure is rebuilt only when what it shows changes (not when the cursor moves:
    // the cursor is drawn over it by <figure-panel>)
    const crange = parseColourRange(this.section.crange ?? '');
    const figKey = g ? [g.key, g.count, g.boundaries?.length ?? -1, this.section.shade, this.section.crange, this.section.clog, lines.length, lines.map((l) => l.x.length).join(','), this.section.point, w].join('|') : '';
    if (g && figKey !== this.figKey) {
      this.figKey = figKey;
      const shade = this.section.shade as MapShade, log = this.section.clog === '1';
      // laid out again at a print width on export (print-layout.ts); the overlays below follow it
      this.fig = relayable((width, height) => phaseMapFigure({
        grid: { nx: g.nx, ny: g.ny, x: [g.plan.x.start, g.plan.x.stop], y: [g.plan.y.start, g.plan.y.stop] },
        stateAt: (i, j) => g.paint(i, j), xLabel: AXIS_LABELS[g.plan.x.name], yLabel: AXIS_LABELS[g.plan.y.name],
        shade, lines, selected: sel, colourRange: crange ?? {}, log, maxCell: g.plan.base.maxCell,
        boundaries: g.boundaries, width, height,
        title: `Phase map over ${AXIS_SYMBOLS[g.plan.x.name]} and ${AXIS_SYMBOLS[g.plan.y.name]}`,
      }), w, Math.round(Math.min(540, Math.max(300, w * 0.5))), 320);
    }
    const base = g && this.fig && this.checkOverlay ? withBoundaryCheck(this.fig, this.checkOverlay) : g ? this.fig : null;
    const fig = g && base ? this.overlays(base, g) : base;
    const cmdAxes = g ? [g.plan.x.name, g.plan.y.name] : [];
    const command = cliLine('map', [...modelFlags(this.inputs, cmdAxes), '--x', cliRange(this.section.x), '--y', cliRange(this.section.y)]);
    const selParams = g && sel ? (() => { const [ix, iy] = this.cellAt(g, sel[0], sel[1]); return { p: g.point(ix, iy), seed: g.seed(ix, iy), state: g.own(ix, iy) }; })() : null;
    return html`
      <div class="controls">
        ${this.axisControl('x')} ${this.axisControl('y')}
        <div class="axis"><label for="shade">Colour by</label>
          <select id="shade" name="shade" @change=${(e: Event) => this.patch({ shade: (e.target as HTMLSelectElement).value })}>
            ${[['phase', 'phase'], ['rho', 'excitation density \u03c1'], ['photon', 'photon density \u03b1\u00b2']].map(([v, t]) =>
              html`<option value=${v} ?selected=${v === this.section.shade}>${t}</option>`)}
          </select></div>
        ${this.section.shade !== 'phase' ? html`<div class="axis"><label for="crange">Colour range lo:hi (empty: automatic)</label>
          <div class="pair"><input id="crange" name="crange" .value=${this.section.crange ?? ''} aria-invalid=${crange ? 'false' : 'true'}
            aria-describedby="crange-msg" @input=${(e: Event) => this.patch({ crange: (e.target as HTMLInputElement).value })}>
          <label><input type="checkbox" name="clog" .checked=${this.section.clog === '1'}
            @change=${(e: Event) => this.patch({ clog: (e.target as HTMLInputElement).checked ? '1' : '' })}> log</label></div>
          <div class="err" id="crange-msg">${crange ? '' : 'write lo:hi with lo < hi (either may be empty)'}</div></div>` : nothing}
        <fieldset class="lines"><legend>Soft-mode lines for interaction range</legend>
          ${SOFT_RANGES.map((r) => html`<label><input type="checkbox" name="line-${r.key}" .checked=${ticked.has(r.key)}
            @change=${(e: Event) => this.toggleLine(r.key, (e.target as HTMLInputElement).checked)}> ${rangeLabel(r.key, this.inputs.interaction)}</label>`)}
          <span class="muted soft-status">${this.soft.status}</span>
        </fieldset>
      </div>
      <div class="status" aria-live="polite">
        <progress max="1" .value=${this.scan.progress} aria-label="Map progress"></progress>
        <span class="progress-text">${this.scan.current ? `${this.scan.current.count} / ${this.scan.current.nx * this.scan.current.ny} points` : ''}
          on ${this.engine?.workers ?? 0} workers${this.scan.status === 'done' && this.scan.totalMs ? ` in ${(this.scan.totalMs / 1000).toFixed(1)} s` : ''}
          ${this.scan.status === 'cancelled' ? ' (cancelled)' : ''}</span>
        ${running ? html`<button class="cancel" @click=${() => this.scan.cancel()}>Cancel</button>` : nothing}
        ${!running && this.scan.status === 'cancelled' && this.scan.current?.key === this.wantedKey ? html`<button class="resume" @click=${() => this.scan.resume()}>Resume</button>` : nothing}
        ${this.scan.error ? html`<span class="err" role="alert">${this.scan.error}</span>` : nothing}
        ${this.scan.failed ? html`<span class="err failed">${this.scan.failed} point${this.scan.failed === 1 ? '' : 's'} could not be solved (blank; the reason is in the export's error column)</span>` : nothing}
        ${!this.model.params ? html`<span class="err stale">The model has an invalid entry: showing the last good map.</span>` : nothing}
        ${g ? html`<button class="pin-map" ?disabled=${!g.complete || !!this.staleText()} title="Keep this map's boundaries drawn (dashed) over the maps of other parameters"
          @click=${() => this.pinMap(g)}>Pin this map</button>` : nothing}
        ${pins.map ? html`<button class="unpin-map" @click=${() => pins.pinMap(null)}>Unpin</button>` : nothing}
        ${this.zoomStack.length ? html`<button class="zoom-back" title="The map before the last zoom (Escape)" @click=${() => this.zoomBack(false)}>Back</button>
          <button class="zoom-full" @click=${() => this.zoomBack(true)}>Full map</button>` : html`<span class="muted zoom-hint">Drag a box on the map to zoom into it.</span>`}
      </div>
      ${g && g.solves !== null ? html`<p class="muted map-notes">${g.solves} of ${g.nx * g.ny} points solved in full${g.notes.length
        ? html`; ${g.notes.map((n) => n.replace(/\s*\(--dense[^)]*\)/g, '')).join('; ')}` : ''}.</p>` : nothing}
      ${g ? this.limitOffer(g) : nothing}
      <figure-panel class="map" interactive .figure=${fig} .cursor=${this.hover} ?busy=${running} stale=${this.staleText()}
        .keyStep=${g ? [(g.plan.x.stop - g.plan.x.start) / Math.max(1, g.nx - 1), (g.plan.y.stop - g.plan.y.start) / Math.max(1, g.ny - 1)] : null}
        @plot-hover=${(e: CustomEvent) => { this.hover = [e.detail.x, e.detail.y]; }}
        @plot-leave=${() => { this.hover = null; }}
        @plot-select=${(e: CustomEvent) => { if (this.checkPick) { this.patch({ check: addPick(this.section.check, e.detail.x, e.detail.y, this.checkPick === 1) }); this.checkPick = this.checkPick === 1 ? 2 : 0; this.requestUpdate(); return; } if (g) { const [ix, iy] = this.cellAt(g, e.detail.x, e.detail.y); this.patch({ point: `${g.plan.x.values[ix]},${g.plan.y.values[iy]}` }); } }}>
      </figure-panel>
      <div class="readout" aria-live="polite" aria-label="Readout under the cursor">${g ? this.readout(g) : 'Waiting for the first points\u2026'}</div>
      ${g ? html`<boundary-check-panel .section=${this.section} .inputs=${this.inputs} .engine=${this.engine} .grid=${g} .gridCount=${g.count} .picking=${this.checkPick} .width=${w}
        @check-pick=${(e: CustomEvent) => { this.checkPick = e.detail.step; this.requestUpdate(); }}
        @check-overlay=${(e: CustomEvent) => { this.checkOverlay = e.detail.overlay; this.requestUpdate(); }}></boundary-check-panel>` : nothing}
      <limits-note lattice=${this.model.params?.lattice ?? this.inputs.lattice} temperature=${this.model.params?.T ?? 0}></limits-note>
      ${g ? html`<data-export class="map-export" .table=${() => mapExportTable(g)} .json=${() => mapExportJson(g)} .rows=${g.count}
        name="phase-map" .command=${command}></data-export>` : nothing}
      ${selParams && sel ? html`<point-detail .params=${selParams.p} .seed=${selParams.seed} .state=${selParams.state ?? null} .engine=${this.engine} .width=${w}
          label="${AXIS_SYMBOLS[g!.plan.x.name]} = ${fmt(sel[0])}, ${AXIS_SYMBOLS[g!.plan.y.name]} = ${fmt(sel[1])}"
          .command=${cliLine('solve', [...modelFlags(this.inputs, cmdAxes), ...axisFlags(g!.plan.x.name, sel[0]), ...axisFlags(g!.plan.y.name, sel[1]), '--seed', String(selParams.seed), '--json'])}
          @point-close=${() => this.patch({ point: '' })}></point-detail>` : nothing}
    `;
  }
}

/** CLI flags that set one axis parameter to a value. */
function axisFlags(name: AxisName, v: number): string[] {
  return [`--${name}`, String(v)];
}

customElements.define('phase-atlas-view', PhaseAtlasView);

declare global { interface HTMLElementTagNameMap { 'phase-atlas-view': PhaseAtlasView } }
