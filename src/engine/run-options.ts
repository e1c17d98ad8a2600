/** Everything one `talus reduce` run is told, with units in the names. */
import type { NormalFormula } from '../reduction/normal-gravity.js';
import type { FreeAirOrder } from '../reduction/free-air.js';
import type { LengthUnit } from '../units.js';
import type { GravityConvention } from '../legacy/gravity-datum.js';
import type { FormulaSet } from '../legacy/formula-set.js';
import type { HeightType } from '../legacy/height-type.js';
import type { LegacyTcRange } from '../legacy/legacy-tc-range.js';
import type { LegacyColumnKey } from './legacy-columns.js';
import type { ShardSpec } from './shard-spec.js';

export interface ReduceOptions {
  stationsPath: string;
  demPaths: string[];
  farDemPath?: string;
  outPath: string;
  stationCrs?: string;
  columns?: Record<string, string>;
  heightUnits: LengthUnit;
  keepGoing: boolean;
  demCrs?: string;
  demUnits: LengthUnit;
  farDemCrs?: string;
  farDemUnits: LengthUnit;
  densityKgM3: number;
  densitiesKgM3: number[];
  radiusM: number;
  capRadiusM: number;
  workers: number;
  batchSize: number;
  normalFormula: NormalFormula;
  freeAirOrder: FreeAirOrder;
  bouguer: 'cap' | 'slab';
  fieldInnerRadiusM: number;
  accuracyMgal: number;
  misfitLimitM: number;
  aboveTerrainM: number;
  belowTerrainM: number;
  tcOutlierLimitMgal: number;
  legacyTcLimitMgal: number;
  /** How the gobs_mgal column is stored (datum, units, removed constant); converted to IGSN71 mGal. */
  gravity: GravityConvention;
  /** File columns of the legacy inputs (datum_offset_mgal, legacy_fa_mgal, legacy_cba_mgal) mapped by --columns. */
  legacyColumns: Partial<Record<LegacyColumnKey, string>>;
  /** The formulas the legacy anomalies were reduced with; enables the legacy columns. */
  legacyFormulas?: FormulaSet;
  /** |printed - recomputed| legacy anomaly beyond which legacy_mismatch is flagged, mGal. */
  legacyToleranceMgal: number;
  /** Annulus the legacy TC covered: a second terrain pass over it (terrain_corr_range_mgal). */
  legacyTcRange?: LegacyTcRange;
  stationHeightType: HeightType;
  /** Height type of the fine and far-zone DEMs. */
  demHeightType: HeightType;
  /** Geoid undulation grid (GeoTIFF, m) for converting between height types. */
  geoidPath?: string;
  /** This machine's share of a cluster run (--shard K/N); absent = the whole run. */
  shard?: ShardSpec;
  /** Draw a progress bar (when stderr is a terminal). */
  progress: boolean;
  /** The command line as typed, for the provenance record. */
  commandLine: string[];
}

export interface ReduceSummary {
  stations: number;
  computed: number;
  flagged: Record<string, number>;
  runTimeS: number;
  terrainTimeS: number;
  stationsPerS: number;
  kernelEvaluationsPerStation: number;
  outputCsv: string;
  provenanceJson: string;
  qcText: string;
  warnings: string[];
  /** Set on a share of a cluster run: its K/N and how many stations it wrote. */
  shard?: { k: number; n: number; stations: number };
  /** The HTML report, when one was asked for. */
  reportHtml?: string;
}
