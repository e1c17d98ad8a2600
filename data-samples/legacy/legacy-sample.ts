/**
 * Turns a modern (invented) station list into an invented legacy-style one: heights in
 * international feet on an old vertical datum, gravity on the Potsdam system, hand-chart style
 * terrain corrections rounded to 0.1 mGal, and anomalies reduced with the 1930 formula,
 * first-order free-air and a 2670 kg/m^3 slab (slab constant of G = 6.673e-11), printed to
 * 0.01 mGal. Pure: the command-line wrapper is make-legacy-sample.ts.
 */
import { reduceWithFormulas } from '../../src/legacy/formula-set.js';
import type { FormulaSet } from '../../src/legacy/formula-set.js';
import { POTSDAM_TO_IGSN71_MGAL } from '../../src/legacy/gravity-datum.js';
import { FOOT_M } from '../../src/units.js';
import { mulberry32 as uniformSource } from '../../test/helpers/seeded-random.js';

/** One station of the modern list (IGSN71 gravity, metres). */
export interface ModernStation {
  id: string;
  lon: number;
  lat: number;
  heightM: number;
  gobsMgal: number;
  /** A modern terrain correction to imitate a chart value from; NaN when none. */
  terrainCorrMgal: number;
}

export interface LegacySampleOptions {
  /** Seed of the invented chart-TC scatter. */
  seed: number;
  /** Old vertical datum minus new, m: old heights are this much higher. */
  oldDatumOffsetM: number;
  /** Station ids whose printed CBA gets an invented +1.00 mGal copying error. */
  plantMismatchIds: readonly string[];
}

/** The formulas the invented legacy survey declares. */
export const LEGACY_SAMPLE_FORMULAS: FormulaSet = {
  normal: 'igf1930',
  freeAir: 'first-order',
  bouguer: 'slab',
  densityKgM3: 2670,
  atmospheric: false,
  gravitationalConstant: 6.673e-11,
};

export const LEGACY_SAMPLE_HEADER = [
  'id',
  'lon',
  'lat',
  'height_ft',
  'gobs_mgal',
  'legacy_tc_mgal',
  'legacy_fa_mgal',
  'legacy_cba_mgal',
] as const;


const roundTo = (v: number, step: number): number => Math.round(v / step) * step;

/** Legacy rows (cells as printed) for the modern stations, in input order. */
export function makeLegacyRows(stations: readonly ModernStation[], options: LegacySampleOptions): string[][] {
  const next = uniformSource(options.seed);
  return stations.map((st) => {
    const u = next();
    const heightFt = roundTo((st.heightM + options.oldDatumOffsetM) / FOOT_M, 0.1);
    // Potsdam = IGSN71 - offset: the datum offset is what is ADDED to Potsdam to get IGSN71.
    const gobsPotsdam = roundTo(st.gobsMgal - POTSDAM_TO_IGSN71_MGAL, 0.01);
    const chartTc = Number.isFinite(st.terrainCorrMgal)
      ? roundTo(Math.max(0, st.terrainCorrMgal * (0.85 + 0.2 * u)), 0.1)
      : roundTo(0.2 + 2.8 * u, 0.1);
    const r = reduceWithFormulas(
      { latDeg: st.lat, heightM: heightFt * FOOT_M, gobsMgal: gobsPotsdam, tcMgal: chartTc },
      LEGACY_SAMPLE_FORMULAS,
    );
    const typo = options.plantMismatchIds.includes(st.id) ? 1 : 0;
    return [
      st.id,
      st.lon.toFixed(6),
      st.lat.toFixed(6),
      heightFt.toFixed(1),
      gobsPotsdam.toFixed(2),
      chartTc.toFixed(1),
      r.freeAirAnomalyMgal.toFixed(2),
      (r.completeBouguerMgal + typo).toFixed(2),
    ];
  });
}

/** Parses the modern station list's records (header id, lon, lat, height_m, gobs_mgal[, terrain_corr_mgal]). */
export function modernStationsFromRecords(records: readonly Record<string, string>[], file: string): ModernStation[] {
  return records.map((rec, i) => {
    const num = (key: string, required: boolean): number => {
      const text = rec[key];
      if (text === undefined || text.trim() === '') {
        if (required) throw new Error(`${file}:${i + 2}: column ${key} is missing`);
        return NaN;
      }
      const v = Number(text);
      if (!Number.isFinite(v)) throw new Error(`${file}:${i + 2}: column ${key}: "${text}" is not a number`);
      return v;
    };
    const id = rec['id'];
    if (id === undefined || id.trim() === '') throw new Error(`${file}:${i + 2}: column id is missing`);
    return {
      id,
      lon: num('lon', true),
      lat: num('lat', true),
      heightM: num('height_m', true),
      gobsMgal: num('gobs_mgal', true),
      terrainCorrMgal: num('terrain_corr_mgal', false),
    };
  });
}
