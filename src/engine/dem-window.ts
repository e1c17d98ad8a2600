/**
 * The part of a DEM a run needs: the stations' extent plus the correction radius, in the
 * DEM's CRS units.
 */
import type { CrsInfo } from '../dem/grid.js';
import type { DemWindow } from '../dem/window.js';
import { meridianRadiusM, primeVerticalRadiusM } from '../terrain/geodesy.js';

/**
 * @param xs, ys station positions in the DEM's CRS
 * @param latDeg station latitudes (for geographic DEMs)
 * @param radiusM correction radius, m
 */
export function windowAround(crs: CrsInfo, xs: Float64Array, ys: Float64Array, latDeg: Float64Array, radiusM: number): DemWindow {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  let maxAbsLat = 0;
  for (let i = 0; i < xs.length; i++) {
    const x = xs[i] as number;
    const y = ys[i] as number;
    if (!(Number.isFinite(x) && Number.isFinite(y))) continue;
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
    maxAbsLat = Math.max(maxAbsLat, Math.abs(latDeg[i] as number));
  }
  let padX: number;
  let padY: number;
  if (crs.kind === 'geographic') {
    const degN = (180 / Math.PI) / meridianRadiusM(maxAbsLat);
    const lat = Math.min(89, maxAbsLat + radiusM * degN);
    padY = radiusM * degN;
    padX = (radiusM * (180 / Math.PI)) / (primeVerticalRadiusM(lat) * Math.cos((lat * Math.PI) / 180));
  } else {
    padX = radiusM / crs.linearUnitM;
    padY = padX;
  }
  // one extra cell's worth of margin is added by the reader's cell rounding
  return { minX: minX - padX, minY: minY - padY, maxX: maxX + padX, maxY: maxY + padY };
}
