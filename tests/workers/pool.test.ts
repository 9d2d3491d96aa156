// The worker pool's scheduling on in-thread engines (Comlink over a MessageChannel, so no
// thread start-up): results in task order, streaming, the size bound, cancellation and
// error passing. Invariant checks (common practice, no source).
import { describe, expect, it } from 'vitest';
import { MessageChannel, Worker } from 'node:worker_threads';
import { expose, wrap } from 'comlink';
import nodeEndpoint from 'comlink/dist/esm/node-adapter.mjs';
import { WorkerPool, type EngineHandle } from '../../workers/pool.ts';
import { InputError } from '../../src/core/input-error.ts';

interface Fake {
  square(x: number, ms: number): Promise<number>;
  fail(): never;
}

function fakeSpawner() {
  const stats = { spawned: 0, terminated: 0, running: 0, maxRunning: 0, calls: 0 };
  let dieNow: ((e: Error) => void) | undefined;
  const spawn = (): EngineHandle<Fake> => {
    stats.spawned++;
    const { port1, port2 } = new MessageChannel();
    let alive = true;
    const impl: Fake = {
      async square(x, ms) {
        stats.calls++;
        stats.running++;
        stats.maxRunning = Math.max(stats.maxRunning, stats.running);
        await new Promise((r) => setTimeout(r, ms));
        stats.running--;
        return x * x;
      },
      fail() {
        throw new InputError('detuning must be a finite number, got NaN');
      },
    };
    expose(impl, nodeEndpoint(port1));
    const failed = new Promise<never>((_, reject) => (dieNow = reject));
    failed.catch(() => undefined);
    return {
      remote: wrap<Fake>(nodeEndpoint(port2)),
      failed,
      terminate() {
        if (!alive) return;
        alive = false;
        stats.terminated++;
        port1.close();
        port2.close();
      },
    };
  };
  return { spawn, stats, kill: (e: Error) => dieNow?.(e) };
}

describe('worker pool', () => {
  it('returns results in task order, streams each, and never runs more than size at once', async () => {
    const { spawn, stats } = fakeSpawner();
    const pool = new WorkerPool(spawn, 3);
    const seen: number[] = [];
    const progress: number[] = [];
    const tasks = Array.from({ length: 20 }, (_, i) => i);
    // later tasks are faster, so completion order differs from task order
    const out = await pool.run(tasks, (r, x) => r.square(x, 20 - x), {
      onResult: (res) => seen.push(res), onProgress: (done) => progress.push(done),
    });
    expect(out).toEqual(tasks.map((x) => x * x));
    expect([...seen].sort((a, b) => a - b)).toEqual(out);
    expect(progress).toEqual(Array.from({ length: 20 }, (_, i) => i + 1));
    expect(stats.maxRunning).toBe(3);
    expect(stats.spawned).toBe(3);
    pool.close();
    expect(stats.terminated).toBe(3);
  });

  it('a run of higher priority goes ahead of queued tasks, behind running ones and its equals', async () => {
    const { spawn } = fakeSpawner();
    const pool = new WorkerPool(spawn, 1);
    const order: string[] = [];
    const task = (tag: string) => (r: Parameters<Parameters<typeof pool.run>[1]>[0], x: number) => r.square(x, 5).then((v) => { order.push(`${tag}${x}`); return v; });
    // one worker: a0 starts at once, the rest queue
    const a = pool.run([0, 1, 2], task('a'));
    const b = pool.run([0, 1], task('b'), { priority: 1 });
    const c = pool.run([0], task('c'), { priority: 1 });
    const d = pool.run([0], task('d'), { priority: 2 });
    await Promise.all([a, b, c, d]);
    expect(order).toEqual(['a0', 'd0', 'b0', 'b1', 'c0', 'a1', 'a2']);
    pool.close();
  });

  it('starts only as many workers as there are tasks', async () => {
    const { spawn, stats } = fakeSpawner();
    const pool = new WorkerPool(spawn, 8);
    await pool.run([1, 2], (r, x) => r.square(x, 1));
    expect(stats.spawned).toBe(2);
    pool.close();
  });

  it('counts progress in the units the caller gives', async () => {
    const { spawn } = fakeSpawner();
    const pool = new WorkerPool(spawn, 2);
    const last: [number, number][] = [];
    await pool.run([3, 5, 2], (r, x) => r.square(x, 1), { units: (x) => x, onProgress: (d, t) => last.push([d, t]) });
    expect(last.at(-1)).toEqual([10, 10]);
    pool.close();
  });

  it('cancels on abort: rejects with AbortError, drops queued tasks, terminates busy workers', async () => {
    const { spawn, stats } = fakeSpawner();
    const pool = new WorkerPool(spawn, 2);
    const ac = new AbortController();
    const done: number[] = [];
    const run = pool.run(Array.from({ length: 50 }, (_, i) => i), (r, x) => r.square(x, 10), {
      signal: ac.signal, onResult: (v) => done.push(v),
    });
    setTimeout(() => ac.abort(), 35);
    await expect(run).rejects.toMatchObject({ name: 'AbortError' });
    expect(done.length).toBeGreaterThan(0);
    expect(done.length).toBeLessThan(50);
    expect(stats.terminated).toBe(2);
    const callsAtAbort = stats.calls;
    await new Promise((r) => setTimeout(r, 40));
    expect(stats.calls).toBe(callsAtAbort);
    // the pool respawns and serves the next run
    expect(await pool.run([4], (r, x) => r.square(x, 1))).toEqual([16]);
    pool.close();
  });

  it('passes a task error through with its name and message, and cancels the rest of the run', async () => {
    const { spawn } = fakeSpawner();
    const pool = new WorkerPool(spawn, 2);
    const run = pool.run([0, 1, 2, 3], async (r, x) => (x === 1 ? r.fail() : r.square(x, 5)));
    await expect(run).rejects.toMatchObject({ name: 'InputError', message: 'detuning must be a finite number, got NaN' });
    pool.close();
  });

  it('rejects the run when a worker dies', async () => {
    const { spawn, kill } = fakeSpawner();
    const pool = new WorkerPool(spawn, 1);
    const run = pool.run([1, 2], (r, x) => r.square(x, 50));
    setTimeout(() => kill(new Error('worker crashed')), 10);
    await expect(run).rejects.toThrow('worker crashed');
    pool.close();
  });

  it('leaves no abort listener behind on a signal shared by many runs', async () => {
    const { spawn } = fakeSpawner();
    const pool = new WorkerPool(spawn, 2);
    const ac = new AbortController();
    let added = 0, removed = 0;
    const add = ac.signal.addEventListener.bind(ac.signal), remove = ac.signal.removeEventListener.bind(ac.signal);
    ac.signal.addEventListener = ((...a: Parameters<typeof add>) => (added++, add(...a))) as typeof add;
    ac.signal.removeEventListener = ((...a: Parameters<typeof remove>) => (removed++, remove(...a))) as typeof remove;
    for (let i = 0; i < 20; i++) await pool.run([i], (r, x) => r.square(x, 0), { signal: ac.signal });
    expect(added).toBe(20);
    expect(removed).toBe(20);
    pool.close();
  });

  it('an already aborted signal rejects at once; an empty run resolves', async () => {
    const { spawn, stats } = fakeSpawner();
    const pool = new WorkerPool(spawn, 2);
    await expect(pool.run([1], (r, x) => r.square(x, 1), { signal: AbortSignal.abort() })).rejects.toMatchObject({ name: 'AbortError' });
    expect(await pool.run([], (r, x: number) => r.square(x, 1))).toEqual([]);
    expect(stats.spawned).toBe(0);
    pool.close();
  });
});

