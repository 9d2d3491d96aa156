/**
 * <array-planner-view>: lab numbers to model units and back (src/core/lab/units.ts),
 * Rb/a and the blockade regime, and a plain verdict on the planned point: its mean-field
 * phase and its margin in pump to the nearest phase boundary. The model's limits and the
 * cautions for the lab work are stated here, deferring to local rules.
 */
import { LitElement, html, css, nothing } from 'lit';
import type { AppState, ModelInputs } from '../state/app-state.ts';
import type { ParsedModel } from '../model/model-inputs.ts';
import { parseNumber } from '../model/model-inputs.ts';
import { type LabNumbers, type ModelNumbers, collectiveCouplingMHz, labToModel, modelToLab } from '../../core/lab/units.ts';
import { sitesInsideBlockade, shellsInsideBlockade } from '../../core/lab/regime.ts';
import { type LossBudget, lossBudget } from '../../core/lab/losses.ts';
import { type OperatingPoint, operatingPoint } from '../../core/lab/operating-point.ts';
import { type LabPoint, labPointText } from '../state/lab-point.ts';
import { lossFields, lossResults, lossRows, typedLosses } from './planner-losses.ts';
import type { LatticeName } from '../../core/lattice/geometry.ts';
import type { ModelParams } from '../../core/model.ts';
import type { EngineClient } from '../engine/engine-client.ts';
import { EngineTask } from '../controllers/engine-task.ts';
import type { PhaseMargin } from '../../core/scan/phase-margin.ts';
import { sharedStyles } from '../app/shared-styles.ts';
import { cliLine } from '../export/cli-command.ts';
import type { Table } from '../export/table.ts';
import { PHASE_NAMES } from '../plot/phase-palette.ts';
import '../app/data-export.ts';
import '../app/limits-note.ts';

type PlannerSection = AppState['planner'];
const TUNITS: Record<string, number> = { uK: 1e-6, mK: 1e-3, K: 1 };
const fmt = (v: number, d = 4) => (Number.isFinite(v) ? Number(v.toPrecision(d)).toString() : '\u2014');

interface FieldSpec { key: keyof PlannerSection; label: string; unit: string }
const LAB_FIELDS: FieldSpec[] = [
  { key: 'c6', label: 'C6 / h of the pair state', unit: 'GHz \u00b5m\u2076' },
  { key: 'spacing', label: 'Lattice spacing a', unit: '\u00b5m' },
  { key: 'g0', label: 'Single-emitter coupling g0 / 2\u03c0', unit: 'MHz' },
  { key: 'emitters', label: 'Emitters N coupled to the mode', unit: '' },
  { key: 'splitting', label: 'Collective splitting 2g / 2\u03c0', unit: 'MHz' },
  { key: 'detuning', label: 'Detuning \u0394 / 2\u03c0 (cavity \u2212 emitter)', unit: 'MHz' },
  { key: 'mu', label: 'Pump: chemical potential \u03bc / h, measured from the emitter line (the bare emitter transition)', unit: 'MHz' },
  { key: 'temperature', label: 'Temperature of the excitations (their quasi-equilibrium, not the atoms\u2019 motion or the cryostat)', unit: '' },
];

/** Standard uncertainties (one sigma) of the entries the tolerance box is made of. */
const SIGMA_FIELDS: FieldSpec[] = [
  { key: 'dspacing', label: '± spacing a (one σ)', unit: 'µm' },
  { key: 'ddetuning', label: '± detuning Δ / 2π (one σ)', unit: 'MHz' },
  { key: 'dmu', label: '± pump μ / h (one σ)', unit: 'MHz' },
];

export class ArrayPlannerView extends LitElement {
  static override properties = { section: { attribute: false }, model: { attribute: false }, inputs: { attribute: false }, engine: { attribute: false }, labPoint: { attribute: false } };
  declare section: PlannerSection;
  /** The operating point in use on every view (null: none). */
  declare labPoint: LabPoint | null;
  declare model: ParsedModel;
  declare inputs: ModelInputs;
  declare engine: EngineClient;
  private verdict = new EngineTask<PhaseMargin>(this);
  /** The last lab numbers that converted, shown (marked) while the current entries have an error. */
  private lastGood: { lab: LabNumbers; model: ModelNumbers } | null = null;

