/** `talus reduce`: terrain corrections and anomalies for every station. */
import { Command, Option } from 'commander';
import type { CliIo } from '../io.js';
import { runReduce } from '../../engine/run-reduce.js';
import type { ReduceOptions, ReduceSummary } from '../../engine/run-options.js';
import { parseColumnMapping } from '../../stations/columns.js';
import { CAP_RADIUS_M, DEFAULT_DENSITY_KG_M3 } from '../../constants.js';
import { availableParallelism } from 'node:os';
import { InputError } from '../../errors.js';
import { writeReport } from '../../report/write-report.js';
import { splitLegacyColumns } from '../../engine/legacy-columns.js';
import { parseGobsOffset, parseGravityDatum, parseGravityUnit } from '../../legacy/gravity-datum.js';
import { LEGACY_MISMATCH_TOLERANCE_MGAL, parseLegacyFormulaSet, parseLegacyTolerance } from '../../legacy/legacy-reduction.js';
import { parseHeightType } from '../../legacy/height-type.js';
import { parseLegacyTcRange } from '../../legacy/legacy-tc-range.js';
import { parseShard } from '../../engine/shard-spec.js';
import {
  parseChoice,
  parseCount,
  parseDensity,
  parseDensityList,
  parseLengthUnit,
  parseNonNegative,
  parsePositive,
} from '../parse-options.js';

const NORMALS = ['grs80', 'wgs84', 'wgs84-1987', 'igf1967', 'igf1967-short', 'igf1930'] as const;

interface RawOptions {
  stations: string;
  dem: string[];
  farDem?: string;
  out: string;
  stationCrs?: string;
  columns?: string;
  heightUnits: string;
  keepGoing?: boolean;
  demCrs?: string;
  demUnits: string;
  farDemCrs?: string;
  farDemUnits: string;
  density: string;
  densities?: string;
  radius: string;
  capRadius: string;
  workers?: string;
  batch: string;
  normal: string;
  freeAir: string;
  bouguer: string;
  fieldInnerRadius: string;
  accuracy: string;
  misfitLimit: string;
  aboveTerrain: string;
  belowTerrain: string;
  tcOutlierLimit: string;
  legacyTcLimit: string;
  gravityDatum: string;
  gravityUnits: string;
  gobsOffset: string;
  legacyFormulas?: string;
  legacyTolerance: string;
  legacyTcRange?: string;
  stationHeightType: string;
  demHeightType: string;
  geoid?: string;
  shard?: string;
  json?: boolean;
  report?: string | boolean;
  progress: boolean;
}

const collect = (v: string, prev: string[] = []): string[] => [...prev, v];

