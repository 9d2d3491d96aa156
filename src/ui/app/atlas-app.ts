/**
 * <atlas-app>: the page. Holds the whole state (state/app-state.ts), mirrors it into the
 * URL and the saved session on every change, parses the model form once for all views,
 * and shows the model form beside the five views. One EngineClient (two instances of the
 * shared worker pool) serves every view.
 */
import { LitElement, html, css, nothing } from 'lit';
import { type AppState, type ModelKey, type SectionName, type ViewName, VIEWS, demoState, cloneState } from '../state/app-state.ts';
import { decodeState, encodeState, queryHasState } from '../state/url-codec.ts';
import { clearSession, loadSession, saveSession } from '../state/session-store.ts';
import { clearLabPoint, readLabPoint, useLabPoint } from '../state/lab-point.ts';
import type { OperatingPoint } from '../../core/lab/operating-point.ts';
import './session-menu.ts';
import { type ParsedModel, parseModel } from '../model/model-inputs.ts';
import { browserEngineClient } from '../engine/browser-engine.ts';
import { AXIS_ENTRIES } from '../../core/scan/model-entries.ts';
import type { AxisName } from '../../core/scan/axes.ts';
import { sharedStyles } from './shared-styles.ts';
import './model-form.ts';
import '../views/phase-atlas-view.ts';
import '../views/staircase-view.ts';
import '../views/modes-view.ts';
import '../views/correlated-view.ts';
import '../views/array-planner-view.ts';

/**
 * Scan workers: navigator.hardwareConcurrency, or ?workers=N in the address (read once at
 * start, not part of the state: it changes speed, never results) for timing comparisons.
 */
function workerCount(): number {
  const n = Number(new URLSearchParams(location.search).get('workers'));
  return Number.isInteger(n) && n >= 1 && n <= 64 ? n : Math.max(1, navigator.hardwareConcurrency || 2);
}

/** Model fields the shown view sets itself (map axes, the staircase's mu scan), with the note the form shows. */
function overriddenFields(s: AppState): Partial<Record<ModelKey, string>> {
  const out: Partial<Record<ModelKey, string>> = {};
  if (s.view === 'atlas') {
    for (const which of ['x', 'y'] as const) {
      const name = s.atlas[which].split('=')[0].trim() as AxisName;
      for (const k of AXIS_ENTRIES[name] ?? []) out[k as ModelKey] ??= `set by the ${which} axis`;
    }
  } else if (s.view === 'staircase') {
    out.mu = 'set by the \u03bc scan of the staircase';
    out.density = 'the staircase scans \u03bc instead';
  }
  return out;
}

const VIEW_TITLES: Record<ViewName, string> = {
  atlas: 'Phase atlas', staircase: 'Staircase', modes: 'Modes', correlated: 'Correlated check', planner: 'Array planner',
};

export class AtlasApp extends LitElement {
  static override properties = { state: { state: true } };
  declare state: AppState;
  /** The parsed form; while an entry is invalid params is null and the views keep their last result. */
  private parsed: ParsedModel;
  readonly engine = browserEngineClient(workerCount());

  constructor() {
    super();
    const q = location.search;
    this.state = queryHasState(q) ? decodeState(q) : loadSession() ?? demoState();
    this.parsed = parseModel(this.state.model);
    // the opened state is the session from now on, and the address shows it
    history.replaceState(null, '', `${location.pathname}?${encodeState(this.state)}`);
    saveSession(this.state);
  }

  static override styles = [sharedStyles, css`
    :host { display: block; min-height: 100vh; background: var(--paper); }
    header.top { display: flex; align-items: center; gap: 14px; padding: 8px 16px; background: #1d2430; color: #fff; flex-wrap: wrap; }
    header.top h1 { font-size: 18px; margin: 0; letter-spacing: 0.02em; }
    header.top .demo { font-size: 12.5px; background: #f3d98b; color: #1d2430; padding: 2px 8px; border-radius: 10px; }
    header.top .spacer { flex: 1; }
    header.top button { background: transparent; color: #fff; border-color: #8f9bb0; }
    header.top button:hover { background: #2e3848; }
    .layout { display: grid; grid-template-columns: 300px minmax(0, 1fr); gap: 14px; padding: 12px 16px; align-items: start; }
    aside { position: sticky; top: 8px; max-height: calc(100vh - 16px); overflow: auto; }
    nav[role='tablist'] { display: flex; gap: 2px; border-bottom: 2px solid #1d2430; margin-bottom: 10px; flex-wrap: wrap; }
    nav button[role='tab'] { border: 1px solid var(--line); border-bottom: none; border-radius: 6px 6px 0 0; padding: 6px 14px; background: #eef1f5; }
    nav button[role='tab'][aria-selected='true'] { background: #1d2430; color: #fff; border-color: #1d2430; }
    main { min-width: 0; }
    @media (max-width: 900px) {
      .layout { grid-template-columns: 1fr; padding: 8px; }
      aside { position: static; max-height: none; }
    }
  `];

