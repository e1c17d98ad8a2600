/**
 * Per-station flags of a run: what the reader raised (bad_row, duplicate_position), what the
 * terrain stage raised (outside_dem, dem_partial, nodata_near, above_terrain, below_terrain),
 * height_misfit, and the neighbourhood checks of src/qc (tc_outlier, legacy_tc_change).
 */
import type { StationTable } from '../stations/table.js';
import { TERRAIN_FLAG, TR } from '../terrain/station-terrain.js';
import { RESULT_WIDTH } from './batch.js';
import { tcOutlierFlags } from '../qc/tc-outlier.js';
import { legacyTcChangeFlags } from '../qc/legacy-tc-change.js';
import { qcSummary, formatQcSummary } from '../qc/qc-summary.js';
import type { ReduceOptions } from './run-options.js';
import { InputError } from '../errors.js';

export interface RunFlags {
  perStation: string[][];
  counts: Record<string, number>;
  summaryText: string;
  /** Where tc_outlier stands (or would stand) in each station's flags: the merge of a sharded run puts it there. */
  tcOutlierSlot: Int32Array;
}

const TERRAIN_CODES = Object.entries(TERRAIN_FLAG) as [string, number][];

/** Local metres (equirectangular about the mean position) for the neighbourhood checks. */
export function localMetres(lonDeg: Float64Array, latDeg: Float64Array): { x: Float64Array; y: Float64Array } {
  let lon0 = 0;
  let lat0 = 0;
  let k = 0;
  for (let i = 0; i < lonDeg.length; i++) {
    if (Number.isFinite(lonDeg[i] as number) && Number.isFinite(latDeg[i] as number)) {
      lon0 += lonDeg[i] as number;
      lat0 += latDeg[i] as number;
      k++;
    }
  }
  lon0 /= Math.max(k, 1);
  lat0 /= Math.max(k, 1);
  const m = 6371000 * (Math.PI / 180);
  const x = new Float64Array(lonDeg.length);
  const y = new Float64Array(lonDeg.length);
  for (let i = 0; i < lonDeg.length; i++) {
    x[i] = ((lonDeg[i] as number) - lon0) * m * Math.cos((lat0 * Math.PI) / 180);
    y[i] = ((latDeg[i] as number) - lat0) * m;
  }
  return { x, y };
}

export function stationFlags(
  table: StationTable,
  results: Float64Array,
  tcMgal: Float64Array,
  misfitM: Float64Array,
  o: Pick<ReduceOptions, 'misfitLimitM' | 'tcOutlierLimitMgal' | 'legacyTcLimitMgal' | 'keepGoing' | 'shard'>,
): RunFlags {
  const n = table.ids.length;
  if (!o.keepGoing) {
    const outside: number[] = [];
    for (let i = 0; i < n; i++) {
      const bits = results[i * RESULT_WIDTH + TR.flags] as number;
      if (Number.isFinite(bits) && (bits & TERRAIN_FLAG.outside_dem) !== 0) outside.push(i);
    }
    const first = outside[0];
    if (first !== undefined) {
      throw new InputError(
        `station lies outside the DEM (lon ${table.lonDeg[first]}, lat ${table.latDeg[first]})` +
          (outside.length > 1 ? `; ${outside.length} stations in all are outside` : '') +
          '; give a DEM that covers every station, or --keep-going to flag them (outside_dem) and compute the rest',
        { file: table.source, line: table.lines[first] as number, station: table.ids[first] as string },
      );
    }
  }
  const per: string[][] = table.flags.map((f) => [...f]);
  for (let i = 0; i < n; i++) {
    const bits = results[i * RESULT_WIDTH + TR.flags] as number;
    if (Number.isFinite(bits)) for (const [code, bit] of TERRAIN_CODES) if ((bits & bit) !== 0) (per[i] as string[]).push(code);
    const m = misfitM[i] as number;
    if (Math.abs(m) > o.misfitLimitM) (per[i] as string[]).push('height_misfit');
  }
  const { x, y } = localMetres(table.lonDeg, table.latDeg);
  // a share of a cluster run sees only its own TCs: tc_outlier is decided by the merge
  const outliers = o.shard ? [] : tcOutlierFlags(x, y, table.heightM, tcMgal, { limitMgal: o.tcOutlierLimitMgal });
  const legacy = legacyTcChangeFlags(tcMgal, table.legacyTcMgal, o.legacyTcLimitMgal);
  const tcOutlierSlot = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    tcOutlierSlot[i] = (per[i] as string[]).length;
    if (outliers[i]) (per[i] as string[]).push('tc_outlier');
    if (legacy[i]) (per[i] as string[]).push('legacy_tc_change');
  }
  const counts: Record<string, number> = {};
  for (const f of per) for (const code of f) counts[code] = (counts[code] ?? 0) + 1;
  const summary = qcSummary(per, table.ids, misfitM);
  return { perStation: per, counts, summaryText: formatQcSummary(summary), tcOutlierSlot };
}
