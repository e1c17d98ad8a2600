/**
 * `talus inspect FILE.tif`: what a DEM holds (size, spacing, CRS, extent, nodata, elevations,
 * storage), as a table on stdout or, with --json, one JSON object.
 */
import type { Command } from 'commander';
import { InputError } from '../../errors.js';
import { isLengthUnit } from '../../units.js';
import { describeDem } from '../../dem/describe-dem.js';
import type { DemDescription } from '../../dem/describe-dem.js';
import { openDem } from '../../dem/geotiff-open.js';
import type { CliIo } from '../io.js';

interface InspectOptions {
  json?: boolean;
  demCrs?: string;
  demUnits?: string;
}

const num = (v: number, digits = 3): string => (Number.isFinite(v) ? Number(v.toFixed(digits)).toString() : 'n/a');
const deg = (v: number): string => v.toFixed(7);

/** The readable table. */
export function formatDemDescription(d: DemDescription): string {
  const geographic = d.crs.kind === 'geographic';
  const u = geographic ? 'deg' : 'CRS units';
  const xyDigits = geographic ? 9 : 3;
  const s = d.stats;
  const rows: [string, string][] = [
    ['file', `${d.file} (${d.fileSizeBytes} bytes)`],
    ['size', `${d.width} x ${d.height} cells (${d.bands} band${d.bands === 1 ? '' : 's'}; band 1 read)`],
    ['CRS', `${d.crs.label} (${d.crs.kind}${d.crs.linearUnitM !== null ? `, ${d.crs.linearUnitM} m per unit` : ''})`],
    ['spacing', `${num(d.spacingX, xyDigits + 3)} x ${num(d.spacingY, xyDigits + 3)} ${u}`],
    ['spacing (m)', `${num(d.spacingEastM)} E-W x ${num(d.spacingNorthM)} N-S${geographic ? ' (at the centre latitude)' : ''}`],
    ['extent x', `${num(d.extent.minX, xyDigits)} .. ${num(d.extent.maxX, xyDigits)} ${u}`],
    ['extent y', `${num(d.extent.minY, xyDigits)} .. ${num(d.extent.maxY, xyDigits)} ${u}`],
    ['corners lon/lat', d.cornersLonLatDeg.map(([lon, lat], i) => `${['UL', 'UR', 'LR', 'LL'][i]} ${deg(lon)} ${deg(lat)}`).join(', ')],
    ['pixels', `pixel-is-${d.pixelConvention} in the file (talus uses cell areas), ${d.rowOrder}`],
    ['nodata value', d.nodataValue === null ? 'none (NaN samples only)' : String(d.nodataValue)],
    ['nodata cells', `${s.nodataCells} of ${s.cells} (${(100 * s.nodataFraction).toFixed(2)} %)`],
    ['elevation (m)', `min ${num(s.minM)}, max ${num(s.maxM)}, mean ${num(s.meanM)} (stored in ${d.elevationUnit})`],
    ['data type', d.dataType],
    ['compression', `${d.compression}${d.predictor !== 1 ? `, predictor ${d.predictor}` : ''}`],
    ['layout', `${d.tiling}; ${d.overviews} overview${d.overviews === 1 ? '' : 's'}; ${d.bigTiff ? 'BigTIFF' : 'classic TIFF'}`],
  ];
  const w = Math.max(...rows.map(([k]) => k.length));
  return rows.map(([k, v]) => `${k.padEnd(w)}  ${v}`).join('\n') + '\n';
}

export function registerInspect(program: Command, io: CliIo): void {
  program
    .command('inspect')
    .description('describe a GeoTIFF DEM: size, spacing, CRS, extent, nodata, elevations, storage')
    .argument('<file>', 'GeoTIFF DEM')
    .option('--json', 'print one JSON object instead of a table')
    .option('--dem-crs <crs>', "the DEM's CRS when the file has none or a user-defined one: EPSG:n or a proj4 string")
    .option('--dem-units <unit>', 'unit of the stored elevations: m, ft or usft', 'm')
    .action(async (file: string, opts: InspectOptions) => {
      const units = opts.demUnits ?? 'm';
      if (!isLengthUnit(units)) throw new InputError(`--dem-units ${units}: expected m, ft or usft`);
      const src = await openDem(file, { demCrs: opts.demCrs, demUnits: units });
      const d = await describeDem(src);
      io.stdout.write(opts.json === true ? JSON.stringify(d) + '\n' : formatDemDescription(d));
    });
}
