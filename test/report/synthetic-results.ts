/**
 * An invented survey for the report tests: stations on a jittered grid over the synthetic DEM of
 * test/fixtures/dem (UTM 33N, x 400000–401920 m, y 5098560–5100000 m), with results columns that
 * follow the relations of docs/results-columns.md, the free-air anomaly built with 2400 kg/m^3 (a
 * regional field that correlates with the hill pulls the estimates somewhat below that). Nothing
 * here is real survey data.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';

/** Every chart the full synthetic results must produce (data-chart ids). */
export const EXPECTED_CHARTS: readonly string[] = ['map-cba', 'map-tc', 'tc-height', 'misfit-hist', 'misfit-map', 'nettleton', 'parasnis', 'cba-densities', 'legacy-tc', 'legacy-change'];

/** 2πG·1000 kg/m^3 in mGal per metre (the Bouguer slab for unit density). */
const SLAB_UNIT_MGAL_PER_M = 0.041928;
/** The density the invented gravity field is built with, kg/m^3. */
export const TRUE_DENSITY_KG_M3 = 2400;

export interface SyntheticOptions {
  /** Number of stations (default 140). */
  n?: number;
  /** 'xy' (projected) or 'lonlat' positions. */
  coords?: 'xy' | 'lonlat';
  /** Include legacy_tc_mgal and delta_*_mgal columns (default true). */
  legacy?: boolean;
  /** Number of stations flagged height_misfit (default 40, more than the id cap). */
  misfitFlags?: number;
}

/** Deterministic pseudo-random numbers in [0, 1) (a 32-bit LCG). */
function lcg(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
}

/** The terrain of the DEM fixtures' generator, metres (x, y metres from the SW corner). */
function terrainM(x: number, y: number): number {
  const hill = 650 * Math.exp(-((x - 600) ** 2 + (y - 900) ** 2) / (2 * 330 ** 2));
  const d = (x - 200 - (y - 100)) / Math.SQRT2;
  const ridge = 180 * Math.exp(-(d ** 2) / (2 * 120 ** 2));
  return 420 + hill + ridge + 7.25 * Math.sin(x / 97) * Math.cos(y / 131);
}

export function syntheticResultsCsv(opts: SyntheticOptions = {}): string {
  const n = opts.n ?? 140;
  const legacy = opts.legacy ?? true;
  const misfitFlags = opts.misfitFlags ?? 40;
  const rnd = lcg(20240607);
  const header = [
    'id',
    ...(opts.coords === 'lonlat' ? ['lon', 'lat'] : ['x', 'y']),
    'height_m',
    'gobs_mgal',
    ...(legacy ? ['legacy_tc_mgal'] : []),
    'dem_height_m',
    'height_misfit_m',
    'free_air_anomaly_mgal',
    'bouguer_unit_mgal',
    'terrain_corr_mgal',
    'terrain_corr_unit_mgal',
    'simple_bouguer_mgal',
    'complete_bouguer_mgal',
    'complete_bouguer_mgal_d2200',
    'complete_bouguer_mgal_d2400',
    'dem_coverage',
    ...(legacy ? ['delta_dem_mgal', 'delta_curvature_mgal', 'delta_far_zone_mgal'] : []),
    'flags',
  ];
  const lines = [header.join(',')];
  const cols = Math.ceil(Math.sqrt(n * 1.33));
  for (let i = 0; i < n; i++) {
    const gx = ((i % cols) + 0.5 + (rnd() - 0.5) * 0.6) / cols;
    const gy = (Math.floor(i / cols) + 0.5 + (rnd() - 0.5) * 0.6) / Math.ceil(n / cols);
    const xr = 60 + gx * 1800;
    const yr = 60 + gy * 1320;
    const dem = terrainM(xr, yr);
    const misfit = i < misfitFlags ? 6 + rnd() * 4 : (rnd() - 0.5) * 3;
    const h = dem + misfit;
    const tcUnit = 0.05 + 0.9 * Math.exp(-((xr - 600) ** 2 + (yr - 900) ** 2) / (2 * 450 ** 2)) + rnd() * 0.1;
    const bu = SLAB_UNIT_MGAL_PER_M * h;
    const regional = -12 + 0.0015 * xr - 0.001 * yr;
    const cbaTrue = regional + (rnd() - 0.5) * 0.6;
    const faa = cbaTrue + (TRUE_DENSITY_KG_M3 / 1000) * (bu - tcUnit);
    const rho = 2.67;
    const tc = rho * tcUnit;
    const sba = faa - rho * bu;
    const cba = sba + tc;
    const flags = [...(i < misfitFlags ? ['height_misfit'] : []), ...(i % 37 === 5 ? ['tc_outlier'] : []), ...(i === 7 ? ['dem_partial'] : [])];
    const pos = opts.coords === 'lonlat' ? [13.5 + xr / 76500, 46.0 + yr / 111200] : [400000 + xr, 5098560 + yr];
    const row = [
      `S${String(i + 1).padStart(3, '0')}`,
      ...pos.map((v) => v.toFixed(opts.coords === 'lonlat' ? 6 : 1)),
      h.toFixed(2),
      (980600 + faa - 0.3086 * h).toFixed(3),
      ...(legacy ? [(tc * 0.92 - 0.05 + (rnd() - 0.5) * 0.2).toFixed(3)] : []),
      dem.toFixed(2),
      misfit.toFixed(2),
      faa.toFixed(3),
      bu.toFixed(4),
      tc.toFixed(4),
      tcUnit.toFixed(4),
      sba.toFixed(3),
      // a station outside the DEM has no CBA (empty = not available)
      i === n - 1 ? '' : cba.toFixed(3),
      ...[2.2, 2.4].map((r) => (i === n - 1 ? '' : (faa - r * bu + r * tcUnit).toFixed(3))),
      (i === 7 ? 0.93 : 1).toFixed(3),
      ...(legacy ? [((rnd() - 0.4) * 0.3).toFixed(3), (0.02 + rnd() * 0.03).toFixed(3), (tc * 0.08 + (rnd() - 0.5) * 0.05).toFixed(3)] : []),
      flags.join(';'),
    ];
    lines.push(row.join(','));
  }
  return lines.join('\n') + '\n';
}

/** A provenance object shaped like docs/results-columns.md (values invented). */
export function syntheticProvenance(): Record<string, unknown> {
  return {
    talusVersion: '0.1.0',
    commandLine: ['talus', 'reduce', '--stations', 'invented.csv', '--dem', 'plain-f32.tif', '--out', 'results.csv'],
    parameters: { densityKgM3: 2670, densitiesKgM3: [2670], radiusM: 166735, normalFormula: 'GRS80', freeAir: 'second-order', bouguer: 'cap', heightMisfitM: 5 },
    constants: { G: 6.6743e-11 },
    dems: [{ path: 'plain-f32.tif', sha256: '0'.repeat(64), width: 64, height: 48, crs: 'EPSG:32633', cellSize: 30 }],
    runTimeS: 1.25,
    stationCounts: { total: 140, flagged: { height_misfit: 40, tc_outlier: 4, dem_partial: 1 } },
  };
}

/** Writes results.csv (and its provenance unless told not to) into `dir`; returns the CSV path. */
export function writeSyntheticResults(dir: string, opts: SyntheticOptions & { provenance?: boolean; name?: string } = {}): string {
  const path = join(dir, opts.name ?? 'results.csv');
  writeFileSync(path, syntheticResultsCsv(opts));
  if (opts.provenance ?? true) writeFileSync(`${path.replace(/\.csv$/, '')}.provenance.json`, JSON.stringify(syntheticProvenance(), null, 2));
  return path;
}