// A real worker thread that can spin: `spin` never returns (a busy loop in the thread),
// `square` answers at once. Raw messages instead of Comlink keep the thread's code tiny.
interface Spinner {
  square(x: number): Promise<number>;
  spin(): Promise<number>;
}

function spinnerSpawner() {
  const stats = { spawned: 0, terminated: 0 };
  const spawn = (): EngineHandle<Spinner> => {
    stats.spawned++;
    const w = new Worker(
      `const { parentPort } = require('node:worker_threads');
       parentPort.on('message', ({ id, op, x }) => {
         if (op === 'spin') { for (;;) {} }
         parentPort.postMessage({ id, value: x * x });
       });`, { eval: true });
    const waiting = new Map<number, (v: number) => void>();
    let next = 0;
    w.on('message', ({ id, value }: { id: number; value: number }) => waiting.get(id)?.(value));
    const call = (op: string, x = 0) => new Promise<number>((resolve) => {
      const id = next++;
      waiting.set(id, resolve);
      w.postMessage({ id, op, x });
    });
    const remote = { square: (x: number) => call('square', x), spin: () => call('spin') };
    let alive = true;
    return {
      remote: remote as unknown as EngineHandle<Spinner>['remote'],
      terminate() {
        if (!alive) return;
        alive = false;
        stats.terminated++;
        void w.terminate();
      },
    };
  };
  return { spawn, stats };
}

describe('worker pool watchdog', () => {
  // Budgets of 300 ms against tasks that answer in well under 50 ms (a message round trip)
  // or never: the margin is wide both ways on a loaded machine. Workers are warmed first
  // (warm() has no budget), since a thread's start-up counts towards its first task.
  it('stops a task that spins past its budget, names it, and replaces the worker', async () => {
    const { spawn, stats } = spinnerSpawner();
    const pool = new WorkerPool(spawn, 1, { taskBudgetMs: 300 });
    try {
      await pool.warm((r) => r.square(0));
      const t0 = performance.now();
      const run = pool.run([{ op: 'spin', label: 'the spinning input' }], (r) => r.spin());
      await expect(run).rejects.toMatchObject({ name: 'TaskTimeoutError' });
      await expect(run).rejects.toThrow(/budget of 0.3 s.*the spinning input/);
      expect(performance.now() - t0).toBeLessThan(10_000);
      expect(stats.terminated).toBe(1);
      // the pool goes on with a fresh worker
      expect(await pool.run([3, 4], (r, x) => r.square(x), { budgetMs: 60_000 })).toEqual([9, 16]);
      expect(stats.spawned).toBe(2);
    } finally {
      pool.close();
    }
  });

  it('with recover, a spinning task yields its stand-in and the run finishes', async () => {
    const { spawn, stats } = spinnerSpawner();
    const pool = new WorkerPool(spawn, 2);
    try {
      await pool.warm((r) => r.square(0));
      const tasks = [2, -1, 5, 7];
      const got = await pool.run(tasks, (r, x) => (x < 0 ? r.spin() : r.square(x)), {
        budgetMs: (x) => (x < 0 ? 300 : 60_000), // a replacement worker starts within the run
        describe: (x) => `task ${x}`,
        recover: (e, i) => (e.name === 'TaskTimeoutError' && /task -1/.test(e.message) ? -100 - i : NaN),
      });
      expect(got).toEqual([4, -101, 25, 49]);
      expect(stats.terminated).toBe(1);
    } finally {
      pool.close();
    }
  });
});