export function reduceOptionsFrom(raw: RawOptions, commandLine: string[]): ReduceOptions {
  const radiusM = parsePositive('--radius', raw.radius);
  const fieldInnerRadiusM = parseNonNegative('--field-inner-radius', raw.fieldInnerRadius);
  if (!(fieldInnerRadiusM < radiusM)) throw new InputError(`option --field-inner-radius: ${fieldInnerRadiusM} m must be smaller than --radius ${radiusM} m`);
  const split = raw.columns !== undefined ? splitLegacyColumns(raw.columns) : null;
  return {
    stationsPath: raw.stations,
    demPaths: raw.dem,
    ...(raw.farDem !== undefined ? { farDemPath: raw.farDem } : {}),
    outPath: raw.out,
    ...(raw.stationCrs !== undefined ? { stationCrs: raw.stationCrs } : {}),
    ...(split && split.readerSpec.trim() !== '' ? { columns: parseColumnMapping(split.readerSpec) } : {}),
    legacyColumns: split ? split.legacy : {},
    heightUnits: parseLengthUnit('--height-units', raw.heightUnits),
    keepGoing: raw.keepGoing === true,
    ...(raw.demCrs !== undefined ? { demCrs: raw.demCrs } : {}),
    demUnits: parseLengthUnit('--dem-units', raw.demUnits),
    ...(raw.farDemCrs !== undefined ? { farDemCrs: raw.farDemCrs } : {}),
    farDemUnits: parseLengthUnit('--far-dem-units', raw.farDemUnits),
    densityKgM3: parseDensity('--density', raw.density),
    densitiesKgM3: raw.densities !== undefined ? parseDensityList('--densities', raw.densities) : [],
    radiusM,
    capRadiusM: parsePositive('--cap-radius', raw.capRadius),
    workers: raw.workers !== undefined ? parseCount('--workers', raw.workers) : Math.max(1, availableParallelism()),
    batchSize: Math.max(1, parseCount('--batch', raw.batch)),
    normalFormula: parseChoice('--normal', raw.normal, NORMALS),
    freeAirOrder: parseChoice('--free-air', raw.freeAir, ['second-order', 'first-order'] as const) === 'first-order' ? 1 : 2,
    bouguer: parseChoice('--bouguer', raw.bouguer, ['cap', 'slab'] as const),
    fieldInnerRadiusM,
    accuracyMgal: parsePositive('--accuracy', raw.accuracy),
    misfitLimitM: parsePositive('--misfit-limit', raw.misfitLimit),
    aboveTerrainM: parsePositive('--above-terrain', raw.aboveTerrain),
    belowTerrainM: parsePositive('--below-terrain', raw.belowTerrain),
    tcOutlierLimitMgal: parsePositive('--tc-outlier-limit', raw.tcOutlierLimit),
    legacyTcLimitMgal: parsePositive('--legacy-tc-limit', raw.legacyTcLimit),
    gravity: {
      datum: parseGravityDatum(raw.gravityDatum),
      units: parseGravityUnit(raw.gravityUnits),
      storedOffset: parseGobsOffset(raw.gobsOffset),
    },
    ...(raw.legacyFormulas !== undefined ? { legacyFormulas: parseLegacyFormulaSet(raw.legacyFormulas) } : {}),
    legacyToleranceMgal: parseLegacyTolerance(raw.legacyTolerance),
    ...(raw.legacyTcRange !== undefined ? { legacyTcRange: parseLegacyTcRange(raw.legacyTcRange) } : {}),
    stationHeightType: parseHeightType(raw.stationHeightType, '--station-height-type'),
    demHeightType: parseHeightType(raw.demHeightType, '--dem-height-type'),
    ...(raw.geoid !== undefined ? { geoidPath: raw.geoid } : {}),
    ...(raw.shard !== undefined ? { shard: parseShard(raw.shard) } : {}),
    progress: raw.progress,
    commandLine,
  };
}

export function formatSummary(s: ReduceSummary): string {
  const lines = [
    `talus reduce: ${s.shard ? `shard ${s.shard.k}/${s.shard.n}: ` : ''}${s.computed} of ${s.shard ? s.shard.stations : s.stations} stations computed in ${s.runTimeS.toFixed(1)} s (terrain ${s.stationsPerS.toFixed(0)} stations/s)`,
    s.qcText,
    ...s.warnings.slice(0, 10).map((w) => `warning: ${w}`),
    ...(s.warnings.length > 10 ? [`warning: ... and ${s.warnings.length - 10} more (all in the provenance file)`] : []),
    `results:    ${s.outputCsv}`,
    `provenance: ${s.provenanceJson}`,
    ...(s.reportHtml ? [`report:     ${s.reportHtml}`] : []),
  ];
  return lines.join('\n') + '\n';
}

