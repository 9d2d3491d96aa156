// One parser for the CLI's flags and the page's form: the same entries give the same
// ModelParams (exact equality, common practice, no source), and a wrong entry is named
// in the field that holds it.
import { describe, expect, it } from 'vitest';
import { parseModel, scanBase } from '../../../src/ui/model/model-inputs.ts';
import { modelFlags } from '../../../src/ui/export/cli-command.ts';
import { demoState } from '../../../src/ui/state/app-state.ts';
import { parseArgs } from '../../../src/cli/flags.ts';
import { MODEL_FLAGS, modelFromArgs } from '../../../src/cli/model-flags.ts';

const demo = demoState().model;
const cliModel = (argv: string[], axes: Parameters<typeof modelFromArgs>[1] = []) =>
  modelFromArgs(parseArgs(argv, MODEL_FLAGS, 'solve'), axes);

describe('form entries and CLI flags', () => {
  it.each([
    ['the demo', demo],
    ['nn on the square lattice with V2 and a range', { ...demo, lattice: 'square', interaction: 'nn', v1: '2', v2: '0.5', range: '3', 'max-cell': '8' }],
    ['softcore at fixed density', { ...demo, interaction: 'softcore', v0: '2', rc: '1.7', pump: 'density', density: '0.3' }],
    ['vdw by V1', { ...demo, strength: 'v1', v1: '4' }],
  ])('%s: the form and its copied flags give the same parameters', (_, m) => {
    const form = parseModel(m);
    expect(form.errors).toEqual({});
    expect(cliModel(modelFlags(m))).toEqual(form.params);
  });

  it('a scan base leaves out what the axes set, as the CLI does', () => {
    expect(scanBase(demo, ['mu', 'rb'])).toEqual(cliModel(modelFlags(demo, ['mu', 'rb']), ['mu', 'rb']));
    expect(scanBase(demo, ['mu', 'rb'])?.mu).toBeUndefined();
  });

  it('names the wrong field', () => {
    expect(parseModel({ ...demo, detuning: '3.6x' }).errors.detuning).toMatch(/finite number, got '3.6x'/);
    expect(parseModel({ ...demo, 'max-cell': '2.5' }).errors['max-cell']).toMatch(/whole number/);
    expect(parseModel({ ...demo, range: '-1' }).errors.range).toMatch(/must be > 0/);
    expect(parseModel({ ...demo, mu: '4' }).errors.mu).toMatch(/unbounded/);
  });
});