  static override styles = [sharedStyles, css`
    :host { display: block; }
    .cols { display: grid; grid-template-columns: minmax(280px, 1fr) minmax(280px, 1fr); gap: 16px; align-items: start; }
    @media (max-width: 900px) { .cols { grid-template-columns: 1fr; } }
    .field { display: grid; grid-template-columns: 1fr 110px 70px; gap: 2px 8px; align-items: center; margin: 5px 0; }
    .field .msg { grid-column: 1 / -1; }
    .field.wide { grid-template-columns: 1fr 188px; }
    .verdict { font-size: 15px; padding: 8px 12px; border: 2px solid #165a78; border-radius: 6px; background: #eef5f8; }
    fieldset { border: 1px solid var(--line); border-radius: 6px; margin: 0 0 10px; }
  `];

  private patch(p: Partial<PlannerSection> & Record<string, string>) {
    this.dispatchEvent(new CustomEvent('section-change', { detail: { section: 'planner', patch: p }, bubbles: true, composed: true }));
  }

  /** The lab numbers as typed, or the error and the field it concerns. */
  private lab(): { lab?: LabNumbers; model?: ModelNumbers; error?: string; field?: string } {
    const s = this.section;
    const n = (k: keyof PlannerSection) => parseNumber(s[k]);
    const lab: LabNumbers = {
      c6GHzUm6: n('c6'), spacingUm: n('spacing'),
      coupling: s.coupling === 'collective' ? { kind: 'collective', splittingMHz: n('splitting') } : { kind: 'single', g0MHz: n('g0'), emitters: n('emitters') },
      detuningMHz: n('detuning'), muMHz: n('mu'), temperatureK: n('temperature') * (TUNITS[s.tunit] ?? 1),
    };
    try {
      const model = labToModel(lab);
      this.lastGood = { lab, model };
      return { lab, model };
    } catch (e) {
      const err = e as Error & { field?: string };
      return { error: err.message, field: err.field };
    }
  }

  private params(m: ModelNumbers): ModelParams {
    const lat = (this.model.params?.lattice ?? this.inputs.lattice) as LatticeName;
    return { lattice: lat, interaction: { shape: 'vdw', Rb: m.rbOverA }, delta: m.delta, mu: m.mu, T: m.T, maxCell: lat === 'chain' ? 12 : 8 };
  }

  override willUpdate() {
    const { model } = this.lab();
    if (!model || !this.engine) return;
    const p = this.params(model);
    if (!(model.mu < model.delta)) return;
    // the bisection runs in a worker (a 'phase-margin' scan), not on the page's thread
    this.verdict.run(JSON.stringify(p), (signal) => this.engine.interactiveScan({ kind: 'phase-margin', params: p }, { signal }));
  }

  /**
   * Switch how the coupling is given. Going to the collective splitting prefills it with
   * 2 g = 2 g0 sqrt(N) from the entries just shown (the round-trip decimal of the same
   * double, so the point and its verdict stay the same); going back keeps g0 and N.
   */
  private switchCoupling(to: string) {
    const s = this.section;
    const p: Record<string, string> = { coupling: to };
    if (to === 'collective' && s.coupling !== 'collective') {
      try {
        p.splitting = String(2 * collectiveCouplingMHz({ kind: 'single', g0MHz: parseNumber(s.g0), emitters: parseNumber(s.emitters) }));
      } catch { /* g0 or N not valid: leave the splitting as it was */ }
    }
    this.patch(p);
  }

