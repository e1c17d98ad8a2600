/** The streams a CLI run writes to; tests pass in-memory sinks. */
export interface CliIo {
  stdout: { write(s: string): unknown; isTTY?: boolean };
  stderr: { write(s: string): unknown; isTTY?: boolean };
}

/** Collects output in memory (for tests and for in-process callers). */
export function memoryIo(): CliIo & { out: () => string; err: () => string } {
  let out = '';
  let err = '';
  return {
    stdout: { write: (s: string) => { out += s; return true; }, isTTY: false },
    stderr: { write: (s: string) => { err += s; return true; }, isTTY: false },
    out: () => out,
    err: () => err,
  };
}
