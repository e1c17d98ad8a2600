/**
 * Resolution pyramid of a DEM: level 0 is the grid itself, level L aggregates 2^L x 2^L native
 * cells. Every coarse cell carries, over the valid native heights H under it:
 * - the MEAN and the VARIANCE (physics.md §5 "Aggregated cells": a mean height alone
 *   underestimates a rough cell's effect by about var/(mean^2 + var) of the height difference);
 * - the COVARIANCES of H with the east and south native-cell offsets from the cell centre
 *   (cov(H, col), cov(H, row), in m x native cells), which say on which side of the cell the
 *   high ground lies (a coarse cell on a slope otherwise errs to first order in cell/D);
 * - the WEIGHT, the fraction of its native footprint that holds data (and, for a far-zone DEM,
 *   is not already covered by the fine DEM).
 * Cells at the east and south edges are clipped to the grid; their footprint is the clipped one.
 * Within-child centroid offsets of partly valid children are neglected when combining.
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
    { level: 0, factor: 1, width, height, mean: data, variance: null, covCol: null, covRow: null, weight: weight0 },
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
  const covCol = sharedFloat32(n);
  const covRow = sharedFloat32(n);
  const weight = sharedFloat32(n);
  for (let row = 0; row < height; row++) {
    const pr0 = row * factor;
    const pRowCentre = pr0 + 0.5 * span(row, factor, nativeHeight);
    for (let col = 0; col < width; col++) {
      const pc0 = col * factor;
      const pColCentre = pc0 + 0.5 * span(col, factor, nativeWidth);
      let wSum = 0;
      let m1 = 0;
      let m2 = 0;
      let ex = 0;
      let ey = 0;
      let hx = 0;
      let hy = 0;
      for (let dr = 0; dr < 2; dr++) {
        const fr = row * 2 + dr;
        if (fr >= fine.height) continue;
        const nr = span(fr, fine.factor, nativeHeight);
        const oy = fr * fine.factor + 0.5 * nr - pRowCentre;
        for (let dc = 0; dc < 2; dc++) {
          const fc = col * 2 + dc;
          if (fc >= fine.width) continue;
          const k = fr * fine.width + fc;
          const nc = span(fc, fine.factor, nativeWidth);
          const w = levelWeight(fine, k) * nr * nc;
          if (!(w > 0)) continue;
          const ox = fc * fine.factor + 0.5 * nc - pColCentre;
          const mu = fine.mean[k] as number;
          const v = fine.variance ? (fine.variance[k] as number) : 0;
          wSum += w;
          m1 += w * mu;
          m2 += w * (v + mu * mu);
          ex += w * ox;
          ey += w * oy;
          hx += w * ((fine.covCol ? (fine.covCol[k] as number) : 0) + mu * ox);
          hy += w * ((fine.covRow ? (fine.covRow[k] as number) : 0) + mu * oy);
        }
      }
      const area = span(row, factor, nativeHeight) * span(col, factor, nativeWidth);
      const i = row * width + col;
      if (wSum > 0) {
        const mu = m1 / wSum;
        mean[i] = mu;
        variance[i] = Math.max(0, m2 / wSum - mu * mu);
        covCol[i] = hx / wSum - (mu * ex) / wSum;
        covRow[i] = hy / wSum - (mu * ey) / wSum;
        weight[i] = wSum / area;
      } else {
        mean[i] = NaN;
        weight[i] = 0;
      }
    }
  }
  return { level: fine.level + 1, factor, width, height, mean, variance, covCol, covRow, weight };
}
