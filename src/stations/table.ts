/**
 * The station table after reading and validation. All numeric arrays are indexed by station
 * index (0-based, input order). SI units: metres; gravity stays in mGal here because it is
 * only ever compared and output in mGal (converted to m/s^2 where formulas need it).
 */
export interface StationTable {
  /** File the stations came from. */
  source: string;
  /** Station ids, unique. */
  ids: string[];
  /** 1-based line number in the source file of each station's row (for messages). */
  lines: number[];
  /** Longitude, degrees (WGS84 / the geographic CRS given), always filled (converted from x/y if needed). */
  lonDeg: Float64Array;
  /** Latitude, degrees. */
  latDeg: Float64Array;
  /** Station coordinates in the station CRS as given (lon/lat again when no --station-crs). */
  x: Float64Array;
  y: Float64Array;
  /** The station CRS label and proj4 definition. */
  crsLabel: string;
  crsProj4: string;
  /** Station height, metres (converted from --height-units). */
  heightM: Float64Array;
  /** Observed gravity, mGal; NaN when the column is absent or the cell is empty. */
  gobsMgal: Float64Array;
  /** Field inner-zone terrain correction, mGal; NaN when absent. */
  innerTcMgal: Float64Array;
  /** Legacy terrain correction, mGal; NaN when absent. */
  legacyTcMgal: Float64Array;
  /** The input header, exactly as read (passthrough to the output). */
  header: string[];
  /** The input cells of each row, exactly as read (passthrough to the output). */
  rows: string[][];
  /** Per-station flag codes raised while reading (e.g. 'duplicate_position', 'bad_row'). */
  flags: string[][];
  /** One message per problem that became a flag instead of an error (keepGoing), in file order. */
  warnings?: string[];
  /** The field delimiter found in the header line. */
  delimiter?: ',' | ';' | '\t' | 'whitespace';
}