  /** The loss budget at the converted point, the margin taken from the verdict when it is for this point. */
  private losses(lab: LabNumbers, m: ModelNumbers): { budget?: LossBudget; error?: { message: string; field?: string }; marginNote: string } {
    const rates = typedLosses(this.section as unknown as Record<string, string | undefined>);
    const v = this.verdict.value;
    const current = v && !this.verdict.stale && this.verdict.status !== 'pending';
    const near = current ? [v.below, v.above].filter((x): x is NonNullable<typeof x> => !!x).sort((a, b) => a.distance - b.distance)[0] : undefined;
    // no boundary within the +-2 g window: the margin is at least 2 g (a lower bound, so the check errs on the safe side)
    const marginMHz = !current ? null : near ? near.distance * m.gMHz : 2 * m.gMHz;
    const marginNote = !current ? 'awaiting the verdict' : near ? 'to the nearest boundary, along \u03bc' : 'at least: no boundary within \u00b12 g';
    if (!rates) return { marginNote };
    try {
      const g0MHz = lab.coupling.kind === 'single' ? lab.coupling.g0MHz : undefined;
      return { budget: lossBudget({ losses: rates, gMHz: m.gMHz, g0MHz, detuningMHz: lab.detuningMHz, muMHz: lab.muMHz, marginMHz }), marginNote };
    } catch (e) {
      const err = e as Error & { field?: string };
      return { error: { message: err.message, field: err.field }, marginNote };
    }
  }

  /** The operating point with its first-order tolerance box (blank uncertainties are exact), or the entry at fault. */
  private tolerance(lab: LabNumbers): { point?: OperatingPoint; error?: string; field?: string } {
    const s = this.section;
    const n = (k: 'dspacing' | 'ddetuning' | 'dmu') => ((s[k] ?? '').trim() === '' ? 0 : parseNumber(s[k]));
    try {
      return { point: operatingPoint(lab, { spacingUm: n('dspacing'), detuningMHz: n('ddetuning'), muMHz: n('dmu') }) };
    } catch (e) {
      const err = e as Error & { field?: string };
      return { error: err.message, field: err.field };
    }
  }

  /**
   * Set the model to the point and put the point, with its tolerance box, on every view
   * (atlas-app applies it: state/lab-point.ts re-centres the axes on it where needed).
   */
  private useInModel(m: ModelNumbers, point: OperatingPoint) {
    const patch: Record<string, string> = {
      interaction: 'vdw', strength: 'rb', rb: fmt(m.rbOverA, 6), detuning: fmt(m.delta, 6), pump: 'mu', mu: fmt(m.mu, 6), temperature: fmt(m.T, 6), range: '',
    };
    this.dispatchEvent(new CustomEvent('lab-point-use', { detail: { model: patch, point }, bubbles: true, composed: true }));
  }

  /** The tolerance box in model units, and the point in use on the views. */
  private toleranceBox(t: { point?: OperatingPoint; error?: string }) {
    const pm = (a: { value: number; sigma: number }) => `${fmt(a.value)} ± ${fmt(a.sigma, 3)}`;
    const p = t.point;
    return html`<h3>Tolerance box (one σ, first order)</h3>
      ${p ? html`<table aria-label="Tolerance box" class="tolerance"><tbody>
        <tr><th class="l">Rb / a, σ = (Rb/a) σ_a / a</th><td class="box-rb">${pm(p.rbOverA)}</td><td class="l"></td></tr>
        <tr><th class="l">V1, σ = 6 V1 σ_a / a</th><td class="box-v1">${pm(p.V1)}</td><td class="l">g</td></tr>
        <tr><th class="l">δ, σ = σ_Δ / g</th><td class="box-delta">${pm(p.delta)}</td><td class="l">g</td></tr>
        <tr><th class="l">μ, σ = σ_μ / g</th><td class="box-mu">${pm(p.mu)}</td><td class="l">g</td></tr></tbody></table>
        ${p.linear ? nothing : html`<p class="caution" role="note">6 σ_a / a is not small: the V1 box is first order and the true interval is lopsided (V1 ∝ a⁻⁶).</p>`}
        <p class="muted">C6, g and T are taken as exact; the inputs as uncorrelated (JCGM 100:2008 eq. 10). Rb/a and V1 share σ_a.</p>`
        : html`<p class="err">${t.error ?? 'Fix the lab numbers first.'}</p>`}
      ${this.labPoint ? html`<p class="lab-in-use" role="status"><strong>Lab point on every view:</strong> ${labPointText(this.labPoint)}
          <button class="clear-lab" @click=${() => this.dispatchEvent(new CustomEvent('lab-point-clear', { bubbles: true, composed: true }))}>Take the lab point off the views</button></p>`
        : html`<p class="muted">"Use these numbers" sets the model to this point and marks it, with this box, on the atlas, the staircase, the modes and the correlated check.</p>`}`;
  }

