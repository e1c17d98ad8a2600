/**
 * Legacy reprocessing: old gravity datums and storage conventions, reproducing an old
 * reduction, explaining the change to the new one, height types and geoid grids, and the range
 * a legacy terrain correction covered.
 */
export {
  POTSDAM_TO_IGSN71_MGAL,
  DEFAULT_GRAVITY_CONVENTION,
  isGravityDatum,
  isGravityUnit,
  parseGravityDatum,
  parseGravityUnit,
  parseGobsOffset,
  parseDatumOffsetCell,
  mgalPerGravityUnit,
  datumOffsetMgal,
  toIgsn71Mgal,
  storedGravityToMgal,
  storedGravityToIgsn71Mgal,
  describeGravityConversions,
} from './gravity-datum.js';
export type { GravityDatum, GravityUnit, GravityConvention, GravityConversionStep } from './gravity-datum.js';
export {
  isFreeAirFormula,
  isBouguerFormula,
  bouguerTermMgal,
  heightCorrectionsMgal,
  reduceWithFormulas,
  validateFormulaSet,
} from './formula-set.js';
export type { FormulaSet, FreeAirFormula, BouguerFormula, FormulaReduction, ReductionInputs } from './formula-set.js';
export {
  LEGACY_MISMATCH_FLAG,
  LEGACY_MISMATCH_TOLERANCE_MGAL,
  checkLegacyAnomalies,
  parseLegacyTolerance,
  parseLegacyFormulaSet,
} from './legacy-reduction.js';
export type { LegacyFormulaSet, PrintedLegacyAnomalies, LegacyCheck } from './legacy-reduction.js';
export { CHANGE_COLUMNS, explainChange, changeRow } from './explain-change.js';
export type { ReductionState, ChangeParts } from './explain-change.js';
export {
  isHeightType,
  parseHeightType,
  convertHeight,
  convertHeights,
  heightTypeMixError,
  suspectHeightTypeMismatch,
} from './height-type.js';
export type { HeightType } from './height-type.js';
export { sampleBilinear, sampleUndulations } from './geoid-grid.js';
export { parseLegacyTcRange, inLegacyTcRange, describeLegacyTcRange } from './legacy-tc-range.js';
export type { LegacyTcRange } from './legacy-tc-range.js';
