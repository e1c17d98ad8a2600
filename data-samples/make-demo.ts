/**
 * Makes the bundled demo survey of the invented Skarveld range (data-samples/demo/):
 *
 *   node --import tsx data-samples/make-demo.ts
 *
 * fine-dem.tif (30 m, UTM 33N), far-dem.tif (0.01 deg, WGS 84), their gdalinfo -json
 * descriptions, and stations.csv (lon/lat WGS 84 and x/y UTM 33N) with synthetic observed gravity. Deterministic (seeded);
 * needs GDAL's gdal_translate and gdalinfo. See data-samples/README.md.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import proj4 from 'proj4';
import { resolveCrs } from '../src/stations/crs-registry.js';
import { gridFromFunction } from '../src/dem/grid.js';
import { openDem } from '../src/dem/geotiff-open.js';
import { readDemWindow } from '../src/dem/read-window.js';
import { runReduce } from '../src/engine/run-reduce.js';
import { memoryIo } from '../src/cli/io.js';
import { parseReduceArgs } from '../src/cli/commands/demo.js';
import { readCsvTable } from '../src/io/read-results.js';
import { normalGravity } from '../src/reduction/normal-gravity.js';
import { freeAirCorrection } from '../src/reduction/free-air.js';
import { atmosphericCorrection } from '../src/reduction/atmosphere.js';
import { bouguerCap } from '../src/reduction/bouguer-cap.js';
import { toMgal } from '../src/units.js';
import { terrainHeightM, SURVEY_CENTRE_E_M, SURVEY_CENTRE_N_M } from './demo-terrain.js';
import { bodyEffectMgal, gaussian, mulberry32, NOISE, PLANTED, plannedStations, trendMgal, TRUE_DENSITY_KG_M3 } from './demo-survey.js';
import { writeCompressedGeoTiff } from './demo-geotiff.js';
import { FAR_DEM, FINE_DEM } from './demo-grids.js';
import { bilinearHeightAt } from '../src/terrain/grid-frame.js';

const OUT = 'data-samples/demo';
const utm = resolveCrs('EPSG:32633');
const wgs = resolveCrs('EPSG:4326');
const toLonLat = proj4(utm.proj4, wgs.proj4);

/** Heights stored to 0.1 m: they compress far better and are still finer than the relief. */
const round1 = (h: number): number => Math.round(h * 10) / 10;

// ---- DEMs
const fine = gridFromFunction({ ...FINE_DEM, crs: utm, source: 'Skarveld fine DEM' }, (x, y) => round1(terrainHeightM(x, y, 90)));
const far = gridFromFunction({ ...FAR_DEM, crs: wgs, source: 'Skarveld far DEM' }, (lon, lat) => {
  const [e, n] = toLonLat.inverse([lon, lat]) as [number, number];
  return round1(terrainHeightM(e, n, 2500));
});
const fineInfo = writeCompressedGeoTiff(`${OUT}/fine-dem.tif`, fine, 32633);
writeFileSync(`${OUT}/fine-dem.gdalinfo.json`, fineInfo);
const farInfo = writeCompressedGeoTiff(`${OUT}/far-dem.tif`, far, 4326);
writeFileSync(`${OUT}/far-dem.gdalinfo.json`, farInfo);

// the file must give back exactly the grid it was made from (DEFLATE is lossless)
const back = await readDemWindow(await openDem(`${OUT}/fine-dem.tif`));
for (let i = 0; i < fine.data.length; i++) if (back.data[i] !== fine.data[i]) throw new Error(`fine-dem.tif cell ${i} reads back ${back.data[i]}, wrote ${fine.data[i]}`);


// ---- stations
const rand = mulberry32(20240917);
const normal = gaussian(rand);
interface Station {
  id: string;
  lonText: string;
  latText: string;
  eM: number;
  nM: number;
  trueHeightM: number;
  reportedHeightM: number;
}
const planned = plannedStations(rand);
const dupOf = planned.find((p) => p.id === PLANTED.duplicate.of);
if (!dupOf) throw new Error(`no station ${PLANTED.duplicate.of} to duplicate`);
planned.push({ ...dupOf, id: PLANTED.duplicate.id });
const stations: Station[] = planned.map((p) => {
  const [lon, lat] = toLonLat.forward([p.eM, p.nM]) as [number, number];
  const lonText = lon.toFixed(7);
  const latText = lat.toFixed(7);
  // the position as printed (1e-7 deg ~ 1 cm) is the position
  const [eM, nM] = toLonLat.inverse([Number(lonText), Number(latText)]) as [number, number];
  const ground = bilinearHeightAt(fine, eM, nM);
  const trueHeightM = ground + (p.id === PLANTED.tower.id ? PLANTED.tower.aboveGroundM : 0);
  let reportedHeightM = trueHeightM + NOISE.gpsHeightM * normal();
  if (p.id === PLANTED.blunderHigh.id) reportedHeightM += PLANTED.blunderHigh.offsetM;
  if (p.id === PLANTED.blunderLow.id) reportedHeightM += PLANTED.blunderLow.offsetM;
  return { id: p.id, lonText, latText, eM, nM, trueHeightM, reportedHeightM };
});

