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
 * kept only while the next level is built. Level 0 stores nothing extra: its variance and
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

/** Offsets of a cell's moments (level 1 as read, and every level while the pyramid is built). */
export const MOM_WEIGHT = 0;
export const MOM_MEAN = 1;
/** Variance of the valid native heights, m^2. */
export const MOM_VARIANCE = 2;
/** Third central moment of the valid native heights, m^3. */
export const MOM_MOMENT3 = 3;
/** cov(H, native column offset), m x cells. */
export const MOM_COV_COL = 4;
/** cov(H, native row offset, rows increase southward), m x cells. */
export const MOM_COV_ROW = 5;
export const MOM_STRIDE = 6;

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

/** Scratch for combining cells (one per build); allocates nothing once made. */
interface CellScratch {
  /** The children's moments, MOM_STRIDE each. */
  child: Float32Array;
  /** Children's weights times their native areas, and their centre offsets from the parent's. */
  cw: Float64Array;
  ox: Float64Array;
  oy: Float64Array;
  twoPoint: TwoPoint;
}

function makeCellScratch(): CellScratch {
  return {
    child: new Float32Array(4 * MOM_STRIDE),
    cw: new Float64Array(4),
    ox: new Float64Array(4),
    oy: new Float64Array(4),
    twoPoint: { wUp: 0.5, dUp: 0, dLo: 0, pUpE: 0, pUpN: 0, pLoE: 0, pLoN: 0 },
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
  // moments of the previous level while the next one is built (null below level 2)
  let prevMoments: Float32Array | null = null;
  let prev = pyr.levels[0] as PyramidLevel;
  while (prev.width > 1 || prev.height > 1) {
    const level = prev.level + 1;
    const w = Math.ceil(prev.width / 2);
    const h = Math.ceil(prev.height / 2);
    const next: PyramidLevel = { level, factor: prev.factor * 2, width: w, height: h, cells: null };
    if (level >= FIRST_STORED_LEVEL) {
      const moments = new Float32Array(w * h * MOM_STRIDE);
      const cells = sharedFloat32(w * h * CELL_STRIDE);
      for (let row = 0; row < h; row++) {
        const nr = span(row, next.factor, height);
        for (let col = 0; col < w; col++) {
          const i = row * w + col;
          combineCell(pyr, level, row, col, prevMoments, moments, i * MOM_STRIDE, scratch);
          storeTwoPoint(moments, i * MOM_STRIDE, span(col, next.factor, width), nr, cells, i * CELL_STRIDE, scratch.twoPoint);
        }
      }
      next.cells = cells;
      prevMoments = moments;
    }
    pyr.levels.push(next);
    prev = next;
  }
  return pyr;
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

/** Number of native cells of a cell's clipped footprint along one axis. */
function span(index: number, factor: number, nativeSize: number): number {
  return Math.min((index + 1) * factor, nativeSize) - index * factor;
}

/**
 * The moments (MOM_* layout) of level-1 cell (row, col), combined straight from the native
 * heights: the pairwise formulas of combineCell with children whose variances, third moments
 * and covariances are 0.
 */
export function level1Moments(pyr: Pyramid, row: number, col: number, out: Float32Array, o: number): void {
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
    out[o + MOM_WEIGHT] = 0;
    out[o + MOM_MEAN] = NaN;
    out[o + MOM_VARIANCE] = 0;
    out[o + MOM_MOMENT3] = 0;
    out[o + MOM_COV_COL] = 0;
    out[o + MOM_COV_ROW] = 0;
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
  out[o + MOM_WEIGHT] = wSum / (nr * nc);
  out[o + MOM_MEAN] = mu;
  out[o + MOM_VARIANCE] = v / wSum;
  out[o + MOM_MOMENT3] = t / wSum;
  out[o + MOM_COV_COL] = hx / wSum;
  out[o + MOM_COV_ROW] = hy / wSum;
}

/**
 * Combines the (up to four) children of cell (row, col) of `level` (>= 2) into the moments
 * out[o ...]; the children's moments are `childMoments` (level - 1 >= 2) or level1Moments.
 */
function combineCell(
  pyr: Pyramid,
  level: number,
  row: number,
  col: number,
  childMoments: Float32Array | null,
  out: Float32Array,
  o: number,
  s: CellScratch,
): void {
  const nativeWidth = pyr.nativeWidth;
  const nativeHeight = pyr.nativeHeight;
  const fine = pyr.levels[level - 1] as PyramidLevel;
  const factor = fine.factor * 2;
  const child = s.child;
  const cw = s.cw;
  const ox = s.ox;
  const oy = s.oy;
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
      const c = nk * MOM_STRIDE;
      if (childMoments === null) level1Moments(pyr, fr, fc, child, c);
      else {
        const src = (fr * fine.width + fc) * MOM_STRIDE;
        for (let j = 0; j < MOM_STRIDE; j++) child[c + j] = childMoments[src + j] as number;
      }
      const nc = span(fc, fine.factor, nativeWidth);
      const w = (child[c + MOM_WEIGHT] as number) * nr * nc;
      if (!(w > 0)) continue;
      cw[nk] = w;
      ox[nk] = fc * fine.factor + 0.5 * nc - pColCentre;
      oy[nk] = fr * fine.factor + 0.5 * nr - pRowCentre;
      wSum += w;
      m1 += w * (child[c + MOM_MEAN] as number);
      nk++;
    }
  }
  if (!(wSum > 0)) {
    out[o + MOM_WEIGHT] = 0;
    out[o + MOM_MEAN] = NaN;
    out[o + MOM_VARIANCE] = 0;
    out[o + MOM_MOMENT3] = 0;
    out[o + MOM_COV_COL] = 0;
    out[o + MOM_COV_ROW] = 0;
    return;
  }
  const area = span(row, factor, nativeHeight) * span(col, factor, nativeWidth);
  const mu = m1 / wSum;
  let v = 0;
  let t = 0;
  let hx = 0;
  let hy = 0;
  for (let j = 0; j < nk; j++) {
    const c = j * MOM_STRIDE;
    const w = cw[j] as number;
    const d = (child[c + MOM_MEAN] as number) - mu;
    const vj = child[c + MOM_VARIANCE] as number;
    v += w * (vj + d * d);
    t += w * ((child[c + MOM_MOMENT3] as number) + 3 * vj * d + d * d * d);
    hx += w * ((child[c + MOM_COV_COL] as number) + d * (ox[j] as number));
    hy += w * ((child[c + MOM_COV_ROW] as number) + d * (oy[j] as number));
  }
  out[o + MOM_WEIGHT] = wSum / area;
  out[o + MOM_MEAN] = mu;
  out[o + MOM_VARIANCE] = v / wSum;
  out[o + MOM_MOMENT3] = t / wSum;
  // cov(H, x) = E[(H - mu) x] - E[H - mu] E[x]; E[H - mu] = 0 by construction
  out[o + MOM_COV_COL] = hx / wSum;
  out[o + MOM_COV_ROW] = hy / wSum;
}