  private field(f: FieldSpec, errField?: string, err?: string) {
    const id = `lab-${f.key}`;
    const bad = errField === f.key;
    return html`<div class="field">
      <label for=${id}>${f.label}</label>
      <input id=${id} name=${id} inputmode="decimal" .value=${this.section[f.key]} aria-invalid=${bad ? 'true' : 'false'} aria-describedby="${id}-msg"
        @input=${(e: Event) => this.patch({ [f.key]: (e.target as HTMLInputElement).value })}>
      ${f.key === 'temperature'
        ? html`<select aria-label="temperature unit" name="lab-tunit" @change=${(e: Event) => this.patch({ tunit: (e.target as HTMLSelectElement).value })}>
            ${Object.keys(TUNITS).map((u) => html`<option value=${u} ?selected=${u === this.section.tunit}>${u === 'uK' ? '\u00b5K' : u}</option>`)}</select>`
        : html`<span class="muted">${f.unit}</span>`}
      <div class="msg err" id="${id}-msg" role=${bad ? 'alert' : nothing}>${bad ? err : ''}</div>
    </div>`;
  }

  /** The plain verdict sentence. */
  private verdictText(m: ModelNumbers) {
    const v = this.verdict.value;
    if (!(m.mu < m.delta)) return html`<p class="err">\u03bc must lie below the detuning (\u03bc = ${fmt(m.mu)} g, \u03b4 = ${fmt(m.delta)} g): the photon number would be unbounded.</p>`;
    if (!v) return html`<p class="muted">Solving\u2026</p>`;
    const s = v.state;
    const name = `${s.fraction ? s.fraction + ' ' : ''}${PHASE_NAMES[s.phase]}`;
    const near = [v.below, v.above].filter((x): x is NonNullable<typeof x> => !!x).sort((a, b) => a.distance - b.distance)[0];
    const mhz = (d: number) => fmt(d * m.gMHz, 3);
    return html`<p class="verdict" role="status">At this pump the mean-field ground state is a <strong>${name}</strong>
      (\u03c1 = ${fmt(s.excitationDensity)}, \u03b1\u00b2 = ${fmt(s.photonDensity)}),
      ${near ? html`<strong>${fmt(near.distance, 2)} g</strong> (${mhz(near.distance)} MHz in \u03bc) from the nearest phase boundary, to ${near.phase}${near === v.below ? ' below' : ' above'}.`
        : html`with no phase boundary within \u00b12 g of pump.`}
      ${v.soft ? html` Its own solution goes soft <strong class="soft-distance">${fmt(v.soft.distance, 2)} g</strong> (${mhz(v.soft.distance)} MHz) away in \u03bc
        (the nearest soft-mode line, at k* = ${typeof v.soft.k === 'number' ? fmt(v.soft.k, 4) : `(${fmt(v.soft.k[0], 3)}, ${fmt(v.soft.k[1], 3)})`}, ${v.soft.kind}).`
        : v.soft === null ? html` No soft-mode line of its own phase within \u00b12 g.` : nothing}
      ${this.verdict.status === 'pending' ? html`<span class="muted">(updating)</span>` : nothing}</p>`;
  }