// ---- forward model: talus's own terrain engine at the true heights, tight error budget
const tmp = mkdtempSync(join(tmpdir(), 'talus-demo-fm-'));
try {
  const fmStations = join(tmp, 'true-stations.csv');
  writeFileSync(fmStations, ['id,lon,lat,height_m', ...stations.map((s) => `${s.id},${s.lonText},${s.latText},${s.trueHeightM.toFixed(4)}`)].join('\n') + '\n');
  const fmOut = join(tmp, 'true-results.csv');
  const io = memoryIo();
  const argv = ['reduce', '--stations', fmStations, '--dem', `${OUT}/fine-dem.tif`, '--far-dem', `${OUT}/far-dem.tif`, '--out', fmOut];
  argv.push('--density', String(TRUE_DENSITY_KG_M3), '--accuracy', '0.002', '--workers', '2', '--no-progress');
  await runReduce(await parseReduceArgs(argv, io), io);
  const t = readCsvTable(fmOut);
  const col = (name: string): number => {
    const k = t.header.indexOf(name);
    if (k < 0) throw new Error(`forward-model results lack ${name}`);
    return k;
  };
  const [iTc, iCov, iB, iNormal] = [col('terrain_corr_unit_mgal'), col('dem_coverage'), col('bouguer_unit_mgal'), col('normal_gravity_mgal')];
  const rho = TRUE_DENSITY_KG_M3 / 1000;
  // x, y: the same positions in UTM 33N (m), so maps can be drawn over the projected fine DEM
  const lines = ['id,lon,lat,x,y,height_m,gobs_mgal'];
  let minTc = Infinity;
  let maxTc = -Infinity;
  stations.forEach((s, i) => {
    const row = t.rows[i] as string[];
    if (row[0] !== s.id) throw new Error(`forward-model row ${i} is ${row[0]}, expected ${s.id}`);
    if (Number(row[iCov]) !== 1) throw new Error(`station ${s.id}: dem_coverage ${row[iCov]}, expected 1`);
    const lat = Number(s.latText);
    const h = s.trueHeightM;
    const gammaMgal = toMgal(normalGravity(lat, 'grs80'));
    const capUnitMgal = toMgal(bouguerCap(h, 1000));
    // the engine and the reduction functions must agree (to the 4 decimals the CSV carries)
    if (Math.abs(capUnitMgal - Number(row[iB])) > 1e-4 || Math.abs(gammaMgal - Number(row[iNormal])) > 1e-4) throw new Error(`station ${s.id}: engine and reduction functions disagree`);
    const tcUnit = Number(row[iTc]);
    minTc = Math.min(minTc, tcUnit * rho);
    maxTc = Math.max(maxTc, tcUnit * rho);
    const gobs =
      gammaMgal - toMgal(freeAirCorrection(h, lat, 2)) - toMgal(atmosphericCorrection(h)) + rho * capUnitMgal - rho * tcUnit +
      bodyEffectMgal(s.eM, s.nM, h) + trendMgal(s.eM, s.nM) + NOISE.gravityMgal * normal();
    lines.push(`${s.id},${s.lonText},${s.latText},${s.eM.toFixed(2)},${s.nM.toFixed(2)},${s.reportedHeightM.toFixed(3)},${gobs.toFixed(3)}`);
  });
  writeFileSync(`${OUT}/stations.csv`, lines.join('\n') + '\n');
  const heights = stations.map((s) => s.trueHeightM);
  process.stdout.write(
    `wrote ${OUT}: fine DEM ${fine.width} x ${fine.height}, far DEM ${far.width} x ${far.height}, ${stations.length} stations, ` +
      `heights ${Math.min(...heights).toFixed(0)}-${Math.max(...heights).toFixed(0)} m, TC at ${TRUE_DENSITY_KG_M3} kg/m^3 ${minTc.toFixed(2)}-${maxTc.toFixed(2)} mGal\n`,
  );
  const xs = stations.map((s) => s.eM - SURVEY_CENTRE_E_M);
  const ys = stations.map((s) => s.nM - SURVEY_CENTRE_N_M);
  process.stdout.write(`station offsets from the centre: east ${Math.min(...xs).toFixed(0)}..${Math.max(...xs).toFixed(0)} m, north ${Math.min(...ys).toFixed(0)}..${Math.max(...ys).toFixed(0)} m\n`);
} finally {
  rmSync(tmp, { recursive: true, force: true });
}
