// Argument parsing: both flag forms, switches, repeats, unknown flags, values that look
// like flags, and the translation of model flags into ModelParams. Exact checks of
// parsed values (common practice, no source).
import { describe, expect, it } from 'vitest';
import { int, num, parseArgs, str, bool, type FlagSpec } from '../../src/cli/flags.ts';
import { MODEL_FLAGS, modelFromArgs } from '../../src/cli/model-flags.ts';
import { InputError } from '../../src/core/input-error.ts';

const specs: FlagSpec[] = [
  { name: 'mu', kind: 'number', help: '' }, { name: 'json', kind: 'bool', help: '' },
  { name: 'max-cell', kind: 'int', help: '' }, { name: 'x', kind: 'string', help: '' },
  { name: 'range', kind: 'number', help: '' }, { name: 'help', kind: 'bool', help: '' },
];

describe('parseArgs', () => {
  it('accepts --flag value and --flag=value, negative values and switches', () => {
    const a = parseArgs(['--mu', '-0.5', '--max-cell=6', '--json', '--x', 'mu=-1..1x3'], specs, 'solve');
    expect(num(a, 'mu')).toBe(-0.5);
    expect(int(a, 'max-cell')).toBe(6);
    expect(bool(a, 'json')).toBe(true);
    expect(str(a, 'x')).toBe('mu=-1..1x3');
    expect(parseArgs(['--mu=1e-3'], specs, 'solve').flags.get('mu')).toBe('1e-3');
    expect(bool(parseArgs(['-h'], specs, 'solve'), 'help')).toBe(true);
  });

  it('reads inf for ranges only where allowed', () => {
    const a = parseArgs(['--range', 'inf'], specs, 'solve');
    expect(num(a, 'range', true)).toBe(Infinity);
    expect(() => num(a, 'range')).toThrow(/--range must be a finite number, got 'inf'/);
  });

  it.each([
    [['--foo', '1'], /unknown flag --foo for solve/],
    [['--max-cel', '3'], /did you mean --max-cell\?/],
    [['--mu'], /--mu needs a value/],
    [['--mu', '--json'], /--mu needs a value/],
    [['--mu='], /got an empty one/],
    [['--mu', '1', '--mu', '2'], /--mu is given twice/],
    [['--json=yes'], /switch and takes no value/],
    [['stray'], /unexpected argument 'stray'/],
  ])('refuses %j', (argv, msg) => {
    expect(() => parseArgs(argv, specs, 'solve')).toThrow(InputError);
    expect(() => parseArgs(argv, specs, 'solve')).toThrow(msg);
  });

  it('checks values when read: NaN, text, fractional integers', () => {
    expect(() => num(parseArgs(['--mu', 'NaN'], specs, 's'), 'mu')).toThrow(/--mu must be a finite number, got 'NaN'/);
    expect(() => num(parseArgs(['--mu', '1x'], specs, 's'), 'mu')).toThrow(/finite number/);
    expect(() => int(parseArgs(['--max-cell', '2.5'], specs, 's'), 'max-cell')).toThrow(/whole number/);
  });
});

describe('model flags', () => {
  const model = (argv: string[], axes: Parameters<typeof modelFromArgs>[1] = []) =>
    modelFromArgs(parseArgs(argv, MODEL_FLAGS, 'solve'), axes);

  it('builds ModelParams with the documented defaults', () => {
    expect(model(['--rb', '1.5', '--detuning', '3', '--mu', '0.5'])).toEqual({
      lattice: 'chain', interaction: { shape: 'vdw', Rb: 1.5 }, delta: 3, mu: 0.5, T: 0, maxCell: 12,
    });
    expect(model(['--lattice', 'square', '--interaction', 'nn', '--v1', '2', '--v2', '0.5', '--range', '3',
      '--detuning', '1', '--density', '0.3', '--temperature', '0.1', '--cell', '1'])).toEqual({
      lattice: 'square', interaction: { shape: 'nn', V1: 2, V2: 0.5, rmax: 3 }, delta: 1, rho: 0.3, T: 0.1, maxCell: 8, cell: 1,
    });
    expect(model(['--interaction', 'softcore', '--v0', '2', '--rc', '1.7', '--detuning', '3', '--mu', '0']).interaction)
      .toEqual({ shape: 'softcore', V0: 2, Rc: 1.7 });
  });

  it.each([
    [['--detuning', '3', '--mu', '0'], /vdw interaction needs --rb/],
    [['--rb', '1', '--mu', '0'], /needs --detuning/],
    [['--rb', '1', '--detuning', '3'], /needs --mu .* or --density/],
    [['--rb', '1', '--detuning', '3', '--mu', '0', '--density', '0.2'], /not both/],
    [['--interaction', 'nn', '--rb', '1', '--detuning', '3', '--mu', '0'], /--rb does not apply to the nn interaction/],
    [['--interaction', 'softcore', '--v0', '1', '--detuning', '3', '--mu', '0'], /softcore interaction needs --v0 and --rc/],
    [['--interaction', 'ising', '--detuning', '3', '--mu', '0'], /unknown interaction 'ising'/],
    [['--lattice', 'kagome', '--rb', '1', '--detuning', '3', '--mu', '0'], /unknown lattice 'kagome'/],
    [['--rb', '1', '--detuning', '3', '--mu', '0', '--range', '-1'], /--range must be > 0/],
  ])('refuses %j', (argv, msg) => {
    expect(() => model(argv)).toThrow(InputError);
    expect(() => model(argv)).toThrow(msg);
  });

  it('lets scan axes stand in for flags, and refuses both at once', () => {
    expect(model(['--detuning', '3'], ['rb', 'mu']).interaction).toEqual({ shape: 'vdw' });
    expect(() => model(['--detuning', '3', '--rb', '1'], ['rb', 'mu'])).toThrow(/--rb conflicts with the rb axis/);
    expect(() => model(['--detuning', '3', '--rb', '1', '--mu', '0'], ['detuning', 'mu'])).toThrow(/--detuning conflicts/);
  });
});
