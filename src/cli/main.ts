/**
 * Entry of `npm run -s atlas -- <command> [flags]`: the process glue around runCli
 * (stdout and stderr, Ctrl-C, the exit code). The first Ctrl-C asks a running scan to
 * stop and write what is finished; a command that cannot stop cleanly, or a second
 * Ctrl-C, ends the process at once with exit code 130.
 */
import { nodeIo } from './io.ts';
import { runCli } from './run.ts';

const controller = new AbortController();
let catching = false;
process.on('SIGINT', () => {
  if (!catching || controller.signal.aborted) process.exit(130);
  controller.abort();
});

const code = await runCli(process.argv.slice(2), nodeIo(controller.signal, (on) => (catching = on)));
// Let piped output drain before exiting (process.exit would cut it short).
await new Promise<void>((resolve) => process.stdout.write('', () => resolve()));
await new Promise<void>((resolve) => process.stderr.write('', () => resolve()));
process.exit(code);
