/**
 * "Copy as command": the command line that reproduces the current view with the
 * project's CLI (src/cli), so a bigger version can run on a cluster. Model entries map
 * one to one onto the CLI's model flags; entries a scan axis sets are left out (the CLI
 * refuses both). Values are quoted for a POSIX shell only where they need it.
 */
import type { ModelInputs, ModelKey } from '../state/app-state.ts';
import { activeKeys } from '../model/model-inputs.ts';

/** Flags set by each scan axis. */
const AXIS_FLAGS: Record<string, ModelKey[]> = {
  rb: ['rb', 'v1'], v1: ['rb', 'v1'], mu: ['mu', 'density'], density: ['mu', 'density'],
  detuning: ['detuning'], temperature: ['temperature'],
};

/** Quote a word for sh when it holds anything but safe characters. */
export function shellWord(w: string): string {
  return /^[A-Za-z0-9_./:=+,-]+$/.test(w) ? w : `'${w.replace(/'/g, `'\\''`)}'`;
}

/** The model flags of the form, minus those the axes set. */
export function modelFlags(m: ModelInputs, axes: string[] = []): string[] {
  const skip = new Set<ModelKey>(['strength', 'pump']);
  for (const a of axes) for (const f of AXIS_FLAGS[a] ?? []) skip.add(f);
  const out: string[] = [];
  for (const k of activeKeys(m)) {
    if (skip.has(k)) continue;
    const v = m[k].trim();
    if (v === '') continue;
    if (k === 'v2' && Number(v) === 0) continue;
    out.push(`--${k}`, v);
  }
  return out;
}

/** The full line `npm run -s atlas -- <command> <flags...>`. */
export function cliLine(command: string, flags: string[]): string {
  return ['npm', 'run', '-s', 'atlas', '--', command, ...flags].map(shellWord).join(' ');
}
