/**
 * Reads a results CSV (docs/results-columns.md) and what lies beside it into ReportData:
 * numeric columns by canonical name, flags, the provenance JSON, density estimates.
 */
import { existsSync, readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { InputError } from '../errors.js';
import type { CsvTable } from '../io/read-results.js';
import { readCsvTable } from '../io/read-results.js';
import type { DensityColumn } from '../density/input.js';
import { DENSITY_COLUMNS, densityInputFromTable } from '../density/input.js';
import { nettleton } from '../density/nettleton.js';
import { parasnis } from '../density/parasnis.js';
import { UNIT_DENSITY_KG_M3 } from '../constants.js';
import type { DensityView, ReportData } from './report-data.js';
import type { MapCoords } from './charts/station-map.js';

/** Nettleton sweep for the report, kg/m^3: sediments to dense crystalline rock (same span as `talus density`). */
export const REPORT_DENSITY_RANGE = { fromKgM3: 1800, toKgM3: 3000, stepKgM3: 10 };
/** Fewest stations a density estimate is drawn for (two unknowns and some redundancy). */
const MIN_DENSITY_STATIONS = 4;

export interface LoadOptions {
  /** canonical name → name in the file (the parsed --columns of talus reduce, e.g. { id: 'STN' }). */
  mapping?: Readonly<Record<string, string>>;
  /** Prefer these map coordinates when the file has both lon/lat and x/y. */
  preferCoords?: MapCoords;
  title?: string;
}

/** The provenance file beside a results CSV: `<results>.provenance.json`, or with the .csv dropped. */
export function provenancePathFor(resultsPath: string): string | undefined {
  const candidates = [`${resultsPath}.provenance.json`, `${resultsPath.replace(/\.csv$/i, '')}.provenance.json`];
  return candidates.find((p) => existsSync(p));
}

export function loadReportData(resultsPath: string, opts: LoadOptions = {}): ReportData {
  const table = readCsvTable(resultsPath);
  const notes: string[] = [];
  const mapping = opts.mapping ?? {};
  for (const [canon, name] of Object.entries(mapping)) {
    if (!table.header.includes(name)) {
      throw new InputError(`--columns maps ${canon} to "${name}", which is not a column; columns present: ${table.header.join(', ')}`, { file: resultsPath, line: 1, field: name });
    }
  }
  const fileName = (canon: string): string => mapping[canon] ?? canon;
  const canonical = new Map<string, string>(Object.entries(mapping).map(([canon, name]) => [name, canon]));
  const need = (canon: string, why: string): number => {
    const i = table.header.indexOf(fileName(canon));
    if (i < 0) throw new InputError(`missing column "${fileName(canon)}" (${why}); columns present: ${table.header.join(', ')}`, { file: resultsPath, line: 1, field: fileName(canon) });
    return i;
  };
  const iId = need('id', 'station ids');
  need('complete_bouguer_mgal', 'complete Bouguer anomaly, mGal: is this a results CSV of talus reduce?');
  const has = (c: string) => table.header.includes(fileName(c));
  const hasXY = has('x') && has('y');
  const hasLonLat = has('lon') && has('lat');
  if (!hasXY && !hasLonLat) need(has('x') || has('y') ? (has('x') ? 'y' : 'x') : 'lon', 'station positions: lon and lat, or x and y');
  const coords: MapCoords = hasXY && hasLonLat ? (opts.preferCoords ?? 'projected') : hasXY ? 'projected' : 'lonlat';

  const columns = numericColumns(table, canonical, resultsPath);
  const ids = table.rows.map((r) => r[iId] ?? '');
  const iFlags = table.header.indexOf('flags');
  const flags = table.rows.map((r) => (iFlags >= 0 ? (r[iFlags] ?? '').split(';').map((s) => s.trim()).filter((s) => s !== '') : []));
  const x = columns.get(coords === 'projected' ? 'x' : 'lon') ?? new Float64Array(ids.length).fill(NaN);
  const y = columns.get(coords === 'projected' ? 'y' : 'lat') ?? new Float64Array(ids.length).fill(NaN);

  const provPath = provenancePathFor(resultsPath);
  let provenance: Record<string, unknown> | undefined;
  if (provPath) {
    try {
      const parsed: unknown = JSON.parse(readFileSync(provPath, 'utf8'));
      if (typeof parsed === 'object' && parsed !== null && !Array.isArray(parsed)) provenance = parsed as Record<string, unknown>;
      else notes.push(`The provenance file ${provPath} does not hold a JSON object; it is not shown.`);
    } catch (e) {
      notes.push(`The provenance file ${provPath} could not be read (${(e as Error).message}); it is not shown.`);
    }
  } else {
    notes.push(`No provenance file (${basename(resultsPath)}.provenance.json) beside the results.`);
  }
  const version = provenance?.talusVersion;
  return {
    title: opts.title ?? `talus report: ${basename(resultsPath)}`,
    resultsPath,
    ...(provenance ? { provenance } : {}),
    stations: { ids, coords, x, y, columns, flags },
    density: densityView(table, mapping),
    notes,
    generator: typeof version === 'string' ? `Written by talus ${version}` : 'Written by talus',
  };
}

/** Every column whose non-empty cells are all numbers, by canonical name; empty cells → NaN. */
function numericColumns(table: CsvTable, canonical: ReadonlyMap<string, string>, file: string): Map<string, Float64Array> {
  const out = new Map<string, Float64Array>();
  table.header.forEach((name, c) => {
    if (name === 'flags') return;
    const a = new Float64Array(table.rows.length);
    for (let r = 0; r < table.rows.length; r++) {
      const cell = table.rows[r]?.[c] ?? '';
      if (cell === '') {
        a[r] = NaN;
        continue;
      }
      const v = Number(cell);
      if (!Number.isFinite(v)) {
        // a text column (ids, notes) is simply not numeric; a contract column must be
        if (/_(mgal|m)$/.test(canonical.get(name) ?? name)) {
          throw new InputError(`value "${cell}" is not a number: expected a decimal number or an empty cell`, { file, line: table.lines[r] ?? 0, station: table.rows[r]?.[0] ?? '', field: name });
        }
        return;
      }
      a[r] = v;
    }
    out.set(canonical.get(name) ?? name, a);
  });
  return out;
}

/** Nettleton and Parasnis estimates for the report, or notes saying why they are missing. */
function densityView(table: CsvTable, fullMapping: Readonly<Record<string, string>>): DensityView {
  const notes: string[] = [];
  const mapping: Partial<Record<DensityColumn, string>> = {};
  for (const [k, v] of Object.entries(fullMapping)) if (k in DENSITY_COLUMNS) mapping[k as DensityColumn] = v;
  let input;
  try {
    input = densityInputFromTable(table, mapping);
  } catch (e) {
    if (e instanceof InputError) return { notes: [`density estimates need the unit-density columns: ${e.message}`] };
    throw e;
  }
  if (input.skippedRows > 0) notes.push(`${input.skippedRows} stations with empty cells were left out of the density estimates.`);
  if (input.ids.length < MIN_DENSITY_STATIONS) {
    return { notes: [...notes, `only ${input.ids.length} stations have all values (at least ${MIN_DENSITY_STATIONS} needed)`] };
  }
  const nt = nettleton(input, { rangeKgM3: REPORT_DENSITY_RANGE });
  const p = parasnis(input);
  if (!nt.zeroCrossing) notes.push('The Nettleton correlation does not cross zero in the sweep: the estimate is the least |correlation|.');
  return {
    nettleton: { densityKgM3: nt.densityKgM3, stderrKgM3: nt.stderrKgM3, curve: nt.curve, minAbsCorr: nt.minAbsCorr, n: nt.n },
    parasnis: {
      densityKgM3: p.densityKgM3,
      stderrKgM3: p.stderrKgM3,
      r2: p.r2,
      n: p.n,
      interceptMgal: p.interceptMgal,
      downweighted: p.downweighted,
      points: p.points,
      slope: p.densityKgM3 / UNIT_DENSITY_KG_M3,
      xLabel: 'Bouguer − terrain term for 1000 kg/m³ (mGal)',
      yLabel: input.innerTcMgal ? 'Free-air anomaly + inner-zone TC (mGal)' : 'Free-air anomaly (mGal)',
    },
    notes,
  };
}
