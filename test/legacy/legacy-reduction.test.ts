import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import { reduceWithFormulas } from '../../src/legacy/formula-set.js';
import type { FormulaSet } from '../../src/legacy/formula-set.js';
import {
  LEGACY_MISMATCH_TOLERANCE_MGAL,
  checkLegacyAnomalies,
  parseLegacyFormulaSet,
  parseLegacyTolerance,
} from '../../src/legacy/legacy-reduction.js';
import { assertClose } from '../helpers/assert-close.js';

/** A Potsdam-era reduction: 1930 formula, 0.3086 mGal/m, slab at 2.67 g/cm^3, no atmosphere. */
const OLD_SET: FormulaSet = {
  normal: 'igf1930',
  freeAir: 'first-order',
  bouguer: 'slab',
  densityKgM3: 2670,
  atmospheric: false,
  gravitationalConstant: 6.673e-11,
};

describe('worked legacy example, recomputed by hand', () => {
  // Invented station: latitude 47.25 deg, elevation 2345.6 ft, Potsdam gravity 980620.00 mGal,
  // hand-chart terrain correction 1.3 mGal.
  const latDeg = 47.25;
  const heightFt = 2345.6;
  const gobsPotsdamMgal = 980620.0;
  const chartTcMgal = 1.3;

  // Height: international foot, 0.3048 m exactly (physics.md §6):
  //   2345.6 ft x 0.3048 = 714.93888 m
  const heightM = 2345.6 * 0.3048;
  // 1930 International formula (physics.md §1, [HeiskanenMoritz1967]):
  //   gamma = 978049 (1 + 0.0052884 sin^2 phi - 0.0000059 sin^2 2phi)
  //   sin^2(47.25 deg) = 0.53922955, sin^2(94.5 deg) = 0.99384417
  //   gamma = 978049 (1 + 0.0028516422 - 0.0000058637) = 980832.32975 mGal
  const sin2 = Math.sin((47.25 * Math.PI) / 180) ** 2;
  const sin2TwoPhi = Math.sin((94.5 * Math.PI) / 180) ** 2;
  const gammaMgal = 978049 * (1 + 0.0052884 * sin2 - 0.0000059 * sin2TwoPhi);
  // First-order free-air (common practice): 0.3086 x 714.93888 = 220.63014 mGal
  const facMgal = 0.3086 * 714.93888;
  // Slab, textbook constant 0.04193 mGal per m per g/cm^3 (common practice; G ~ 6.673e-11):
  //   0.04193 x 2.67 x 714.93888 = 80.03962 mGal
  const slabMgal = 0.04193 * 2.67 * 714.93888;
  // FAA = 980620.00 - 980832.32975 + 220.63014 = 8.30039 mGal
  const faaMgal = 980620.0 - gammaMgal + facMgal;
  // CBA = 8.30039 - 80.03962 + 1.3 = -70.43923 mGal
  const cbaMgal = faaMgal - slabMgal + 1.3;

  it('the hand arithmetic gives the printed intermediate values', () => {
    // Tolerance: the comments above print 5 decimals.
    assertClose(heightM, 714.93888, { abs: 1e-9 });
    assertClose(gammaMgal, 980832.32975, { abs: 1e-5 });
    assertClose(faaMgal, 8.30039, { abs: 1e-5 });
    assertClose(cbaMgal, -70.43923, { abs: 1e-5 });
  });

  it('reduceWithFormulas reproduces the hand FAA and CBA', () => {
    const r = reduceWithFormulas({ latDeg, heightM: heightFt * 0.3048, gobsMgal: gobsPotsdamMgal, tcMgal: chartTcMgal }, OLD_SET);
    // FAA has no G: only float rounding near 1e6 mGal.
    assertClose(r.freeAirAnomalyMgal, faaMgal, { abs: 1e-8 });
    // Tolerance: the rounded constant 0.04193 differs from 2 pi (6.673e-11) 1e8 = 0.0419277 by
    // 2.3e-6 mGal per m per g/cm^3, i.e. 2.3e-6 x 2.67 x 714.9 = 0.0045 mGal on the slab.
    assertClose(r.completeBouguerMgal, cbaMgal, { abs: 0.005 });
    assertClose(r.bouguerMgal, slabMgal, { abs: 0.005 });
  });

  it('values printed to 0.01 mGal reproduce within the default tolerance; a misread digit does not', () => {
    const printedFa = Math.round(faaMgal * 100) / 100;
    const printedCba = Math.round(cbaMgal * 100) / 100;
    const inputs = { latDeg, heightM, gobsMgal: gobsPotsdamMgal, tcMgal: chartTcMgal };
    const ok = checkLegacyAnomalies(inputs, OLD_SET, { faMgal: printedFa, cbaMgal: printedCba });
    expect(ok.mismatch).toBe(false);
    expect(Math.abs(ok.cbaResidualMgal)).toBeLessThanOrEqual(LEGACY_MISMATCH_TOLERANCE_MGAL);
    // A misread first decimal (0.3 mGal) is flagged, with residual = printed - recomputed.
    const bad = checkLegacyAnomalies(inputs, OLD_SET, { faMgal: printedFa, cbaMgal: printedCba + 0.3 });
    expect(bad.mismatch).toBe(true);
    // Tolerance: the printed CBA's own rounding (0.005) plus the slab constant (0.0045).
    assertClose(bad.cbaResidualMgal, 0.3, { abs: 0.01 });
  });
});

