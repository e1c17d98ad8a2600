/**
 * Resolution pyramid of a DEM: level 0 is the grid itself, level L aggregates 2^L x 2^L native
 * cells. Every coarse cell carries, over the valid native heights H under it:
 * - the MEAN, the VARIANCE and the THIRD CENTRAL MOMENT (physics.md §5 "Aggregated cells": a
 *   mean height alone underestimates a rough cell's effect by about var/(mean^2 + var) of the
 *   height difference; the third moment tells a cell cut by an escarpment from a rough one);
 * - the COVARIANCES of H with the east and south native-cell offsets from the cell centre
 *   (cov(H, col), cov(H, row), in m x native cells), which say on which side of the cell the
 *   high ground lies (a coarse cell on a slope otherwise errs to first order in cell/D);
 * - the WEIGHT, the fraction of its native footprint that holds data (and, for a far-zone DEM,
 *   is not already covered by the fine DEM).
 * Cells at the east and south edges are clipped to the grid; their footprint is the clipped one.
 * Children are combined with the parallel (pairwise) central-moment formulas, relative to the
 * parent mean, so no large raw moments cancel. Within-child centroid offsets of partly valid
 * children are neglected.
 *
 * Storage: a stored cell keeps its weight and mean and, instead of the raw moments, the
 * two-point representation they define (cell-effect.ts twoPointFromMoments: the upper point's
 * share, the heights of both points relative to the mean, the upper point's offset from the
 * centre in native cells), which depends only on the cell and not on the station; so the walk
 * spends no division or square root on it. The CELL_STRIDE values of a cell sit side by side in
 * one Float32Array per level (32 bytes, two cells per cache line). The moments themselves are
 * kept for two rows per level only: the levels are built together in row strips, each row of
 * level L+1 as soon as its two child rows of level L exist (rows 2r and 2r+1 sit in slots 0 and 1
 * of level L's strip), so the build holds no whole level of moments beside the stored cells; every
 * cell is combined with the same arithmetic as level by level. Level 0 stores nothing extra: its variance and
 * covariances are 0 and its weight is 1 where the height is not NaN (times the optional native
 * weight). Level 1 is not stored either: its moments are combined from its four native cells
 * when read (level1Moments), with the same arithmetic and float32 rounding as the build.
 * Storing it would cost 2x the DEM's bytes; the levels from 2 up cost 0.67x. Coarse arrays live
 * on SharedArrayBuffers so worker threads share the pyramid without copying; children are
 * combined in float64 and stored as float32.
 */
import type { DemGrid } from '../dem/grid.js';
import { sharedFloat32 } from '../dem/grid.js';
import type { TwoPoint } from './cell-effect.js';
import { twoPointFromMoments } from './cell-effect.js';
import { type CellScratch, combineCell, makeCellScratch, MOM_COV_COL, MOM_COV_ROW, MOM_MEAN, MOM_MOMENT3, MOM_STRIDE, MOM_VARIANCE, MOM_WEIGHT, span } from './cell-moments.js';

/** Offsets of a stored cell's values in a level's `cells` array, and the floats per cell. */
/** Fraction of the native footprint with data and in use, 0..1. */
export const CELL_WEIGHT = 0;
/** Mean valid height, m (NaN when the weight is 0). */
export const CELL_MEAN = 1;
/** Standard deviation of the valid native heights, m (0: the cell is one flat column). */
export const CELL_SD = 2;
/** Share of the upper point of the two-point representation (0 when the sd is 0). */
export const CELL_W_UP = 3;
/** Upper point's height above the mean, m. */
export const CELL_UP_OFFSET = 4;
/** Lower point's depth below the mean, m. */
export const CELL_LO_OFFSET = 5;
/** Upper point's offset from the cell centre, native columns (east) and rows (south). */
export const CELL_P_UP_COL = 6;
export const CELL_P_UP_ROW = 7;
export const CELL_STRIDE = 8;

/** The first level that is stored; level 1 is combined from level 0 when read. */
export const FIRST_STORED_LEVEL = 2;

export interface PyramidLevel {
  /** Level number (0 = native). */
  level: number;
  /** Native cells per side of one cell of this level (2^level). */
  factor: number;
  width: number;
  height: number;
  /** CELL_STRIDE values per cell (two-point form), row-major; null at level 0 (the DEM) and level 1 (not stored). */
  cells: Float32Array | null;
}

export interface Pyramid {
  /** Native width and height (the grid's). */
  nativeWidth: number;
  nativeHeight: number;
  /** Native heights, m (the grid's data). */
  heights: Float32Array;
  /** Native weights 0..1 (0 where the height is NaN), or null: 1 where the height is not NaN. */
  nativeWeight: Float32Array | null;
  levels: PyramidLevel[];
}

