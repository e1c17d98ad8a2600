/** Station QC after the terrain run: flags and the end-of-run summary. */
export { tcOutlierFlags, TC_OUTLIER_DEFAULTS } from './tc-outlier.js';
export type { TcOutlierOptions } from './tc-outlier.js';
export { legacyTcChangeFlags } from './legacy-tc-change.js';
export { duplicatePositionFlags } from './duplicate-position.js';
export { qcSummary, formatQcSummary } from './qc-summary.js';
export type { QcSummary } from './qc-summary.js';
export {
  QC_FLAGS,
  DEFAULT_MISFIT_LIMIT_M,
  DEFAULT_DUPLICATE_TOLERANCE_M,
  DEFAULT_LEGACY_TC_LIMIT_MGAL,
} from './flag-codes.js';
export type { QcFlagInfo } from './flag-codes.js';
