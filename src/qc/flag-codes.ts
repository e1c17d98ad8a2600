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
  raisedBy: 'reader' | 'engine' | 'qc';
}

/** Default height misfit limit, m (station height minus DEM height). */
export const DEFAULT_MISFIT_LIMIT_M = 10;
/** Default horizontal tolerance for duplicate positions, m: closer than a field GPS fix resolves two marks (common practice). */
export const DEFAULT_DUPLICATE_TOLERANCE_M = 1;
/** Default |new - legacy| terrain-correction change that is flagged, mGal (common practice for legacy reprocessing; from memory). */
export const DEFAULT_LEGACY_TC_LIMIT_MGAL = 1;

export const QC_FLAGS: readonly QcFlagInfo[] = [
  { code: 'bad_row', meaning: 'the row could not be used (its message is in the provenance warnings); only with --keep-going', option: '--keep-going', defaultValue: '', raisedBy: 'reader' },
  { code: 'outside_dem', meaning: 'station lies outside the fine DEM (not computed); only with --keep-going, else an error', option: '--keep-going', defaultValue: '', raisedBy: 'engine' },
  { code: 'dem_partial', meaning: 'the DEMs do not cover the whole correction disc (dem_coverage < 1); the missing part counts as the cap', option: '--far-dem', defaultValue: '', raisedBy: 'engine' },
  { code: 'nodata_near', meaning: 'nodata within the inner zone (895 m) or at the station', option: '', defaultValue: '', raisedBy: 'engine' },
  { code: 'height_misfit', meaning: '|station height - DEM height| exceeds the limit', option: '--misfit-limit', defaultValue: `${DEFAULT_MISFIT_LIMIT_M} m`, raisedBy: 'engine' },
  { code: 'above_terrain', meaning: 'station more than the limit above the DEM (tower, airborne): the DEM surface is used as it is, not pulled to the station', option: '--above-terrain', defaultValue: '50 m', raisedBy: 'engine' },
  { code: 'below_terrain', meaning: 'station more than the limit below the DEM (tunnel, or a bad height): the DEM surface is used as it is', option: '--below-terrain', defaultValue: '50 m', raisedBy: 'engine' },
  { code: 'duplicate_position', meaning: 'another station within 0.01 m horizontally (a re-occupation or a copied row)', option: '', defaultValue: '0.01 m', raisedBy: 'reader' },
  { code: 'tc_outlier', meaning: 'terrain correction far from the median of its nearest neighbours at similar heights', option: '--tc-outlier-limit', defaultValue: '1 mGal, and 5 robust sigma of the neighbours', raisedBy: 'qc' },
  { code: 'legacy_tc_change', meaning: '|new TC - legacy_tc_mgal| exceeds the limit', option: '--legacy-tc-limit', defaultValue: `${DEFAULT_LEGACY_TC_LIMIT_MGAL} mGal`, raisedBy: 'qc' },
  { code: 'legacy_mismatch', meaning: 'a printed legacy anomaly is not reproduced by the declared --legacy-formulas', option: '--legacy-tolerance', defaultValue: '0.05 mGal', raisedBy: 'qc' },
  { code: 'outside_geoid', meaning: 'station outside the --geoid grid (not computed); only with --keep-going', option: '--geoid', defaultValue: '', raisedBy: 'engine' },
];
