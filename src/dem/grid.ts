/**
 * The in-memory elevation grid every part of talus works on.
 *
 * Conventions (pinned by tests):
 * - Row 0 is the NORTH edge (south-up files are flipped at read time); column 0 is the west edge.
 * - Pixel-is-area: the value of cell (row, col) belongs to the cell whose centre is at
 *   x = originX + (col + 0.5) * cellSizeX,  y = originY - (row + 0.5) * cellSizeY,
 *   in the grid's CRS units (degrees for geographic CRSs). Pixel-is-point files are converted
 *   to this convention at read time (the origin is shifted by half a cell).
 * - cellSizeX > 0 and cellSizeY > 0 (both in CRS units).
 * - Elevations are metres (converted from --dem-units at read time); nodata is NaN.
 * - `data` is a Float32Array backed by a SharedArrayBuffer so worker threads share it unchanged.
 */

export interface CrsInfo {
  /** 'geographic' (lon/lat degrees) or 'projected' (easting/northing). */
  kind: 'geographic' | 'projected';
  /** A proj4 definition string usable by the proj4 package. */
  proj4: string;
  /** Human label, e.g. "EPSG:32633" or "user-defined". */
  label: string;
  /** EPSG code when known. */
  epsg?: number;
  /** Metres per CRS unit for projected CRSs (1 for metre grids, 0.3048 for foot grids); NaN for geographic. */
  linearUnitM: number;
}

export interface DemGrid {
  /** Number of columns. */
  width: number;
  /** Number of rows. */
  height: number;
  /** x of the grid's west edge, CRS units. */
  originX: number;
  /** y of the grid's north edge, CRS units. */
  originY: number;
  /** Cell width, CRS units (> 0). */
  cellSizeX: number;
  /** Cell height, CRS units (> 0). */
  cellSizeY: number;
  /** row-major elevations in metres, NaN = nodata; length width*height; SharedArrayBuffer-backed. */
  data: Float32Array;
  crs: CrsInfo;
  /** Where the grid came from (file path, or a description for synthetic grids). */
  source: string;
}

/** x (CRS units) of the centre of column `col`. */
export function cellCentreX(g: DemGrid, col: number): number {
  return g.originX + (col + 0.5) * g.cellSizeX;
}

/** y (CRS units) of the centre of row `row` (row 0 = north). */
export function cellCentreY(g: DemGrid, row: number): number {
  return g.originY - (row + 0.5) * g.cellSizeY;
}

/** A Float32Array of `length` elements on a fresh SharedArrayBuffer. */
export function sharedFloat32(length: number): Float32Array {
  return new Float32Array(new SharedArrayBuffer(length * Float32Array.BYTES_PER_ELEMENT));
}

/** Builds a grid from a function of cell-centre coordinates (for synthetic DEMs and tests). */
export function gridFromFunction(
  spec: Omit<DemGrid, 'data'>,
  heightAt: (x: number, y: number, row: number, col: number) => number,
): DemGrid {
  const data = sharedFloat32(spec.width * spec.height);
  for (let row = 0; row < spec.height; row++) {
    const y = spec.originY - (row + 0.5) * spec.cellSizeY;
    for (let col = 0; col < spec.width; col++) {
      data[row * spec.width + col] = heightAt(spec.originX + (col + 0.5) * spec.cellSizeX, y, row, col);
    }
  }
  return { ...spec, data };
}
