/**
 * Unit conversion table. The engine works in SI (m, kg/m^3, m/s^2); these factors are used only
 * where values enter or leave talus.
 */

/** 1 mGal in m/s^2 (definition: 1 Gal = 1 cm/s^2). */
export const MGAL = 1e-5;
/** 1 gravity unit (g.u.) in m/s^2 (1 g.u. = 1 um/s^2 = 0.1 mGal). */
export const GRAVITY_UNIT = 1e-6;
/** International foot in metres (exact, 1959 agreement). */
export const FOOT_M = 0.3048;
/** US survey foot in metres (exact, 1200/3937). */
export const US_SURVEY_FOOT_M = 1200 / 3937;
/** Degrees to radians. */
export const DEG = Math.PI / 180;

export type LengthUnit = 'm' | 'ft' | 'usft';

/** Metres per one unit of the given length unit. */
export function metresPer(unit: LengthUnit): number {
  switch (unit) {
    case 'm':
      return 1;
    case 'ft':
      return FOOT_M;
    case 'usft':
      return US_SURVEY_FOOT_M;
  }
}

export function isLengthUnit(s: string): s is LengthUnit {
  return s === 'm' || s === 'ft' || s === 'usft';
}

export const toMgal = (ms2: number): number => ms2 / MGAL;
export const fromMgal = (mgal: number): number => mgal * MGAL;
