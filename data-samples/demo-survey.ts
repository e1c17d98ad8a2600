/**
 * The invented Skarveld survey: where the stations are, what problems are planted, and the
 * invented geology (a buried dense body and a regional trend) that the observed gravity of
 * make-demo.ts is forward-modelled from. Positions are UTM 33N metres.
 */
import { G } from '../src/constants.js';
import { prismGzFactor } from '../src/kernels/prism.js';
import { toMgal } from '../src/units.js';
import { SURVEY_CENTRE_E_M, SURVEY_CENTRE_N_M } from './demo-terrain.js';
import { mulberry32 } from '../test/helpers/seeded-random.js';

export { mulberry32 };


/** Standard normal deviates from a uniform source (Box-Muller). */
export function gaussian(rand: () => number): () => number {
  return () => {
    const u = 1 - rand(); // (0, 1]: log never sees 0
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rand());
  };
}

export interface PlannedStation {
  id: string;
  eM: number;
  nM: number;
}

/** Stations every spacingM along a polyline of survey-centre-relative vertices (a road). */
function traverse(prefix: string, vertices: [number, number][], spacingM: number): PlannedStation[] {
  const out: PlannedStation[] = [];
  let carry = 0;
  for (let k = 0; k + 1 < vertices.length; k++) {
    const [x0, y0] = vertices[k] as [number, number];
    const [x1, y1] = vertices[k + 1] as [number, number];
    const len = Math.hypot(x1 - x0, y1 - y0);
    for (let s = carry; s < len; s += spacingM) {
      const t = s / len;
      out.push({ id: `${prefix}${String(out.length + 1).padStart(3, '0')}`, eM: SURVEY_CENTRE_E_M + x0 + t * (x1 - x0), nM: SURVEY_CENTRE_N_M + y0 + t * (y1 - y0) });
      carry = s + spacingM - len;
    }
  }
  return out;
}

/**
 * Station plan: a 1.6 km grid (positions jittered by up to +-150 m) and three road traverses
 * (stations every 350 m): road A along the valley, road B from the south-west over the ridges
 * onto the plateau, road C north-south across the valley. All within 10 km of the centre.
 */
export function plannedStations(rand: () => number): PlannedStation[] {
  const grid: PlannedStation[] = [];
  for (let i = 0; i < 12; i++) {
    for (let j = 0; j < 12; j++) {
      grid.push({
        id: `G${String(grid.length + 1).padStart(3, '0')}`,
        eM: SURVEY_CENTRE_E_M - 8800 + 1600 * j + 300 * (rand() - 0.5),
        nM: SURVEY_CENTRE_N_M - 8800 + 1600 * i + 300 * (rand() - 0.5),
      });
    }
  }
  const valleyRoad: [number, number][] = [];
  for (let x = -9500; x <= 9500; x += 1000) valleyRoad.push([x, -3000 + 1200 * Math.sin(x / 4500) + 250]);
  const a = traverse('A', valleyRoad, 350);
  const b = traverse('B', [[-8500, -9000], [-5000, -5200], [-1500, -1000], [2500, 2000], [6000, 5200], [8800, 9000]], 350);
  const c = traverse('C', [[2600, -9500], [3400, -5000], [2200, -1500], [3800, 2500], [3000, 9500]], 350);
  return [...grid, ...a, ...b, ...c];
}

/** Planted problems: ids and what was done to them (README and tests read these). */
export const PLANTED = {
  /** Reported height off by +15 m (a misread antenna height). */
  blunderHigh: { id: 'G050', offsetM: 15 },
  /** Reported height off by -25 m (a keying error). */
  blunderLow: { id: 'A030', offsetM: -25 },
  /** Read on a 60 m mast platform: height and gravity observed 60 m above the ground. */
  tower: { id: 'B020', aboveGroundM: 60 },
  /** Re-occupied under a new id at exactly the same position. */
  duplicate: { of: 'G100', id: 'G100R' },
} as const;

/** Density of the invented terrain, kg/m^3: the value a density estimate should find. */
export const TRUE_DENSITY_KG_M3 = 2550;

/** Buried dense body: a right prism, bounds relative to the survey centre (m), elevations (m). */
export const BODY = {
  westM: -4500,
  eastM: -1500,
  southM: 1000,
  northM: 3500,
  topElevationM: -300,
  bottomElevationM: -2500,
  densityContrastKgM3: 250,
};

/** Gravity of the buried body at a station, mGal (z down, station at its own height). */
export function bodyEffectMgal(eM: number, nM: number, heightM: number): number {
  const x = eM - SURVEY_CENTRE_E_M;
  const y = nM - SURVEY_CENTRE_N_M;
  const f = prismGzFactor(BODY.westM - x, BODY.eastM - x, BODY.southM - y, BODY.northM - y, heightM - BODY.topElevationM, heightM - BODY.bottomElevationM);
  return toMgal(G * BODY.densityContrastKgM3 * f);
}

/** Regional trend: a plane, mGal, with the gradients below (per km east / north of the centre). */
export const TREND = { offsetMgal: -32, eastMgalPerKm: 0.34, northMgalPerKm: -0.04 };

export function trendMgal(eM: number, nM: number): number {
  return TREND.offsetMgal + (TREND.eastMgalPerKm * (eM - SURVEY_CENTRE_E_M)) / 1000 + (TREND.northMgalPerKm * (nM - SURVEY_CENTRE_N_M)) / 1000;
}

/** Standard deviations of the invented measurement errors. */
export const NOISE = { gpsHeightM: 0.1, gravityMgal: 0.02 };
