/**
 * The results file of one share (`--shard K/N`): its stations only, in input order, with the
 * columns of the whole run's results CSV after SHARD_COLUMNS, which carry what `talus merge`
 * needs to put the rows back and to decide tc_outlier over every station: the station's index
 * in the station file (0-based data row), its id, where tc_outlier goes in its flags, and the
 * neighbourhood check's inputs at full precision (shortest round-trip decimals; empty = NaN).
 * The flags column of a share never holds tc_outlier: the merge decides it.
 */
import type { StationTable } from '../stations/table.js';
import { resultsCsv, type OutputColumn } from '../io/results-csv.js';
import { localMetres } from './station-flags.js';

export const SHARD_COLUMNS = [
  'shard_station_index',
  'shard_station_id',
  'shard_tc_outlier_slot',
  'shard_qc_x_m',
  'shard_qc_y_m',
  'shard_qc_height_m',
  'shard_qc_tc_mgal',
  'shard_qc_misfit_m',
] as const;

/** Exact decimal text of a number (parses back to the same double); '' for NaN. */
export function exactCell(v: number): string {
  return Number.isFinite(v) ? String(v) : '';
}

export interface ShardRowsInput {
  table: StationTable;
  columns: readonly OutputColumn[];
  flags: readonly (readonly string[])[];
  tcOutlierSlot: Int32Array;
  tcMgal: Float64Array;
  misfitM: Float64Array;
}

/** The share's CSV text and how many stations it holds. */
export function shardCsv(share: Uint8Array, r: ShardRowsInput): { csv: string; stations: number } {
  const idx: number[] = [];
  for (let i = 0; i < share.length; i++) if (share[i] === 1) idx.push(i);
  const t = r.table;
  // the same local metres the whole run's neighbourhood check uses (about every station's mean position)
  const qc = localMetres(t.lonDeg, t.latDeg);
  const rows = idx.map((i) => [
    String(i),
    t.ids[i] as string,
    String(r.tcOutlierSlot[i]),
    exactCell(qc.x[i] as number),
    exactCell(qc.y[i] as number),
    exactCell(t.heightM[i] as number),
    exactCell(r.tcMgal[i] as number),
    exactCell(r.misfitM[i] as number),
    ...(t.rows[i] as string[]),
    ...Array.from({ length: Math.max(0, t.header.length - (t.rows[i] as string[]).length) }, () => ''),
  ]);
  const columns = r.columns.map((c) => ({ name: c.name, decimals: c.decimals, values: idx.map((i) => c.values[i] as number) }));
  const csv = resultsCsv([...SHARD_COLUMNS, ...t.header], rows, columns, idx.map((i) => r.flags[i] as string[]));
  return { csv, stations: idx.length };
}
