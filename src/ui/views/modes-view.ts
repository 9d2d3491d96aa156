/**
 * <modes-view>: the fluctuation spectrum of the model's point: the branches omega_n(k)
 * along the zone path, the stability margin against k, the softest wavevector k* and
 * whether the state is dynamically stable. `cell` restricts the state to supercells of
 * that size (1: follow the uniform state where it is not the ground state).
 */
import { HostWidthController } from '../controllers/host-width.ts';
import { LitElement, html, css, nothing } from 'lit';
import type { AppState, ModelInputs } from '../state/app-state.ts';
import type { ParsedModel } from '../model/model-inputs.ts';
import { parseNumber } from '../model/model-inputs.ts';
import type { StateSpectrum } from '../../core/spectrum/state-spectrum.ts';
import type { EngineClient } from '../engine/engine-client.ts';
import { EngineTask } from '../controllers/engine-task.ts';
import { type BranchRange, branchesFigure, marginFigure } from '../figures/spectrum-figure.ts';
import { kText } from '../model/pi-multiple.ts';
import { type LabPoint, labPointText, modelAtLabPoint } from '../state/lab-point.ts';
import { withLabNote } from '../figures/lab-point-mark.ts';
import type { RenderedFigure } from '../app/figure-panel.ts';
import { relayable } from '../export/print-layout.ts';
import { phaseWords } from '../model/phase-words.ts';
import { inPageWords } from '../model/page-words.ts';
import { term, termStyles } from '../app/term-tip.ts';
import { sharedStyles } from '../app/shared-styles.ts';
import { cliLine, modelFlags } from '../export/cli-command.ts';
import type { Table } from '../export/table.ts';
import { PHASE_NAMES } from '../plot/phase-palette.ts';
import '../app/figure-panel.ts';
import '../app/data-export.ts';
import '../app/limits-note.ts';

type Section = AppState['modes'];

/** Wall time a spectrum may take before it is stopped and the view says so (2D cells of up to 12 sites take ~20 s). */
const MODES_BUDGET_MS = 180_000;
const f = (x: number) => (Math.abs(x) < 1e-12 ? '0' : Number(x.toPrecision(6)).toString());

/** The zoom entry "lo:hi" (g) as a range, or the reason it is not one. */
export function parseZoom(text: string): [number, number] | string {
  const m = text.split(':');
  const lo = Number(m[0]), hi = Number(m[1]);
  if (m.length !== 2 || m[0].trim() === '' || m[1].trim() === '' || !Number.isFinite(lo) || !Number.isFinite(hi)) return `write the frequency range as lo:hi in g, e.g. 0:3 (got "${text}")`;
  if (!(lo < hi)) return `the range needs lo < hi (got ${lo}:${hi})`;
  return [lo, hi];
}

/** Branch table: one row a path point (k, arc length, margin, growth, omega_1..n). */
export function spectrumTable(sp: StateSpectrum): Table {
  const n = Math.max(...sp.branches.map((b) => b.omega.length));
  const oneD = typeof sp.branches[0]?.k === 'number';
  return {
    columns: [...(oneD ? ['k'] : ['kx', 'ky']), 's', 'margin', 'growth', ...Array.from({ length: n }, (_, i) => `omega${i + 1}`)],
    rows: sp.branches.map((b, i) => [...(typeof b.k === 'number' ? [b.k] : b.k), b.s, sp.margins[i], b.growth, ...Array.from({ length: n }, (_, j) => b.omega[j] ?? null)]),
  };
}

export class ModesView extends LitElement {
  static override properties = {
    section: { attribute: false }, model: { attribute: false }, inputs: { attribute: false }, engine: { attribute: false },
    zoom: { state: true }, zoomText: { state: true }, labPoint: { attribute: false },
  };
  /** The lab's operating point: the figure says whether this spectrum is at it (null: none). */
  declare labPoint: LabPoint | null;
  /** Frequency range of the branch figure (view-local: it changes the look, never a result). */
  declare zoom: 'low' | 'all' | 'custom';
  declare zoomText: string;
  declare section: Section;
  declare model: ParsedModel;
  declare inputs: ModelInputs;
  declare engine: EngineClient;
  private task = new EngineTask<StateSpectrum>(this);
  private inputError: string | null = null;
  private size = new HostWidthController(this);

