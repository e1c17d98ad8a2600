/** Run summary: station counts, key column statistics, remarks, and the run's provenance. */
import { esc, fmt } from '../escape.js';
import { column } from '../report-data.js';
import type { ReportData } from '../report-data.js';
import type { ReportSection, SectionResult } from '../section-types.js';
import { summarize } from '../summary-stats.js';

/** Columns summarised in the run summary, with display names (units in the names). */
const KEY_COLUMNS: readonly [string, string][] = [
  ['height_m', 'Station height (m)'],
  ['free_air_anomaly_mgal', 'Free-air anomaly (mGal)'],
  ['simple_bouguer_mgal', 'Simple Bouguer anomaly (mGal)'],
  ['terrain_corr_mgal', 'Terrain correction (mGal)'],
  ['complete_bouguer_mgal', 'Complete Bouguer anomaly (mGal)'],
  ['height_misfit_m', 'Height misfit, station − DEM (m)'],
  ['dem_coverage', 'DEM coverage (fraction)'],
];

export const summarySection: ReportSection = {
  id: 'summary',
  title: 'Run summary',
  render: (data) => renderSummary(data),
};

function renderSummary(data: ReportData): SectionResult {
  const st = data.stations;
  const flagged = st.flags.filter((f) => f.length > 0).length;
  const facts: [string, string][] = [
    ['Results file', data.resultsPath],
    ['Stations', String(st.ids.length)],
    ['Stations with flags', String(flagged)],
    ['Map coordinates', st.coords === 'lonlat' ? 'longitude/latitude (degrees)' : 'projected x/y (metres)'],
  ];
  const rows = KEY_COLUMNS.flatMap(([name, label]) => {
    const c = column(data, name);
    if (!c) return [];
    const s = summarize(c);
    return [`<tr><th scope="row">${esc(label)}</th><td>${s.n}</td><td>${fmt(s.mean)}</td><td>${fmt(s.sd)}</td><td>${fmt(s.min)}</td><td>${fmt(s.max)}</td></tr>`];
  });
  const html = [
    keyValueTable(facts),
    rows.length > 0
      ? `<table class="stats"><caption>Key columns</caption><thead><tr><th>Column</th><th>n</th><th>mean</th><th>sd</th><th>min</th><th>max</th></tr></thead><tbody>${rows.join('')}</tbody></table>`
      : '',
    data.notes.length > 0 ? `<ul class="notes">${data.notes.map((n) => `<li>${esc(n)}</li>`).join('')}</ul>` : '',
    provenanceHtml(data.provenance),
  ].join('');
  return { html };
}

function keyValueTable(pairs: readonly [string, string][], caption?: string): string {
  const body = pairs.map(([k, v]) => `<tr><th scope="row">${esc(k)}</th><td>${esc(v)}</td></tr>`).join('');
  return `<table class="kv">${caption ? `<caption>${esc(caption)}</caption>` : ''}<tbody>${body}</tbody></table>`;
}

function show(v: unknown): string {
  if (v === null || v === undefined) return '–';
  if (typeof v === 'string') return v;
  if (typeof v === 'number' || typeof v === 'boolean') return String(v);
  return JSON.stringify(v);
}

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** Provenance JSON as tables: run facts, parameters, constants, DEMs; unknown keys listed as JSON. */
export function provenanceHtml(p: Record<string, unknown> | undefined): string {
  if (!p) return '<p class="note">No provenance file was found beside the results.</p>';
  const known = new Set(['talusVersion', 'commandLine', 'parameters', 'constants', 'dems', 'runTimeS', 'stationCounts']);
  const run: [string, string][] = [];
  if (p.talusVersion !== undefined) run.push(['talus version', show(p.talusVersion)]);
  if (p.commandLine !== undefined) run.push(['Command line', Array.isArray(p.commandLine) ? p.commandLine.map(String).join(' ') : show(p.commandLine)]);
  if (typeof p.runTimeS === 'number') run.push(['Run time (s)', fmt(p.runTimeS, 1)]);
  const counts = p.stationCounts;
  if (isRecord(counts)) {
    if (counts.total !== undefined) run.push(['Stations in run', show(counts.total)]);
    if (isRecord(counts.flagged)) run.push(['Flag counts', Object.entries(counts.flagged).map(([k, v]) => `${k}: ${show(v)}`).join(', ') || 'none']);
  }
  for (const [k, v] of Object.entries(p)) if (!known.has(k)) run.push([k, show(v)]);
  const parts = [`<h3>Provenance</h3>`, keyValueTable(run, 'Run')];
  if (isRecord(p.parameters)) parts.push(keyValueTable(Object.entries(p.parameters).map(([k, v]) => [k, show(v)]), 'Parameters'));
  if (isRecord(p.constants)) parts.push(keyValueTable(Object.entries(p.constants).map(([k, v]) => [k, show(v)]), 'Constants'));
  if (Array.isArray(p.dems) && p.dems.length > 0) {
    const keys = ['path', 'sha256', 'width', 'height', 'crs', 'cellSize'];
    const head = keys.map((k) => `<th>${esc(k)}</th>`).join('');
    const body = p.dems
      .map((d) => `<tr>${keys.map((k) => `<td class="${k === 'sha256' ? 'hash' : ''}">${esc(show(isRecord(d) ? d[k] : undefined))}</td>`).join('')}</tr>`)
      .join('');
    parts.push(`<table class="dems"><caption>DEMs</caption><thead><tr>${head}</tr></thead><tbody>${body}</tbody></table>`);
  }
  return parts.join('');
}
