/**
 * "Copy as command": the command line that reproduces the current view with the
 * project's CLI (src/cli), so a bigger version can run on a cluster. The form's entries
 * are the CLI's model flags (formEntries); entries a scan axis sets are left out by the
 * shared axis table (AXIS_ENTRIES; the CLI refuses both). Values are quoted for a POSIX
 * shell only where they need it.
 */
import type { ModelInputs } from '../state/app-state.ts';
import { formEntries } from '../model/model-inputs.ts';
import { AXIS_ENTRIES, type ModelEntry } from '../../core/scan/model-entries.ts';
import type { AxisName } from '../../core/scan/axes.ts';

/** Quote a word for sh when it holds anything but safe characters. */
export function shellWord(w: string): string {
  return /^[A-Za-z0-9_./:=+,-]+$/.test(w) ? w : `'${w.replace(/'/g, `'\\''`)}'`;
}

/** The model flags of the form, minus those the axes set. */
export function modelFlags(m: ModelInputs, axes: readonly AxisName[] = []): string[] {
  const skip = new Set<ModelEntry>(axes.flatMap((a) => AXIS_ENTRIES[a]));
  const out: string[] = [];
  for (const [k, text] of Object.entries(formEntries(m)) as [ModelEntry, string][]) {
    const v = text.trim();
    if (skip.has(k) || v === '' || (k === 'v2' && Number(v) === 0)) continue;
    out.push(`--${k}`, v);
  }
  return out;
}

/** The full line `npm run -s atlas -- <command> <flags...>`. */
export function cliLine(command: string, flags: string[]): string {
  return ['npm', 'run', '-s', 'atlas', '--', command, ...flags].map(shellWord).join(' ');
}
