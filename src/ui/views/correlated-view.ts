/**
 * <correlated-view>: the correlated check. Exact diagonalisation or variational Monte
 * Carlo, or unbiased quantum Monte Carlo (the reference), on a periodic cluster of the
 * model's lattice or on the user's own array (CSV upload), at the model's mu and detuning
 * (alpha self-consistent, or fixed), next to the mean-field answer for the same inputs.
 * Shows the array to scale shaded by <n_i>, the live optimisation trace (VMC), S(k) and
 * C(r), and for QMC f(alpha) - f(0). ED and VMC at T = 0; QMC at any T or in its
 * ground-state mode (its run: controllers/qmc-task.ts; its numbers: qmc-numbers.ts).
 * VMC is checked against ED, ground-state QMC and mean field (qmc-reference.ts).
 */
import { HostWidthController } from '../controllers/host-width.ts';
import { LitElement, html, css, nothing } from 'lit';
import type { AppState, ModelInputs } from '../state/app-state.ts';
import type { ParsedModel } from '../model/model-inputs.ts';
import { parseNumber } from '../model/model-inputs.ts';
import { type ClusterSpec, parseClusterSize } from '../../core/cluster/spec.ts';
import { parseSiteCsv } from '../../core/cluster/site-array.ts';
import type { EdResult } from '../../core/ed/exact-diagonalisation.ts';
import type { VmcRequest } from '../../core/vmc/variational-monte-carlo.ts';
import type { VmcResult } from '../../core/vmc/vmc-result.ts';
import type { SolveResult } from '../../core/meanfield/ground-state.ts';
import { variationalMonteCarloOnPool } from '../../../workers/vmc-chains.ts';
import type { EngineClient } from '../engine/engine-client.ts';
import { EngineTask } from '../controllers/engine-task.ts';
import { sharedStyles } from '../app/shared-styles.ts';
import { clusterFigure } from '../figures/cluster-figure.ts';
import { seriesFigure } from '../figures/series-figure.ts';
import { correlatedTable, comparisonRows } from './correlated-numbers.ts';
import { cliLine, modelFlags } from '../export/cli-command.ts';
import { downloadText } from '../export/download.ts';
import { pageCsvHeader } from '../export/page-state.ts';
import { PHASE_NAMES } from '../plot/phase-palette.ts';
import { inPageWords } from '../model/page-words.ts';
import '../app/figure-panel.ts';
import '../app/data-export.ts';
import '../app/limits-note.ts';
import { type LabPoint, labPointText, modelAtLabPoint } from '../state/lab-point.ts';
import { withLabNote } from '../figures/lab-point-mark.ts';
import type { RenderedFigure } from '../app/figure-panel.ts';
import { relayable } from '../export/print-layout.ts';
import type { QmcRequest, QmcResult } from '../../core/qmc/quantum-monte-carlo.ts';
import type { Estimate } from '../../core/vmc/binning.ts';
import { QmcTask, qmcProgressText } from '../controllers/qmc-task.ts';
import { qmcRows, qmcTable } from './qmc-numbers.ts';
import { vmcWarnings } from './qmc-reference.ts';
import { freeEnergyFigure } from '../figures/qmc-figures.ts';
import { arrayLattice } from '../../core/cluster/array-lattice.ts';
import { defaultMaxCell } from '../../core/model.ts';
import type { LatticeName } from '../../core/lattice/geometry.ts';

type Section = AppState['correlated'];
export type Correlated = { kind: 'ed'; r: EdResult } | { kind: 'vmc'; r: VmcResult };
/** What the view shows: an ED or VMC result, or a QMC one. */
type Shown = Correlated | { kind: 'qmc'; r: QmcResult };
interface Job {
  method: 'ed' | 'vmc' | 'qmc'; cluster: ClusterSpec; mu: number; delta?: number; alpha?: number; seed: number; steps: number; sweeps: number; chains: number;
  /** QMC: temperature (null: ground-state mode), sweeps per chain, chains, alpha grid points. */
  qmc?: { temperature: number | null; sweeps: number; chains: number; alphaPoints: number };
}

/** The QMC request of a job (the CLI's `qmc` builds the same from its flags). */
function qmcRequest(j: Job): QmcRequest {
  const q = j.qmc!;
  return {
    cluster: j.cluster, mu: j.mu, ...(j.alpha === undefined ? { delta: j.delta } : { alpha: j.alpha }),
    ...(q.temperature === null ? { ground: true } : { temperature: q.temperature }),
    sweeps: q.sweeps, chains: q.chains, seed: j.seed, alphaPoints: q.alphaPoints,
  };
}

