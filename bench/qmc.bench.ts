/**
 * Quantum Monte Carlo (issue 8), every figure measured side by side in this run, in CPU
 * seconds of this process (other load on the machine inflates both sides alike):
 *  1. Sweeps per second and nanoseconds per operator slot of the stochastic series expansion
 *     on a 256-site nearest-neighbour chain at beta = 16 (V1 = 1, mu = 1, alpha = 0.25: the
 *     transverse-field Ising point J = h = 1/4), against bench/native/tfim-chain-sse.c, a
 *     plain single-thread C implementation of the same sweep (diagonal plus multibranch
 *     cluster update) compiled here with cc -O2 (skipped, with a note, without a compiler).
 *     Our sweep also runs the line updates the C code lacks.
 *  2. The same chain with full-range van der Waals couplings (every pair, O(1) bond draws
 *     from the alias table): cost per operator over the nearest-neighbour chain.
 *  3. A 32 x 32 square torus, vdW with range 3.
 *  4. Energy error reached per CPU-second by QMC against VMC on the same 64-site vdW ring at
 *     low temperature (QMC at beta = 32, VMC the ground-state variational run), as the ratio of
 *     1 / (error^2 x CPU seconds), the usual Monte Carlo efficiency.
 *  5. Two workers over one: the same self-consistent run (two chains) on pools of 1 and 2.
 *  6. Wall time on two workers to locate the T = 0 crystal-to-condensate transition of the
 *     nearest-neighbour chain at mu = V1 with the cavity to +-0.01 in delta - mu (one
 *     self-consistent run: the threshold max I(alpha)/alpha^2 of its f(alpha) curve).
 *  --quick shortens every run.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { ClusterSpec } from '../src/core/cluster/spec.ts';
import { qmcGeometry } from '../src/core/qmc/qmc-geometry.ts';
import { runSseChain, type SseChainRequest } from '../src/core/qmc/sse-chain.ts';
import { quantumMonteCarlo } from '../src/core/qmc/quantum-monte-carlo.ts';
import { variationalMonteCarlo } from '../src/core/vmc/variational-monte-carlo.ts';
import type { Bench, BenchContext } from './harness.ts';
import { poolFigures } from './qmc-pool.ts';

const cpu = () => { const u = process.cpuUsage(); return (u.user + u.system) / 1e6; };
const chain = (shape: 'nn' | 'vdw'): ClusterSpec =>
  ({ kind: 'periodic', lattice: 'chain', size: [256], interaction: shape === 'nn' ? { shape: 'nn', V1: 1 } : { shape: 'vdw', V1: 1 } });

/** Sweeps per CPU second and ns per slot of one chain after a warm-up run. */
function sweepRate(cluster: ClusterSpec, mu: number, alpha: number, beta: number, sweeps: number) {
  const g = qmcGeometry(cluster);
  const req: SseChainRequest = { cluster, mu, alpha, beta, thermalization: Math.ceil(sweeps / 5), sweeps: 16, bins: 4, seed: 1, chain: 0 };
  runSseChain(req, g);
  const t0 = cpu();
  const r = runSseChain({ ...req, sweeps, bins: 8 }, g);
  const s = cpu() - t0, total = req.thermalization + sweeps;
  return { rate: total / s, nsSlot: (1e9 * s) / (total * r.cutoff), nsOp: (1e9 * s) / (total * r.meanOperators), slots: r.cutoff, ops: r.meanOperators };
}

/** The C reference's sweeps per CPU second, or null without a compiler. */
function nativeRate(sweeps: number): { rate: number; nsSlot: number } | null {
  const src = fileURLToPath(new URL('./native/tfim-chain-sse.c', import.meta.url));
  const exe = join(mkdtempSync(join(tmpdir(), 'atlas-bench-')), 'tfim');
  try { execFileSync('cc', ['-O2', '-o', exe, src], { stdio: 'ignore' }); } catch { return null; }
  const [measured, seconds, L] = execFileSync(exe, ['256', '16', '0.25', '0.25', String(sweeps), '1']).toString().trim().split(' ').map(Number);
  return { rate: measured / seconds, nsSlot: (1e9 * seconds) / (measured * L) };
}

