/**
 * Spectrum method group of the engine worker: the fluctuation spectrum, stability margins
 * and softest mode of one point, and the trace of one soft-mode line (one interaction range
 * and followed phase over a plane; the CLI and the page send one task per range). Request
 * and result types are plain data defined beside their core modules.
 */
import { stateSpectrum, type SpectrumRequest, type StateSpectrum } from '../../src/core/spectrum/state-spectrum.ts';
import { softLines, type SoftLineRequest, type SoftLineResult } from '../../src/core/softmode/soft-lines.ts';

export const spectrumApi = {
  /** Solve the point and expand about its state (stateSpectrum). */
  spectrum(req: SpectrumRequest): StateSpectrum {
    return stateSpectrum(req.params, { seed: req.seed, points: req.points });
  },

  /** Trace the soft-mode lines of one range and phase (softLines). */
  softLines(req: SoftLineRequest): SoftLineResult {
    return softLines(req);
  },
};
