/**
 * Nettleton's density estimate [Nettleton1939]: the reduction density for which the complete
 * Bouguer anomaly is least correlated with the topography. For each density of a sweep the CBA
 * is recomputed from the unit-density terms, CBA(rho) = FAA (+ inner TC) - (rho/1000) x with
 * x = BC_unit - TC_unit (no new terrain integration), and its Pearson correlation with station
 * height (or with the terrain term TC_unit) is taken.
 *
 * Because CBA(rho) is linear in rho, the correlations come from centred sums formed once:
 * corr(rho) = (S_yt - k S_xt) / sqrt(S_tt (S_yy - 2k S_xy + k^2 S_xx)), k = rho/1000 (exactly
 * the Pearson coefficient of the recomputed CBA; O(n) for any sweep length). Its numerator is
 * linear in rho, so there is at most one zero crossing.
 *
 * The estimate is the zero crossing, linearly interpolated between the two sweep points that
 * bracket it. When the sweep holds no crossing, the sweep density of least |corr| is returned
 * with zeroCrossing = false (atRangeEdge tells whether that is an end of the sweep: widen it).
 *
 * Uncertainty: the density interval over which |corr| stays below tanh(1 / sqrt(n - 3)), the
 * one-standard-deviation level of a zero correlation under Fisher's z transform (Fisher 1921;
 * common practice), half-width taken from the local slope of the curve at the crossing.
 */
import type { DensityInput } from './input.js';
import { localMetres } from './input.js';
import { parasnisVariables } from './parasnis.js';
import { leastSquares } from './least-squares.js';
import { UNIT_DENSITY_KG_M3 } from '../constants.js';

export interface DensityRange {
  fromKgM3: number;
  toKgM3: number;
  stepKgM3: number;
}

export interface NettletonOptions {
  /** The sweep, kg/m^3 (the brief spelling {from, to, step} is accepted too). */
  rangeKgM3: DensityRange | { from: number; to: number; step: number };
  /** Correlate with station height (default) or with the unit-density terrain correction. */
  against?: 'height' | 'terrain';
  /** 'linear': remove a plane in X, Y from both CBA and the target first (partial correlation). */
  trend?: 'none' | 'linear';
}

export interface NettletonResult {
  /** Density of zero (or least) correlation, kg/m^3; NaN when the correlation is undefined. */
  densityKgM3: number;
  /** Half-width of the |corr| < tanh(1/sqrt(n-3)) interval, kg/m^3; NaN without a zero crossing. */
  stderrKgM3: number;
  /** [density kg/m^3, Pearson correlation] for each sweep point. */
  curve: [number, number][];
  /** |corr| at the estimate (about 0 when the sweep crosses zero). */
  minAbsCorr: number;
  /** Stations used. */
  n: number;
  zeroCrossing: boolean;
  atRangeEdge: boolean;
  against: 'height' | 'terrain';
}

/** The sweep densities; throws RangeError on a malformed range (the CLI validates first). */
export function sweepDensities(range: NettletonOptions['rangeKgM3']): number[] {
  const from = 'fromKgM3' in range ? range.fromKgM3 : range.from;
  const to = 'fromKgM3' in range ? range.toKgM3 : range.to;
  const step = 'fromKgM3' in range ? range.stepKgM3 : range.step;
  if (!(step > 0) || !(to >= from) || !Number.isFinite(from) || !Number.isFinite(to) || (to - from) / step > 1e6) {
    throw new RangeError(`bad density range ${from}:${to}:${step}`);
  }
  const count = Math.floor((to - from) / step + 1e-9) + 1;
  return Array.from({ length: count }, (_, i) => from + i * step);
}

/** Residuals of a on a plane in (X, Y), or a itself when there is no trend. */
function detrend(a: Float64Array, xy: { xM: Float64Array; yM: Float64Array } | undefined): Float64Array {
  return xy ? leastSquares([xy.xM, xy.yM], a).residuals : a;
}

export function nettleton(input: DensityInput, opts: NettletonOptions): NettletonResult {
  const against = opts.against ?? 'height';
  const rhos = sweepDensities(opts.rangeKgM3);
  const xy = opts.trend === 'linear' ? localMetres(input) : undefined;
  const v = parasnisVariables(input);
  const x = detrend(v.x, xy);
  const y = detrend(v.y, xy);
  const t = detrend(against === 'height' ? input.heightM : input.tcUnitMgal, xy);
  const n = t.length;
  let mx = 0, my = 0, mt = 0;
  for (let i = 0; i < n; i++) {
    mx += x[i] as number;
    my += y[i] as number;
    mt += t[i] as number;
  }
  mx /= n; my /= n; mt /= n;
  let sxx = 0, syy = 0, stt = 0, sxy = 0, sxt = 0, syt = 0;
  for (let i = 0; i < n; i++) {
    const dx = (x[i] as number) - mx;
    const dy = (y[i] as number) - my;
    const dt = (t[i] as number) - mt;
    sxx += dx * dx; syy += dy * dy; stt += dt * dt;
    sxy += dx * dy; sxt += dx * dt; syt += dy * dt;
  }
  const corrAt = (rho: number): number => {
    const k = rho / UNIT_DENSITY_KG_M3;
    return (syt - k * sxt) / Math.sqrt(stt * (syy - 2 * k * sxy + k * k * sxx));
  };
  const curve: [number, number][] = rhos.map((rho) => [rho, corrAt(rho)]);
  let density = NaN;
  let stderr = NaN;
  let crossing = false;
  for (let i = 0; i + 1 < curve.length && !crossing; i++) {
    const [r0, c0] = curve[i] as [number, number];
    const [r1, c1] = curve[i + 1] as [number, number];
    if (c0 === 0) {
      density = r0;
    } else if (c0 * c1 < 0 || c1 === 0) {
      density = r0 + (c0 / (c0 - c1)) * (r1 - r0);
    } else continue;
    crossing = true;
    const slopePerKgM3 = Math.abs((c1 - c0) / (r1 - r0));
    stderr = n > 3 ? Math.tanh(1 / Math.sqrt(n - 3)) / slopePerKgM3 : NaN;
  }
  if (curve.length === 1 && (curve[0] as [number, number])[1] === 0) {
    density = rhos[0] as number;
    crossing = true;
  }
  let edge = false;
  if (!crossing) {
    let best = -1;
    let bestAbs = Infinity;
    curve.forEach(([, c], i) => {
      if (Math.abs(c) < bestAbs) {
        bestAbs = Math.abs(c);
        best = i;
      }
    });
    if (best >= 0) {
      density = (curve[best] as [number, number])[0];
      edge = best === 0 || best === curve.length - 1;
    }
  }
  return {
    densityKgM3: density,
    stderrKgM3: stderr,
    curve,
    minAbsCorr: Number.isFinite(density) ? Math.abs(corrAt(density)) : NaN,
    n,
    zeroCrossing: crossing,
    atRangeEdge: edge,
    against,
  };
}
