/**
 * Quadtree walk over one DEM's pyramid for one station: every part of the disc of radius R is
 * visited exactly once, at the coarsest level whose cells are far enough away for the error
 * budget (zone-plan.ts), so there are no gaps and no double counting.
 *
 * A cell at level L is
 * - skipped when it lies wholly beyond R or holds no data (weight 0);
 * - split into its children when it is too close (nearest distance < acceptRatio * size), when
 *   it overlaps the near-station window, or when it straddles R and is larger than the
 *   boundary cell size;
 * - otherwise evaluated (if its centre is within R): a native cell as an exact prism when it
 *   is near, any cell as a moment-carrying column when far.
 */
import type { DemGrid } from '../dem/grid.js';
import type { GridFrame } from './grid-frame.js';
import { blockGeometry } from './grid-frame.js';
import type { Pyramid } from './pyramid.js';
import { CELL_LO_OFFSET, CELL_MEAN, CELL_P_UP_COL, CELL_P_UP_ROW, CELL_SD, CELL_STRIDE, CELL_UP_OFFSET, CELL_W_UP, CELL_WEIGHT } from './pyramid.js';
import { level1Moments, MOM_COV_COL, MOM_COV_ROW, MOM_MEAN, MOM_MOMENT3, MOM_STRIDE, MOM_VARIANCE, MOM_WEIGHT } from './cell-moments.js';
import type { ZonePlan } from './zone-plan.js';
import { EXTENT_ERROR_COEFF, INNER_ZONE_OUTER_M, MIDDLE_ZONE_OUTER_M } from './zone-plan.js';
import type { TwoPoint } from './cell-effect.js';
import { coarseCellTc, columnTc, prismCellTc, twoPointFromMoments } from './cell-effect.js';

/** Slots of the per-station accumulator. */
export const ACC = {
  inner: 0,
  middle: 1,
  outer: 2,
  prisms: 3,
  columns: 4,
  geocentric: 5,
  nearPoints: 6,
  missingNear: 7,
  errorEstimate: 8,
  size: 9,
} as const;

export interface WindowCells {
  /** Native column/row bounds of the near window, inclusive; an empty window has c0 > c1. */
  c0: number;
  c1: number;
  r0: number;
  r1: number;
}

const NO_WINDOW: WindowCells = { c0: 1, c1: 0, r0: 1, r1: 0 };

/** Scratch state reused between calls (one per thread; the walk allocates nothing). */
export interface WalkScratch {
  stack: Int32Array;
  geom: Float64Array;
  twoPoint: TwoPoint;
  /** Moments of one level-1 cell (combined when read). */
  moments: Float32Array;
}

export function makeWalkScratch(): WalkScratch {
  return {
    stack: new Int32Array(3 * 4096),
    geom: new Float64Array(4),
    twoPoint: { wUp: 0.5, dUp: 0, dLo: 0, pUpE: 0, pUpN: 0, pLoE: 0, pLoN: 0 },
    moments: new Float32Array(MOM_STRIDE),
  };
}

