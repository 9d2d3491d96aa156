/**
 * The engine object every worker exposes: one method group per physics method, merged
 * into one object so a page or CLI reaches `remote.meanfield.solveRun(...)`,
 * `remote.spectrum....`. To add a group, write workers/api/<name>.ts exporting a plain
 * object of functions over protocol types and add it below.
 */
import { proxy } from 'comlink';
import type { EngineInfo } from './protocol.ts';
import { meanfieldApi } from './api/meanfield.ts';
import { correlatedApi } from './api/correlated.ts';
import { spectrumApi } from './api/spectrum.ts';
import { qmcApi } from './api/qmc.ts';

// proxy() marks each group so Comlink's types give remote.group.method(...) as a call
// (at run time Comlink walks the property path either way).
const groups = {
  meanfield: proxy(meanfieldApi),
  correlated: proxy(correlatedApi),
  spectrum: proxy(spectrumApi),
  qmc: proxy(qmcApi),
};

export const engine = {
  ...groups,
  /** Warm-up probe: answers once the worker has loaded every group. */
  info(): EngineInfo {
    return { groups: Object.keys(groups) };
  },
};

export type Engine = typeof engine;
