#!/usr/bin/env node
// Thin shim: argv -> src/cli -> exit code (0 ok, 2 input error, 1 bug).
// Runs the compiled CLI (built by `npm install` through the prepare script).
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const compiled = fileURLToPath(new URL('../dist/src/cli/main.js', import.meta.url));
if (!existsSync(compiled)) {
  process.stderr.write('talus: the compiled CLI is missing (dist/). Run `npm install` or `npm run build` first.\n');
  process.exit(1);
}
// A reader that goes away (e.g. `talus reduce --help | head`) is not an error.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (e) => {
    if (e && e.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw e;
  });
}
const { runCli } = await import(compiled);
const code = await runCli(process.argv.slice(2), {
  stdout: process.stdout,
  stderr: process.stderr,
});
process.exitCode = code;
