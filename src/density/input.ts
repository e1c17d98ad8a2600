/**
 * The station values a density estimate needs, taken from a results CSV of `talus reduce`
 * (docs/results-columns.md). Gravity terms stay in mGal: they are only compared and regressed,
 * and mGal is the unit of the file they come from.
 */
import { InputError } from '../errors.js';
import type { CsvTable } from '../io/read-results.js';
import { EARTH_RADIUS_M } from '../constants.js';
import { DEG } from '../units.js';

export interface DensityInput {
  /** File the stations came from. */
  source: string;
  /** Station ids. */
  ids: string[];
  /** 1-based line of each station's row in the source file. */
  lines: number[];
  /** Index of each station's row in the source table (for --where on any column). */
  rowIndex: Int32Array;
  /** Station coordinates as given: metres (projected) or degrees (lon, lat). */
  x: Float64Array;
  y: Float64Array;
  /** 'projected' when x/y columns were read (metres), 'geographic' for lon/lat (degrees). */
  coords: 'projected' | 'geographic';
  /** Station height, m. */
  heightM: Float64Array;
  /** Free-air anomaly, mGal. */
  faaMgal: Float64Array;
  /** Bouguer term (cap or slab, as used) for 1000 kg/m^3, mGal. */
  bouguerUnitMgal: Float64Array;
  /** Terrain correction for 1000 kg/m^3, mGal. */
  tcUnitMgal: Float64Array;
  /** Field inner-zone terrain correction, mGal, added as given (density-independent). */
  innerTcMgal?: Float64Array;
  /** Rows left out because a required cell was empty (not available). */
  skippedRows: number;
}

/** Canonical column names (docs/results-columns.md); `--columns` may rename the input ones. */
export const DENSITY_COLUMNS = {
  id: 'id',
  x: 'x',
  y: 'y',
  lon: 'lon',
  lat: 'lat',
  height_m: 'height_m',
  free_air_anomaly_mgal: 'free_air_anomaly_mgal',
  bouguer_unit_mgal: 'bouguer_unit_mgal',
  terrain_corr_unit_mgal: 'terrain_corr_unit_mgal',
  inner_tc_mgal: 'inner_tc_mgal',
} as const;
export type DensityColumn = keyof typeof DENSITY_COLUMNS;

/**
 * Parses a `--columns` mapping "id=STN,height_m=elev" (canonical=name in the file).
 * Unknown canonical names and malformed pairs are InputErrors.
 */
export function parseColumnMapping(spec: string | undefined): Partial<Record<DensityColumn, string>> {
  const out: Partial<Record<DensityColumn, string>> = {};
  if (spec === undefined || spec.trim() === '') return out;
  for (const part of spec.split(',')) {
    const m = /^\s*([A-Za-z_]+)\s*=\s*(.+?)\s*$/.exec(part);
    if (!m) throw new InputError(`bad mapping "${part}": expected canonical=column, e.g. height_m=elev`, { field: '--columns' });
    const key = m[1] as string;
    if (!(key in DENSITY_COLUMNS)) {
      throw new InputError(`unknown column "${key}" in "${part}": expected one of ${Object.keys(DENSITY_COLUMNS).join(', ')}`, {
        field: '--columns',
      });
    }
    out[key as DensityColumn] = m[2] as string;
  }
  return out;
}

function columnIndex(table: CsvTable, name: string, required: boolean, why: string): number {
  const i = table.header.indexOf(name);
  if (i < 0 && required) {
    throw new InputError(`missing column "${name}" (${why}); columns present: ${table.header.join(', ')}`, {
      file: table.file,
      line: 1,
      field: name,
    });
  }
  return i;
}

/**
 * Builds the density input from a results table. Rows with an empty required cell (the results
 * CSV writes empty for "not available", e.g. outside the DEM) are skipped and counted; a cell
 * that is present but not a finite number is an InputError naming file, line, station, column
 * and value.
 */