  constructor() {
    super();
    this.zoom = 'low';
    this.zoomText = '';
  }

  static override styles = [sharedStyles, termStyles, css`
    :host { display: block; }
    .controls { display: flex; gap: 16px; flex-wrap: wrap; align-items: flex-end; margin-bottom: 8px; }
    .controls label { display: block; font-size: 13px; }
    .controls input { width: 90px; }
    .summary { font-size: 14px; margin: 6px 0; }
    .controls select { max-width: 100%; }
  `];


  private patch(p: Partial<Section>) {
    this.dispatchEvent(new CustomEvent('section-change', { detail: { section: 'modes', patch: p }, bubbles: true, composed: true }));
  }

  override willUpdate() {
    const p = this.model.params;
    this.inputError = null;
    const points = parseNumber(this.section.points);
    const cellText = this.section.cell.trim();
    const cell = cellText === '' ? undefined : parseNumber(cellText);
    if (!Number.isInteger(points) || points < 2 || points > 2000) { this.inputError = 'path points must be a whole number 2..2000'; return; }
    if (cell !== undefined && !(Number.isInteger(cell) && cell >= 1)) { this.inputError = 'cell must be empty (ground state) or a whole number M >= 1'; return; }
    if (!p || !this.engine) return;
    const req = { params: { ...p, ...(cell !== undefined ? { cell } : {}) }, seed: 1, points };
    this.task.run(JSON.stringify(req), (signal) => this.engine.call((r) => r.spectrum.spectrum(req), signal,
      { budgetMs: MODES_BUDGET_MS, describe: `the spectrum of ${p.lattice} at ${points} path points (fewer points, or a smaller Mmax, finish sooner)` }));
  }

  override updated() {
    this.dataset.status = this.task.status;
    this.dataset.stale = this.task.stale ? 'yes' : 'no';
    this.dataset.lab = this.labPoint ? (modelAtLabPoint(this.labPoint, this.model.params) ? 'at' : 'away') : '';
  }

  /** The branches figure with the lab point named on it, and whether the model's point lies in its box. */
  private labNote(fig: RenderedFigure): RenderedFigure {
    const lab = this.labPoint;
    return lab ? withLabNote(fig, labPointText(lab), modelAtLabPoint(lab, this.model.params)) : fig;
  }

