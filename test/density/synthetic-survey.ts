/**
 * An invented gravity survey whose true reduction density is known, made by a forward model
 * independent of the density code: terrain built from vertical prisms (closed form of
 * [Nagy2000] via src/kernels/prism.ts), stations on the prism tops, observed gravity =
 * normal gravity - free-air gradient effect + topography at the true density + a geological
 * anomaly + an optional regional trend + noise (+ optional gross errors). The results
 * columns (FAA, bouguer_unit, terrain_corr_unit) are then computed the way the results CSV
 * defines them (docs/results-columns.md).
 */
import { prismGzFactor } from '../../src/kernels/prism.js';
import { bouguerSlab } from '../../src/reduction/bouguer-slab.js';
import { normalGravity } from '../../src/reduction/normal-gravity.js';
import { freeAirCorrection } from '../../src/reduction/free-air.js';
import { G } from '../../src/constants.js';
import { MGAL } from '../../src/units.js';
import { mulberry32 } from '../helpers/seeded-random.js';

/** Seeded uniform generator. */
export const rng = mulberry32;

/** Terrain model: CELLS x CELLS prisms of CELL_M metres, heights above a flat datum at 0 m. */
const CELLS = 48;
const CELL_M = 125;
/** False easting/northing so that the fits see realistic projected coordinates. */
export const EAST0_M = 500_000;
export const NORTH0_M = 4_100_000;

/** Standard normal deviate by Box-Muller. */
export function gauss(u: () => number): number {
  return Math.sqrt(-2 * Math.log(1 - u())) * Math.cos(2 * Math.PI * u());
}

/** Invented landscape: a ramp rising east, two hills and some rolling ground, m. */
export function terrainHeightM(x: number, y: number): number {
  const hill = (cx: number, cy: number, s: number, a: number): number => a * Math.exp(-((x - cx) ** 2 + (y - cy) ** 2) / (2 * s * s));
  return 40 + 0.04 * x + hill(2500, 3500, 700, 220) + hill(4200, 1800, 500, 150) + 40 * (1 + Math.sin(x / 900) * Math.cos(y / 700));
}

export interface TerrainStations {
  /** Local coordinates in the model, m (0..6000). */
  xLocalM: Float64Array;
  yLocalM: Float64Array;
  heightM: Float64Array;
  /** Attraction of the prism topography for 1000 kg/m^3 at each station, mGal. */
  topoUnitMgal: Float64Array;
  bouguerUnitMgal: Float64Array;
  tcUnitMgal: Float64Array;
}

/** Stations at random points of the central 4 km, each on the flat top of its own prism. */
export function terrainStations(n: number, seed: number): TerrainStations {
  const u = rng(seed);
  const cellH = new Float64Array(CELLS * CELLS);
  for (let j = 0; j < CELLS; j++) for (let i = 0; i < CELLS; i++) cellH[j * CELLS + i] = terrainHeightM((i + 0.5) * CELL_M, (j + 0.5) * CELL_M);
  const out: TerrainStations = {
    xLocalM: new Float64Array(n),
    yLocalM: new Float64Array(n),
    heightM: new Float64Array(n),
    topoUnitMgal: new Float64Array(n),
    bouguerUnitMgal: new Float64Array(n),
    tcUnitMgal: new Float64Array(n),
  };
  for (let s = 0; s < n; s++) {
    const xs = 1000 + 4000 * u();
    const ys = 1000 + 4000 * u();
    const hs = cellH[Math.floor(ys / CELL_M) * CELLS + Math.floor(xs / CELL_M)] as number;
    let f = 0;
    for (let j = 0; j < CELLS; j++) {
      for (let i = 0; i < CELLS; i++) {
        const hc = cellH[j * CELLS + i] as number;
        // z down from the station: prism top at hs - hc, base (datum) at hs
        f += prismGzFactor(i * CELL_M - xs, (i + 1) * CELL_M - xs, j * CELL_M - ys, (j + 1) * CELL_M - ys, hs - hc, hs);
      }
    }
    out.xLocalM[s] = xs;
    out.yLocalM[s] = ys;
    out.heightM[s] = hs;
    out.topoUnitMgal[s] = (G * 1000 * f) / MGAL;
    out.bouguerUnitMgal[s] = bouguerSlab(hs, 1000) / MGAL;
    // topo_effect = BC - TC (docs/physics.md §5), so TC = BC - topo_effect
    out.tcUnitMgal[s] = (out.bouguerUnitMgal[s] as number) - (out.topoUnitMgal[s] as number);
  }
  return out;
}

/** Residual of v after projection onto span(basis) by modified Gram-Schmidt (makes v uncorrelated with each basis vector). */
export function orthogonalise(v: Float64Array, basis: Float64Array[]): Float64Array {
  const q: Float64Array[] = [];
  for (const b of basis) {
    const w = Float64Array.from(b);
    for (const e of q) {
      const d = w.reduce((s, wi, i) => s + wi * (e[i] as number), 0);
      for (let i = 0; i < w.length; i++) w[i] = (w[i] as number) - d * (e[i] as number);
    }
    const norm = Math.sqrt(w.reduce((s, wi) => s + wi * wi, 0));
    q.push(w.map((wi) => wi / norm));
  }
  const r = Float64Array.from(v);
  for (const e of q) {
    const d = r.reduce((s, ri, i) => s + ri * (e[i] as number), 0);
    for (let i = 0; i < r.length; i++) r[i] = (r[i] as number) - d * (e[i] as number);
  }
  return r;
}

