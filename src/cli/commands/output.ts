/**
 * Where a scan command's output goes (--out file or stdout), and what it says when it was
 * interrupted: the finished part is written, stderr says so, the exit code is 130.
 */
import { str, type FlagSpec, type ParsedArgs } from '../flags.ts';
import type { CliIo } from '../io.ts';

export const OUT_FLAG: FlagSpec = { name: 'out', kind: 'string', value: 'file', help: 'write to this file instead of stdout' };

/** Write text to --out or stdout; 0 when complete, 130 (and a note on stderr) when interrupted. */
export function finishOutput(io: CliIo, args: ParsedArgs, text: string, run: { complete: boolean; points: unknown[]; total: number }): number {
  const file = str(args, 'out');
  if (file) io.writeText(file, text);
  else io.stdout(text);
  if (run.complete) return 0;
  io.stderr(`interrupted: wrote the ${run.points.length} finished of ${run.total} points to ${file ?? 'stdout'}\n`);
  return 130;
}
