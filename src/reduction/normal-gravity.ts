/**
 * Normal gravity on the reference ellipsoid: the theoretical gravity of a level ellipsoid at
 * geodetic latitude, subtracted from observed gravity in every anomaly.
 *
 * Each formula is given with the constants of its own defining document; legacy data must be
 * reduced with the formula it was published with (the 1967 series and short form differ by
 * 0.085 mGal at 45 deg).
 */
import { DEG, MGAL } from '../units.js';

export type NormalFormula = 'grs80' | 'wgs84' | 'wgs84-1987' | 'igf1967' | 'igf1967-short' | 'igf1930';

export interface NormalFormulaInfo {
  readonly name: NormalFormula;
  /** One-line description for help text and provenance. */
  readonly description: string;
  /** Defining source, with a key from docs/references.md. */
  readonly source: string;
}

/** Every supported formula, in the order help text lists them. */
export const NORMAL_FORMULAS: readonly NormalFormulaInfo[] = [
  {
    name: 'grs80',
    description: 'GRS80, closed-form Somigliana formula (default)',
    source: '[Moritz1980]; closed form as printed in [Hinze2005]',
  },
  {
    name: 'wgs84',
    description: 'WGS84, 2000 edition constants, closed-form Somigliana formula',
    source: '[TR8350] (NIMA TR8350.2, 3rd ed., 2000), chapter 4',
  },
  {
    name: 'wgs84-1987',
    description: 'WGS84, 1987 DMA edition constants, closed-form Somigliana formula',
    source: '[TR8350] (DMA TR8350.2, 1987 edition)',
  },
  {
    name: 'igf1967',
    description: 'International Gravity Formula 1967 (GRS67), series form',
    source: '[GRS67] series form',
  },
  {
    name: 'igf1967-short',
    description: 'International Gravity Formula 1967, short form used by legacy databases',
    source: '[GRS67] rounded to the 1930 layout; common practice in legacy databases',
  },
  {
    name: 'igf1930',
    description: 'International Gravity Formula 1930 (Potsdam era)',
    source: '[HeiskanenMoritz1967] (International Gravity Formula 1930)',
  },
];

export function isNormalFormula(s: string): s is NormalFormula {
  return NORMAL_FORMULAS.some((f) => f.name === s);
}

/** Closed-form Somigliana constants: gamma = gammaE (1 + k s) / sqrt(1 - e2 s), s = sin^2 phi. */
interface SomiglianaConstants {
  /** Normal gravity at the equator, m/s^2. */
  readonly gammaEquatorMs2: number;
  /** Somigliana constant k = (b gammaP) / (a gammaE) - 1, dimensionless. */
  readonly k: number;
  /** First eccentricity squared, dimensionless. */
  readonly e2: number;
}

/** [Moritz1980]; [Hinze2005]: 978032.67715 mGal, k = 0.001931851353, e^2 = 0.0066943800229. */
const GRS80: SomiglianaConstants = { gammaEquatorMs2: 9.7803267715, k: 0.001931851353, e2: 0.0066943800229 };
/** [TR8350] 2000 edition, chapter 4: 9.7803253359 m/s^2, k = 0.00193185265241, e^2 = 0.00669437999013. */
const WGS84_2000: SomiglianaConstants = {
  gammaEquatorMs2: 9.7803253359,
  k: 0.00193185265241,
  e2: 0.00669437999013,
};
/**
 * [TR8350] 1987 edition: 9.7803267714 m/s^2, k = 0.00193185138639. The eccentricity is the
 * WGS84 e^2 = 0.00669437999013, unchanged between the editions (value from memory).
 */
const WGS84_1987: SomiglianaConstants = {
  gammaEquatorMs2: 9.7803267714,
  k: 0.00193185138639,
  e2: 0.00669437999013,
};

function somigliana(sin2: number, c: SomiglianaConstants): number {
  return (c.gammaEquatorMs2 * (1 + c.k * sin2)) / Math.sqrt(1 - c.e2 * sin2);
}

/**
 * Normal gravity on the ellipsoid, m/s^2, at geodetic latitude `latDeg` (degrees).
 * NaN latitude gives NaN.
 */
export function normalGravity(latDeg: number, formula: NormalFormula): number {
  const phi = latDeg * DEG;
  const sinPhi = Math.sin(phi);
  const s = sinPhi * sinPhi;
  // sin^2(2 phi) = 4 s (1 - s): exact identity, avoids a second sine.
  const sin2TwoPhi = 4 * s * (1 - s);
  switch (formula) {
    case 'grs80':
      return somigliana(s, GRS80);
    case 'wgs84':
      return somigliana(s, WGS84_2000);
    case 'wgs84-1987':
      return somigliana(s, WGS84_1987);
    case 'igf1967':
      // [GRS67] series: 978031.846 (1 + 0.005278895 s + 0.000023462 s^2) mGal
      return 978031.846 * MGAL * (1 + 0.005278895 * s + 0.000023462 * s * s);
    case 'igf1967-short':
      // [GRS67] short form (common practice): 978031.846 (1 + 0.0053024 s - 0.0000058 sin^2 2phi) mGal
      return 978031.846 * MGAL * (1 + 0.0053024 * s - 0.0000058 * sin2TwoPhi);
    case 'igf1930':
      // [HeiskanenMoritz1967] International formula 1930: 978049 (1 + 0.0052884 s - 0.0000059 sin^2 2phi) mGal
      return 978049 * MGAL * (1 + 0.0052884 * s - 0.0000059 * sin2TwoPhi);
  }
}
