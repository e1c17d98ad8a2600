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
 * Level 0 stores no extra arrays: its variance and covariances are 0 and its weight is 1 where
 * the height is not NaN (times the optional native weight). Coarse arrays live on
 * SharedArrayBuffers so worker threads share the pyramid without copying; children are
 * combined in float64 and stored as float32.
 */
import type { DemGrid } from '../dem/grid.js';
import { sharedFloat32 } from '../dem/grid.js';

export interface PyramidLevel {
  /** Level number (0 = native). */
  level: number;
  /** Native cells per side of one cell of this level (2^level). */
  factor: number;
  width: number;
  height: number;
  /** Mean valid height, m (NaN when weight = 0). At level 0 the DEM itself. */
  mean: Float32Array;
  /** Variance of the valid native heights, m^2; null at level 0 (zero). */
  variance: Float32Array | null;
  /** Third central moment of the valid native heights, m^3; null at level 0 (zero). */
  moment3: Float32Array | null;
  /** cov(H, native column offset), m x cells; null at level 0. */
  covCol: Float32Array | null;
  /** cov(H, native row offset, rows increase southward), m x cells; null at level 0. */
  covRow: Float32Array | null;
  /** Fraction of the native footprint with data and in use, 0..1; null at level 0 without a native weight (1 where the height is not NaN). */
  weight: Float32Array | null;
}

export interface Pyramid {
  /** Native width and height (the grid's). */
  nativeWidth: number;
  nativeHeight: number;
  levels: PyramidLevel[];
}

/** Weight of cell k of a level (level 0 may have no weight array). */
export function levelWeight(lv: PyramidLevel, k: number): number {
  if (lv.weight !== null) return lv.weight[k] as number;
  return Number.isNaN(lv.mean[k] as number) ? 0 : 1;
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
  const levels: PyramidLevel[] = [
    { level: 0, factor: 1, width, height, mean: data, variance: null, moment3: null, covCol: null, covRow: null, weight: weight0 },
  ];
  let prev = levels[0] as PyramidLevel;
  while (prev.width > 1 || prev.height > 1) {
    prev = coarsen(prev, width, height);
    levels.push(prev);
  }
  return { nativeWidth: width, nativeHeight: height, levels };
}

/** Number of native cells of a cell's clipped footprint along one axis. */
function span(index: number, factor: number, nativeSize: number): number {
  return Math.min((index + 1) * factor, nativeSize) - index * factor;
}

function coarsen(fine: PyramidLevel, nativeWidth: number, nativeHeight: number): PyramidLevel {
  const factor = fine.factor * 2;
  const width = Math.ceil(fine.width / 2);
  const height = Math.ceil(fine.height / 2);
  const n = width * height;
  const mean = sharedFloat32(n);
  const variance = sharedFloat32(n);
  const moment3 = sharedFloat32(n);
  const covCol = sharedFloat32(n);
  const covRow = sharedFloat32(n);
  const weight = sharedFloat32(n);
  // children of one parent: weight, mean, variance, third moment, covariances, offsets
  const cw = new Float64Array(4);
  const cm = new Float64Array(4);
  const cv = new Float64Array(4);
  const c3 = new Float64Array(4);
  const cx = new Float64Array(4);
  const cy = new Float64Array(4);
  const ox = new Float64Array(4);
  const oy = new Float64Array(4);
  for (let row = 0; row < height; row++) {
    const pRowCentre = row * factor + 0.5 * span(row, factor, nativeHeight);
    for (let col = 0; col < width; col++) {
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
          const k = fr * fine.width + fc;
          const nc = span(fc, fine.factor, nativeWidth);
          const w = levelWeight(fine, k) * nr * nc;
          if (!(w > 0)) continue;
          cw[nk] = w;
          cm[nk] = fine.mean[k] as number;
          cv[nk] = fine.variance ? (fine.variance[k] as number) : 0;
          c3[nk] = fine.moment3 ? (fine.moment3[k] as number) : 0;
          cx[nk] = fine.covCol ? (fine.covCol[k] as number) : 0;
          cy[nk] = fine.covRow ? (fine.covRow[k] as number) : 0;
          ox[nk] = fc * fine.factor + 0.5 * nc - pColCentre;
          oy[nk] = fr * fine.factor + 0.5 * nr - pRowCentre;
          wSum += w;
          m1 += w * (cm[nk] as number);
          nk++;
        }
      }
      const area = span(row, factor, nativeHeight) * span(col, factor, nativeWidth);
      const i = row * width + col;
      if (!(wSum > 0)) {
        mean[i] = NaN;
        weight[i] = 0;
        continue;
      }
      const mu = m1 / wSum;
      let v = 0;
      let t = 0;
      let ex = 0;
      let ey = 0;
      let hx = 0;
      let hy = 0;
      for (let j = 0; j < nk; j++) {
        const w = cw[j] as number;
        const d = (cm[j] as number) - mu;
        const vj = cv[j] as number;
        v += w * (vj + d * d);
        t += w * ((c3[j] as number) + 3 * vj * d + d * d * d);
        ex += w * (ox[j] as number);
        ey += w * (oy[j] as number);
        hx += w * ((cx[j] as number) + d * (ox[j] as number));
        hy += w * ((cy[j] as number) + d * (oy[j] as number));
      }
      mean[i] = mu;
      variance[i] = v / wSum;
      moment3[i] = t / wSum;
      // cov(H, x) = E[(H - mu) x] - E[H - mu] E[x]; E[H - mu] = 0 by construction
      covCol[i] = hx / wSum;
      covRow[i] = hy / wSum;
      weight[i] = wSum / area;
      void ex;
      void ey;
    }
  }
  return { level: fine.level + 1, factor, width, height, mean, variance, moment3, covCol, covRow, weight };
}
