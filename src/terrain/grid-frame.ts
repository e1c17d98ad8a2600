/**
 * Station-relative geometry of a DEM grid: where a block of native cells lies, in metres east
 * and north of the station, and how big it is.
 *
 * - Projected grids: offsets are CRS-unit differences times the unit's length in metres, in the
 *   grid's own axes (grid north; the meridian convergence only rotates the whole picture, which
 *   leaves the vertical attraction unchanged). Projection scale error (< 1e-3 for UTM) is
 *   ignored.
 * - Geographic grids: a cell's true size at its latitude, from the GRS80 local radii at the
 *   station: north = M(phi_s) dphi, east = N(phi_s) cos(phi_m) dlambda with phi_m the mean of
 *   the station and cell latitudes (the mid-latitude rule, second-order accurate).
 */
import type { DemGrid } from '../dem/grid.js';
import { meridianRadiusM, primeVerticalRadiusM } from './geodesy.js';

const DEG = Math.PI / 180;

export interface GridFrame {
  geographic: boolean;
  originX: number;
  originY: number;
  cellSizeX: number;
  cellSizeY: number;
  /** Projected: metres per CRS unit. */
  unitM: number;
  /** Station position in the grid CRS. */
  stationX: number;
  stationY: number;
  /** Geographic: metres per degree north (M dphi) and per degree east at the equator (N). */
  mPerDegNorth: number;
  nPerDeg: number;
}

export function makeGridFrame(grid: DemGrid, stationX: number, stationY: number, stationLatDeg: number): GridFrame {
  const f: GridFrame = {
    geographic: false,
    originX: 0,
    originY: 0,
    cellSizeX: 1,
    cellSizeY: 1,
    unitM: NaN,
    stationX: 0,
    stationY: 0,
    mPerDegNorth: NaN,
    nPerDeg: NaN,
  };
  setGridFrame(f, grid, stationX, stationY, stationLatDeg);
  return f;
}

/** Re-aims an existing frame at another grid or station (no allocation per station). */
export function setGridFrame(f: GridFrame, grid: DemGrid, stationX: number, stationY: number, stationLatDeg: number): void {
  const geographic = grid.crs.kind === 'geographic';
  f.geographic = geographic;
  f.originX = grid.originX;
  f.originY = grid.originY;
  f.cellSizeX = grid.cellSizeX;
  f.cellSizeY = grid.cellSizeY;
  f.unitM = geographic ? NaN : grid.crs.linearUnitM;
  f.stationX = stationX;
  f.stationY = stationY;
  f.mPerDegNorth = meridianRadiusM(stationLatDeg) * DEG;
  f.nPerDeg = primeVerticalRadiusM(stationLatDeg) * DEG;
}

/**
 * Geometry of the block of native columns [c0, c1) and rows [r0, r1) (row 0 north):
 * writes [eastM, northM, widthM, heightM] of its centre and size into `out`.
 */
export function blockGeometry(f: GridFrame, c0: number, c1: number, r0: number, r1: number, out: Float64Array): void {
  const x = f.originX + 0.5 * (c0 + c1) * f.cellSizeX;
  const y = f.originY - 0.5 * (r0 + r1) * f.cellSizeY;
  if (f.geographic) {
    const cosMid = Math.cos(0.5 * (y + f.stationY) * DEG);
    const ePerDeg = f.nPerDeg * cosMid;
    out[0] = (x - f.stationX) * ePerDeg;
    out[1] = (y - f.stationY) * f.mPerDegNorth;
    out[2] = (c1 - c0) * f.cellSizeX * ePerDeg;
    out[3] = (r1 - r0) * f.cellSizeY * f.mPerDegNorth;
  } else {
    const u = f.unitM;
    out[0] = (x - f.stationX) * u;
    out[1] = (y - f.stationY) * u;
    out[2] = (c1 - c0) * f.cellSizeX * u;
    out[3] = (r1 - r0) * f.cellSizeY * u;
  }
}

/**
 * Fractional grid coordinates (col, row; cell centres at integers) of the point eastM, northM
 * from the station. Inverse of blockGeometry's centre mapping (up to the mid-latitude rule).
 */
export function localToGrid(f: GridFrame, eastM: number, northM: number, out: Float64Array): void {
  let x: number;
  let y: number;
  if (f.geographic) {
    y = f.stationY + northM / f.mPerDegNorth;
    x = f.stationX + eastM / (f.nPerDeg * Math.cos(0.5 * (y + f.stationY) * DEG));
  } else {
    x = f.stationX + eastM / f.unitM;
    y = f.stationY + northM / f.unitM;
  }
  out[0] = (x - f.originX) / f.cellSizeX - 0.5;
  out[1] = (f.originY - y) / f.cellSizeY - 0.5;
}

/** Bilinear height at fractional grid coordinates (col, row); NaN outside the grid or near nodata. */
export function bilinearHeight(grid: DemGrid, col: number, row: number): number {
  const { width, height, data } = grid;
  // Clamp half a cell beyond the outermost centres: the edge cells extend to the grid border.
  if (!(col >= -0.5 && col <= width - 0.5 && row >= -0.5 && row <= height - 0.5)) return NaN;
  const cc = Math.min(Math.max(col, 0), width - 1);
  const rr = Math.min(Math.max(row, 0), height - 1);
  const c0 = Math.min(Math.floor(cc), width - 2 < 0 ? 0 : width - 2);
  const r0 = Math.min(Math.floor(rr), height - 2 < 0 ? 0 : height - 2);
  const c1 = Math.min(c0 + 1, width - 1);
  const r1 = Math.min(r0 + 1, height - 1);
  const tx = cc - c0;
  const ty = rr - r0;
  const a = data[r0 * width + c0] as number;
  const b = data[r0 * width + c1] as number;
  const c = data[r1 * width + c0] as number;
  const d = data[r1 * width + c1] as number;
  return (a * (1 - tx) + b * tx) * (1 - ty) + (c * (1 - tx) + d * tx) * ty;
}

/** Bilinear height at (x, y) in the grid's CRS units (see bilinearHeight for the edges and nodata). */
export function bilinearHeightAt(grid: DemGrid, x: number, y: number): number {
  return bilinearHeight(grid, (x - grid.originX) / grid.cellSizeX - 0.5, (grid.originY - y) / grid.cellSizeY - 0.5);
}
