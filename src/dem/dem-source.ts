/**
 * An opened DEM file: everything talus knows about it before reading elevations. A DemSource is
 * plain data (the file is closed again after openDem); readDemWindow reopens it to read.
 */
import type { LengthUnit } from '../units.js';
import type { CrsInfo } from './grid.js';
import type { CrsResolver } from './crs-resolver.js';
import type { DemDataType, DemTiling } from './tiff-layout.js';

export interface DemOpenOptions {
  /** --dem-crs: 'EPSG:n' or a proj4 string; overrides the file's GeoKeys. */
  demCrs?: string | undefined;
  /** --dem-units: unit of the stored elevations (default metres). */
  demUnits?: LengthUnit | undefined;
  /** Turns 'EPSG:n' / proj4 strings into CrsInfo (default: the station CRS registry). */
  resolveCrs?: CrsResolver | undefined;
}

export interface DemSource {
  /** The path as given to openDem. */
  path: string;
  fileSizeBytes: number;
  /** Columns and rows of the full-resolution image. */
  width: number;
  height: number;
  /** DemGrid convention: west edge, north edge, cell sizes > 0, CRS units; always pixel-is-area. */
  originX: number;
  originY: number;
  cellSizeX: number;
  cellSizeY: number;
  /** The file stores its south row first (flipped to row 0 = north at read time). */
  southUp: boolean;
  /** The file's own GTRasterTypeGeoKey convention (origin above is already area-based). */
  pixelConvention: 'area' | 'point';
  crs: CrsInfo;
  dataType: DemDataType;
  /** 'none', 'lzw', 'deflate', 'packbits' or 'zstd'. */
  compression: string;
  predictor: number;
  tiling: DemTiling;
  /** Reduced-resolution images after the first (COG overviews); talus reads the first image. */
  overviewCount: number;
  bigTiff: boolean;
  /** Samples per pixel; band 1 is the elevation. */
  bandCount: number;
  /** GDAL_NODATA value in stored units (null when the file has none); NaN samples are nodata too. */
  nodata: number | null;
  /** Unit of the stored elevations, and metres per stored unit. */
  elevationUnit: LengthUnit;
  elevationScaleM: number;
}
