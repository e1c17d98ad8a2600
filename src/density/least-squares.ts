/**
 * Weighted linear least squares with an intercept, y = c + sum_k b_k X_k, for the few
 * predictors a density regression needs. Columns and y are centred on their weighted means
 * before the normal equations are formed (two-pass; keeps large map coordinates from
 * swamping the fit), then solved by Cholesky on the unit-diagonal scaled matrix.
 * Standard errors are the classical sigma^2 (X'WX)^-1 with sigma^2 = sum w r^2 / (n - p - 1)
 * (e.g. Draper & Smith, Applied Regression Analysis; common practice).
 */

export interface LeastSquaresFit {
  /** Slopes b_k, one per predictor column. */
  coef: Float64Array;
  /** Standard errors of the slopes. */
  stderr: Float64Array;
  intercept: number;
  interceptStderr: number;
  /** Residuals y - fit, one per point (all points, whatever their weight). */
  residuals: Float64Array;
  /** Residual standard deviation, sqrt(sum w r^2 / (n - p - 1)). */
  sigma: number;
  /** Weighted coefficient of determination 1 - SSres / SStot. */
  r2: number;
  /** Points with positive weight. */
  n: number;
}

/** Weighted mean of a over points with w > 0. */
function weightedMean(a: ArrayLike<number>, w: ArrayLike<number> | undefined, sumW: number): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += (w ? (w[i] as number) : 1) * (a[i] as number);
  return s / sumW;
}

/**
 * Fits y on the columns with optional weights (w >= 0; 0 leaves a point out). Returns NaN
 * estimates when the system is singular (a constant predictor, too few points): callers report
 * that rather than throw.
 */
export function leastSquares(columns: readonly ArrayLike<number>[], y: ArrayLike<number>, weights?: ArrayLike<number>): LeastSquaresFit {
  const p = columns.length;
  const nAll = y.length;
  let sumW = 0;
  let n = 0;
  for (let i = 0; i < nAll; i++) {
    const w = weights ? (weights[i] as number) : 1;
    sumW += w;
    if (w > 0) n++;
  }
  const mx = columns.map((c) => weightedMean(c, weights, sumW));
  const my = weightedMean(y, weights, sumW);
  const a = new Float64Array(p * p);
  const b = new Float64Array(p);
  let syy = 0;
  for (let i = 0; i < nAll; i++) {
    const w = weights ? (weights[i] as number) : 1;
    if (!(w > 0)) continue;
    const yc = (y[i] as number) - my;
    syy += w * yc * yc;
    for (let j = 0; j < p; j++) {
      const xj = ((columns[j] as ArrayLike<number>)[i] as number) - (mx[j] as number);
      b[j] = (b[j] as number) + w * xj * yc;
      for (let k = 0; k <= j; k++) {
        const xk = ((columns[k] as ArrayLike<number>)[i] as number) - (mx[k] as number);
        a[j * p + k] = (a[j * p + k] as number) + w * xj * xk;
      }
    }
  }
  for (let j = 0; j < p; j++) for (let k = 0; k < j; k++) a[k * p + j] = a[j * p + k] as number;
  const inv = invertSpd(a, p);
  const coef = new Float64Array(p);
  for (let j = 0; j < p; j++) {
    let s = 0;
    for (let k = 0; k < p; k++) s += (inv[j * p + k] as number) * (b[k] as number);
    coef[j] = s;
  }
  const intercept = my - coef.reduce((s, c, j) => s + c * (mx[j] as number), 0);
  const residuals = new Float64Array(nAll);
  let ssr = 0;
  for (let i = 0; i < nAll; i++) {
    let f = intercept;
    for (let j = 0; j < p; j++) f += (coef[j] as number) * ((columns[j] as ArrayLike<number>)[i] as number);
    const r = (y[i] as number) - f;
    residuals[i] = r;
    const w = weights ? (weights[i] as number) : 1;
    if (w > 0) ssr += w * r * r;
  }
  const dof = n - p - 1;
  const sigma2 = dof > 0 ? ssr / dof : NaN;
  const stderr = Float64Array.from({ length: p }, (_, j) => Math.sqrt(sigma2 * (inv[j * p + j] as number)));
  let q = 1 / sumW;
  for (let j = 0; j < p; j++) for (let k = 0; k < p; k++) q += (mx[j] as number) * (inv[j * p + k] as number) * (mx[k] as number);
  return {
    coef,
    stderr,
    intercept,
    interceptStderr: Math.sqrt(sigma2 * q),
    residuals,
    sigma: Math.sqrt(sigma2),
    r2: 1 - ssr / syy,
    n,
  };
}

/**
 * Inverse of a symmetric positive definite p x p matrix (row-major) by Cholesky of its
 * unit-diagonal scaling D^-1/2 A D^-1/2. NaN-filled when not positive definite.
 */
export function invertSpd(a: Float64Array, p: number): Float64Array {
  const d = Float64Array.from({ length: p }, (_, j) => Math.sqrt(a[j * p + j] as number));
  const s = new Float64Array(p * p);
  for (let j = 0; j < p; j++) for (let k = 0; k < p; k++) s[j * p + k] = (a[j * p + k] as number) / ((d[j] as number) * (d[k] as number));
  // Cholesky s = L L^T (lower, in place)
  const l = new Float64Array(p * p);
  for (let j = 0; j < p; j++) {
    let diag = s[j * p + j] as number;
    for (let k = 0; k < j; k++) diag -= (l[j * p + k] as number) ** 2;
    if (!(diag > 1e-13)) return new Float64Array(p * p).fill(NaN);
    const ljj = Math.sqrt(diag);
    l[j * p + j] = ljj;
    for (let i = j + 1; i < p; i++) {
      let v = s[i * p + j] as number;
      for (let k = 0; k < j; k++) v -= (l[i * p + k] as number) * (l[j * p + k] as number);
      l[i * p + j] = v / ljj;
    }
  }
  // inverse of L by forward substitution, then S^-1 = L^-T L^-1
  const li = new Float64Array(p * p);
  for (let c = 0; c < p; c++) {
    for (let i = c; i < p; i++) {
      let v = i === c ? 1 : 0;
      for (let k = c; k < i; k++) v -= (l[i * p + k] as number) * (li[k * p + c] as number);
      li[i * p + c] = v / (l[i * p + i] as number);
    }
  }
  const out = new Float64Array(p * p);
  for (let j = 0; j < p; j++) {
    for (let k = 0; k < p; k++) {
      let v = 0;
      for (let i = Math.max(j, k); i < p; i++) v += (li[i * p + j] as number) * (li[i * p + k] as number);
      out[j * p + k] = v / ((d[j] as number) * (d[k] as number));
    }
  }
  return out;
}

/** Pearson product-moment correlation of two equal-length series (two-pass); NaN if either is constant. */
export function pearson(a: ArrayLike<number>, b: ArrayLike<number>): number {
  const n = a.length;
  let ma = 0;
  let mb = 0;
  for (let i = 0; i < n; i++) {
    ma += a[i] as number;
    mb += b[i] as number;
  }
  ma /= n;
  mb /= n;
  let sab = 0;
  let saa = 0;
  let sbb = 0;
  for (let i = 0; i < n; i++) {
    const da = (a[i] as number) - ma;
    const db = (b[i] as number) - mb;
    sab += da * db;
    saa += da * da;
    sbb += db * db;
  }
  return sab / Math.sqrt(saa * sbb);
}
