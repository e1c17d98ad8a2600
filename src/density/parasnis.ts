/**
 * Parasnis's density estimate [Parasnis1952]: with the complete Bouguer anomaly
 * CBA = FAA - (rho/1000) (BC_unit - TC_unit) [+ inner TC] taken as uncorrelated noise about a
 * constant, FAA (+ inner TC) = (rho/1000) x + c, x = BC_unit - TC_unit (the attraction of the
 * topography for 1000 kg/m^3), so the slope of FAA on x is the density. Options: a linear
 * regional trend a_x X + a_y Y fitted at the same time (X, Y local metres), and a robust fit.
 */
import type { DensityInput } from './input.js';
import { localMetres } from './input.js';
import type { RobustMethod } from './robust-fit.js';
import { robustLeastSquares } from './robust-fit.js';
import { UNIT_DENSITY_KG_M3 } from '../constants.js';

export interface ParasnisOptions {
  trend?: 'none' | 'linear';
  robust?: RobustMethod;
}

export interface ParasnisResult {
  /** Estimated density, kg/m^3. NaN when the fit is singular (e.g. all x equal). */
  densityKgM3: number;
  /** Its standard error, kg/m^3 (for a robust fit: the weighted least-squares value at the final weights). */
  stderrKgM3: number;
  /** Coefficient of determination of the (weighted) fit. */
  r2: number;
  /** Stations used. */
  n: number;
  /** The intercept c, mGal (the CBA level; with a trend, at the stations' mean position). */
  interceptMgal: number;
  /** Regional trend, mGal per metre east (ax) and north (ay), when requested. */
  trend?: { ax: number; ay: number };
  /** Stations down-weighted or removed by the robust fit (0 without one). */
  downweighted: number;
  /** Final weight of each station (all 1 without a robust fit). */
  weights: Float64Array;
  /** The regression points: x = (BC_unit - TC_unit) mGal per 1000 kg/m^3, y = FAA (+ inner TC) mGal. */
  points: { x: number; y: number }[];
}

/** The Parasnis regression variables of each station. */
export function parasnisVariables(input: DensityInput): { x: Float64Array; y: Float64Array } {
  const n = input.ids.length;
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    x[i] = (input.bouguerUnitMgal[i] as number) - (input.tcUnitMgal[i] as number);
    y[i] = (input.faaMgal[i] as number) + (input.innerTcMgal ? (input.innerTcMgal[i] as number) : 0);
  }
  return { x, y };
}

export function parasnis(input: DensityInput, opts: ParasnisOptions = {}): ParasnisResult {
  const { x, y } = parasnisVariables(input);
  const withTrend = opts.trend === 'linear';
  const columns: ArrayLike<number>[] = [x];
  if (withTrend) {
    // centred on the mean position, so the intercept is the CBA level at the survey centre
    const { xM, yM } = localMetres(input);
    const mean = (a: Float64Array): number => a.reduce((t, v) => t + v, 0) / a.length;
    const x0 = mean(xM);
    const y0 = mean(yM);
    columns.push(xM.map((v) => v - x0), yM.map((v) => v - y0));
  }
  const rf = robustLeastSquares(columns, y, opts.robust ?? 'none');
  const f = rf.fit;
  const points = Array.from(x, (xi, i) => ({ x: xi, y: y[i] as number }));
  return {
    densityKgM3: (f.coef[0] as number) * UNIT_DENSITY_KG_M3,
    stderrKgM3: (f.stderr[0] as number) * UNIT_DENSITY_KG_M3,
    r2: f.r2,
    n: f.n,
    interceptMgal: f.intercept,
    ...(withTrend ? { trend: { ax: f.coef[1] as number, ay: f.coef[2] as number } } : {}),
    downweighted: rf.downweighted,
    weights: rf.weights,
    points,
  };
}
