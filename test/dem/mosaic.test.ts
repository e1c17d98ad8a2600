/**
 * Mosaics of DEM tiles cut from one grid with gdal_translate -srcwin (make-fixtures.sh): the
 * merged grid must equal the uncut file's GDAL values, with NaN and a gap report where the
 * tiles leave a 4-column hole (columns 32..35: x = 400960..401080).
 */
import { describe, expect, it } from 'vitest';
import { loadDemMosaic } from '../../src/dem/mosaic.js';
import { findGaps } from '../../src/dem/mosaic-gaps.js';
import { fixturePath, gdalCells } from './gdal-reference.js';

const TILES = ['mosaic-west', 'mosaic-east-north', 'mosaic-east-south'].map(fixturePath);

describe('loadDemMosaic', () => {
  it('three tiles merge into the original 64 x 48 grid; the gap columns are NaN', async () => {
    const { grid, gaps } = await loadDemMosaic(TILES, undefined);
    expect([grid.width, grid.height, grid.originX, grid.originY]).toEqual([64, 48, 400000, 5100000]);
    expect(grid.data.buffer).toBeInstanceOf(SharedArrayBuffer);
    for (const { col, row, value } of gdalCells('plain-f32')) {
      const got = grid.data[row * 64 + col];
      const want = col >= 32 && col < 36 ? NaN : value === -9999 ? NaN : Math.fround(value);
      expect(Object.is(got, want), `col ${col} row ${row}`).toBe(true);
    }
    expect(gaps).toEqual([
      'no DEM between x=400960 and x=401080, y=5098560 and y=5100000 (4 x 48 cells)',
      '192 of 3072 cells inside the DEM tiles\' bounding box are covered by no tile',
    ]);
  });

  it('a window is clipped to the tiles and reports only the gap inside it', async () => {
    // x 400900..401200 = columns 30..39 (400900 is a cell edge); y 5099000..5099500 = rows 16..33
    const { grid, gaps } = await loadDemMosaic(TILES, { minX: 400900, maxX: 401200, minY: 5099000, maxY: 5099500 });
    expect([grid.width, grid.height, grid.originX, grid.originY]).toEqual([10, 18, 400900, 5099520]);
    expect(gaps[0]).toBe('no DEM between x=400960 and x=401080, y=5098980 and y=5099520 (4 x 18 cells)');
  });

  it('a window inside one tile has no gaps', async () => {
    const { grid, gaps } = await loadDemMosaic(TILES, { minX: 400000, maxX: 400300, minY: 5099000, maxY: 5099500 });
    expect(gaps).toEqual([]);
    expect(Number.isNaN(grid.data[0])).toBe(false);
  });

  it('refuses tiles off the lattice, with other spacing, or in another CRS, naming both files', async () => {
    await expect(loadDemMosaic([TILES[0]!, fixturePath('mosaic-misaligned')], undefined)).rejects.toThrow(
      /mosaic-west\.tif and .*mosaic-misaligned\.tif are not on one cell lattice \(offset 36\.5 x 0 cells\)/,
    );
    await expect(loadDemMosaic([TILES[0]!, fixturePath('mosaic-coarse')], undefined)).rejects.toThrow(
      /mosaic-west\.tif and .*mosaic-coarse\.tif have different spacings \(30 x 30 vs 60 x 60\)/,
    );
    await expect(loadDemMosaic([TILES[0]!, fixturePath('geographic-4326')], undefined)).rejects.toThrow(
      /mosaic-west\.tif and .*geographic-4326\.tif have different CRSs/,
    );
  });

  it('findGaps merges uncovered blocks into rectangles and counts cells', () => {
    const r = findGaps(10, 10, [{ col0: 0, col1: 5, row0: 0, row1: 10 }, { col0: 5, col1: 10, row0: 0, row1: 4 }]);
    expect(r.uncoveredCells).toBe(30);
    expect(r.rects).toEqual([{ col0: 5, col1: 10, row0: 4, row1: 10 }]);
    expect(findGaps(4, 4, [{ col0: -2, col1: 8, row0: -1, row1: 9 }])).toEqual({ uncoveredCells: 0, rects: [] });
  });
});
