/** Station height minus DEM height: a histogram and a map (diverging, centred on zero). */
import { histogramChart } from '../charts/histogram-chart.js';
import { column } from '../report-data.js';
import type { ReportData } from '../report-data.js';
import { figure } from '../section-types.js';
import type { ReportSection, SectionResult } from '../section-types.js';
import { mapOf, reliefCaption } from './map-sections.js';

/** A misfit tolerance (m) from the provenance parameters, when the run recorded one. */
export function misfitTolerance(data: ReportData): number | undefined {
  const params = data.provenance?.parameters;
  if (typeof params !== 'object' || params === null) return undefined;
  for (const [k, v] of Object.entries(params as Record<string, unknown>)) {
    if (/misfit/i.test(k) && typeof v === 'number' && v > 0) return v;
  }
  return undefined;
}

export const misfitSection: ReportSection = {
  id: 'misfit',
  title: 'Height misfit (station − DEM)',
  render: (data): SectionResult => {
    const misfit = column(data, 'height_misfit_m');
    if (!misfit) return { omitted: 'the results have no height_misfit_m values' };
    const tol = misfitTolerance(data);
    const markers = tol !== undefined ? [{ x: -tol, label: `−${tol} m` }, { x: tol, label: `+${tol} m` }] : [];
    const hist = histogramChart({ id: 'misfit-hist', title: 'Height misfit distribution', xLabel: 'Station height − DEM height (m)', values: misfit, markers });
    const map = mapOf(data, 'misfit-map', 'Height misfit at the stations', misfit, 'Misfit (m)', 'diverging-zero');
    return {
      html:
        figure(hist, tol !== undefined ? `Dashed lines: the run's misfit tolerance of ±${tol} m.` : 'Positive: station above the DEM surface.') +
        figure(map, 'Blue: station below the DEM; orange: above. Centred on zero.' + reliefCaption(data)),
    };
  },
};
