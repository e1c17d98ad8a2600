/**
 * Every readable DEM fixture, read by talus and compared with GDAL's view of the same file
 * (gdalinfo -json: size, geotransform, nodata, type, compression, block size, overviews;
 * gdallocationinfo -valonly: cell values).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { openDem } from '../../src/dem/geotiff-open.js';
import { readDemWindow } from '../../src/dem/read-window.js';
import { assertClose } from '../helpers/assert-close.js';
import { crsFromProjString, fixturePath, fixtureResolver, gdalCells, gdalInfo } from './gdal-reference.js';

const READABLE = [
  'plain-f32', 'tiled-deflate-pred3', 'int16-lzw-pred2', 'uint16', 'int32-deflate', 'float64', 'packbits',
  'zstd-pred3', 'cog', 'bigtiff', 'pixel-is-point', 'nan-nodata', 'south-up', 'feet-elevations', 'ftus-crs',
  'geographic-4326', 'national-3794', 'mosaic-west', 'mosaic-east-north', 'mosaic-east-south',
  'mosaic-misaligned', 'mosaic-coarse',
];

const COMPRESSION_NAMES: Record<string, string> = { DEFLATE: 'deflate', LZW: 'lzw', PACKBITS: 'packbits', ZSTD: 'zstd' };

/** GDAL's geotransform in the DemGrid convention (north edge origin, positive cell sizes). */
function gdalLattice(name: string): { originX: number; originY: number; cellSizeX: number; cellSizeY: number; southUp: boolean } {
  const info = gdalInfo(name);
  const [x0, dx, , y0, , dy] = info.geoTransform as number[] as [number, number, number, number, number, number];
  const southUp = dy > 0;
  return { originX: x0, originY: southUp ? y0 + info.size[1] * dy : y0, cellSizeX: dx, cellSizeY: Math.abs(dy), southUp };
}

describe.each(READABLE)('%s matches GDAL', (name) => {
  const info = gdalInfo(name);
  const open = () => openDem(fixturePath(name), { resolveCrs: fixtureResolver(name) });

  it('size, georeferencing (to 1e-9 cell) and pixel convention match gdalinfo', async () => {
    const src = await open();
    expect([src.width, src.height]).toEqual(info.size);
    const ref = gdalLattice(name);
    // 1e-9 of a cell: both sides compute the same double arithmetic; this allows last-bit rounding
    const tol = { abs: 1e-9 * ref.cellSizeX };
    assertClose(src.originX, ref.originX, tol, 'originX');
    assertClose(src.originY, ref.originY, { abs: 1e-9 * ref.cellSizeY }, 'originY');
    assertClose(src.cellSizeX, ref.cellSizeX, tol, 'cellSizeX');
    assertClose(src.cellSizeY, ref.cellSizeY, { abs: 1e-9 * ref.cellSizeY }, 'cellSizeY');
    expect(src.southUp).toBe(ref.southUp);
    expect(src.pixelConvention).toBe(info.metadata?.['']?.AREA_OR_POINT === 'Point' ? 'point' : 'area');
  });

  it('data type, compression, blocks, overviews, nodata and BigTIFF flag match the file', async () => {
    const src = await open();
    const band = info.bands[0]!;
    expect(src.dataType).toBe(band.type);
    const gdalCompression = info.metadata?.IMAGE_STRUCTURE?.COMPRESSION;
    expect(src.compression).toBe(gdalCompression === undefined ? 'none' : COMPRESSION_NAMES[gdalCompression]);
    expect(src.predictor).toBe(Number(info.metadata?.IMAGE_STRUCTURE?.PREDICTOR ?? 1));
    const block = src.tiling.kind === 'tiled' ? [src.tiling.tileWidth, src.tiling.tileHeight] : [src.width, src.tiling.rowsPerStrip];
    expect(block).toEqual(band.block);
    expect(src.overviewCount).toBe(band.overviews?.length ?? 0);
    if (band.noDataValue === undefined) expect(src.nodata).toBeNull();
    else if (band.noDataValue === 'NaN') expect(src.nodata).toBeNaN();
    else expect(src.nodata).toBe(band.noDataValue);
    // TIFF header bytes 2-3: 42 classic, 43 BigTIFF (little-endian files)
    const magic = readFileSync(fixturePath(name)).readUInt16LE(2);
    expect(src.bigTiff).toBe(magic === 43);
    expect(src.crs.epsg).toBe(info.stac?.['proj:epsg']);
  });

  it('every sampled cell equals gdallocationinfo bit for bit (nodata → NaN, row 0 north)', async () => {
    const src = await open();
    const grid = await readDemWindow(src);
    expect(grid.data.buffer).toBeInstanceOf(SharedArrayBuffer);
    const nodata = src.nodata;
    const cells = gdalCells(name);
    expect(cells.length).toBeGreaterThan(20);
    let checked = 0;
    for (const { col, row, value } of cells) {
      const gridRow = src.southUp ? src.height - 1 - row : row;
      const got = grid.data[gridRow * grid.width + col] as number;
      // GDAL prints 15 significant digits; a float32 needs at most 9, so fround(text) is the stored value
      const want = Number.isNaN(value) || value === nodata ? NaN : Math.fround(value);
      if (!Object.is(got, want)) expect.fail(`cell col ${col} file row ${row}: talus ${got}, GDAL ${value}`);
      checked++;
    }
    expect(checked).toBe(cells.length);
  });
});

describe('user-defined CRS with --dem-crs', () => {
  it('reads the file once --dem-crs gives the definition, with GDAL georeferencing', async () => {
    const def = '+proj=tmerc +lat_0=0 +lon_0=14.2 +k=0.9997 +x_0=300000 +y_0=-4800000 +ellps=GRS80 +units=m +no_defs';
    const src = await openDem(fixturePath('user-defined-crs'), {
      demCrs: def,
      resolveCrs: (spec) => crsFromProjString(spec, 'user-defined'),
    });
    const ref = gdalLattice('user-defined-crs');
    expect([src.originX, src.originY, src.cellSizeX, src.cellSizeY]).toEqual([ref.originX, ref.originY, ref.cellSizeX, ref.cellSizeY]);
    expect(src.crs.proj4).toBe(def);
    const grid = await readDemWindow(src);
    for (const { col, row, value } of gdalCells('user-defined-crs')) {
      const want = value === -9999 ? NaN : Math.fround(value);
      expect(Object.is(grid.data[row * grid.width + col], want)).toBe(true);
    }
  });
});
