/**
 * Reads a station file (CSV with comma, semicolon, tab or whitespace delimiters) into a
 * validated StationTable in SI units. See validate.ts for the checks and the README text in
 * DEVELOPERS.md for which problems are fatal and which become flags.
 */
import { readFile } from 'node:fs/promises';
import { InputError, isInputError, type InputErrorContext } from '../errors.js';
import { metresPer, type LengthUnit } from '../units.js';
import type { CrsInfo } from '../dem/grid.js';
import type { StationTable } from './table.js';
import { detectDelimiter, delimiterName, splitLine } from './delimiter.js';
import { CANONICAL_COLUMNS, resolveColumns, type ColumnIndex } from './columns.js';
import { resolveCrs } from './crs-registry.js';
import { makeTransform, transformArrays } from './transform.js';
import {
  checkHeight,
  checkLatitude,
  checkLongitude,
  duplicatePositions,
  lonLatToLocalMetres,
  parseOptionalNumber,
  parseRequiredNumber,
} from './validate.js';

export interface StationReadOptions {
  /** canonical column → file column (from --columns, see parseColumnMapping). */
  columns?: Record<string, string>;
  /** CRS of the station coordinates (EPSG:n or proj4); default EPSG:4326 with lon/lat columns. */
  stationCrs?: string;
  /** Unit of the height column; default 'm'. */
  heightUnits?: LengthUnit;
  /** Row-level problems become a 'bad_row' flag (numeric fields NaN) instead of an error. */
  keepGoing?: boolean;
}

const BOM = '\uFEFF';
const LINE_BREAK = /\r?\n|\r/;

export async function readStations(path: string, opts: StationReadOptions = {}): Promise<StationTable> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (e) {
    throw new InputError(`cannot read station file: ${(e as Error).message}`, { file: path });
  }
  return parseStations(text, path, opts);
}

/** The same as readStations on text already in memory (`file` names it in messages). */
export function parseStations(text: string, file: string, opts: StationReadOptions = {}): StationTable {
  const heightUnit: LengthUnit = opts.heightUnits ?? 'm';
  const heightFactor = metresPer(heightUnit);
  const keepGoing = opts.keepGoing === true;
  const crs: CrsInfo = resolveCrs(opts.stationCrs ?? 'EPSG:4326', { field: '--station-crs' });
  const positions = crs.kind === 'projected' ? 'xy' : 'lonlat';

  const lines = (text.startsWith(BOM) ? text.slice(1) : text).split(LINE_BREAK);
  let h = 0;
  while (h < lines.length && isSkipped(lines[h] as string)) h++;
  if (h >= lines.length) {
    throw new InputError('no header line: the file is empty or has only comments and blank lines', { file });
  }
  const headerLineNo = h + 1;
  const delimiter = detectDelimiter(lines[h] as string);
  const header = splitLine(lines[h] as string, delimiter, { file, line: headerLineNo }).map((c) => c.trim());
  checkHeaderNames(header, file, headerLineNo);
  const col = resolveColumns(header, opts.columns ?? {}, positions, file, headerLineNo);
  const posX = positions === 'xy' ? col.x : col.lon;
  const posY = positions === 'xy' ? col.y : col.lat;

  const ids: string[] = [];
  const lineNos: number[] = [];
  const rows: string[][] = [];
  const xs: number[] = [];
  const ys: number[] = [];
  const heights: number[] = [];
  const gobs: number[] = [];
  const innerTc: number[] = [];
  const legacyTc: number[] = [];
  const flags: string[][] = [];
  const warnings: string[] = [];
  const seen = new Map<string, number>();

  for (let i = h + 1; i < lines.length; i++) {
    const raw = lines[i] as string;
    if (isSkipped(raw)) continue;
    const line = i + 1;
    const ctx: InputErrorContext = { file, line };
    let cells: string[] = [];
    let id = '';
    try {
      cells = splitLine(raw, delimiter, ctx);
      id = (cells[col.id] ?? '').trim();
      if (id !== '') ctx.station = id;
      if (cells.length !== header.length) {
        throw new InputError(
          `${cells.length} fields, expected ${header.length} as in the header (line ${headerLineNo}, delimiter ${delimiterName(delimiter)})`,
          ctx,
        );
      }
      if (id === '') throw new InputError('empty station id', { ...ctx, field: header[col.id] as string });
      const x = parseRequiredNumber(cells[posX], positions === 'xy' ? `an x coordinate in ${crs.label}` : 'a longitude in degrees', ctx, header[posX]);
      const y = parseRequiredNumber(cells[posY], positions === 'xy' ? `a y coordinate in ${crs.label}` : 'a latitude in degrees', ctx, header[posY]);
      if (positions === 'lonlat') {
        checkLongitude(x, ctx, header[posX]);
        checkLatitude(y, ctx, header[posY]);
      }
      const hRaw = parseRequiredNumber(cells[col.height_m], `a height in ${heightUnit}`, ctx, header[col.height_m]);
      const hM = hRaw * heightFactor;
      checkHeight(hM, hRaw, heightUnit, ctx, header[col.height_m]);
      const g = optional(cells, col.gobs_mgal, 'observed gravity in mGal', ctx, header);
      const itc = optional(cells, col.inner_tc_mgal, 'a terrain correction in mGal', ctx, header);
      const ltc = optional(cells, col.legacy_tc_mgal, 'a terrain correction in mGal', ctx, header);
      xs.push(x);
      ys.push(y);
      heights.push(hM);
      gobs.push(g);
      innerTc.push(itc);
      legacyTc.push(ltc);
      flags.push([]);
    } catch (e) {
      if (!keepGoing || !isInputError(e)) throw e;
      warnings.push(e.message);
      if (id === '') id = `(line ${line})`;
      xs.push(NaN);
      ys.push(NaN);
      heights.push(NaN);
      gobs.push(NaN);
      innerTc.push(NaN);
      legacyTc.push(NaN);
      flags.push(['bad_row']);
    }
    // duplicate ids are fatal even with keepGoing: output rows could not be told apart
    checkDuplicateId(seen, id, line, file, header[col.id] as string);
    ids.push(id);
    lineNos.push(line);
    rows.push(cells);
  }
  if (ids.length === 0) {
    throw new InputError(`no station rows after the header (line ${headerLineNo})`, { file });
  }

  const x = Float64Array.from(xs);
  const y = Float64Array.from(ys);
  let lonDeg: Float64Array = x;
  let latDeg: Float64Array = y;
  const wgs84 = resolveCrs('EPSG:4326');
  if (crs.proj4 !== wgs84.proj4) {
    const ll = toWgs84(crs, wgs84, x, y, { file, lines: lineNos, ids }, keepGoing, flags, warnings);
    lonDeg = ll.x;
    latDeg = ll.y;
  }
  const heightM = Float64Array.from(heights);
  flags.forEach((f, i) => {
    if (f.includes('bad_row')) x[i] = y[i] = lonDeg[i] = latDeg[i] = heightM[i] = gobs[i] = innerTc[i] = legacyTc[i] = NaN;
  });
  const metric = crs.kind === 'projected' ? { eastM: x.map((v) => v * crs.linearUnitM), northM: y.map((v) => v * crs.linearUnitM) } : lonLatToLocalMetres(lonDeg, latDeg);
  for (const [a, b] of duplicatePositions(metric.eastM, metric.northM)) {
    for (const k of [a, b]) if (!(flags[k] as string[]).includes('duplicate_position')) (flags[k] as string[]).push('duplicate_position');
  }

  const table: StationTable = {
    source: file,
    ids,
    lines: lineNos,
    lonDeg,
    latDeg,
    x,
    y,
    crsLabel: crs.label,
    crsProj4: crs.proj4,
    heightM,
    gobsMgal: Float64Array.from(gobs),
    innerTcMgal: Float64Array.from(innerTc),
    legacyTcMgal: Float64Array.from(legacyTc),
    header,
    rows,
    flags,
    delimiter,
  };
  if (warnings.length > 0) table.warnings = warnings;
  return table;
}

