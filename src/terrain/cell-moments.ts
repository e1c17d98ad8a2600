/**
 * The moments of pyramid cells and how children combine into their parent (pyramid.ts): the
 * parallel (pairwise) central-moment formulas, relative to the parent mean, so no large raw
 * moments cancel. Level 1 is combined straight from the native heights, at build time and
 * whenever the walk reads it.
 */
import type { TwoPoint } from './cell-effect.js';
import type { Pyramid, PyramidLevel } from './pyramid.js';

/** Offsets of a cell's moments (level 1 as read, and every level while the pyramid is built). */
/** Fraction of the native footprint with data and in use, 0..1. */
export const MOM_WEIGHT = 0;
/** Mean valid height, m (NaN when the weight is 0). */
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

/** Scratch for combining cells (one per build); allocates nothing once made. */
export interface CellScratch {
  /** The children's moments, MOM_STRIDE each. */
  child: Float32Array;
  /** Children's weights times their native areas, and their centre offsets from the parent's. */
  cw: Float64Array;
  ox: Float64Array;
  oy: Float64Array;
  twoPoint: TwoPoint;
}

export function makeCellScratch(): CellScratch {
  return {
    child: new Float32Array(4 * MOM_STRIDE),
    cw: new Float64Array(4),
    ox: new Float64Array(4),
    oy: new Float64Array(4),
    twoPoint: { wUp: 0.5, dUp: 0, dLo: 0, pUpE: 0, pUpN: 0, pLoE: 0, pLoN: 0 },
  };
}

/** Number of native cells of a cell's clipped footprint along one axis. */
export function span(index: number, factor: number, nativeSize: number): number {
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
    writeEmptyMoments(out, o);
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
 * out[o ...]. The children's moments are level1Moments (childMoments null, level 2) or
 * `childMoments`: level - 1's moments for rows 2 * row and 2 * row + 1, one row of fine.width
 * cells after the other (a strip; the second row is absent below the last row).
 */
export function combineCell(
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
        const src = (dr * fine.width + fc) * MOM_STRIDE;
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
    writeEmptyMoments(out, o);
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

/** The moments of a cell without data: weight 0, mean NaN, the rest 0. */
function writeEmptyMoments(out: Float32Array, o: number): void {
  out[o + MOM_WEIGHT] = 0;
  out[o + MOM_MEAN] = NaN;
  out[o + MOM_VARIANCE] = 0;
  out[o + MOM_MOMENT3] = 0;
  out[o + MOM_COV_COL] = 0;
  out[o + MOM_COV_ROW] = 0;
}
