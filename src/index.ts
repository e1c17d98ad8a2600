/**
 * talus public library API. SI units throughout (m, kg/m^3, m/s^2) unless a name says otherwise.
 */
export { G, EARTH_RADIUS_M, CAP_RADIUS_M, DEFAULT_DENSITY_KG_M3 } from './constants.js';
export { MGAL, FOOT_M, US_SURVEY_FOOT_M, metresPer } from './units.js';
export { InputError } from './errors.js';
export {
  readStations,
  parseStations,
  parseColumnMapping,
  CANONICAL_COLUMNS,
  detectDelimiter,
  resolveCrs,
  knownEpsgCodes,
  describeEpsg,
  makeTransform,
  transformArrays,
  MIN_HEIGHT_M,
  MAX_HEIGHT_M,
  DUPLICATE_POSITION_M,
} from './stations/index.js';
export type { StationTable, StationReadOptions, CanonicalColumn, Delimiter, PointTransform, PointSource } from './stations/index.js';
export {
  openDem,
  readDemWindow,
  isEmptyGrid,
  loadDemMosaic,
  describeDem,
  cellsInWindow,
  cellCentreX,
  cellCentreY,
  gridFromFunction,
  sharedFloat32,
} from './dem/index.js';
export type { DemGrid, CrsInfo, DemSource, DemOpenOptions, DemWindow, DemMosaic, DemDescription, CrsResolver } from './dem/index.js';
export { prismGz, gravityFromFactor } from './attraction.js';
export {
  prismGzFactor,
  sumPrismsGzFactor,
  lineElementGzFactor,
  lineElementGauss2x2GzFactor,
  pointMassGzFactor,
  radialColumnGzFactor,
  hammerSectorGzFactor,
  HAMMER_ZONES,
  lineElementRelError,
  gauss2x2RelError,
  prismCancellationRelError,
} from './kernels/index.js';
export type { HammerZone } from './kernels/index.js';
export {
  normalGravity,
  isNormalFormula,
  NORMAL_FORMULAS,
  normalGravityAtHeight,
  normalGravityEllipsoidal,
  atmosphericCorrection,
  freeAirCorrection,
  bouguerSlab,
  bouguerCap,
  bullardB,
  anomalies,
} from './reduction/index.js';
export type { NormalFormula, NormalFormulaInfo, FreeAirOrder, AnomalyTerms, Anomalies } from './reduction/index.js';
export * from './legacy/index.js';
export * from './density/index.js';
export * from './qc/index.js';
export * from './report/index.js';
