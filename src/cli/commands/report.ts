/** `talus report RESULTS.csv -o report.html`: a self-contained HTML report of a reduction run. */
import type { Command } from 'commander';
import type { CliIo } from '../io.js';
import { parseColumnMapping } from '../../stations/index.js';
import { writeReport } from '../../report/write-report.js';

interface ReportCliOptions {
  output: string;
  dem?: string;
  columns?: string;
  title?: string;
}

export function registerReportCommand(program: Command, io: CliIo): void {
  program
    .command('report')
    .description('write a self-contained HTML report (maps, charts, flags, provenance) from a results CSV of talus reduce')
    .argument('<results>', 'results CSV written by talus reduce (its .provenance.json is read when beside it)')
    .requiredOption('-o, --output <file>', 'HTML file to write')
    .option('--dem <file>', 'GeoTIFF DEM drawn as shaded relief under the station maps')
    .option('--columns <map>', 'the --columns given to talus reduce: input column names, e.g. "id=STN,height_m=elev,lon=LONG"')
    .option('--title <text>', 'report title (default: "talus report: <results file name>")')
    .action(async (file: string, o: ReportCliOptions) => {
      const result = await writeReport(file, o.output, {
        ...(o.dem !== undefined ? { demPath: o.dem } : {}),
        columns: o.columns !== undefined ? parseColumnMapping(o.columns) : {},
        ...(o.title !== undefined ? { title: o.title } : {}),
      });
      io.stdout.write(`talus report: wrote ${result.outPath} (${Math.ceil(result.bytes / 1024)} KB)\n`);
      for (const n of result.notes) io.stderr.write(`note: ${n}\n`);
    });
}
