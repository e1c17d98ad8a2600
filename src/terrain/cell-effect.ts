/**
 * Terrain effect of one pyramid cell seen from the station, as a geometric factor in metres
 * (TC contribution = G rho factor, positive when the cell adds to the terrain correction).
 *
 * The body is the column between the sphere through the station (radius rs = R0 + h_s) and the
 * cell's terrain (radius R0 + H): positive mass where H > h_s, a deficit where H < h_s. The
 * TC is minus its downward attraction (kernels: z positive down) [LaFehr1991 convention].
 * Weight scales the cell's area.
 */
import { curvedExtentCorrectionFactor, lineElementExtentGzFactor } from '../kernels/line-element-extent.js';
import { prismGzFactor } from '../kernels/prism.js';
import { radialColumnGzFactor } from '../kernels/radial-column.js';
import { EARTH_RADIUS_M } from '../constants.js';
import { sphereDropM } from './geodesy.js';

/** Flat geometry with the sphere's drop: one extent-corrected line element. */
function flatColumnTc(eM: number, nM: number, dxM: number, dyM: number, drop: number, dH: number): number {
  return -lineElementExtentGzFactor(dxM, dyM, eM, nM, drop - dH, drop);
}

/** Geocentric radial column plus the extent correction on the sphere. */
function geoColumnTc(
  eM: number,
  nM: number,
  dxM: number,
  dyM: number,
  dH: number,
  rs: number,
  omega: number,
  cosPsi: number,
): number {
  return -(
    radialColumnGzFactor(omega, rs, rs, rs + dH, cosPsi) +
    curvedExtentCorrectionFactor(dxM, dyM, eM, nM, -dH, 0, rs)
  );
}

/**
 * One column of the cell (flat with drop, or geocentric), TC factor in metres.
 * @param eM, nM column position east / north of the station, m
 * @param dxM, dyM cell size, m
 * @param dHM terrain height minus station height, m
 */
export function columnTc(
  eM: number,
  nM: number,
  dxM: number,
  dyM: number,
  dHM: number,
  stationHeightM: number,
  geocentric: boolean,
): number {
  const rs = EARTH_RADIUS_M + stationHeightM;
  const d = Math.sqrt(eM * eM + nM * nM);
  if (geocentric) {
    const omega = (dxM * dyM) / (EARTH_RADIUS_M * EARTH_RADIUS_M);
    return geoColumnTc(eM, nM, dxM, dyM, dHM, rs, omega, Math.cos(d / EARTH_RADIUS_M));
  }
  return flatColumnTc(eM, nM, dxM, dyM, sphereDropM(d, rs), dHM);
}

/**
 * The two-point representation of a coarse cell's height distribution: weight wUp of the
 * area at height dUp placed at (pUpE, pUpN) from the cell centre, the rest at dLo placed at
 * (pLoE, pLoN). Chosen to reproduce the cell's mean, variance, third central moment and the
 * height-position covariance exactly (common practice: the two-point distribution with given
 * skewness), so a cell cut by an escarpment becomes its two terraces, each on its own side.
 */
export interface TwoPoint {
  wUp: number;
  dUp: number;
  dLo: number;
  pUpE: number;
  pUpN: number;
  pLoE: number;
  pLoN: number;
}

/** Smallest weight given to either point (keeps extreme skewness finite). */
const MIN_POINT_WEIGHT = 0.02;

/**
 * @param dMeanM mean height minus station height, m
 * @param sdM standard deviation, m (> 0)
 * @param m3 third central moment, m^3
 * @param covE, covN covariance of height with the east / north offset, m^2
 * @param halfE, halfN half the cell size east / north, m (bounds the offsets)
 */
export function twoPointFromMoments(
  dMeanM: number,
  sdM: number,
  m3: number,
  covE: number,
  covN: number,
  halfE: number,
  halfN: number,
  out: TwoPoint,
): void {
  const skew = m3 / (sdM * sdM * sdM);
  let wUp = Number.isFinite(skew) ? 0.5 * (1 - skew / Math.sqrt(4 + skew * skew)) : 0.5;
  wUp = Math.min(1 - MIN_POINT_WEIGHT, Math.max(MIN_POINT_WEIGHT, wUp));
  const wLo = 1 - wUp;
  const ratio = Math.sqrt(wLo / wUp);
  const dUp = dMeanM + sdM * ratio;
  const dLo = dMeanM - sdM / ratio;
  const k = 1 / (wUp * (dUp - dLo));
  const pUpE = Math.max(-halfE, Math.min(halfE, covE * k));
  const pUpN = Math.max(-halfN, Math.min(halfN, covN * k));
  out.wUp = wUp;
  out.dUp = dUp;
  out.dLo = dLo;
  out.pUpE = pUpE;
  out.pUpN = pUpN;
  out.pLoE = (-wUp * pUpE) / wLo;
  out.pLoN = (-wUp * pUpN) / wLo;
}

/** A coarse cell by its two-point representation, TC factor in metres, times its weight. */
export function coarseCellTc(
  eM: number,
  nM: number,
  dxM: number,
  dyM: number,
  tp: TwoPoint,
  weight: number,
  stationHeightM: number,
  geocentric: boolean,
): number {
  return (
    weight *
    (tp.wUp * columnTc(eM + tp.pUpE, nM + tp.pUpN, dxM, dyM, tp.dUp, stationHeightM, geocentric) +
      (1 - tp.wUp) * columnTc(eM + tp.pLoE, nM + tp.pLoN, dxM, dyM, tp.dLo, stationHeightM, geocentric))
  );
}

/** A native cell as an exact flat-topped prism, lowered by the sphere's drop at its centre. */
export function prismCellTc(eM: number, nM: number, dxM: number, dyM: number, dHM: number, stationHeightM: number): number {
  const rs = EARTH_RADIUS_M + stationHeightM;
  const drop = sphereDropM(Math.sqrt(eM * eM + nM * nM), rs);
  const hx = 0.5 * dxM;
  const hy = 0.5 * dyM;
  return -prismGzFactor(eM - hx, eM + hx, nM - hy, nM + hy, drop - dHM, drop);
}
