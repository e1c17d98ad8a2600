/** Vertical colour bar legend with ticks and a unit label, drawn to the right of a map. */
import { esc, px, tickLabel } from '../escape.js';
import { niceTicks } from '../ticks.js';
import type { ColourScale } from '../colour-scale.js';

/** Width the colour bar needs to the right of the plot area, px. */
export const COLOUR_BAR_PAD = 96;

export function colourBar(id: string, scale: ColourScale, label: string, x: number, top: number, height: number): string {
  const gradId = `grad-${id}`;
  const n = scale.map.stops.length;
  // gradient runs bottom (min) to top (max)
  const stops = scale.map.stops.map((c, i) => `<stop offset="${px((i / (n - 1)) * 100)}%" stop-color="${esc(c)}"/>`).join('');
  const barW = 14;
  const t = niceTicks(scale.min, scale.max, 8);
  const span = scale.max - scale.min;
  const yOf = (v: number) => top + height - ((v - scale.min) / (span || 1)) * height;
  const ticks = t.ticks
    .filter((v) => v >= scale.min - 1e-9 * Math.abs(span) && v <= scale.max + 1e-9 * Math.abs(span))
    .map((v) => `<line x1="${x + barW}" x2="${x + barW + 4}" y1="${px(yOf(v))}" y2="${px(yOf(v))}"/><text x="${x + barW + 7}" y="${px(yOf(v) + 4)}">${esc(tickLabel(v, t.step))}</text>`)
    .join('');
  return (
    `<g class="colour-bar">` +
    `<defs><linearGradient id="${esc(gradId)}" x1="0" y1="1" x2="0" y2="0">${stops}</linearGradient></defs>` +
    `<rect x="${x}" y="${top}" width="${barW}" height="${px(height)}" fill="url(#${esc(gradId)})" stroke="#555" stroke-width="0.5"/>` +
    `<g class="axis">${ticks}</g>` +
    `<text class="axis-label" transform="translate(${px(x + COLOUR_BAR_PAD - 14)} ${px(top + height / 2)}) rotate(-90)" text-anchor="middle">${esc(label)}</text>` +
    `</g>`
  );
}
