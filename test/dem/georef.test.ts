/**
 * georefFromTags on tag sets other than the ones GDAL writes (a tie point away from pixel 0,0;
 * a negative ModelPixelScale y), checked against GDAL's geotransform of plain-f32.tif and
 * south-up.tif: the same lattice must come out however the tags express it.
 */
import { describe, expect, it } from 'vitest';
import { georefFromTags } from '../../src/dem/georef.js';
import { gdalInfo } from './gdal-reference.js';

const [x0, dx, , y0, , dy] = gdalInfo('plain-f32').geoTransform!;

describe('georefFromTags', () => {
  it('a tie point at raster (10, 5) gives GDAL\'s origin of the same grid', () => {
    const g = georefFromTags({ pixelScale: [dx, -dy, 0], tiePoints: [10, 5, 0, x0 + 10 * dx, y0 + 5 * dy, 0] }, 64, 48, 'f.tif');
    expect(g).toEqual({ originX: x0, originY: y0, cellSizeX: dx, cellSizeY: -dy, southUp: false, pixelConvention: 'area' });
  });

  it('a negative ModelPixelScale y (rows going north) is south-up with the north edge as origin', () => {
    const [sx0, , , sy0, , sdy] = gdalInfo('south-up').geoTransform!;
    const g = georefFromTags({ pixelScale: [dx, -sdy, 0], tiePoints: [0, 0, 0, sx0, sy0, 0] }, 64, 48, 'f.tif');
    expect(g.southUp).toBe(true);
    expect([g.originX, g.originY, g.cellSizeY]).toEqual([x0, y0, -dy]);
  });

  it('pixel-is-point moves the origin back half a cell (as GDAL reports it)', () => {
    const g = georefFromTags({ pixelScale: [dx, -dy, 0], tiePoints: [0, 0, 0, x0 + dx / 2, y0 + dy / 2, 0], rasterType: 2 }, 64, 48, 'f.tif');
    expect([g.originX, g.originY, g.pixelConvention]).toEqual([x0, y0, 'point']);
  });

  it('refuses several tie points, a zero or NaN scale, and missing tags, naming the file', () => {
    expect(() => georefFromTags({ pixelScale: [30, 30, 0], tiePoints: [0, 0, 0, 1, 2, 0, 5, 5, 0, 3, 4, 0] }, 4, 4, 'a.tif')).toThrow(/a\.tif: has 2 tie points/);
    expect(() => georefFromTags({ pixelScale: [NaN, 30, 0], tiePoints: [0, 0, 0, 1, 2, 0] }, 4, 4, 'b.tif')).toThrow(/b\.tif: has cell width NaN/);
    expect(() => georefFromTags({ pixelScale: [30, 0, 0], tiePoints: [0, 0, 0, 1, 2, 0] }, 4, 4, 'c.tif')).toThrow(/c\.tif: has cell height/);
    expect(() => georefFromTags({}, 4, 4, 'd.tif')).toThrow(/d\.tif: has no georeferencing/);
  });
});
