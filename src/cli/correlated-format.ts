/**
 * How the correlated commands print: JSON objects for programs (every field of the result,
 * the input echoed, structure-factor momenta as a number on a ring and [kx, ky] otherwise),
 * short tables for people. VMC values carry their errors as { value, error }.
 */
import type { ClusterSpec } from '../core/cluster/spec.ts';
import type { EdResult } from '../core/ed/exact-diagonalisation.ts';
import type { VmcResult } from '../core/vmc/vmc-result.ts';
import { clusterLabel } from './cluster-flags.ts';

type Momentum = { k: [number, number] };
type Estimate = { value: number; error: number };

/** k as a number on a periodic ring, else [kx, ky]. */
function momenta<T extends Momentum>(c: ClusterSpec, points: T[]): (Omit<T, 'k' | 'm'> & { k: number | [number, number] })[] {
  const ring = c.kind === 'periodic' && c.lattice === 'chain';
  return points.map(({ k, m: _m, ...rest }: T & { m?: unknown }) => ({ k: ring ? k[0] : k, ...rest }));
}

/** The input as JSON-safe data (positions of an array left out; their count kept). */
export function clusterJson(c: ClusterSpec): Record<string, unknown> {
  const interaction = { ...c.interaction };
  if (interaction.rmax === Infinity) delete interaction.rmax;
  return c.kind === 'array' ? { kind: 'array', lattice: c.lattice, sites: c.positions.length / 2, interaction } : { ...c, interaction };
}

export function edJson(c: ClusterSpec, r: EdResult): Record<string, unknown> {
  const orderParameter = r.orderParameter && momenta(c, [r.orderParameter])[0];
  return { ...r, cluster: clusterJson(c), structureFactor: momenta(c, r.structureFactor), orderParameter };
}

export function vmcJson(c: ClusterSpec, r: VmcResult): Record<string, unknown> {
  const orderParameter = r.orderParameter && momenta(c, [r.orderParameter])[0];
  return { ...r, cluster: clusterJson(c), structureFactor: momenta(c, r.structureFactor), orderParameter };
}

const f = (x: number, d = 6) => (Math.abs(x) < 1e-13 ? '0' : Number(x.toFixed(d)).toString());
const pm = (e: Estimate, d = 6) => `${f(e.value, d)} +- ${Number(e.error.toPrecision(2))}`;
const kLabel = (k: [number, number], ring: boolean) => (ring ? f(k[0], 4) : `(${f(k[0], 4)}, ${f(k[1], 4)})`);

/** Photon line: fixed or self-consistent alpha, and the grand potential when delta is known. */
function photonLine(selfConsistent: boolean, alpha: string, delta: number | null): string {
  return selfConsistent ? `alpha ${alpha} (self-consistent, detuning ${delta})` : `alpha ${alpha} (fixed${delta === null ? '' : `, detuning ${delta}`})`;
}

export function edText(c: ClusterSpec, r: EdResult): string {
  const ring = c.kind === 'periodic' && c.lattice === 'chain';
  const peak = r.structureFactor.filter((p) => p.m[0] !== 0 || p.m[1] !== 0).sort((a, b) => b.value - a.value)[0];
  const lines = [
    `exact diagonalisation: ${clusterLabel(c)}, ${r.dimension} states (${r.basis} basis)`,
    `  mu ${r.mu}, ${photonLine(r.selfConsistent, f(r.alpha, 8), r.delta)}`,
    `  energy per site      ${f(r.energyPerSite, 10)}${r.selfConsistent ? '   (e = (delta-mu) alpha^2 + E0/N)' : '   (<H(alpha)>/N)'}`,
    r.grandPotentialPerSite !== null && !r.selfConsistent ? `  grand potential      ${f(r.grandPotentialPerSite, 10)}` : '',
    `  density <n>          ${f(r.density)}     photon alpha^2 ${f(r.photonDensity)}     <sigma^x> ${f(r.sigmaX)}`,
    peak ? `  S(k) peak            S(${kLabel(peak.k, ring)}) = ${f(peak.value)}` : '',
    r.orderParameter ? `  density-wave order   m^2 = ${f(r.orderParameter.value)} at k = ${kLabel(r.orderParameter.k, ring)}   (<|n_k|^2>/N^2)` : '',
    `  site densities       ${r.siteDensities.map((x) => f(x, 4)).join(' ')}`,
    `  C(r)                 ${r.correlation.slice(0, 8).map((p) => `${f(p.r, 3)}:${f(p.value, 4)}`).join('  ')}`,
    `  Lanczos              ${r.lanczos.iterations} steps, residual ${r.lanczos.residual.toExponential(1)}, ${r.lanczos.evaluations} ground-state solves`,
  ];
  return lines.filter(Boolean).join('\n') + '\n';
}

export function vmcText(c: ClusterSpec, r: VmcResult): string {
  const ring = c.kind === 'periodic' && c.lattice === 'chain';
  const peak = r.structureFactor.filter((p) => p.m[0] !== 0 || p.m[1] !== 0).sort((a, b) => b.value - a.value)[0];
  const last = r.trace[r.trace.length - 1];
  const lines = [
    `variational Monte Carlo: ${clusterLabel(c)}, ${r.chains} chain(s), seed ${r.seed}, ${r.samples} measured sweeps`,
    `  mu ${r.mu}, ${photonLine(r.selfConsistent, r.selfConsistent ? pm(r.alpha, 6) : f(r.alpha.value, 8), r.delta)}`,
    `  energy per site      ${pm(r.energyPerSite, 8)}${r.selfConsistent ? '   (e = (delta-mu) alpha^2 + <H>/N)' : '   (<H(alpha)>/N)'}`,
    `  density <n>          ${pm(r.density)}     <sigma^x> ${pm(r.sigmaX)}`,
    peak ? `  S(k) peak            S(${kLabel(peak.k, ring)}) = ${pm(peak)}` : '',
    r.orderParameter ? `  density-wave order   m^2 = ${pm(r.orderParameter)} at k = ${kLabel(r.orderParameter.k, ring)}   (<|n_k|^2>/N^2)` : '',
    `  site densities       ${r.siteDensities.map((x) => f(x.value, 3)).join(' ')}`,
    `  C(r)                 ${r.correlation.slice(0, 6).map((p) => `${f(p.r, 3)}:${f(p.value, 4)}`).join('  ')}`,
    `  acceptance ${f(r.acceptance, 3)}, tau_int ${f(r.tauInt, 2)} sweeps; optimisation ${r.trace.length} steps${last ? `, last step e = ${f(last.energyPerSite)}` : ''}`,
    '  (a variational upper bound: compare with ed on clusters up to 20 sites)',
  ];
  return lines.filter(Boolean).join('\n') + '\n';
}
