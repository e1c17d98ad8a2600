/**
 * A declared set of reduction formulas (the ones a legacy survey was reduced with, or the ones
 * talus uses now) and the anomalies of one station under it.
 *
 * Values enter and leave in mGal because legacy anomalies are compared and printed in mGal;
 * the formulas themselves are evaluated in SI by src/reduction and converted once here.
 */
import { G } from '../constants.js';
import { InputError } from '../errors.js';
import {
  atmosphericCorrection,
  bouguerCap,
  bouguerSlab,
  freeAirCorrection,
  isNormalFormula,
  normalGravity,
} from '../reduction/index.js';
import type { NormalFormula } from '../reduction/index.js';
import { toMgal } from '../units.js';

export type FreeAirFormula = 'first-order' | 'second-order';
export type BouguerFormula = 'slab' | 'cap';

export interface FormulaSet {
  /** Normal gravity formula. */
  normal: NormalFormula;
  /** 'first-order' = 0.3086 mGal/m (common practice); 'second-order' = [Hinze2005]. */
  freeAir: FreeAirFormula;
  /** Infinite slab (Bullard A) or spherical cap of 166.735 km (Bullard A+B, [LaFehr1991]). */
  bouguer: BouguerFormula;
  /** Reduction density, kg/m^3 (> 0). */
  densityKgM3: number;
  /** Whether the atmospheric correction was added ([Hinze2005] after [Wenzel1985]). */
  atmospheric: boolean;
  /**
   * Gravitational constant the Bouguer term was computed with, m^3 kg^-1 s^-2. Omit for
   * [CODATA2018]; older tables used 6.67e-11 or 6.673e-11 (the slab constant 0.04193 mGal per m
   * per g/cm^3 corresponds to about 6.673e-11).
   */
  gravitationalConstant?: number;
  /** Radius of the Bouguer spherical cap, m (cap only). Omit for 166.735 km [LaFehr1991]. */
  capRadiusM?: number;
}

/** The terms and anomalies of one station under a formula set, all mGal. */
export interface FormulaReduction {
  normalGravityMgal: number;
  freeAirCorrMgal: number;
  /** 0 when the set has no atmospheric correction. */
  atmosphericCorrMgal: number;
  /** The Bouguer term of the set (slab or cap), subtracted. */
  bouguerMgal: number;
  freeAirAnomalyMgal: number;
  simpleBouguerMgal: number;
  /** NaN when the terrain correction is NaN. */
  completeBouguerMgal: number;
}

/** The station values one reduction needs. */
export interface ReductionInputs {
  /** Geodetic latitude, degrees. */
  latDeg: number;
  /** Station height, m, in the height system the formula set was used with. */
  heightM: number;
  /** Observed gravity, mGal, in the datum the reduction used. */
  gobsMgal: number;
  /** Terrain correction, mGal, at the set's density, added (incl. any inner zones). */
  tcMgal: number;
}

export function isFreeAirFormula(s: string): s is FreeAirFormula {
  return s === 'first-order' || s === 'second-order';
}

export function isBouguerFormula(s: string): s is BouguerFormula {
  return s === 'slab' || s === 'cap';
}

/** Ratio of the set's G to the CODATA value used by src/reduction (1 when not given). */
function gRatio(set: FormulaSet): number {
  return set.gravitationalConstant === undefined ? 1 : set.gravitationalConstant / G;
}

/** Bouguer term, mGal, of the set at `heightM` and `densityKgM3`. */
export function bouguerTermMgal(set: FormulaSet, heightM: number, densityKgM3: number): number {
  const bc =
    set.bouguer === 'slab'
      ? bouguerSlab(heightM, densityKgM3)
      : set.capRadiusM === undefined
        ? bouguerCap(heightM, densityKgM3)
        : bouguerCap(heightM, densityKgM3, set.capRadiusM);
  return toMgal(bc) * gRatio(set);
}

/** Free-air plus (when the set has one) atmospheric correction, mGal. */
export function heightCorrectionsMgal(set: FormulaSet, heightM: number, latDeg: number): {
  freeAirCorrMgal: number;
  atmosphericCorrMgal: number;
} {
  const order = set.freeAir === 'first-order' ? 1 : 2;
  return {
    freeAirCorrMgal: toMgal(freeAirCorrection(heightM, latDeg, order)),
    atmosphericCorrMgal: set.atmospheric ? toMgal(atmosphericCorrection(heightM)) : 0,
  };
}

/**
 * Anomalies of one station under `set`, mGal ([Hinze2005] sign conventions):
 * FAA = gobs - gamma0 + FAC (+ g_atm); SBA = FAA - BC; CBA = SBA + TC. NaN propagates.
 */
export function reduceWithFormulas(inputs: ReductionInputs, set: FormulaSet): FormulaReduction {
  const normalGravityMgal = toMgal(normalGravity(inputs.latDeg, set.normal));
  const { freeAirCorrMgal, atmosphericCorrMgal } = heightCorrectionsMgal(set, inputs.heightM, inputs.latDeg);
  const bouguerMgal = bouguerTermMgal(set, inputs.heightM, set.densityKgM3);
  // Difference of the two large terms first: keeps the anomaly's rounding near 1e-10 mGal.
  const freeAirAnomalyMgal = inputs.gobsMgal - normalGravityMgal + freeAirCorrMgal + atmosphericCorrMgal;
  const simpleBouguerMgal = freeAirAnomalyMgal - bouguerMgal;
  return {
    normalGravityMgal,
    freeAirCorrMgal,
    atmosphericCorrMgal,
    bouguerMgal,
    freeAirAnomalyMgal,
    simpleBouguerMgal,
    completeBouguerMgal: simpleBouguerMgal + inputs.tcMgal,
  };
}

/** Checks a formula set at the boundary; `field` names the option it came from. */
export function validateFormulaSet(set: FormulaSet, field = '--legacy-formulas'): FormulaSet {
  if (!isNormalFormula(set.normal)) throw new InputError(`unknown normal gravity formula "${set.normal}"`, { field });
  if (!isFreeAirFormula(set.freeAir))
    throw new InputError(`unknown free-air formula "${set.freeAir}": expected first-order or second-order`, { field });
  if (!isBouguerFormula(set.bouguer))
    throw new InputError(`unknown Bouguer formula "${set.bouguer}": expected slab or cap`, { field });
  if (!(set.densityKgM3 > 0 && set.densityKgM3 < 30000))
    throw new InputError(`density ${set.densityKgM3} kg/m^3 is not a positive density`, { field });
  const gc = set.gravitationalConstant;
  if (gc !== undefined && !(gc > 6.6e-11 && gc < 6.7e-11))
    throw new InputError(`gravitational constant ${gc} is outside 6.6e-11..6.7e-11 m^3 kg^-1 s^-2`, { field });
  return set;
}
