/**
 * What a TIFF image's storage looks like (data type, compression, predictor, tiles or strips)
 * and whether talus can decode it. Checked once when the file is opened, so a read never meets
 * an unsupported or truncated file half way.
 */
import type { ImageFileDirectory } from 'geotiff';
import { InputError } from '../errors.js';

export type DemDataType = 'Int16' | 'UInt16' | 'Int32' | 'Float32' | 'Float64';

export type DemTiling =
  | { kind: 'tiled'; tileWidth: number; tileHeight: number }
  | { kind: 'strips'; rowsPerStrip: number };

export interface TiffLayout {
  dataType: DemDataType;
  /** 'none', 'lzw', 'deflate', 'packbits' or 'zstd'. */
  compression: string;
  /** TIFF Predictor: 1 none, 2 horizontal differencing, 3 floating point. */
  predictor: number;
  tiling: DemTiling;
  bandCount: number;
}

/** TIFF Compression codes talus reads (geotiff.js decoders, each checked against GDAL). */
const COMPRESSIONS: ReadonlyMap<number, string> = new Map([
  [1, 'none'],
  [5, 'lzw'],
  [8, 'deflate'],
  [32946, 'deflate'],
  [32773, 'packbits'],
  [50000, 'zstd'],
]);

/** Names of some codes talus does not read, for the error message. */
const OTHER_COMPRESSIONS: ReadonlyMap<number, string> = new Map([
  [2, 'CCITT RLE'], [3, 'CCITT G3'], [4, 'CCITT G4'], [6, 'old JPEG'], [7, 'JPEG'],
  [34887, 'LERC'], [34925, 'LZMA'], [50001, 'WebP'], [50002, 'JPEG XL'],
]);

const SUPPORTED_COMPRESSIONS = 'none, LZW, deflate, PackBits, zstd';

/** (SampleFormat, BitsPerSample) → type. SampleFormat 1 = unsigned, 2 = signed, 3 = float. */
function dataTypeOf(format: number, bits: number): DemDataType | undefined {
  if (format === 2 && bits === 16) return 'Int16';
  if (format === 1 && bits === 16) return 'UInt16';
  if (format === 2 && bits === 32) return 'Int32';
  if (format === 3 && bits === 32) return 'Float32';
  if (format === 3 && bits === 64) return 'Float64';
  return undefined;
}

function first(v: unknown, fallback: number): number {
  if (v === undefined || v === null) return fallback;
  if (typeof v === 'number') return v;
  const a = v as ArrayLike<number>;
  return a.length > 0 ? Number(a[0]) : fallback;
}

/** Storage layout of image `fd`; InputError when talus cannot decode it. */
export async function tiffLayout(fd: ImageFileDirectory, height: number, file: string): Promise<TiffLayout> {
  const code = first(await fd.loadValue('Compression'), 1);
  const compression = COMPRESSIONS.get(code);
  if (compression === undefined) {
    const name = OTHER_COMPRESSIONS.get(code);
    throw new InputError(
      `uses ${name !== undefined ? `${name} compression (TIFF code ${code})` : `unknown TIFF compression code ${code}`}, ` +
        `which talus cannot decode; expected one of ${SUPPORTED_COMPRESSIONS} (convert with e.g. COMPRESS=DEFLATE)`,
      { file },
    );
  }
  const predictor = first(await fd.loadValue('Predictor'), 1);
  if (!(predictor === 1 || predictor === 2 || predictor === 3)) {
    throw new InputError(`has TIFF predictor ${predictor}; expected 1 (none), 2 (horizontal) or 3 (floating point)`, { file });
  }
  const format = first(await fd.loadValue('SampleFormat'), 1);
  const bits = first(await fd.loadValue('BitsPerSample'), 1);
  const dataType = dataTypeOf(format, bits);
  if (dataType === undefined) {
    throw new InputError(
      `has ${bits}-bit samples of SampleFormat ${format}; expected Int16, UInt16, Int32, Float32 or Float64 elevations`,
      { file },
    );
  }
  const bandCount = first(await fd.loadValue('SamplesPerPixel'), 1);
  const planar = first(await fd.loadValue('PlanarConfiguration'), 1);
  if (bandCount > 1 && planar !== 2 && predictor !== 1) {
    throw new InputError(`has ${bandCount} pixel-interleaved bands with a predictor; expected a single-band DEM`, { file });
  }
  const tiled = fd.hasTag('TileWidth');
  const tiling: DemTiling = tiled
    ? { kind: 'tiled', tileWidth: first(await fd.loadValue('TileWidth'), 0), tileHeight: first(await fd.loadValue('TileLength'), 0) }
    : { kind: 'strips', rowsPerStrip: Math.min(first(await fd.loadValue('RowsPerStrip'), height), height) };
  if (tiling.kind === 'tiled' && !(tiling.tileWidth > 0 && tiling.tileHeight > 0)) {
    throw new InputError(`has tile size ${tiling.tileWidth} x ${tiling.tileHeight}; expected positive tile dimensions`, { file });
  }
  if (tiling.kind === 'strips' && !(tiling.rowsPerStrip > 0)) {
    throw new InputError(`has RowsPerStrip ${tiling.rowsPerStrip}; expected a positive number`, { file });
  }
  return { dataType, compression, predictor, tiling, bandCount };
}

/**
 * Checks that every strip or tile lies inside the file. geotiff.js reads past the end of a
 * truncated file as zeros, silently, so this is the only guard against such files.
 */
export async function checkBlocksInFile(fd: ImageFileDirectory, fileSizeBytes: number, file: string): Promise<void> {
  const tiled = fd.hasTag('TileOffsets');
  const offsets = (await fd.loadValue(tiled ? 'TileOffsets' : 'StripOffsets')) as ArrayLike<number | bigint> | undefined;
  const counts = (await fd.loadValue(tiled ? 'TileByteCounts' : 'StripByteCounts')) as ArrayLike<number | bigint> | undefined;
  if (offsets === undefined || counts === undefined || offsets.length !== counts.length) {
    throw new InputError(`has no valid ${tiled ? 'tile' : 'strip'} offsets/byte counts: the TIFF is damaged`, { file });
  }
  let end = 0;
  for (let i = 0; i < offsets.length; i++) {
    const e = Number(offsets[i]) + Number(counts[i]);
    if (e > end) end = e;
  }
  if (!(end <= fileSizeBytes)) {
    throw new InputError(
      `is truncated: its image data runs to byte ${end} but the file has ${fileSizeBytes} bytes`,
      { file },
    );
  }
}
