/**
 * Reproducing a legacy reduction: recompute the old free-air and complete Bouguer anomalies
 * from the old inputs with the declared old formulas, and flag rows whose printed anomalies
 * (`legacy_fa_mgal`, `legacy_cba_mgal`) are not reproduced.
 *
 * Residual convention: residual = printed - recomputed, mGal.
 */
import { InputError } from '../errors.js';
import { isNormalFormula } from '../reduction/index.js';
import { isBouguerFormula, isFreeAirFormula, reduceWithFormulas, validateFormulaSet } from './formula-set.js';
import type { FormulaSet, ReductionInputs } from './formula-set.js';

/** The formulas a legacy survey declares it was reduced with. */
export type LegacyFormulaSet = FormulaSet;

/** Flag code for a row whose printed legacy anomalies are not reproduced. */
export const LEGACY_MISMATCH_FLAG = 'legacy_mismatch';

/**
 * Default reproduction tolerance, mGal. Printed anomalies rounded to 0.01 mGal carry up to
 * 0.005 mGal of rounding, and old inputs (gravity, TC) were themselves rounded before use;
 * old slab constants (0.04193 vs 2 pi G with G = 6.6743e-11) differ by ~0.01 mGal per 1000 m.
 * 0.05 mGal covers these with margin while a misread digit (>= 0.1 mGal) still fails. Values
 * printed to 0.1 mGal (rounding up to 0.05 mGal) need a tolerance of about 0.1 mGal.
 */
export const LEGACY_MISMATCH_TOLERANCE_MGAL = 0.05;

/** Printed legacy anomalies of one row; NaN = column absent or cell empty. */
export interface PrintedLegacyAnomalies {
  faMgal: number;
  cbaMgal: number;
}

export interface LegacyCheck {
  /** FAA recomputed with the legacy formulas, mGal. */
  recomputedFaMgal: number;
  /** CBA recomputed with the legacy formulas and the legacy TC, mGal (NaN without a TC). */
  recomputedCbaMgal: number;
  /** printed - recomputed FAA, mGal; NaN when nothing was printed or nothing recomputed. */
  faResidualMgal: number;
  /** printed - recomputed CBA, mGal; NaN likewise. */
  cbaResidualMgal: number;
  /**
   * True when a printed value is present and is not reproduced within the tolerance, or
   * cannot be recomputed at all (e.g. a printed CBA with no legacy TC).
   */
  mismatch: boolean;
}

/**
 * Recompute one row's legacy anomalies and compare them with the printed ones.
 * `inputs` are the OLD values: gravity in its old datum (mGal), old height (m), legacy TC (mGal).
 */
export function checkLegacyAnomalies(
  inputs: ReductionInputs,
  set: LegacyFormulaSet,
  printed: PrintedLegacyAnomalies,
  toleranceMgal: number = LEGACY_MISMATCH_TOLERANCE_MGAL,
): LegacyCheck {
  const r = reduceWithFormulas(inputs, set);
  const faResidualMgal = printed.faMgal - r.freeAirAnomalyMgal;
  const cbaResidualMgal = printed.cbaMgal - r.completeBouguerMgal;
  // Written so a NaN residual of a printed value fails the comparison.
  const faBad = !Number.isNaN(printed.faMgal) && !(Math.abs(faResidualMgal) <= toleranceMgal);
  const cbaBad = !Number.isNaN(printed.cbaMgal) && !(Math.abs(cbaResidualMgal) <= toleranceMgal);
  return {
    recomputedFaMgal: r.freeAirAnomalyMgal,
    recomputedCbaMgal: r.completeBouguerMgal,
    faResidualMgal,
    cbaResidualMgal,
    mismatch: faBad || cbaBad,
  };
}

/** Parses the reproduction tolerance, mGal (a positive finite number). */
export function parseLegacyTolerance(text: string, field = '--legacy-tolerance'): number {
  const v = text.trim() === '' ? NaN : Number(text);
  if (!(v > 0 && v < Infinity)) throw new InputError(`tolerance "${text}" is not a positive number of mGal`, { field });
  return v;
}

/**
 * Parses a declared legacy formula set written as comma-separated key=value pairs, e.g.
 * `normal=igf1930,free-air=first-order,bouguer=slab,density=2670,atmospheric=no,g=6.673e-11`.
 * normal, free-air, bouguer and density are required; atmospheric defaults to no; g is optional.
 */
export function parseLegacyFormulaSet(text: string, field = '--legacy-formulas'): LegacyFormulaSet {
  const pairs = new Map<string, string>();
  for (const part of text.split(',')) {
    const eq = part.indexOf('=');
    const key = part.slice(0, eq).trim().toLowerCase();
    const value = part.slice(eq + 1).trim();
    if (eq < 0 || key === '' || value === '')
      throw new InputError(`"${part.trim()}" is not a key=value pair (in "${text}")`, { field });
    if (pairs.has(key)) throw new InputError(`"${key}" is given twice (in "${text}")`, { field });
    pairs.set(key, value);
  }
  const known = ['normal', 'free-air', 'bouguer', 'density', 'atmospheric', 'g'];
  for (const key of pairs.keys()) {
    if (!known.includes(key)) throw new InputError(`unknown key "${key}": expected one of ${known.join(', ')}`, { field });
  }
  const need = (key: string): string => {
    const v = pairs.get(key);
    if (v === undefined) throw new InputError(`"${key}=" is required (in "${text}")`, { field });
    return v;
  };
  const normal = need('normal').toLowerCase();
  const freeAir = need('free-air').toLowerCase();
  const bouguer = need('bouguer').toLowerCase();
  const densityText = need('density');
  const density = Number(densityText);
  if (!isNormalFormula(normal)) throw new InputError(`unknown normal gravity formula "${normal}"`, { field });
  if (!isFreeAirFormula(freeAir))
    throw new InputError(`unknown free-air formula "${freeAir}": expected first-order or second-order`, { field });
  if (!isBouguerFormula(bouguer)) throw new InputError(`unknown Bouguer formula "${bouguer}": expected slab or cap`, { field });
  const atm = (pairs.get('atmospheric') ?? 'no').toLowerCase();
  if (atm !== 'yes' && atm !== 'no') throw new InputError(`atmospheric="${atm}": expected yes or no`, { field });
  const set: LegacyFormulaSet = { normal, freeAir, bouguer, densityKgM3: density, atmospheric: atm === 'yes' };
  const gText = pairs.get('g');
  if (gText !== undefined) set.gravitationalConstant = Number(gText);
  return validateFormulaSet(set, field);
}
