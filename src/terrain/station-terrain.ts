/**
 * The terrain correction of one station: near-station window + walk over the fine DEM's
 * pyramid + walk over the far-zone DEM's pyramid, with flags and coverage. Results are per
 * unit density (1000 kg/m^3) so that any number of reduction densities cost nothing extra.
 */
import type { DemGrid } from '../dem/grid.js';
import { G, UNIT_DENSITY_KG_M3 } from '../constants.js';
import { MGAL } from '../units.js';
import type { GridFrame } from './grid-frame.js';
import { bilinearHeight, makeGridFrame, setGridFrame } from './grid-frame.js';
import type { Pyramid } from './pyramid.js';
import type { ZonePlan } from './zone-plan.js';
import type { NearZoneScratch, NearZoneSpec } from './near-zone.js';
import { integrateNearZone, makeNearZoneScratch } from './near-zone.js';
import type { WalkScratch, WindowCells } from './traverse.js';
import { ACC, makeWalkScratch, walkPyramid } from './traverse.js';
import type { CoveragePattern } from './coverage.js';
import { coveredFraction, makeCoveragePattern } from './coverage.js';

export interface TerrainSource {
  grid: DemGrid;
  pyramid: Pyramid;
}

export interface TerrainContext {
  fine: TerrainSource;
  far: TerrainSource | null;
  plan: ZonePlan;
  coverage: CoveragePattern;
}

export function makeTerrainContext(fine: TerrainSource, far: TerrainSource | null, plan: ZonePlan): TerrainContext {
  const innerM = Math.max(plan.fieldInnerRadiusM, plan.nearHalfCells * plan.fineCellM);
  return { fine, far, plan, coverage: makeCoveragePattern(innerM, plan.radiusM, fine, far) };
}

/** Flag bits raised by the terrain stage. */
export const TERRAIN_FLAG = {
  outside_dem: 1,
  dem_partial: 2,
  nodata_near: 4,
  above_terrain: 8,
  below_terrain: 16,
} as const;

/** Slots of one station's terrain result row. */
export const TR = {
  tcInnerUnitMgal: 0,
  tcMiddleUnitMgal: 1,
  tcOuterUnitMgal: 2,
  tcUnitMgal: 3,
  demHeightM: 4,
  misfitM: 5,
  coverage: 6,
  flags: 7,
  prisms: 8,
  columns: 9,
  geocentric: 10,
  nearPoints: 11,
  errorEstimateUnitMgal: 12,
  size: 13,
} as const;

export interface StationPosition {
  /** Station in the fine DEM's CRS. */
  fineX: number;
  fineY: number;
  /** Station in the far DEM's CRS (ignored without a far DEM). */
  farX: number;
  farY: number;
  latDeg: number;
  heightM: number;
}

/** Mass factor (m) → mGal at unit density. */
const UNIT_FACTOR_TO_MGAL = (G * UNIT_DENSITY_KG_M3) / MGAL;

/** Per-thread state reused from station to station: nothing is allocated per station. */
export class TerrainScratch {
  readonly acc = new Float64Array(ACC.size);
  readonly walk: WalkScratch = makeWalkScratch();
  readonly gc = new Float64Array(2);
  readonly near: NearZoneScratch = makeNearZoneScratch();
  readonly nearSpec: NearZoneSpec = { col: 0, row: 0, halfCells: 0, stationHeightM: 0, adjustM: 0, taperM: 0, innerSkipM: 0, segmentM: 1 };
  readonly window: WindowCells = { c0: 1, c1: 0, r0: 1, r1: 0 };
  /** Station frames of the fine and the far DEM, re-aimed per station (setGridFrame). */
  fineFrame: GridFrame | null = null;
  farFrame: GridFrame | null = null;
}

function aimFrame(current: GridFrame | null, grid: DemGrid, x: number, y: number, latDeg: number): GridFrame {
  if (current === null) return makeGridFrame(grid, x, y, latDeg);
  setGridFrame(current, grid, x, y, latDeg);
  return current;
}

