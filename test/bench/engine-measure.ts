/**
 * The measurements of the engine benchmark, run as compiled JavaScript (engine.bench.ts bundles
 * this file and the worker; see there). Prints setup times, stations/s inline and on 1 and 2
 * pool workers, parallel efficiency, kernel evaluations per station, peak RSS against the DEM
 * bytes, and the speed-up over a brute-force prism sum with the accuracy that goes with it.
 * Argument `inline-only`: setup and the inline run only (for CPU profiles).
 */
import { loadavg } from 'node:os';
import { performance } from 'node:perf_hooks';
import { buildPyramid, type Pyramid } from '../../src/terrain/pyramid.js';
import { planZones } from '../../src/terrain/zone-plan.js';
import { makeTerrainContext, stationTerrain, TerrainScratch, TR, type TerrainContext } from '../../src/terrain/station-terrain.js';
import { farWeights } from '../../src/engine/far-mask.js';
import { RESULT_WIDTH, sharedFloat64, type StationArrays } from '../../src/engine/batch.js';
import { runTerrain } from '../../src/engine/pool.js';
import { G, UNIT_DENSITY_KG_M3, CAP_RADIUS_M } from '../../src/constants.js';
import { MGAL } from '../../src/units.js';
import { distanceToEdgeM, FINE_CELL_M, makeFarGrid, makeFineGrid, makeStations } from './engine-scene.js';
import { bruteForceNativeFactor, bruteForceNearFactor, type BruteStation } from './brute-force-tc.js';

const RHO = 2670;
const ACCURACY_MGAL = 0.01;
const STATIONS = 2000;
const BATCH = 32;
const BRUTE_STATIONS = 5;
const BRUTE_RADIUS_M = 10_000;
const MB = 1024 * 1024;
const TARGET_RATE = 500;
const TARGET_EFFICIENCY = 0.85;
const MGAL_PER_FACTOR = (G * RHO) / MGAL;
const inlineOnly = process.argv.includes('inline-only');

const out = (s: string): void => void process.stdout.write(`${s}\n`);
const load = (): string => loadavg().map((v) => v.toFixed(2)).join(' ');
const maxRssBytes = (): number => process.resourceUsage().maxRSS * 1024;
const seconds = (t0: number): number => (performance.now() - t0) / 1000;
const verdict = (ok: boolean): string => (ok ? 'PASS' : 'MISS');

function timed<T>(f: () => T): [T, number] {
  const t0 = performance.now();
  const v = f();
  return [v, seconds(t0)];
}

function pyramidBytes(p: Pyramid): number {
  let b = 0;
  for (const lv of p.levels) b += lv.cells ? lv.cells.byteLength : 0;
  return b;
}

function sameBits(a: Float64Array, b: Float64Array): boolean {
  const x = new Uint8Array(a.buffer, a.byteOffset, a.byteLength);
  const y = new Uint8Array(b.buffer, b.byteOffset, b.byteLength);
  if (x.length !== y.length) return false;
  for (let i = 0; i < x.length; i++) if (x[i] !== y[i]) return false;
  return true;
}

function meanSlot(results: Float64Array, n: number, slot: number): number {
  let s = 0;
  for (let i = 0; i < n; i++) s += results[i * RESULT_WIDTH + slot] as number;
  return s / n;
}

/** Process CPU time (all threads), s. */
function cpuSeconds(): number {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1e6;
}

/** One runTerrain call: results, wall seconds, process CPU seconds (all threads). */
async function timeRun(ctx: TerrainContext, st: StationArrays, workers: number, batchSize = BATCH): Promise<[Float64Array, number, number]> {
  const results = sharedFloat64(st.count * RESULT_WIDTH);
  const c0 = cpuSeconds();
  const t0 = performance.now();
  await runTerrain(ctx, st, results, { workers, batchSize });
  return [results, seconds(t0), cpuSeconds() - c0];
}

