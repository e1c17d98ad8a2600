/**
 * `npm run bench [name...]`: runs every test/bench/*.bench.ts (or the named ones) one after
 * another in fresh Node processes, so one benchmark's heap does not disturb the next.
 */
import { readdirSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const dir = fileURLToPath(new URL('.', import.meta.url));
const wanted = process.argv.slice(2);
const files = readdirSync(dir)
  .filter((f) => f.endsWith('.bench.ts'))
  .filter((f) => wanted.length === 0 || wanted.some((w) => f.startsWith(w)))
  .sort();
let failed = 0;
for (const f of files) {
  process.stdout.write(`\n=== ${f} ===\n`);
  const r = spawnSync(process.execPath, ['--import', 'tsx', '--expose-gc', `${dir}${f}`], { stdio: 'inherit' });
  if (r.status !== 0) failed++;
}
process.exit(failed > 0 ? 1 : 0);
