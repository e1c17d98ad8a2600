/**
 * One `talus reduce` run: stations → DEMs → pyramids → terrain (pool) → reduction → QC →
 * results CSV and provenance JSON (both written atomically).
 */
import { performance } from 'node:perf_hooks';
import type { CliIo } from '../cli/io.js';
import { talusVersion } from '../cli/version.js';
import { G, UNIT_DENSITY_KG_M3 } from '../constants.js';
import { InputError } from '../errors.js';
import { readStations } from '../stations/read-csv.js';
import { makeTransform } from '../stations/transform.js';
import { buildPyramid } from '../terrain/pyramid.js';
import { planZones } from '../terrain/zone-plan.js';
import { makeTerrainContext } from '../terrain/station-terrain.js';
import { writeFileAtomic } from '../io/atomic-file.js';
import { resultsCsv, type OutputColumn } from '../io/results-csv.js';
import { sha256File, type Provenance } from '../io/provenance.js';
import { loadRunDems, readWindows, shareOf } from './shard-run.js';
import { shardCsv } from './shard-csv.js';
import { farWeights } from './far-mask.js';
import { RESULT_WIDTH, sharedFloat64, type StationArrays } from './batch.js';
import { runTerrain } from './pool.js';
import { makeProgress, makeStageNotes } from './progress.js';
import type { ReductionSettings } from './reduction-terms.js';
import { stationFlags } from './station-flags.js';
import type { ReduceOptions, ReduceSummary } from './run-options.js';
import { suspectHeightTypeMismatch } from '../legacy/height-type.js';
import { findLegacyColumn, legacyHeightsM, readLegacyColumn } from './legacy-columns.js';
import { runGravity } from './legacy-gravity.js';
import { OUTSIDE_GEOID_FLAG, stationHeights } from './legacy-heights.js';
import { checkRangeWithinRadius, rangeTerrain, type RangeTerrain } from './legacy-tc-pass.js';
import { legacyOutputs } from './legacy-outputs.js';
import { reductionColumns } from './reduction-columns.js';
import { cellSizeM, demProvenance, meanOf, runFormulas } from './run-provenance.js';

/** The provenance record of a run: the common fields plus the gravity conversions, heights and legacy comparison. */
interface RunProvenance extends Provenance {
  conversions: { gravity: unknown[] };
  heights: Record<string, unknown>;
  legacy: Record<string, unknown>;
}

