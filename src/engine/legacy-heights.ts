/**
 * Station heights for the two stages of a run when stations and DEM may be on different height
 * types (h ellipsoidal = H orthometric + N geoid, [HeiskanenMoritz1967]):
 * - the terrain stage compares stations with the DEM, so it gets every station height
 *   converted to the DEM's height type (--dem-height-type) with the geoid grid's N;
 * - the reduction (free-air, atmospheric and Bouguer terms, normal gravity on the ellipsoid)
 *   uses the station heights in their declared type (--station-height-type): orthometric H
 *   is the standard practice; ellipsoidal h is what [Hinze2005] recommend. The choice is
 *   written to the provenance file.
 * Mixing types without a geoid grid is refused (heightTypeMixError).
 */
import { InputError } from '../errors.js';
import { openDem } from '../dem/geotiff-open.js';
import { convertHeight, heightTypeMixError } from '../legacy/height-type.js';
import type { HeightType } from '../legacy/height-type.js';
import { sampleUndulations } from '../legacy/geoid-grid.js';
import type { OutputColumn } from '../io/results-csv.js';
import type { StationTable } from '../stations/table.js';
import { loadDem } from './load-dems.js';

/** Metres per degree of arc on a 6371 km sphere: only to size the geoid window's margin. */
const METRES_PER_DEGREE = 111195;
/** Geoid cells read beyond the stations' extent on every side (bilinear needs one). */
const GEOID_MARGIN_CELLS = 3;
/** Flag of a station the geoid grid does not cover (only with --keep-going). */
export const OUTSIDE_GEOID_FLAG = 'outside_geoid';

export interface HeightSettings {
  stationHeightType: HeightType;
  demHeightType: HeightType;
  geoidPath?: string;
  keepGoing: boolean;
}

export interface StationHeights {
  /** Station heights in the DEM's height type, m (terrain stage). */
  terrainM: Float64Array;
  /** Station heights in their declared type, m (reduction). */
  reductionM: Float64Array;
  /** Station indices the geoid grid does not cover where a conversion was needed (keepGoing). */
  outsideGeoid: number[];
  /** geoid_undulation_m, orthometric_height_m, ellipsoidal_height_m when a geoid grid is given. */
  columns: OutputColumn[];
  /** For the provenance file. */
  record: Record<string, unknown>;
}

export async function stationHeights(s: HeightSettings, table: StationTable, active: Uint8Array): Promise<StationHeights> {
  const mix = heightTypeMixError(s.demHeightType, s.stationHeightType, s.geoidPath !== undefined);
  if (mix) throw mix;
  const n = table.ids.length;
  const reductionM = Float64Array.from(table.heightM);
  const record: Record<string, unknown> = {
    stationHeightType: s.stationHeightType,
    demHeightType: s.demHeightType,
    terrainStageHeightType: s.demHeightType,
    reductionHeightType: s.stationHeightType,
    freeAirHeight:
      s.stationHeightType === 'orthometric'
        ? 'orthometric height H with normal gravity on the ellipsoid (standard practice)'
        : 'ellipsoidal height h with normal gravity on the ellipsoid (Hinze et al. 2005)',
    geoid: s.geoidPath ?? null,
  };
  if (s.geoidPath === undefined) return { terrainM: Float64Array.from(table.heightM), reductionM, outsideGeoid: [], columns: [], record };

  const src = await openDem(s.geoidPath, { demUnits: 'm' });
  const cellM = Math.max(src.cellSizeX, src.cellSizeY) * (src.crs.kind === 'projected' ? src.crs.linearUnitM : METRES_PER_DEGREE);
  const geoid = await loadDem([s.geoidPath], table, active, GEOID_MARGIN_CELLS * cellM, { demUnits: 'm' }, 'geoid grid');
  const undulationM = sampleUndulations(geoid.grid, geoid.x, geoid.y);
  const converting = s.stationHeightType !== s.demHeightType;
  const terrainM = new Float64Array(n);
  const orthometric = new Float64Array(n).fill(NaN);
  const ellipsoidal = new Float64Array(n).fill(NaN);
  const outsideGeoid: number[] = [];
  for (let i = 0; i < n; i++) {
    const h = table.heightM[i] as number;
    const N = undulationM[i] as number;
    if (active[i] === 1 && converting && !Number.isFinite(N)) {
      if (!s.keepGoing)
        throw new InputError(
          `the geoid grid ${s.geoidPath} has no undulation at this station (outside the grid or nodata), so its ` +
            `${s.stationHeightType} height cannot be converted to the DEM's ${s.demHeightType} heights; ` +
            `give a grid that covers every station, or --keep-going to flag it (${OUTSIDE_GEOID_FLAG})`,
          { file: table.source, line: table.lines[i] as number, station: table.ids[i] as string },
        );
      outsideGeoid.push(i);
    }
    terrainM[i] = convertHeight(h, s.stationHeightType, s.demHeightType, N);
    orthometric[i] = convertHeight(h, s.stationHeightType, 'orthometric', N);
    ellipsoidal[i] = convertHeight(h, s.stationHeightType, 'ellipsoidal', N);
  }
  record['geoidSampling'] = 'bilinear between cell centres (src/legacy/geoid-grid.ts)';
  record['geoidWindowRead'] = { width: geoid.grid.width, height: geoid.grid.height, crs: geoid.grid.crs.label };
  const columns: OutputColumn[] = [
    { name: 'geoid_undulation_m', decimals: 3, values: undulationM },
    { name: 'orthometric_height_m', decimals: 3, values: orthometric },
    { name: 'ellipsoidal_height_m', decimals: 3, values: ellipsoidal },
  ];
  return { terrainM, reductionM, outsideGeoid, columns, record };
}
