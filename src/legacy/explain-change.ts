/**
 * Why a station's complete Bouguer anomaly changed between a legacy reduction and the current
 * one: the difference split into named parts by sequential substitution.
 *
 * Method: start from the legacy state (every ingredient old) and switch one ingredient at a
 * time to its new value, in this fixed order:
 *   1 datum      observed gravity: old value in its old datum -> new value (IGSN71)
 *   2 normal     normal gravity formula
 *   3 free-air   free-air formula and atmospheric correction (on/off)
 *   4 bouguer    Bouguer formula (slab -> cap, i.e. Bullard B) and gravitational constant
 *   5 terrain    terrain correction per unit density (new DEM and method vs legacy TC)
 *   6 density    reduction density (scales both the Bouguer term and the TC)
 *   7 height     station height (old height, e.g. feet on an old vertical datum converted to
 *                metres, -> new height, e.g. orthometric from GNSS and a geoid model)
 * Each part = CBA after switching that ingredient - CBA before it, so the parts telescope to
 * CBA(new) - CBA(legacy) exactly (to float rounding, ~1e-12 mGal). The attribution depends on
 * the order: the interaction of two changes (e.g. new height under the new density) is
 * credited to whichever comes later. A final part, `legacyResidual`, is the recomputed legacy
 * CBA minus the printed one (what the declared old formulas do not reproduce; the negative of
 * the residual in legacy-reduction.ts), so that the total is the new CBA minus the PRINTED
 * legacy CBA when one is given.
 *
 * Latitude is the same for both reductions; a change of position is not separated.
 */
import { bouguerTermMgal, heightCorrectionsMgal } from './formula-set.js';
import type { FormulaSet } from './formula-set.js';
import { normalGravity } from '../reduction/index.js';
import { toMgal } from '../units.js';

/** One reduction's ingredients: its formulas and its station values. */
export interface ReductionState extends FormulaSet {
  /** Observed gravity in this reduction's datum, mGal. */
  gobsMgal: number;
  /** Station height used by this reduction, m. */
  heightM: number;
  /** Terrain correction at this reduction's density, mGal, added (incl. inner zones). */
  tcMgal: number;
}

/** Output column names, in order. */
export const CHANGE_COLUMNS = [
  'delta_datum_mgal',
  'delta_normal_mgal',
  'delta_free_air_mgal',
  'delta_bouguer_mgal',
  'delta_terrain_mgal',
  'delta_density_mgal',
  'delta_height_mgal',
  'delta_legacy_residual_mgal',
  'delta_total_mgal',
] as const;

export interface ChangeParts {
  datumMgal: number;
  normalMgal: number;
  freeAirMgal: number;
  bouguerMgal: number;
  terrainMgal: number;
  densityMgal: number;
  heightMgal: number;
  /** recomputed legacy CBA - printed legacy CBA; 0 when no printed value is given. */
  legacyResidualMgal: number;
  /** new CBA - legacy CBA (printed when given, else recomputed); the parts sum to it. */
  totalMgal: number;
  /** CBA of the legacy state, recomputed, mGal. */
  legacyRecomputedCbaMgal: number;
  /** CBA of the new state, mGal. */
  newCbaMgal: number;
}

/** The mixed state during substitution: ingredients switched so far are new. */
interface MixedState {
  gobsMgal: number;
  normal: FormulaSet;
  freeAir: FormulaSet;
  bouguer: FormulaSet;
  /** TC per kg/m^3 of density, mGal. */
  tcPerDensity: number;
  densityKgM3: number;
  heightM: number;
}

function cbaOf(s: MixedState, latDeg: number): number {
  const gammaMgal = toMgal(normalGravity(latDeg, s.normal.normal));
  const h = heightCorrectionsMgal(s.freeAir, s.heightM, latDeg);
  const bc = bouguerTermMgal(s.bouguer, s.heightM, s.densityKgM3);
  return s.gobsMgal - gammaMgal + h.freeAirCorrMgal + h.atmosphericCorrMgal - bc + s.tcPerDensity * s.densityKgM3;
}

/**
 * Decomposes new CBA - legacy CBA for one station at geodetic latitude `latDeg` (degrees).
 * `printedLegacyCbaMgal` is the legacy file's CBA (NaN or omitted when absent).
 * NaN inputs propagate into the parts they touch (and the total).
 */
export function explainChange(
  latDeg: number,
  legacy: ReductionState,
  current: ReductionState,
  printedLegacyCbaMgal: number = NaN,
): ChangeParts {
  const s: MixedState = {
    gobsMgal: legacy.gobsMgal,
    normal: legacy,
    freeAir: legacy,
    bouguer: legacy,
    tcPerDensity: legacy.tcMgal / legacy.densityKgM3,
    densityKgM3: legacy.densityKgM3,
    heightM: legacy.heightM,
  };
  const v0 = cbaOf(s, latDeg);
  s.gobsMgal = current.gobsMgal;
  const v1 = cbaOf(s, latDeg);
  s.normal = current;
  const v2 = cbaOf(s, latDeg);
  s.freeAir = current;
  const v3 = cbaOf(s, latDeg);
  s.bouguer = current;
  const v4 = cbaOf(s, latDeg);
  s.tcPerDensity = current.tcMgal / current.densityKgM3;
  const v5 = cbaOf(s, latDeg);
  s.densityKgM3 = current.densityKgM3;
  const v6 = cbaOf(s, latDeg);
  s.heightM = current.heightM;
  const v7 = cbaOf(s, latDeg);
  const parts = {
    legacyResidualMgal: Number.isNaN(printedLegacyCbaMgal) ? 0 : v0 - printedLegacyCbaMgal,
    datumMgal: v1 - v0,
    normalMgal: v2 - v1,
    freeAirMgal: v3 - v2,
    bouguerMgal: v4 - v3,
    terrainMgal: v5 - v4,
    densityMgal: v6 - v5,
    heightMgal: v7 - v6,
  };
  // The total is taken from the two end states, not summed from the parts, so that the
  // telescoping identity (parts sum to the total) is a checkable property.
  const totalMgal = v7 - (Number.isNaN(printedLegacyCbaMgal) ? v0 : printedLegacyCbaMgal);
  return { ...parts, totalMgal, legacyRecomputedCbaMgal: v0, newCbaMgal: v7 };
}

/** The parts as output cells, in CHANGE_COLUMNS order. */
export function changeRow(p: ChangeParts): number[] {
  return [
    p.datumMgal,
    p.normalMgal,
    p.freeAirMgal,
    p.bouguerMgal,
    p.terrainMgal,
    p.densityMgal,
    p.heightMgal,
    p.legacyResidualMgal,
    p.totalMgal,
  ];
}
