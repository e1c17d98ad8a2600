/**
 * readDemWindow: the cells of a DEM that overlap a window, as a DemGrid (row 0 north, metres,
 * NaN for nodata, SharedArrayBuffer-backed). Peak memory is the grid plus one strip.
 */
import type { DemGrid } from './grid.js';
import { sharedFloat32 } from './grid.js';
import type { DemSource } from './dem-source.js';
import { readStrips } from './strip-reader.js';
import { cellsInWindow, isEmptyRange } from './window.js';
import type { CellRange, DemWindow } from './window.js';

/** True for the grid readDemWindow returns when the window misses the file. */
export function isEmptyGrid(g: DemGrid): boolean {
  return g.width === 0 || g.height === 0;
}

/** Where a strip goes: `range`'s first cell lands at (row0, col0) of a row-major grid `width` wide. */
export interface StripTarget {
  data: Float32Array;
  width: number;
  col0: number;
  row0: number;
  /** Write only cells that are still NaN (so one tile's nodata never hides another's data). */
  onlyIntoNaN?: boolean;
}

/**
 * Copies stored samples of `range` into `target` as metres (row 0 north), turning the nodata
 * value and NaN samples into NaN. With a scale of 1 the float32 value is copied bit for bit.
 */
export function placeStrip(
  src: DemSource,
  range: CellRange,
  target: StripTarget,
  samples: ArrayLike<number>,
  fileRow0: number,
  nRows: number,
): void {
  const ncols = range.col1 - range.col0;
  const nodata = src.nodata ?? NaN;
  const nodataF32 = Math.fround(nodata);
  const scale = src.elevationScaleM;
  const out = target.data;
  const guard = target.onlyIntoNaN === true;
  for (let i = 0; i < nRows; i++) {
    const fileRow = fileRow0 + i;
    const gridRow = src.southUp ? src.height - 1 - fileRow : fileRow;
    const o = (gridRow - range.row0 + target.row0) * target.width + target.col0;
    const s = i * ncols;
    for (let c = 0; c < ncols; c++) {
      const v = samples[s + c] as number;
      // v !== v: NaN samples are nodata whatever the tag says
      const z = v === nodata || v === nodataF32 || v !== v ? NaN : v * scale;
      if (!guard || out[o + c] !== out[o + c]) out[o + c] = z;
    }
  }
}

/**
 * Reads the cells overlapping `window` (DEM CRS units; default: the whole file), clipped to the
 * file. When the window misses the file the result has width 0 or height 0 and an empty `data`
 * (see isEmptyGrid); the caller decides whether that is an error.
 */
export async function readDemWindow(src: DemSource, window?: DemWindow): Promise<DemGrid> {
  const range = cellsInWindow(src, window);
  const empty = isEmptyRange(range);
  const width = empty ? 0 : range.col1 - range.col0;
  const height = empty ? 0 : range.row1 - range.row0;
  const data = sharedFloat32(width * height);
  if (!empty) {
    const target = { data, width, col0: 0, row0: 0 };
    await readStrips(src, range, (s, y, n) => placeStrip(src, range, target, s, y, n));
  }
  return {
    width,
    height,
    originX: src.originX + range.col0 * src.cellSizeX,
    originY: src.originY - range.row0 * src.cellSizeY,
    cellSizeX: src.cellSizeX,
    cellSizeY: src.cellSizeY,
    data,
    crs: src.crs,
    source: src.path,
  };
}
