/**
 * The like-for-like terrain pass of --legacy-tc-range R1:R2: the new terrain correction over
 * the same annulus a legacy TC covered, computed by a second terrain run whose zone plan skips
 * the terrain inside R1 (as for a field inner zone) and ends at R2. The DEM pyramids of the
 * main pass are reused; only the zone plan and the terrain context are rebuilt.
 */
import { InputError } from '../errors.js';
import { planZones } from '../terrain/zone-plan.js';
import type { ZonePlan } from '../terrain/zone-plan.js';
import { makeTerrainContext, TR } from '../terrain/station-terrain.js';
import type { TerrainSource } from '../terrain/station-terrain.js';
import type { LegacyTcRange } from '../legacy/legacy-tc-range.js';
import { RESULT_WIDTH, sharedFloat64 } from './batch.js';
import type { StationArrays } from './batch.js';
import { runTerrain } from './pool.js';
import type { TerrainRunOptions } from './pool.js';

export interface RangeTerrain {
  /** TC over the range at 1000 kg/m^3, mGal, per station (NaN where not computed). */
  tcUnitMgal: Float64Array;
  plan: ZonePlan;
}

/** Checks the range against the run's radius (the DEM window was read for --radius). */
export function checkRangeWithinRadius(range: LegacyTcRange, radiusM: number): void {
  if (!(range.outerRadiusM <= radiusM))
    throw new InputError(
      `outer radius ${range.outerRadiusM} m of the legacy TC range is beyond --radius ${radiusM} m: ` +
        `the DEM is read only out to --radius; raise --radius or lower the range`,
      { field: '--legacy-tc-range' },
    );
}

export async function rangeTerrain(
  fine: TerrainSource,
  far: TerrainSource | null,
  mainPlan: ZonePlan,
  range: LegacyTcRange,
  stations: StationArrays,
  runOpts: TerrainRunOptions,
): Promise<RangeTerrain> {
  const plan = planZones({
    radiusM: range.outerRadiusM,
    accuracyMgal: mainPlan.accuracyMgal,
    fieldInnerRadiusM: range.innerRadiusM,
    fineCellM: mainPlan.fineCellM,
    aboveTerrainM: mainPlan.aboveTerrainM,
    belowTerrainM: mainPlan.belowTerrainM,
  });
  const ctx = makeTerrainContext(fine, far, plan);
  const n = stations.count;
  const results = sharedFloat64(n * RESULT_WIDTH);
  await runTerrain(ctx, stations, results, runOpts);
  const tcUnitMgal = new Float64Array(n);
  for (let i = 0; i < n; i++) tcUnitMgal[i] = results[i * RESULT_WIDTH + TR.tcUnitMgal] as number;
  return { tcUnitMgal, plan };
}
