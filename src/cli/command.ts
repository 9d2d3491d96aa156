/**
 * A command of the CLI: its name, help text, flags and what it does. Commands live in
 * src/cli/commands/<name>.ts and are listed in src/cli/commands/index.ts; help text is
 * generated from the flag specs, so a flag is documented where it is declared.
 */
import type { FlagSpec, ParsedArgs } from './flags.ts';
import type { CliIo } from './io.ts';

export interface Command {
  name: string;
  /** One line for the top-level help. */
  summary: string;
  /** Usage line after the program name, e.g. "map --x name=a:b:n [--y ...] [flags]". */
  usage: string;
  /** A paragraph or two on what it computes and prints. */
  description: string;
  flags: readonly FlagSpec[];
  /** Takes positional arguments (file names). */
  positional?: boolean;
  examples?: readonly string[];
  /** Exit code: 0 done, 2 bad input (thrown as InputError), 130 interrupted. */
  run(args: ParsedArgs, io: CliIo): Promise<number>;
}

export const PROGRAM = 'npm run -s atlas --';

/** Flags every command has. */
export const HELP_FLAG: FlagSpec = { name: 'help', kind: 'bool', help: 'show this help' };

/** The --help text of a command. */
export function commandHelp(c: Command): string {
  const width = Math.max(...c.flags.map(flagLabel).map((s) => s.length));
  const flags = c.flags.map((f) => {
    const def = f.def !== undefined ? ` [default ${f.def}]` : '';
    return `  ${flagLabel(f).padEnd(width)}  ${f.help}${def}`;
  });
  const ex = c.examples?.length ? `\nExamples:\n${c.examples.map((e) => `  ${PROGRAM} ${e}`).join('\n')}\n` : '';
  return `Usage: ${PROGRAM} ${c.usage}\n\n${c.description}\n\nFlags:\n${flags.join('\n')}\n${ex}`;
}

function flagLabel(f: FlagSpec): string {
  return f.kind === 'bool' ? `--${f.name}` : `--${f.name} ${f.value ?? f.kind}`;
}
