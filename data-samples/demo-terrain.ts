/**
 * Procedural terrain of the invented Skarveld range (the demo survey area), as a pure function
 * of UTM zone 33N easting and northing in metres. One function serves both demo DEMs: the fine
 * DEM samples it every 30 m with all its detail, the far DEM every ~1 km with the detail finer
 * than its cells left out, so the two agree where they overlap.
 *
 * Pieces (heights in metres above the geoid of the invented scenario):
 * - a regional mountain belt striking SW-NE north-west of the survey, a lowland to the south-east;
 * - local ridges (sharp-crested folded ridges striking about N60E);
 * - a valley that meanders west-east through the survey;
 * - a plateau whose edge (an escarpment about 250 m high) crosses the north-east corner;
 * - rough small-scale relief (value noise, wavelengths 90 m to 3 km);
 * - nothing below 20 m above sea level (lowlandFloorM).
 */

/** Centre of the survey area, UTM 33N metres. */
export const SURVEY_CENTRE_E_M = 500000;
export const SURVEY_CENTRE_N_M = 5200000;

/** Integer hash of a lattice point to [0, 1): deterministic, no state (a seeded PRNG per point). */
function latticeValue(ix: number, iy: number, seed: number): number {
  let h = Math.imul(ix, 0x27d4eb2d) ^ Math.imul(iy, 0x165667b1) ^ Math.imul(seed, 0x9e3779b9);
  h = Math.imul(h ^ (h >>> 15), 0x85ebca6b);
  h = Math.imul(h ^ (h >>> 13), 0xc2b2ae35);
  h ^= h >>> 16;
  return (h >>> 0) / 4294967296;
}

/** Smooth value noise in [-1, 1] on a lattice of the given wavelength, m. */
function valueNoise(eM: number, nM: number, wavelengthM: number, seed: number): number {
  const u = eM / wavelengthM;
  const v = nM / wavelengthM;
  const ix = Math.floor(u);
  const iy = Math.floor(v);
  const fu = u - ix;
  const fv = v - iy;
  const su = fu * fu * (3 - 2 * fu);
  const sv = fv * fv * (3 - 2 * fv);
  const a = latticeValue(ix, iy, seed);
  const b = latticeValue(ix + 1, iy, seed);
  const c = latticeValue(ix, iy + 1, seed);
  const d = latticeValue(ix + 1, iy + 1, seed);
  const top = a + (b - a) * su;
  const bottom = c + (d - c) * su;
  return 2 * (top + (bottom - top) * sv) - 1;
}

/**
 * Fractal relief: octaves from maxWavelengthM down to minWavelengthM (halving), amplitude
 * falling as wavelength^0.8 so small-scale roughness stays a few metres.
 */
function fractalRelief(eM: number, nM: number, maxWavelengthM: number, minWavelengthM: number, amplitudeM: number, seed: number): number {
  let sum = 0;
  let k = 0;
  for (let w = maxWavelengthM; w >= minWavelengthM; w /= 2, k++) {
    sum += amplitudeM * Math.pow(w / maxWavelengthM, 0.8) * valueNoise(eM, nM, w, seed + k * 101);
  }
  return sum;
}

/** Smooth step from 0 to 1 across width w around 0. */
function smoothStep(t: number, wM: number): number {
  return 0.5 * (1 + Math.tanh(t / wM));
}

/**
 * Terrain height at a point, m.
 * @param eM UTM 33N easting, m
 * @param nM UTM 33N northing, m
 * @param minWavelengthM finest relief wavelength to include, m (90 for the fine DEM; about
 *   twice the cell size for a coarser grid, so it is not aliased)
 */
export function terrainHeightM(eM: number, nM: number, minWavelengthM: number): number {
  const x = eM - SURVEY_CENTRE_E_M;
  const y = nM - SURVEY_CENTRE_N_M;
  // regional: a mountain belt striking N45E, its axis 45 km north-west of the survey centre
  const across = (x - y) / Math.SQRT2; // distance south-east of the axis through the centre, m
  const belt = 1900 * Math.exp(-(((across + 45000) / 28000) ** 2));
  // lowland to the south-east: the base level falls from 700 m to 150 m
  const base = 150 + 550 * (1 - smoothStep(across - 60000, 25000));
  // broad regional undulation (wavelengths 12-100 km)
  const regional = fractalRelief(eM, nM, 100000, 12000, 220, 11);
  // local ridges striking N60E: |sin| gives sharp crests, spacing 5 km, fading away from the survey
  const along = x * Math.cos(Math.PI / 6) + y * Math.sin(Math.PI / 6);
  const perp = -x * Math.sin(Math.PI / 6) + y * Math.cos(Math.PI / 6);
  const fade = Math.exp(-((x * x + y * y) / (30000 * 30000)));
  const ridges = fade * 260 * (Math.abs(Math.sin((perp + 600 * Math.sin(along / 7000)) * (Math.PI / 5000))) - 0.5);
  // a valley meandering west-east 3 km south of the centre, 250 m deep, about 1.5 km wide
  const valleyAxisY = -3000 + 1200 * Math.sin(x / 4500);
  const valley = -250 * fade * Math.exp(-(((y - valleyAxisY) / 1500) ** 2));
  // plateau edge: 250 m escarpment along a line through (6 km E, 4 km N) striking N30W
  const edge = (x - 6000) * Math.cos(Math.PI / 6) + (y - 4000) * Math.sin(Math.PI / 6);
  const plateau = 250 * smoothStep(edge + 300 * Math.sin(y / 2500), 350);
  // roughness 90 m - 3 km
  const rough = minWavelengthM <= 3000 ? fractalRelief(eM, nM, 3000, Math.max(minWavelengthM, 90), 35, 29) : 0;
  return lowlandFloorM(base + belt + regional + ridges + valley + plateau + rough);
}

/**
 * Keeps the invented lowland above sea level: heights below 100 m are eased smoothly towards
 * 20 m (continuous with a continuous slope at 100 m), so no cell needs a water treatment.
 */
function lowlandFloorM(hM: number): number {
  return hM >= 100 ? hM : 100 - 80 * (1 - Math.exp(-(100 - hM) / 80));
}
