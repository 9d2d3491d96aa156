/**
 * The CLI as a function: argv in, exit code out, everything else through CliIo. Bad input
 * (an InputError, also one thrown inside a worker, or an --out path that cannot be written,
 * checked before the command starts) is one line on stderr and exit code 2,
 * never a stack trace; an unexpected failure is one line and exit code 1 (the stack only
 * with ATLAS_DEBUG=1); a cancellation after Ctrl-C that a command did not handle itself
 * is exit code 130.
 */
import { InputError } from '../core/input-error.ts';
import { commandHelp, PROGRAM, type Command } from './command.ts';
import { COMMANDS } from './commands/index.ts';
import { parseArgs, str } from './flags.ts';
import { CLI_RANGE_FORM, rangeNote } from '../core/scan/axes.ts';
import type { CliIo } from './io.ts';

/** The top-level --help. */
export function topHelp(commands: readonly Command[] = COMMANDS): string {
  const w = Math.max(...commands.map((c) => c.name.length));
  return `Blockade Atlas: phases of interacting emitters in a cavity, from the command line.\n\n` +
    `Usage: ${PROGRAM} <command> [flags]     (${PROGRAM} <command> --help for its flags)\n\n` +
    `Commands:\n${commands.map((c) => `  ${c.name.padEnd(w)}  ${c.summary}`).join('\n')}\n\n` +
    `Units: energies in the collective light-matter coupling g, lengths in the lattice spacing a.\n` +
    `Flags take their value as --flag value or --flag=value.\n`;
}

/** An error that came back from a worker as a plain Error still carries its name. */
function isInputError(e: unknown): e is Error {
  return e instanceof InputError || (e instanceof Error && e.name === 'InputError');
}

/** Run one command line; resolves with the exit code. */
export async function runCli(argv: readonly string[], io: CliIo, commands: readonly Command[] = COMMANDS): Promise<number> {
  try {
    const [name, ...rest] = argv;
    if (name === undefined) throw new InputError(`no command given (use ${commands.map((c) => c.name).join(', ')}; see --help)`);
    if (name === '--help' || name === '-h' || name === 'help') {
      const c = commands.find((x) => x.name === rest[0]);
      io.stdout(c ? commandHelp(c) : topHelp(commands));
      return 0;
    }
    const command = commands.find((c) => c.name === name);
    if (!command) {
      throw new InputError(`unknown command '${name}' (use ${commands.map((c) => c.name).join(', ')}; see --help)`);
    }
    const args = parseArgs(rest, command.flags, command.name, command.positional);
    if (args.flags.has('help')) {
      io.stdout(commandHelp(command));
      return 0;
    }
    // a range in the old start:stop:count form is read, with a note on stderr (axes.ts)
    for (const f of command.flags) {
      const value = f.value?.includes(CLI_RANGE_FORM) ? str(args, f.name) : undefined;
      const note = value ? rangeNote(value) : null;
      if (note) io.stderr(`atlas: note: --${f.name} ${note}\n`);
    }
    // A bad --out (or any other file a command writes) is refused now, not after the
    // computation that would fill it.
    for (const f of command.flags) {
      const path = f.writes || f.name === 'out' ? str(args, f.name) : undefined;
      if (path) io.checkOutput?.(path);
    }
    return await command.run(args, io);
  } catch (e) {
    if (io.interrupt.aborted && e instanceof Error && e.name === 'AbortError') {
      // a command that did not catch its own cancellation: still a clean Ctrl-C
      io.stderr('atlas: interrupted\n');
      return 130;
    }
    if (isInputError(e)) {
      io.stderr(`atlas: ${oneLine(e.message)}\n`);
      return 2;
    }
    if (e instanceof Error && e.name === 'ConvergenceError') {
      // A valid input at which the numerics reached their iteration cap: say so in one line.
      io.stderr(`atlas: no converged answer at this input: ${oneLine(e.message)}\n`);
      return 3;
    }
    const err = e instanceof Error ? e : new Error(String(e));
    io.stderr(`atlas: internal error: ${oneLine(err.message)}${process.env.ATLAS_DEBUG ? '\n' + err.stack : ' (ATLAS_DEBUG=1 shows the stack)'}\n`);
    return 1;
  }
}

function oneLine(s: string): string {
  return s.replace(/\s*\n\s*/g, ' ').trim();
}
