/**
 * Sum of many prisms stored in flat typed arrays, with Neumaier compensated summation
 * [Neumaier1974] inlined (no allocation). Same conventions as prism.ts: station at the
 * origin, z positive down, result positive down, g_z = G rho_ref F.
 */
import { prismGzFactor } from './prism.js';

/**
 * F = sum_i w_i prismGzFactor(x1[i], x2[i], y1[i], y2[i], z1[i], z2[i]), i < count.
 * @param x1 west bounds, m (station-relative)
 * @param x2 east bounds, m
 * @param y1 south bounds, m
 * @param y2 north bounds, m
 * @param z1 tops, m (z down)
 * @param z2 bottoms, m
 * @param count number of prisms to sum (every array must hold at least count values)
 * @param weights optional dimensionless weights (e.g. density / reference density); absent = 1
 * @returns F in metres; NaN if any input used is NaN (propagated, never thrown)
 */
export function sumPrismsGzFactor(
  x1: Float64Array,
  x2: Float64Array,
  y1: Float64Array,
  y2: Float64Array,
  z1: Float64Array,
  z2: Float64Array,
  count: number,
  weights?: Float64Array,
): number {
  let sum = 0;
  let comp = 0;
  for (let i = 0; i < count; i++) {
    let v = prismGzFactor(
      x1[i] as number,
      x2[i] as number,
      y1[i] as number,
      y2[i] as number,
      z1[i] as number,
      z2[i] as number,
    );
    if (weights !== undefined) v *= weights[i] as number;
    const t = sum + v;
    comp += Math.abs(sum) >= Math.abs(v) ? sum - t + v : v - t + sum;
    sum = t;
  }
  return sum + comp;
}
