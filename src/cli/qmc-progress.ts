/**
 * Progress of a quantum Monte Carlo run on stderr: the run's batches (the alpha grid, its
 * refinement, the measurement; in the ground-state mode one grid per beta) become known
 * one at a time, so the bar (src/cli/progress.ts) counts chains done of the chains handed
 * out so far and is relabelled with each batch's stage and beta; one summary line at the end.
 */
import type { QmcProgress } from '../../workers/protocol.ts';
import type { CliIo } from './io.ts';
import { Progress } from './progress.ts';

export class QmcProgressLine {
  private bar?: Progress;
  private key = '';
  private done = 0;
  private readonly t0: number;

  constructor(private readonly io: CliIo, private readonly label: string) {
    this.t0 = io.now();
  }

  update(p: QmcProgress): void {
    const key = `${p.stage} ${p.beta} ${p.total}`;
    if (key !== this.key) {
      this.key = key;
      this.bar = new Progress(this.io, `${this.label} ${p.stage} beta=${Number(p.beta.toPrecision(4))}`, p.total, 'chains');
    }
    this.done = p.done;
    this.bar!.update(p.done);
  }

  /** Clear the bar and print "qmc: n chains in s s<extra>". */
  finish(extra = ''): void {
    if (this.io.stderrIsTTY) this.io.stderr('\r\x1b[K');
    this.io.stderr(`${this.label}: ${this.done} chains in ${((this.io.now() - this.t0) / 1000).toFixed(1)} s${extra}\n`);
  }
}
