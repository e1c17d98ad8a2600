/**
 * What `talus inspect` reports about a DEM: layout, spacing in CRS units and metres, extent in
 * CRS units and WGS84 lon/lat, and elevation statistics read strip by strip (one strip in memory).
 */
import proj4 from 'proj4';
import { InputError } from '../errors.js';
import { DEG } from '../units.js';
import type { DemSource } from './dem-source.js';
import { readStrips } from './strip-reader.js';

/** WGS84 ellipsoid [TR8350]: semi-major axis, m, and first eccentricity squared. */
const WGS84_A_M = 6378137;
const WGS84_E2 = 0.0066943799901413165;
const WGS84_LONLAT = '+proj=longlat +datum=WGS84 +no_defs';

export interface DemStats {
  cells: number;
  nodataCells: number;
  nodataFraction: number;
  /** Over valid cells, metres; NaN when every cell is nodata. */
  minM: number;
  maxM: number;
  meanM: number;
}

export interface DemDescription {
  file: string;
  fileSizeBytes: number;
  width: number;
  height: number;
  crs: { label: string; kind: 'geographic' | 'projected'; epsg: number | null; proj4: string; linearUnitM: number | null };
  /** Cell size in CRS units (degrees for geographic). */
  spacingX: number;
  spacingY: number;
  /** Cell size in metres: for a geographic grid, along the parallel and meridian at the centre latitude. */
  spacingEastM: number;
  spacingNorthM: number;
  extent: { minX: number; minY: number; maxX: number; maxY: number };
  /** WGS84 lon/lat of the corners, degrees: upper-left, upper-right, lower-right, lower-left. */
  cornersLonLatDeg: [number, number][];
  pixelConvention: 'area' | 'point';
  rowOrder: 'north-up' | 'south-up';
  nodataValue: number | null;
  elevationUnit: string;
  dataType: string;
  compression: string;
  predictor: number;
  tiling: string;
  overviews: number;
  bigTiff: boolean;
  bands: number;
  stats: DemStats;
}

/** Metres per degree of longitude (along the parallel) and latitude at latDeg, WGS84. */
export function metresPerDegree(latDeg: number, a = WGS84_A_M, e2 = WGS84_E2): { eastM: number; northM: number } {
  const s = Math.sin(latDeg * DEG);
  const w = Math.sqrt(1 - e2 * s * s);
  // prime-vertical radius N = a / w, meridian radius M = a (1 - e2) / w^3 [HeiskanenMoritz1967]
  return { eastM: DEG * (a / w) * Math.cos(latDeg * DEG), northM: DEG * (a * (1 - e2)) / (w * w * w) };
}

/** Nodata count and min/max/mean of the whole DEM in metres (Neumaier-compensated sum). */
export async function demStats(src: DemSource): Promise<DemStats> {
  const nodata = src.nodata ?? NaN;
  const nodataF32 = Math.fround(nodata);
  const scale = src.elevationScaleM;
  let nodataCells = 0;
  let min = Infinity;
  let max = -Infinity;
  let sum = 0;
  let comp = 0;
  await readStrips(src, { col0: 0, col1: src.width, row0: 0, row1: src.height }, (samples, _y, nRows) => {
    const n = nRows * src.width;
    for (let i = 0; i < n; i++) {
      const v = samples[i] as number;
      if (v === nodata || v === nodataF32 || v !== v) {
        nodataCells++;
        continue;
      }
      const z = Math.fround(v * scale);
      if (z < min) min = z;
      if (z > max) max = z;
      const t = sum + z;
      comp += Math.abs(sum) >= Math.abs(z) ? sum - t + z : z - t + sum;
      sum = t;
    }
  });
  const cells = src.width * src.height;
  const valid = cells - nodataCells;
  return {
    cells,
    nodataCells,
    nodataFraction: nodataCells / cells,
    minM: valid > 0 ? min : NaN,
    maxM: valid > 0 ? max : NaN,
    meanM: valid > 0 ? (sum + comp) / valid : NaN,
  };
}

export async function describeDem(src: DemSource): Promise<DemDescription> {
  const extent = {
    minX: src.originX,
    maxX: src.originX + src.width * src.cellSizeX,
    minY: src.originY - src.height * src.cellSizeY,
    maxY: src.originY,
  };
  const corners: [number, number][] = [
    [extent.minX, extent.maxY], [extent.maxX, extent.maxY], [extent.maxX, extent.minY], [extent.minX, extent.minY],
  ];
  let toLonLat: (p: [number, number]) => [number, number];
  try {
    const conv = proj4(src.crs.proj4, WGS84_LONLAT);
    toLonLat = (p) => conv.forward(p) as [number, number];
  } catch (e) {
    throw new InputError(`cannot use CRS ${src.crs.label} (${e instanceof Error ? e.message : String(e)})`, { file: src.path });
  }
  const cornersLonLatDeg = corners.map(toLonLat);
  if (!cornersLonLatDeg.every(([lon, lat]) => Number.isFinite(lon) && Number.isFinite(lat))) {
    throw new InputError(`the corners of the DEM cannot be converted from ${src.crs.label} to WGS84 lon/lat`, { file: src.path });
  }
  let spacingEastM: number;
  let spacingNorthM: number;
  if (src.crs.kind === 'geographic') {
    const perDeg = metresPerDegree((extent.minY + extent.maxY) / 2);
    spacingEastM = src.cellSizeX * perDeg.eastM;
    spacingNorthM = src.cellSizeY * perDeg.northM;
  } else {
    spacingEastM = src.cellSizeX * src.crs.linearUnitM;
    spacingNorthM = src.cellSizeY * src.crs.linearUnitM;
  }
  return {
    file: src.path,
    fileSizeBytes: src.fileSizeBytes,
    width: src.width,
    height: src.height,
    crs: {
      label: src.crs.label, kind: src.crs.kind, epsg: src.crs.epsg ?? null, proj4: src.crs.proj4,
      linearUnitM: src.crs.kind === 'projected' ? src.crs.linearUnitM : null,
    },
    spacingX: src.cellSizeX,
    spacingY: src.cellSizeY,
    spacingEastM,
    spacingNorthM,
    extent,
    cornersLonLatDeg,
    pixelConvention: src.pixelConvention,
    rowOrder: src.southUp ? 'south-up' : 'north-up',
    nodataValue: src.nodata,
    elevationUnit: src.elevationUnit,
    dataType: src.dataType,
    compression: src.compression,
    predictor: src.predictor,
    tiling: src.tiling.kind === 'tiled' ? `tiles ${src.tiling.tileWidth} x ${src.tiling.tileHeight}` : `strips of ${src.tiling.rowsPerStrip} rows`,
    overviews: src.overviewCount,
    bigTiff: src.bigTiff,
    bands: src.bandCount,
    stats: await demStats(src),
  };
}
