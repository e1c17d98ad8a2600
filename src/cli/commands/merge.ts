/** `talus merge SHARD1.csv SHARD2.csv ... -o results.csv`: join the shares of a cluster run. */
import type { Command } from 'commander';
import type { CliIo } from '../io.js';
import { runMerge } from '../../engine/merge-shards.js';

export function registerMergeCommand(program: Command, io: CliIo): void {
  program
    .command('merge')
    .summary('join the shares of a cluster run (talus reduce --shard K/N) into one results CSV')
    .description(
      'Check that the shard results come from one station file, the same DEMs and the same parameters, ' +
        'that every share 1..N is given once and every station is in exactly one share; then write the ' +
        'results CSV in station-file order (byte for byte what one talus reduce over all stations writes), ' +
        'with tc_outlier decided over all stations, and a provenance JSON beside it (run times summed, ' +
        'flag counts recomputed, the window each share read).',
    )
    .argument('<shards...>', 'results CSVs of talus reduce --shard K/N (each with its .provenance.json beside it)')
    .requiredOption('-o, --out <results.csv>', 'merged results CSV (a provenance JSON is written beside it)')
    .addHelpText(
      'after',
      `
Example (a cluster of 4 machines, or 4 jobs of a batch queue; K runs on machine K):
  for K in 1 2 3 4; do talus reduce --stations s.csv --dem dem.tif --radius 20000 --shard $K/4 --out part$K.csv; done
  talus merge part1.csv part2.csv part3.csv part4.csv -o results.csv

Every parameter must be equal across the shares except --shard, --out, --workers, --batch and
--no-progress; the station file and DEMs are compared by sha256, so their paths may differ.`,
    )
    .action(async (files: string[], o: { out: string }) => {
      const s = await runMerge(files, o.out, ['talus', 'merge', ...process.argv.slice(3)]);
      io.stdout.write(
        [
          `talus merge: ${s.shards} shards, ${s.stations} stations (${s.computed} computed; run time ${s.runTimeS.toFixed(1)} s summed over the shards)`,
          s.qcText,
          `results:    ${s.outputCsv}`,
          `provenance: ${s.provenanceJson}`,
        ].join('\n') + '\n',
      );
    });
}