describe('legacy mismatch flag', () => {
  const inputs = { latDeg: 35, heightM: 1200, gobsMgal: 979800, tcMgal: 2.4 };
  const exact = reduceWithFormulas(inputs, OLD_SET);

  it('is raised by an FAA off by more than the tolerance, with the signed residual', () => {
    const c = checkLegacyAnomalies(inputs, OLD_SET, { faMgal: exact.freeAirAnomalyMgal - 0.2, cbaMgal: NaN });
    expect(c.mismatch).toBe(true);
    // Float rounding of values near 1e6 mGal.
    assertClose(c.faResidualMgal, -0.2, { abs: 1e-8 });
  });

  it('honours a looser tolerance for values printed to 0.1 mGal', () => {
    const printed = { faMgal: exact.freeAirAnomalyMgal + 0.07, cbaMgal: exact.completeBouguerMgal - 0.07 };
    expect(checkLegacyAnomalies(inputs, OLD_SET, printed).mismatch).toBe(true);
    expect(checkLegacyAnomalies(inputs, OLD_SET, printed, 0.1).mismatch).toBe(false);
  });

  it('is not raised when nothing is printed, and is raised for a printed CBA without a legacy TC', () => {
    expect(checkLegacyAnomalies(inputs, OLD_SET, { faMgal: NaN, cbaMgal: NaN }).mismatch).toBe(false);
    const noTc = checkLegacyAnomalies({ ...inputs, tcMgal: NaN }, OLD_SET, {
      faMgal: exact.freeAirAnomalyMgal,
      cbaMgal: exact.completeBouguerMgal,
    });
    expect(noTc.mismatch).toBe(true);
    expect(noTc.cbaResidualMgal).toBeNaN();
  });

  it('catches a wrong declared formula: the 1967 short form instead of 1930', () => {
    const printed = { faMgal: exact.freeAirAnomalyMgal, cbaMgal: exact.completeBouguerMgal };
    const c = checkLegacyAnomalies(inputs, { ...OLD_SET, normal: 'igf1967-short' }, printed);
    expect(c.mismatch).toBe(true);
  });
});

describe('parsing the declared legacy formulas and tolerance', () => {
  it('reads key=value pairs', () => {
    expect(parseLegacyFormulaSet('normal=igf1930,free-air=first-order,bouguer=slab,density=2670,g=6.673e-11')).toEqual(OLD_SET);
    expect(parseLegacyFormulaSet('normal=grs80, free-air=second-order, bouguer=cap, density=2670, atmospheric=yes')).toEqual({
      normal: 'grs80',
      freeAir: 'second-order',
      bouguer: 'cap',
      densityKgM3: 2670,
      atmospheric: true,
    });
  });

  it('rejects missing, unknown and bad entries with the value named', () => {
    const base = 'normal=igf1930,free-air=first-order,bouguer=slab';
    expect(() => parseLegacyFormulaSet(base)).toThrow(/"density=" is required/);
    expect(() => parseLegacyFormulaSet(`${base},density=2.67x`)).toThrow(InputError);
    expect(() => parseLegacyFormulaSet(`${base},density=0`)).toThrow(/density 0/);
    expect(() => parseLegacyFormulaSet(`${base},density=2670,colour=red`)).toThrow(/unknown key "colour"/);
    expect(() => parseLegacyFormulaSet('normal=igf1940,free-air=first-order,bouguer=slab,density=2670')).toThrow(/"igf1940"/);
    expect(() => parseLegacyFormulaSet(`${base},density=2670,g=6.67`)).toThrow(/gravitational constant 6.67/);
    expect(() => parseLegacyFormulaSet(`${base},density`)).toThrow(/not a key=value pair/);
    expect(() => parseLegacyTolerance('-0.1')).toThrow(/--legacy-tolerance/);
    expect(() => parseLegacyTolerance('nan')).toThrow(InputError);
    expect(parseLegacyTolerance('0.1')).toBe(0.1);
  });
});
