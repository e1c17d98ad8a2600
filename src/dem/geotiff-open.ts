/**
 * openDem: opens a GeoTIFF, reads and checks its metadata, closes it again. Every problem with
 * the file (missing, not a TIFF, truncated, no georeferencing, unsupported compression or type,
 * rotated grid, unknown CRS) becomes one InputError naming the file.
 */
import { stat } from 'node:fs/promises';
import { fromFile } from 'geotiff';
import type GeoTIFF from 'geotiff';
import { InputError, isInputError } from '../errors.js';
import { metresPer } from '../units.js';
import { crsFromGeoKeys } from './crs-from-geokeys.js';
import type { DemGeoKeys } from './crs-from-geokeys.js';
import type { DemOpenOptions, DemSource } from './dem-source.js';
import { georefFromTags } from './georef.js';
import { checkBlocksInFile, tiffLayout } from './tiff-layout.js';
import { resolveCrs } from '../stations/crs-registry.js';

type Tiff = Awaited<ReturnType<typeof fromFile>>;

/** Runs `body` on the opened TIFF and always closes it; geotiff.js failures become InputErrors. */
export async function withTiff<T>(path: string, body: (tiff: Tiff) => Promise<T>): Promise<T> {
  let tiff: Tiff;
  try {
    tiff = await fromFile(path);
  } catch (e) {
    throw new InputError(`cannot be read as a TIFF (${describeError(e)})`, { file: path });
  }
  try {
    return await body(tiff);
  } catch (e) {
    if (isInputError(e)) throw e;
    throw new InputError(`cannot be decoded as a TIFF (${describeError(e)})`, { file: path });
  } finally {
    await tiff.close();
  }
}

function describeError(e: unknown): string {
  if (e instanceof Error) return (e as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : e.message;
  return String(e);
}

/** Images after the first that are reduced-resolution versions (NewSubfileType bit 0). */
async function countOverviews(tiff: GeoTIFF): Promise<number> {
  const n = await tiff.getImageCount();
  let overviews = 0;
  for (let i = 1; i < n; i++) {
    const img = await tiff.getImage(i);
    const subfile = Number(await img.getFileDirectory().loadValue('NewSubfileType')) & 1;
    if (subfile === 1) overviews++;
  }
  return overviews;
}

/** Opens `path`, describes it (full-resolution image, band 1) and closes it. */
export async function openDem(path: string, opts: DemOpenOptions = {}): Promise<DemSource> {
  let fileSizeBytes: number;
  try {
    const st = await stat(path);
    if (!st.isFile()) throw new InputError('is not a regular file; expected a GeoTIFF DEM', { file: path });
    fileSizeBytes = st.size;
  } catch (e) {
    if (isInputError(e)) throw e;
    throw new InputError(`cannot be opened (${describeError(e)}); expected a GeoTIFF DEM`, { file: path });
  }
  const elevationUnit = opts.demUnits ?? 'm';
  return withTiff(path, async (tiff) => {
    const img = await tiff.getImage(0);
    const fd = img.getFileDirectory();
    const width = img.getWidth();
    const height = img.getHeight();
    if (!(width > 0 && height > 0)) throw new InputError(`has image size ${width} x ${height}; expected a non-empty raster`, { file: path });
    const keys = img.getGeoKeys() as DemGeoKeys | null;
    const crs = crsFromGeoKeys(keys, path, { demCrs: opts.demCrs, resolveCrs: opts.resolveCrs ?? ((spec: string) => resolveCrs(spec)) });
    const georef = georefFromTags(
      {
        pixelScale: (await fd.loadValue('ModelPixelScale')) as ArrayLike<number> | undefined,
        tiePoints: (await fd.loadValue('ModelTiepoint')) as ArrayLike<number> | undefined,
        transformation: (await fd.loadValue('ModelTransformation')) as ArrayLike<number> | undefined,
        rasterType: (keys as { GTRasterTypeGeoKey?: number } | null)?.GTRasterTypeGeoKey,
      },
      width,
      height,
      path,
    );
    const layout = await tiffLayout(fd, height, path);
    await checkBlocksInFile(fd, fileSizeBytes, path);
    const nodataText = fd.hasTag('GDAL_NODATA') ? String(await fd.loadValue('GDAL_NODATA')).replace(/\0+$/, '').trim() : '';
    const nodata = nodataText === '' ? null : Number(nodataText);
    if (nodataText !== '' && Number.isNaN(nodata) && !/^[+-]?nan$/i.test(nodataText)) {
      throw new InputError(`has GDAL_NODATA "${nodataText}"; expected a number or nan`, { file: path });
    }
    return {
      path,
      fileSizeBytes,
      width,
      height,
      ...georef,
      crs,
      ...layout,
      overviewCount: await countOverviews(tiff),
      bigTiff: tiff.bigTiff,
      nodata,
      elevationUnit,
      elevationScaleM: metresPer(elevationUnit),
    };
  });
}
