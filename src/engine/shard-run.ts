/**
 * The pieces of `talus reduce --shard K/N` that differ from the whole run: which stations the
 * share computes, its DEMs (shard-dem.ts), and the DEM records of its provenance.
 */
import type { DemProvenance } from '../io/provenance.js';
import type { StationTable } from '../stations/table.js';
import { loadDem, type LoadedDem } from './load-dems.js';
import type { ReduceOptions } from './run-options.js';
import { meanOf } from './run-provenance.js';
import { demCellM, loadShardDem, sharePadM, type ShardDem } from './shard-dem.js';
import { shardMask } from './shard-spec.js';

/** The share's stations (null for a whole run) and the stations whose terrain this run computes. */
export function shareOf(o: ReduceOptions, table: StationTable, active: Uint8Array): { share: Uint8Array | null; computeActive: Uint8Array } {
  if (!o.shard) return { share: null, computeActive: active };
  const share = shardMask(table.lonDeg, table.latDeg, o.shard);
  return { share, computeActive: active.map((a, i) => a & (share[i] as number)) };
}

/** The fine and far-zone DEMs of a run: the whole window, or a share's part of it. */
export async function loadRunDems(
  o: ReduceOptions,
  table: StationTable,
  active: Uint8Array,
  share: Uint8Array | null,
): Promise<{ fine: LoadedDem | ShardDem; far: LoadedDem | ShardDem | null }> {
  const fineOpts = { ...(o.demCrs ? { demCrs: o.demCrs } : {}), demUnits: o.demUnits };
  const farOpts = { ...(o.farDemCrs ? { demCrs: o.farDemCrs } : {}), demUnits: o.farDemUnits };
  if (!share) {
    const fine = await loadDem(o.demPaths, table, active, o.radiusM, fineOpts, 'DEM');
    const far = o.farDemPath ? await loadDem([o.farDemPath], table, active, o.radiusM, farOpts, 'far-zone DEM') : null;
    return { fine, far };
  }
  const lat = meanOf(table.latDeg, active);
  let maxCellM = o.demPaths[0] !== undefined ? await demCellM(o.demPaths[0], fineOpts, lat) : 0;
  if (o.farDemPath) maxCellM = Math.max(maxCellM, await demCellM(o.farDemPath, farOpts, lat));
  const pad = sharePadM(o.radiusM, maxCellM);
  const fine = await loadShardDem(o.demPaths, table, active, share, o.radiusM, pad, fineOpts, 'DEM');
  const far = o.farDemPath ? await loadShardDem([o.farDemPath], table, active, share, o.radiusM, pad, farOpts, 'far-zone DEM') : null;
  return { fine, far };
}

/** A share's DEM records name the window it read, not the whole run's grid it kept. */
export function readWindows(records: DemProvenance[], d: LoadedDem | ShardDem): DemProvenance[] {
  return 'read' in d ? records.map((r) => ({ ...r, windowRead: { ...d.read } })) : records;
}
