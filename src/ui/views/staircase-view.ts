/**
 * <staircase-view>: a mu scan at the model's other parameters for the model's interaction
 * range and a second range to compare, rho(mu) and the emitter filling, the plateaus found
 * from the solutions (src/core/meanfield/plateaus.ts) shaded and labelled, and a table of
 * plateau widths for both ranges.
 */
import { HostWidthController } from '../controllers/host-width.ts';
import { LitElement, html, css, nothing } from 'lit';
import type { AppState, ModelInputs } from '../state/app-state.ts';
import type { ParsedModel } from '../model/model-inputs.ts';
import { cliRange, parseRange, rangeNote, rangeValues } from '../../core/scan/axes.ts';
import type { Plateau } from '../../core/meanfield/plateaus.ts';
import type { SolveResult } from '../../core/meanfield/ground-state.ts';
import type { ModelParams } from '../../core/model.ts';
import type { EngineClient } from '../engine/engine-client.ts';
import { StaircaseScansController, type StaircaseSeries as ScanSeries } from '../controllers/staircase-scans.ts';
import { SCAN_SEED } from '../controllers/map-scan.ts';
import { EDGE_TOL } from '../../../workers/scans/staircase-scan.ts';
import { plateauLabel, staircaseFigure, type StaircaseSeries } from '../figures/staircase-figure.ts';
import { sharedStyles } from '../app/shared-styles.ts';
import { cliLine, modelFlags } from '../export/cli-command.ts';
import type { Table } from '../export/table.ts';
import { inPageWords } from '../model/page-words.ts';
import { phaseWords } from '../model/phase-words.ts';
import { term, termStyles } from '../app/term-tip.ts';
import { type LabPoint, labPointText } from '../state/lab-point.ts';
import { PinsController, pinLabel, pins } from '../state/pinned-results.ts';
import { withLabPoint } from '../figures/lab-point-mark.ts';
import { withPinnedStaircase } from '../figures/pinned-overlay.ts';
import { relayable } from '../export/print-layout.ts';
import type { RenderedFigure } from '../app/figure-panel.ts';
import '../app/figure-panel.ts';
import '../app/data-export.ts';
import '../app/limits-note.ts';

type StaircaseSection = AppState['staircase'];
const fmt = (v: number) => Number(v.toPrecision(5)).toString();

/** Choices for the second range: a cut of the model's interaction. */
const COMPARE: [string, string][] = [['', 'none'], ['1', 'r \u2264 1 (nearest only)'], ['2', 'r \u2264 2'], ['3', 'r \u2264 3'], ['inf', 'full sum']];

/** Human label of a range cut. */
function rangeLabel(r: number | undefined): string {
  return r === undefined || !Number.isFinite(r) ? 'full range' : `r \u2264 ${r}`;
}

export class StaircaseView extends LitElement {
  static override properties = {
    section: { attribute: false }, model: { attribute: false }, inputs: { attribute: false }, engine: { attribute: false },
    hover: { state: true }, labPoint: { attribute: false },
  };
  /** The lab's operating point: its mu and tolerance marked on the staircase (null: none). */
  declare labPoint: LabPoint | null;
  /** Pinned results (a pinned staircase is drawn over this one). */
  private pinned = new PinsController(this);
  private overlayState = { lab: '', pinned: '' };
  /** The mu under the pointer (or the keyboard cursor) on the staircase, null when away. */
  declare hover: number | null;
  declare section: StaircaseSection;
  declare model: ParsedModel;
  declare inputs: ModelInputs;
  declare engine: EngineClient;
  private scans = new StaircaseScansController(this, () => this.engine);
  private rangeError: string | null = null;
  private size = new HostWidthController(this);

  constructor() {
    super();
    this.hover = null;
  }

  static override styles = [sharedStyles, termStyles, css`
    :host { display: block; }
    .controls { display: flex; gap: 16px; flex-wrap: wrap; align-items: flex-end; margin-bottom: 8px; }
    .controls label { display: block; font-size: 13px; }
    .tables { display: flex; gap: 24px; flex-wrap: wrap; margin-top: 8px; align-items: flex-start; }
    .readout { font-family: 'DejaVu Sans Mono', monospace; font-size: 13px; min-height: 20px; padding: 3px 6px; background: #f1f3f6; border-radius: 4px; }
  `];


  private patch(p: Partial<StaircaseSection>) {
    this.dispatchEvent(new CustomEvent('section-change', { detail: { section: 'staircase', patch: p }, bubbles: true, composed: true }));
  }

