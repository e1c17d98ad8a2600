/**
 * Parasnis [Parasnis1952] and Nettleton [Nettleton1939] recover the density of an invented
 * survey forward-modelled from prism terrain at a known density (test/density/synthetic-survey.ts).
 *
 * Tolerance: +-30 kg/m^3 throughout. With 0.1 mGal reading noise and ~13 mGal of topographic
 * signal per 1000 kg/m^3 the estimates' standard errors are 7-10 kg/m^3, so 30 is about 3
 * sigma; it is also the resolution field practice asks of a reduction density (common practice).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { makeSurvey, terrainStations } from './synthetic-survey.js';
import type { TerrainStations } from './synthetic-survey.js';
import { surveyInput } from './survey-input.js';
import { parasnis } from '../../src/density/parasnis.js';
import { nettleton } from '../../src/density/nettleton.js';
import { compareDensityEstimates } from '../../src/density/compare.js';
import { assertClose } from '../helpers/assert-close.js';

const TRUE_DENSITY = 2670;
const TOL = { abs: 30 };
const RANGE = { from: 1800, to: 3500, step: 10 };
/** Regional field rising to the east-north-east, like the terrain ramp: correlated with topography. */
const TREND = { ax: 0.0008, ay: 0.0003 };

let terrain: TerrainStations;
beforeAll(() => {
  terrain = terrainStations(200, 11);
});

describe('forward model', () => {
  it('terrain corrections of the prism terrain are positive everywhere (hills and valleys both add; [Hammer1939])', () => {
    expect(Math.min(...terrain.tcUnitMgal)).toBeGreaterThan(0);
    // the survey has real relief: heights span ~100-410 m
    expect(Math.max(...terrain.heightM) - Math.min(...terrain.heightM)).toBeGreaterThan(250);
  });
});

describe('clean survey (geology uncorrelated with topography, 0.1 mGal noise)', () => {
  it('Parasnis recovers 2670 kg/m^3 within 30, with a standard error below 30', () => {
    const p = parasnis(surveyInput(makeSurvey(terrain, { densityKgM3: TRUE_DENSITY, noiseMgal: 0.1, seed: 5 })));
    assertClose(p.densityKgM3, TRUE_DENSITY, TOL, 'Parasnis');
    expect(p.stderrKgM3).toBeGreaterThan(0);
    expect(p.stderrKgM3).toBeLessThan(30);
    expect(p.n).toBe(200);
    expect(p.points).toHaveLength(200);
  });

  it('Nettleton recovers 2670 kg/m^3 within 30 against height and against the terrain term, at a zero crossing', () => {
    const input = surveyInput(makeSurvey(terrain, { densityKgM3: TRUE_DENSITY, noiseMgal: 0.1, seed: 5 }));
    for (const against of ['height', 'terrain'] as const) {
      const nt = nettleton(input, { rangeKgM3: RANGE, against });
      assertClose(nt.densityKgM3, TRUE_DENSITY, TOL, `Nettleton against ${against}`);
      expect(nt.zeroCrossing).toBe(true);
      // the interpolated crossing has |corr| near 0: the curve is smooth at a 10 kg/m^3 step
      expect(nt.minAbsCorr).toBeLessThan(1e-3);
      expect(nt.curve).toHaveLength(171);
    }
  });

  it('the two methods agree and the verdict says so', () => {
    const input = surveyInput(makeSurvey(terrain, { densityKgM3: TRUE_DENSITY, noiseMgal: 0.1, seed: 5 }));
    const v = compareDensityEstimates(input, parasnis(input), nettleton(input, { rangeKgM3: RANGE }));
    expect(v.agree).toBe(true);
    expect(v.verdict).toMatch(/agree/);
    expect(v.warnings).toEqual([]);
  });

  it('a different true density (2300) is recovered too: the estimate follows the data, not a default', () => {
    const input = surveyInput(makeSurvey(terrain, { densityKgM3: 2300, noiseMgal: 0.1, seed: 6 }));
    assertClose(parasnis(input).densityKgM3, 2300, TOL, 'Parasnis');
    assertClose(nettleton(input, { rangeKgM3: RANGE }).densityKgM3, 2300, TOL, 'Nettleton');
  });
});