// ---- setup --------------------------------------------------------------------------------
globalThis.gc?.();
const baselineRss = process.memoryUsage().rss;
out(`load average at start: ${load()}`);
const [fine, tFineGen] = timed(makeFineGrid);
const [far, tFarGen] = timed(makeFarGrid);
const demBytes = fine.data.byteLength + far.data.byteLength;
const [finePyramid, tFinePyr] = timed(() => buildPyramid(fine));
const [weights, tWeights] = timed(() => farWeights(far, fine, (x, y) => [x, y]));
const [farPyramid, tFarPyr] = timed(() => buildPyramid(far, weights));
const plan = planZones({
  radiusM: CAP_RADIUS_M,
  accuracyMgal: (ACCURACY_MGAL * UNIT_DENSITY_KG_M3) / RHO,
  fieldInnerRadiusM: 0,
  fineCellM: FINE_CELL_M,
  aboveTerrainM: 50,
  belowTerrainM: 50,
});
const ctx = makeTerrainContext({ grid: fine, pyramid: finePyramid }, { grid: far, pyramid: farPyramid }, plan);
const stations = makeStations(fine, STATIONS, 1000, 20240607);
out(`fine DEM ${fine.width} x ${fine.height} at ${fine.cellSizeX} m (${(fine.width * fine.cellSizeX) / 1000} km), far DEM ${far.width} x ${far.height} at ${far.cellSizeX} m (${(far.width * far.cellSizeX) / 1000} km); DEM bytes ${(demBytes / MB).toFixed(1)} MB (Float32)`);
out(`zone plan: radius ${plan.radiusM} m, accuracy ${ACCURACY_MGAL} mGal at ${RHO} kg/m^3 (${plan.accuracyMgal.toFixed(5)} at unit density), accept ratio ${plan.acceptRatio.toFixed(2)}, near window ${2 * plan.nearHalfCells + 1}^2 cells, geocentric from ${plan.geocentricFromM} m`);
out(`synthetic DEM generation (not engine): fine ${tFineGen.toFixed(2)} s, far ${tFarGen.toFixed(3)} s`);
out(
  `setup: fine pyramid ${tFinePyr.toFixed(3)} s (${finePyramid.levels.length} levels, ${(pyramidBytes(finePyramid) / MB).toFixed(1)} MB = ${(pyramidBytes(finePyramid) / fine.data.byteLength).toFixed(2)} x fine DEM), ` +
    `far weights ${tWeights.toFixed(3)} s, far pyramid ${tFarPyr.toFixed(3)} s; total ${(tFinePyr + tWeights + tFarPyr).toFixed(3)} s`,
);
const rssAfterSetup = maxRssBytes();

// ---- throughput ---------------------------------------------------------------------------
globalThis.gc?.();
const [inline, tInline, cInline] = await timeRun(ctx, stations, 0);
const rateInline = STATIONS / tInline;
out(`inline (workers 0): ${STATIONS} stations in ${tInline.toFixed(2)} s = ${rateInline.toFixed(0)} stations/s (${((1000 * tInline) / STATIONS).toFixed(3)} ms/station); CPU ${cInline.toFixed(2)} s = ${(STATIONS / cInline).toFixed(0)} stations per CPU-second`);
const rssAfterInline = maxRssBytes();
const n = STATIONS;
const evals = {
  prisms: meanSlot(inline, n, TR.prisms),
  columns: meanSlot(inline, n, TR.columns),
  geocentric: meanSlot(inline, n, TR.geocentric),
  nearPoints: meanSlot(inline, n, TR.nearPoints),
};
const evalsTotal = evals.prisms + evals.columns + evals.geocentric + evals.nearPoints;
out(
  `kernel evaluations per station: ${evals.prisms.toFixed(0)} prisms, ${evals.columns.toFixed(0)} columns, ${evals.geocentric.toFixed(0)} geocentric columns, ` +
    `${evals.nearPoints.toFixed(0)} near points; total ${evalsTotal.toFixed(0)} (${((1e9 * tInline) / STATIONS / evalsTotal).toFixed(0)} ns per evaluation, all costs included)`,
);
let tcMin = Infinity;
let tcMax = -Infinity;
let tcSum = 0;
let errSum = 0;
for (let i = 0; i < n; i++) {
  const tc = (inline[i * RESULT_WIDTH + TR.tcUnitMgal] as number) * (RHO / UNIT_DENSITY_KG_M3);
  tcMin = Math.min(tcMin, tc);
  tcMax = Math.max(tcMax, tc);
  tcSum += tc;
  errSum += (inline[i * RESULT_WIDTH + TR.errorEstimateUnitMgal] as number) * (RHO / UNIT_DENSITY_KG_M3);
}
out(`TC at ${RHO} kg/m^3: mean ${(tcSum / n).toFixed(3)}, min ${tcMin.toFixed(3)}, max ${tcMax.toFixed(3)} mGal; mean column-error estimate ${(errSum / n).toFixed(5)} mGal`);