export function densityInputFromTable(table: CsvTable, mapping: Partial<Record<DensityColumn, string>> = {}): DensityInput {
  const name = (c: DensityColumn): string => mapping[c] ?? DENSITY_COLUMNS[c];
  const iId = columnIndex(table, name('id'), true, 'station ids');
  const hasXY = table.header.includes(name('x')) && table.header.includes(name('y'));
  const iX = hasXY ? columnIndex(table, name('x'), true, 'station x') : columnIndex(table, name('lon'), true, 'station longitude (or x and y)');
  const iY = hasXY ? columnIndex(table, name('y'), true, 'station y') : columnIndex(table, name('lat'), true, 'station latitude (or x and y)');
  const iH = columnIndex(table, name('height_m'), true, 'station height, m');
  const iF = columnIndex(table, name('free_air_anomaly_mgal'), true, 'free-air anomaly, mGal');
  const iB = columnIndex(table, name('bouguer_unit_mgal'), true, 'Bouguer term for 1000 kg/m^3, mGal');
  const iT = columnIndex(table, name('terrain_corr_unit_mgal'), true, 'terrain correction for 1000 kg/m^3, mGal');
  const iI = columnIndex(table, name('inner_tc_mgal'), false, '');
  const required: [number, string][] = [
    [iX, name(hasXY ? 'x' : 'lon')],
    [iY, name(hasXY ? 'y' : 'lat')],
    [iH, name('height_m')],
    [iF, name('free_air_anomaly_mgal')],
    [iB, name('bouguer_unit_mgal')],
    [iT, name('terrain_corr_unit_mgal')],
  ];
  const n0 = table.rows.length;
  const cols = required.map(() => new Float64Array(n0));
  const inner = new Float64Array(n0);
  const ids: string[] = [];
  const lines: number[] = [];
  const rowIndex = new Int32Array(n0);
  let n = 0;
  let skipped = 0;
  rows: for (let r = 0; r < n0; r++) {
    const row = table.rows[r] as string[];
    const line = table.lines[r] as number;
    const id = row[iId] ?? '';
    const values: number[] = [];
    for (const [ci, cname] of required) {
      const cell = row[ci] ?? '';
      if (cell === '') {
        skipped++;
        continue rows;
      }
      values.push(parseNumberCell(cell, { file: table.file, line, station: id, field: cname }));
    }
    values.forEach((v, k) => ((cols[k] as Float64Array)[n] = v));
    const innerCell = iI >= 0 ? (row[iI] ?? '') : '';
    inner[n] = innerCell === '' ? 0 : parseNumberCell(innerCell, { file: table.file, line, station: id, field: name('inner_tc_mgal') });
    ids.push(id);
    lines.push(line);
    rowIndex[n] = r;
    n++;
  }
  const cut = (a: Float64Array): Float64Array => a.slice(0, n);
  return {
    source: table.file,
    ids,
    lines,
    rowIndex: rowIndex.slice(0, n),
    x: cut(cols[0] as Float64Array),
    y: cut(cols[1] as Float64Array),
    coords: hasXY ? 'projected' : 'geographic',
    heightM: cut(cols[2] as Float64Array),
    faaMgal: cut(cols[3] as Float64Array),
    bouguerUnitMgal: cut(cols[4] as Float64Array),
    tcUnitMgal: cut(cols[5] as Float64Array),
    ...(iI >= 0 ? { innerTcMgal: cut(inner) } : {}),
    skippedRows: skipped,
  };
}

function parseNumberCell(cell: string, ctx: { file: string; line: number; station: string; field: string }): number {
  const v = Number(cell);
  if (!Number.isFinite(v)) throw new InputError(`value "${cell}" is not a number: expected a finite decimal number`, ctx);
  return v;
}

/** The stations whose mask entry is true, as a new DensityInput (arrays copied). */
export function subsetDensityInput(input: DensityInput, keep: ArrayLike<boolean>): DensityInput {
  const idx: number[] = [];
  for (let i = 0; i < input.ids.length; i++) if (keep[i] === true) idx.push(i);
  const pick = (a: Float64Array): Float64Array => Float64Array.from(idx, (i) => a[i] as number);
  return {
    ...input,
    ids: idx.map((i) => input.ids[i] as string),
    lines: idx.map((i) => input.lines[i] as number),
    rowIndex: Int32Array.from(idx, (i) => input.rowIndex[i] as number),
    x: pick(input.x),
    y: pick(input.y),
    heightM: pick(input.heightM),
    faaMgal: pick(input.faaMgal),
    bouguerUnitMgal: pick(input.bouguerUnitMgal),
    tcUnitMgal: pick(input.tcUnitMgal),
    ...(input.innerTcMgal ? { innerTcMgal: pick(input.innerTcMgal) } : {}),
  };
}

/**
 * Station positions in local metres for a trend surface: projected coordinates as given;
 * lon/lat by an equirectangular projection about the mean position on the EARTH_RADIUS_M sphere
 * (common practice for a plane fit over a survey area; the scale error at 100 km from the
 * centre is below 0.1 %, irrelevant to a first-order trend).
 */
export function localMetres(input: DensityInput): { xM: Float64Array; yM: Float64Array } {
  if (input.coords === 'projected') return { xM: input.x, yM: input.y };
  const n = input.x.length;
  let lon0 = 0;
  let lat0 = 0;
  for (let i = 0; i < n; i++) {
    lon0 += input.x[i] as number;
    lat0 += input.y[i] as number;
  }
  lon0 /= n;
  lat0 /= n;
  const kx = EARTH_RADIUS_M * DEG * Math.cos(lat0 * DEG);
  const ky = EARTH_RADIUS_M * DEG;
  return {
    xM: Float64Array.from(input.x, (lon) => (lon - lon0) * kx),
    yM: Float64Array.from(input.y, (lat) => (lat - lat0) * ky),
  };
}