function isSkipped(line: string): boolean {
  const t = line.trimStart();
  return t === '' || t.startsWith('#');
}

function optional(cells: string[], index: number, what: string, ctx: InputErrorContext, header: readonly string[]): number {
  return index < 0 ? NaN : parseOptionalNumber(cells[index], what, ctx, header[index]);
}

function checkHeaderNames(header: readonly string[], file: string, line: number): void {
  const lower = header.map((c) => c.toLowerCase());
  lower.forEach((name, i) => {
    if (name === '') throw new InputError(`header field ${i + 1} is empty; expected a column name`, { file, line });
    const first = lower.indexOf(name);
    if (first !== i && (CANONICAL_COLUMNS as readonly string[]).includes(name)) {
      throw new InputError(`column '${header[i]}' appears twice in the header (fields ${first + 1} and ${i + 1})`, { file, line, field: header[i] as string });
    }
  });
}

function checkDuplicateId(seen: Map<string, number>, id: string, line: number, file: string, field: string): void {
  const before = seen.get(id);
  if (before !== undefined) {
    throw new InputError(`station id '${id}' appears twice: lines ${before} and ${line}; expected unique ids`, { file, line, station: id, field });
  }
  seen.set(id, line);
}

function toWgs84(
  crs: CrsInfo,
  wgs84: CrsInfo,
  x: Float64Array,
  y: Float64Array,
  source: { file: string; lines: number[]; ids: string[] },
  keepGoing: boolean,
  flags: string[][],
  warnings: string[],
): { x: Float64Array; y: Float64Array } {
  if (!keepGoing) return transformArrays(crs, wgs84, x, y, source);
  const t = makeTransform(crs, wgs84);
  const lon = new Float64Array(x.length).fill(NaN);
  const lat = new Float64Array(x.length).fill(NaN);
  for (let i = 0; i < x.length; i++) {
    if (Number.isNaN(x[i] as number)) continue;
    try {
      [lon[i], lat[i]] = t(x[i] as number, y[i] as number);
    } catch (e) {
      if (!isInputError(e)) throw e;
      warnings.push(`${source.file}:${source.lines[i]}: station ${source.ids[i]}: ${e.message}`);
      (flags[i] as string[]).push('bad_row');
    }
  }
  return { x: lon, y: lat };
}

export type { ColumnIndex };
