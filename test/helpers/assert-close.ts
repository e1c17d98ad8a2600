import { expect } from 'vitest';

export interface Tolerance {
  /** Absolute tolerance in the value's own unit. */
  abs?: number;
  /** Relative tolerance (fraction of |expected|). */
  rel?: number;
}

/**
 * Passes when |actual - expected| <= max(abs, rel * |expected|). Every call site states why
 * its tolerance is what it is.
 */
export function assertClose(actual: number, expected: number, tol: Tolerance, label = ''): void {
  const limit = Math.max(tol.abs ?? 0, (tol.rel ?? 0) * Math.abs(expected));
  const err = Math.abs(actual - expected);
  if (!(err <= limit)) {
    expect.fail(
      `${label ? label + ': ' : ''}expected ${expected} +- ${limit}, got ${actual} (error ${err}, ${expected !== 0 ? (err / Math.abs(expected)).toExponential(2) + ' relative' : ''})`,
    );
  }
  expect(err).toBeLessThanOrEqual(limit);
}
