/** Density estimation from the unit-density columns of a results CSV. */
export { nettleton, sweepDensities } from './nettleton.js';
export type { NettletonOptions, NettletonResult, DensityRange } from './nettleton.js';
export { parasnis, parasnisVariables } from './parasnis.js';
export type { ParasnisOptions, ParasnisResult } from './parasnis.js';
export { densityInputFromTable, subsetDensityInput, localMetres, parseColumnMapping as parseDensityColumnMapping, DENSITY_COLUMNS } from './input.js';
export type { DensityInput, DensityColumn } from './input.js';
export { selectStations, parseWhere, parseBox, parsePolygon, pointInPolygon } from './select.js';
export type { Selection, WhereClause, Box } from './select.js';
export {
  compareDensityEstimates,
  MIN_STATIONS_FOR_DENSITY,
  MIN_RELIEF_M,
  TREND_SHIFT_SIGMAS,
  AGREEMENT_SIGMAS,
} from './compare.js';
export type { DensityVerdict, CompareContext } from './compare.js';
export { leastSquares, pearson } from './least-squares.js';
export type { LeastSquaresFit } from './least-squares.js';
export { robustLeastSquares, HUBER_K, TRIM_SIGMAS, DOWNWEIGHT_REPORT_LIMIT } from './robust-fit.js';
export type { RobustMethod, RobustFit } from './robust-fit.js';
export { readCsvTable, parseCsvTable } from '../io/read-results.js';
export type { CsvTable } from '../io/read-results.js';
