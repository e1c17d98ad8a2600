/**
 * The DEMs of one share of a cluster run (`--shard K/N`). The terrain sums of a station must come
 * out bit for bit as in the whole run, and they depend on the pyramid's cell lattice and on the
 * order of the walk, both fixed by the grid's origin and size. So a share keeps the whole run's
 * grid (same origin, same size: the stations' extent plus the radius) but reads from the file only
 * the cells within SHARE_PAD of its own stations; the rest stays NaN. Every cell the walk
 * evaluates for a share station, and every fine cell the far-zone weights of those cells look at,
 * lies inside that pad, so the share's stations see exactly the whole run's data. The file I/O
 * and decoding shrink with the share; the grid's memory does not (see DEVELOPERS.md).
 */
import type { DemGrid } from '../dem/grid.js';
import { sharedFloat32 } from '../dem/grid.js';
import type { DemOpenOptions, DemSource } from '../dem/dem-source.js';
import { openDem } from '../dem/geotiff-open.js';
import { loadDemMosaic } from '../dem/mosaic.js';
import { readDemWindow, isEmptyGrid } from '../dem/read-window.js';
import { cellsInWindow, type DemWindow, type GridLattice } from '../dem/window.js';
import type { StationTable } from '../stations/table.js';
import { InputError } from '../errors.js';
import { windowAround } from './dem-window.js';
import { WGS84_LONLAT, type LoadedDem } from './load-dems.js';
import { resolveCrs } from '../stations/crs-registry.js';
import { transformArrays } from '../stations/transform.js';
import type { CrsInfo } from '../dem/grid.js';
import { cellSizeM } from './run-provenance.js';

/** A share's DEM: the whole run's grid with only the share's part read, and that part's size. */
export interface ShardDem extends LoadedDem {
  read: { width: number; height: number; originX: number; originY: number };
}

/**
 * Distance from a share station within which its DEM cells are read, m: the radius, plus the
 * largest cell the walk evaluates across the radius (the boundary cell, 5 % of the radius, or
 * one DEM cell when coarser; its diagonal), plus two cells of lattice rounding.
 */
export function sharePadM(radiusM: number, maxCellM: number): number {
  return radiusM + Math.SQRT2 * Math.max(0.05 * radiusM, maxCellM) + 2 * maxCellM;
}

/** Largest cell side of a DEM file, m, near latDeg (from its header). */
export async function demCellM(path: string, opts: DemOpenOptions, latDeg: number): Promise<number> {
  const s = await openDem(path, opts);
  return cellSizeM(latticeGrid(s, s, new Float32Array(0)), latDeg);
}

function latticeGrid(l: GridLattice, s: DemSource, data: Float32Array): DemGrid {
  return { width: l.width, height: l.height, originX: l.originX, originY: l.originY, cellSizeX: s.cellSizeX, cellSizeY: s.cellSizeY, data, crs: s.crs, source: s.path };
}

/** The lattice a whole run's window gives: one file (readDemWindow) or a mosaic (loadDemMosaic). */
async function wholeLattice(paths: string[], first: DemSource, window: DemWindow, opts: DemOpenOptions): Promise<GridLattice> {
  let ref: GridLattice = first;
  if (paths.length > 1) {
    const tiles: DemSource[] = [first];
    for (const p of paths.slice(1)) tiles.push(await openDem(p, opts));
    const col0 = tiles.map((t) => Math.round((t.originX - first.originX) / first.cellSizeX));
    const row0 = tiles.map((t) => Math.round((first.originY - t.originY) / first.cellSizeY));
    const c0 = Math.min(...col0);
    const r0 = Math.min(...row0);
    ref = {
      width: Math.max(...tiles.map((t, i) => (col0[i] as number) + t.width)) - c0,
      height: Math.max(...tiles.map((t, i) => (row0[i] as number) + t.height)) - r0,
      originX: first.originX + c0 * first.cellSizeX,
      originY: first.originY - r0 * first.cellSizeY,
      cellSizeX: first.cellSizeX,
      cellSizeY: first.cellSizeY,
    };
  }
  const r = cellsInWindow(ref, window);
  return {
    width: Math.max(0, r.col1 - r.col0),
    height: Math.max(0, r.row1 - r.row0),
    originX: ref.originX + r.col0 * ref.cellSizeX,
    originY: ref.originY - r.row0 * ref.cellSizeY,
    cellSizeX: ref.cellSizeX,
    cellSizeY: ref.cellSizeY,
  };
}

