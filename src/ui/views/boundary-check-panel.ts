/**
 * <boundary-check-panel>: the phase atlas's "check this boundary". The user picks a line
 * across a mean-field boundary on the map (two clicks, or the arrow keys and Enter twice,
 * or the ends typed in), chooses cluster sizes, points, sweeps and the QMC temperature;
 * the QMC line scan runs on the scan workers (controllers/boundary-check.ts) with progress
 * and cancel. The Binder crossings of consecutive sizes are the finite-size transition
 * points; the panel reports them beside the mean-field boundary on the same line (read from
 * the map's grid), draws the Binder curves, and hands the atlas an overlay (the line and a
 * marker with its error bar per crossing) through the `check-overlay` event. Picking is
 * asked of the atlas with `check-pick` ({ step: 1 } first end, 0 stop); the atlas routes
 * the map's plot-select to the check while it picks.
 */
import { LitElement, html, css, nothing } from 'lit';
import type { AppState, ModelInputs } from '../state/app-state.ts';
import type { EngineClient } from '../engine/engine-client.ts';
import type { MapGrid } from '../controllers/map-scan.ts';
import { BoundaryCheckController, type BoundaryCheckResult } from '../controllers/boundary-check.ts';
import { type CheckLine, checkLine, labelChanges, lineToMap, parseCheckEnds } from '../model/boundary-check-line.ts';
import { checkCommand, checkRequest } from '../model/boundary-check-request.ts';
import type { QmcScanRequest } from '../../../workers/protocol.ts';
import type { CheckOverlay } from '../figures/boundary-check-overlay.ts';
import { binderFigure } from '../figures/boundary-check-figure.ts';
import { phaseKey } from '../figures/phase-map-figure.ts';
import { AXIS_LABELS, AXIS_SYMBOLS } from '../model/axis-labels.ts';
import { sharedStyles } from '../app/shared-styles.ts';
import type { Table } from '../export/table.ts';
import '../app/figure-panel.ts';
import type { RenderedFigure } from '../app/figure-panel.ts';
import '../app/data-export.ts';

type AtlasSection = AppState['atlas'];
const fmt = (v: number, d = 4) => Number(v.toPrecision(d)).toString();

/** The scan's runs as an export table (one row a run, as the CLI's qmc-scan CSV holds them). */
function checkTable(r: BoundaryCheckResult): Table {
  const est = (e: { value: number; error: number } | null | undefined) => (e ? [e.value, e.error] : [null, null]);
  return {
    columns: ['index', 'size', r.request.axis.name, 'binder', 'binder_error', 'orderParameter', 'orderParameter_error', 'density', 'density_error', 'alpha', 'alpha_error', 'phase', 'error'],
    rows: [...r.points].sort((a, b) => a.index - b.index).map((p) => [
      p.index, p.size, p.value, ...est(p.result?.binder), ...est(p.result?.orderParameter), ...est(p.result?.density), ...est(p.result?.alpha),
      p.result?.phase ?? null, p.error ?? null,
    ]),
  };
}

export class BoundaryCheckPanel extends LitElement {
  static override properties = {
    section: { attribute: false }, inputs: { attribute: false }, engine: { attribute: false }, grid: { attribute: false },
    picking: { type: Number }, width: { type: Number }, gridCount: { type: Number },
  };
  declare section: AtlasSection;
  declare inputs: ModelInputs;
  declare engine: EngineClient;
  /** The map's grid (axes, and the mean-field states along the line). */
  declare grid: MapGrid | null;
  /** 0: not picking; 1, 2: waiting for that end. */
  declare picking: number;
  declare width: number;
  /** Points of the map computed so far (a new count redraws the mean-field boundary). */
  declare gridCount: number;
  private check = new BoundaryCheckController(this, () => this.engine);
  private line: CheckLine | null = null;
  private req: QmcScanRequest | null = null;
  private problem: string | null = null;
  private overlayKey = '';

  constructor() {
    super();
    this.grid = null;
    this.picking = 0;
    this.width = 560;
    this.gridCount = 0;
  }

  static override styles = [sharedStyles, css`
    :host { display: block; margin-top: 10px; }
    fieldset { border: 1px solid var(--line); border-radius: 6px; padding: 6px 10px 8px; }
    .row { display: flex; flex-wrap: wrap; gap: 8px 14px; align-items: flex-end; }
    .row label { display: block; font-size: 13px; }
    .row input { width: 80px; }
    .row input.ends { width: 230px; }
    progress { width: 180px; height: 12px; }
    .verdict { font-size: 14px; margin: 6px 0; }
  `];

  private patch(p: Partial<AtlasSection>) {
    this.dispatchEvent(new CustomEvent('section-change', { detail: { section: 'atlas', patch: p }, bubbles: true, composed: true }));
  }

  private pick(step: number) {
    this.dispatchEvent(new CustomEvent('check-pick', { detail: { step }, bubbles: true, composed: true }));
  }

