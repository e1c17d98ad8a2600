/**
 * Opens the run's DEMs: the fine DEM (one file, or tiles of one mosaic) and the optional
 * far-zone DEM, each read only over the stations' extent plus the correction radius, with
 * the stations' positions in each DEM's CRS.
 */
import type { CrsInfo, DemGrid } from '../dem/grid.js';
import type { DemOpenOptions, DemSource } from '../dem/dem-source.js';
import { openDem } from '../dem/geotiff-open.js';
import { loadDemMosaic } from '../dem/mosaic.js';
import { readDemWindow, isEmptyGrid } from '../dem/read-window.js';
import { resolveCrs } from '../stations/crs-registry.js';
import { transformArrays } from '../stations/transform.js';
import type { StationTable } from '../stations/table.js';
import { InputError } from '../errors.js';
import { windowAround } from './dem-window.js';

export interface LoadedDem {
  grid: DemGrid;
  sources: DemSource[];
  gaps: string[];
  /** Station positions in this DEM's CRS (NaN for stations that could not be placed). */
  x: Float64Array;
  y: Float64Array;
}

export const WGS84_LONLAT = 'EPSG:4326';

/** Station lon/lat (WGS84) to a DEM's CRS; identity when the DEM is WGS84 lon/lat. */
function stationsIn(crs: CrsInfo, table: StationTable, active: Uint8Array): { x: Float64Array; y: Float64Array } {
  const wgs = resolveCrs(WGS84_LONLAT);
  const n = table.ids.length;
  const lon = new Float64Array(n);
  const lat = new Float64Array(n);
  const ids: string[] = [];
  const lines: number[] = [];
  const idx: number[] = [];
  for (let i = 0; i < n; i++) {
    if (active[i] !== 1) continue;
    lon[idx.length] = table.lonDeg[i] as number;
    lat[idx.length] = table.latDeg[i] as number;
    ids.push(table.ids[i] as string);
    lines.push(table.lines[i] as number);
    idx.push(i);
  }
  const t = transformArrays(wgs, crs, lon.subarray(0, idx.length), lat.subarray(0, idx.length), { file: table.source, lines, ids });
  const x = new Float64Array(n).fill(NaN);
  const y = new Float64Array(n).fill(NaN);
  for (let k = 0; k < idx.length; k++) {
    x[idx[k] as number] = t.x[k] as number;
    y[idx[k] as number] = t.y[k] as number;
  }
  return { x, y };
}

export async function loadDem(
  paths: string[],
  table: StationTable,
  active: Uint8Array,
  radiusM: number,
  opts: DemOpenOptions,
  role: string,
): Promise<LoadedDem> {
  if (paths.length === 0) throw new InputError(`no ${role} given`);
  const first = await openDem(paths[0] as string, opts);
  const { x, y } = stationsIn(first.crs, table, active);
  const window = windowAround(first.crs, x, y, table.latDeg, radiusM);
  let grid: DemGrid;
  let sources: DemSource[];
  let gaps: string[] = [];
  if (paths.length === 1) {
    grid = await readDemWindow(first, window);
    sources = [first];
  } else {
    const mosaic = await loadDemMosaic(paths, window, opts);
    grid = mosaic.grid;
    sources = mosaic.sources;
    gaps = mosaic.gaps;
  }
  if (isEmptyGrid(grid)) {
    throw new InputError(`${role} ${paths.join(', ')} does not overlap the stations or their ${(radiusM / 1000).toFixed(1)} km correction area`);
  }
  return { grid, sources, gaps, x, y };
}
