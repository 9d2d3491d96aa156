/**
 * A computation of the core that did not converge within its iteration cap (an
 * eigenvalue iteration, a Newton or shift loop, a lattice sum, a zero-line trace).
 * Distinct from InputError, which means the user's input is outside what the tool takes:
 * a ConvergenceError is a limit of the numerics at a valid input, named with the method
 * and the cap it reached so that a scan can report the point and go on.
 */
export class ConvergenceError extends Error {
  constructor(readonly method: string, message: string) {
    super(`${method}: ${message}`);
    this.name = 'ConvergenceError';
  }
}
