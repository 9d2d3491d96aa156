/**
 * Seeded random streams for the Markov chains (seedrandom's Alea generator, J. Baagoe).
 * Chain c of a run with seed s draws from the stream seeded by the string "s/chain c", so
 * chains are independent and a seed with a chain count fixes every number bit for bit. The
 * generator state is plain data and travels with the chain between segments, so a segment
 * may run on any worker.
 */
import seedrandom from 'seedrandom';

export type StreamState = seedrandom.State.Alea;

export interface RandomStream {
  /** Uniform deviate in [0, 1). */
  next: () => number;
  /** The generator state, to resume the stream later. */
  state: () => StreamState;
}

/** The stream of chain `chain` of a run seeded by `seed`. */
export function chainStream(seed: number | string, chain: number): RandomStream {
  return wrap(seedrandom.alea(`${seed}/chain ${chain}`, { state: true }));
}

/** Resume a stream from its saved state. */
export function resumeStream(state: StreamState): RandomStream {
  return wrap(seedrandom.alea('', { state: { ...state } }));
}

function wrap(g: seedrandom.StatefulPRNG<StreamState>): RandomStream {
  return { next: () => g(), state: () => g.state() };
}
