/** The synthetic survey read back through the results-CSV path (parse, map columns). */
import { parseCsvTable } from '../../src/io/read-results.js';
import { densityInputFromTable } from '../../src/density/input.js';
import type { DensityInput } from '../../src/density/input.js';
import type { SyntheticSurvey } from './synthetic-survey.js';
import { surveyCsv } from './synthetic-survey.js';

export function surveyInput(s: SyntheticSurvey, coords: 'xy' | 'lonlat' = 'xy'): DensityInput {
  return densityInputFromTable(parseCsvTable(surveyCsv(s, coords), 'synthetic.csv'));
}
