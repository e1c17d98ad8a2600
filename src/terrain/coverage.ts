/**
 * How much of the correction disc the DEMs cover, by sampling: rings spaced evenly in
 * log(radius) from the near window to R, each with evenly spaced azimuths (staggered on
 * alternate rings); a sample counts when the fine DEM or the far-zone DEM holds data there.
 * The result is the area-weighted covered fraction. Spacing: 32 rings x 48 azimuths (about
 * 23 % of the radius between rings near R, 7.5 degrees around), so a gap smaller than that
 * can be missed; gaps in the inner zone are caught exactly by the walk itself (nodata_near).
 */
import type { DemGrid } from '../dem/grid.js';
import type { GridFrame } from './grid-frame.js';
import { localToGrid } from './grid-frame.js';

export const COVERAGE_RINGS = 32;
export const COVERAGE_AZIMUTHS = 48;

/** Sample offsets (east, north, area weight), built once per run. */
export interface CoveragePattern {
  east: Float64Array;
  north: Float64Array;
  area: Float64Array;
}

export function makeCoveragePattern(innerM: number, radiusM: number): CoveragePattern {
  const n = COVERAGE_RINGS * COVERAGE_AZIMUTHS;
  const east = new Float64Array(n);
  const north = new Float64Array(n);
  const area = new Float64Array(n);
  const r0 = Math.max(innerM, 1);
  const logStep = radiusM > r0 ? Math.log(radiusM / r0) / COVERAGE_RINGS : 0;
  let k = 0;
  for (let i = 0; i < COVERAGE_RINGS; i++) {
    const ra = r0 * Math.exp(i * logStep);
    const rb = r0 * Math.exp((i + 1) * logStep);
    const r = 0.5 * (ra + rb);
    const ringArea = (rb * rb - ra * ra) / COVERAGE_AZIMUTHS;
    for (let j = 0; j < COVERAGE_AZIMUTHS; j++) {
      const az = ((j + 0.5 * (i % 2)) * 2 * Math.PI) / COVERAGE_AZIMUTHS;
      east[k] = r * Math.sin(az);
      north[k] = r * Math.cos(az);
      area[k] = ringArea;
      k++;
    }
  }
  return { east, north, area };
}

function hasData(grid: DemGrid, frame: GridFrame, e: number, n: number, gc: Float64Array): boolean {
  localToGrid(frame, e, n, gc);
  const col = Math.round(gc[0] as number);
  const row = Math.round(gc[1] as number);
  if (col < 0 || row < 0 || col >= grid.width || row >= grid.height) return false;
  return !Number.isNaN(grid.data[row * grid.width + col] as number);
}

/** Area-weighted fraction of the pattern's samples that fall on data, 0..1. */
export function coveredFraction(
  pattern: CoveragePattern,
  fine: DemGrid,
  fineFrame: GridFrame,
  far: DemGrid | null,
  farFrame: GridFrame | null,
  gc: Float64Array,
): number {
  let total = 0;
  let covered = 0;
  const n = pattern.east.length;
  for (let k = 0; k < n; k++) {
    const e = pattern.east[k] as number;
    const no = pattern.north[k] as number;
    const a = pattern.area[k] as number;
    total += a;
    if (hasData(fine, fineFrame, e, no, gc) || (far !== null && farFrame !== null && hasData(far, farFrame, e, no, gc))) {
      covered += a;
    }
  }
  return total > 0 ? covered / total : 1;
}
