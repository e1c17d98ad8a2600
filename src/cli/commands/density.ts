/**
 * `talus density RESULTS.csv`: Parasnis and Nettleton density estimates from the unit-density
 * columns of a results CSV, with a plain-language verdict.
 */
import type { Command } from 'commander';
import type { CliIo } from '../io.js';
import { InputError } from '../../errors.js';
import { readCsvTable } from '../../io/read-results.js';
import { densityInputFromTable, parseColumnMapping } from '../../density/input.js';
import type { Selection } from '../../density/select.js';
import { parseBox, parsePolygon, parseWhere, selectStations } from '../../density/select.js';
import type { DensityRange } from '../../density/nettleton.js';
import { nettleton } from '../../density/nettleton.js';
import { parasnis } from '../../density/parasnis.js';
import type { RobustMethod } from '../../density/robust-fit.js';
import { compareDensityEstimates } from '../../density/compare.js';

/** Default Nettleton sweep, kg/m^3: spans sediments to dense crystalline rock (common practice). */
export const DEFAULT_DENSITY_RANGE = '1800:3000:10';
/** Fewest stations a regression is attempted with (two unknowns plus a trend plane). */
const MIN_STATIONS = 4;

export function parseDensityRange(s: string): DensityRange {
  const parts = s.split(':').map((p) => Number(p.trim()));
  const [from, to, step] = parts as [number, number, number];
  if (parts.length !== 3 || !parts.every(Number.isFinite) || !(step > 0) || !(to > from) || !(from >= 0) || (to - from) / step > 100000) {
    throw new InputError(`bad value "${s}": expected FROM:TO:STEP in kg/m^3 with 0 <= FROM < TO, STEP > 0 and at most 100000 steps, e.g. ${DEFAULT_DENSITY_RANGE}`, {
      field: '--range',
    });
  }
  return { fromKgM3: from, toKgM3: to, stepKgM3: step };
}

function oneOf<T extends string>(value: string, allowed: readonly T[], option: string): T {
  if (!(allowed as readonly string[]).includes(value)) throw new InputError(`bad value "${value}": expected one of ${allowed.join(', ')}`, { field: option });
  return value as T;
}

interface DensityCliOptions {
  range: string;
  against: string;
  trend: string;
  robust: string;
  where: string[];
  box?: string;
  polygon?: string;
  columns?: string;
  json?: boolean;
}

const f = (v: number, digits: number): string => (Number.isFinite(v) ? v.toFixed(digits) : 'n/a');

export function registerDensityCommand(program: Command, io: CliIo): void {
  program
    .command('density')
    .description('estimate the reduction density (Parasnis and Nettleton) from a results CSV of talus reduce')
    .argument('<results>', 'results CSV written by talus reduce')
    .option('--range <from:to:step>', 'Nettleton density sweep, kg/m^3', DEFAULT_DENSITY_RANGE)
    .option('--against <what>', 'Nettleton: correlate the CBA with station "height" or the "terrain" term', 'height')
    .option('--trend <kind>', '"none" or "linear": fit a regional plane at the same time', 'none')
    .option('--robust <kind>', 'Parasnis: "none", "huber" (IRLS) or "trim" (drop > 3 sigma)', 'none')
    .option('--where <cond>', 'keep stations with COLUMN=VALUE, COLUMN!=VALUE, "COLUMN>VALUE" ... (repeatable)', (v: string, acc: string[]) => [...acc, v], [] as string[])
    .option('--box <minx,miny,maxx,maxy>', 'keep stations inside the box (file coordinate units)')
    .option('--polygon <file|"x1 y1, x2 y2, ...">', 'keep stations inside the polygon (file coordinate units)')
    .option('--columns <map>', 'column names in the file, e.g. "id=STN,height_m=elev,lon=LONG"')
    .option('--json', 'print the estimates as JSON')
    .action((file: string, o: DensityCliOptions) => {
      const range = parseDensityRange(o.range);
      const against = oneOf(o.against, ['height', 'terrain'] as const, '--against');
      const trend = oneOf(o.trend, ['none', 'linear'] as const, '--trend');
      const robust = oneOf<RobustMethod>(o.robust, ['none', 'huber', 'trim'], '--robust');
      const selection: Selection = {
        where: o.where.map(parseWhere),
        ...(o.box !== undefined ? { box: parseBox(o.box) } : {}),
        ...(o.polygon !== undefined ? { polygon: parsePolygon(o.polygon) } : {}),
      };
      const table = readCsvTable(file);
      const all = densityInputFromTable(table, parseColumnMapping(o.columns));
      const input = selectStations(all, table, selection);
      if (input.ids.length < MIN_STATIONS) {
        throw new InputError(
          `only ${input.ids.length} stations with all values${all.skippedRows > 0 ? ` (${all.skippedRows} rows had empty cells)` : ''} after selection: expected at least ${MIN_STATIONS}`,
          { file },
        );
      }
      const p = parasnis(input, { trend, robust });
      const nt = nettleton(input, { rangeKgM3: range, against, trend });
      const withTrend = trend === 'none' ? parasnis(input, { trend: 'linear', robust }) : undefined;
      const v = compareDensityEstimates(input, p, nt, { trendUsed: trend === 'linear', ...(withTrend ? { withTrend } : {}) });
      if (o.json) {
        const out = {
          parasnis: {
            density: p.densityKgM3,
            stderr: p.stderrKgM3,
            r2: p.r2,
            n: p.n,
            interceptMgal: p.interceptMgal,
            downweighted: p.downweighted,
            ...(p.trend ? { trend: p.trend } : {}),
          },
          nettleton: {
            density: nt.densityKgM3,
            curve: nt.curve,
            stderr: nt.stderrKgM3,
            n: nt.n,
            against: nt.against,
            zeroCrossing: nt.zeroCrossing,
          },
          verdict: { agree: v.agree, text: v.verdict, warnings: v.warnings, reliefM: v.reliefM },
          stations: { used: input.ids.length, skippedEmpty: all.skippedRows, unselected: all.ids.length - input.ids.length },
        };
        // JSON has no NaN: unknown values are written as null.
        io.stdout.write(JSON.stringify(out, (_k, val: unknown) => (typeof val === 'number' && !Number.isFinite(val) ? null : val)) + '\n');
        return;
      }
      const lines = [
        `talus density: ${file}: ${input.ids.length} stations used` +
          (all.skippedRows > 0 ? `, ${all.skippedRows} rows skipped (empty cells)` : '') +
          (all.ids.length > input.ids.length ? `, ${all.ids.length - input.ids.length} outside the selection` : '') +
          `; height range ${f(v.reliefM, 1)} m`,
        '',
        'method     density kg/m^3   1-sigma kg/m^3   detail',
        `Parasnis   ${f(p.densityKgM3, 0).padStart(14)}   ${f(p.stderrKgM3, 0).padStart(14)}   R^2 ${f(p.r2, 3)}, intercept ${f(p.interceptMgal, 2)} mGal` +
          (trend === 'linear' ? ', linear trend fitted' : '') +
          (robust !== 'none' ? `, ${robust}: ${p.downweighted} down-weighted` : ''),
        `Nettleton  ${f(nt.densityKgM3, 0).padStart(14)}   ${f(nt.stderrKgM3, 0).padStart(14)}   against ${against}, |corr| ${f(nt.minAbsCorr, 3)} at the estimate` +
          (nt.zeroCrossing ? '' : ' (no zero crossing)'),
        '',
        v.verdict,
        ...v.warnings.map((w) => `warning: ${w}`),
      ];
      io.stdout.write(lines.join('\n') + '\n');
    });
}