/** The inputs that fix the physics (not the method's settings). */
function physicsKey(j: Job): string {
  return JSON.stringify([j.cluster, j.mu, j.delta, j.alpha]);
}

/** Sites as stored in the state: "x,y;x,y;..." (units of a). */
function sitesFromState(s: string): number[] {
  return s.split(';').filter(Boolean).flatMap((p) => p.split(',').map(Number));
}

export class CorrelatedView extends LitElement {
  static override properties = {
    section: { attribute: false }, model: { attribute: false }, inputs: { attribute: false }, engine: { attribute: false },
    labPoint: { attribute: false },
  };
  /** The lab's operating point: the cluster figure says whether this check is at it (null: none). */
  declare labPoint: LabPoint | null;
  declare section: Section;
  declare model: ParsedModel;
  declare inputs: ModelInputs;
  declare engine: EngineClient;
  private task = new EngineTask<Correlated>(this);
  private meanField = new EngineTask<SolveResult>(this);
  /** The lattice the mean-field column is for: the model's, an array's own, or null (no lattice). */
  private mfLattice: LatticeName | null = null;
  /** The QMC run (on the scan workers, through workers/qmc-run.ts like the CLI's qmc). */
  private qmc = new QmcTask(this, () => this.engine);
  /** The last ground-state QMC energy and the inputs it belongs to (the reference VMC is held against). */
  private lastQmc: { key: string; e: Estimate } | null = null;
  /** The cluster's sites, built in the interactive worker (the build's lattice sums never run on this thread). */
  private sites = new EngineTask<{ N: number; positions: number[] }>(this);
  /** The live optimisation trace of the running VMC. */
  private trace: VmcResult['trace'] = [];
  private problem: string | null = null;
  /** The last ED answer and the inputs it belongs to (drawn on the VMC trace as the exact bound). */
  private lastEd: { key: string; r: EdResult } | null = null;
  private job: Job | null = null;
  private uploadError: string | null = null;
  private size = new HostWidthController(this);

  static override styles = [sharedStyles, css`
    :host { display: block; }
    .controls { display: flex; flex-wrap: wrap; gap: 10px 16px; align-items: flex-end; margin-bottom: 8px; }
    .controls label { display: block; font-size: 13px; }
    .controls input { width: 90px; }
    .controls > div { min-width: 0; max-width: 100%; }
    .controls label, .controls select { max-width: 100%; }
    .grid { display: grid; grid-template-columns: repeat(auto-fit, minmax(420px, 1fr)); gap: 10px; }
    @media (max-width: 900px) { .grid { grid-template-columns: 1fr; } }
  `];


  private patch(p: Partial<Section>) {
    this.dispatchEvent(new CustomEvent('section-change', { detail: { section: 'correlated', patch: p }, bubbles: true, composed: true }));
  }

