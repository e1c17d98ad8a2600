/**
 * GeoTIFF georeferencing → the DemGrid convention (row 0 north, pixel-is-area, cell sizes > 0).
 *
 * Reads ModelPixelScale + one ModelTiepoint, or a ModelTransformation matrix, and
 * GTRasterTypeGeoKey (1 = PixelIsArea, 2 = PixelIsPoint; a missing key means area, as in GDAL).
 * For pixel-is-point the tie point is the centre of pixel (0,0), so the origin moves back half a
 * cell. South-up files (y grows with the row) are described here and flipped at read time.
 * Rotated or sheared transforms are refused.
 */
import { InputError } from '../errors.js';

/** The raw tags, as numbers (any of them may be missing). */
export interface GeoTags {
  /** ModelPixelScaleTag: [sx, sy, sz]. */
  pixelScale?: ArrayLike<number> | undefined;
  /** ModelTiepointTag: [I, J, K, X, Y, Z] (more than one tie point is refused). */
  tiePoints?: ArrayLike<number> | undefined;
  /** ModelTransformationTag: 4×4 row-major matrix. */
  transformation?: ArrayLike<number> | undefined;
  /** GTRasterTypeGeoKey. */
  rasterType?: number | undefined;
}

export interface Georef {
  /** x of the west edge, CRS units. */
  originX: number;
  /** y of the north edge, CRS units. */
  originY: number;
  cellSizeX: number;
  cellSizeY: number;
  /** True when the file stores its southernmost row first (flipped at read time). */
  southUp: boolean;
  /** The file's own convention (the returned origin is always pixel-is-area). */
  pixelConvention: 'area' | 'point';
}

/** An affine transform without rotation: x = x0 + col*dx, y = y0 + row*dy (file pixel corners). */
interface AxisTransform {
  x0: number;
  dx: number;
  y0: number;
  dy: number;
}

function fromTransformation(m: ArrayLike<number>, file: string): AxisTransform {
  if (m.length < 16) throw new InputError(`ModelTransformation has ${m.length} values; expected 16`, { file });
  const [a, b, , d, e, f, , h] = [m[0], m[1], m[2], m[3], m[4], m[5], m[6], m[7]] as number[];
  if (!(b === 0 && e === 0)) {
    throw new InputError(
      `the grid is rotated or sheared (ModelTransformation terms ${b}, ${e}); talus needs a north-up or ` +
        'south-up grid: resample it first (e.g. to a north-up grid in the same CRS)',
      { file },
    );
  }
  return { x0: d as number, dx: a as number, y0: h as number, dy: f as number };
}

function fromScaleAndTie(scale: ArrayLike<number>, tie: ArrayLike<number>, file: string): AxisTransform {
  if (tie.length !== 6) {
    throw new InputError(`has ${Math.floor(tie.length / 6)} tie points; expected exactly 1 (with ModelPixelScale)`, { file });
  }
  const sx = scale[0] as number;
  const sy = scale[1] as number;
  const [i, j, , x, y] = [tie[0], tie[1], tie[2], tie[3], tie[4]] as number[];
  // ModelPixelScale's y is positive for north-up grids (y decreases down the rows).
  return { x0: (x as number) - (i as number) * sx, dx: sx, y0: (y as number) + (j as number) * sy, dy: -sy };
}

/** Georeferencing of a width × height raster in the DemGrid convention. */
export function georefFromTags(tags: GeoTags, width: number, height: number, file: string): Georef {
  let t: AxisTransform;
  if (tags.transformation !== undefined) t = fromTransformation(tags.transformation, file);
  else if (tags.pixelScale !== undefined && tags.tiePoints !== undefined) t = fromScaleAndTie(tags.pixelScale, tags.tiePoints, file);
  else {
    throw new InputError(
      'has no georeferencing (neither ModelPixelScale + ModelTiepoint nor ModelTransformation): expected a GeoTIFF',
      { file },
    );
  }
  const pixelConvention = tags.rasterType === 2 ? 'point' : 'area';
  if (pixelConvention === 'point') {
    // OGC GeoTIFF 1.1, raster space: PixelIsPoint: the model point is the centre of the pixel.
    t.x0 -= t.dx / 2;
    t.y0 -= t.dy / 2;
  }
  if (!(t.dx > 0 && Number.isFinite(t.dx))) {
    throw new InputError(`has cell width ${t.dx}; expected a finite positive x step (columns running east)`, { file });
  }
  if (!(Math.abs(t.dy) > 0 && Number.isFinite(t.dy))) {
    throw new InputError(`has cell height ${-t.dy}; expected a finite non-zero y step`, { file });
  }
  if (!(Number.isFinite(t.x0) && Number.isFinite(t.y0))) {
    throw new InputError(`has a non-finite grid origin (${t.x0}, ${t.y0})`, { file });
  }
  const southUp = t.dy > 0;
  return {
    originX: t.x0,
    originY: southUp ? t.y0 + height * t.dy : t.y0,
    cellSizeX: t.dx,
    cellSizeY: Math.abs(t.dy),
    southUp,
    pixelConvention,
  };
}