if (inlineOnly) {
  out(`load average at end: ${load()}`);
  process.exit(0);
}

// pool start + stop cost: two one-station tasks
const pair: StationArrays = { ...stations, count: 2 };
const [, tPool1] = await timeRun(ctx, pair, 1, 1);
const [, tPool2] = await timeRun(ctx, pair, 2, 1);
out(`pool start + stop with 2 one-station tasks: ${(1000 * tPool1).toFixed(0)} ms (1 worker), ${(1000 * tPool2).toFixed(0)} ms (2 workers)`);
const [res1, t1, c1] = await timeRun(ctx, stations, 1);
const [res2, t2, c2] = await timeRun(ctx, stations, 2);
const rate1 = STATIONS / t1;
const rate2 = STATIONS / t2;
const efficiency = rate2 / (2 * rate1);
out(`workers 1: ${t1.toFixed(2)} s = ${rate1.toFixed(0)} stations/s per worker (pool start included; ${(STATIONS / (t1 - tPool1)).toFixed(0)} without)`);
out(`workers 2: ${t2.toFixed(2)} s = ${rate2.toFixed(0)} stations/s = ${(rate2 / 2).toFixed(0)} per worker (pool start included; ${(STATIONS / (t2 - tPool2) / 2).toFixed(0)} per worker without)`);
out(`CPU time (all threads): workers 1 ${c1.toFixed(2)} s = ${(STATIONS / c1).toFixed(0)} stations per CPU-second, workers 2 ${c2.toFixed(2)} s = ${(STATIONS / c2).toFixed(0)}; CPU/wall at 2 workers ${(c2 / t2).toFixed(2)} cores busy (load from other processes lowers it)`);
out(`parallel efficiency at 2 workers rate(2) / (2 rate(1)) = ${(100 * efficiency).toFixed(1)} %; inline / 1 worker = ${(rateInline / rate1).toFixed(3)}`);
out(`results bit-identical to inline: workers 1 ${sameBits(inline, res1) ? 'yes' : 'NO'}, workers 2 ${sameBits(inline, res2) ? 'yes' : 'NO'}`);
const rssPeak = maxRssBytes();
out(`load average after the timed runs: ${load()}`);

