/**
 * Writes an invented legacy-style station file from a modern invented station list.
 *
 *   node --import tsx data-samples/legacy/make-legacy-sample.ts \
 *     --in <stations.csv> --out data-samples/legacy/legacy-stations.csv \
 *     [--seed 1] [--old-datum-offset-m 0.25] [--plant-mismatch ID[,ID...]]
 *
 * See legacy-sample.ts for what is converted and README.md beside it for how to reduce it.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { parse } from 'csv-parse/sync';
import { LEGACY_SAMPLE_HEADER, makeLegacyRows, modernStationsFromRecords } from './legacy-sample.js';

const { values } = parseArgs({
  options: {
    in: { type: 'string' },
    out: { type: 'string' },
    seed: { type: 'string', default: '1' },
    'old-datum-offset-m': { type: 'string', default: '0.25' },
    'plant-mismatch': { type: 'string', default: '' },
  },
});
if (values.in === undefined || values.out === undefined) {
  process.stderr.write('usage: make-legacy-sample.ts --in stations.csv --out legacy.csv [options]\n');
  process.exit(2);
}
const seed = Number(values.seed);
const oldDatumOffsetM = Number(values['old-datum-offset-m']);
if (!Number.isInteger(seed) || !Number.isFinite(oldDatumOffsetM)) {
  process.stderr.write('--seed must be an integer and --old-datum-offset-m a number\n');
  process.exit(2);
}
const records = parse(readFileSync(values.in, 'utf8'), { columns: true, skip_empty_lines: true, trim: true }) as Record<
  string,
  string
>[];
const stations = modernStationsFromRecords(records, values.in);
const plantMismatchIds = values['plant-mismatch'].split(',').filter((s) => s !== '');
const rows = makeLegacyRows(stations, { seed, oldDatumOffsetM, plantMismatchIds });
const text = [LEGACY_SAMPLE_HEADER.join(','), ...rows.map((r) => r.join(','))].join('\n') + '\n';
writeFileSync(values.out, text);
process.stdout.write(`wrote ${rows.length} legacy stations to ${values.out}\n`);
