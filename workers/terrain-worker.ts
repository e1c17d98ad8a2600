/**
 * Worker adapter: receives the shared terrain context once (workerData: DEM grids and
 * pyramids on SharedArrayBuffers, station arrays, the shared result array) and computes the
 * station ranges it is given. No logic lives here.
 */
import { workerData } from 'node:worker_threads';
import type { TerrainContext } from '../src/terrain/station-terrain.js';
import { TerrainScratch } from '../src/terrain/station-terrain.js';
import type { StationArrays } from '../src/engine/batch.js';
import { computeTerrainBatch } from '../src/engine/batch.js';

interface Shared {
  ctx: TerrainContext;
  stations: StationArrays;
  results: Float64Array;
}

const shared = workerData as Shared;
const scratch = new TerrainScratch();

export default function run(task: { start: number; end: number }): number {
  computeTerrainBatch(shared.ctx, shared.stations, shared.results, task.start, task.end, scratch);
  return task.end - task.start;
}