// ---- brute force at equal accuracy --------------------------------------------------------
const plan10 = planZones({ ...plan, radiusM: BRUTE_RADIUS_M });
const ctx10 = makeTerrainContext({ grid: fine, pyramid: finePyramid }, null, plan10);
const picked: BruteStation[] = [];
for (let i = 0; i < n && picked.length < BRUTE_STATIONS; i++) {
  const x = stations.fineX[i] as number;
  const y = stations.fineY[i] as number;
  if (distanceToEdgeM(fine, x, y) < BRUTE_RADIUS_M + 1000) continue;
  picked.push({ x, y, heightM: stations.heightM[i] as number, halfCells: plan10.nearHalfCells, taperM: plan10.taperM });
}
const count = new Float64Array(1);
bruteForceNativeFactor(fine, picked[0] as BruteStation, 2000, count); // warm-up of the prism loop
let bruteSeconds = 0;
let bruteCpu = 0;
let bruteCells = 0;
let worstDiff = 0;
let worstOverTol = 0;
const row = new Float64Array(TR.size);
const scratch = new TerrainScratch();
for (const s of picked) {
  const c0 = cpuSeconds();
  const t0 = performance.now();
  const nativeFactor = bruteForceNativeFactor(fine, s, BRUTE_RADIUS_M, count);
  bruteSeconds += seconds(t0);
  bruteCpu += cpuSeconds() - c0;
  bruteCells += count[0] as number;
  const brute = (nativeFactor + bruteForceNearFactor(fine, s)) * MGAL_PER_FACTOR;
  stationTerrain(ctx10, { fineX: s.x, fineY: s.y, farX: s.x, farY: s.y, latDeg: 45, heightM: s.heightM }, row, scratch);
  const zoned = (row[TR.tcUnitMgal] as number) * (RHO / UNIT_DENSITY_KG_M3);
  const diff = zoned - brute;
  const tol = Math.max(0.02, 0.005 * Math.abs(brute));
  worstDiff = Math.max(worstDiff, Math.abs(diff));
  worstOverTol = Math.max(worstOverTol, Math.abs(diff) / tol);
  out(`  station (${s.x.toFixed(0)}, ${s.y.toFixed(0)}) h ${s.heightM.toFixed(1)} m, R 10 km: zoned ${zoned.toFixed(4)} brute ${brute.toFixed(4)} mGal, diff ${diff >= 0 ? '+' : ''}${diff.toFixed(4)} (tolerance ${tol.toFixed(3)})`);
}
const nsPerPrism = (1e9 * bruteSeconds) / bruteCells;
const cells10 = bruteCells / picked.length;
const scaleR2 = (CAP_RADIUS_M / BRUTE_RADIUS_M) ** 2;
const cellsFull = cells10 * scaleR2;
const nsPerPrismCpu = (1e9 * bruteCpu) / bruteCells;
const bruteStationS = (cellsFull * nsPerPrism) / 1e9;
const bruteStationCpuS = (cellsFull * nsPerPrismCpu) / 1e9;
const speedup = rateInline * bruteStationS;
const speedupCpu = (STATIONS / cInline) * bruteStationCpuS;
out(`brute force: ${picked.length} stations x ${cells10.toFixed(0)} native prisms within 10 km, ${nsPerPrism.toFixed(1)} ns per prism wall (${nsPerPrismCpu.toFixed(1)} CPU), ${((1000 * bruteSeconds) / picked.length).toFixed(0)} ms per station`);
out(
  `EXTRAPOLATED by cell count (cells proportional to R^2, x ${scaleR2.toFixed(1)}) to ${CAP_RADIUS_M / 1000} km at 30 m: ${(cellsFull / 1e6).toFixed(1)} M prisms = ${bruteStationS.toFixed(2)} s per station ` +
    `(${(1 / bruteStationS).toFixed(3)} stations/s); zoned engine inline ${rateInline.toFixed(0)} stations/s: speed-up ${speedup.toFixed(0)} x by wall time, ${speedupCpu.toFixed(0)} x by CPU time`,
);
out(`equal accuracy: zoned vs brute force at 10 km, worst |diff| ${worstDiff.toFixed(4)} mGal at ${RHO} kg/m^3 = ${worstOverTol.toFixed(2)} of max(0.02 mGal, 0.5 %)`);

// ---- memory and targets -------------------------------------------------------------------
const rssLimit = 1.5 * demBytes + 200 * MB;
out(
  `peak RSS ${(rssPeak / MB).toFixed(0)} MB (after setup ${(rssAfterSetup / MB).toFixed(0)}, after inline ${(rssAfterInline / MB).toFixed(0)}, baseline ${(baselineRss / MB).toFixed(0)}); ` +
    `(peak - baseline) / DEM bytes = ${((rssPeak - baselineRss) / demBytes).toFixed(2)}`,
);
out('targets:');
out(`  ${verdict(rate1 >= TARGET_RATE)} stations/s per worker at ${CAP_RADIUS_M / 1000} km: ${rate1.toFixed(0)} (1 worker), ${(rate2 / 2).toFixed(0)} (each of 2), ${rateInline.toFixed(0)} inline; target >= ${TARGET_RATE}`);
out(`  ${verdict(efficiency >= TARGET_EFFICIENCY)} parallel efficiency at 2 workers: ${(100 * efficiency).toFixed(1)} % by wall time (${(100 * (c1 / c2)).toFixed(1)} % by CPU time per station, ${(c2 / t2).toFixed(2)} of 2 cores ours); target >= ${100 * TARGET_EFFICIENCY} %`);
out(`  ${verdict(STATIONS / c1 >= TARGET_RATE)} (by CPU time, load-independent) stations per CPU-second per worker: ${(STATIONS / c1).toFixed(0)} (1 worker), ${(STATIONS / c2).toFixed(0)} (2 workers), ${(STATIONS / cInline).toFixed(0)} inline; target >= ${TARGET_RATE}`);
out(`  ${verdict(rssPeak <= rssLimit)} peak RSS ${(rssPeak / MB).toFixed(0)} MB; target < 1.5 x DEM bytes + 200 MB = ${(rssLimit / MB).toFixed(0)} MB`);
out(`  ${verdict(worstOverTol <= 1)} zoned within max(0.02 mGal, 0.5 %) of brute force at 10 km on ${picked.length} stations`);
out(`load average at end: ${load()}`);