async function run(ctx: BenchContext): Promise<void> {
  const quick = ctx.flag('quick');
  const sweeps = quick ? 600 : 3000;
  const c = nativeRate(5 * sweeps);
  const nn = sweepRate(chain('nn'), 1, 0.25, 16, sweeps);
  ctx.figure('nn chain N=256 beta=16: sweeps per CPU second', nn.rate, 'sweeps/s');
  ctx.figure('nn chain: time per operator slot per sweep', nn.nsSlot, 'ns', { note: `(${nn.slots} slots, ${nn.ops.toFixed(0)} operators)` });
  if (c) {
    ctx.figure('native C reference, same chain: sweeps per CPU second', c.rate, 'sweeps/s', { note: `${c.nsSlot.toFixed(0)} ns per slot` });
    ctx.figure('C sweeps/s over ours (per worker)', c.rate / nn.rate, 'x', { target: '<= 2' });
  } else ctx.log('no C compiler (cc): the native reference was skipped');
  const vdw = sweepRate(chain('vdw'), 1, 0.25, 16, sweeps);
  ctx.figure('vdW full-range chain N=256 beta=16: sweeps per CPU second', vdw.rate, 'sweeps/s', { note: `${vdw.nsOp.toFixed(0)} ns per operator` });
  ctx.figure('cost per operator, full range over nearest neighbour', vdw.nsOp / nn.nsOp, 'x', { target: '< 3' });
  const sq = sweepRate({ kind: 'periodic', lattice: 'square', size: [32, 32], interaction: { shape: 'vdw', V1: 1, rmax: 3 } }, 2, 0.3, 4, quick ? 100 : 400);
  ctx.figure('square 32x32 vdW range 3 beta=4: sweeps per CPU second', sq.rate, 'sweeps/s', { note: `${sq.nsOp.toFixed(0)} ns per operator, ${sq.ops.toFixed(0)} operators` });

  // 4. Efficiency against VMC. VMC's statistical error is small (a near-eigenstate ansatz) but
  // its bias does not shrink with time; QMC has no bias. Figures: the statistical efficiency
  // 1/(error^2 CPU-second) of each, and the CPU time QMC needs to reach VMC's total error
  // |e_VMC - e_QMC| (its bias against the unbiased answer) over VMC's own time.
  const ring: ClusterSpec = { kind: 'periodic', lattice: 'chain', size: [64], interaction: { shape: 'vdw', Rb: 1.2 } };
  let t0 = cpu();
  const q = quantumMonteCarlo({ cluster: ring, mu: 1.5, alpha: 0.3, temperature: 1 / 32, sweeps: quick ? 800 : 4000, bins: 16 });
  const tq = cpu() - t0;
  t0 = cpu();
  const v = variationalMonteCarlo({ cluster: ring, mu: 1.5, alpha: 0.3, seed: 1, steps: quick ? 20 : 60, sweepsPerStep: 200, sweeps: quick ? 2000 : 8000, bins: 16 });
  const tv = cpu() - t0;
  const eff = (err: number, t: number) => 1 / (err * err * t);
  const bias = Math.abs(v.energyPerSite.value - q.energyPerSite.value);
  ctx.log(`64-site vdW ring (Rb = 1.2, mu = 1.5, alpha = 0.3): QMC (T = 1/32) e = ${q.energyPerSite.value.toFixed(5)} +- ${q.energyPerSite.error.toExponential(1)} in ${tq.toFixed(1)} s; VMC e = ${v.energyPerSite.value.toFixed(5)} +- ${v.energyPerSite.error.toExponential(1)} in ${tv.toFixed(1)} s (optimisation included)`);
  ctx.figure('statistical efficiency 1/(error^2 CPU-s), QMC over VMC', eff(q.energyPerSite.error, tq) / eff(v.energyPerSite.error, tv), 'x');
  const tReach = tq * (q.energyPerSite.error / bias) ** 2;
  ctx.figure('CPU time to VMC\'s total error: VMC over QMC', tv / tReach, 'x', { target: '> 10', note: `VMC bias ${bias.toExponential(1)} (QMC reaches it in ${tReach.toFixed(2)} s)` });
  await poolFigures(ctx, quick);
}

const bench: Bench = { name: 'qmc', title: 'stochastic series expansion: sweep speed against native code, range, efficiency, workers', run };
export default bench;
