import { describe, expect, it } from 'vitest';
import { formatQcSummary, qcSummary } from '../../src/qc/qc-summary.js';
import { QC_FLAGS } from '../../src/qc/flag-codes.js';

describe('qcSummary', () => {
  const flags = [[], ['height_misfit', 'above_terrain'], ['tc_outlier'], ['height_misfit', 'below_terrain'], ['zz_custom'], [], ['tc_outlier', 'tc_outlier']];
  const ids = ['A', 'B', 'C', 'D', 'E', 'F', 'G'];
  const misfit = Float64Array.from([0.5, 23.4, NaN, -15.1, 2, -0.2, 1]);

  it('counts stations per flag (a code repeated on one station counts once), in table order', () => {
    const s = qcSummary(flags, ids, misfit, 3);
    expect(s.stations).toBe(7);
    expect(s.flaggedStations).toBe(5);
    expect(s.counts).toEqual([
      { code: 'height_misfit', count: 2 },
      { code: 'above_terrain', count: 1 },
      { code: 'below_terrain', count: 1 },
      { code: 'tc_outlier', count: 2 },
      { code: 'zz_custom', count: 1 },
    ]);
    expect(s.worstMisfits).toEqual([
      { id: 'B', misfitM: 23.4 },
      { id: 'D', misfitM: -15.1 },
      { id: 'E', misfitM: 2 },
    ]);
  });

  it('formats a short digest naming each flag with its meaning and the worst misfits', () => {
    const text = formatQcSummary(qcSummary(flags, ids, misfit, 2));
    expect(text.split('\n')[0]).toBe('QC: 7 stations, 5 flagged');
    expect(text).toMatch(/height_misfit\s+2\s+\|station height - DEM height\| exceeds the limit/);
    expect(text).toContain('worst height misfits (station - DEM): B +23.4 m, D -15.1 m');
  });

  it('a clean run says none flagged', () => {
    expect(formatQcSummary(qcSummary([[], []], ['A', 'B'], new Float64Array([NaN, NaN])))).toBe('QC: 2 stations, none flagged');
  });

  it('the flag table holds every code of the results contract, each once', () => {
    const codes = QC_FLAGS.map((f) => f.code);
    expect(new Set(codes).size).toBe(codes.length);
    expect(codes).toEqual([
      'bad_row', 'outside_dem', 'dem_partial', 'nodata_near', 'height_misfit', 'above_terrain', 'below_terrain',
      'duplicate_position', 'tc_outlier', 'legacy_tc_change', 'legacy_mismatch', 'outside_geoid',
    ]);
  });
});