  /** The two interaction ranges: the model's own, and the comparison cut (if any, and different). */
  private ranges(p: ModelParams): (number | undefined)[] {
    const own = p.interaction.rmax;
    const c = this.section.compare.trim();
    if (c === '') return [own];
    const other = c === 'inf' ? undefined : Number(c);
    return (other ?? Infinity) === (own ?? Infinity) ? [own] : [own, other];
  }

  override willUpdate() {
    const p = this.model.params;
    this.rangeError = null;
    let r;
    try { r = parseRange(this.section.mu, 'mu'); } catch (e) { this.rangeError = inPageWords((e as Error).message); return; }
    if (!p || !this.engine) return;
    if (r.count < 2 || r.count > 5000) { this.rangeError = 'the \u03bc scan needs from 2 to 5000 points (xN)'; return; }
    if (!(Math.max(r.start, r.stop) < p.delta)) { this.rangeError = `\u03bc must stay below the detuning ${p.delta} (the photon number is unbounded above it)`; return; }
    const series: ScanSeries[] = this.ranges(p).map((rmax) => {
      const { rho: _rho, mu: _mu, ...base } = p;
      const interaction = { ...p.interaction };
      if (rmax === undefined) delete interaction.rmax; else interaction.rmax = rmax;
      return { label: rangeLabel(rmax), plan: { base: { ...base, interaction }, x: { name: 'mu', ...r, values: rangeValues(r) }, seed: SCAN_SEED } };
    });
    this.scans.run(JSON.stringify(series), series);
  }

  override updated() {
    this.dataset.scan = this.scans.status;
    this.dataset.lab = this.overlayState.lab;
    this.dataset.pinned = this.overlayState.pinned;
    this.dataset.refined = this.scans.status === 'done' && this.scans.value?.series.every((s) => s.result.refined) ? 'yes' : 'no';
  }

  private plateauTable(s: StaircaseSeries[]): Table {
    const rows: Table['rows'] = [];
    for (const x of s) for (const p of x.plateaus) rows.push([x.label, p.fraction, p.muLow, p.muHigh, p.width, p.points, p.openLow || p.openHigh ? 'open' : '']);
    return { columns: ['range', 'fraction', 'muLow', 'muHigh', 'width', 'points', 'edge'], rows };
  }

  /** The out-of-date mark of the figure: empty while it shows the latest inputs. */
  private staleText(): string {
    if (!this.scans.value) return '';
    if (!this.model.params || this.rangeError) return 'out of date: an entry is invalid';
    if (!this.scans.stale) return '';
    return this.scans.status === 'running' ? 'out of date, recomputing…' : 'out of date (stopped)';
  }

