/**
 * One share's files as `talus merge` reads them: the shard results CSV (cells exactly as written,
 * no trimming, so they are written back byte for byte) and its provenance JSON.
 */
import { readFileSync } from 'node:fs';
import { parse } from 'csv-parse/sync';
import { InputError } from '../errors.js';
import { SHARD_COLUMNS } from './shard-csv.js';

export interface ShardProvenance {
  parameters: Record<string, unknown>;
  stations: { file: string; sha256: string; rows: number };
  dems: { role: string; path: string; sha256: string; windowRead?: unknown }[];
  shard?: { k: number; n: number; stations: number };
  runTimeS: number;
  stationCounts: { total: number; computed: number; flagged: Record<string, number> };
  performance: Record<string, number>;
  warnings: string[];
  [key: string]: unknown;
}

export interface ShardFile {
  file: string;
  provenance: ShardProvenance;
  shard: { k: number; n: number; stations: number };
  /** The header after the shard columns (input columns, results columns, flags). */
  header: string[];
  /** Per row: the shard columns' cells, and the other cells. */
  shardCells: string[][];
  cells: string[][];
  /** 1-based file line of each row. */
  lines: number[];
}

function readText(file: string, what: string): string {
  try {
    return readFileSync(file, 'utf8');
  } catch (e) {
    throw new InputError(`cannot read the ${what} (${(e as NodeJS.ErrnoException).code ?? String(e)}): expected a file written by talus reduce --shard K/N`, { file });
  }
}

export function readShardFile(file: string): ShardFile {
  const provPath = `${file}.provenance.json`;
  let provenance: ShardProvenance;
  try {
    provenance = JSON.parse(readText(provPath, 'provenance file')) as ShardProvenance;
  } catch (e) {
    if (e instanceof InputError) throw e;
    throw new InputError(`not a readable provenance JSON (${(e as Error).message})`, { file: provPath });
  }
  const shard = provenance.shard;
  if (!shard || !Number.isInteger(shard.k) || !Number.isInteger(shard.n)) {
    throw new InputError('the provenance has no shard record: expected the results of talus reduce --shard K/N', { file: provPath });
  }
  let records: { record: string[]; info: { lines: number } }[];
  try {
    records = parse(readText(file, 'shard results file'), { info: true, relax_column_count: false }) as unknown as typeof records;
  } catch (e) {
    throw new InputError(`not a readable CSV table (${(e as Error).message})`, { file });
  }
  const head = records[0]?.record ?? [];
  const s = SHARD_COLUMNS.length;
  if (head.slice(0, s).join(',') !== SHARD_COLUMNS.join(',')) {
    throw new InputError(`the header does not start with the shard columns ${SHARD_COLUMNS.join(',')}: expected a results file of talus reduce --shard K/N`, { file, line: 1 });
  }
  const rows = records.slice(1);
  if (rows.length !== shard.stations) {
    throw new InputError(`${rows.length} rows, but its provenance says shard ${shard.k}/${shard.n} wrote ${shard.stations}: the file is truncated or was edited`, { file });
  }
  return {
    file,
    provenance,
    shard,
    header: head.slice(s),
    shardCells: rows.map((r) => r.record.slice(0, s)),
    cells: rows.map((r) => r.record.slice(s)),
    lines: rows.map((r) => r.info.lines),
  };
}
