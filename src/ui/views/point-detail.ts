/**
 * <point-detail>: one point of the map opened: its sublattice pattern drawn on the
 * lattice, its numbers, and its fluctuation spectrum. The state is the map's own when the
 * map has reached the point (`state`); otherwise it is solved once on the interactive
 * worker with the map's seed for the point (cold, as the first point of a segment). The
 * spectrum is computed about that state, never solving it again.
 *
 * It opens below the map: each newly opened point is scrolled into view (when its top is
 * not in the upper half of the window), and Escape closes it from anywhere on the page.
 */
import { atSearchLimit } from '../../core/meanfield/plateaus.ts';
import { LitElement, html, css, nothing } from 'lit';
import type { ModelParams } from '../../core/model.ts';
import type { SolveResult } from '../../core/meanfield/ground-state.ts';
import type { EngineClient } from '../engine/engine-client.ts';
import { EngineTask } from '../controllers/engine-task.ts';
import { phaseWords } from '../model/phase-words.ts';
import { sharedStyles } from '../app/shared-styles.ts';
import { patternFigure } from '../figures/pattern-figure.ts';
import { stateRows, sublatticeTable } from './state-numbers.ts';
import '../app/figure-panel.ts';
import '../app/data-export.ts';
import { PHASE_NAMES } from '../plot/phase-palette.ts';
import type { StateSpectrum } from '../../core/spectrum/state-spectrum.ts';
import { branchesFigure } from '../figures/spectrum-figure.ts';

import { kText } from '../model/pi-multiple.ts';
import { inPageWords } from '../model/page-words.ts';
import { term, termStyles } from '../app/term-tip.ts';
import { relayable } from '../export/print-layout.ts';

export class PointDetail extends LitElement {
  static override properties = {
    params: { attribute: false }, state: { attribute: false }, seed: { type: Number }, label: { type: String }, engine: { attribute: false },
    width: { type: Number }, command: { type: String },
  };
  declare params: ModelParams | null;
  /** The map's state of the point, when it has one (then nothing is solved here). */
  declare state: SolveResult | null;
  declare seed: number;
  declare label: string;
  declare engine: EngineClient;
  declare width: number;
  declare command: string;
  private task = new EngineTask<SolveResult>(this);
  private spectrum = new EngineTask<StateSpectrum>(this);

  constructor() {
    super();
    this.params = null;
    this.state = null;
    this.seed = 1;
    this.label = '';
    this.width = 560;
    this.command = '';
  }

  /**
   * Escape anywhere closes the point (unless another handler already took the key). Listened
   * to in the capture phase, so an open point takes Escape before the map's zoom (which
   * steps back only on an Escape nobody took).
   */
  private onKey = (e: KeyboardEvent) => {
    if (e.key === 'Escape' && !e.defaultPrevented) { e.preventDefault(); this.close(); }
  };

  override connectedCallback() {
    super.connectedCallback();
    document.addEventListener('keydown', this.onKey, true);
  }

  override disconnectedCallback() {
    document.removeEventListener('keydown', this.onKey, true);
    super.disconnectedCallback();
  }

  /** The label last scrolled to: a new point scrolls once, later re-renders do not move the page. */
  private shownLabel = '';

  override updated() {
    if (this.label === this.shownLabel) return;
    this.shownLabel = this.label;
    // once laid out: a top in the lower half of the window (or above it) means most of the
    // point is out of sight, so bring its header to the top
    requestAnimationFrame(() => {
      const r = this.getBoundingClientRect();
      if (r.top > innerHeight * 0.5 || r.top < 0) this.scrollIntoView({ block: 'start', behavior: 'smooth' });
    });
  }

  static override styles = [sharedStyles, termStyles, css`
    :host { display: block; border: 1px solid var(--line); border-radius: 6px; padding: 8px 12px; background: var(--panel); }
    .cols { display: grid; grid-template-columns: minmax(0, 3fr) minmax(260px, 2fr); gap: 12px; align-items: start; }
    @media (max-width: 900px) { .cols { grid-template-columns: 1fr; } }
    header { display: flex; justify-content: space-between; align-items: baseline; gap: 8px; }
  `];

