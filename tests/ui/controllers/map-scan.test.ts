// The page and the command line give the same map, byte for byte: the page's map
// controller (with its engine client on Node worker threads instead of Web Workers; the
// client only sees a pool) fills a grid through the one scan driver, and the page's CSV
// export of it must equal the CSV that `map` prints for the same inputs. Exact equality
// is the check (common practice, no source): one code path, one column table, one writer.
import { afterAll, describe, expect, it } from 'vitest';
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import { nodeEnginePool } from '../../../workers/node-spawn.ts';
import { EngineClient } from '../../../src/ui/engine/engine-client.ts';
import { MapScanController } from '../../../src/ui/controllers/map-scan.ts';
import { mapExportJson, mapExportTable } from '../../../src/ui/export/map-export.ts';
import { toCSV } from '../../../src/ui/export/table.ts';
import { parseModel, scanBase } from '../../../src/ui/model/model-inputs.ts';
import { modelFlags } from '../../../src/ui/export/cli-command.ts';
import { demoState } from '../../../src/ui/state/app-state.ts';
import { parseAxis } from '../../../src/core/scan/axes.ts';
import { cli } from '../../cli/test-io.ts';

/** A host that only counts update requests (the controller needs no DOM). */
class Host implements ReactiveControllerHost {
  updates = 0;
  addController(_c: ReactiveController): void {}
  removeController(_c: ReactiveController): void {}
  requestUpdate(): void { this.updates++; }
  get updateComplete(): Promise<boolean> { return Promise.resolve(true); }
}

const client = new EngineClient(nodeEnginePool(2), nodeEnginePool(1));
afterAll(() => client.close());

describe('the page map equals the CLI map', () => {
  // the demo form with a smaller cell search; the map crosses empty, superradiant and
  // density-wave regions on a 12 x 5 grid
  const inputs = { ...demoState().model, 'max-cell': '6' };
  const xText = 'mu=-1:2.9:12', yText = 'rb=0.9:2.1:5';

  it('CSV byte for byte, JSON as the same document', async () => {
    const model = parseModel(inputs);
    expect(model.params).not.toBeNull();
    const host = new Host();
    const ctrl = new MapScanController(host, () => client, 0);
    const x = parseAxis(xText, 'x'), y = parseAxis(yText, 'y');
    // as the atlas view builds its plan
    const plan = { base: scanBase(inputs, [x.name, y.name])!, x, y };
    ctrl.run(plan, 'identity');
    await ctrl.finished;
    expect(ctrl.status).toBe('done');
    const grid = ctrl.current!;
    expect(grid.complete).toBe(true);
    const phases = new Set(grid.done().map((p) => p.state?.phase));
    expect(phases.size).toBeGreaterThanOrEqual(3);
    const page = toCSV(mapExportTable(grid));

    const line = ['map', ...modelFlags(inputs, ['mu', 'rb']), '--x', xText, '--y', yText, '--workers', '2'];
    const run = await cli(line);
    expect(run.code).toBe(0);
    expect(page).toBe(run.out);

    // JSON: every field the page exports equals the CLI's (the CLI streams its document one
    // point a line and adds the adaptive map's solves, notes and boundary lines after them).
    const json = await cli([...line, '--json']);
    const doc = JSON.parse(json.out) as Record<string, unknown>, exported = mapExportJson(grid) as Record<string, unknown>;
    expect(Object.keys(exported)).toEqual(expect.arrayContaining(['points', 'x', 'y', 'params']));
    for (const k of Object.keys(exported)) expect(exported[k], k).toEqual(doc[k]);
  });
});
