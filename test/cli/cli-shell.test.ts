import { describe, expect, it } from 'vitest';
import { runCli } from '../../src/cli/main.js';
import { memoryIo } from '../../src/cli/io.js';
import { readFileSync } from 'node:fs';

describe('CLI shell', () => {
  it('--help exits 0 and teaches the subcommands', async () => {
    const io = memoryIo();
    expect(await runCli(['--help'], io)).toBe(0);
    expect(io.out()).toContain('Usage: talus');
    expect(io.out()).toContain('Exit codes');
  });

  it('--version prints the package.json version', async () => {
    const io = memoryIo();
    expect(await runCli(['--version'], io)).toBe(0);
    const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string };
    expect(io.out().trim()).toBe(pkg.version);
  });

  it('an unknown command is a usage error: exit 2 with a message on stderr', async () => {
    const io = memoryIo();
    expect(await runCli(['no-such-command'], io)).toBe(2);
    expect(io.err()).toMatch(/unknown command|too many arguments/);
  });
});