  /** Apply a change to the state: URL, session and parse follow. */
  private commit(next: AppState) {
    this.state = next;
    this.parsed = parseModel(next.model);
    history.replaceState(null, '', `${location.pathname}?${encodeState(next)}`);
    saveSession(next);
  }

  private onModelInput(e: CustomEvent<{ key: ModelKey; value: string }>) {
    const next = cloneState(this.state);
    next.model[e.detail.key] = e.detail.value;
    this.commit(next);
  }

  private onModelReplace(e: CustomEvent<Partial<Record<ModelKey, string>>>) {
    const next = cloneState(this.state);
    Object.assign(next.model, e.detail);
    this.commit(next);
  }

  private onSectionChange(e: CustomEvent<{ section: SectionName; patch: Record<string, string> }>) {
    const next = cloneState(this.state);
    Object.assign(next[e.detail.section], e.detail.patch);
    this.commit(next);
  }

  private setView(v: ViewName) {
    const next = cloneState(this.state);
    next.view = v;
    this.commit(next);
  }

  private onTabKey(e: KeyboardEvent) {
    const i = VIEWS.indexOf(this.state.view);
    const j = e.key === 'ArrowRight' ? (i + 1) % VIEWS.length : e.key === 'ArrowLeft' ? (i + VIEWS.length - 1) % VIEWS.length : -1;
    if (j < 0) return;
    e.preventDefault();
    this.setView(VIEWS[j]);
    void this.updateComplete.then(() => (this.renderRoot.querySelector(`#tab-${VIEWS[j]}`) as HTMLElement | null)?.focus());
  }

  private async copyLink() {
    try { await navigator.clipboard.writeText(location.href); } catch { /* the address bar holds it too */ }
  }

  /** The planner's "use these numbers": model, lab point and re-centred axes in one change. */
  private onLabUse(e: CustomEvent<{ model: Partial<Record<ModelKey, string>>; point: OperatingPoint }>) {
    this.commit(useLabPoint(this.state, e.detail.model, e.detail.point));
  }

  private onLabClear() {
    this.commit(clearLabPoint(this.state));
  }

  /** A named session loaded from the browser's store replaces the state (the view it was saved on included). */
  private onSessionLoad(e: CustomEvent<{ state: AppState }>) {
    this.commit(e.detail.state);
  }

  private reset() {
    clearSession();
    this.commit(demoState());
  }

  private view() {
    const s = this.state;
    const common = { model: this.parsed };
    const lab = readLabPoint(s.lab);
    switch (s.view) {
      case 'atlas': return html`<phase-atlas-view .section=${s.atlas} .model=${common.model} .inputs=${s.model} .engine=${this.engine} .labPoint=${lab}></phase-atlas-view>`;
      case 'staircase': return html`<staircase-view .section=${s.staircase} .model=${common.model} .inputs=${s.model} .engine=${this.engine} .labPoint=${lab}></staircase-view>`;
      case 'modes': return html`<modes-view .section=${s.modes} .model=${common.model} .inputs=${s.model} .engine=${this.engine} .labPoint=${lab}></modes-view>`;
      case 'correlated': return html`<correlated-view .section=${s.correlated} .model=${common.model} .inputs=${s.model} .engine=${this.engine} .labPoint=${lab}></correlated-view>`;
      case 'planner': return html`<array-planner-view .section=${s.planner} .model=${common.model} .inputs=${s.model} .engine=${this.engine} .labPoint=${lab}></array-planner-view>`;
    }
  }

  override render() {
    const s = this.state;
    return html`
      <header class="top">
        <h1>Blockade Atlas</h1>
        <span class="demo" title="The default inputs are an invented demo scenario">Demo scenario: invented for this tool, not from an experiment</span>
        <span class="spacer"></span>
        <button @click=${this.copyLink} aria-label="Copy a link to this exact view">Copy link</button>
        <session-menu .state=${s} @session-load=${this.onSessionLoad}></session-menu>
        <button @click=${this.reset}>Reset to demo</button>
      </header>
      <div class="layout" @model-input=${this.onModelInput} @model-replace=${this.onModelReplace} @section-change=${this.onSectionChange}
        @lab-point-use=${this.onLabUse} @lab-point-clear=${this.onLabClear}>
        <aside aria-label="Model inputs">
          <model-form .inputs=${s.model} .errors=${this.parsed.errors} .overrides=${overriddenFields(s)}></model-form>
        </aside>
        <main>
          <nav role="tablist" aria-label="Views" @keydown=${this.onTabKey}>
            ${VIEWS.map((v) => html`<button role="tab" id="tab-${v}" aria-selected=${v === s.view ? 'true' : 'false'}
              aria-controls="panel" tabindex=${v === s.view ? '0' : '-1'} @click=${() => this.setView(v)}>${VIEW_TITLES[v]}</button>`)}
          </nav>
          <section id="panel" role="tabpanel" aria-labelledby="tab-${s.view}">
            <h2>${VIEW_TITLES[s.view]}</h2>
            ${this.view()}
          </section>
          ${nothing}
        </main>
      </div>`;
  }
}
customElements.define('atlas-app', AtlasApp);

declare global { interface HTMLElementTagNameMap { 'atlas-app': AtlasApp } }
