/** Option value parsers for the CLI: each failure is an InputError naming the option and value. */
import { InputError } from '../errors.js';
import { isLengthUnit, type LengthUnit } from '../units.js';

function optionError(option: string, value: string, expected: string): InputError {
  return new InputError(`option ${option}: got "${value}", expected ${expected}`);
}

export function parsePositive(option: string, value: string): number {
  const v = Number(value);
  if (!(value.trim() !== '' && Number.isFinite(v) && v > 0)) throw optionError(option, value, 'a positive number');
  return v;
}

export function parseNonNegative(option: string, value: string): number {
  const v = Number(value);
  if (!(value.trim() !== '' && Number.isFinite(v) && v >= 0)) throw optionError(option, value, 'a number >= 0');
  return v;
}

export function parseCount(option: string, value: string): number {
  const v = Number(value);
  if (!(Number.isInteger(v) && v >= 0)) throw optionError(option, value, 'a whole number >= 0');
  return v;
}

export function parseDensity(option: string, value: string): number {
  const v = Number(value);
  if (!(value.trim() !== '' && Number.isFinite(v) && v >= 100 && v <= 10000)) {
    throw optionError(option, value, 'a density in kg/m^3 between 100 and 10000 (e.g. 2670; g/cm^3 values must be multiplied by 1000)');
  }
  return v;
}

export function parseDensityList(option: string, value: string): number[] {
  const parts = value.split(',').map((s) => s.trim()).filter((s) => s !== '');
  if (parts.length === 0) throw optionError(option, value, 'a comma-separated list of densities in kg/m^3, e.g. 2200,2450,2670');
  const out = parts.map((p) => parseDensity(option, p));
  if (new Set(out).size !== out.length) throw optionError(option, value, 'each density once');
  return out;
}

export function parseLengthUnit(option: string, value: string): LengthUnit {
  if (!isLengthUnit(value)) throw optionError(option, value, 'one of m, ft (international foot), usft (US survey foot)');
  return value;
}

export function parseChoice<T extends string>(option: string, value: string, choices: readonly T[]): T {
  if (!(choices as readonly string[]).includes(value)) throw optionError(option, value, `one of ${choices.join(', ')}`);
  return value as T;
}
