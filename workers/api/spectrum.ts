/**
 * Spectrum method group of the engine worker: the fluctuation spectrum, stability margins
 * and softest mode of one point (solved here, or about a state already solved, so a
 * clicked map point is not solved again), and the trace of one soft-mode line (one
 * interaction range and followed phase over a plane; the scan driver sends one task per
 * range). Request and result types are plain data defined beside their core modules.
 */
import { stateSpectrum, type SpectrumRequest, type StateSpectrum } from '../../src/core/spectrum/state-spectrum.ts';
import { background, inputFromState } from '../../src/core/spectrum/background.ts';
import { fluctuationSpectrum } from '../../src/core/spectrum/spectrum.ts';
import { zonePath } from '../../src/core/spectrum/zone-path.ts';
import { marginsAt, softestMode } from '../../src/core/softmode/softest.ts';
import { softLines, type SoftLineRequest, type SoftLineResult } from '../../src/core/softmode/soft-lines.ts';
import type { StateSpectrumRequest } from '../protocol.ts';

export const spectrumApi = {
  /** Solve the point and expand about its state (stateSpectrum). */
  spectrum(req: SpectrumRequest): StateSpectrum {
    return stateSpectrum(req.params, { seed: req.seed, points: req.points });
  },

  /**
   * Expand about a state already solved (req.state at req.params): the same steps as
   * stateSpectrum after its solve (background, branches along the zone path, margins,
   * softest mode over the zone).
   */
  spectrumOfState(req: StateSpectrumRequest): StateSpectrum {
    const bg = background(inputFromState(req.state, req.params));
    const sp = fluctuationSpectrum(bg, { points: req.points });
    const margins = marginsAt(bg, zonePath(bg.l, req.points ?? 129).k);
    const { evaluations: _e, ...softMode } = softestMode(bg);
    return { state: req.state, ...sp, margins, softMode };
  },

  /** Trace the soft-mode lines of one range and phase (softLines). */
  softLines(req: SoftLineRequest): SoftLineResult {
    return softLines(req);
  },
};
