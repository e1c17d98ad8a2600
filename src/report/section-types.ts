/** A report section: renders its HTML body from the report data, or says why it is left out. */
import { esc } from './escape.js';
import type { ReportData } from './report-data.js';

export type SectionResult = { html: string } | { omitted: string };

export interface ReportSection {
  /** Anchor id, kebab-case (also used to prefix the section's chart ids). */
  id: string;
  title: string;
  render(data: ReportData): SectionResult;
}

/** A figure around one chart; the caption is plain text (escaped here). */
export function figure(chartSvg: string, caption: string): string {
  return `<figure>${chartSvg}<figcaption>${esc(caption)}</figcaption></figure>`;
}
