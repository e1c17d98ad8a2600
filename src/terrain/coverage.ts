/**
 * How much of the correction disc the DEMs cover, by sampling: rings spaced evenly in
 * log(radius) from the near window to R, each with evenly spaced azimuths (staggered on
 * alternate rings); a sample counts when the fine DEM or the far-zone DEM holds data there.
 * The result is the area-weighted covered fraction. Spacing: 32 rings x 48 azimuths (about
 * 23 % of the radius between rings near R, 7.5 degrees around), so a gap smaller than that
 * can be missed; gaps in the inner zone are caught exactly by the walk itself (nodata_near).
 *
 * Each sample first looks at the cell of the coarsest pyramid level that is no larger than the
 * sample spacing: weight 1 means every native cell under it holds data, weight 0 (for a DEM
 * without native weights) that none does; only a partly filled cell sends the sample on to its
 * native cell. The answer is the native look-up's, always, but most samples land on a few
 * coarse cells the walk has just read instead of 1536 scattered native cells.
 */
import type { DemGrid } from '../dem/grid.js';
import type { GridFrame } from './grid-frame.js';
import { localToGrid } from './grid-frame.js';
import type { Pyramid } from './pyramid.js';
import { CELL_STRIDE, CELL_WEIGHT, FIRST_STORED_LEVEL } from './pyramid.js';

export const COVERAGE_RINGS = 32;
export const COVERAGE_AZIMUTHS = 48;

/** Metres per degree for the nominal cell size of a geographic grid (only picks a level). */
const NOMINAL_M_PER_DEG = 111_320;

/** A DEM as the coverage test sees it. */
export interface CoverageSource {
  grid: DemGrid;
  pyramid: Pyramid;
}

/** Sample offsets (east, north, area weight) and the pyramid level tested per sample, built once per run. */
export interface CoveragePattern {
  east: Float64Array;
  north: Float64Array;
  area: Float64Array;
  /** Pyramid level at which each sample is tested, fine and far DEM. */
  fineLevel: Uint8Array;
  farLevel: Uint8Array | null;
}

export function makeCoveragePattern(innerM: number, radiusM: number, fine: CoverageSource, far: CoverageSource | null): CoveragePattern {
  const n = COVERAGE_RINGS * COVERAGE_AZIMUTHS;
  const east = new Float64Array(n);
  const north = new Float64Array(n);
  const area = new Float64Array(n);
  const spacing = new Float64Array(n);
  const r0 = Math.max(innerM, 1);
  const logStep = radiusM > r0 ? Math.log(radiusM / r0) / COVERAGE_RINGS : 0;
  let k = 0;
  for (let i = 0; i < COVERAGE_RINGS; i++) {
    const ra = r0 * Math.exp(i * logStep);
    const rb = r0 * Math.exp((i + 1) * logStep);
    const r = 0.5 * (ra + rb);
    const ringArea = (rb * rb - ra * ra) / COVERAGE_AZIMUTHS;
    const along = (2 * Math.PI * r) / COVERAGE_AZIMUTHS;
    for (let j = 0; j < COVERAGE_AZIMUTHS; j++) {
      const az = ((j + 0.5 * (i % 2)) * 2 * Math.PI) / COVERAGE_AZIMUTHS;
      east[k] = r * Math.sin(az);
      north[k] = r * Math.cos(az);
      area[k] = ringArea;
      spacing[k] = Math.min(rb - ra, along);
      k++;
    }
  }
  return { east, north, area, fineLevel: sampleLevels(spacing, fine), farLevel: far ? sampleLevels(spacing, far) : null };
}

/** Coarsest level of the source whose cells are no larger than each sample's spacing. */
function sampleLevels(spacing: Float64Array, src: CoverageSource): Uint8Array {
  const g = src.grid;
  const unitM = g.crs.kind === 'geographic' ? NOMINAL_M_PER_DEG : g.crs.linearUnitM;
  const cellM = Math.max(g.cellSizeX, g.cellSizeY) * unitM;
  const top = src.pyramid.levels.length - 1;
  const out = new Uint8Array(spacing.length);
  for (let k = 0; k < spacing.length; k++) {
    let level = 0;
    while (level < top && cellM * 2 ** (level + 1) <= (spacing[k] as number)) level++;
    out[k] = level < FIRST_STORED_LEVEL ? 0 : level;
  }
  return out;
}

function hasData(src: CoverageSource, level: number, frame: GridFrame, e: number, n: number, gc: Float64Array): boolean {
  const grid = src.grid;
  localToGrid(frame, e, n, gc);
  const col = Math.round(gc[0] as number);
  const row = Math.round(gc[1] as number);
  if (col < 0 || row < 0 || col >= grid.width || row >= grid.height) return false;
  const lv = level > 0 ? src.pyramid.levels[level] : undefined;
  const cells = lv ? lv.cells : null;
  if (lv && cells !== null) {
    const w = cells[((row >> level) * lv.width + (col >> level)) * CELL_STRIDE + CELL_WEIGHT] as number;
    // weight 1: every native cell under it holds data; weight 0 without native weights: none does
    if (w === 1) return true;
    if (w === 0 && src.pyramid.nativeWeight === null) return false;
  }
  return !Number.isNaN(grid.data[row * grid.width + col] as number);
}

/** Area-weighted fraction of the pattern's samples that fall on data, 0..1. */
export function coveredFraction(
  pattern: CoveragePattern,
  fine: CoverageSource,
  fineFrame: GridFrame,
  far: CoverageSource | null,
  farFrame: GridFrame | null,
  gc: Float64Array,
): number {
  let total = 0;
  let covered = 0;
  const n = pattern.east.length;
  const farLevel = pattern.farLevel;
  for (let k = 0; k < n; k++) {
    const e = pattern.east[k] as number;
    const no = pattern.north[k] as number;
    const a = pattern.area[k] as number;
    total += a;
    if (
      hasData(fine, pattern.fineLevel[k] as number, fineFrame, e, no, gc) ||
      (far !== null && farFrame !== null && farLevel !== null && hasData(far, farLevel[k] as number, farFrame, e, no, gc))
    ) {
      covered += a;
    }
  }
  return total > 0 ? covered / total : 1;
}
