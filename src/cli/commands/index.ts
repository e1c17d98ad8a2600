import type { Command } from 'commander';
import type { CliIo } from '../io.js';
import { registerDensityCommand } from './density.js';
import { registerReportCommand } from './report.js';
import { registerInspect } from './inspect.js';
import { registerReduceCommand } from './reduce.js';
import { registerDemoCommand } from './demo.js';

/** Each subcommand lives in its own file and registers itself here. */
export function registerCommands(program: Command, io: CliIo): void {
  void program;
  void io;
  registerDensityCommand(program, io);
  registerReportCommand(program, io);
  registerInspect(program, io);
  registerReduceCommand(program, io);
  registerDemoCommand(program, io);
}
