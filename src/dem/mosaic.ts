/**
 * loadDemMosaic: several GeoTIFF tiles of one DEM (same CRS, same spacing, one lattice) merged
 * into one grid over a window. Cells outside every tile are NaN and are reported as gaps.
 * A finer DEM and a coarser far-zone DEM are separate mosaics: the engine combines them.
 */
import { InputError } from '../errors.js';
import type { DemGrid } from './grid.js';
import { sharedFloat32 } from './grid.js';
import type { DemOpenOptions, DemSource } from './dem-source.js';
import { openDem } from './geotiff-open.js';
import { findGaps } from './mosaic-gaps.js';
import { placeStrip } from './read-window.js';
import { readStrips } from './strip-reader.js';
import { cellsInWindow, isEmptyRange } from './window.js';
import type { CellRange, DemWindow, GridLattice } from './window.js';

/** Tiles must share spacing and lattice to this fraction of a cell. */
export const MOSAIC_ALIGN_TOL_CELLS = 1e-6;

export interface DemMosaic {
  /** The merged grid (row 0 north, metres, NaN = nodata or no tile); empty when the window misses every tile. */
  grid: DemGrid;
  /** One line per uncovered rectangle inside the tiles' bounding box, then a count; [] when none. */
  gaps: string[];
  /** The opened tiles, in the order given. */
  sources: DemSource[];
}

function checkSameMosaic(ref: DemSource, t: DemSource): void {
  const both = `${ref.path} and ${t.path}`;
  if (ref.crs.proj4 !== t.crs.proj4 || ref.crs.label !== t.crs.label) {
    throw new InputError(`DEM tiles ${both} have different CRSs (${ref.crs.label} vs ${t.crs.label}); expected one CRS for a mosaic`);
  }
  const tolX = MOSAIC_ALIGN_TOL_CELLS * ref.cellSizeX;
  const tolY = MOSAIC_ALIGN_TOL_CELLS * ref.cellSizeY;
  if (!(Math.abs(ref.cellSizeX - t.cellSizeX) <= tolX && Math.abs(ref.cellSizeY - t.cellSizeY) <= tolY)) {
    throw new InputError(
      `DEM tiles ${both} have different spacings (${ref.cellSizeX} x ${ref.cellSizeY} vs ${t.cellSizeX} x ${t.cellSizeY}); ` +
        'expected equal cells for a mosaic (load a coarser DEM as a separate far-zone DEM)',
    );
  }
  const offX = (t.originX - ref.originX) / ref.cellSizeX;
  const offY = (ref.originY - t.originY) / ref.cellSizeY;
  if (!(Math.abs(offX - Math.round(offX)) <= MOSAIC_ALIGN_TOL_CELLS && Math.abs(offY - Math.round(offY)) <= MOSAIC_ALIGN_TOL_CELLS)) {
    throw new InputError(
      `DEM tiles ${both} are not on one cell lattice (offset ${offX} x ${offY} cells); expected whole-cell offsets within ${MOSAIC_ALIGN_TOL_CELLS} cell`,
    );
  }
}

/** A tile's cells in the reference lattice (integer offsets from the first tile). */
function tileCells(ref: DemSource, t: DemSource): CellRange {
  const col0 = Math.round((t.originX - ref.originX) / ref.cellSizeX);
  const row0 = Math.round((ref.originY - t.originY) / ref.cellSizeY);
  return { col0, col1: col0 + t.width, row0, row1: row0 + t.height };
}

function fmt(v: number): string {
  return Number(v.toPrecision(12)).toString();
}

/**
 * Opens `paths`, checks they form one mosaic, and reads the cells overlapping `window` (default:
 * the tiles' bounding box) into one grid. The window is clipped to the tiles' bounding box.
 */
export async function loadDemMosaic(paths: readonly string[], window: DemWindow | undefined, opts: DemOpenOptions = {}): Promise<DemMosaic> {
  if (paths.length === 0) throw new InputError('no DEM files given; expected at least one GeoTIFF');
  const sources: DemSource[] = [];
  for (const p of paths) sources.push(await openDem(p, opts));
  const ref = sources[0] as DemSource;
  for (const t of sources.slice(1)) checkSameMosaic(ref, t);
  const cells = sources.map((t) => tileCells(ref, t));
  const c0 = Math.min(...cells.map((c) => c.col0));
  const r0 = Math.min(...cells.map((c) => c.row0));
  const union: GridLattice = {
    width: Math.max(...cells.map((c) => c.col1)) - c0,
    height: Math.max(...cells.map((c) => c.row1)) - r0,
    originX: ref.originX + c0 * ref.cellSizeX,
    originY: ref.originY - r0 * ref.cellSizeY,
    cellSizeX: ref.cellSizeX,
    cellSizeY: ref.cellSizeY,
  };
  const out = cellsInWindow(union, window);
  const empty = isEmptyRange(out);
  const width = empty ? 0 : out.col1 - out.col0;
  const height = empty ? 0 : out.row1 - out.row0;
  const data = sharedFloat32(width * height).fill(NaN);
  // tile ranges in output-grid indices
  const inOut = cells.map((c) => ({ col0: c.col0 - c0 - out.col0, col1: c.col1 - c0 - out.col0, row0: c.row0 - r0 - out.row0, row1: c.row1 - r0 - out.row0 }));
  for (let k = 0; k < sources.length && !empty; k++) {
    const t = sources[k] as DemSource;
    const o = inOut[k] as CellRange;
    const local: CellRange = {
      col0: Math.max(0, -o.col0), col1: Math.min(t.width, width - o.col0),
      row0: Math.max(0, -o.row0), row1: Math.min(t.height, height - o.row0),
    };
    if (isEmptyRange(local)) continue;
    const target = { data, width, col0: o.col0 + local.col0, row0: o.row0 + local.row0, onlyIntoNaN: true };
    await readStrips(t, local, (s, y, n) => placeStrip(t, local, target, s, y, n));
  }
  const originX = union.originX + out.col0 * ref.cellSizeX;
  const originY = union.originY - out.row0 * ref.cellSizeY;
  const gapReport = empty ? { uncoveredCells: 0, rects: [] } : findGaps(width, height, inOut);
  const gaps = gapReport.rects.map(
    (r) =>
      `no DEM between x=${fmt(originX + r.col0 * ref.cellSizeX)} and x=${fmt(originX + r.col1 * ref.cellSizeX)}, ` +
      `y=${fmt(originY - r.row1 * ref.cellSizeY)} and y=${fmt(originY - r.row0 * ref.cellSizeY)} ` +
      `(${r.col1 - r.col0} x ${r.row1 - r.row0} cells)`,
  );
  if (gapReport.uncoveredCells > 0) {
    gaps.push(`${gapReport.uncoveredCells} of ${width * height} cells inside the DEM tiles' bounding box are covered by no tile`);
  }
  const grid: DemGrid = {
    width, height, originX, originY, cellSizeX: ref.cellSizeX, cellSizeY: ref.cellSizeY, data, crs: ref.crs,
    source: paths.join(', '),
  };
  return { grid, gaps, sources };
}
