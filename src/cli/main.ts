/**
 * Entry of `npm run -s atlas -- <command> [flags]` (built into dist/cli/atlas.mjs by
 * scripts/build-cli.mjs): the process glue around runCli (stdout and stderr, signals, the
 * exit code).
 *
 * Signals. SIGINT (Ctrl-C), SIGTERM and SIGHUP (what a batch scheduler or a closed
 * terminal sends) all ask a running scan to stop and write what is finished; the exit code
 * is then the shell's convention for that signal, 128 + its number (130, 143, 129). A
 * command that cannot stop cleanly ends at once with that code. One Ctrl-C often arrives
 * twice (the terminal signals the whole process group and `npm run` forwards its own copy
 * to the child), so a repeat within DUPLICATE_MS of the first is ignored; a later one ends
 * the process at once.
 *
 * A closed output pipe (`atlas map ... | head`) is not an error: the process ends quietly
 * with 141 (128 + SIGPIPE, what the shell reports for a command ended by a closed pipe).
 */
import { nodeIo } from './io.ts';
import { runCli } from './run.ts';

/** 128 + the signal's number. */
const SIGNAL_CODES = { SIGINT: 130, SIGTERM: 143, SIGHUP: 129 } as const;
type StopSignal = keyof typeof SIGNAL_CODES;
/** Code of a process ended by a closed output pipe (128 + SIGPIPE). */
const EPIPE_CODE = 141;
/** Two copies of one signal arrive within milliseconds; a person presses twice in no less than this. */
const DUPLICATE_MS = 500;

const controller = new AbortController();
let catching = false;
let stoppedBy: { signal: StopSignal; at: number } | undefined;

function onSignal(signal: StopSignal): void {
  const now = performance.now();
  if (stoppedBy) {
    if (now - stoppedBy.at > DUPLICATE_MS) process.exit(SIGNAL_CODES[stoppedBy.signal]);
    return;
  }
  stoppedBy = { signal, at: now };
  if (!catching) process.exit(SIGNAL_CODES[signal]);
  controller.abort();
}
for (const signal of Object.keys(SIGNAL_CODES) as StopSignal[]) process.on(signal, () => onSignal(signal));

function onStreamError(stream: 'stdout' | 'stderr', e: NodeJS.ErrnoException): void {
  if (e.code === 'EPIPE' || e.code === 'EIO') {
    if (stream === 'stdout') process.exit(EPIPE_CODE);
    return; // nowhere left to report to; stdout may still be read
  }
  throw e;
}
process.stdout.on('error', (e) => onStreamError('stdout', e));
process.stderr.on('error', (e) => onStreamError('stderr', e));

let code = await runCli(process.argv.slice(2), nodeIo(controller.signal, (on) => (catching = on)));
// A command reports any interruption as 130 (Ctrl-C); say which signal it was.
if (code === 130 && stoppedBy) code = SIGNAL_CODES[stoppedBy.signal];
// Let piped output drain before exiting (process.exit would cut it short).
await new Promise<void>((resolve) => process.stdout.write('', () => resolve()));
await new Promise<void>((resolve) => process.stderr.write('', () => resolve()));
process.exit(code);
