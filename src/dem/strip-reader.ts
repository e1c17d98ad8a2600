/**
 * Reads a cell range of a DEM's band 1 as tile-aligned row strips, one strip in memory at a
 * time. geotiff.js decodes whole tiles, so strips start and end on block rows (tile rows or
 * TIFF strips); their height is a multiple of the block height near STRIP_TARGET_BYTES.
 */
import type { DemSource } from './dem-source.js';
import { withTiff } from './geotiff-open.js';
import type { CellRange } from './window.js';

/** Decoded bytes per strip to aim for: large enough to amortise per-call cost, small next to the grid. */
export const STRIP_TARGET_BYTES = 16 * 1024 * 1024;

const BYTES_PER_SAMPLE = { Int16: 2, UInt16: 2, Int32: 4, Float32: 4, Float64: 8 } as const;

/** Rows per strip for a read `ncols` wide. */
export function stripRows(src: DemSource, ncols: number): number {
  const block = src.tiling.kind === 'tiled' ? src.tiling.tileHeight : src.tiling.rowsPerStrip;
  const rowBytes = ncols * BYTES_PER_SAMPLE[src.dataType];
  return block * Math.max(1, Math.floor(STRIP_TARGET_BYTES / (rowBytes * block)));
}

/**
 * Calls `onStrip(samples, fileRow0, nRows)` for consecutive strips covering `range` (stored
 * values, not yet converted: nodata and units are the caller's). `fileRow0` counts rows as
 * stored in the file; for a south-up file that is from the south.
 */
export async function readStrips(
  src: DemSource,
  range: CellRange,
  onStrip: (samples: ArrayLike<number>, fileRow0: number, nRows: number) => void,
  opts: { cache?: boolean } = {},
): Promise<void> {
  const ncols = range.col1 - range.col0;
  if (ncols <= 0 || range.row1 <= range.row0) return;
  const fileRow0 = src.southUp ? src.height - range.row1 : range.row0;
  const fileRow1 = src.southUp ? src.height - range.row0 : range.row1;
  const step = stripRows(src, ncols);
  await withTiff(src.path, async (tiff) => {
    tiff.cache = opts.cache === true;
    const img = await tiff.getImage(0);
    for (let y = fileRow0; y < fileRow1; ) {
      const yEnd = Math.min(fileRow1, (Math.floor(y / step) + 1) * step);
      const samples = await img.readRasters({ window: [range.col0, y, range.col1, yEnd], samples: [0], interleave: true });
      onStrip(samples as unknown as ArrayLike<number>, y, yEnd - y);
      y = yEnd;
    }
  });
}