  override render() {
    const v = this.scans.value;
    const refined = v?.series.every((s) => s.result.refined) ?? false;
    const solved = (s: { result: { points: { state?: SolveResult }[] } }) => s.result.points.map((x) => x.state).filter((x): x is SolveResult => !!x);
    const series: StaircaseSeries[] = v ? v.series.map((s) => {
      const states = solved(s);
      return {
        label: s.label, mu: states.map((x) => x.mu), rho: states.map((x) => x.excitationDensity),
        filling: states.map((x) => x.emitterDensity), plateaus: s.result.plateaus,
      };
    }) : [];
    const w = Math.max(300, Math.min(this.size.width, 1100));
    const delta = v?.series[0].plan.base.delta ?? 0;
    const fig = series.length ? relayable((width, height) => staircaseFigure(series[0], series[1] ?? null, delta, width, height),
      w, Math.round(Math.min(480, Math.max(300, w * 0.5)))) : null;
    const pts: Table = {
      columns: ['range', 'mu', 'phase', 'fraction', 'excitationDensity', 'emitterDensity', 'photonDensity', 'cellSize', 'error'],
      rows: v ? v.series.flatMap((s) => s.result.points.map((pt) => {
        const x = pt.state;
        return [s.label, s.plan.x.values[pt.ix], x?.phase, x?.fraction ?? '', x?.excitationDensity, x?.emitterDensity, x?.photonDensity, x?.cellSize, pt.error ?? ''];
      })) : [],
    };
    const p = this.model.params;
    const cmds = p ? this.ranges(p).map((rmax) => cliLine('staircase', [...modelFlags({ ...this.inputs, range: rmax === undefined ? '' : String(rmax) }, ['mu']), `--mu=${cliRange(this.section.mu)}`, '--json'])) : [];
    return html`
      <div class="controls">
        <div><label for="st-mu">\u03bc scan start..stop xN points (g)</label>
          <input id="st-mu" name="staircase-mu" .value=${this.section.mu} aria-invalid=${this.rangeError ? 'true' : 'false'} aria-describedby="st-mu-msg st-mu-note"
            @input=${(e: Event) => this.patch({ mu: (e.target as HTMLInputElement).value })}>
          <div class="err" id="st-mu-msg" role=${this.rangeError ? 'alert' : nothing}>${this.rangeError ?? ''}</div>
          <div class="muted range-note" id="st-mu-note">${this.rangeError ? '' : rangeNote(this.section.mu, true) ?? ''}</div></div>
        <div><label for="st-cmp">Compare with the ${term('range cut')}</label>
          <select id="st-cmp" name="staircase-compare" @change=${(e: Event) => this.patch({ compare: (e.target as HTMLSelectElement).value })}>
            ${COMPARE.map(([k, t]) => html`<option value=${k} ?selected=${k === this.section.compare}>${t}</option>`)}</select></div>
        <div aria-live="polite"><progress max=${this.scans.total || 1} .value=${this.scans.done} aria-label="Staircase progress"></progress>
          ${this.scans.status === 'running' ? html`${this.scans.done} / ${this.scans.total} <button @click=${() => this.scans.cancel()}>Cancel</button>` : nothing}
          ${this.scans.status === 'cancelled' || this.scans.status === 'error' ? html`<button class="resume" @click=${() => this.scans.resume()}>Run again</button>` : nothing}
          ${this.scans.error ? html`<span class="err" role="alert">${inPageWords(this.scans.error)}</span>` : nothing}
          ${!p ? html`<span class="err">The model has an invalid entry: showing the last good staircase.</span>` : nothing}
          ${series.length ? html`<button class="pin-staircase" ?disabled=${this.scans.status !== 'done' || !!this.staleText()}
            title="Keep these curves drawn (dashed) over the staircases of other parameters" @click=${() => this.pinStaircase(series)}>Pin this staircase</button>` : nothing}
          ${pins.staircase ? html`<button class="unpin-staircase" @click=${() => pins.pinStaircase(null)}>Unpin</button>` : nothing}</div>
      </div>
      <figure-panel class="staircase" interactive .figure=${fig ? this.overlays(fig, series) : null} stale=${this.staleText()} .cursor=${this.cursorAt(v?.series[0], fig)}
        .keyStep=${series.length ? [(series[0].mu.at(-1)! - series[0].mu[0]) / Math.max(1, series[0].mu.length - 1), 0.05] : null}
        @plot-hover=${(e: CustomEvent) => { this.hover = e.detail.x; }} @plot-leave=${() => { this.hover = null; }}></figure-panel>
      <div class="readout" aria-live="polite" aria-label="Readout under the cursor">${v ? this.readout(v.series) : 'Waiting for the first points\u2026'}</div>
      <p class="muted">Plateaus are read from the solutions: no condensate and every sublattice empty or full, the fraction from the
        cell's integer occupation confirmed by continued fractions with denominators \u2264 Mmax.
        ${refined ? html`Edges bisected to ${EDGE_TOL} g.` : html`Edges at the grid (within one step ${series.length ? `= ${fmt((series[0].mu.at(-1)! - series[0].mu[0]) / Math.max(1, series[0].mu.length - 1))} g` : ''});
          ${this.scans.status === 'running' ? 'scanning and bisecting\u2026' : ''}`}</p>
      <div class="tables">${series.map((s) => this.widths(s))}</div>
      <limits-note lattice=${p?.lattice ?? this.inputs.lattice} temperature=${p?.T ?? 0}></limits-note>
      ${v ? html`<data-export class="points-export" .table=${pts} .json=${{ series: series.map((s, i) => ({ label: s.label, plateaus: s.plateaus, points: v.series[i].result.points.map((pt) => pt.state ?? { error: pt.error }) })) }}
        name="staircase" .command=${cmds.join('\n')}></data-export>
        <h3>Plateau table</h3>
        <data-export class="plateau-export" .table=${this.plateauTable(series)} .json=${this.plateauTable(series)} name="plateaus"></data-export>` : nothing}
    `;
  }

  /** The solved point of a scan nearest to mu, or null. */
  private nearest(s: { result: { points: { state?: SolveResult }[] } }, mu: number): SolveResult | null {
    let best: SolveResult | null = null;
    for (const p of s.result.points) if (p.state && (!best || Math.abs(p.state.mu - mu) < Math.abs(best.mu - mu))) best = p.state;
    return best;
  }