/**
 * Loads a DEM for share `share` (1 = station of this share) of a run whose stations are `active`.
 * Station positions and their checks cover every active station, as in the whole run.
 */
export async function loadShardDem(
  paths: string[],
  table: StationTable,
  active: Uint8Array,
  share: Uint8Array,
  radiusM: number,
  padM: number,
  opts: DemOpenOptions,
  role: string,
): Promise<ShardDem> {
  if (paths.length === 0) throw new InputError(`no ${role} given`);
  const first = await openDem(paths[0] as string, opts);
  const whole = stationsIn(first.crs, table, active);
  const wholeWindow = windowAround(first.crs, whole.x, whole.y, table.latDeg, radiusM);
  const lattice = await wholeLattice(paths, first, wholeWindow, opts);
  const sx = whole.x.map((v, i) => (share[i] === 1 && active[i] === 1 ? v : NaN));
  const sy = whole.y.map((v, i) => (share[i] === 1 && active[i] === 1 ? v : NaN));
  const data = sharedFloat32(lattice.width * lattice.height).fill(NaN);
  const grid = latticeGrid(lattice, first, data);
  let part: DemGrid | null = null;
  let gaps: string[] = [];
  let sources = [first];
  if (sx.some((v) => Number.isFinite(v))) {
    // the share's pad, inside the whole run's window (cells outside it are not in the grid)
    const pad = windowAround(first.crs, sx, sy, table.latDeg, padM);
    const window = {
      minX: Math.max(pad.minX, wholeWindow.minX),
      minY: Math.max(pad.minY, wholeWindow.minY),
      maxX: Math.min(pad.maxX, wholeWindow.maxX),
      maxY: Math.min(pad.maxY, wholeWindow.maxY),
    };
    if (paths.length === 1) part = await readDemWindow(first, window);
    else ({ grid: part, gaps, sources } = await loadDemMosaic(paths, window, opts));
    embed(part, grid);
  }
  if (isEmptyGrid(grid)) {
    throw new InputError(`${role} ${paths.join(', ')} does not overlap the stations or their ${(radiusM / 1000).toFixed(1)} km correction area`);
  }
  const read = part ? { width: part.width, height: part.height, originX: part.originX, originY: part.originY } : { width: 0, height: 0, originX: grid.originX, originY: grid.originY };
  return { grid, sources, gaps, x: whole.x, y: whole.y, read };
}

/** Station lon/lat (WGS84) to a DEM's CRS for the active stations, as loadDem places them (NaN elsewhere). */
function stationsIn(crs: CrsInfo, table: StationTable, active: Uint8Array): { x: Float64Array; y: Float64Array } {
  const idx: number[] = [];
  for (let i = 0; i < table.ids.length; i++) if (active[i] === 1) idx.push(i);
  const lon = Float64Array.from(idx, (i) => table.lonDeg[i] as number);
  const lat = Float64Array.from(idx, (i) => table.latDeg[i] as number);
  const where = { file: table.source, lines: idx.map((i) => table.lines[i] as number), ids: idx.map((i) => table.ids[i] as string) };
  const t = transformArrays(resolveCrs(WGS84_LONLAT), crs, lon, lat, where);
  const x = new Float64Array(table.ids.length).fill(NaN);
  const y = new Float64Array(table.ids.length).fill(NaN);
  idx.forEach((i, k) => {
    x[i] = t.x[k] as number;
    y[i] = t.y[k] as number;
  });
  return { x, y };
}

/** Copies the cells of `part` into `grid` (same lattice), clipped to `grid`. */
function embed(part: DemGrid, grid: DemGrid): void {
  const dc = Math.round((part.originX - grid.originX) / grid.cellSizeX);
  const dr = Math.round((grid.originY - part.originY) / grid.cellSizeY);
  for (let r = 0; r < part.height; r++) {
    const gr = r + dr;
    if (gr < 0 || gr >= grid.height) continue;
    for (let c = 0; c < part.width; c++) {
      const gc = c + dc;
      if (gc < 0 || gc >= grid.width) continue;
      grid.data[gr * grid.width + gc] = part.data[r * part.width + c] as number;
    }
  }
}
