/**
 * Progress on stderr: stations done, rate and time left. Drawn only when stderr is a
 * terminal (CI logs and pipes stay clean); redrawn at most 10 times a second.
 */
import type { CliIo } from '../cli/io.js';

export interface Progress {
  update(done: number): void;
  finish(): void;
}

export function makeProgress(io: CliIo, total: number, label: string, enabled: boolean): Progress {
  if (!enabled || !io.stderr.isTTY || total === 0) return { update: () => {}, finish: () => {} };
  const t0 = performance.now();
  let last = 0;
  const draw = (done: number): void => {
    const elapsed = (performance.now() - t0) / 1000;
    const rate = elapsed > 0 ? done / elapsed : 0;
    const left = rate > 0 ? (total - done) / rate : NaN;
    const width = 30;
    const filled = Math.round((width * done) / total);
    const bar = '#'.repeat(filled) + '-'.repeat(width - filled);
    const eta = Number.isFinite(left) ? `${Math.ceil(left)} s left` : '';
    io.stderr.write(`\r${label} [${bar}] ${done}/${total} stations, ${rate.toFixed(0)}/s ${eta}   `);
  };
  return {
    update(done: number) {
      const now = performance.now();
      if (now - last < 100 && done < total) return;
      last = now;
      draw(done);
    },
    finish() {
      draw(total);
      io.stderr.write('\n');
    },
  };
}

/**
 * One-line notes of the stages before the terrain (reading DEMs, building pyramids), with the
 * time each took, on a terminal only: a large DEM takes seconds to decode.
 */
export function makeStageNotes(io: CliIo, enabled: boolean): (what: string) => void {
  if (!enabled || !io.stderr.isTTY) return () => {};
  let t = performance.now();
  let pending = '';
  return (what: string) => {
    const now = performance.now();
    if (pending) io.stderr.write(` ${((now - t) / 1000).toFixed(1)} s\n`);
    t = now;
    pending = what;
    if (what) io.stderr.write(`${what} ...`);
  };
}
