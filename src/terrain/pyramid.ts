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
 * Storage: the six values of a coarse cell sit side by side in one Float32Array per level
 * (CELL_STRIDE floats per cell, in the order of the CELL_* offsets), so reading a cell touches
 * one cache line instead of six arrays. Level 0 stores nothing extra: its variance and
 * covariances are 0 and its weight is 1 where the height is not NaN (times the optional native
 * weight). Level 1 is not stored either: its cells are combined from their four native cells
 * when read (readCell), with the same arithmetic and float32 rounding as a stored level, so the
 * results are the same bit for bit. Storing it would cost 1.5x the DEM's bytes; the levels
 * from 2 up cost 0.5x. Coarse arrays live on SharedArrayBuffers so worker threads share the
 * pyramid without copying; children are combined in float64 and stored as float32.
 */
import type { DemGrid } from '../dem/grid.js';
import { sharedFloat32 } from '../dem/grid.js';

/** Offsets of a cell's values in a level's `cells` array, and the floats per cell. */
export const CELL_WEIGHT = 0;
/** Mean valid height, m (NaN when the weight is 0). */
export const CELL_MEAN = 1;
/** Variance of the valid native heights, m^2. */
export const CELL_VARIANCE = 2;
/** Third central moment of the valid native heights, m^3. */
export const CELL_MOMENT3 = 3;
/** cov(H, native column offset), m x cells. */
export const CELL_COV_COL = 4;
/** cov(H, native row offset, rows increase southward), m x cells. */
export const CELL_COV_ROW = 5;
export const CELL_STRIDE = 6;

/** The first level that is stored; level 1 is combined from level 0 when read. */
export const FIRST_STORED_LEVEL = 2;