  override render() {
    const sp = this.task.value;
    const w = Math.max(300, Math.min(this.size.width, 1000));
    const h = Math.round(Math.min(420, Math.max(260, w * 0.42)));
    const st = sp?.state;
    const maxCell = this.model.params?.maxCell ?? st?.cellSize ?? 12;
    const stale = !sp ? '' : !this.model.params || this.inputError ? 'out of date: an entry is invalid'
      : !this.task.stale ? '' : this.task.status === 'pending' ? 'out of date, recomputing\u2026' : 'out of date (not recomputed)';
    const zoomed = this.zoom === 'custom' ? parseZoom(this.zoomText) : null;
    const range: BranchRange = this.zoom === 'custom' ? (typeof zoomed === 'string' ? 'low' : zoomed!) : this.zoom;
    const cmd = cliLine('spectrum', [...modelFlags(this.inputs), ...(this.section.cell.trim() ? ['--cell', this.section.cell.trim()] : []), '--points', this.section.points.trim(), '--json']);
    return html`
      <div class="controls">
        <div><label for="md-points">Points along the path</label><input id="md-points" name="modes-points" .value=${this.section.points}
          @input=${(e: Event) => this.patch({ points: (e.target as HTMLInputElement).value })}></div>
        <div><label for="md-cell">Only supercells of M sites (empty: ground state)</label><input id="md-cell" name="modes-cell" .value=${this.section.cell}
          @input=${(e: Event) => this.patch({ cell: (e.target as HTMLInputElement).value })}></div>
        <div aria-live="polite">${this.task.status === 'pending' ? html`computing\u2026 <button @click=${() => this.task.abort()}>Cancel</button>` : nothing}
          ${this.task.status !== 'pending' && (this.task.stale || this.task.error) ? html`<button class="retry" @click=${() => this.task.retry()}>Run again</button>` : nothing}</div>
        <div><label for="md-zoom">Frequency range</label>
          <select id="md-zoom" name="modes-zoom" @change=${(e: Event) => { this.zoom = (e.target as HTMLSelectElement).value as 'low' | 'all' | 'custom'; }}>
            <option value="low" ?selected=${this.zoom === 'low'}>follow the low branches</option>
            <option value="all" ?selected=${this.zoom === 'all'}>all branches</option>
            <option value="custom" ?selected=${this.zoom === 'custom'}>zoom to lo:hi</option></select></div>
        ${this.zoom === 'custom' ? html`<div><label for="md-zoom-range">ω from:to (g)</label><input id="md-zoom-range" name="modes-zoom-range" .value=${this.zoomText}
          aria-invalid=${typeof zoomed === 'string' ? 'true' : 'false'} aria-describedby="md-zoom-msg"
          @input=${(e: Event) => { this.zoomText = (e.target as HTMLInputElement).value; }}>
          <div class="err" id="md-zoom-msg">${typeof zoomed === 'string' && this.zoomText.trim() ? zoomed : ''}</div></div>` : nothing}
      </div>
      ${this.inputError ? html`<p class="err" role="alert">${this.inputError}</p>` : nothing}
      ${this.task.error ? html`<p class="err" role="alert">${inPageWords(this.task.error)}</p>` : nothing}
      ${!this.model.params ? html`<p class="err">The model has an invalid entry: showing the last good spectrum.</p>` : nothing}
      ${sp && st ? html`
        <p class="summary ${stale ? 'stale-text' : ''}" role="status">${stale ? html`<strong class="err">${stale}:</strong> ` : nothing}State: <strong>${st.phase === 'supersolid' ? term('supersolid', phaseWords(st, maxCell)) : phaseWords(st, maxCell)}</strong> (M = ${st.cellSize}).
          Softest mode at <strong class="kstar">k* = ${kText(sp.softMode.k)}</strong> (${sp.softMode.kind}), ${term('margin')}
          <strong class="margin">${f(sp.softMode.margin)}</strong>: ${sp.softMode.stable ? 'thermodynamically stable' : 'UNSTABLE (a lower state exists in the cell of k*)'};
          ${sp.dynamicallyStable ? 'dynamically stable (real frequencies).' : html`<span class="err">dynamically unstable, growth rate ${f(sp.growth)} g.</span>`}</p>
        ${this.labPoint ? html`<p class="lab-note">${modelAtLabPoint(this.labPoint, this.model.params) ? 'This spectrum is at the lab point' : 'This spectrum is NOT at the lab point'}
          (${labPointText(this.labPoint)}, ±1σ box).</p>` : nothing}
        <figure-panel class="branches" stale=${stale} .figure=${this.labNote(relayable((W, H) => branchesFigure(sp, W, H, `Fluctuation branches of the ${PHASE_NAMES[st.phase]} state`, range), w, h))}></figure-panel>
        <figure-panel class="margin" stale=${stale} .figure=${relayable((W, H) => marginFigure(sp, W, H), w, Math.round(h * 0.8))}></figure-panel>
        <p class="muted">At k = 0 (${term('photon weight')} in brackets): ${sp.zoneCentre.omega.map((o, i) => `${f(o)} g (${f(sp.zoneCentre.photonWeight[i])})`).join(', ')}.
          ${term('margin', 'Margin')}: lowest eigenvalue of the static stability matrix, 1 for free emitters, 0 on a soft-mode line.</p>
        <data-export class="modes-export" .table=${spectrumTable(sp)} .json=${sp} name="spectrum" .command=${cmd}></data-export>` : nothing}
      <limits-note lattice=${this.model.params?.lattice ?? this.inputs.lattice} temperature=${this.model.params?.T ?? 0}></limits-note>`;
  }
}
customElements.define('modes-view', ModesView);

declare global { interface HTMLElementTagNameMap { 'modes-view': ModesView } }
