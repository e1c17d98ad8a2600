/**
 * Output files are written to a temporary name beside the target and renamed into place when
 * complete, so an interrupted run never leaves a half-written result.
 */
import { rename, rm, writeFile, mkdir } from 'node:fs/promises';
import { dirname, basename, join } from 'node:path';
import { InputError } from '../errors.js';

export function temporaryPath(target: string): string {
  return join(dirname(target), `.${basename(target)}.${process.pid}.tmp`);
}

export async function writeFileAtomic(target: string, content: string): Promise<void> {
  const tmp = temporaryPath(target);
  try {
    await mkdir(dirname(target), { recursive: true });
    await writeFile(tmp, content, 'utf8');
    await rename(tmp, target);
  } catch (e) {
    await rm(tmp, { force: true });
    throw new InputError(`cannot write output: ${(e as Error).message}`, { file: target });
  }
}
