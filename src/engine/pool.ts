/**
 * Runs the terrain stage for all stations: inline (workers = 0) or on a piscina pool of CPU
 * threads that share the DEM pyramid and the result array through SharedArrayBuffers (the
 * pool receives them once in workerData; nothing is copied per task). Results are written by
 * station index, so the output does not depend on the pool size or on completion order.
 */
import { Piscina } from 'piscina';
import type { TerrainContext } from '../terrain/station-terrain.js';
import type { StationArrays } from './batch.js';
import { computeTerrainBatch } from './batch.js';

export interface TerrainRunOptions {
  workers: number;
  /** Stations per task. */
  batchSize: number;
  /** Called after each finished batch with the number of stations done so far. */
  onProgress?: (done: number) => void;
  signal?: AbortSignal;
}

function workerUrl(): { filename: string; execArgv: string[] } {
  const fromTs = import.meta.url.endsWith('.ts');
  const filename = new URL(fromTs ? '../../workers/terrain-worker.ts' : '../../workers/terrain-worker.js', import.meta.url).href;
  // Workers accept only some process flags (e.g. --expose-gc is refused): pass on the module
  // loader and resolution flags, which the TypeScript sources need, and nothing else.
  const keep: string[] = [];
  const argv = process.execArgv;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i] as string;
    if (/^--(import|require|loader|experimental-loader|conditions)$/.test(a) && i + 1 < argv.length) {
      keep.push(a, argv[++i] as string);
    } else if (/^--(import|require|loader|experimental-loader|conditions)=/.test(a)) {
      keep.push(a);
    }
  }
  const hasTsx = keep.some((a) => a.includes('tsx'));
  const execArgv = fromTs && !hasTsx ? [...keep, '--import', 'tsx'] : keep;
  return { filename, execArgv };
}

export async function runTerrain(ctx: TerrainContext, stations: StationArrays, results: Float64Array, opts: TerrainRunOptions): Promise<void> {
  const n = stations.count;
  if (opts.workers <= 0) {
    for (let start = 0; start < n; start += opts.batchSize) {
      if (opts.signal?.aborted) throw abortError();
      const end = Math.min(n, start + opts.batchSize);
      computeTerrainBatch(ctx, stations, results, start, end);
      opts.onProgress?.(end);
      // let signals and progress rendering through between batches
      if ((start / opts.batchSize) % 16 === 15) await new Promise((r) => setImmediate(r));
    }
    return;
  }
  const { filename, execArgv } = workerUrl();
  const pool = new Piscina({
    filename,
    workerData: { ctx, stations, results },
    minThreads: opts.workers,
    maxThreads: opts.workers,
    idleTimeout: 10_000,
    execArgv,
  });
  let poolError: unknown = null;
  pool.on('error', (e: unknown) => {
    poolError = e;
  });
  let done = 0;
  // One abort listener for the whole run (not one per task): on abort the pool is destroyed,
  // which ends the running tasks, and the run rejects.
  let onAbort: (() => void) | null = null;
  const aborted = new Promise<never>((_, reject) => {
    onAbort = () => reject(abortError());
    opts.signal?.addEventListener('abort', onAbort, { once: true });
  });
  aborted.catch(() => {});
  try {
    if (opts.signal?.aborted) throw abortError();
    const tasks: Promise<void>[] = [];
    for (let start = 0; start < n; start += opts.batchSize) {
      const end = Math.min(n, start + opts.batchSize);
      tasks.push(
        (pool.run({ start, end }) as Promise<number>).then((count) => {
          done += count;
          opts.onProgress?.(done);
        }),
      );
    }
    const all = Promise.all(tasks);
    all.catch(() => {}); // after an abort the destroyed pool rejects the pending tasks
    await Promise.race([all, aborted]);
    if (poolError) throw poolError;
  } finally {
    if (onAbort) opts.signal?.removeEventListener('abort', onAbort);
    await pool.destroy();
  }
}

function abortError(): Error {
  const e = new Error('The run was interrupted');
  e.name = 'AbortError';
  return e;
}