  override willUpdate(changed: Map<string, unknown>) {
    if (!this.params || !this.engine) return;
    if (changed.has('params') || changed.has('seed') || changed.has('state')) {
      const params = this.params, given = this.state;
      const req = { params, seed: this.seed };
      // the key is the point alone: the map's state arriving later does not solve again
      this.task.run(JSON.stringify(req), (signal) => (given ? Promise.resolve(given) : this.engine.call((r) => r.meanfield.solve(req), signal)));
    }
    const s = this.task.status === 'complete' ? this.task.value : undefined;
    if (s && this.task.valueKey === JSON.stringify({ params: this.params, seed: this.seed })) {
      const sreq = { params: this.params, state: s, points: 65 };
      this.spectrum.run(JSON.stringify([this.task.valueKey, 65]), (signal) => this.engine.call((r) => r.spectrum.spectrumOfState(sreq), signal));
    }
  }

  private close() {
    this.dispatchEvent(new CustomEvent('point-close', { bubbles: true, composed: true }));
  }

  override render() {
    const s = this.task.value;
    const lat = this.params?.lattice ?? 'chain';
    const sp = this.spectrum.value;
    return html`<section aria-label="Opened point" aria-busy=${this.task.status === 'pending' ? 'true' : 'false'}>
      <header><h3>Point ${this.label}${s ? html`: <span class="phase-name">${s.phase === 'supersolid' ? term('supersolid', phaseWords(s, this.params?.maxCell ?? s.cellSize)) : phaseWords(s, this.params?.maxCell ?? s.cellSize)}</span>${this.params && atSearchLimit(s, this.params.maxCell)
          ? html` <span class="err at-limit">(M = Mmax = ${s.cellSize}, the largest cell searched: may be an artefact of that limit)</span>` : nothing}` : nothing}</h3>
        <button @click=${this.close} aria-label="Close the opened point" title="Close (Escape)">Close</button></header>
      ${this.task.error ? html`<p class="err" role="alert">${inPageWords(this.task.error)}</p>` : nothing}
      ${s ? html`<div class="cols">
          <div><figure-panel class="pattern" .figure=${relayable((W, H) => patternFigure(lat, s, W, H), Math.max(380, this.width * 0.58), lat === 'chain' ? 190 : 360, 300, 150)}></figure-panel>
            <p class="muted m-note">Shade: m, the probability that the site's emitter is excited (⟨n⟩ of its sublattice), from white
              (empty) to ink (excited). Amber ring: the coherence |⟨σx⟩|, the site's part in the photon condensate (wider = more).</p></div>
          <div>
            <table aria-label="Numbers of the opened point"><tbody>
              ${stateRows(s).map(([k, v, u]) => html`<tr><th class="l" scope="row">${k}</th><td>${v}</td><td class="l muted">${u}</td></tr>`)}
            </tbody></table>
            <data-export .table=${sublatticeTable(s)} .json=${s} name="point" .command=${this.command}></data-export>
          </div>
        </div>` : html`<p class="muted">Solving\u2026</p>`}
      ${sp ? html`<figure-panel class="point-spectrum"
          .figure=${relayable((W, H) => branchesFigure(sp, W, H, `Fluctuation branches at this point`), Math.max(380, this.width - 30), 260, 300, 200)}></figure-panel>
        <p class="muted soft">Softest mode k* = ${kText(sp.softMode.k, 4)} (${sp.softMode.kind}), ${term('margin')}
          ${sp.softMode.margin.toPrecision(4)}${sp.softMode.stable ? ', stable' : ', unstable'};
          ${sp.dynamicallyStable ? 'real frequencies.' : 'complex frequencies (dynamically unstable).'}</p>`
        : this.spectrum.error ? html`<p class="err">${inPageWords(this.spectrum.error)}</p>` : html`<p class="muted">Spectrum…</p>`}
    </section>`;
  }
}
customElements.define('point-detail', PointDetail);

declare global { interface HTMLElementTagNameMap { 'point-detail': PointDetail } }
