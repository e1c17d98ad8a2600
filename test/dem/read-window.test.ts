/**
 * Windowed reads: only the cells overlapping the window, clipped to the file, row 0 north, for
 * striped, tiled and south-up files. Reference: GDAL's cell values (gdallocationinfo) and
 * geotransform (gdalinfo), via the whole-file read already checked in geotiff-fixtures.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { openDem } from '../../src/dem/geotiff-open.js';
import { isEmptyGrid, readDemWindow } from '../../src/dem/read-window.js';
import { stripRows } from '../../src/dem/strip-reader.js';
import { cellsInWindow } from '../../src/dem/window.js';
import { cellCentreX, cellCentreY } from '../../src/dem/grid.js';
import { fixturePath, fixtureResolver, gdalCells, gdalInfo } from './gdal-reference.js';

const open = (name: string) => openDem(fixturePath(name), { resolveCrs: fixtureResolver(name) });

/** GDAL value of file cell (col, row) of plain-f32, from the sampled set. */
function gdalValueMap(name: string): Map<string, number> {
  return new Map(gdalCells(name).map((c) => [`${c.col},${c.row}`, c.value]));
}

describe('readDemWindow', () => {
  it.each(['plain-f32', 'tiled-deflate-pred3', 'south-up', 'int16-lzw-pred2', 'cog'])(
    '%s: a window 10 x 7 cells inside the file returns exactly those cells, GDAL values bit for bit',
    async (name) => {
      const src = await open(name);
      const gt = gdalInfo('plain-f32').geoTransform!;
      // cells col 13..22, rows 9..15 of the north-up lattice; window edges a quarter cell inside
      const w = { minX: gt[0] + 13.25 * 30, maxX: gt[0] + 22.75 * 30, minY: gt[3] - 15.75 * 30, maxY: gt[3] - 9.25 * 30 };
      const g = await readDemWindow(src, w);
      expect([g.width, g.height, g.originX, g.originY]).toEqual([10, 7, gt[0] + 13 * 30, gt[3] - 9 * 30]);
      const ref = gdalValueMap(name);
      let compared = 0;
      for (let r = 0; r < g.height; r++) {
        for (let c = 0; c < g.width; c++) {
          const fileRow = src.southUp ? src.height - 1 - (r + 9) : r + 9;
          const v = ref.get(`${c + 13},${fileRow}`);
          if (v === undefined) continue;
          const want = v === -9999 ? NaN : Math.fround(v);
          expect(Object.is(g.data[r * g.width + c], want)).toBe(true);
          compared++;
        }
      }
      expect(compared).toBeGreaterThan(5);
    },
  );

  it('a window on exact cell edges takes no sliver row or column (1e-9 cell edge slack)', () => {
    const lattice = { width: 64, height: 48, originX: 400000, originY: 5100000, cellSizeX: 30, cellSizeY: 30 };
    expect(cellsInWindow(lattice, { minX: 400300, maxX: 400600, minY: 5099100, maxY: 5099700 })).toEqual({ col0: 10, col1: 20, row0: 10, row1: 30 });
    // 0.1 / 30 = 3.3e-3 cell beyond an edge is real overlap
    expect(cellsInWindow(lattice, { minX: 400299.9, maxX: 400600.1, minY: 5099100, maxY: 5099700 })).toEqual({ col0: 9, col1: 21, row0: 10, row1: 30 });
  });

  it('a window partly outside the file is clipped to the file', async () => {
    const src = await open('plain-f32');
    const g = await readDemWindow(src, { minX: 399000, maxX: 400100, minY: 5099950, maxY: 5200000 });
    expect([g.width, g.height, g.originX, g.originY]).toEqual([4, 2, 400000, 5100000]);
    expect(cellCentreX(g, 0)).toBe(400015);
    expect(cellCentreY(g, 0)).toBe(5099985);
  });

  it('a window that misses the file gives an empty grid, flagged by isEmptyGrid', async () => {
    const src = await open('plain-f32');
    const g = await readDemWindow(src, { minX: 500000, maxX: 510000, minY: 5099000, maxY: 5099500 });
    expect(isEmptyGrid(g)).toBe(true);
    expect(g.data.length).toBe(0);
  });

  it('a window with min > max or NaN is an InputError', async () => {
    const src = await open('plain-f32');
    await expect(readDemWindow(src, { minX: 401000, maxX: 400000, minY: 0, maxY: 1 })).rejects.toThrow(/min > max/);
    await expect(readDemWindow(src, { minX: NaN, maxX: 400000, minY: 0, maxY: 1 })).rejects.toThrow(/non-finite/);
  });

  it('strips are whole multiples of the block height (tile-aligned reads)', async () => {
    const tiled = await open('tiled-deflate-pred3');
    expect(stripRows(tiled, 64) % 16).toBe(0);
    const striped = await open('int16-lzw-pred2');
    expect(stripRows(striped, 64) % 8).toBe(0);
  });
});