  override willUpdate() {
    this.line = null;
    this.req = null;
    this.problem = null;
    const g = this.grid;
    const ends = parseCheckEnds(this.section.check);
    if (!ends && this.check.status === 'pending') this.check.cancel(); // a new line is being picked
    if (!g || !ends) return;
    try {
      this.line = checkLine(ends, { name: g.plan.x.name, span: g.plan.x.stop - g.plan.x.start }, { name: g.plan.y.name, span: g.plan.y.stop - g.plan.y.start });
      this.req = checkRequest(this.inputs, this.line, this.section);
    } catch (e) {
      this.problem = (e as Error).message;
      return;
    }
    this.check.run(this.req);
  }

  /** The result of the current request (not an older line's). */
  private current(): BoundaryCheckResult | undefined {
    const v = this.check.value;
    return v && this.req && this.check.task.valueKey === JSON.stringify(this.req) ? v : undefined;
  }

  /** True when the mean-field boundary was read from the map's coarse preview (the line's row not computed yet). */
  private mfPreview = false;

  /** Mean-field phase changes along the line, from the map's grid. */
  private meanFieldBoundaries(l: CheckLine): { at: number; halfWidth: number; from: string; to: string }[] {
    const g = this.grid;
    if (!g) return [];
    const along = l.along === 'x' ? g.plan.x : g.plan.y, other = l.along === 'x' ? g.plan.y : g.plan.x;
    const j = other.values.reduce((b, v, i) => (Math.abs(v - l.fixed) < Math.abs(other.values[b] - l.fixed) ? i : b), 0);
    const idx = along.values.map((v, i) => [v, i] as const).filter(([v]) => v >= l.start - 1e-12 && v <= l.stop + 1e-12);
    // what the map shows: a point's own state, or the nearest finished row's while the map fills
    const labels = idx.map(([, i]) => phaseKey(l.along === 'x' ? g.paint(i, j) : g.paint(j, i)) ?? undefined);
    this.mfPreview = idx.some(([, i]) => !(l.along === 'x' ? g.own(i, j) : g.own(j, i)));
    return labelChanges(idx.map(([v]) => v), labels);
  }

  override updated() {
    const r = this.current();
    const partial = this.section.check.split(';').map((p) => p.split(',').map(Number)).filter((p) => p.length === 2 && p.every(Number.isFinite)) as [number, number][];
    const l = this.line;
    const overlay: CheckOverlay = {
      ends: partial.slice(0, 2),
      line: l ? [lineToMap(l, l.start), lineToMap(l, l.stop)] : null,
      markers: l && r ? r.crossings.map((c) => {
        const [x, y] = lineToMap(l, c.at);
        return { x, y, ex: l.along === 'x' ? c.error : 0, ey: l.along === 'y' ? c.error : 0, label: `QMC L ${c.sizes.join('/')}: ${AXIS_SYMBOLS[l.name]} = ${fmt(c.at)} \u00b1 ${fmt(c.error, 2)}` };
      }) : [],
    };
    const key = JSON.stringify(overlay);
    if (key !== this.overlayKey) {
      this.overlayKey = key;
      this.dispatchEvent(new CustomEvent('check-overlay', { detail: { overlay }, bubbles: true, composed: true }));
    }
    this.dataset.status = this.check.status;
    this.dataset.crossings = r ? String(r.crossings.length) : '';
  }

  private field(key: keyof AtlasSection, label: string, cls = '') {
    return html`<div><label for="bc-${key}">${label}</label>
      <input id="bc-${key}" class=${cls} name="atlas-${key}" .value=${this.section[key]} @input=${(e: Event) => this.patch({ [key]: (e.target as HTMLInputElement).value })}></div>`;
  }

