/**
 * Command-line flags: `--name value` and `--name=value` alike, `--flag` alone for
 * switches, `-h` for `--help`. Values stay strings until a command reads them through the
 * typed getters, which name the flag in their InputError messages. An unknown or repeated
 * flag, a missing value or a stray argument is refused.
 */
import { InputError } from '../core/input-error.ts';

export type FlagKind = 'number' | 'int' | 'string' | 'bool';

export interface FlagSpec {
  name: string;
  kind: FlagKind;
  help: string;
  /** Placeholder of the value in help (default: the kind). */
  value?: string;
  /** Default shown in help. */
  def?: string;
  /** The value is a file the command writes: checked before any work starts (runCli). */
  writes?: boolean;
}

export interface ParsedArgs {
  command: string;
  flags: Map<string, string | true>;
  positional: string[];
}

/** Parse argv (after the command name) against the command's flags. */
export function parseArgs(argv: readonly string[], specs: readonly FlagSpec[], command: string, positional = false): ParsedArgs {
  const byName = new Map(specs.map((s) => [s.name, s]));
  const flags = new Map<string, string | true>();
  const rest: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (arg === '-h') {
      flags.set('help', true);
      continue;
    }
    if (!arg.startsWith('--') || arg === '--') {
      if (arg === '--') {
        rest.push(...argv.slice(i + 1));
        break;
      }
      if (!positional && /^[x\u00d7]\d+$/i.test(arg)) {
        throw new InputError(`unexpected argument '${arg}' for ${command}: a range is one argument, write it without the space (mu=-1..3.9x200) or quote it`);
      }
      if (!positional) throw new InputError(`unexpected argument '${arg}' for ${command} (flags start with --; see ${command} --help)`);
      rest.push(arg);
      continue;
    }
    const eq = arg.indexOf('=');
    const name = arg.slice(2, eq < 0 ? undefined : eq);
    const spec = byName.get(name);
    if (!spec) throw new InputError(`unknown flag --${name} for ${command}${suggest(name, specs)} (see ${command} --help)`, name);
    if (flags.has(name)) throw new InputError(`--${name} is given twice`, name);
    if (spec.kind === 'bool') {
      if (eq >= 0) throw new InputError(`--${name} is a switch and takes no value`, name);
      flags.set(name, true);
      continue;
    }
    let value: string;
    if (eq >= 0) {
      value = arg.slice(eq + 1);
    } else {
      const next = argv[i + 1];
      if (next === undefined || next.startsWith('--')) throw new InputError(`--${name} needs a value (${spec.value ?? spec.kind})`, name);
      value = next;
      i++;
    }
    if (value.trim() === '') throw new InputError(`--${name} needs a value (${spec.value ?? spec.kind}), got an empty one`, name);
    flags.set(name, value);
  }
  return { command, flags, positional: rest };
}

/** Was the flag given? */
export function has(a: ParsedArgs, name: string): boolean {
  return a.flags.has(name);
}

/** A switch. */
export function bool(a: ParsedArgs, name: string): boolean {
  return a.flags.get(name) === true;
}

/** A string flag, or undefined. */
export function str(a: ParsedArgs, name: string): string | undefined {
  const v = a.flags.get(name);
  return typeof v === 'string' ? v : undefined;
}

/** A finite number (or +-inf where allowInfinite), or undefined when absent. */
export function num(a: ParsedArgs, name: string, allowInfinite = false): number | undefined {
  const s = str(a, name);
  if (s === undefined) return undefined;
  const t = s.trim().toLowerCase();
  if (allowInfinite && (t === 'inf' || t === 'infinity' || t === 'none')) return Infinity;
  const x = Number(t);
  if (!Number.isFinite(x)) throw new InputError(`--${name} must be a finite number, got '${s}'`, name);
  return x;
}

/** A whole number, or undefined when absent. */
export function int(a: ParsedArgs, name: string): number | undefined {
  const s = str(a, name);
  if (s === undefined) return undefined;
  if (!/^\s*[+-]?\d+\s*$/.test(s)) throw new InputError(`--${name} must be a whole number, got '${s}'`, name);
  return Number(s);
}

/** ", did you mean --x?" for a near miss (edit distance <= 2), else "". */
function suggest(name: string, specs: readonly FlagSpec[]): string {
  let best = '', bestD = 3;
  for (const s of specs) {
    const d = editDistance(name, s.name);
    if (d < bestD) [best, bestD] = [s.name, d];
  }
  return best ? `; did you mean --${best}?` : '';
}

function editDistance(a: string, b: string): number {
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const cur = [i];
    for (let j = 1; j <= b.length; j++) {
      cur[j] = Math.min(prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + (a[i - 1] === b[j - 1] ? 0 : 1));
    }
    prev = cur;
  }
  return prev[b.length];
}
