/**
 * The per-station QC flag codes of a results CSV (docs/results-columns.md), with what each
 * means and which option sets its threshold. The first six are raised by the terrain engine,
 * the rest by src/qc after the terrain run.
 */

export interface QcFlagInfo {
  code: string;
  meaning: string;
  /** CLI option that sets the threshold, or '' when there is none. */
  option: string;
  /** Default threshold, in words ('' when there is none). */
  defaultValue: string;
  raisedBy: 'engine' | 'qc';
}

/** Default height misfit limit, m (station height minus DEM height). */
export const DEFAULT_MISFIT_LIMIT_M = 10;
/** Default horizontal tolerance for duplicate positions, m: closer than a field GPS fix resolves two marks (common practice). */
export const DEFAULT_DUPLICATE_TOLERANCE_M = 1;
/** Default |new - legacy| terrain-correction change that is flagged, mGal (common practice for legacy reprocessing; from memory). */
export const DEFAULT_LEGACY_TC_LIMIT_MGAL = 1;

export const QC_FLAGS: readonly QcFlagInfo[] = [
  { code: 'outside_dem', meaning: 'station lies outside every DEM', option: '', defaultValue: '', raisedBy: 'engine' },
  { code: 'dem_partial', meaning: 'the DEMs do not cover the whole correction area (see dem_coverage)', option: '', defaultValue: '', raisedBy: 'engine' },
  { code: 'nodata_near', meaning: 'nodata cells close to the station', option: '', defaultValue: '', raisedBy: 'engine' },
  { code: 'height_misfit', meaning: 'station height differs from the DEM height by more than the limit', option: '--misfit-limit', defaultValue: `${DEFAULT_MISFIT_LIMIT_M} m`, raisedBy: 'engine' },
  { code: 'above_terrain', meaning: 'station is above the DEM surface by more than the misfit limit', option: '--misfit-limit', defaultValue: `${DEFAULT_MISFIT_LIMIT_M} m`, raisedBy: 'engine' },
  { code: 'below_terrain', meaning: 'station is below the DEM surface by more than the misfit limit', option: '--misfit-limit', defaultValue: `${DEFAULT_MISFIT_LIMIT_M} m`, raisedBy: 'engine' },
  { code: 'duplicate_position', meaning: 'another station lies within the tolerance horizontally', option: '--duplicate-tolerance', defaultValue: `${DEFAULT_DUPLICATE_TOLERANCE_M} m`, raisedBy: 'qc' },
  { code: 'tc_outlier', meaning: 'terrain correction far from the median of nearby stations at similar heights', option: '--tc-outlier-limit', defaultValue: '1 mGal, and 5 robust sigma of the neighbours', raisedBy: 'qc' },
  { code: 'legacy_tc_change', meaning: 'new terrain correction differs from the legacy one by more than the limit', option: '--legacy-tc-limit', defaultValue: `${DEFAULT_LEGACY_TC_LIMIT_MGAL} mGal`, raisedBy: 'qc' },
];