  /** The job the inputs describe, or the reason there is none. */
  private describe(): { job?: Job; error?: string } {
    const p = this.model.params;
    if (!p) return { error: 'The model has an invalid entry: showing the last good result.' };
    if (p.mu === undefined) return { error: 'The correlated check works at fixed \u03bc: set the pump as a chemical potential.' };
    const s = this.section;
    let cluster: ClusterSpec;
    try {
      if (s.cluster === 'array') {
        const positions = sitesFromState(s.sites);
        if (positions.length < 2) return { error: 'Upload a CSV of your array (x,y per line, units of a) or choose a periodic cluster.' };
        cluster = { kind: 'array', lattice: p.lattice, positions, interaction: p.interaction };
      } else {
        cluster = { kind: 'periodic', lattice: p.lattice, size: parseClusterSize(s.size), interaction: p.interaction };
      }
      // the site count without building the cluster (its Ewald sums belong in a worker)
      const N = cluster.kind === 'array' ? cluster.positions.length / 2 : cluster.size.reduce((a, b) => a * b, 1);
      if (s.method === 'ed' && N > 20) return { error: `exact diagonalisation is limited to 20 sites (2^N states); this cluster has ${N}` };
    } catch (e) {
      return { error: (e as Error).message };
    }
    const alphaText = s.alpha.trim();
    const alpha = alphaText === '' ? undefined : parseNumber(alphaText);
    if (alpha !== undefined && !(alpha >= 0)) return { error: `fixed \u03b1 must be a number >= 0, got "${alphaText}"` };
    const seed = parseNumber(s.seed), steps = parseNumber(s.steps), sweeps = parseNumber(s.samples);
    if (s.method === 'qmc') {
      const ground = s.ground === '1', temperature = parseNumber(s.temperature), qs = parseNumber(s.sweeps), qc = parseNumber(s.chains), ap = parseNumber(s.apoints);
      if (!ground && !(temperature > 0)) return { error: `QMC needs a temperature T > 0 (got "${s.temperature}"), or tick the ground state` };
      if (!Number.isInteger(seed) || !Number.isInteger(qs) || qs < 64 || !Number.isInteger(qc) || qc < 1 || qc > 64 || !Number.isInteger(ap) || ap < 4 || ap > 64) {
        return { error: 'QMC needs a whole-number seed, sweeps >= 64, chains from 1 to 64 and 4 to 64 α grid points' };
      }
      return {
        job: {
          method: 'qmc', cluster, mu: p.mu, ...(alpha === undefined ? { delta: p.delta } : { alpha }), seed, steps: 0, sweeps: 0, chains: qc,
          qmc: { temperature: ground ? null : temperature, sweeps: qs, chains: qc, alphaPoints: ap },
        },
      };
    }
    if (s.method === 'vmc' && (!Number.isInteger(seed) || !Number.isInteger(steps) || steps < 1 || !Number.isInteger(sweeps) || sweeps < 64)) {
      return { error: 'VMC needs a whole-number seed, steps >= 1 and samples >= 64' };
    }
    return {
      job: {
        method: s.method === 'vmc' ? 'vmc' : 'ed', cluster, mu: p.mu, ...(alpha === undefined ? { delta: p.delta } : { alpha }),
        seed, steps, sweeps, chains: this.engine?.workers ?? 1,
      },
    };
  }

  /** The job of the current inputs, described once an update (render reuses it). */
  private described: { job?: Job; error?: string } = {};

  override willUpdate() {
    this.described = this.describe();
    const { job } = this.described;
    if (!job || !this.engine) return;
    this.job = job;
    this.sites.run(JSON.stringify(job.cluster), (signal) => this.engine.call((r) => r.correlated.clusterSites(job.cluster), signal));
    const key = JSON.stringify(job);
    if (key !== this.problem) {
      this.problem = key;
      this.trace = [];
    }
    // the other methods' runs stop when the method changes (they share the scan workers)
    if (job.method !== 'qmc' && this.qmc.status === 'pending') this.qmc.cancel();
    if (job.method === 'qmc' && this.task.status === 'pending') this.task.abort();
    if (job.method === 'qmc') this.qmc.run(qmcRequest(job));
    else this.task.run(key, (signal) => (job.method === 'ed'
      ? this.engine.call((r) => r.correlated.ed({ cluster: job.cluster, mu: job.mu, alpha: job.alpha, delta: job.delta }), signal).then((r) => ({ kind: 'ed' as const, r }))
      : this.runVmc(job, signal).then((r) => ({ kind: 'vmc' as const, r }))));
    const p = this.model.params!;
    // An array is compared with the lattice it is cut from (not the form's), or with none.
    const lat = job.cluster.kind === 'array' ? arrayLattice(job.cluster.positions, p.lattice) : p.lattice;
    this.mfLattice = lat;
    if (lat === null) { this.meanField.abort(); return; }
    const mf = { params: { ...p, lattice: lat, maxCell: lat === p.lattice ? p.maxCell : defaultMaxCell(lat), T: job.qmc?.temperature ?? 0 } };
    this.meanField.run(JSON.stringify(mf), (signal) => this.engine.call((r) => r.meanfield.solve(mf), signal));
  }

  /** The cluster figure with the lab point named on it, and whether the model's point lies in its box. */
  private labNote(fig: RenderedFigure): RenderedFigure {
    const lab = this.labPoint;
    return lab ? withLabNote(fig, labPointText(lab), modelAtLabPoint(lab, this.model.params)) : fig;
  }

