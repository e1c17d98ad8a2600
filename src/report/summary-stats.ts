/**
 * Descriptive statistics for display (table cells, colour-scale limits, histogram bins).
 * These only describe columns already computed by the engine; no result is derived here.
 */

/** Finite values of `values`, sorted ascending. */
export function sortedFinite(values: ArrayLike<number>): number[] {
  const out: number[] = [];
  for (let i = 0; i < values.length; i++) {
    const v = values[i] as number;
    if (Number.isFinite(v)) out.push(v);
  }
  return out.sort((a, b) => a - b);
}

/** Quantile p in [0, 1] of an ascending array (linear interpolation between order statistics); NaN when empty. */
export function quantileSorted(sorted: readonly number[], p: number): number {
  if (sorted.length === 0) return NaN;
  const pos = Math.max(0, Math.min(1, p)) * (sorted.length - 1);
  const i = Math.floor(pos);
  const lo = sorted[i] as number;
  const hi = sorted[Math.min(sorted.length - 1, i + 1)] as number;
  return lo + (hi - lo) * (pos - i);
}

export interface ColumnSummary {
  n: number;
  mean: number;
  sd: number;
  min: number;
  max: number;
  median: number;
}

/** Count, mean, sample standard deviation (n − 1), min, max and median of the finite values. */
export function summarize(values: ArrayLike<number>): ColumnSummary {
  const s = sortedFinite(values);
  const n = s.length;
  if (n === 0) return { n, mean: NaN, sd: NaN, min: NaN, max: NaN, median: NaN };
  let mean = 0;
  for (let i = 0; i < n; i++) mean += ((s[i] as number) - mean) / (i + 1);
  let ss = 0;
  for (const v of s) ss += (v - mean) ** 2;
  return {
    n,
    mean,
    sd: n > 1 ? Math.sqrt(ss / (n - 1)) : NaN,
    min: s[0] as number,
    max: s[n - 1] as number,
    median: quantileSorted(s, 0.5),
  };
}
