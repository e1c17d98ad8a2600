/**
 * `talus merge`: the shares of a cluster run (`talus reduce --shard K/N`) joined into the results
 * CSV and provenance the whole run writes. Rows go back in station-file order, tc_outlier is
 * decided over every station (its neighbours cross share borders) and put where the whole run
 * puts it in the flags, and the CSV is written by the same writer, so it equals the whole run's
 * byte for byte. Both files are written atomically.
 */
import { writeFileAtomic } from '../io/atomic-file.js';
import { resultsCsv } from '../io/results-csv.js';
import { tcOutlierFlags } from '../qc/tc-outlier.js';
import { formatQcSummary, qcSummary } from '../qc/qc-summary.js';
import { talusVersion } from '../cli/version.js';
import { readShardFile, type ShardFile } from './merge-input.js';
import { checkShards, stationRows } from './merge-check.js';

export interface MergeSummary {
  stations: number;
  shards: number;
  computed: number;
  flagged: Record<string, number>;
  runTimeS: number;
  outputCsv: string;
  provenanceJson: string;
  qcText: string;
}

const num = (s: string | undefined): number => (s === undefined || s === '' ? NaN : Number(s));

export async function runMerge(files: string[], outPath: string, commandLine: string[]): Promise<MergeSummary> {
  const shards = checkShards(files.map((f) => readShardFile(f)));
  const at = stationRows(shards);
  const n = at.length;
  const first = shards[0] as ShardFile;
  const cellsOf = (i: number): { shard: ShardFile; row: number } => {
    const a = at[i] as { shard: number; row: number };
    return { shard: shards[a.shard] as ShardFile, row: a.row };
  };
  // the neighbourhood check's inputs, at full precision, in station order
  const x = new Float64Array(n), y = new Float64Array(n), h = new Float64Array(n), tc = new Float64Array(n), misfit = new Float64Array(n);
  const ids: string[] = [];
  const slots = new Int32Array(n);
  const rows: string[][] = [];
  const flags: string[][] = [];
  for (let i = 0; i < n; i++) {
    const { shard, row } = cellsOf(i);
    const s = shard.shardCells[row] as string[];
    ids.push(s[1] as string);
    slots[i] = Number(s[2]);
    x[i] = num(s[3]); y[i] = num(s[4]); h[i] = num(s[5]); tc[i] = num(s[6]); misfit[i] = num(s[7]);
    const cells = shard.cells[row] as string[];
    rows.push(cells.slice(0, -1));
    const f = cells[cells.length - 1] as string;
    flags.push(f === '' ? [] : f.split(';'));
  }
  const limitMgal = first.provenance.parameters.tcOutlierLimitMgal as number;
  const outliers = tcOutlierFlags(x, y, h, tc, { limitMgal });
  for (let i = 0; i < n; i++) if (outliers[i]) (flags[i] as string[]).splice(slots[i] as number, 0, 'tc_outlier');
  const csv = resultsCsv(first.header.slice(0, -1), rows, [], flags);

  const counts: Record<string, number> = {};
  for (const f of flags) for (const code of f) counts[code] = (counts[code] ?? 0) + 1;
  const sum = (get: (s: ShardFile) => number): number => shards.reduce((acc, s) => acc + get(s), 0);
  const computed = sum((s) => s.provenance.stationCounts.computed);
  const terrainTimeS = sum((s) => s.provenance.performance.terrainTimeS ?? 0);
  const kernelEvals = sum((s) => (s.provenance.performance.kernelEvaluationsPerStation ?? 0) * s.provenance.stationCounts.computed);
  const runTimeS = sum((s) => s.provenance.runTimeS);
  const { shard: _shard, ...parameters } = first.provenance.parameters;
  const provenance = {
    ...first.provenance,
    talusVersion: talusVersion(),
    commandLine,
    createdUtc: new Date().toISOString(),
    parameters: { ...parameters, outPath },
    shard: undefined,
    shards: shards.map((s) => ({
      file: s.file,
      k: s.shard.k,
      n: s.shard.n,
      stations: s.shard.stations,
      commandLine: s.provenance.commandLine,
      createdUtc: s.provenance.createdUtc,
      runTimeS: s.provenance.runTimeS,
      windowsRead: s.provenance.dems.map((d) => ({ role: d.role, path: d.path, windowRead: d.windowRead })),
    })),
    dems: first.provenance.dems.map(({ windowRead: _w, ...d }) => d),
    runTimeS,
    stationCounts: { total: n, computed, flagged: counts },
    performance: {
      terrainTimeS,
      stationsPerS: computed / Math.max(terrainTimeS, 1e-9),
      kernelEvaluationsPerStation: computed > 0 ? kernelEvals / computed : 0,
    },
    warnings: [...new Set(shards.flatMap((s) => s.provenance.warnings))],
  };
  const provenancePath = `${outPath}.provenance.json`;
  await writeFileAtomic(outPath, csv);
  await writeFileAtomic(provenancePath, JSON.stringify(provenance, null, 2) + '\n');
  return {
    stations: n,
    shards: shards.length,
    computed,
    flagged: counts,
    runTimeS,
    outputCsv: outPath,
    provenanceJson: provenancePath,
    qcText: formatQcSummary(qcSummary(flags, ids, misfit)),
  };
}
