/**
 * Ctrl-C during `talus reduce`: the run stops, exits with an input-error code and a one-line
 * message, and leaves neither the results file nor a temporary file behind.
 */
import { describe, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../..', import.meta.url));

describe('interrupting a run', () => {
  it('SIGINT stops the run cleanly and writes no output', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'talus-int-'));
    const out = join(dir, 'r.csv');
    const args = [
      'reduce', '--stations', 'data-samples/demo/stations.csv', '--dem', 'data-samples/demo/fine-dem.tif',
      '--far-dem', 'data-samples/demo/far-dem.tif', '--out', out, '--workers', '2', '--accuracy', '0.00002', '--no-progress',
    ];
    const script = `import('./src/cli/main.ts').then(async (m) => { process.exitCode = await m.runCli(${JSON.stringify(args)}, { stdout: process.stdout, stderr: process.stderr }); })`;
    const child = spawn(process.execPath, ['--import', 'tsx', '-e', script], { cwd: root, stdio: ['ignore', 'pipe', 'pipe'] });
    let err = '';
    child.stderr.on('data', (d: Buffer) => (err += d.toString()));
    // interrupt once the terrain stage is running (the DEMs load in about a second; this accuracy makes the terrain stage take tens of seconds)
    const timer = setTimeout(() => child.kill('SIGINT'), 2500);
    const code = await new Promise<number | null>((resolve) => child.on('exit', (c) => resolve(c)));
    clearTimeout(timer);
    expect(code, err).toBe(2);
    expect(err).toMatch(/interrupted: no output was written/);
    expect(existsSync(out)).toBe(false);
    expect(readdirSync(dir)).toEqual([]);
    rmSync(dir, { recursive: true, force: true });
  }, 60000);
});
