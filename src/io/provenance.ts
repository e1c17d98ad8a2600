/** The provenance record written beside every results file (`<out>.provenance.json`). */
import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';

export async function sha256File(path: string): Promise<string> {
  const h = createHash('sha256');
  await new Promise<void>((resolve, reject) => {
    createReadStream(path)
      .on('data', (chunk) => h.update(chunk))
      .on('end', () => resolve())
      .on('error', reject);
  });
  return h.digest('hex');
}

export interface DemProvenance {
  role: 'fine' | 'far';
  path: string;
  sha256: string;
  fileSizeBytes: number;
  width: number;
  height: number;
  crs: string;
  cellSizeX: number;
  cellSizeY: number;
  cellSizeM: number;
  windowRead: { width: number; height: number; originX: number; originY: number };
}

export interface Provenance {
  talusVersion: string;
  commandLine: string[];
  createdUtc: string;
  parameters: Record<string, unknown>;
  constants: Record<string, number | string>;
  formulas: Record<string, string>;
  stations: { file: string; sha256: string; rows: number };
  dems: DemProvenance[];
  zonePlan: Record<string, unknown>;
  runTimeS: number;
  stationCounts: { total: number; computed: number; flagged: Record<string, number> };
  performance: Record<string, number>;
  warnings: string[];
}
