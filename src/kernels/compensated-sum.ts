/**
 * Neumaier compensated summation [Neumaier1974] without allocation.
 *
 * State is a caller-owned Float64Array(2): [0] running sum, [1] running compensation. Create
 * it once (per worker or per station loop) and reset it; the functions allocate nothing.
 *
 * For the tightest loops inline the same pattern in locals (as prism-batch.ts does):
 *   const t = sum + v;
 *   comp += Math.abs(sum) >= Math.abs(v) ? (sum - t) + v : (v - t) + sum;
 *   sum = t;
 *   ... result = sum + comp
 */

/** Index of the running sum in the state array. */
const SUM = 0;
/** Index of the running compensation in the state array. */
const COMP = 1;

/** A fresh zeroed accumulator state (allocate once, outside hot loops). */
export function createNeumaierState(): Float64Array {
  return new Float64Array(2);
}

/** Zero the accumulator. */
export function neumaierReset(state: Float64Array): void {
  state[SUM] = 0;
  state[COMP] = 0;
}

/** Add one term (any unit, consistent within one accumulator). */
export function neumaierAdd(state: Float64Array, value: number): void {
  const sum = state[SUM] as number;
  const t = sum + value;
  // [Neumaier1974]: the lost low part of whichever operand is smaller in magnitude.
  state[COMP] = (state[COMP] as number) + (Math.abs(sum) >= Math.abs(value) ? sum - t + value : value - t + sum);
  state[SUM] = t;
}

/** Compensated total so far. */
export function neumaierResult(state: Float64Array): number {
  return (state[SUM] as number) + (state[COMP] as number);
}
