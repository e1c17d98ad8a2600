/**
 * What the HTML report is built from: plain data, already read and validated (see
 * load-report-data.ts). Column names are the canonical ones of docs/results-columns.md; a user's
 * --columns mapping has been applied before this point.
 */
import type { MapCoords, RasterBackground } from './charts/station-map.js';

export interface ReportStations {
  ids: readonly string[];
  /** Which coordinates x/y hold: lon/lat degrees or projected metres. */
  coords: MapCoords;
  x: Float64Array;
  y: Float64Array;
  /** Every numeric results column by canonical name; empty cells are NaN. */
  columns: ReadonlyMap<string, Float64Array>;
  /** Flag codes per station (empty array when clean). */
  flags: readonly (readonly string[])[];
}

/** A Nettleton estimate as the density module returns it. */
export interface NettletonView {
  densityKgM3: number;
  /** Half-width of the density interval where |corr| is not significant, kg/m^3; NaN without a zero crossing. */
  stderrKgM3: number;
  /** [density kg/m^3, correlation of CBA(density) with height]. */
  curve: readonly (readonly [number, number])[];
  minAbsCorr: number;
  n: number;
}

/** A Parasnis estimate as the density module returns it; the fitted line is y = intercept + slope·x. */
export interface ParasnisView {
  densityKgM3: number;
  stderrKgM3: number;
  r2: number;
  n: number;
  interceptMgal: number;
  downweighted: number;
  points: readonly { x: number; y: number }[];
  /** Slope of the fitted line in the points' units (mGal per mGal). */
  slope: number;
  xLabel: string;
  yLabel: string;
}

export interface DensityView {
  nettleton?: NettletonView;
  parasnis?: ParasnisView;
  /** Why an estimate is missing (e.g. too few stations, a column absent). */
  notes: string[];
}

export interface ReportData {
  title: string;
  /** Path of the results CSV as the user gave it (shown, never opened by buildReport). */
  resultsPath: string;
  /** The parsed <results>.provenance.json, when it was found beside the CSV. */
  provenance?: Record<string, unknown>;
  stations: ReportStations;
  /** Shaded relief under the station maps, in the same coordinates as stations.x/y. */
  relief?: RasterBackground;
  density?: DensityView;
  /** Remarks shown in the run summary (missing provenance, relief left out and why, ...). */
  notes: readonly string[];
  /** Text for the footer, e.g. the talus version that wrote the report. */
  generator?: string;
}

/** A results column, or undefined when the results don't have it or it is entirely empty. */
export function column(data: ReportData, name: string): Float64Array | undefined {
  const c = data.stations.columns.get(name);
  if (!c) return undefined;
  for (let i = 0; i < c.length; i++) if (Number.isFinite(c[i] as number)) return c;
  return undefined;
}