  override render() {
    const s = this.section;
    const { model: current, error, field } = this.lab();
    // while an entry is bad, the last good point stays on show (marked), with its verdict
    const point = current ? { lab: this.lab().lab!, model: current } : this.lastGood;
    const model = point?.model;
    const losses = point ? this.losses(point.lab, point.model) : null;
    // the tolerance box of the current entries only (never of the last good ones: "use" must use what is typed)
    const tol = current ? this.tolerance(point!.lab) : null;
    const lossValues = s as unknown as Record<string, string | undefined>;
    const lat = (this.model.params?.lattice ?? this.inputs.lattice) as LatticeName;
    const shown = LAB_FIELDS.filter((f) => (s.coupling === 'collective' ? f.key !== 'g0' && f.key !== 'emitters' : f.key !== 'splitting'));
    const back = model && this.model.params ? (() => {
      const p = this.model.params;
      const rb = p.interaction.Rb ?? (p.interaction.V1 !== undefined && p.interaction.shape === 'vdw' ? Math.pow(p.interaction.V1 / 2, 1 / 6) : NaN);
      try { return { rb, lab: modelToLab({ rbOverA: rb, delta: p.delta, mu: p.mu ?? NaN, T: p.T }, parseNumber(s.c6), model.gMHz) }; } catch { return null; }
    })() : null;
    const rows: Table['rows'] = model ? [
      ['g', model.gMHz, 'MHz'], ['Rb', model.rbUm, 'um'], ['Rb/a', model.rbOverA, ''], ['V1', model.V1, 'g'],
      ['delta', model.delta, 'g'], ['mu', model.mu, 'g'], ['T', model.T, 'g'],
      ...(tol?.point ? [['sigma Rb/a', tol.point.rbOverA.sigma, ''], ['sigma V1', tol.point.V1.sigma, 'g'], ['sigma delta', tol.point.delta.sigma, 'g'],
        ['sigma mu', tol.point.mu.sigma, 'g']] as Table['rows'] : []),
      ...(losses?.budget ? lossRows(losses.budget) : []),
    ] : [];
    const p = model ? this.params(model) : null;
    const command = p ? cliLine('solve', ['--lattice', p.lattice, '--interaction', 'vdw', '--rb', fmt(model!.rbOverA, 8), '--detuning', fmt(model!.delta, 8),
      '--mu', fmt(model!.mu, 8), '--temperature', fmt(model!.T, 8), '--json']) : '';
    return html`<div class="cols">
      <section aria-label="Lab numbers">
        <fieldset><legend>Lab numbers (frequencies as \u03bd = E/h)</legend>
          <div class="field wide"><label for="lab-coupling">Coupling given as</label>
            <select id="lab-coupling" name="lab-coupling" @change=${(e: Event) => this.switchCoupling((e.target as HTMLSelectElement).value)}>
              <option value="single" ?selected=${s.coupling !== 'collective'}>g0 and N (g = g0 \u221aN)</option>
              <option value="collective" ?selected=${s.coupling === 'collective'}>collective splitting 2g</option></select></div>
          ${shown.map((f) => this.field(f, field, error))}
          ${error && !shown.some((f) => f.key === field) ? html`<p class="err" role="alert">${error}</p>` : nothing}
        </fieldset>
        <fieldset><legend>Uncertainties (one \u03c3; blank = exact)</legend>
          ${SIGMA_FIELDS.map((f) => this.field(f, tol?.field, tol?.error))}
        </fieldset>
        <fieldset><legend>Losses (full widths, \u03bd = E/h)</legend>
          ${lossFields(lossValues, (k, v) => this.patch({ [k]: v }), losses?.error)}
        </fieldset>
        ${current ? html`<button class="primary use-numbers" ?disabled=${!tol?.point} @click=${() => tol?.point && this.useInModel(current, tol.point)}>Use these numbers in the model</button>` : nothing}
      </section>
      <section aria-label="Model units">
        ${model ? html`
          ${current ? nothing : html`<p class="note last-good" role="note">Showing the last good numbers: fix the entry marked on the left to update.</p>`}
          <table aria-label="Model units"><tbody>
            <tr><th class="l">collective coupling g / 2\u03c0 (energy unit)</th><td class="g-mhz">${fmt(model.gMHz)}</td><td class="l">MHz</td></tr>
            <tr><th class="l">blockade radius Rb = (C6 / 2g)^(1/6)</th><td>${fmt(model.rbUm)}</td><td class="l">\u00b5m</td></tr>
            <tr><th class="l">Rb / a</th><td class="rb-a">${fmt(model.rbOverA)}</td><td class="l"></td></tr>
            <tr><th class="l">V(a) = V1 = 2 (Rb/a)\u2076</th><td>${fmt(model.V1)}</td><td class="l">g</td></tr>
            <tr><th class="l">detuning \u03b4</th><td>${fmt(model.delta)}</td><td class="l">g</td></tr>
            <tr><th class="l">chemical potential \u03bc, from the emitter line</th><td>${fmt(model.mu)}</td><td class="l">g</td></tr>
            <tr><th class="l">temperature T of the excitations</th><td>${fmt(model.T)}</td><td class="l">g</td></tr>
          </tbody></table>
          <p class="regime">Regime on the ${lat}: <span class="blockaded">${sitesInsideBlockade(lat, model.rbOverA)}</span> neighbours inside one blockade disc
            (the sites closer than Rb to an excited emitter, itself not counted: each costs V &gt; 2g to excite beside it;
            ${shellsInsideBlockade(lat, model.rbOverA).length} neighbour shell${shellsInsideBlockade(lat, model.rbOverA).length === 1 ? '' : 's'}).
            ${model.rbOverA < 1 ? 'Below nearest-neighbour blockade: neighbours cost less than the Rabi splitting.' : ''}</p>
          ${this.verdictText(model)}
          ${this.toleranceBox(tol ?? {})}
          <h3>Losses</h3>
          ${losses?.budget ? lossResults(losses.budget, losses.marginNote)
            : html`<p class="muted">Enter the cavity linewidth \u03ba and the emitter decay \u03b3 (full widths, MHz) for the cooperativity, strong coupling
              and whether the quasi-equilibrium picture can apply.${losses?.error ? ' Fix the loss entries.' : ''}</p>`}
          ${back ? html`<h3>And back: the model's current point in lab units</h3>
            <p class="back">Rb/a = ${fmt(back.rb)} needs a = ${fmt(back.lab.spacingUm)} \u00b5m at this C6 and g; \u03b4 \u2192 \u0394/2\u03c0 = ${fmt(back.lab.detuningMHz)} MHz,
            \u03bc \u2192 ${fmt(back.lab.muMHz)} MHz, T \u2192 ${fmt(back.lab.temperatureK * 1e6)} \u00b5K.</p>` : nothing}
          <data-export .table=${{ columns: ['quantity', 'value', 'unit'], rows }} .json=${{ lab: point?.lab, model, verdict: this.verdict.value ?? null, losses: losses?.budget ?? null }}
            name="planner" .command=${command}></data-export>` : html`<p class="err">Fix the lab numbers to see the model units.</p>`}
      </section>
    </div>
    <limits-note lattice=${lat} temperature=${model?.T ?? 0}></limits-note>
    <div class="note" role="note"><strong>What the model leaves out.</strong> No cavity or emitter losses in the solution (quasi-equilibrium with a
      chemical potential for excitations; the losses panel only compares their rates with the gaps, and full driven-dissipative
      steady states are not computed), a single cavity mode, rotating-wave coupling, a mean-field (coherent) photon, van der Waals
      pairs only (no F\u00f6rster resonances, no angular dependence). Check that the pair state's C6 is repulsive and that the
      blockade picture holds at your densities.</div>
    <div class="caution" role="note"><strong>Lab safety.</strong> This planner does not assess safety. Laser work (trap, tweezer and
      Rydberg excitation beams, often Class 3B or 4, some in the ultraviolet or invisible infrared) can cause eye and skin injury;
      cryogenic work (liquid nitrogen or helium, cryostats for semiconductor samples) carries cold burns, pressure build-up and
      oxygen depletion in closed rooms; high voltage on field electrodes. Follow your institution's rules, your laser and
      cryogenic safety officers and licensed practice; they take precedence over anything shown here.</div>`;
  }
}
customElements.define('array-planner-view', ArrayPlannerView);

declare global { interface HTMLElementTagNameMap { 'array-planner-view': ArrayPlannerView } }
