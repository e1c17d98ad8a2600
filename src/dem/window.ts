/**
 * A window in the DEM's CRS units → the range of grid cells that overlap it, clipped to the
 * file. Grid rows count from the north (DemGrid convention), whatever the file's row order.
 */
import { InputError } from '../errors.js';

/** Axis-aligned rectangle in the DEM's CRS units (degrees for geographic DEMs). */
export interface DemWindow {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

/** Half-open cell ranges [col0, col1) × [row0, row1), grid rows from the north. */
export interface CellRange {
  col0: number;
  col1: number;
  row0: number;
  row1: number;
}

/** The lattice a grid lives on. */
export interface GridLattice {
  width: number;
  height: number;
  originX: number;
  originY: number;
  cellSizeX: number;
  cellSizeY: number;
}

/**
 * Window edges within this fraction of a cell of a cell edge count as on the edge, so a window
 * that is itself an exact cell-aligned rectangle does not pick up a sliver row from rounding.
 */
const EDGE_SLACK_CELLS = 1e-9;

export function checkWindow(w: DemWindow, what: string): void {
  if (!(Number.isFinite(w.minX) && Number.isFinite(w.minY) && Number.isFinite(w.maxX) && Number.isFinite(w.maxY))) {
    throw new InputError(`${what} has a non-finite edge (${w.minX}, ${w.minY}, ${w.maxX}, ${w.maxY})`);
  }
  if (!(w.minX <= w.maxX && w.minY <= w.maxY)) {
    throw new InputError(`${what} has min > max (x ${w.minX}..${w.maxX}, y ${w.minY}..${w.maxY}); expected minX <= maxX and minY <= maxY`);
  }
}

/** Cells of `g` that overlap `w` (touching an edge is not overlapping); may be empty. */
export function cellsInWindow(g: GridLattice, w?: DemWindow): CellRange {
  if (w === undefined) return { col0: 0, col1: g.width, row0: 0, row1: g.height };
  checkWindow(w, 'the DEM window');
  const clamp = (v: number, hi: number): number => Math.min(Math.max(v, 0), hi);
  const col0 = clamp(Math.floor((w.minX - g.originX) / g.cellSizeX + EDGE_SLACK_CELLS), g.width);
  const col1 = clamp(Math.ceil((w.maxX - g.originX) / g.cellSizeX - EDGE_SLACK_CELLS), g.width);
  const row0 = clamp(Math.floor((g.originY - w.maxY) / g.cellSizeY + EDGE_SLACK_CELLS), g.height);
  const row1 = clamp(Math.ceil((g.originY - w.minY) / g.cellSizeY - EDGE_SLACK_CELLS), g.height);
  if (col1 <= col0 || row1 <= row0) return { col0, col1: col0, row0, row1: row0 };
  return { col0, col1, row0, row1 };
}

export function isEmptyRange(r: CellRange): boolean {
  return r.col1 <= r.col0 || r.row1 <= r.row0;
}
