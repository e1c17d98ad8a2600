/**
 * `talus demo [--out-dir out]`: runs talus on the bundled invented survey (data-samples/demo):
 * reduce, report, density — the same code paths as typing the three commands — and says where
 * the results are.
 */
import { existsSync } from 'node:fs';
import { mkdir } from 'node:fs/promises';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Command } from 'commander';
import type { CliIo } from '../io.js';
import { InputError } from '../../errors.js';
import { runReduce } from '../../engine/run-reduce.js';
import type { ReduceOptions } from '../../engine/run-options.js';
import { writeReport } from '../../report/write-report.js';
import { formatSummary, reduceOptionsFrom, registerReduceCommand } from './reduce.js';
import { registerDensityCommand } from './density.js';

/** Extra reduction densities of the demo run, kg/m^3 (sediments, crystalline mean, textbook). */
export const DEMO_DENSITIES = '2200,2450,2670';

export interface DemoPaths {
  stations: string;
  fineDem: string;
  farDem: string;
  results: string;
  report: string;
}

/** The bundled sample: data-samples/demo in the package root above this module (source or dist). */
export function findDemoData(): string {
  let dir = dirname(fileURLToPath(import.meta.url));
  for (let k = 0; k < 6; k++) {
    const candidate = join(dir, 'data-samples', 'demo');
    if (existsSync(join(candidate, 'stations.csv'))) return candidate;
    dir = dirname(dir);
  }
  throw new InputError('the bundled demo data (data-samples/demo/stations.csv) was not found beside the talus package');
}

/** Shorter paths in messages and provenance when the file lies under the working directory. */
function display(p: string): string {
  const r = relative(process.cwd(), p);
  return r !== '' && !r.startsWith('..') ? r : p;
}

export function demoPaths(dataDir: string, outDir: string): DemoPaths {
  return {
    stations: display(join(dataDir, 'stations.csv')),
    fineDem: display(join(dataDir, 'fine-dem.tif')),
    farDem: display(join(dataDir, 'far-dem.tif')),
    results: display(join(resolve(outDir), 'demo-results.csv')),
    report: display(join(resolve(outDir), 'demo-report.html')),
  };
}

/** A program holding one subcommand, output sent to io, errors thrown instead of exiting. */
function subProgram(io: CliIo): Command {
  return new Command()
    .exitOverride()
    .configureOutput({ writeOut: (s) => io.stdout.write(s), writeErr: (s) => io.stderr.write(s) });
}

/** Reduce options from a `reduce ...` argument list, parsed by `talus reduce`'s own option definitions. */
export async function parseReduceArgs(argv: string[], io: CliIo): Promise<ReduceOptions> {
  const program = subProgram(io);
  registerReduceCommand(program, io);
  let parsed: ReduceOptions | undefined;
  const reduce = program.commands.find((c) => c.name() === 'reduce');
  if (!reduce) throw new Error('talus reduce is not registered');
  reduce.action((raw: Parameters<typeof reduceOptionsFrom>[0]) => {
    parsed = reduceOptionsFrom(raw, ['talus', ...argv]);
  });
  await program.parseAsync(argv, { from: 'user' });
  if (!parsed) throw new Error('talus reduce options were not parsed');
  return parsed;
}

interface DemoCliOptions {
  outDir: string;
  workers?: string;
}

export function registerDemoCommand(program: Command, io: CliIo): void {
  program
    .command('demo')
    .summary('run talus on the bundled invented survey (reduce, report, density)')
    .description(
      'Run talus on the bundled invented survey (data-samples/demo): talus reduce, talus report and talus density, ' +
        'writing demo-results.csv (+ provenance) and demo-report.html into --out-dir.',
    )
    .option('--out-dir <dir>', 'directory for the results and the report', 'out')
    .option('--workers <n>', 'worker threads for talus reduce (0 = inline); default: one per CPU core')
    .action(async (o: DemoCliOptions) => {
      const p = demoPaths(findDemoData(), o.outDir);
      await mkdir(dirname(resolve(p.results)), { recursive: true });
      io.stdout.write(`talus demo: the invented Skarveld survey (${display(dirname(resolve(p.stations)))}; synthetic data, see data-samples/README.md)\n\n`);
      const reduceArgv = [
        'reduce', '--stations', p.stations, '--dem', p.fineDem, '--far-dem', p.farDem,
        '--out', p.results, '--densities', DEMO_DENSITIES, ...(o.workers !== undefined ? ['--workers', o.workers] : []),
      ];
      io.stdout.write(`$ talus ${reduceArgv.join(' ')}\n`);
      const summary = await runReduce(await parseReduceArgs(reduceArgv, io), io);
      io.stdout.write(formatSummary(summary) + '\n');

      io.stdout.write(`$ talus report ${p.results} -o ${p.report} --dem ${p.fineDem}\n`);
      const report = await writeReport(p.results, p.report, { demPath: p.fineDem, columns: {}, title: 'talus demo: invented Skarveld survey' });
      io.stdout.write(`talus report: wrote ${report.outPath} (${Math.ceil(report.bytes / 1024)} KB)\n`);
      for (const n of report.notes) io.stderr.write(`note: ${n}\n`);

      io.stdout.write(`\n$ talus density ${p.results}\n`);
      const density = subProgram(io);
      registerDensityCommand(density, io);
      await density.parseAsync(['density', p.results], { from: 'user' });

      io.stdout.write(
        `\nResults:    ${p.results}\nProvenance: ${summary.provenanceJson}\nReport:     ${p.report} (open it in a web browser)\n` +
          'The data are invented; the true density of the synthetic terrain is 2550 kg/m^3 (data-samples/README.md).\n',
      );
    });
}
