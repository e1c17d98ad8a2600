/** "Nice" axis ticks: steps of 1, 2 or 5 times a power of ten covering a data range. */

export interface NiceTicks {
  /** Tick values from domainMin to domainMax inclusive. */
  ticks: number[];
  /** Step between ticks. */
  step: number;
  /** The extended domain (first and last tick). */
  domainMin: number;
  domainMax: number;
}

/** The 1-2-5 step nearest to `span / targetCount` (nearest on a log scale: cut-offs at √2, √10, √50). */
export function niceStep(span: number, targetCount: number): number {
  const raw = span / Math.max(1, targetCount);
  const power = 10 ** Math.floor(Math.log10(raw));
  const fraction = raw / power;
  const mult = fraction < Math.SQRT2 ? 1 : fraction < Math.sqrt(10) ? 2 : fraction < Math.sqrt(50) ? 5 : 10;
  return mult * power;
}

/**
 * Ticks covering [min, max] with about `targetCount` intervals; the domain is extended outwards
 * to whole steps. A degenerate range (min == max) is widened by one unit of its magnitude.
 */
export function niceTicks(min: number, max: number, targetCount = 5): NiceTicks {
  let lo = Math.min(min, max);
  let hi = Math.max(min, max);
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) {
    lo = 0;
    hi = 1;
  }
  if (hi - lo < 1e-12 * Math.max(1, Math.abs(lo))) {
    const pad = Math.abs(lo) > 0 ? Math.abs(lo) * 0.1 : 1;
    lo -= pad;
    hi += pad;
  }
  const step = niceStep(hi - lo, targetCount);
  const first = Math.floor(lo / step + 1e-9);
  const last = Math.ceil(hi / step - 1e-9);
  const ticks: number[] = [];
  for (let i = first; i <= last; i++) ticks.push(roundToStep(i * step, step));
  return { ticks, step, domainMin: roundToStep(first * step, step), domainMax: roundToStep(last * step, step) };
}

/** Removes binary noise such as 0.30000000000000004 from a multiple of `step`. */
function roundToStep(value: number, step: number): number {
  const decimals = Math.max(0, -Math.floor(Math.log10(step)) + 1);
  return Number(value.toFixed(Math.min(decimals, 15)));
}

/** Returns a linear map from domain [d0, d1] to range [r0, r1]. */
export function linearScale(d0: number, d1: number, r0: number, r1: number): (v: number) => number {
  const span = d1 - d0;
  const k = span !== 0 ? (r1 - r0) / span : 0;
  return (v: number) => r0 + (v - d0) * k;
}
