/** Station tables: CSV reading and validation, column mapping, CRS registry and transforms. */
export type { StationTable } from './table.js';
export { readStations, parseStations, type StationReadOptions } from './read-csv.js';
export { parseColumnMapping, CANONICAL_COLUMNS, type CanonicalColumn } from './columns.js';
export { detectDelimiter, type Delimiter } from './delimiter.js';
export { resolveCrs, knownEpsgCodes, describeEpsg } from './crs-registry.js';
export { makeTransform, transformArrays, type PointTransform, type PointSource } from './transform.js';
export { MIN_HEIGHT_M, MAX_HEIGHT_M, DUPLICATE_POSITION_M } from './validate.js';