/**
 * Builds the pyramid. `nativeWeight` (optional, length width*height, SharedArrayBuffer-backed
 * for sharing) multiplies the validity of each native cell: the far-zone DEM passes
 * 1 - (fraction covered by the fine DEM). Levels are added until one cell covers the grid.
 */
export function buildPyramid(grid: DemGrid, nativeWeight?: Float32Array): Pyramid {
  const { width, height, data } = grid;
  let weight0: Float32Array | null = null;
  if (nativeWeight) {
    weight0 = nativeWeight;
    for (let i = 0; i < width * height; i++) if (Number.isNaN(data[i] as number)) weight0[i] = 0;
  }
  const levels: PyramidLevel[] = [{ level: 0, factor: 1, width, height, cells: null }];
  for (let prev = levels[0] as PyramidLevel; prev.width > 1 || prev.height > 1; ) {
    const level = prev.level + 1;
    const w = Math.ceil(prev.width / 2);
    const h = Math.ceil(prev.height / 2);
    const cells = level >= FIRST_STORED_LEVEL ? sharedFloat32(w * h * CELL_STRIDE) : null;
    prev = { level, factor: prev.factor * 2, width: w, height: h, cells };
    levels.push(prev);
  }
  const pyr: Pyramid = { nativeWidth: width, nativeHeight: height, heights: data, nativeWeight: weight0, levels };
  if (levels.length > FIRST_STORED_LEVEL) buildStoredLevels(pyr);
  return pyr;
}

/**
 * Fills the cells of levels FIRST_STORED_LEVEL and up, row by row: after row r of level L, row
 * r >> 1 of level L+1 is built when both its child rows exist (r odd, or r the last row).
 * strips[L] holds level L's moments for two rows, row r in slot r & 1.
 */
function buildStoredLevels(pyr: Pyramid): void {
  const levels = pyr.levels;
  const top = levels.length - 1;
  const strips: (Float32Array | null)[] = levels.map((l) => (l.level >= FIRST_STORED_LEVEL ? new Float32Array(2 * l.width * MOM_STRIDE) : null));
  const scratch = makeCellScratch();
  const firstRows = (levels[FIRST_STORED_LEVEL] as PyramidLevel).height;
  for (let firstRow = 0; firstRow < firstRows; firstRow++) {
    let level = FIRST_STORED_LEVEL;
    let row = firstRow;
    for (;;) {
      buildRow(pyr, level, row, strips[level - 1] ?? null, strips[level] as Float32Array, scratch);
      if (level === top || ((row & 1) === 0 && row !== (levels[level] as PyramidLevel).height - 1)) break;
      level++;
      row >>= 1;
    }
  }
}

/** Row `row` of `level`: moments into slot row & 1 of `strip`, two-point form into the level's cells. */
function buildRow(pyr: Pyramid, level: number, row: number, childStrip: Float32Array | null, strip: Float32Array, scratch: CellScratch): void {
  const lv = pyr.levels[level] as PyramidLevel;
  const cells = lv.cells as Float32Array;
  const w = lv.width;
  const nr = span(row, lv.factor, pyr.nativeHeight);
  const slot = (row & 1) * w;
  for (let col = 0; col < w; col++) {
    const o = (slot + col) * MOM_STRIDE;
    combineCell(pyr, level, row, col, childStrip, strip, o, scratch);
    storeTwoPoint(strip, o, span(col, lv.factor, pyr.nativeWidth), nr, cells, (row * w + col) * CELL_STRIDE, scratch.twoPoint);
  }
}

/** The two-point form of one cell's moments (nc x nr native cells) into cells[c ...]. */
function storeTwoPoint(m: Float32Array, o: number, nc: number, nr: number, cells: Float32Array, c: number, tp: TwoPoint): void {
  const sd = Math.sqrt(m[o + MOM_VARIANCE] as number);
  cells[c + CELL_WEIGHT] = m[o + MOM_WEIGHT] as number;
  cells[c + CELL_MEAN] = m[o + MOM_MEAN] as number;
  if (!(sd > 0)) {
    cells[c + CELL_SD] = 0;
    return; // the other values stay 0
  }
  // relative to the mean, offsets in native cells (south positive; the walk scales and turns them)
  twoPointFromMoments(0, sd, m[o + MOM_MOMENT3] as number, m[o + MOM_COV_COL] as number, m[o + MOM_COV_ROW] as number, 0.5 * nc, 0.5 * nr, tp);
  cells[c + CELL_SD] = sd;
  cells[c + CELL_W_UP] = tp.wUp;
  cells[c + CELL_UP_OFFSET] = tp.dUp;
  cells[c + CELL_LO_OFFSET] = -tp.dLo;
  cells[c + CELL_P_UP_COL] = tp.pUpE;
  cells[c + CELL_P_UP_ROW] = tp.pUpN;
}
