/**
 * Engine benchmark: the terrain stage on an invented survey (2000 stations on a 30 m DEM of
 * 60 x 60 km with a 1 km far-zone DEM, radius 166.735 km, 0.01 mGal at 2670 kg/m^3), inline
 * and on 1 and 2 pool workers; setup time, kernel evaluations, peak RSS and the speed-up over
 * brute force. Measurements: engine-measure.ts.
 *
 * It measures COMPILED code: tsx's transform turns imported calls into getter calls and slows
 * hot loops 2-3x, so this file (run by `npm run bench engine` under tsx) first bundles
 * engine-measure.ts and workers/terrain-worker.ts with esbuild into
 * node_modules/.cache/talus-bench-engine/ (bench/engine/ and workers/, the layout the pool
 * expects beside its module), then runs the bundle in a fresh Node process.
 *
 * `node --import tsx test/bench/engine.bench.ts --profile`: setup and the inline run only,
 * under node --cpu-prof, then the top functions by self and total time.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, readdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { topFunctions } from './cpu-profile-top.js';

const repo = fileURLToPath(new URL('../../', import.meta.url));
const outDir = join(repo, 'node_modules', '.cache', 'talus-bench-engine');
const measureJs = join(outDir, 'bench', 'engine', 'engine-measure.js');
const workerJs = join(outDir, 'workers', 'terrain-worker.js');
const profile = process.argv.includes('--profile');

function bundle(entry: string, outfile: string): void {
  const args = [entry, '--bundle', '--platform=node', '--format=esm', '--target=node20', '--packages=external', '--log-level=warning', `--outfile=${outfile}`];
  const r = spawnSync(join(repo, 'node_modules', '.bin', 'esbuild'), args, { stdio: 'inherit', cwd: repo });
  if (r.status !== 0) throw new Error(`esbuild failed on ${entry}`);
}

rmSync(outDir, { recursive: true, force: true });
mkdirSync(outDir, { recursive: true });
const t0 = performance.now();
bundle(join(repo, 'test', 'bench', 'engine-measure.ts'), measureJs);
bundle(join(repo, 'workers', 'terrain-worker.ts'), workerJs);
process.stdout.write(`bundled the engine and the worker with esbuild in ${((performance.now() - t0) / 1000).toFixed(2)} s (compiled code is measured)\n`);

const profDir = join(outDir, 'profiles');
// no --expose-gc: the pool hands process.execArgv to its workers, and workers refuse that flag
const nodeArgs = [...(profile ? ['--cpu-prof', `--cpu-prof-dir=${profDir}`] : []), measureJs, ...(profile ? ['inline-only'] : [])];
const r = spawnSync(process.execPath, nodeArgs, { stdio: 'inherit', cwd: repo });
if (r.status !== 0) process.exit(r.status ?? 1);

if (profile) {
  const file = readdirSync(profDir).find((f) => f.endsWith('.cpuprofile'));
  if (!file) throw new Error(`no CPU profile in ${profDir}`);
  const top = topFunctions(join(profDir, file), 15);
  process.stdout.write(`\nCPU profile ${join(profDir, file)} (${top.sampledS.toFixed(1)} s sampled, setup included)\nby self time:\n`);
  for (const f of top.self) process.stdout.write(`  ${f.selfPct.toFixed(1).padStart(5)} % self ${f.totalPct.toFixed(1).padStart(5)} % total  ${f.name}\n`);
  process.stdout.write('by total time:\n');
  for (const f of top.total) process.stdout.write(`  ${f.totalPct.toFixed(1).padStart(5)} % total ${f.selfPct.toFixed(1).padStart(5)} % self  ${f.name}\n`);
}