export interface PyramidLevel {
  /** Level number (0 = native). */
  level: number;
  /** Native cells per side of one cell of this level (2^level). */
  factor: number;
  width: number;
  height: number;
  /** CELL_STRIDE values per cell, row-major; null at level 0 (the DEM) and level 1 (not stored). */
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

/** Scratch for reading and combining cells (one per thread); allocates nothing once made. */
export interface CellScratch {
  /** The children's values, CELL_STRIDE each. */
  child: Float32Array;
  /** Children's weights times their native areas, and their centre offsets from the parent's. */
  cw: Float64Array;
  ox: Float64Array;
  oy: Float64Array;
  /** Scratch for children that are themselves combined when read. */
  next: CellScratch | null;
}

export function makeCellScratch(): CellScratch {
  return {
    child: new Float32Array(4 * CELL_STRIDE),
    cw: new Float64Array(4),
    ox: new Float64Array(4),
    oy: new Float64Array(4),
    next: null,
  };
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
  const pyr: Pyramid = {
    nativeWidth: width,
    nativeHeight: height,
    heights: data,
    nativeWeight: weight0,
    levels: [{ level: 0, factor: 1, width, height, cells: null }],
  };
  const scratch = makeCellScratch();
  let prev = pyr.levels[0] as PyramidLevel;
  while (prev.width > 1 || prev.height > 1) {
    const level = prev.level + 1;
    const w = Math.ceil(prev.width / 2);
    const h = Math.ceil(prev.height / 2);
    const next: PyramidLevel = { level, factor: prev.factor * 2, width: w, height: h, cells: null };
    if (level >= FIRST_STORED_LEVEL) {
      const cells = sharedFloat32(w * h * CELL_STRIDE);
      for (let row = 0; row < h; row++) {
        for (let col = 0; col < w; col++) combineCell(pyr, level, row, col, cells, (row * w + col) * CELL_STRIDE, scratch);
      }
      next.cells = cells;
    }
    pyr.levels.push(next);
    prev = next;
  }
  return pyr;
}

/** Writes the CELL_STRIDE values of cell (row, col) of `level` into out[o ...]. */
export function readCell(pyr: Pyramid, level: number, row: number, col: number, out: Float32Array, o: number, scratch: CellScratch): void {
  if (level === 0) {
    const k = row * pyr.nativeWidth + col;
    const h = pyr.heights[k] as number;
    out[o + CELL_WEIGHT] = pyr.nativeWeight !== null ? (pyr.nativeWeight[k] as number) : Number.isNaN(h) ? 0 : 1;
    out[o + CELL_MEAN] = h;
    out[o + CELL_VARIANCE] = 0;
    out[o + CELL_MOMENT3] = 0;
    out[o + CELL_COV_COL] = 0;
    out[o + CELL_COV_ROW] = 0;
    return;
  }
  const lv = pyr.levels[level] as PyramidLevel;
  const cells = lv.cells;
  if (cells === null) {
    if (level === 1) combineNative(pyr, row, col, out, o);
    else combineCell(pyr, level, row, col, out, o, scratch);
    return;
  }
  const i = (row * lv.width + col) * CELL_STRIDE;
  for (let j = 0; j < CELL_STRIDE; j++) out[o + j] = cells[i + j] as number;
}

/** Number of native cells of a cell's clipped footprint along one axis. */
function span(index: number, factor: number, nativeSize: number): number {
  return Math.min((index + 1) * factor, nativeSize) - index * factor;
}

/**
 * combineCell for a level-1 cell, read straight from the native heights: the children's
 * variances, third moments and covariances are 0, and adding an exact 0 changes nothing, so
 * the result is the same bit for bit.
 */
function combineNative(pyr: Pyramid, row: number, col: number, out: Float32Array, o: number): void {
  const nW = pyr.nativeWidth;
  const nH = pyr.nativeHeight;
  const heights = pyr.heights;
  const nativeWeight = pyr.nativeWeight;
  const c0 = col * 2;
  const r0 = row * 2;
  const nc = Math.min(c0 + 2, nW) - c0;
  const nr = Math.min(r0 + 2, nH) - r0;
  const pColCentre = c0 + 0.5 * nc;
  const pRowCentre = r0 + 0.5 * nr;
  // children in row-major order, as combineCell visits them
  let wSum = 0;
  let m1 = 0;
  for (let dr = 0; dr < nr; dr++) {
    for (let dc = 0; dc < nc; dc++) {
      const k = (r0 + dr) * nW + c0 + dc;
      const h = heights[k] as number;
      const w = nativeWeight !== null ? (nativeWeight[k] as number) : Number.isNaN(h) ? 0 : 1;
      if (!(w > 0)) continue;
      wSum += w;
      m1 += w * h;
    }
  }
  if (!(wSum > 0)) {
    out[o + CELL_WEIGHT] = 0;
    out[o + CELL_MEAN] = NaN;
    out[o + CELL_VARIANCE] = 0;
    out[o + CELL_MOMENT3] = 0;
    out[o + CELL_COV_COL] = 0;
    out[o + CELL_COV_ROW] = 0;
    return;
  }
  const mu = m1 / wSum;
  let v = 0;
  let t = 0;
  let hx = 0;
  let hy = 0;
  for (let dr = 0; dr < nr; dr++) {
    const oy = r0 + dr + 0.5 - pRowCentre;
    for (let dc = 0; dc < nc; dc++) {
      const k = (r0 + dr) * nW + c0 + dc;
      const h = heights[k] as number;
      const w = nativeWeight !== null ? (nativeWeight[k] as number) : Number.isNaN(h) ? 0 : 1;
      if (!(w > 0)) continue;
      const d = h - mu;
      v += w * (d * d);
      t += w * (d * d * d);
      hx += w * (d * (c0 + dc + 0.5 - pColCentre));
      hy += w * (d * oy);
    }
  }
  out[o + CELL_WEIGHT] = wSum / (nr * nc);
  out[o + CELL_MEAN] = mu;
  out[o + CELL_VARIANCE] = v / wSum;
  out[o + CELL_MOMENT3] = t / wSum;
  out[o + CELL_COV_COL] = hx / wSum;
  out[o + CELL_COV_ROW] = hy / wSum;
}

/** Combines the (up to four) children of cell (row, col) of `level` into out[o ...]. */
function combineCell(pyr: Pyramid, level: number, row: number, col: number, out: Float32Array, o: number, s: CellScratch): void {
  const nativeWidth = pyr.nativeWidth;
  const nativeHeight = pyr.nativeHeight;
  const fine = pyr.levels[level - 1] as PyramidLevel;
  const factor = fine.factor * 2;
  const child = s.child;
  const cw = s.cw;
  const ox = s.ox;
  const oy = s.oy;
  if (fine.level > 0 && fine.cells === null && s.next === null) s.next = makeCellScratch();
  const pRowCentre = row * factor + 0.5 * span(row, factor, nativeHeight);
  const pColCentre = col * factor + 0.5 * span(col, factor, nativeWidth);
  let nk = 0;
  let wSum = 0;
  let m1 = 0;
  for (let dr = 0; dr < 2; dr++) {
    const fr = row * 2 + dr;
    if (fr >= fine.height) continue;
    const nr = span(fr, fine.factor, nativeHeight);
    for (let dc = 0; dc < 2; dc++) {
      const fc = col * 2 + dc;
      if (fc >= fine.width) continue;
      const c = nk * CELL_STRIDE;
      readCell(pyr, fine.level, fr, fc, child, c, s.next as CellScratch);
      const nc = span(fc, fine.factor, nativeWidth);
      const w = (child[c + CELL_WEIGHT] as number) * nr * nc;
      if (!(w > 0)) continue;
      cw[nk] = w;
      ox[nk] = fc * fine.factor + 0.5 * nc - pColCentre;
      oy[nk] = fr * fine.factor + 0.5 * nr - pRowCentre;
      wSum += w;
      m1 += w * (child[c + CELL_MEAN] as number);
      nk++;
    }
  }
  if (!(wSum > 0)) {
    out[o + CELL_WEIGHT] = 0;
    out[o + CELL_MEAN] = NaN;
    out[o + CELL_VARIANCE] = 0;
    out[o + CELL_MOMENT3] = 0;
    out[o + CELL_COV_COL] = 0;
    out[o + CELL_COV_ROW] = 0;
    return;
  }
  const area = span(row, factor, nativeHeight) * span(col, factor, nativeWidth);
  const mu = m1 / wSum;
  let v = 0;
  let t = 0;
  let hx = 0;
  let hy = 0;
  for (let j = 0; j < nk; j++) {
    const c = j * CELL_STRIDE;
    const w = cw[j] as number;
    const d = (child[c + CELL_MEAN] as number) - mu;
    const vj = child[c + CELL_VARIANCE] as number;
    v += w * (vj + d * d);
    t += w * ((child[c + CELL_MOMENT3] as number) + 3 * vj * d + d * d * d);
    hx += w * ((child[c + CELL_COV_COL] as number) + d * (ox[j] as number));
    hy += w * ((child[c + CELL_COV_ROW] as number) + d * (oy[j] as number));
  }
  out[o + CELL_WEIGHT] = wSum / area;
  out[o + CELL_MEAN] = mu;
  out[o + CELL_VARIANCE] = v / wSum;
  out[o + CELL_MOMENT3] = t / wSum;
  // cov(H, x) = E[(H - mu) x] - E[H - mu] E[x]; E[H - mu] = 0 by construction
  out[o + CELL_COV_COL] = hx / wSum;
  out[o + CELL_COV_ROW] = hy / wSum;
}
