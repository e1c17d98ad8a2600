/** Station maps coloured by the complete Bouguer anomaly and by the terrain correction. */
import { stationMap } from '../charts/station-map.js';
import { CIVIDIS, VIRIDIS } from '../colour-maps.js';
import { divergingScale, sequentialScale } from '../colour-scale.js';
import { column } from '../report-data.js';
import type { ReportData } from '../report-data.js';
import { figure } from '../section-types.js';
import type { ReportSection, SectionResult } from '../section-types.js';

/** The relief remark shown under a map. */
export function reliefCaption(data: ReportData): string {
  return data.relief ? ' Background: shaded relief of the DEM (sun from the north-west).' : '';
}

export function mapOf(data: ReportData, id: string, title: string, values: Float64Array, valueLabel: string, kind: 'diverging-median' | 'diverging-zero' | 'sequential' | 'sequential-cividis'): string {
  const scale =
    kind === 'diverging-median'
      ? divergingScale(values, 'median')
      : kind === 'diverging-zero'
        ? divergingScale(values, 0)
        : sequentialScale(values, kind === 'sequential' ? VIRIDIS : CIVIDIS);
  return stationMap({
    id,
    title,
    coords: data.stations.coords,
    x: data.stations.x,
    y: data.stations.y,
    values,
    scale,
    valueLabel,
    ids: data.stations.ids,
    ...(data.relief ? { background: data.relief } : {}),
  });
}

export const cbaMapSection: ReportSection = {
  id: 'map-cba',
  title: 'Complete Bouguer anomaly',
  render: (data): SectionResult => {
    const cba = column(data, 'complete_bouguer_mgal');
    if (!cba) return { omitted: 'the results have no complete_bouguer_mgal values' };
    const svg = mapOf(data, 'map-cba', 'Complete Bouguer anomaly at the stations', cba, 'CBA (mGal)', 'diverging-median');
    return {
      html: figure(svg, 'Colours centred on the median anomaly; limits at the 2 % and 98 % quantiles (values beyond take the end colours). Grey: no value.' + reliefCaption(data)),
    };
  },
};

export const tcMapSection: ReportSection = {
  id: 'map-tc',
  title: 'Terrain correction',
  render: (data): SectionResult => {
    const tc = column(data, 'terrain_corr_mgal');
    if (!tc) return { omitted: 'the results have no terrain_corr_mgal values' };
    const svg = mapOf(data, 'map-tc', 'Terrain correction at the stations', tc, 'Terrain correction (mGal)', 'sequential');
    return { html: figure(svg, 'Sequential viridis scale between the 2 % and 98 % quantiles. Grey: no value.' + reliefCaption(data)) };
  },
};