describe('regional trend correlated with topography', () => {
  const survey = (coords: 'xy' | 'lonlat' = 'xy') =>
    surveyInput(makeSurvey(terrain, { densityKgM3: TRUE_DENSITY, noiseMgal: 0.1, seed: 5, trendMgalPerM: TREND }), coords);

  it('biases the plain estimates by more than the tolerance (the known bias, [Nettleton1939] discussion; common practice)', () => {
    const input = survey();
    expect(Math.abs(parasnis(input).densityKgM3 - TRUE_DENSITY)).toBeGreaterThan(30);
    expect(Math.abs(nettleton(input, { rangeKgM3: RANGE }).densityKgM3 - TRUE_DENSITY)).toBeGreaterThan(30);
  });

  it('--trend linear removes the bias from both methods', () => {
    const input = survey();
    const p = parasnis(input, { trend: 'linear' });
    assertClose(p.densityKgM3, TRUE_DENSITY, TOL, 'Parasnis + trend');
    // the fitted plane is the planted one: 0.1 mGal noise over 4 km leaves ~1e-5 mGal/m of scatter; 5e-5 is ~5 sigma
    assertClose(p.trend?.ax ?? NaN, TREND.ax, { abs: 5e-5 }, 'ax');
    assertClose(p.trend?.ay ?? NaN, TREND.ay, { abs: 5e-5 }, 'ay');
    assertClose(nettleton(input, { rangeKgM3: RANGE, trend: 'linear' }).densityKgM3, TRUE_DENSITY, TOL, 'Nettleton + trend');
  });

  it('with lon/lat columns the trend is fitted in local metres and gives the same density', () => {
    const input = survey('lonlat');
    expect(input.coords).toBe('geographic');
    const p = parasnis(input, { trend: 'linear' });
    assertClose(p.densityKgM3, TRUE_DENSITY, TOL, 'Parasnis + trend, lon/lat');
    // local metres from the equirectangular projection: the planted gradient per metre comes back
    // within 2 % (the invented lon/lat used 111195 m per degree, the projection 6371 km: 0.0006 % apart)
    assertClose(p.trend?.ax ?? NaN, TREND.ax, { rel: 0.02 }, 'ax');
  });

  it('the verdict warns about the trend and suggests --trend linear', () => {
    const input = survey();
    const v = compareDensityEstimates(input, parasnis(input), nettleton(input, { rangeKgM3: RANGE }), {
      withTrend: parasnis(input, { trend: 'linear' }),
    });
    expect(v.warnings.join(' ')).toMatch(/--trend linear/);
  });
});

describe('gross errors (5 % of stations off by 10-20 mGal)', () => {
  const survey = () => makeSurvey(terrain, { densityKgM3: TRUE_DENSITY, noiseMgal: 0.1, seed: 5, outlierFraction: 0.05 });

  it('degrade the plain Parasnis estimate beyond the tolerance', () => {
    expect(Math.abs(parasnis(surveyInput(survey())).densityKgM3 - TRUE_DENSITY)).toBeGreaterThan(30);
  });

  for (const robust of ['huber', 'trim'] as const) {
    it(`--robust ${robust} recovers the density and down-weights every planted outlier`, () => {
      const s = survey();
      expect(s.outliers).toHaveLength(10);
      const p = parasnis(surveyInput(s), { robust });
      assertClose(p.densityKgM3, TRUE_DENSITY, TOL, `Parasnis ${robust}`);
      for (const k of s.outliers) expect(p.weights[k]).toBeLessThan(0.5);
      expect(p.downweighted).toBeGreaterThanOrEqual(10);
      // a few clean stations sit on the tails of the geological anomaly: allow up to 10 more
      expect(p.downweighted).toBeLessThanOrEqual(20);
    });
  }
});
