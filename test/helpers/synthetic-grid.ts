import type { DemGrid } from '../../src/dem/grid.js';
import { gridFromFunction } from '../../src/dem/grid.js';
import { buildPyramid } from '../../src/terrain/pyramid.js';
import { planZones, type ZonePlanOptions } from '../../src/terrain/zone-plan.js';
import { makeTerrainContext, stationTerrain, TerrainScratch, TR, type TerrainContext } from '../../src/terrain/station-terrain.js';

/** A square projected (metre) grid centred on the origin, heights from f(x, y). */
export function squareGrid(cells: number, cellM: number, f: (x: number, y: number) => number, centre = [0, 0]): DemGrid {
  const half = (cells * cellM) / 2;
  return gridFromFunction(
    {
      width: cells,
      height: cells,
      originX: (centre[0] as number) - half,
      originY: (centre[1] as number) + half,
      cellSizeX: cellM,
      cellSizeY: cellM,
      crs: { kind: 'projected', proj4: '+proj=tmerc +lat_0=45 +lon_0=10 +k=1 +x_0=0 +y_0=0 +ellps=GRS80 +units=m +no_defs', label: 'synthetic TM', linearUnitM: 1 },
      source: 'synthetic',
    },
    (x, y) => f(x, y),
  );
}

export function contextFor(fine: DemGrid, far: DemGrid | null, opts: Partial<ZonePlanOptions> = {}): TerrainContext {
  const plan = planZones({
    radiusM: 166735,
    // 0.01 mGal at 2670 kg/m^3, expressed at the unit density as the engine takes it
    accuracyMgal: (0.01 * 1000) / 2670,
    fieldInnerRadiusM: 0,
    fineCellM: Math.max(fine.cellSizeX, fine.cellSizeY) * (fine.crs.kind === 'projected' ? fine.crs.linearUnitM : 111000),
    aboveTerrainM: 50,
    belowTerrainM: 50,
    ...opts,
  });
  return makeTerrainContext({ grid: fine, pyramid: buildPyramid(fine) }, far ? { grid: far, pyramid: buildPyramid(far) } : null, plan);
}

/** Runs one station (x, y in the fine grid's CRS, same for the far grid) and returns the result row. */
export function runStation(ctx: TerrainContext, x: number, y: number, heightM: number, latDeg = 45): Float64Array {
  const out = new Float64Array(TR.size);
  stationTerrain(ctx, { fineX: x, fineY: y, farX: x, farY: y, latDeg, heightM }, out, new TerrainScratch());
  return out;
}
