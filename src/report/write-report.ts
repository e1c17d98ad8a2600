/**
 * writeReport: results CSV (+ provenance, + optional DEM for shaded relief) → one self-contained
 * HTML file. Used by `talus report` and by `talus reduce --report`.
 */
import { writeFileSync } from 'node:fs';
import { InputError, isInputError } from '../errors.js';
import { openDem } from '../dem/geotiff-open.js';
import { isEmptyGrid, readDemWindow } from '../dem/read-window.js';
import { buildReport } from './build-report.js';
import { loadReportData } from './load-report-data.js';
import type { ReportData } from './report-data.js';
import { reliefBackground } from './relief-image.js';
import { extentOf } from './charts/chart-frame.js';
import { resolveCrs } from '../stations/crs-registry.js';
import { makeTransform } from '../stations/transform.js';

export interface WriteReportOptions {
  /** A GeoTIFF DEM to draw as shaded relief under the station maps. */
  demPath?: string;
  /** canonical name → column name in the results file (the parsed --columns of talus reduce). */
  columns?: Readonly<Record<string, string>>;
  title?: string;
  /** Width limit of the relief image, px (default 600). */
  reliefMaxWidthPx?: number;
}

export interface WriteReportResult {
  outPath: string;
  bytes: number;
  notes: readonly string[];
}

/** Margin added around the stations' extent when reading the relief window (fraction of the larger span). */
const RELIEF_MARGIN = 0.75;

export async function writeReport(resultsPath: string, outPath: string, opts: WriteReportOptions = {}): Promise<WriteReportResult> {
  let data: ReportData;
  const notes: string[] = [];
  if (opts.demPath !== undefined) {
    const src = await openDem(opts.demPath);
    const prefer = src.crs.kind === 'geographic' ? 'lonlat' : 'projected';
    data = loadReportData(resultsPath, { ...(opts.columns ? { mapping: opts.columns } : {}), preferCoords: prefer, ...(opts.title ? { title: opts.title } : {}) });
    const want = src.crs.kind === 'geographic' ? 'lonlat' : 'projected';
    if (want === 'projected' && data.stations.coords === 'lonlat') {
      // stations given in lon/lat over a projected DEM: map them in the DEM's CRS
      const toDem = makeTransform(resolveCrs('EPSG:4326'), src.crs);
      const n = data.stations.x.length;
      const x = new Float64Array(n).fill(NaN);
      const y = new Float64Array(n).fill(NaN);
      for (let i = 0; i < n; i++) {
        const lon = data.stations.x[i] as number;
        const lat = data.stations.y[i] as number;
        if (!(Number.isFinite(lon) && Number.isFinite(lat))) continue;
        const p = toDem(lon, lat);
        x[i] = p[0];
        y[i] = p[1];
      }
      data = { ...data, stations: { ...data.stations, coords: 'projected', x, y } };
    }
    if (data.stations.coords !== want) {
      notes.push(`Shaded relief left out: the DEM is in ${src.crs.label} (${src.crs.kind}) but the stations are mapped in ${data.stations.coords === 'lonlat' ? 'lon/lat' : 'x/y'}.`);
    } else {
      const [x0, x1] = extentOf(data.stations.x);
      const [y0, y1] = extentOf(data.stations.y);
      const aspect = want === 'lonlat' ? Math.max(0.05, Math.cos((((y0 + y1) / 2) * Math.PI) / 180)) : 1;
      const half = Math.max((x1 - x0) * aspect, y1 - y0, 1e-6) * RELIEF_MARGIN;
      const cx = (x0 + x1) / 2;
      const cy = (y0 + y1) / 2;
      const window = { minX: cx - half / aspect, maxX: cx + half / aspect, minY: cy - half, maxY: cy + half };
      const grid = await readDemWindow(src, window);
      const relief = isEmptyGrid(grid)
        ? undefined
        : reliefBackground(grid, { xMin: window.minX, xMax: window.maxX, yMin: window.minY, yMax: window.maxY, maxWidthPx: opts.reliefMaxWidthPx ?? 600 });
      if (relief) data = { ...data, relief };
      else notes.push(`Shaded relief left out: the DEM ${opts.demPath} does not cover the stations.`);
    }
  } else {
    data = loadReportData(resultsPath, { ...(opts.columns ? { mapping: opts.columns } : {}), ...(opts.title ? { title: opts.title } : {}) });
    notes.push('No DEM given (--dem): the maps have no shaded-relief background.');
  }
  data = { ...data, notes: [...data.notes, ...notes] };
  const html = buildReport(data);
  try {
    writeFileSync(outPath, html, 'utf8');
  } catch (e) {
    if (isInputError(e)) throw e;
    throw new InputError(`cannot write the report (${(e as NodeJS.ErrnoException).code ?? String(e)}): expected a writable path`, { file: outPath });
  }
  return { outPath, bytes: Buffer.byteLength(html, 'utf8'), notes: data.notes };
}
