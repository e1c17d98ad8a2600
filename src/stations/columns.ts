/**
 * Canonical station columns and how they are found in a file's header: by the --columns
 * mapping (canonical=file column) or else by their canonical name (case-insensitive).
 */
import { InputError } from '../errors.js';

export const CANONICAL_COLUMNS = [
  'id',
  'lon',
  'lat',
  'x',
  'y',
  'height_m',
  'gobs_mgal',
  'inner_tc_mgal',
  'legacy_tc_mgal',
] as const;

export type CanonicalColumn = (typeof CANONICAL_COLUMNS)[number];

/** Column index in the file of each canonical column, -1 when absent. */
export type ColumnIndex = Record<CanonicalColumn, number>;

function isCanonical(s: string): s is CanonicalColumn {
  return (CANONICAL_COLUMNS as readonly string[]).includes(s);
}

/**
 * Parses a --columns value such as "id=STN,lon=LONG,lat=LAT,height_m=ELEV" into
 * { id: 'STN', lon: 'LONG', ... }. File column names are kept as written (trimmed).
 */
export function parseColumnMapping(spec: string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const part of spec.split(',')) {
    if (part.trim() === '') continue;
    const eq = part.indexOf('=');
    if (eq < 0) {
      throw new InputError(`'${part.trim()}' in --columns: expected canonical=column, e.g. id=STN`, { field: '--columns' });
    }
    const canon = part.slice(0, eq).trim().toLowerCase();
    const col = part.slice(eq + 1).trim();
    if (!isCanonical(canon)) {
      throw new InputError(
        `unknown canonical column '${canon}' in --columns; expected one of ${CANONICAL_COLUMNS.join(', ')}`,
        { field: '--columns' },
      );
    }
    if (col === '') {
      throw new InputError(`empty file column for '${canon}' in --columns; expected ${canon}=COLUMN`, { field: '--columns' });
    }
    if (out[canon] !== undefined) {
      throw new InputError(`'${canon}' is mapped twice in --columns (to '${out[canon]}' and '${col}')`, { field: '--columns' });
    }
    out[canon] = col;
  }
  return out;
}

/**
 * Finds every canonical column in `header`. A mapped column must exist (exact name, else
 * case-insensitive); unmapped canonical columns are looked up by their own name,
 * case-insensitively. Required: id, height_m, and lon/lat (geographic station CRS) or x/y.
 */
export function resolveColumns(
  header: readonly string[],
  mapping: Readonly<Record<string, string>>,
  positions: 'lonlat' | 'xy',
  file: string,
  headerLine: number,
): ColumnIndex {
  const found = `columns found: ${header.map((h) => `'${h}'`).join(', ')}`;
  const lower = header.map((h) => h.toLowerCase());
  const index = {} as ColumnIndex;
  for (const canon of CANONICAL_COLUMNS) {
    const mapped = mapping[canon];
    if (mapped !== undefined) {
      let at = header.indexOf(mapped);
      if (at < 0) at = lower.indexOf(mapped.toLowerCase());
      if (at < 0) {
        throw new InputError(`--columns maps ${canon} to '${mapped}', which is not in the header; ${found}`, {
          file,
          line: headerLine,
          field: mapped,
        });
      }
      index[canon] = at;
    } else {
      index[canon] = lower.indexOf(canon);
    }
  }
  for (const k of Object.keys(mapping)) {
    if (!isCanonical(k)) throw new InputError(`unknown canonical column '${k}' in --columns`, { field: '--columns' });
  }
  const required: CanonicalColumn[] = ['id', positions === 'xy' ? 'x' : 'lon', positions === 'xy' ? 'y' : 'lat', 'height_m'];
  const missing = required.filter((c) => index[c] < 0);
  if (missing.length > 0) {
    const hint =
      positions === 'xy'
        ? ' (the station CRS is projected: give x and y, e.g. --columns x=EASTING,y=NORTHING)'
        : ' (or map them with --columns, e.g. --columns lon=LONG,lat=LAT)';
    throw new InputError(`missing required column${missing.length > 1 ? 's' : ''} ${missing.join(', ')}${hint}; ${found}`, {
      file,
      line: headerLine,
    });
  }
  return index;
}
