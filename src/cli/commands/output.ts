/**
 * Where a scan command's output goes (--out file or stdout), and what it says when it was
 * interrupted: the finished part is written, stderr says so, the exit code is 130.
 */
import { InputError } from '../../core/input-error.ts';
import { bool, str, type FlagSpec, type ParsedArgs } from '../flags.ts';
import type { CliIo } from '../io.ts';
import { outputFor, type OutputTarget } from '../stream-writer.ts';

export const OUT_FLAG: FlagSpec = { name: 'out', kind: 'string', value: 'file', help: 'write to this file instead of stdout', writes: true };

export const RESUME_FLAG: FlagSpec = {
  name: 'resume', kind: 'bool',
  help: 'continue the part --out holds (or its .partial file left by a killed run): check it is this scan, compute only what is missing',
};

/**
 * Run `work` writing to the streamed output of --out (or stdout), continued under --resume
 * (when the command is `resumable`; else a fresh output every run);
 * commit it when the run ends (finished or interrupted), drop what this run started when
 * it fails. 0 when complete, 130 (and a note on stderr) when interrupted.
 */
export async function streamOutput(
  io: CliIo, args: ParsedArgs, work: (target: OutputTarget) => Promise<{ complete: boolean; written: number; total: number }>,
  o: { resumable?: boolean; unit?: string } = {},
): Promise<number> {
  const file = str(args, 'out');
  const resumable = o.resumable ?? true;
  const resume = resumable && bool(args, 'resume');
  if (resume && !file) throw new InputError('--resume needs --out (the file to continue)', 'resume');
  const target = outputFor(io, file, resume);
  let run;
  try {
    run = await work(target);
  } catch (e) {
    target.abandon();
    throw e;
  }
  await target.ready(); // stdout: what is queued is passed on before the run reports its end
  target.commit();
  if (run.complete) return 0;
  io.stderr(`interrupted: wrote the ${run.written} finished of ${run.total} ${o.unit ?? 'points'} to ${file ?? 'stdout'}${file && resumable ? ' (continue it with --resume)' : ''}\n`);
  return 130;
}