export function registerReduceCommand(program: Command, io: CliIo): void {
  program
    .command('reduce')
    .summary('terrain corrections and Bouguer anomalies for every station')
    .description(
      'Compute, for every station, the terrain correction (Bullard C, relative to the spherical cap at the ' +
        'station height, Earth curvature included) from the DEM(s) out to --radius, and the normal gravity, ' +
        'atmospheric, free-air and Bouguer corrections and the free-air, simple and complete Bouguer anomalies.',
    )
    .requiredOption('--stations <file.csv>', 'station table (columns id, lon, lat, height_m, gobs_mgal; see --columns)')
    .requiredOption('--dem <file.tif>', 'fine DEM GeoTIFF; repeat for tiles of one mosaic', collect)
    .option('--far-dem <file.tif>', 'coarser DEM used where the fine DEM ends (to cover the whole radius)')
    .requiredOption('--out <results.csv>', 'results CSV (a provenance JSON is written beside it)')
    .option('--station-crs <crs>', 'CRS of x, y station columns: EPSG:n or a proj4 string (default lon/lat EPSG:4326)')
    .option('--columns <map>', 'map canonical names to your columns, e.g. id=STN,lon=LONG,lat=LAT,height_m=ELEV,gobs_mgal=G')
    .addOption(new Option('--height-units <unit>', 'unit of the station heights').choices(['m', 'ft', 'usft']).default('m'))
    .option('--keep-going', 'flag bad rows (bad_row) and compute the rest instead of stopping')
    .option('--dem-crs <crs>', 'override or supply the fine DEM CRS')
    .addOption(new Option('--dem-units <unit>', 'elevation unit of the fine DEM').choices(['m', 'ft', 'usft']).default('m'))
    .option('--far-dem-crs <crs>', 'override or supply the far-zone DEM CRS')
    .addOption(new Option('--far-dem-units <unit>', 'elevation unit of the far-zone DEM').choices(['m', 'ft', 'usft']).default('m'))
    .option('--density <kg/m3>', 'reduction density, kg/m^3', String(DEFAULT_DENSITY_KG_M3))
    .option('--densities <list>', 'extra densities for complete_bouguer_mgal_d<density> columns, e.g. 2200,2450')
    .option('--radius <m>', 'terrain correction radius, m (beyond it terrain counts as the cap)', String(CAP_RADIUS_M))
    .option('--cap-radius <m>', 'radius of the Bouguer spherical cap, m', String(CAP_RADIUS_M))
    .option('--workers <n>', 'worker threads (0 = run inline); default: one per CPU core')
    .option('--batch <n>', 'stations per worker task', '32')
    .addOption(new Option('--normal <formula>', 'normal gravity formula').choices([...NORMALS]).default('grs80'))
    .addOption(new Option('--free-air <order>', 'free-air correction').choices(['second-order', 'first-order']).default('second-order'))
    .addOption(new Option('--bouguer <kind>', 'Bouguer correction used in the anomalies').choices(['cap', 'slab']).default('cap'))
    .option('--field-inner-radius <m>', 'skip terrain inside this radius and add the inner_tc_mgal column instead', '0')
    .option('--accuracy <mGal>', 'error budget of the far-zone kernels at the reduction density, mGal', '0.01')
    .option('--misfit-limit <m>', 'flag height_misfit when |station - DEM| exceeds this, m', '10')
    .option('--above-terrain <m>', 'a station this far above the DEM is treated as above the terrain (no surface adjustment), m', '50')
    .option('--below-terrain <m>', 'a station this far below the DEM is flagged below_terrain (no surface adjustment), m', '50')
    .option('--tc-outlier-limit <mGal>', 'smallest TC departure from its neighbours flagged as tc_outlier, mGal', '1')
    .option('--legacy-tc-limit <mGal>', 'flag legacy_tc_change when |new - legacy TC| exceeds this, mGal', '1')
    .option('--gravity-datum <datum>', 'datum of the gobs_mgal column: igsn71, or potsdam (IGSN71 = Potsdam - 14.0 mGal)', 'igsn71')
    .option('--gravity-units <unit>', 'units of the gobs_mgal column: mgal, or gu (gravity units, 1 mGal = 10 g.u.)', 'mgal')
    .option('--gobs-offset <n>', 'constant removed from the stored gravity values, in their own units (added back first)', '0')
    .option(
      '--legacy-formulas <set>',
      'recompute and explain the legacy anomalies reduced with these formulas, e.g.\n' +
        'normal=igf1930,free-air=first-order,bouguer=slab,density=2670[,atmospheric=no][,g=6.673e-11]',
    )
    .option('--legacy-tolerance <mGal>', 'flag legacy_mismatch when a printed legacy anomaly is not reproduced within this', String(LEGACY_MISMATCH_TOLERANCE_MGAL))
    .option('--legacy-tc-range <R1:R2>', 'also compute the TC over the annulus the legacy TC covered, m (terrain_corr_range_mgal)')
    .option('--station-height-type <type>', 'station heights are orthometric or ellipsoidal (the reduction uses them as declared)', 'orthometric')
    .option('--dem-height-type <type>', 'DEM heights (fine and far-zone) are orthometric or ellipsoidal', 'orthometric')
    .option('--geoid <N.tif>', 'geoid undulation grid (GeoTIFF, m, geoid above the ellipsoid) to convert between height types')
    .option('--shard <K/N>', 'compute share K of N of the stations (one machine of a cluster); join the shares with talus merge')
    .option('--no-progress', 'do not draw the progress bar')
    .option('--json', 'print one JSON summary line at the end instead of the text summary')
    .option('--report [file.html]', 'also write the HTML report (default: <out> with .html)')
    .addHelpText(
      'after',
      `
Examples:
  talus reduce --stations survey.csv --dem dem30m.tif --far-dem dem500m.tif --out results.csv
  talus reduce --stations s.csv --station-crs EPSG:32633 --dem a.tif --dem b.tif --densities 2200,2450 --out r.csv

Output: every input column, then dem_height_m, height_misfit_m, normal_gravity_mgal, atmospheric_corr_mgal,
free_air_corr_mgal, bouguer_slab_mgal, bouguer_cap_mgal, bouguer_unit_mgal, terrain_corr_mgal,
terrain_corr_unit_mgal (TC at 1000 kg/m^3), topo_effect_mgal, free_air_anomaly_mgal, simple_bouguer_mgal,
complete_bouguer_mgal, complete_bouguer_mgal_d<density>, tc_inner_mgal (< 0.895 km), tc_middle_mgal
(< 21.9 km), tc_outer_mgal, dem_coverage and flags. Empty cells mean "not available".
With a gravity conversion: gobs_igsn71_mgal (the value reduced). With --geoid: geoid_undulation_m,
orthometric_height_m, ellipsoidal_height_m. With --legacy-tc-range: terrain_corr_range_mgal. With
--legacy-formulas: legacy_fa_recomputed_mgal, legacy_cba_recomputed_mgal and the delta_*_mgal parts of
the change from the legacy CBA (they sum to delta_total_mgal); legacy_mismatch flags printed legacy
anomalies not reproduced within --legacy-tolerance. Legacy columns: legacy_tc_mgal, legacy_fa_mgal,
legacy_cba_mgal, datum_offset_mgal (mGal added to reach IGSN71; empty = the datum's own),
legacy_height_m (the height the old reduction used, in --height-units; gives delta_height_mgal), all
mappable with --columns.

Cluster example (one share per machine, then one merge; the shares must use the same parameters):
  for K in 1 2 3 4; do talus reduce --stations s.csv --dem dem.tif --shard $K/4 --out part$K.csv; done
  talus merge part1.csv part2.csv part3.csv part4.csv -o results.csv
A share computes the stations of one block of the Hilbert-curve ordering of their lon/lat, cut in N
blocks of equal count, and reads only the DEM around them; its CSV adds shard_* columns and leaves
tc_outlier (which needs neighbours from every share) to talus merge.

Legacy example:
  talus reduce --stations old.csv --columns height_m=ELEV_FT --height-units ft --gravity-datum potsdam \\
    --legacy-formulas normal=igf1930,free-air=first-order,bouguer=slab,density=2670,g=6.673e-11 \\
    --dem dem.tif --out r.csv`,
    )
    .action(async (raw: RawOptions) => {
      const opts = reduceOptionsFrom(raw, ['talus', 'reduce', ...process.argv.slice(3)]);
      if (opts.shard && raw.report !== undefined && raw.report !== false) {
        throw new InputError(`option --report cannot be used with --shard ${raw.shard}: a share holds only part of the stations; run talus report on the merged results`);
      }
      const controller = new AbortController();
      const onSigint = (): void => controller.abort();
      process.once('SIGINT', onSigint);
      try {
        const summary = await runReduce(opts, io, controller.signal);
        if (raw.report !== undefined && raw.report !== false) {
          const reportPath = typeof raw.report === 'string' ? raw.report : opts.outPath.replace(/\.csv$/i, '') + '.html';
          const rep = await writeReport(opts.outPath, reportPath, {
            demPath: opts.demPaths[0] as string,
            ...(opts.columns ? { columns: opts.columns } : {}),
          });
          summary.warnings.push(...rep.notes.map((n) => `report: ${n}`));
          summary.reportHtml = rep.outPath;
        }
        if (raw.json) {
          io.stdout.write(
            JSON.stringify({
              stations: summary.stations,
              computed: summary.computed,
              flagged: summary.flagged,
              runTimeS: +summary.runTimeS.toFixed(3),
              stationsPerS: +summary.stationsPerS.toFixed(1),
              output: summary.outputCsv,
              provenance: summary.provenanceJson,
              ...(summary.reportHtml ? { report: summary.reportHtml } : {}),
            }) + '\n',
          );
        } else {
          io.stdout.write(formatSummary(summary));
        }
      } catch (e) {
        if (controller.signal.aborted) throw new InputError('interrupted: no output was written');
        throw e;
      } finally {
        process.removeListener('SIGINT', onSigint);
      }
    });
}