export function walkPyramid(
  grid: DemGrid,
  pyr: Pyramid,
  frame: GridFrame,
  stationHeightM: number,
  plan: ZonePlan,
  window: WindowCells | null,
  checkNearData: boolean,
  acc: Float64Array,
  scratch: WalkScratch,
): void {
  const win = window ?? NO_WINDOW;
  const R = plan.radiusM;
  const skipR = plan.fieldInnerRadiusM;
  const ratio = plan.acceptRatio;
  const geoFrom = plan.geocentricFromM;
  const nW = pyr.nativeWidth;
  const nH = pyr.nativeHeight;
  const g = scratch.geom;
  let stack = scratch.stack;
  const top = pyr.levels.length - 1;
  const topLevel = pyr.levels[top];
  if (!topLevel) return;
  let sp = 0;
  for (let r = 0; r < topLevel.height; r++) {
    for (let c = 0; c < topLevel.width; c++) {
      if (sp + 3 > stack.length) stack = grow(stack, scratch);
      stack[sp++] = top;
      stack[sp++] = r;
      stack[sp++] = c;
    }
  }
  while (sp > 0) {
    const col = stack[--sp] as number;
    const row = stack[--sp] as number;
    const level = stack[--sp] as number;
    const lv = pyr.levels[level];
    if (!lv) continue;
    // the cell's values: stored cells[o + CELL_*] from level 2, moments of level 1, level 0 read directly
    const cells = lv.cells;
    const o = (row * lv.width + col) * CELL_STRIDE;
    const moments = scratch.moments;
    let w: number;
    let mean: number;
    if (cells !== null) {
      w = cells[o + CELL_WEIGHT] as number;
      mean = cells[o + CELL_MEAN] as number;
    } else if (level === 0) {
      const k = row * nW + col;
      mean = pyr.heights[k] as number;
      w = pyr.nativeWeight !== null ? (pyr.nativeWeight[k] as number) : Number.isNaN(mean) ? 0 : 1;
    } else {
      level1Moments(pyr, row, col, moments, 0);
      w = moments[MOM_WEIGHT] as number;
      mean = moments[MOM_MEAN] as number;
    }
    const f = lv.factor;
    const c0 = col * f;
    const c1 = Math.min(c0 + f, nW);
    const r0 = row * f;
    const r1 = Math.min(r0 + f, nH);
    blockGeometry(frame, c0, c1, r0, r1, g);
    const e = g[0] as number;
    const n = g[1] as number;
    const dx = g[2] as number;
    const dy = g[3] as number;
    const ox = Math.max(Math.abs(e) - 0.5 * dx, 0);
    const oy = Math.max(Math.abs(n) - 0.5 * dy, 0);
    const dMin = Math.sqrt(ox * ox + oy * oy);
    if (dMin > R) continue;
    // Missing data within the inner zone is counted on the cells that are not split (a coarse
    // cell that holds the station and a gap kilometres away is not evidence of a near gap).
    const nearGap = checkNearData && w < 1 && dMin < INNER_ZONE_OUTER_M;
    if (!(w > 0)) {
      if (nearGap) acc[ACC.missingNear] = (acc[ACC.missingNear] as number) + 1;
      continue;
    }
    const overlapsWindow = c0 <= win.c1 && c1 - 1 >= win.c0 && r0 <= win.r1 && r1 - 1 >= win.r0;
    if (level === 0 && overlapsWindow) {
      if (nearGap) acc[ACC.missingNear] = (acc[ACC.missingNear] as number) + 1;
      continue; // integrated by the near zone
    }
    const size = Math.max(dx, dy);
    const ex = Math.abs(e) + 0.5 * dx;
    const ey = Math.abs(n) + 0.5 * dy;
    const dMax = Math.sqrt(ex * ex + ey * ey);
    const tooClose = dMin < ratio * size;
    const straddles = dMax > R && size > plan.boundaryCellM;
    const straddlesSkip = skipR > 0 && dMin < skipR && dMax > skipR;
    if (level > 0 && (tooClose || overlapsWindow || straddles || straddlesSkip)) {
      if (sp + 12 > stack.length) stack = grow(stack, scratch);
      const cl = level - 1;
      const below = pyr.levels[cl];
      if (!below) continue;
      for (let dr = 0; dr < 2; dr++) {
        const rr = row * 2 + dr;
        if (rr >= below.height) continue;
        for (let dc = 0; dc < 2; dc++) {
          const cc = col * 2 + dc;
          if (cc >= below.width) continue;
          stack[sp++] = cl;
          stack[sp++] = rr;
          stack[sp++] = cc;
        }
      }
      continue;
    }
    if (nearGap) acc[ACC.missingNear] = (acc[ACC.missingNear] as number) + 1;
    const dCentre = Math.sqrt(e * e + n * n);
    // A cell cut by the outer radius (or by the field inner radius) counts with the fraction
    // of it inside the annulus, sampled on 8 x 8 points, so the disc has no staircase edge.
    const inAnnulus = dMax > R || (skipR > 0 && dMin < skipR) ? annulusFraction(e, n, dx, dy, skipR, R) : 1;
    if (!(inAnnulus > 0)) continue;
    const dMean = mean - stationHeightM;
    let tc: number;
    if (level === 0 && tooClose) {
      tc = prismCellTc(e, n, dx, dy, dMean, stationHeightM) * w * inAnnulus;
      acc[ACC.prisms] = (acc[ACC.prisms] as number) + 1;
    } else {
      const geocentric = dCentre >= geoFrom;
      const tp = scratch.twoPoint;
      let twoPoints = false;
      if (cells !== null) {
        // stored two-point form; offsets per native cell -> metres (rows run south)
        if ((cells[o + CELL_SD] as number) > 0) {
          twoPoints = true;
          const wUp = cells[o + CELL_W_UP] as number;
          const wLo = 1 - wUp;
          const pUpE = (cells[o + CELL_P_UP_COL] as number) * (dx / (c1 - c0));
          const pUpN = -(cells[o + CELL_P_UP_ROW] as number) * (dy / (r1 - r0));
          tp.wUp = wUp;
          tp.dUp = dMean + (cells[o + CELL_UP_OFFSET] as number);
          tp.dLo = dMean - (cells[o + CELL_LO_OFFSET] as number);
          tp.pUpE = pUpE;
          tp.pUpN = pUpN;
          tp.pLoE = (-wUp * pUpE) / wLo;
          tp.pLoN = (-wUp * pUpN) / wLo;
        }
      } else if (level === 1) {
        const sd = Math.sqrt(moments[MOM_VARIANCE] as number);
        if (sd > 0) {
          twoPoints = true;
          // covariances per native cell -> metres (rows run south)
          const cellE = dx / (c1 - c0);
          const cellN = dy / (r1 - r0);
          twoPointFromMoments(
            dMean,
            sd,
            moments[MOM_MOMENT3] as number,
            (moments[MOM_COV_COL] as number) * cellE,
            -(moments[MOM_COV_ROW] as number) * cellN,
            0.5 * dx,
            0.5 * dy,
            tp,
          );
        }
      }
      if (twoPoints) tc = coarseCellTc(e, n, dx, dy, tp, w * inAnnulus, stationHeightM, geocentric);
      else tc = w * inAnnulus * columnTc(e, n, dx, dy, dMean, stationHeightM, geocentric);
      const evals = twoPoints ? 2 : 1;
      if (geocentric) acc[ACC.geocentric] = (acc[ACC.geocentric] as number) + evals;
      else acc[ACC.columns] = (acc[ACC.columns] as number) + evals;
      const q = size / dCentre;
      acc[ACC.errorEstimate] = (acc[ACC.errorEstimate] as number) + Math.abs(tc) * EXTENT_ERROR_COEFF * q * q * q * q;
    }
    const zone = dCentre < INNER_ZONE_OUTER_M ? ACC.inner : dCentre < MIDDLE_ZONE_OUTER_M ? ACC.middle : ACC.outer;
    acc[zone] = (acc[zone] as number) + tc;
  }
}

/** Fraction of the cell (centre e, n; size dx, dy) between radii rIn and rOut, on 8 x 8 samples. */
function annulusFraction(e: number, n: number, dx: number, dy: number, rIn: number, rOut: number): number {
  let inside = 0;
  const rIn2 = rIn * rIn;
  const rOut2 = rOut * rOut;
  for (let i = 0; i < 8; i++) {
    const x = e + ((i + 0.5) / 8 - 0.5) * dx;
    for (let j = 0; j < 8; j++) {
      const y = n + ((j + 0.5) / 8 - 0.5) * dy;
      const r2 = x * x + y * y;
      if (r2 <= rOut2 && r2 >= rIn2) inside++;
    }
  }
  return inside / 64;
}

function grow(stack: Int32Array, scratch: WalkScratch): Int32Array {
  const bigger = new Int32Array(stack.length * 2);
  bigger.set(stack);
  scratch.stack = bigger;
  return bigger;
}