  /** The cursor dot on the first series' rho curve at the hovered mu. */
  /** The pinned staircase and the lab point (its mu band, the marker on rho(mu) of the first range) over the figure. */
  private overlays(fig: RenderedFigure, series: StaircaseSeries[]): RenderedFigure {
    let out = fig, slot = 0;
    this.overlayState = { lab: '', pinned: '' };
    if (pins.staircase) {
      const r = withPinnedStaircase(out, pins.staircase);
      out = r.fig; slot = r.rows;
      this.overlayState.pinned = 'drawn';
    }
    const lab = this.labPoint;
    if (lab) {
      const rho = interpolate(series[0].mu, series[0].rho, lab.mu.value);
      out = withLabPoint(out, { x: lab.mu, y: rho === null ? null : { value: rho, sigma: 0 }, band: true, text: labPointText(lab) }, slot);
      this.overlayState.lab = rho === null ? 'band' : 'marker';
    }
    return out;
  }

  /** Pin the model's own curve (not the comparison cut), named by the model's entries (mu is the scan's). */
  private pinStaircase(series: StaircaseSeries[]) {
    const s = series[0];
    pins.pinStaircase({ label: pinLabel(this.inputs, ['mu']), series: [{ label: s.label, mu: [...s.mu], rho: [...s.rho], filling: [...s.filling] }] });
  }

  private cursorAt(s: { result: { points: { state?: SolveResult }[] } } | undefined, fig: unknown): [number, number] | null {
    if (this.hover === null || !s || !fig) return null;
    const x = this.nearest(s, this.hover);
    return x ? [x.mu, x.excitationDensity] : null;
  }

  /** mu, rho, <n>, the phase and the plateau under the pointer, for each range. */
  private readout(list: { label: string; result: { points: { state?: SolveResult }[]; plateaus: Plateau[] } }[]) {
    if (this.hover === null) return html`<span class="muted">Move the pointer over the staircase (or focus it and use the arrow keys).</span>`;
    const maxCell = this.model.params?.maxCell ?? 12;
    return html`${list.map((s, i) => {
      const x = this.nearest(s, this.hover!);
      if (!x) return nothing;
      const on = s.result.plateaus.find((p) => x.mu >= p.muLow && x.mu <= p.muHigh);
      return html`${i ? html`<br>` : nothing}<span class="readout-line">${list.length > 1 ? `${s.label}: ` : ''}\u03bc = ${fmt(x.mu)}, \u03c1 = ${fmt(x.excitationDensity)},
        \u27e8n\u27e9 = ${fmt(x.emitterDensity)}: <strong>${phaseWords(x, maxCell)}</strong>${on
          ? html`, on the plateau <strong class="readout-plateau">${plateauLabel(on.fraction)}</strong> (\u03bc ${fmt(on.muLow)} to ${fmt(on.muHigh)})` : ', between plateaus'}</span>`;
    })}`;
  }

  private widths(s: StaircaseSeries) {
    const list: Plateau[] = [...s.plateaus].sort((a, b) => a.muLow - b.muLow);
    return html`<table class="plateaus" aria-label="Plateau widths, ${s.label}">
      <caption><strong>${s.label}</strong>: ${list.length} plateaus, in order of \u03bc</caption>
      <thead><tr><th class="l">fraction</th><th>\u03bc low (g)</th><th>\u03bc high (g)</th><th>width (g)</th></tr></thead>
      <tbody>${list.map((p) => html`<tr><td class="l">${plateauLabel(p.fraction)}</td><td>${p.openLow ? '\u2264 ' : ''}${fmt(p.muLow)}</td>
        <td>${p.openHigh ? '\u2265 ' : ''}${fmt(p.muHigh)}</td><td>${fmt(p.width)}</td></tr>`)}</tbody></table>`;
  }
}
customElements.define('staircase-view', StaircaseView);

declare global { interface HTMLElementTagNameMap { 'staircase-view': StaircaseView } }

/** y at x on the polyline (xs ascending), or null outside it. */
function interpolate(xs: number[], ys: number[], x: number): number | null {
  if (!xs.length || x < xs[0] || x > xs[xs.length - 1]) return null;
  let i = 1;
  while (i < xs.length - 1 && xs[i] < x) i++;
  const x0 = xs[i - 1], x1 = xs[i] ?? x0;
  return x1 === x0 ? ys[i - 1] : ys[i - 1] + ((ys[i] - ys[i - 1]) * (x - x0)) / (x1 - x0);
}