  override updated() {
    const qmc = this.job?.method === 'qmc';
    this.dataset.status = qmc ? this.qmc.status : this.task.status;
    this.dataset.method = qmc ? (this.qmc.value ? 'qmc' : '') : this.task.value?.kind ?? '';
    this.dataset.lab = this.labPoint ? (modelAtLabPoint(this.labPoint, this.model.params) ? 'at' : 'away') : '';
    const v = this.task.value;
    if (v?.kind === 'ed' && this.job?.method === 'ed' && this.task.status === 'complete') this.lastEd = { key: physicsKey(this.job), r: v.r };
    const q = this.qmc.value;
    if (qmc && q && this.qmc.status === 'complete' && q.temperature === null) this.lastQmc = { key: physicsKey(this.job!), e: q.energyPerSite };
  }

  private runVmc(job: Job, signal: AbortSignal): Promise<VmcResult> {
    const req: VmcRequest = {
      cluster: job.cluster, mu: job.mu, alpha: job.alpha, delta: job.delta, seed: job.seed, chains: job.chains,
      ansatz: { oneBody: 'site' }, steps: job.steps, sweeps: job.sweeps,
    };
    let pending = false;
    return variationalMonteCarloOnPool(req, this.engine.scanPool, { signal, onStep: (t) => {
      if (signal.aborted) return;
      this.trace = [...this.trace, t];
      if (!pending) { pending = true; setTimeout(() => { pending = false; this.requestUpdate(); }, 120); }
    } });
  }

  private async upload(e: Event) {
    const file = (e.target as HTMLInputElement).files?.[0];
    if (!file) return;
    try {
      const spacing = parseNumber((this.renderRoot.querySelector('#cr-spacing') as HTMLInputElement | null)?.value ?? '');
      const pos = parseSiteCsv(await file.text(), Number.isFinite(spacing) ? spacing : undefined);
      this.uploadError = null;
      const pairs: string[] = [];
      for (let i = 0; i < pos.length; i += 2) pairs.push(`${+pos[i].toFixed(6)},${+pos[i + 1].toFixed(6)}`);
      this.patch({ cluster: 'array', sites: pairs.join(';') });
    } catch (err) {
      this.uploadError = (err as Error).message;
      this.requestUpdate();
    }
  }

  private command(job: Job): string {
    const flags = modelFlags(this.inputs).filter((_, i, a) => !['--detuning', '--mu', '--temperature', '--max-cell', '--density'].includes(a[i - (i % 2)]));
    const cluster = job.cluster.kind === 'array' ? ['--sites', 'sites.csv'] : ['--size', this.section.size.trim()];
    const photon = job.alpha !== undefined ? ['--alpha', String(job.alpha)] : ['--detuning', String(job.delta)];
    const q = job.qmc;
    const run = job.method === 'vmc' ? ['--seed', String(job.seed), '--workers', String(job.chains), '--steps', String(job.steps), '--sweeps', String(job.sweeps), '--one-body', 'site']
      : q ? [...(q.temperature === null ? ['--ground'] : ['--temperature', String(q.temperature)]), '--sweeps', String(q.sweeps), '--chains', String(q.chains),
        '--alpha-points', String(q.alphaPoints), '--seed', String(job.seed), '--workers', String(this.engine?.workers ?? 1)] : [];
    return cliLine(job.method, [...flags, ...cluster, '--mu', String(job.mu), ...photon, ...run, '--json']);
  }

  private field(key: keyof Section, label: string, width = 90) {
    return html`<div><label for="cr-${key}">${label}</label>
      <input id="cr-${key}" name="correlated-${key}" style="width:${width}px" .value=${this.section[key]}
        @input=${(e: Event) => this.patch({ [key]: (e.target as HTMLInputElement).value })}></div>`;
  }

  /** The result to show: the active method's (QMC has its own controller). */
  private shown(): Shown | undefined {
    if (this.section.method !== 'qmc') return this.task.value;
    const r = this.qmc.value;
    return r ? { kind: 'qmc', r } : undefined;
  }

