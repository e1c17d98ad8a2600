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
import { makeTerrainContext, TR } from '../terrain/station-terrain.js';
import { meridianRadiusM, primeVerticalRadiusM } from '../terrain/geodesy.js';
import type { DemGrid } from '../dem/grid.js';
import { NORMAL_FORMULAS } from '../reduction/normal-gravity.js';
import { writeFileAtomic } from '../io/atomic-file.js';
import { resultsCsv, type OutputColumn } from '../io/results-csv.js';
import { sha256File, type DemProvenance, type Provenance } from '../io/provenance.js';
import { loadDem, type LoadedDem } from './load-dems.js';
import { farWeights } from './far-mask.js';
import { RESULT_WIDTH, sharedFloat64, type StationArrays } from './batch.js';
import { runTerrain } from './pool.js';
import { makeProgress } from './progress.js';
import { reduceStation, type ReductionSettings } from './reduction-terms.js';
import { stationFlags } from './station-flags.js';
import type { ReduceOptions, ReduceSummary } from './run-options.js';
import { suspectHeightTypeMismatch } from '../legacy/height-type.js';
import { findLegacyColumn, readLegacyColumn } from './legacy-columns.js';
import { runGravity } from './legacy-gravity.js';
import { OUTSIDE_GEOID_FLAG, stationHeights } from './legacy-heights.js';
import { checkRangeWithinRadius, rangeTerrain, type RangeTerrain } from './legacy-tc-pass.js';
import { legacyOutputs } from './legacy-outputs.js';

/** The provenance record of a run: the common fields plus the gravity conversions, heights and legacy comparison. */
interface RunProvenance extends Provenance {
  conversions: { gravity: unknown[] };
  heights: Record<string, unknown>;
  legacy: Record<string, unknown>;
}

/** Largest cell side of a grid in metres near latitude latDeg. */
function cellSizeM(g: DemGrid, latDeg: number): number {
  if (g.crs.kind === 'projected') return Math.max(g.cellSizeX, g.cellSizeY) * g.crs.linearUnitM;
  const deg = Math.PI / 180;
  return Math.max(g.cellSizeX * deg * primeVerticalRadiusM(latDeg) * Math.cos(latDeg * deg), g.cellSizeY * deg * meridianRadiusM(latDeg));
}

function meanOf(a: Float64Array, active: Uint8Array): number {
  let s = 0;
  let n = 0;
  for (let i = 0; i < a.length; i++) if (active[i] === 1 && Number.isFinite(a[i] as number)) { s += a[i] as number; n++; }
  return n > 0 ? s / n : 0;
}

