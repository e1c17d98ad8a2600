/**
 * CLI entry: runCli(argv, io) -> exit code. 0 ok, 2 input error (one line on stderr),
 * 1 internal bug (stack trace). Testable in-process; bin/talus.js is a thin shim over it.
 */
import { Command, CommanderError } from 'commander';
import { isInputError } from '../errors.js';
import type { CliIo } from './io.js';
import { talusVersion } from './version.js';
import { registerCommands } from './commands/index.js';

export type { CliIo } from './io.js';

export function buildProgram(io: CliIo): Command {
  const program = new Command();
  program
    .name('talus')
    .description(
      'Gravity terrain corrections (Bullard C) from GeoTIFF DEMs, with Earth curvature, out to 166.7 km, ' +
        'and complete Bouguer anomalies for every station.',
    )
    .version(talusVersion(), '-V, --version', 'print the talus version')
    .showHelpAfterError('(run with --help for usage)')
    .configureOutput({
      writeOut: (s) => io.stdout.write(s),
      writeErr: (s) => io.stderr.write(s),
    })
    .exitOverride();
  program.addHelpText(
    'after',
    `
Typical run:
  talus inspect dem.tif                       what a DEM holds (CRS, spacing, extent, nodata)
  talus reduce --stations s.csv --dem dem.tif --far-dem far.tif --out results.csv
  talus density results.csv                   Nettleton and Parasnis density estimates
  talus report results.csv -o report.html     self-contained HTML report

Units: heights in metres unless --height-units says otherwise; gravity in mGal; density in kg/m^3.
Exit codes: 0 ok, 2 input error (message names the file, line, station and column), 1 internal error.`,
  );
  registerCommands(program, io);
  return program;
}

export async function runCli(argv: readonly string[], io: CliIo): Promise<number> {
  const program = buildProgram(io);
  try {
    await program.parseAsync([...argv], { from: 'user' });
    return typeof process.exitCode === 'number' && process.exitCode !== 0 ? process.exitCode : 0;
  } catch (e) {
    if (e instanceof CommanderError) {
      // help and version exit with code 0; usage errors are input errors
      if (e.exitCode === 0 || e.code === 'commander.helpDisplayed' || e.code === 'commander.version') return 0;
      return 2;
    }
    if (isInputError(e)) {
      io.stderr.write(`talus: ${(e as Error).message}\n`);
      return 2;
    }
    const err = e as Error;
    io.stderr.write(`talus: internal error (a bug in talus; please report it with the command line):\n${err?.stack ?? String(e)}\n`);
    return 1;
  }
}
