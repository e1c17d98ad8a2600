/**
 * A plain-language verdict on a Parasnis and a Nettleton estimate of the same stations, with
 * warnings about the known ways both go wrong. Thresholds are named below and documented.
 */
import type { DensityInput } from './input.js';
import type { NettletonResult } from './nettleton.js';
import type { ParasnisResult } from './parasnis.js';

/** Fewer stations than this and both estimates rest on too little data (common practice). */
export const MIN_STATIONS_FOR_DENSITY = 20;
/** Height range (max - min), m, below which the topographic signal is too small to constrain the density (common practice). */
export const MIN_RELIEF_M = 50;
/**
 * A regional trend is suspected when fitting a plane in X, Y alongside the Parasnis slope moves
 * the density by more than this many standard errors of the trend-fitted estimate.
 */
export const TREND_SHIFT_SIGMAS = 2;
/** The two methods agree when they differ by at most this many combined standard errors. */
export const AGREEMENT_SIGMAS = 1;

export interface DensityVerdict {
  /** True when the estimates agree within AGREEMENT_SIGMAS combined standard errors. */
  agree: boolean;
  /** |Parasnis - Nettleton|, kg/m^3. */
  differenceKgM3: number;
  /** sqrt(stderr_P^2 + stderr_N^2), kg/m^3 (NaN when either is unknown). */
  combinedStderrKgM3: number;
  /** Station height range, m. */
  reliefM: number;
  /** One-sentence verdict. */
  verdict: string;
  /** Caveats, each one sentence. */
  warnings: string[];
}

export interface CompareContext {
  /** The Parasnis estimate with --trend linear, when the main one was made without a trend. */
  withTrend?: ParasnisResult;
  /** Whether the main estimates already include a linear trend. */
  trendUsed?: boolean;
}

const fmt = (v: number): string => (Number.isFinite(v) ? v.toFixed(0) : 'n/a');

export function compareDensityEstimates(
  input: DensityInput,
  p: ParasnisResult,
  nt: NettletonResult,
  ctx: CompareContext = {},
): DensityVerdict {
  let hMin = Infinity;
  let hMax = -Infinity;
  for (const h of input.heightM) {
    if (h < hMin) hMin = h;
    if (h > hMax) hMax = h;
  }
  const relief = hMax - hMin;
  const diff = Math.abs(p.densityKgM3 - nt.densityKgM3);
  const combined = Math.hypot(p.stderrKgM3, nt.stderrKgM3);
  const warnings: string[] = [];
  let verdict: string;
  let agree = false;
  if (!Number.isFinite(p.densityKgM3) || !Number.isFinite(nt.densityKgM3)) {
    verdict = 'No density could be estimated: the stations do not vary enough in height or terrain for a regression.';
  } else if (!Number.isFinite(combined)) {
    verdict = `Parasnis gives ${fmt(p.densityKgM3)} and Nettleton ${fmt(nt.densityKgM3)} kg/m^3; their agreement cannot be judged because an uncertainty is unknown.`;
  } else if (diff <= AGREEMENT_SIGMAS * combined) {
    agree = true;
    verdict = `The two methods agree: Parasnis ${fmt(p.densityKgM3)} +- ${fmt(p.stderrKgM3)} and Nettleton ${fmt(nt.densityKgM3)} +- ${fmt(nt.stderrKgM3)} kg/m^3 differ by ${fmt(diff)}, within their combined uncertainty of ${fmt(combined)}.`;
  } else {
    verdict = `The two methods disagree: Parasnis ${fmt(p.densityKgM3)} +- ${fmt(p.stderrKgM3)} and Nettleton ${fmt(nt.densityKgM3)} +- ${fmt(nt.stderrKgM3)} kg/m^3 differ by ${fmt(diff)}, more than their combined uncertainty of ${fmt(combined)}; look for a regional trend, gross errors or a density that changes across the area.`;
  }
  if (!nt.zeroCrossing) {
    warnings.push(
      `The Nettleton correlation does not cross zero in the density range; the value shown is the least |correlation| found${nt.atRangeEdge ? ', at an end of the range: widen --range' : ''}.`,
    );
  }
  if (p.n < MIN_STATIONS_FOR_DENSITY) {
    warnings.push(`Only ${p.n} stations (fewer than ${MIN_STATIONS_FOR_DENSITY}): the estimate is weakly constrained.`);
  }
  if (!(relief >= MIN_RELIEF_M)) {
    warnings.push(`The station heights span only ${relief.toFixed(1)} m (less than ${MIN_RELIEF_M} m): the estimate is weakly constrained.`);
  }
  if (!ctx.trendUsed && ctx.withTrend && Number.isFinite(ctx.withTrend.densityKgM3)) {
    const shift = Math.abs(ctx.withTrend.densityKgM3 - p.densityKgM3);
    if (shift > TREND_SHIFT_SIGMAS * ctx.withTrend.stderrKgM3) {
      warnings.push(
        `A regional trend seems correlated with the topography: fitting a plane moves the Parasnis density to ${fmt(ctx.withTrend.densityKgM3)} kg/m^3 (by ${fmt(shift)}); rerun with --trend linear.`,
      );
    }
  }
  if (p.downweighted > 0) warnings.push(`The robust fit down-weighted ${p.downweighted} station(s): check them for gross errors.`);
  return { agree, differenceKgM3: diff, combinedStderrKgM3: combined, reliefM: relief, verdict, warnings };
}
