/**
 * Observed gravity as legacy files store it, brought to the IGSN71 datum in mGal.
 *
 * Conventions (written once here, pinned by test/legacy/gravity-datum.test.ts):
 * - A datum offset is the number ADDED to a gravity value in its own datum to obtain the
 *   IGSN71 value: g_IGSN71 = g_stored + offset. For the Potsdam system the offset is -14.0 mGal
 *   ([WoollardGodley1980]: IGSN71 values are about 14 mGal lower than Potsdam values).
 * - A per-row offset (for surveys tied to a local base whose own shift is known) replaces the
 *   datum's offset for that row; an empty cell (NaN) falls back to the datum's offset.
 * - Stored values are converted in this order: add back the removed constant (in the column's
 *   own units), convert g.u. to mGal (1 mGal = 10 g.u.), then shift the datum.
 */
import { InputError } from '../errors.js';
import type { InputErrorContext } from '../errors.js';
import { GRAVITY_UNIT, MGAL } from '../units.js';

export type GravityDatum = 'igsn71' | 'potsdam';
/** Units of a stored gravity column: milligal or gravity units (1 g.u. = 1 um/s^2 = 0.1 mGal). */
export type GravityUnit = 'mgal' | 'gu';

/** Offset added to Potsdam-system gravity to obtain IGSN71, mGal [WoollardGodley1980]. */
export const POTSDAM_TO_IGSN71_MGAL = -14.0;

/** How a legacy file stores observed gravity. */
export interface GravityConvention {
  /** Datum the stored values refer to. */
  datum: GravityDatum;
  /** Units of the stored values. */
  units: GravityUnit;
  /**
   * Constant that was subtracted from every stored value, in the column's own units (e.g.
   * 900000 when 979123.45 mGal is stored as 79123.45). It is added back. 0 = none.
   */
  storedOffset: number;
}

export const DEFAULT_GRAVITY_CONVENTION: GravityConvention = { datum: 'igsn71', units: 'mgal', storedOffset: 0 };

export function isGravityDatum(s: string): s is GravityDatum {
  return s === 'igsn71' || s === 'potsdam';
}

export function isGravityUnit(s: string): s is GravityUnit {
  return s === 'mgal' || s === 'gu';
}

/** Parses a gravity datum option value ('igsn71' or 'potsdam', case-insensitive). */
export function parseGravityDatum(text: string, field = '--gravity-datum'): GravityDatum {
  const s = text.trim().toLowerCase();
  if (!isGravityDatum(s)) throw new InputError(`unknown gravity datum "${text}": expected igsn71 or potsdam`, { field });
  return s;
}

/** Parses a gravity unit option value ('mgal' or 'gu', case-insensitive). */
export function parseGravityUnit(text: string, field = '--gravity-units'): GravityUnit {
  const s = text.trim().toLowerCase();
  if (!isGravityUnit(s)) throw new InputError(`unknown gravity units "${text}": expected mgal or gu`, { field });
  return s;
}

/** Parses the constant removed from stored gravity (a finite number, in the column's units). */
export function parseGobsOffset(text: string, field = '--gobs-offset'): number {
  const v = text.trim() === '' ? NaN : Number(text);
  if (!Number.isFinite(v)) throw new InputError(`gravity offset "${text}" is not a finite number`, { field });
  return v;
}

/**
 * Parses one cell of a per-row datum offset column, mGal: empty gives NaN (the datum's own
 * offset applies); anything else must be a finite number. `ctx` names file, line, station and
 * column for the message.
 */
export function parseDatumOffsetCell(text: string, ctx: InputErrorContext): number {
  if (text.trim() === '') return NaN;
  const v = Number(text);
  if (!Number.isFinite(v)) throw new InputError(`datum offset "${text}" is not a number of mGal`, ctx);
  return v;
}

/** mGal per one unit of the stored column. */
export function mgalPerGravityUnit(units: GravityUnit): number {
  return units === 'mgal' ? 1 : GRAVITY_UNIT / MGAL;
}

/**
 * Offset, mGal, added to a value in `datum` to obtain IGSN71: the per-row offset when it is a
 * number, otherwise the datum's own (0 for IGSN71, -14.0 for Potsdam).
 */
export function datumOffsetMgal(datum: GravityDatum, perRowOffsetMgal?: number): number {
  if (perRowOffsetMgal !== undefined && !Number.isNaN(perRowOffsetMgal)) return perRowOffsetMgal;
  return datum === 'potsdam' ? POTSDAM_TO_IGSN71_MGAL : 0;
}

/**
 * Gravity in `datum` (mGal) to IGSN71 (mGal): gobs + offset, the offset as in datumOffsetMgal.
 * NaN gravity gives NaN.
 */
export function toIgsn71Mgal(gobsMgal: number, datum: GravityDatum, perRowOffsetMgal?: number): number {
  return gobsMgal + datumOffsetMgal(datum, perRowOffsetMgal);
}

/**
 * A stored value to mGal in the stored datum (constant added back, units converted, no datum
 * shift): the gravity the legacy reduction itself used.
 */
export function storedGravityToMgal(stored: number, convention: GravityConvention): number {
  return (stored + convention.storedOffset) * mgalPerGravityUnit(convention.units);
}

/** A stored value to IGSN71 mGal: storedGravityToMgal, then the datum shift. */
export function storedGravityToIgsn71Mgal(
  stored: number,
  convention: GravityConvention,
  perRowOffsetMgal?: number,
): number {
  return toIgsn71Mgal(storedGravityToMgal(stored, convention), convention.datum, perRowOffsetMgal);
}

/** One conversion step, for the provenance file. */
export interface GravityConversionStep {
  /** What kind of step. */
  step: 'stored-offset' | 'units' | 'datum' | 'per-row-datum-offset';
  /** One-line human description with the numbers used. */
  description: string;
}

/**
 * Every conversion applied to the observed gravity column, in the order applied; empty when
 * the column was already IGSN71 mGal with nothing removed and no per-row offsets.
 * `perRowOffsetColumn` names the per-row offset column when one is used.
 */
export function describeGravityConversions(
  convention: GravityConvention,
  perRowOffsetColumn?: string,
): GravityConversionStep[] {
  const steps: GravityConversionStep[] = [];
  const unitLabel = convention.units === 'mgal' ? 'mGal' : 'g.u.';
  if (convention.storedOffset !== 0) {
    steps.push({
      step: 'stored-offset',
      description: `added back the constant ${convention.storedOffset} ${unitLabel} removed from stored values`,
    });
  }
  if (convention.units === 'gu') {
    steps.push({ step: 'units', description: 'converted gravity units to mGal (1 mGal = 10 g.u.)' });
  }
  if (convention.datum === 'potsdam') {
    steps.push({
      step: 'datum',
      description: `Potsdam to IGSN71: added ${POTSDAM_TO_IGSN71_MGAL.toFixed(1)} mGal [WoollardGodley1980]`,
    });
  }
  if (perRowOffsetColumn !== undefined) {
    steps.push({
      step: 'per-row-datum-offset',
      description: `where column ${perRowOffsetColumn} has a value, it replaced the datum offset (added, mGal)`,
    });
  }
  return steps;
}
