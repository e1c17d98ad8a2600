/**
 * What `talus merge` checks before joining shares: one station file (sha256), the same DEM files
 * (role and sha256, in order), the same parameters (all but the ones that only say where and how
 * fast a share ran), every share 1..N exactly once, and every station in exactly one share.
 */
import { isDeepStrictEqual } from 'node:util';
import { InputError } from '../errors.js';
import type { ShardFile } from './merge-input.js';
import { SHARD_COLUMNS } from './shard-csv.js';

/**
 * Parameters a share may set on its own: its share, its output, its machine's threads and batch
 * size and progress bar (results are bit-identical for any pool size), and the paths of the
 * inputs (a machine may mount them elsewhere; their contents are compared by sha256 instead).
 */
export const PER_SHARD_PARAMETERS = new Set(['shard', 'outPath', 'workers', 'batchSize', 'progress', 'stationsPath', 'demPaths', 'farDemPath']);

const show = (v: unknown): string => (v === undefined ? '(not set)' : JSON.stringify(v));

function checkSameRun(a: ShardFile, b: ShardFile): void {
  const pair = `${a.file} and ${b.file}`;
  if (a.provenance.stations.sha256 !== b.provenance.stations.sha256) {
    throw new InputError(`shards ${pair} come from different station files (sha256 ${a.provenance.stations.sha256.slice(0, 12)}... vs ${b.provenance.stations.sha256.slice(0, 12)}...); expected one station file for all shards`);
  }
  const dems = (f: ShardFile): string => f.provenance.dems.map((d) => `${d.role}:${d.sha256}`).join(' ');
  if (dems(a) !== dems(b)) {
    throw new InputError(`shards ${pair} were computed from different DEM files (${a.provenance.dems.map((d) => d.path).join(', ')} vs ${b.provenance.dems.map((d) => d.path).join(', ')}, compared by sha256); expected the same DEMs for all shards`);
  }
  const keys = new Set([...Object.keys(a.provenance.parameters), ...Object.keys(b.provenance.parameters)]);
  for (const key of keys) {
    if (PER_SHARD_PARAMETERS.has(key)) continue;
    const va = a.provenance.parameters[key];
    const vb = b.provenance.parameters[key];
    if (!isDeepStrictEqual(va, vb)) {
      throw new InputError(`shards ${pair} were run with different parameters: ${key} is ${show(va)} in ${a.file} but ${show(vb)} in ${b.file}; expected every parameter but --shard to be equal`);
    }
  }
  if (a.shard.n !== b.shard.n) {
    throw new InputError(`shards ${pair} split the run differently (${a.shard.k}/${a.shard.n} vs ${b.shard.k}/${b.shard.n}); expected one N for all shards`);
  }
  if (a.header.join(',') !== b.header.join(',')) {
    throw new InputError(`shards ${pair} have different columns; expected the same results columns in every shard`);
  }
}

/** The shares in K order, each exactly once; throws InputError naming the files otherwise. */
export function checkShards(shards: ShardFile[]): ShardFile[] {
  const first = shards[0];
  if (!first) throw new InputError('no shard files given: expected SHARD1.csv SHARD2.csv ... from talus reduce --shard K/N');
  for (const s of shards.slice(1)) checkSameRun(first, s);
  const byK = new Map<number, ShardFile>();
  for (const s of shards) {
    const seen = byK.get(s.shard.k);
    if (seen) throw new InputError(`shard ${s.shard.k}/${s.shard.n} is given twice: ${seen.file} and ${s.file}; expected each shard once`);
    byK.set(s.shard.k, s);
  }
  const n = first.shard.n;
  const missing = Array.from({ length: n }, (_, i) => i + 1).filter((k) => !byK.has(k));
  if (missing.length > 0) {
    throw new InputError(`shard${missing.length > 1 ? 's' : ''} ${missing.map((k) => `${k}/${n}`).join(', ')} missing: ${shards.length} of ${n} shards given (${shards.map((s) => s.file).join(', ')}); expected all ${n}`);
  }
  return Array.from({ length: n }, (_, i) => byK.get(i + 1) as ShardFile);
}

/** For every station index, the shard file and row holding it; throws when one is missing or repeated. */
export function stationRows(shards: ShardFile[]): { shard: number; row: number }[] {
  const total = (shards[0] as ShardFile).provenance.stations.rows;
  const at: ({ shard: number; row: number } | undefined)[] = new Array(total);
  shards.forEach((s, si) => {
    s.shardCells.forEach((cells, row) => {
      const text = cells[0] as string;
      const index = Number(text);
      if (!(/^\d+$/.test(text) && index < total)) {
        throw new InputError(`${SHARD_COLUMNS[0]} "${text}" is not a station index; expected a whole number below ${total}`, { file: s.file, line: s.lines[row] as number });
      }
      const prev = at[index];
      if (prev) {
        const other = shards[prev.shard] as ShardFile;
        throw new InputError(`station index ${index} (${cells[1]}) is in two shards: ${other.file}:${other.lines[prev.row]} and ${s.file}:${s.lines[row]}; expected each station once`);
      }
      at[index] = { shard: si, row };
    });
  });
  for (let i = 0; i < total; i++) {
    if (!at[i]) throw new InputError(`station index ${i} of ${total} is in no shard (${shards.map((s) => s.file).join(', ')}); expected every station once`);
  }
  return at as { shard: number; row: number }[];
}