  override render() {
    const s = this.section;
    const { error } = this.described;
    const v = this.shown();
    const isQmc = s.method === 'qmc';
    const status = isQmc ? this.qmc.status : this.task.status;
    const runError = isQmc ? this.qmc.error : this.task.error;
    const mf = this.mfLattice === null ? undefined : this.meanField.value;
    const w = Math.max(340, Math.min(560, (this.size.width - 10) / (this.size.width > 900 ? 2 : 1)));
    const job = this.job;
    const positions = job && this.sites.valueKey === JSON.stringify(job.cluster) && this.sites.value ? Float64Array.from(this.sites.value.positions) : null;
    // QMC on a torus averages over translations: every site has <n> = the density
    const dens = v ? (v.kind === 'ed' ? v.r.siteDensities : v.kind === 'vmc' ? v.r.siteDensities.map((e) => e.value)
      : v.r.siteDensities?.map((e) => e.value) ?? new Array<number>(v.r.sites).fill(v.r.density.value)) : null;
    const trace = v?.kind === 'vmc' && this.task.status !== 'pending' ? v.r.trace : this.trace;
    return html`
      <div class="controls">
        <div><label for="cr-method">Method</label>
          <select id="cr-method" name="correlated-method" @change=${(e: Event) => this.patch({ method: (e.target as HTMLSelectElement).value })}>
            <option value="ed" ?selected=${s.method !== 'vmc'}>exact diagonalisation (Lanczos)</option>
            <option value="vmc" ?selected=${s.method === 'vmc'}>variational Monte Carlo (Jastrow)</option>
            <option value="qmc" ?selected=${isQmc}>quantum Monte Carlo (SSE): unbiased reference, any T</option></select></div>
        <div><label for="cr-cluster">Sites</label>
          <select id="cr-cluster" name="correlated-cluster" @change=${(e: Event) => this.patch({ cluster: (e.target as HTMLSelectElement).value })}>
            <option value="periodic" ?selected=${s.cluster !== 'array'}>periodic cluster of the lattice</option>
            <option value="array" ?selected=${s.cluster === 'array'}>my array (CSV)</option></select></div>
        ${s.cluster === 'array'
          ? html`<div><label for="cr-file">Array file (x and y per line: comma, semicolon or space)</label><input id="cr-file" type="file" accept=".csv,text/csv,text/plain" style="width:220px" @change=${this.upload}></div>
              <div><label for="cr-spacing">coordinates in \u00b5m: spacing a</label><input id="cr-spacing" name="correlated-spacing" placeholder="units of a"></div>`
          : this.field('size', 'Cluster size L (ring) or Lx x Ly (e.g. 4x4)')}
        ${this.field('alpha', '\u03b1 fixed (empty: self-consistent)', 150)}
        ${s.method === 'vmc' ? html`${this.field('seed', 'Seed')} ${this.field('steps', 'SR steps')} ${this.field('samples', 'Samples (sweeps)')}` : nothing}
        ${isQmc ? this.qmcFields() : nothing}
        <div aria-live="polite" class="run-status">${status === 'pending' ? html`<span class="running">running\u2026${isQmc ? ' ' + qmcProgressText(this.qmc.progress) : ''}</span>
          <button class="cancel" @click=${() => (isQmc ? this.qmc.cancel() : this.task.abort())}>Cancel</button>`
          : isQmc && this.qmc.cancelled ? html`<span class="muted">QMC run cancelled</span> <button class="rerun" @click=${() => this.qmc.rerun()}>Run QMC</button>` : nothing}</div>
      </div>
      <p class="muted trust">Which to trust: quantum Monte Carlo (stochastic series expansion) samples the cluster without bias at any T;
        its error bars are statistical only, so it is the reference. ED is exact but limited to 20 sites at T = 0; VMC is a variational
        bound, as good as its ansatz and its optimisation, and is checked against the others below.</p>
      ${this.labPoint ? html`<p class="lab-note">${modelAtLabPoint(this.labPoint, this.model.params) ? 'This check is at the lab point' : 'This check is NOT at the lab point'}
        (${labPointText(this.labPoint)}, \u00b11\u03c3 box; the cluster is at the model's \u03bc and \u03b4).</p>` : nothing}
      ${error ? html`<p class="err" role="alert">${inPageWords(error)}</p>` : nothing}
      ${this.uploadError ? html`<p class="err" role="alert">${inPageWords(this.uploadError)}</p>` : nothing}
      ${runError ? html`<p class="err" role="alert">${inPageWords(runError)}</p>` : nothing}
      ${v?.kind === 'vmc' && this.task.status === 'complete' ? this.vmcVerdict(v.r, mf) : nothing}
      ${v?.kind === 'qmc' && v.r.notes.length ? html`<ul class="caution qmc-notes" aria-label="QMC notes">${v.r.notes.map((n) => html`<li>${n}</li>`)}</ul>` : nothing}
      <div class="grid">
        ${positions ? html`<figure-panel class="cluster" .figure=${this.labNote(relayable((W, H) => clusterFigure(positions, dens, job!.cluster.kind === 'periodic', W, H), w, this.model.params?.lattice === 'chain' && job!.cluster.kind === 'periodic' ? 170 : 300, 300, 120))}></figure-panel>` : nothing}
        <div>${this.comparison(v, mf)}</div>
        ${trace.length ? this.traceFigure(trace, mf, w) : nothing}
        ${v ? this.correlationFigures(v, w) : nothing}
        ${v?.kind === 'qmc' ? this.freeEnergy(v.r, w) : nothing}
      </div>
      <limits-note lattice=${this.model.params?.lattice ?? this.inputs.lattice} temperature=${isQmc ? job?.qmc?.temperature ?? 0 : 0}></limits-note>
      ${v && job ? html`<data-export class="correlated-export" .table=${v.kind === 'qmc' ? qmcTable(v.r) : correlatedTable(v)} .json=${v.r} name=${v.kind} .command=${this.command(job)}></data-export>
        ${job.cluster.kind === 'array' ? html`<button @click=${() => downloadText(pageCsvHeader('sites of the uploaded array, in lattice spacings') + 'x,y\n' + s.sites.split(';').join('\n') + '\n', 'sites.csv', 'text/csv')}>Save sites.csv for the command</button>` : nothing}` : nothing}`;
  }

  /** The optimisation trace; the first quarter of the steps (far above) is left out of the y range. */
  private traceFigure(trace: VmcResult['trace'], mf: SolveResult | undefined, w: number) {
    const refs: { axis: 'y'; value: number; label: string; stroke: string; dash?: string }[] = [];
    if (mf) refs.push({ axis: 'y', value: mf.grandPotential, label: 'mean-field \u03a9', stroke: '#b57a10' });
    if (this.lastEd && this.job && this.lastEd.key === physicsKey(this.job)) refs.push({ axis: 'y', value: this.lastEd.r.energyPerSite, label: 'ED (exact)', stroke: '#1d2430', dash: '2 2' });
    const tail = trace.slice(Math.floor(trace.length / 4));
    const ys = [...tail.flatMap((t) => [t.energyPerSite - t.error, t.energyPerSite + t.error]), ...refs.map((r) => r.value)];
    const lo = Math.min(...ys), hi = Math.max(...ys), pad = (hi - lo) * 0.08 || 1e-3;
    return html`<figure-panel class="trace" .figure=${relayable((width, height) => seriesFigure({
      id: 'trace', name: 'vmc-trace', title: 'VMC optimisation trace: energy per site against step', width, height,
      series: [{ label: 'VMC e per step', x: trace.map((t) => t.step), y: trace.map((t) => t.energyPerSite), err: trace.map((t) => t.error), stroke: '#3a3f9e', points: true }],
      refs, x: { label: 'stochastic-reconfiguration step' }, y: { label: 'energy per site (g)' },
      xDomain: [0, Math.max(1, trace[trace.length - 1].step)], yDomain: [lo - pad, hi + pad],
    }), w, 300)}></figure-panel>`;
  }

  /** QMC entries: temperature or the ground state, sweeps, chains, alpha grid, seed. */
  private qmcFields() {
    const ground = this.section.ground === '1';
    return html`${ground ? nothing : this.field('temperature', 'Temperature T (g)')}
      <div><label><input type="checkbox" name="correlated-ground" .checked=${ground}
        @change=${(e: Event) => this.patch({ ground: (e.target as HTMLInputElement).checked ? '1' : '' })}> ground state (\u03b2 doubled to convergence)</label></div>
      ${this.field('sweeps', 'Sweeps per chain')} ${this.field('chains', 'Chains')} ${this.field('apoints', '\u03b1 grid points')} ${this.field('seed', 'Seed')}`;
  }

  /** Issue 11 item 7: VMC held against ED, ground-state QMC and mean field of the same inputs. */
  private vmcVerdict(r: VmcResult, mf: SolveResult | undefined) {
    const key = this.job ? physicsKey(this.job) : '';
    const comparable = this.job?.alpha === undefined;
    const warnings = vmcWarnings(r, {
      ed: this.lastEd?.key === key ? this.lastEd.r.energyPerSite : undefined,
      qmc: this.lastQmc?.key === key ? this.lastQmc.e : undefined,
      meanField: comparable && mf ? mf.grandPotential : undefined,
    });
    return warnings.length ? html`<div class="caution vmc-warnings" role="alert">${warnings.map((t) => html`<p>\u26a0 ${t}</p>`)}</div>` : nothing;
  }

  private freeEnergy(r: QmcResult, w: number) {
    const fig = freeEnergyFigure(r, w);
    // laid out again at a print width on export (its height is its own)
    return fig ? html`<figure-panel class="qmc-f" .figure=${{ ...fig, layout: (W: number) => freeEnergyFigure(r, Math.max(300, W)) ?? fig }}></figure-panel>` : nothing;
  }

  private comparison(v: Shown | undefined, mf: SolveResult | undefined) {
    if (v?.kind === 'qmc') return this.table('QMC (cluster, unbiased)', qmcRows(v.r, mf), mf, v.r.temperature ?? 0);
    return this.table(v?.kind === 'vmc' ? 'VMC (cluster)' : 'ED (cluster)', comparisonRows(v, mf, this.job?.alpha !== undefined), mf, 0);
  }

  private table(method: string, rows: [string, string, string][], mf: SolveResult | undefined, T: number) {
    return html`<table class="comparison" aria-label="Correlated result beside mean field">
      <thead><tr><th class="l">quantity</th><th>${method}</th><th>${this.mfLattice === null ? 'no mean field: the array is no lattice of spacing a' : `mean field (infinite ${this.mfLattice} lattice)`}</th></tr></thead>
      <tbody>${rows.map(([k, a, b]) => html`<tr><th class="l" scope="row">${k}</th><td>${a}</td><td>${b}</td></tr>`)}</tbody>
      <caption class="muted" style="caption-side: bottom; text-align: left">${mf ? `mean field: ${PHASE_NAMES[mf.phase]}${mf.fraction ? ' ' + mf.fraction : ''}, M = ${mf.cellSize}, at T = ${T}` : ''}</caption>
    </table>`;
  }

  private correlationFigures(v: Shown, w: number) {
    const sk = v.kind === 'ed' ? v.r.structureFactor.map((p) => ({ ...p, error: 0 })) : v.r.structureFactor;
    const oneD = sk.every((p) => p.k[1] === 0);
    const kx = sk.map((p) => (oneD ? p.k[0] : Math.hypot(p.k[0], p.k[1])));
    const order = kx.map((_, i) => i).sort((a, b) => kx[a] - kx[b]);
    const cr = v.kind === 'ed' ? v.r.correlation.map((p) => ({ ...p, error: 0 })) : v.r.correlation;
    return html`
      <figure-panel class="sk" .figure=${relayable((width, height) => seriesFigure({
        id: 'sk', name: 'structure-factor', title: 'Connected structure factor S(k) = (\u27e8|n_k|\u00b2\u27e9 \u2212 |\u27e8n_k\u27e9|\u00b2)/N on the cluster momenta', width, height,
        series: [{ label: `S(k) connected, ${v.kind.toUpperCase()}`, x: order.map((i) => kx[i]), y: order.map((i) => sk[i].value), err: order.map((i) => sk[i].error), stroke: '#8e1f2c', points: true, noLine: true }],
        x: { label: oneD ? 'k (1/a)' : '|k| (1/a)' }, y: { label: 'S(k) (per site)' },
      }), w, 280)}></figure-panel>
      <figure-panel class="cr" .figure=${relayable((width, height) => seriesFigure({
        id: 'cr', name: 'density-correlation', title: 'Density correlation C(r) on the distance shells', width, height,
        series: [{ label: `C(r), ${v.kind.toUpperCase()}`, x: cr.map((p) => p.r), y: cr.map((p) => p.value), err: cr.map((p) => p.error), stroke: '#2f7f78', points: true }],
        refs: [{ axis: 'y', value: 0, label: 'uncorrelated', stroke: '#7d8798', dash: '2 2' }],
        x: { label: 'distance r (a)' }, y: { label: 'C(r) = \u27e8n\u1d62n\u2c7c\u27e9 \u2212 \u27e8n\u1d62\u27e9\u27e8n\u2c7c\u27e9' },
      }), w, 280)}></figure-panel>`;
  }
}
customElements.define('correlated-view', CorrelatedView);

declare global { interface HTMLElementTagNameMap { 'correlated-view': CorrelatedView } }
