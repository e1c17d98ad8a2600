import type { Command } from 'commander';
import type { CliIo } from '../io.js';
import { registerDensityCommand } from './density.js';
import { registerReportCommand } from './report.js';
import { registerInspect } from './inspect.js';
import { registerReduceCommand } from './reduce.js';
import { registerDemoCommand } from './demo.js';
import { registerMergeCommand } from './merge.js';

/** Each subcommand lives in its own file and registers itself here, in the order of --help. */
export function registerCommands(program: Command, io: CliIo): void {
  registerReduceCommand(program, io);
  registerMergeCommand(program, io);
  registerInspect(program, io);
  registerDensityCommand(program, io);
  registerReportCommand(program, io);
  registerDemoCommand(program, io);
}
