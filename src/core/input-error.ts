/**
 * An error in the user's input (a value out of range, an unknown name, mu >= delta).
 * The CLI prints its message on one line and exits with code 2; the page shows it
 * beside the field named by `field`.
 */
export class InputError extends Error {
  constructor(message: string, readonly field?: string) {
    super(message);
    this.name = 'InputError';
  }
}

/** Throw an InputError unless `x` is a finite number. */
export function requireFinite(x: number, field: string): number {
  if (typeof x !== 'number' || !Number.isFinite(x)) {
    throw new InputError(`${field} must be a finite number, got ${String(x)}`, field);
  }
  return x;
}

/**
 * Refuse mu >= delta (or a non-finite mu or delta): the photon term (delta - mu) a^dag a of
 * K is then unbounded below and the photon number runs away (DESIGN.md, "Model and
 * conventions"). The one place this check and its message live. Returns delta - mu > 0.
 */
export function requireBelowDetuning(mu: number, delta: number): number {
  requireFinite(mu, 'mu');
  requireFinite(delta, 'detuning');
  if (!(mu < delta)) {
    throw new InputError(`mu = ${mu} must be below the detuning ${delta}: for mu >= delta the photon number is unbounded`, 'mu');
  }
  return delta - mu;
}
