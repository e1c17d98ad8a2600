/** Files talus must refuse, each with one InputError naming the file and what was expected. */
import { describe, expect, it } from 'vitest';
import { InputError, isInputError } from '../../src/errors.js';
import { openDem } from '../../src/dem/geotiff-open.js';
import { fixturePath, fixtureResolver } from './gdal-reference.js';

async function refusal(name: string, opts: Parameters<typeof openDem>[1] = {}): Promise<string> {
  try {
    await openDem(fixturePath(name), opts);
  } catch (e) {
    expect(isInputError(e)).toBe(true);
    return (e as Error).message;
  }
  return expect.fail(`${name} was accepted`);
}

describe('openDem refuses what it cannot read, naming the file', () => {
  it('a missing file', async () => {
    expect(await refusal('no-such-dem')).toMatch(/no-such-dem\.tif: cannot be opened \(no such file\)/);
  });
  it('a file that is not a TIFF', async () => {
    expect(await refusal('not-a-tiff')).toMatch(/not-a-tiff\.tif: cannot be read as a TIFF/);
  });
  it('a truncated TIFF (geotiff.js alone would read zeros past the end)', async () => {
    expect(await refusal('truncated')).toMatch(/truncated\.tif: is truncated: its image data runs to byte 12674 but the file has 6000 bytes/);
  });
  it('a plain TIFF without GeoTIFF keys', async () => {
    expect(await refusal('non-geo')).toMatch(/non-geo\.tif: is a plain TIFF with no GeoTIFF keys/);
  });
  it('an unsupported compression (LZMA), by name and code', async () => {
    expect(await refusal('lzma', { resolveCrs: fixtureResolver('lzma') })).toMatch(/lzma\.tif: uses LZMA compression \(TIFF code 34925\)/);
  });
  it('a rotated grid (ModelTransformation with rotation terms)', async () => {
    expect(await refusal('rotated', { resolveCrs: fixtureResolver('rotated') })).toMatch(/rotated\.tif: the grid is rotated or sheared/);
  });
  it('a user-defined CRS without --dem-crs, and says to pass --dem-crs', async () => {
    expect(await refusal('user-defined-crs')).toMatch(/user-defined-crs\.tif: uses a user-defined projected CRS \(ProjectedCSTypeGeoKey 32767\); pass its definition with --dem-crs/);
  });
  it('an EPSG code the resolver does not know, with the resolver reason', async () => {
    const msg = await refusal('plain-f32', {
      resolveCrs: (spec) => {
        throw new InputError(`unknown CRS code ${spec}`);
      },
    });
    expect(msg).toMatch(/plain-f32\.tif: projected CRS EPSG:32633: unknown CRS code EPSG:32633/);
  });
  it('a bad --dem-crs string', async () => {
    const msg = await refusal('user-defined-crs', { demCrs: '+proj=nonsense' });
    expect(msg).toMatch(/user-defined-crs\.tif: --dem-crs \+proj=nonsense: /);
  });
});
