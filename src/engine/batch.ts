/**
 * A batch of stations through the terrain stage. Runs identically inline and inside a worker:
 * each station's result depends only on its own inputs, so the output is the same bit for bit
 * for any number of workers and any batch order.
 */
import type { TerrainContext } from '../terrain/station-terrain.js';
import { stationTerrain, TerrainScratch, TR } from '../terrain/station-terrain.js';

/** Station inputs as flat arrays (SharedArrayBuffer-backed when shared with workers). */
export interface StationArrays {
  count: number;
  fineX: Float64Array;
  fineY: Float64Array;
  farX: Float64Array;
  farY: Float64Array;
  latDeg: Float64Array;
  heightM: Float64Array;
  /** 1 = compute, 0 = skip (a bad row): its result row stays NaN. */
  active: Uint8Array;
}

export const RESULT_WIDTH = TR.size;

export function sharedFloat64(length: number): Float64Array {
  return new Float64Array(new SharedArrayBuffer(length * Float64Array.BYTES_PER_ELEMENT));
}

/** Computes stations [start, end) into results[i * RESULT_WIDTH ...]. */
export function computeTerrainBatch(
  ctx: TerrainContext,
  st: StationArrays,
  results: Float64Array,
  start: number,
  end: number,
  scratch: TerrainScratch = new TerrainScratch(),
): void {
  const row = new Float64Array(RESULT_WIDTH);
  const pos = { fineX: 0, fineY: 0, farX: 0, farY: 0, latDeg: 0, heightM: 0 };
  for (let i = start; i < end; i++) {
    if (st.active[i] !== 1) {
      results.fill(NaN, i * RESULT_WIDTH, (i + 1) * RESULT_WIDTH);
      continue;
    }
    pos.fineX = st.fineX[i] as number;
    pos.fineY = st.fineY[i] as number;
    pos.farX = st.farX[i] as number;
    pos.farY = st.farY[i] as number;
    pos.latDeg = st.latDeg[i] as number;
    pos.heightM = st.heightM[i] as number;
    stationTerrain(ctx, pos, row, scratch);
    results.set(row, i * RESULT_WIDTH);
  }
}