export function stationTerrain(ctx: TerrainContext, st: StationPosition, out: Float64Array, scratch: TerrainScratch): void {
  out.fill(NaN);
  const { grid } = ctx.fine;
  const plan = ctx.plan;
  const frame = aimFrame(scratch.fineFrame, grid, st.fineX, st.fineY, st.latDeg);
  scratch.fineFrame = frame;
  const colF = (st.fineX - grid.originX) / grid.cellSizeX - 0.5;
  const rowF = (grid.originY - st.fineY) / grid.cellSizeY - 0.5;
  const col = Math.floor(colF + 0.5);
  const row = Math.floor(rowF + 0.5);
  let flags = 0;
  if (!(col >= 0 && row >= 0 && col < grid.width && row < grid.height)) {
    out[TR.flags] = TERRAIN_FLAG.outside_dem;
    return;
  }
  const demHeight = bilinearHeight(grid, colF, rowF);
  const misfit = st.heightM - demHeight;
  let adjust = 0;
  if (Number.isNaN(demHeight)) flags |= TERRAIN_FLAG.nodata_near;
  else if (misfit > plan.aboveTerrainM) flags |= TERRAIN_FLAG.above_terrain;
  else if (misfit < -plan.belowTerrainM) flags |= TERRAIN_FLAG.below_terrain;
  else adjust = misfit;

  const acc = scratch.acc;
  acc.fill(0);
  const m = plan.nearHalfCells;
  const spec = scratch.nearSpec;
  spec.col = col;
  spec.row = row;
  spec.halfCells = m;
  spec.stationHeightM = st.heightM;
  spec.adjustM = adjust;
  spec.taperM = plan.taperM;
  spec.innerSkipM = plan.fieldInnerRadiusM;
  spec.segmentM = plan.nearSegmentM;
  const near = integrateNearZone(grid, frame, spec, scratch.near);
  acc[ACC.inner] = near.factor;
  acc[ACC.nearPoints] = near.points;
  if (near.missing > 0) flags |= TERRAIN_FLAG.nodata_near;
  const window = scratch.window;
  window.c0 = col - m;
  window.c1 = col + m;
  window.r0 = row - m;
  window.r1 = row + m;
  walkPyramid(grid, ctx.fine.pyramid, frame, st.heightM, plan, window, true, acc, scratch.walk);
  if ((acc[ACC.missingNear] as number) > 0) flags |= TERRAIN_FLAG.nodata_near;
  let farFrame: GridFrame | null = null;
  if (ctx.far) {
    farFrame = aimFrame(scratch.farFrame, ctx.far.grid, st.farX, st.farY, st.latDeg);
    scratch.farFrame = farFrame;
    walkPyramid(ctx.far.grid, ctx.far.pyramid, farFrame, st.heightM, plan, null, false, acc, scratch.walk);
  }
  const coverage = coveredFraction(ctx.coverage, ctx.fine, frame, ctx.far, farFrame, scratch.gc);
  if (coverage < 1) flags |= TERRAIN_FLAG.dem_partial;
  const inner = (acc[ACC.inner] as number) * UNIT_FACTOR_TO_MGAL;
  const middle = (acc[ACC.middle] as number) * UNIT_FACTOR_TO_MGAL;
  const outer = (acc[ACC.outer] as number) * UNIT_FACTOR_TO_MGAL;
  out[TR.tcInnerUnitMgal] = inner;
  out[TR.tcMiddleUnitMgal] = middle;
  out[TR.tcOuterUnitMgal] = outer;
  out[TR.tcUnitMgal] = inner + middle + outer;
  out[TR.demHeightM] = demHeight;
  out[TR.misfitM] = misfit;
  out[TR.coverage] = coverage;
  out[TR.flags] = flags;
  out[TR.prisms] = acc[ACC.prisms] as number;
  out[TR.columns] = acc[ACC.columns] as number;
  out[TR.geocentric] = acc[ACC.geocentric] as number;
  out[TR.nearPoints] = acc[ACC.nearPoints] as number;
  out[TR.errorEstimateUnitMgal] = (acc[ACC.errorEstimate] as number) * UNIT_FACTOR_TO_MGAL;
}
