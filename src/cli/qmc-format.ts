/**
 * How `qmc` prints: JSON with every field of the result (values as { value, error }, the
 * structure factor as [{ k, m, value, error }] with k a number on a ring and [kx, ky]
 * otherwise, the input under `params`), or a short table for people with the f(alpha)
 * scan of a self-consistent run and the notes (equilibration, autocorrelation, the
 * finite-cluster caveats).
 */
import type { ClusterSpec } from '../core/cluster/spec.ts';
import type { QmcResult } from '../core/qmc/quantum-monte-carlo.ts';
import type { QmcRequest } from '../core/qmc/quantum-monte-carlo.ts';
import { clusterJson } from './correlated-format.ts';
import { clusterLabel } from './cluster-flags.ts';

type Estimate = { value: number; error: number };
type WithK = { k: [number, number] };

const isRing = (c: ClusterSpec) => c.kind === 'periodic' && c.lattice === 'chain';
const f = (x: number, d = 6) => (Math.abs(x) < 1e-13 ? '0' : Number(x.toFixed(d)).toString());
/** value +- error, the value to the error's second significant digit (at most d decimals). */
export const pm = (e: Estimate | null, d = 6): string => {
  if (!e || !Number.isFinite(e.value)) return 'n/a';
  if (!(e.error > 0)) return `${f(e.value, d)} +- 0`;
  const dec = Math.min(d, Math.max(0, 1 - Math.floor(Math.log10(e.error))));
  return `${e.value.toFixed(dec)} +- ${Number(e.error.toPrecision(2))}`;
};
const kText = (k: [number, number], ring: boolean) => (ring ? f(k[0], 4) : `(${f(k[0], 4)}, ${f(k[1], 4)})`);

/** The result as JSON-safe data, the request under params. */
export function qmcJson(c: ClusterSpec, r: QmcResult, req: QmcRequest, workers: number): Record<string, unknown> {
  const ring = isRing(c);
  const withK = <T extends WithK>(p: T) => ({ ...p, k: ring ? p.k[0] : p.k });
  const { cluster: _c, ...run } = req;
  return {
    ...r,
    structureFactor: r.structureFactor.map(withK),
    orderParameter: r.orderParameter && withK(r.orderParameter),
    params: { cluster: clusterJson(c), ...run, workers },
  };
}

/** The f(alpha) table of a self-consistent run, the global minimum marked. */
function alphaTable(r: QmcResult): string[] {
  if (!r.alphaScan) return [];
  const best = r.alphaScan.reduce((b, p, i, a) => (p.f.value < a[b].f.value ? i : b), 0);
  return [
    '  f(alpha) - f(0) per site = (delta - mu) alpha^2 - int_0^alpha <sigma^x>:',
    `    ${'alpha'.padEnd(10)} ${'<sigma^x>'.padEnd(20)} f(alpha) - f(0)`,
    ...r.alphaScan.map((p, i) => `    ${f(p.alpha, 5).padEnd(10)} ${pm(p.sigmaX, 5).padEnd(20)} ${pm(p.f, 6)}${i === best ? '   <- global minimum' : ''}`),
    r.minima && r.minima.length > 1 ? `  local minima of f at alpha = ${r.minima.map((m) => f(m.alpha, 4)).join(', ')}` : '',
    r.condensateThreshold ? `  the condensate wins for delta - mu < ${pm(r.condensateThreshold.deltaMinusMu, 4)} at this mu and T (alpha jumps to ${f(r.condensateThreshold.alpha, 3)} there)` : '',
  ];
}

export function qmcText(c: ClusterSpec, r: QmcResult, workers: number): string {
  const ring = isRing(c);
  const peak = r.structureFactor.filter((p) => p.m[0] !== 0 || p.m[1] !== 0).sort((a, b) => b.value - a.value)[0];
  const temp = r.ground
    ? `ground state (beta ${r.ground.betas.join(' -> ')}${r.ground.converged ? ', converged' : ', NOT converged'})`
    : `T ${r.temperature} (beta ${f(r.beta, 6)})`;
  const photon = r.selfConsistent ? `alpha ${pm(r.alpha)} (self-consistent, detuning ${r.delta})` : `alpha ${f(r.alpha.value, 8)} (fixed${r.delta === null ? '' : `, detuning ${r.delta}`})`;
  const tau = r.autocorrelation;
  const lines = [
    `quantum Monte Carlo (SSE): ${clusterLabel(c)}, ${temp}`,
    `  ${r.chains} chain(s) x ${r.sweeps} sweeps (+${r.thermalization} thermalisation) per alpha point, ${workers} worker(s)`,
    `  mu ${r.mu}, ${photon}`,
    `  energy per site      ${pm(r.energyPerSite, 8)}${r.selfConsistent ? '   (e = (delta-mu) alpha^2 + <H(alpha)>/N)' : '   (<H(alpha)>/N)'}`,
    `  density <n>          ${pm(r.density)}     <sigma^x> ${pm(r.sigmaX)}     photon alpha^2 ${pm(r.photonDensity)}`,
    `  compressibility      ${pm(r.compressibility)}   (d<n>/dmu)`,
    peak ? `  S(k) peak            S(${kText(peak.k, ring)}) = ${pm(peak)}` : '',
    r.orderParameter ? `  order parameter      m^2 = ${pm(r.orderParameter)} at k = ${kText(r.orderParameter.k, ring)}   Binder U = ${pm(r.binder, 4)}` : '',
    `  phase                ${r.phase}   (finite-cluster label)`,
    `  C(r)                 ${r.correlation.slice(0, 6).map((p) => `${f(p.r, 3)}:${pm(p, 4)}`).join('  ')}`,
    r.siteDensities ? `  site densities       ${r.siteDensities.map((x) => f(x.value, 3)).join(' ')}` : '',
    `  tau_int (sweeps)     energy ${f(tau.energy, 1)}, density ${f(tau.density, 1)}, sigma^x ${f(tau.sigmaX, 1)};` +
      ` drift between halves ${f(r.drift.energy.sigmas, 1)}, ${f(r.drift.density.sigmas, 1)}, ${f(r.drift.sigmaX.sigmas, 1)} sigma`,
    `  operators            ${f(r.meanOperators, 1)} on average, cutoff ${r.cutoff}`,
    ...alphaTable(r),
    ...r.notes.map((n) => `  note: ${n}`),
  ];
  return lines.filter(Boolean).join('\n') + '\n';
}