export async function runReduce(o: ReduceOptions, io: CliIo, signal?: AbortSignal): Promise<ReduceSummary> {
  const t0 = performance.now();
  const warnings: string[] = [];
  const table = await readStations(o.stationsPath, {
    ...(o.columns ? { columns: o.columns } : {}),
    ...(o.stationCrs ? { stationCrs: o.stationCrs } : {}),
    heightUnits: o.heightUnits,
    keepGoing: o.keepGoing,
  });
  if (table.warnings) warnings.push(...table.warnings);
  const n = table.ids.length;
  if (o.fieldInnerRadiusM > 0 && !table.header.some((h) => h.toLowerCase() === (o.columns?.inner_tc_mgal ?? 'inner_tc_mgal').toLowerCase())) {
    throw new InputError(
      `--field-inner-radius ${o.fieldInnerRadiusM} needs the field inner-zone terrain corrections in column ${o.columns?.inner_tc_mgal ?? 'inner_tc_mgal'}; columns found: ${table.header.join(', ')}`,
      { file: table.source },
    );
  }
  if (o.legacyTcRange) checkRangeWithinRadius(o.legacyTcRange, o.radiusM);
  const active = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    const ok = Number.isFinite(table.lonDeg[i] as number) && Number.isFinite(table.latDeg[i] as number) && Number.isFinite(table.heightM[i] as number);
    active[i] = ok ? 1 : 0;
  }
  const offsetCol = findLegacyColumn(table, 'datum_offset_mgal', o.legacyColumns);
  const gravity = runGravity(
    table.gobsMgal,
    o.gravity,
    offsetCol >= 0 ? readLegacyColumn(table, offsetCol, 'datum offset') : null,
    table.header[offsetCol],
  );
  const heights = await stationHeights(
    { stationHeightType: o.stationHeightType, demHeightType: o.demHeightType, keepGoing: o.keepGoing, ...(o.geoidPath ? { geoidPath: o.geoidPath } : {}) },
    table,
    active,
  );
  for (const i of heights.outsideGeoid) active[i] = 0;
  // a share (--shard K/N) computes the terrain of its stations only; everything else stays global
  const { share, computeActive } = shareOf(o, table, active);
  const stage = makeStageNotes(io, o.progress);
  stage(`reading ${o.demPaths.length > 1 ? `${o.demPaths.length} DEM tiles` : 'the DEM'}${o.farDemPath ? ' and the far-zone DEM' : ''}`);
  const { fine, far } = await loadRunDems(o, table, active, share);
  stage('building the resolution pyramids');
  warnings.push(...fine.gaps.map((g) => `DEM mosaic gap: ${g}`));
  const meanLat = meanOf(table.latDeg, active);
  const plan = planZones({
    radiusM: o.radiusM,
    accuracyMgal: (o.accuracyMgal * UNIT_DENSITY_KG_M3) / o.densityKgM3,
    fieldInnerRadiusM: o.fieldInnerRadiusM,
    fineCellM: cellSizeM(fine.grid, meanLat),
    aboveTerrainM: o.aboveTerrainM,
    belowTerrainM: o.belowTerrainM,
  });
  const finePyramid = buildPyramid(fine.grid);
  let farSource = null;
  if (far) {
    const toFine = far.grid.crs.proj4 === fine.grid.crs.proj4 ? (x: number, y: number): [number, number] => [x, y] : makeTransform(far.grid.crs, fine.grid.crs);
    const weights = farWeights(far.grid, fine.grid, toFine);
    farSource = { grid: far.grid, pyramid: buildPyramid(far.grid, weights) };
  }
  const ctx = makeTerrainContext({ grid: fine.grid, pyramid: finePyramid }, farSource, plan);
  stage('');

  const stations: StationArrays = {
    count: n,
    fineX: sharedFloat64(n),
    fineY: sharedFloat64(n),
    farX: sharedFloat64(n),
    farY: sharedFloat64(n),
    latDeg: sharedFloat64(n),
    heightM: sharedFloat64(n),
    active: new Uint8Array(new SharedArrayBuffer(n)),
  };
  stations.fineX.set(fine.x);
  stations.fineY.set(fine.y);
  if (far) {
    stations.farX.set(far.x);
    stations.farY.set(far.y);
  }
  stations.latDeg.set(table.latDeg);
  stations.heightM.set(heights.terrainM);
  stations.active.set(computeActive);
  const results = sharedFloat64(n * RESULT_WIDTH);
  const tTerrain = performance.now();
  const progress = makeProgress(io, n, 'terrain', o.progress);
  await runTerrain(ctx, stations, results, {
    workers: o.workers,
    batchSize: o.batchSize,
    onProgress: (d) => progress.update(d),
    ...(signal ? { signal } : {}),
  });
  progress.finish();
  let range: RangeTerrain | null = null;
  if (o.legacyTcRange) {
    const rangeProgress = makeProgress(io, n, 'legacy TC range', o.progress);
    range = await rangeTerrain(ctx.fine, ctx.far, plan, o.legacyTcRange, stations, {
      workers: o.workers,
      batchSize: o.batchSize,
      onProgress: (d) => rangeProgress.update(d),
      ...(signal ? { signal } : {}),
    });
    rangeProgress.finish();
  }
  const terrainTimeS = (performance.now() - tTerrain) / 1000;

  // reduction
  const settings: ReductionSettings = {
    densityKgM3: o.densityKgM3,
    densitiesKgM3: o.densitiesKgM3,
    normalFormula: o.normalFormula,
    freeAirOrder: o.freeAirOrder,
    bouguer: o.bouguer,
    capRadiusM: o.capRadiusM,
    useInnerTc: o.fieldInnerRadiusM > 0,
  };
  const rc = reductionColumns(settings, table, heights.reductionM, gravity.igsn71Mgal, results, computeActive);
  const { c, extra, zones, coverage, computed, kernelEvals } = rc;
  const scale = o.densityKgM3 / UNIT_DENSITY_KG_M3;
  const v = (oc: OutputColumn): Float64Array => oc.values as Float64Array;
  const flags = stationFlags(table, results, v(c.tc), v(c.misfit), o);
  const heightWarning = suspectHeightTypeMismatch(v(c.misfit));
  if (heightWarning) warnings.push(heightWarning);
  const tcAdded = new Float64Array(n);
  for (let i = 0; i < n; i++) tcAdded[i] = (v(c.tc)[i] as number) + (settings.useInnerTc ? (table.innerTcMgal[i] as number) : 0);
  const rangeTcMgal = range ? range.tcUnitMgal.map((t) => t * scale) : null;
  const printed = (key: 'legacy_fa_mgal' | 'legacy_cba_mgal'): Float64Array =>
    readLegacyColumn(table, findLegacyColumn(table, key, o.legacyColumns), 'a legacy anomaly in mGal');
  const legacy = legacyOutputs(
    o,
    {
      latDeg: table.latDeg,
      oldGobsMgal: gravity.storedDatumMgal,
      oldHeightM: legacyHeightsM(table, findLegacyColumn(table, 'legacy_height_m', o.legacyColumns), o.heightUnits),
      legacyTcMgal: table.legacyTcMgal,
      printedFaMgal: printed('legacy_fa_mgal'),
      printedCbaMgal: printed('legacy_cba_mgal'),
      newGobsMgal: gravity.igsn71Mgal,
      newHeightM: heights.reductionM,
      newTcMgal: tcAdded,
      rangeTcMgal,
      active: computeActive,
    },
    v(c.cba),
    range ? range.plan : null,
  );
  for (const i of heights.outsideGeoid) (flags.perStation[i] as string[]).push(OUTSIDE_GEOID_FLAG);
  legacy.flags.forEach((codes, i) => (flags.perStation[i] as string[]).push(...codes));
  for (const code of [OUTSIDE_GEOID_FLAG, ...new Set(legacy.flags.flat())]) {
    const count = flags.perStation.filter((f) => f.includes(code)).length;
    if (count > 0) flags.counts[code] = count;
  }
  if (heights.outsideGeoid.length > 0)
    legacy.summaryLines.unshift(`${OUTSIDE_GEOID_FLAG}: ${heights.outsideGeoid.length} stations not covered by the geoid grid (not computed)`);
  const columns: OutputColumn[] = [
    ...gravity.columns,
    ...heights.columns,
    ...Object.values(c),
    ...extra,
    zones.inner,
    zones.middle,
    zones.outer,
    coverage,
    ...legacy.columns,
  ];
  const sharded = share ? shardCsv(share, { table, columns, flags: flags.perStation, tcOutlierSlot: flags.tcOutlierSlot, tcMgal: v(c.tc), misfitM: v(c.misfit) }) : null;
  const csv = sharded ? sharded.csv : resultsCsv(table.header, table.rows, columns, flags.perStation);
  const qcText = sharded
    ? `shard ${o.shard?.k}/${o.shard?.n}: ${sharded.stations} stations; tc_outlier and the QC summary come from talus merge`
    : [flags.summaryText, ...legacy.summaryLines].join('\n');
  const provenancePath = `${o.outPath}.provenance.json`;
  const runTimeS = (performance.now() - t0) / 1000;
  const provenance: RunProvenance = {
    talusVersion: talusVersion(),
    commandLine: o.commandLine,
    createdUtc: new Date().toISOString(),
    parameters: { ...o, commandLine: undefined, columns: o.columns ?? null },
    constants: { G, G_units: 'm^3 kg^-1 s^-2 (CODATA 2018)', earthRadiusM: 6371000, unitDensityKgM3: UNIT_DENSITY_KG_M3 },
    formulas: runFormulas(o),
    conversions: { gravity: gravity.conversions },
    heights: heights.record,
    legacy: legacy.record,
    stations: { file: o.stationsPath, sha256: await sha256File(o.stationsPath), rows: n },
    ...(sharded && o.shard ? { shard: { k: o.shard.k, n: o.shard.n, stations: sharded.stations } } : {}),
    dems: [...readWindows(await demProvenance('fine', fine, meanLat), fine), ...(far ? readWindows(await demProvenance('far', far, meanLat), far) : [])],
    zonePlan: { ...plan },
    runTimeS,
    stationCounts: { total: n, computed, flagged: flags.counts },
    performance: { terrainTimeS, stationsPerS: computed / Math.max(terrainTimeS, 1e-9), kernelEvaluationsPerStation: computed > 0 ? kernelEvals / computed : 0, workers: o.workers },
    warnings,
  };
  await writeFileAtomic(o.outPath, csv);
  await writeFileAtomic(provenancePath, JSON.stringify(provenance, null, 2) + '\n');
  return {
    stations: n,
    computed,
    flagged: flags.counts,
    runTimeS: (performance.now() - t0) / 1000,
    terrainTimeS,
    stationsPerS: computed / Math.max(terrainTimeS, 1e-9),
    kernelEvaluationsPerStation: computed > 0 ? kernelEvals / computed : 0,
    outputCsv: o.outPath,
    provenanceJson: provenancePath,
    qcText,
    warnings,
    ...(sharded && o.shard ? { shard: { k: o.shard.k, n: o.shard.n, stations: sharded.stations } } : {}),
  };
}
