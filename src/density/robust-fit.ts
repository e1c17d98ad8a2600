/**
 * Robust versions of the least-squares fit, for surveys with gross errors (misread meters,
 * wrong heights): Huber M-estimation by iteratively reweighted least squares, or iterative
 * trimming of points beyond TRIM_SIGMAS robust standard deviations.
 */
import type { LeastSquaresFit } from './least-squares.js';
import { leastSquares } from './least-squares.js';

export type RobustMethod = 'none' | 'huber' | 'trim';

/** Huber tuning constant, in robust standard deviations: 95 % efficiency at the normal distribution (Huber 1964; common practice). */
export const HUBER_K = 1.345;
/** Trimming limit, in robust standard deviations (common practice). */
export const TRIM_SIGMAS = 3;
/** MAD to standard deviation for normal data, 1 / Phi^-1(3/4) (common practice). */
export const MAD_TO_SIGMA = 1.482602218505602;
/**
 * A point counts as down-weighted when its final weight is below this: for Huber that is a
 * residual beyond 2 HUBER_K = 2.69 robust sigma (0.7 % of normal data), so the count reports
 * suspect stations, not the many good ones Huber trims slightly.
 */
export const DOWNWEIGHT_REPORT_LIMIT = 0.5;
/** Iteration cap for IRLS and trimming; both converge in a handful of steps on survey data. */
const MAX_ITERATIONS = 50;

export interface RobustFit {
  fit: LeastSquaresFit;
  /** Final weight of each point (1 = full, 0 = trimmed). */
  weights: Float64Array;
  /** Points with weight below DOWNWEIGHT_REPORT_LIMIT: Huber residuals beyond 2 HUBER_K sigma, or trimmed. */
  downweighted: number;
  iterations: number;
}

/** Median of a copy of the values. */
export function median(values: ArrayLike<number>): number {
  const s = Float64Array.from(values).sort();
  const n = s.length;
  if (n === 0) return NaN;
  return n % 2 === 1 ? (s[(n - 1) / 2] as number) : ((s[n / 2 - 1] as number) + (s[n / 2] as number)) / 2;
}

/** Robust standard deviation of residuals: MAD_TO_SIGMA * median |r - median r|. */
export function robustSigma(r: ArrayLike<number>): number {
  const m = median(r);
  return MAD_TO_SIGMA * median(Float64Array.from(r as ArrayLike<number>, (v) => Math.abs(v - m)));
}

export function robustLeastSquares(columns: readonly ArrayLike<number>[], y: ArrayLike<number>, method: RobustMethod): RobustFit {
  const n = y.length;
  let fit = leastSquares(columns, y);
  const weights = new Float64Array(n).fill(1);
  if (method === 'none') return { fit, weights, downweighted: 0, iterations: 1 };
  let it = 1;
  for (; it < MAX_ITERATIONS; it++) {
    const s = robustSigma(fit.residuals);
    if (!(s > 0)) break;
    let changed = false;
    for (let i = 0; i < n; i++) {
      const u = Math.abs(fit.residuals[i] as number) / s;
      const w = method === 'huber' ? (u <= HUBER_K ? 1 : HUBER_K / u) : u <= TRIM_SIGMAS ? 1 : 0;
      if (method === 'trim' ? w !== weights[i] : Math.abs(w - (weights[i] as number)) > 1e-9) changed = true;
      weights[i] = w;
    }
    const prev = fit.coef;
    fit = leastSquares(columns, y, weights);
    // Huber: stop when slopes move less than 1e-10 relative (far below any reported digit).
    const moved = fit.coef.some((c, j) => Math.abs(c - (prev[j] as number)) > 1e-10 * Math.max(1, Math.abs(c)));
    if (!changed || (method === 'huber' && !moved)) break;
  }
  let down = 0;
  for (let i = 0; i < n; i++) if ((weights[i] as number) < DOWNWEIGHT_REPORT_LIMIT) down++;
  return { fit, weights, downweighted: down, iterations: it };
}
