/** The HTML report: plain data in, one self-contained HTML file out. */
export { buildReport } from './build-report.js';
export { writeReport } from './write-report.js';
export type { WriteReportOptions, WriteReportResult } from './write-report.js';
export { loadReportData, provenancePathFor, REPORT_DENSITY_RANGE } from './load-report-data.js';
export type { LoadOptions } from './load-report-data.js';
export { REPORT_SECTIONS } from './report-sections.js';
export type { ReportSection, SectionResult } from './section-types.js';
export type { ReportData, ReportStations, NettletonView, ParasnisView, DensityView } from './report-data.js';
