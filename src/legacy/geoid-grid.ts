/**
 * Geoid undulation grids: a DemGrid whose values are the undulation N (m, geoid above the
 * ellipsoid), sampled bilinearly at station positions.
 *
 * Sampling convention: values belong to cell centres (the DemGrid pixel-is-area convention),
 * and the surface is bilinear between neighbouring centres. Between the outermost centres and
 * the grid's edge the nearest edge centres are used (constant outwards). Outside the grid's
 * extent, or where a centre that carries weight is nodata (NaN), the result is NaN: the
 * caller flags the station.
 */
import type { DemGrid } from '../dem/grid.js';

/** Fractional cell index along one axis, or NaN outside [0, n * cell]. */
function fractionalIndex(offsetCrs: number, cellSize: number, n: number): number {
  const u = offsetCrs / cellSize;
  if (!(u >= 0 && u <= n)) return NaN;
  const f = u - 0.5;
  return f < 0 ? 0 : f > n - 1 ? n - 1 : f;
}

/**
 * Bilinear value of `grid` at (x, y), given in the grid's CRS units (degrees for geographic
 * grids: no longitude wrapping is done). NaN outside the grid or next to nodata.
 */
export function sampleBilinear(grid: DemGrid, x: number, y: number): number {
  const fc = fractionalIndex(x - grid.originX, grid.cellSizeX, grid.width);
  const fr = fractionalIndex(grid.originY - y, grid.cellSizeY, grid.height);
  if (Number.isNaN(fc) || Number.isNaN(fr)) return NaN;
  const c0 = Math.floor(fc);
  const r0 = Math.floor(fr);
  const tx = fc - c0;
  const ty = fr - r0;
  const c1 = tx > 0 ? c0 + 1 : c0;
  const r1 = ty > 0 ? r0 + 1 : r0;
  const w = grid.width;
  const d = grid.data;
  // Terms whose weight is exactly 0 are skipped, so a point on a valid centre next to nodata
  // keeps its value; any weighted nodata node makes the result NaN.
  let sum = 0;
  const add = (row: number, col: number, weight: number): void => {
    if (weight !== 0) sum += weight * (d[row * w + col] ?? NaN);
  };
  add(r0, c0, (1 - tx) * (1 - ty));
  add(r0, c1, tx * (1 - ty));
  add(r1, c0, (1 - tx) * ty);
  add(r1, c1, tx * ty);
  return sum;
}

/** Undulations N (m) at each station position (xs, ys in the grid's CRS); NaN where unavailable. */
export function sampleUndulations(grid: DemGrid, xs: Float64Array, ys: Float64Array): Float64Array {
  const out = new Float64Array(xs.length);
  for (let i = 0; i < xs.length; i++) out[i] = sampleBilinear(grid, xs[i] ?? NaN, ys[i] ?? NaN);
  return out;
}
