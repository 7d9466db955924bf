import type { Level } from "./model.js";
import { escapeHtml as html } from "./html-escape.js";
import { formatCount } from "./wording.js";

/** Colours by level, shared by the chart and the page's badges. */
export const LEVEL_COLOUR: Readonly<Record<Level, string>> = { error: "#b3261e", warning: "#9a5b00", note: "#2c5aa0" };

/** One bar of the problems-per-check chart. */
export interface Bar {
  readonly label: string;
  readonly value: number;
  readonly level: Level;
  readonly hint: string;
}

/** A horizontal bar chart as inline SVG: one labelled bar per check, lengths proportional to counts. */
export function barChart(bars: readonly Bar[], title: string): string {
  const rowH = 28;
  const labelW = 230;
  const barW = 360;
  const width = labelW + barW + 80;
  const height = bars.length * rowH + 8;
  const max = Math.max(1, ...bars.map((b) => b.value));
  const rows = bars.map((b, i) => {
    const y = 4 + i * rowH;
    const w = b.value === 0 ? 0 : Math.max(2, Math.round((b.value / max) * barW));
    const label = b.label.length > 32 ? `${b.label.slice(0, 31)}…` : b.label;
    return (
      `<g><title>${html(`${b.label}: ${formatCount(b.value)} (${b.level}) — ${b.hint}`)}</title>` +
      `<text x="${labelW - 8}" y="${y + 18}" text-anchor="end" class="bar-label">${html(label)}</text>` +
      `<rect x="${labelW}" y="${y + 5}" width="${w}" height="${rowH - 10}" rx="3" fill="${LEVEL_COLOUR[b.level]}"/>` +
      `<text x="${labelW + w + 6}" y="${y + 18}" class="bar-value">${formatCount(b.value)}</text></g>`
    );
  });
  return (
    `<svg class="bars" role="img" aria-label="${html(title)}" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}">` +
    `<title>${html(title)}</title>${rows.join("")}</svg>`
  );
}

/** A small histogram of equal-width bins as inline SVG. */
export function histogram(bins: readonly number[], title: string): string {
  const width = 140;
  const height = 32;
  const n = Math.max(1, bins.length);
  const gap = 1;
  const w = (width - gap * (n - 1)) / n;
  const max = Math.max(1, ...bins);
  const rects = bins.map((v, i) => {
    const h = v === 0 ? 0 : Math.max(1, Math.round((v / max) * (height - 2)));
    return `<rect x="${(i * (w + gap)).toFixed(1)}" y="${height - h}" width="${w.toFixed(1)}" height="${h}"><title>${formatCount(v)}</title></rect>`;
  });
  return (
    `<svg class="hist" role="img" aria-label="${html(title)}" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}">` +
    `<line x1="0" y1="${height - 0.5}" x2="${width}" y2="${height - 0.5}" class="axis"/>${rects.join("")}</svg>`
  );
}
