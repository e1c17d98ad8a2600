/**
 * Terrain effect of one pyramid cell seen from the station, as a geometric factor in metres
 * (TC contribution = G rho factor, positive when the cell adds to the terrain correction).
 *
 * The body is the column between the sphere through the station (radius rs = R0 + h_s) and the
 * cell's terrain (radius R0 + H): positive mass where H > h_s, a deficit where H < h_s. The
 * TC is minus its downward attraction (kernels: z positive down) [LaFehr1991 convention].
 * Weight scales the cell's area.
 */
import { lineElementExtentCorrectionFactor, lineElementExtentGzFactor } from '../kernels/line-element-extent.js';
import { prismGzFactor } from '../kernels/prism.js';
import { radialColumnGzFactor } from '../kernels/radial-column.js';
import { EARTH_RADIUS_M } from '../constants.js';
import { sphereDropM } from './geodesy.js';

/** Flat geometry with the sphere's drop: one extent-corrected line element. */
function flatColumnTc(eM: number, nM: number, dxM: number, dyM: number, drop: number, dH: number): number {
  return -lineElementExtentGzFactor(dxM, dyM, eM, nM, drop - dH, drop);
}

/** Geocentric radial column plus the flat extent correction. */
function geoColumnTc(
  eM: number,
  nM: number,
  dxM: number,
  dyM: number,
  drop: number,
  dH: number,
  rs: number,
  omega: number,
  cosPsi: number,
): number {
  return -(
    radialColumnGzFactor(omega, rs, rs, rs + dH, cosPsi) +
    lineElementExtentCorrectionFactor(dxM, dyM, eM, nM, drop - dH, drop)
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
  const drop = sphereDropM(d, rs);
  if (geocentric) {
    const omega = (dxM * dyM) / (EARTH_RADIUS_M * EARTH_RADIUS_M);
    return geoColumnTc(eM, nM, dxM, dyM, drop, dHM, rs, omega, Math.cos(d / EARTH_RADIUS_M));
  }
  return flatColumnTc(eM, nM, dxM, dyM, drop, dHM);
}

/**
 * A coarse cell by the two-point rule: half its area at mean + sd placed at +p from the
 * centre, half at mean - sd placed at -p, with p = cov(H, position) / sd. This reproduces
 * the cell's mean, variance and height-position covariance exactly, so both the linear and
 * the quadratic parts of the column's response to height (the curvature and the terrain
 * terms) see the right amount of mass on the right side of the cell.
 * @param eM, nM cell centre east / north of the station, m
 * @param dxM, dyM cell size, m
 * @param dMeanM mean terrain height minus station height, m
 * @param sdM standard deviation of the terrain height within the cell, m
 * @param pxM, pyM offset of the upper point east / north, m
 * @param weight fraction of the cell in use, 0..1
 */
export function coarseCellTc(
  eM: number,
  nM: number,
  dxM: number,
  dyM: number,
  dMeanM: number,
  sdM: number,
  pxM: number,
  pyM: number,
  weight: number,
  stationHeightM: number,
  geocentric: boolean,
): number {
  if (!(sdM > 0)) return weight * columnTc(eM, nM, dxM, dyM, dMeanM, stationHeightM, geocentric);
  return (
    0.5 *
    weight *
    (columnTc(eM + pxM, nM + pyM, dxM, dyM, dMeanM + sdM, stationHeightM, geocentric) +
      columnTc(eM - pxM, nM - pyM, dxM, dyM, dMeanM - sdM, stationHeightM, geocentric))
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