async function demProvenance(role: 'fine' | 'far', d: LoadedDem, latDeg: number): Promise<DemProvenance[]> {
  const out: DemProvenance[] = [];
  for (const s of d.sources) {
    out.push({
      role,
      path: s.path,
      sha256: await sha256File(s.path),
      fileSizeBytes: s.fileSizeBytes,
      width: s.width,
      height: s.height,
      crs: s.crs.label,
      cellSizeX: s.cellSizeX,
      cellSizeY: s.cellSizeY,
      cellSizeM: cellSizeM(d.grid, latDeg),
      windowRead: { width: d.grid.width, height: d.grid.height, originX: d.grid.originX, originY: d.grid.originY },
    });
  }
  return out;
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
  const fine = await loadDem(o.demPaths, table, active, o.radiusM, { ...(o.demCrs ? { demCrs: o.demCrs } : {}), demUnits: o.demUnits }, 'DEM');
  warnings.push(...fine.gaps.map((g) => `DEM mosaic gap: ${g}`));
  const far = o.farDemPath
    ? await loadDem([o.farDemPath], table, active, o.radiusM, { ...(o.farDemCrs ? { demCrs: o.farDemCrs } : {}), demUnits: o.farDemUnits }, 'far-zone DEM')
    : null;
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
  stations.active.set(active);
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
  const col = (name: string, decimals: number): OutputColumn => ({ name, decimals, values: new Float64Array(n).fill(NaN) });
  const c = {
    demH: col('dem_height_m', 3),
    misfit: col('height_misfit_m', 3),
    normal: col('normal_gravity_mgal', 4),
    atm: col('atmospheric_corr_mgal', 4),
    fac: col('free_air_corr_mgal', 4),
    slab: col('bouguer_slab_mgal', 4),
    cap: col('bouguer_cap_mgal', 4),
    bUnit: col('bouguer_unit_mgal', 4),
    tc: col('terrain_corr_mgal', 4),
    tcUnit: col('terrain_corr_unit_mgal', 4),
    topo: col('topo_effect_mgal', 4),
    faa: col('free_air_anomaly_mgal', 4),
    sba: col('simple_bouguer_mgal', 4),
    cba: col('complete_bouguer_mgal', 4),
  };
  const extra = o.densitiesKgM3.map((d) => col(`complete_bouguer_mgal_d${d}`, 4));
  const zones = { inner: col('tc_inner_mgal', 4), middle: col('tc_middle_mgal', 4), outer: col('tc_outer_mgal', 4) };
  const coverage = col('dem_coverage', 5);
  let kernelEvals = 0;
  let computed = 0;
  const scale = o.densityKgM3 / UNIT_DENSITY_KG_M3;
  const v = (oc: OutputColumn): Float64Array => oc.values as Float64Array;
  for (let i = 0; i < n; i++) {
    if (active[i] !== 1) continue;
    const base = i * RESULT_WIDTH;
    const tcUnit = results[base + TR.tcUnitMgal] as number;
    const r = reduceStation(settings, table.latDeg[i] as number, heights.reductionM[i] as number, gravity.igsn71Mgal[i] as number, tcUnit, table.innerTcMgal[i] as number);
    v(c.demH)[i] = results[base + TR.demHeightM] as number;
    v(c.misfit)[i] = results[base + TR.misfitM] as number;
    v(c.normal)[i] = r.normalMgal;
    v(c.atm)[i] = r.atmMgal;
    v(c.fac)[i] = r.freeAirCorrMgal;
    v(c.slab)[i] = r.slabMgal;
    v(c.cap)[i] = r.capMgal;
    v(c.bUnit)[i] = r.bouguerUnitMgal;
    v(c.tc)[i] = r.tcMgal;
    v(c.tcUnit)[i] = tcUnit;
    v(c.topo)[i] = r.topoEffectMgal;
    v(c.faa)[i] = r.faaMgal;
    v(c.sba)[i] = r.sbaMgal;
    v(c.cba)[i] = r.cbaMgal;
    extra.forEach((e, k) => (v(e)[i] = r.cbaAtMgal[k] as number));
    v(zones.inner)[i] = (results[base + TR.tcInnerUnitMgal] as number) * scale;
    v(zones.middle)[i] = (results[base + TR.tcMiddleUnitMgal] as number) * scale;
    v(zones.outer)[i] = (results[base + TR.tcOuterUnitMgal] as number) * scale;
    v(coverage)[i] = results[base + TR.coverage] as number;
    if (Number.isFinite(tcUnit)) {
      computed++;
      kernelEvals += (results[base + TR.prisms] as number) + (results[base + TR.columns] as number) + (results[base + TR.geocentric] as number) + (results[base + TR.nearPoints] as number);
    }
  }
  const flags = stationFlags(table, results, v(c.tc), v(c.misfit), o);
  const heightWarning = suspectHeightTypeMismatch(v(c.misfit));
  if (heightWarning) warnings.push(heightWarning);
  const tcAdded = new Float64Array(n);
  for (let i = 0; i < n; i++) tcAdded[i] = (v(c.tc)[i] as number) + (settings.useInnerTc ? (table.innerTcMgal[i] as number) : 0);
  const rangeTcMgal = range ? range.tcUnitMgal.map((t) => t * scale) : null;
  const printed = (key: 'legacy_fa_mgal' | 'legacy_cba_mgal'): Float64Array =>
    readLegacyColumn(table, findLegacyColumn(table, key, o.legacyColumns), 'a legacy anomaly');
  const legacy = legacyOutputs(
    o,
    {
      latDeg: table.latDeg,
      oldGobsMgal: gravity.storedDatumMgal,
      oldHeightM: table.heightM,
      legacyTcMgal: table.legacyTcMgal,
      printedFaMgal: printed('legacy_fa_mgal'),
      printedCbaMgal: printed('legacy_cba_mgal'),
      newGobsMgal: gravity.igsn71Mgal,
      newHeightM: heights.reductionM,
      newTcMgal: tcAdded,
      rangeTcMgal,
      active,
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
  const qcText = [flags.summaryText, ...legacy.summaryLines].join('\n');
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
  const csv = resultsCsv(table.header, table.rows, columns, flags.perStation);
  const provenancePath = `${o.outPath}.provenance.json`;
  const runTimeS = (performance.now() - t0) / 1000;
  const provenance: RunProvenance = {
    talusVersion: talusVersion(),
    commandLine: o.commandLine,
    createdUtc: new Date().toISOString(),
    parameters: { ...o, commandLine: undefined, columns: o.columns ?? null },
    constants: { G, G_units: 'm^3 kg^-1 s^-2 (CODATA 2018)', earthRadiusM: 6371000, unitDensityKgM3: UNIT_DENSITY_KG_M3 },
    formulas: {
      normalGravity: NORMAL_FORMULAS.find((f) => f.name === o.normalFormula)?.description ?? o.normalFormula,
      atmospheric: 'Hinze et al. 2005 (after Wenzel 1985): 0.874 - 9.9e-5 h + 3.56e-9 h^2 mGal',
      freeAir: o.freeAirOrder === 2 ? 'second order, Hinze et al. 2005' : 'first order, 0.3086 mGal/m',
      bouguer: o.bouguer === 'cap' ? `spherical cap to ${o.capRadiusM} m, LaFehr 1991` : 'infinite slab 2 pi G rho h',
      terrain: 'Bullard C relative to the spherical cap at station height, Earth curvature included, to --radius',
      ...(o.legacyTcRange ? { terrainRange: 'a second terrain pass over --legacy-tc-range (inside R1 skipped, ends at R2)' } : {}),
    },
    conversions: { gravity: gravity.conversions },
    heights: heights.record,
    legacy: legacy.record,
    stations: { file: o.stationsPath, sha256: await sha256File(o.stationsPath), rows: n },
    dems: [...(await demProvenance('fine', fine, meanLat)), ...(far ? await demProvenance('far', far, meanLat) : [])],
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
  };
}
