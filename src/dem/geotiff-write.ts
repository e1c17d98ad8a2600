/**
 * Encodes a DemGrid as an uncompressed Float32 GeoTIFF (geotiff.js's writer: one strip,
 * pixel-is-area, EPSG code in the GeoKeys). Used for test rasters and the sample data; compress
 * with GDAL when size matters (the writer never compresses).
 */
import { writeArrayBuffer } from 'geotiff';
import type { DemGrid } from './grid.js';

/** @param nodata value written for NaN cells (and declared as GDAL_NODATA); NaN cells stay NaN without it */
export function encodeGeoTiff(g: DemGrid, epsg: number, nodata?: number): Uint8Array {
  const values = new Float32Array(g.width * g.height);
  for (let i = 0; i < values.length; i++) {
    const v = g.data[i] as number;
    values[i] = Number.isNaN(v) && nodata !== undefined ? nodata : v;
  }
  const geographic = g.crs.kind === 'geographic';
  const meta: Record<string, unknown> = {
    width: g.width,
    height: g.height,
    ModelPixelScale: [g.cellSizeX, g.cellSizeY, 0],
    ModelTiepoint: [0, 0, 0, g.originX, g.originY, 0],
    GTModelTypeGeoKey: geographic ? 2 : 1,
    GTRasterTypeGeoKey: 1, // pixel-is-area
    ...(geographic ? { GeographicTypeGeoKey: epsg } : { ProjectedCSTypeGeoKey: epsg }),
    ...(nodata !== undefined ? { GDAL_NODATA: String(nodata) } : {}),
  };
  return new Uint8Array(writeArrayBuffer(values, meta as Parameters<typeof writeArrayBuffer>[1]) as ArrayBuffer);
}
