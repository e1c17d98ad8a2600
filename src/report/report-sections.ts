/**
 * The report's sections, in order. To add a section, write a ReportSection in sections/ and put
 * it in this list; buildReport draws every section that has something to show and lists the
 * others, with the reason, in the table of contents.
 */
import type { ReportSection } from './section-types.js';
import { summarySection } from './sections/summary-section.js';
import { cbaMapSection, tcMapSection } from './sections/map-sections.js';
import { terrainHeightSection } from './sections/terrain-height-section.js';
import { misfitSection } from './sections/misfit-section.js';
import { densitySection } from './sections/density-section.js';
import { legacySection } from './sections/legacy-section.js';
import { deltaSection } from './sections/delta-section.js';
import { flagsSection } from './sections/flags-section.js';

export const REPORT_SECTIONS: readonly ReportSection[] = [
  summarySection,
  cbaMapSection,
  tcMapSection,
  terrainHeightSection,
  misfitSection,
  densitySection,
  legacySection,
  deltaSection,
  flagsSection,
];