export interface SurveyOptions {
  densityKgM3: number;
  /** Regional trend, mGal per metre east and north (0 by default). */
  trendMgalPerM?: { ax: number; ay: number };
  /** Gaussian reading noise, mGal (1 sigma). */
  noiseMgal: number;
  /** Fraction of stations given a gross error of 10..20 mGal. */
  outlierFraction?: number;
  seed: number;
}

export interface SyntheticSurvey {
  ids: string[];
  eastM: Float64Array;
  northM: Float64Array;
  lonDeg: Float64Array;
  latDeg: Float64Array;
  heightM: Float64Array;
  faaMgal: Float64Array;
  bouguerUnitMgal: Float64Array;
  tcUnitMgal: Float64Array;
  outliers: number[];
}

/**
 * Gravity over the stations. The geological anomaly (a dense body and a basin) is made
 * exactly uncorrelated in-sample with 1, X, Y, height and the topographic attraction: the
 * methods assume an anomaly uncorrelated with topography, and this leaves noise, trend and
 * gross errors as the only things that can move an estimate.
 */
export function makeSurvey(t: TerrainStations, o: SurveyOptions): SyntheticSurvey {
  const n = t.heightM.length;
  const u = rng(o.seed);
  const latDeg = Float64Array.from(t.yLocalM, (y) => 45 + y / 111_195);
  const lonDeg = Float64Array.from(t.xLocalM, (x, i) => 7 + x / (111_195 * Math.cos(((latDeg[i] as number) * Math.PI) / 180)));
  const body = (x: number, y: number, cx: number, cy: number, s: number, a: number): number =>
    a * Math.exp(-((x - cx) ** 2 + (y - cy) ** 2) / (2 * s * s));
  const geo0 = Float64Array.from(t.xLocalM, (x, i) => {
    const y = t.yLocalM[i] as number;
    return body(x, y, 3800, 3900, 1200, 2) + body(x, y, 1700, 1500, 1500, -1.5);
  });
  const geology = orthogonalise(geo0, [new Float64Array(n).fill(1), t.xLocalM, t.yLocalM, t.heightM, t.topoUnitMgal]);
  const ax = o.trendMgalPerM?.ax ?? 0;
  const ay = o.trendMgalPerM?.ay ?? 0;
  const outliers: number[] = [];
  const nOut = Math.round((o.outlierFraction ?? 0) * n);
  let meanX = 0;
  for (const v of t.topoUnitMgal) meanX += v / n;
  while (outliers.length < nOut) {
    const k = Math.floor(u() * n);
    if (!outliers.includes(k)) outliers.push(k);
  }
  const faa = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const h = t.heightM[i] as number;
    const lat = latDeg[i] as number;
    const gammaMgal = normalGravity(lat, 'grs80') / MGAL;
    const facMgal = freeAirCorrection(h, lat, 1) / MGAL;
    let signal = ((o.densityKgM3 / 1000) * (t.topoUnitMgal[i] as number)) + (geology[i] as number) + ax * (t.xLocalM[i] as number) + ay * (t.yLocalM[i] as number) + o.noiseMgal * gauss(u);
    if (outliers.includes(i)) signal += Math.sign((t.topoUnitMgal[i] as number) - meanX) * (10 + 10 * u());
    const gobs = gammaMgal - facMgal + signal;
    faa[i] = gobs - gammaMgal + facMgal; // FAA = g_obs - gamma0 + FAC (docs/physics.md §5; no atmospheric term here)
  }
  return {
    ids: Array.from({ length: n }, (_, i) => `S${String(i + 1).padStart(4, '0')}`),
    eastM: Float64Array.from(t.xLocalM, (x) => x + EAST0_M),
    northM: Float64Array.from(t.yLocalM, (y) => y + NORTH0_M),
    lonDeg,
    latDeg,
    heightM: t.heightM,
    faaMgal: faa,
    bouguerUnitMgal: t.bouguerUnitMgal,
    tcUnitMgal: t.tcUnitMgal,
    outliers,
  };
}

/** The survey as a results CSV (a subset of the documented columns, plus a geology column). */
export function surveyCsv(s: SyntheticSurvey, coords: 'xy' | 'lonlat' = 'xy'): string {
  const head = ['id', ...(coords === 'xy' ? ['x', 'y'] : ['lon', 'lat']), 'height_m', 'free_air_anomaly_mgal', 'bouguer_unit_mgal', 'terrain_corr_unit_mgal', 'unit', 'flags'];
  const rows = s.ids.map((id, i) => {
    const c = coords === 'xy' ? [s.eastM[i], s.northM[i]] : [s.lonDeg[i], s.latDeg[i]];
    const unit = (s.eastM[i] as number) - EAST0_M < 3000 ? 'west' : 'east';
    return [id, ...c.map((v) => (v as number).toFixed(coords === 'xy' ? 3 : 9)), (s.heightM[i] as number).toFixed(3), ...[s.faaMgal[i], s.bouguerUnitMgal[i], s.tcUnitMgal[i]].map((v) => (v as number).toFixed(6)), unit, ''].join(',');
  });
  return [head.join(','), ...rows].join('\n') + '\n';
}
