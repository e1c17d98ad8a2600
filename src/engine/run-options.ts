/** Everything one `talus reduce` run is told, with units in the names. */
import type { NormalFormula } from '../reduction/normal-gravity.js';
import type { FreeAirOrder } from '../reduction/free-air.js';
import type { LengthUnit } from '../units.js';

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
  /** The HTML report, when one was asked for. */
  reportHtml?: string;
}