  override render() {
    const s = this.section, l = this.line, r = this.current();
    const running = this.check.status === 'pending';
    const ground = s.cground === '1';
    const pickText = this.picking === 1 ? 'Click the first end on the map (or focus the map, move with the arrow keys and press Enter).'
      : this.picking === 2 ? 'Now the second end, across the boundary.' : '';
    const sym = l ? AXIS_SYMBOLS[l.name] : '';
    const mf = l ? this.meanFieldBoundaries(l) : [];
    return html`<fieldset class="boundary-check"><legend>Check this boundary with quantum Monte Carlo</legend>
      <p class="muted" style="margin:2px 0 6px">Mean field overstates order (most of all in 1D). Pick a line across a boundary of the map:
        QMC runs along it on periodic clusters of several sizes, and where their Binder cumulants cross is the transition, with its error bar.</p>
      <div class="row">
        <div><button class="pick" aria-pressed=${this.picking ? 'true' : 'false'} @click=${() => this.pick(this.picking ? 0 : 1)}>${this.picking ? 'Stop picking' : 'Pick a line on the map'}</button></div>
        ${this.field('check', 'Line ends (x,y;x,y in map units)', 'ends')}
        ${this.field('sizes', 'Cluster sizes L')}
        ${this.field('cpoints', 'Points on the line')}
        ${this.field('csweeps', 'Sweeps per run')}
        ${l && (l.name === 'temperature' || l.fixedName === 'temperature') ? html`<div class="muted">QMC temperature: from the line</div>` : html`
          ${ground ? nothing : this.field('ctemp', 'QMC temperature T (g)')}
          <div><label><input type="checkbox" name="atlas-cground" .checked=${ground}
            @change=${(e: Event) => this.patch({ cground: (e.target as HTMLInputElement).checked ? '1' : '' })}> ground state</label></div>`}
      </div>
      <div aria-live="polite" class="pick-hint muted">${pickText}</div>
      ${this.problem ? html`<p class="err" role="alert">${this.problem}</p>` : nothing}
      ${this.check.error ? html`<p class="err" role="alert">${this.check.error}</p>` : nothing}
      ${l ? html`<p class="muted line-text">QMC scans ${AXIS_LABELS[l.name]} from ${fmt(l.start)} to ${fmt(l.stop)} at ${AXIS_SYMBOLS[l.fixedName]} = ${fmt(l.fixed)}
        (the line is snapped onto the axis it runs along most).</p>` : nothing}
      <div class="row" aria-live="polite">
        ${running || this.check.total ? html`<progress max="1" .value=${this.check.total ? this.check.done / this.check.total : 0} aria-label="QMC check progress"></progress>
          <span class="check-progress">${this.check.done} / ${this.check.total} runs</span>` : nothing}
        ${running ? html`<button class="cancel-check" @click=${() => this.check.cancel()}>Cancel</button>` : nothing}
        ${!running && this.check.cancelled && this.req ? html`<span class="muted">cancelled</span> <button class="rerun-check" @click=${() => this.check.rerun()}>Run the check again</button>` : nothing}
      </div>
      ${r && l ? this.verdict(r, l, sym, mf) : nothing}
      ${l && (r || this.check.points.length) ? html`<figure-panel class="binder" .figure=${this.binder(r, l, mf)}></figure-panel>` : nothing}
      ${r && l && this.req ? html`<data-export class="check-export" .table=${() => checkTable(r)} .json=${() => r} .rows=${r.points.length}
        name="boundary-check" .command=${checkCommand(this.inputs, l, this.req)}></data-export>` : nothing}
    </fieldset>`;
  }

  /** The Binder figure of the check (laid out again at a print width on export; its height is its own). */
  private binder(r: BoundaryCheckResult | undefined, l: CheckLine, mf: { at: number }[]): RenderedFigure {
    const make = (width: number) => binderFigure({
      points: r ? r.points : this.check.points, crossings: r ? r.crossings : [], meanField: mf.map((b) => b.at),
      xLabel: AXIS_LABELS[l.name], width,
    });
    return { ...make(Math.max(340, Math.min(this.width, 760))), layout: (W: number) => make(Math.max(300, W)) };
  }

  private verdict(r: BoundaryCheckResult, l: CheckLine, sym: string, mf: { at: number; halfWidth: number; from: string; to: string }[]) {
    const failed = r.points.filter((p) => p.error !== undefined).length;
    const grid = this.mfPreview ? 'the map\u2019s coarse preview: the map is still running' : 'map grid';
    const mfText = mf.length ? `mean field: ${mf.map((b) => `${sym} = ${fmt(b.at)} \u00b1 ${fmt(b.halfWidth, 2)} (${b.from} \u2192 ${b.to}, ${grid})`).join('; ')}`
      : `mean field: no boundary on this line (${grid})`;
    if (!r.crossings.length) {
      return html`<p class="verdict no-crossing" role="status"><strong>No Binder crossing on this line:</strong> QMC finds no transition between
        ${sym} = ${fmt(l.start)} and ${fmt(l.stop)} for these sizes (the curves do not cross; ${mfText}). Widen the line, or add sweeps if the curves are noisy.
        ${failed ? html`<span class="err">${failed} runs failed (see the export's error column).</span>` : nothing}</p>`;
    }
    // the shift from the crossing of the two largest sizes, when it is unique
    const top = r.crossings.filter((c) => c.sizes.join() === r.crossings[r.crossings.length - 1].sizes.join());
    const best = top.length === 1 ? top[0] : null;
    const shift = best && mf.length ? mf.map((b) => best.at - b.at).reduce((a, b) => (Math.abs(b) < Math.abs(a) ? b : a)) : null;
    return html`<p class="verdict" role="status"><strong>QMC transition:</strong>
      ${r.crossings.map((c) => html`<span class="crossing">${sym} = ${fmt(c.at)} \u00b1 ${fmt(c.error, 2)} (L ${c.sizes.join('/')})</span> `)};
      ${mfText}.${shift !== null && best ? html` Mean field is off by <strong class="shift">${fmt(shift, 3)} \u00b1 ${fmt(best.error, 2)}</strong> in ${sym} (QMC of the largest sizes minus mean field).` : nothing}
      ${r.crossings.length > new Set(r.crossings.map((c) => c.sizes.join())).size ? html` Several sign changes for one pair of sizes: the crossing is ambiguous (noise near a shallow crossing); add sweeps.` : nothing}
      ${failed ? html`<span class="err">${failed} runs failed (see the export's error column).</span>` : nothing}</p>`;
  }
}
customElements.define('boundary-check-panel', BoundaryCheckPanel);

declare global { interface HTMLElementTagNameMap { 'boundary-check-panel': BoundaryCheckPanel } }
