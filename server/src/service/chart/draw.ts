/** The svg itself: every element as a string, from the layout and the placed labels. Nothing here measures. */
import type { Segment } from './geometry';
import type { ChartInput, Plotted } from './input';
import type { LabelPlacement } from './labels';
import { FONT, PAD, TITLE_Y, type Axis, type ChartLayout, type GuideLine, type LegendItem } from './layout';
import { COLOURS, STYLE } from './style';
import { coord, count, energyText, escapeXml, shorten, textWidth } from './text';

const EMPTY_HEIGHT = 64;

export function drawChart(input: ChartInput, layout: ChartLayout, placement: LabelPlacement, description: string): string {
  return [
    svgOpen(input.width, input.height, input.id, ` font-size="${FONT.label}"`),
    `<title id="${input.id}-title">${escapeXml(input.title)}</title>`,
    `<desc id="${input.id}-desc">${escapeXml(description)}</desc>`,
    `<style>${STYLE}</style>`,
    titleRow(input, placement.omitted),
    legend(layout.legend),
    grid(layout),
    plotRect(layout),
    axisLines(layout),
    tickLabels(layout),
    axisTitles(input, layout),
    guideLines(layout.guides),
    meltingPoints(input.plotted, layout),
    energyMarkers(input, layout),
    labels(placement, layout.guides),
    `</svg>`,
  ].join('');
}

/**
 * The title, and at the right of its row a note when labels were left out, so that no salt loses its label
 * without a word (the <desc> says the same).
 */
function titleRow(input: ChartInput, omitted: number): string {
  const note = omitted ? `${count(omitted, 'label')} left out for room; every point has a tooltip` : '';
  const noteWidth = note ? textWidth(note, FONT.note) + 16 : 0;
  const title = shorten(input.title, Math.max(8, Math.floor((input.width - 2 * PAD - noteWidth) / 8)));
  return (
    `<text class="iw-lc-text iw-lc-title" fill="currentColor" x="${coord(PAD)}" y="${coord(TITLE_Y)}" font-size="${FONT.title}" font-weight="600">${escapeXml(title)}</text>` +
    (note
      ? `<text class="iw-lc-text iw-lc-note" fill="currentColor" x="${coord(input.width - PAD)}" y="${coord(TITLE_Y)}" font-size="${FONT.note}" text-anchor="end" opacity="0.8">${escapeXml(note)}</text>`
      : '')
  );
}

function svgOpen(width: number, height: number, id: string, extra = ''): string {
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" class="iw-lattice" width="${width}" height="${height}" ` +
    `viewBox="0 0 ${width} ${height}" role="img" aria-labelledby="${id}-title ${id}-desc"${extra}>`
  );
}

/** A small svg saying there is nothing to chart, and why. */
export function drawEmptyChart(input: ChartInput): string {
  const message = 'No salts with lattice energies to chart.';
  const reason = input.leftOut.join(' ');
  const { width, id } = input;
  return [
    svgOpen(width, EMPTY_HEIGHT, id),
    `<title id="${id}-title">${escapeXml(input.title)}</title>`,
    `<desc id="${id}-desc">${escapeXml(reason ? `${message} ${reason}` : message)}</desc>`,
    `<style>${STYLE}</style>`,
    `<g class="iw-lc-text" fill="currentColor" font-size="13">`,
    `<text x="12" y="${reason ? 26 : 37}">${escapeXml(message)}</text>`,
    reason ? `<text x="12" y="46" font-size="11" opacity="0.8">${escapeXml(shorten(reason, Math.floor((width - 24) / 6)))}</text>` : '',
    `</g>`,
    `</svg>`,
  ].join('');
}

/** Wraps parts in a group when there are any. */
const group = (open: string, parts: string[]) => (parts.length ? `${open}${parts.join('')}</g>` : '');

const line = (x1: number, y1: number, x2: number, y2: number, attrs = '') =>
  `<line${attrs} x1="${coord(x1)}" y1="${coord(y1)}" x2="${coord(x2)}" y2="${coord(y2)}"/>`;

function legend(items: readonly LegendItem[]): string {
  return group(
    `<g class="iw-lc-legend">`,
    items.map((item) => {
      const mx = item.x + 8;
      const my = item.y - 4;
      const symbol =
        item.kind === 'est'
          ? estimateMarker(mx, my, 4.5)
          : item.kind === 'meas'
            ? measuredMarker(mx, my, 4.25)
            : item.kind === 'melt'
              ? meltCross(mx, my, 3.75)
              : guideStroke({ x1: mx - 8, y1: my, x2: mx + 8, y2: my });
      return (
        `<g class="iw-lc-legend-item" data-kind="${item.kind}">${symbol}` +
        `<text class="iw-lc-text" fill="currentColor" x="${coord(item.x + 20)}" y="${coord(item.y)}" font-size="${FONT.legend}">${escapeXml(item.text)}</text></g>`
      );
    }),
  );
}

function grid({ plot, x, y }: ChartLayout): string {
  return (
    `<g class="iw-lc-grid" stroke="currentColor" stroke-opacity="0.15" stroke-width="1">` +
    y.ticks.ticks.map((t) => line(plot.x0, y.at(t), plot.x1, y.at(t))).join('') +
    x.ticks.ticks.map((t) => line(x.at(t), plot.y0, x.at(t), plot.y1)).join('') +
    `</g>`
  );
}

/** The plot area itself (transparent), so a host or a check can read its bounds. */
function plotRect({ plot }: ChartLayout): string {
  return `<rect class="iw-lc-plot" x="${coord(plot.x0)}" y="${coord(plot.y0)}" width="${coord(plot.x1 - plot.x0)}" height="${coord(plot.y1 - plot.y0)}" fill="none" stroke="none"/>`;
}

function axisLines({ plot, x, y, melt }: ChartLayout): string {
  const main =
    `<g class="iw-lc-axis" stroke="currentColor" stroke-width="1" fill="none">` +
    `<path d="M${coord(plot.x0)} ${coord(plot.y0)}V${coord(plot.y1)}H${coord(plot.x1)}"/>` +
    y.ticks.ticks.map((t) => line(plot.x0 - 4, y.at(t), plot.x0, y.at(t))).join('') +
    x.ticks.ticks.map((t) => line(x.at(t), plot.y1, x.at(t), plot.y1 + 4)).join('') +
    `</g>`;
  if (!melt) return main;
  return (
    main +
    `<g class="iw-lc-melt" stroke="${COLOURS.melt}" stroke-width="1" fill="none">` +
    `<path d="M${coord(plot.x1)} ${coord(plot.y0)}V${coord(plot.y1)}"/>` +
    melt.ticks.ticks.map((t) => line(plot.x1, melt.at(t), plot.x1 + 4, melt.at(t))).join('') +
    `</g>`
  );
}

function tickLabels({ plot, x, y, melt }: ChartLayout): string {
  const size = FONT.tick;
  const beside = (a: Axis, left: number) =>
    a.ticks.ticks.map((t, i) => `<text x="${coord(left)}" y="${coord(a.at(t) + size * 0.35)}">${a.labels[i]}</text>`).join('');
  return (
    `<g class="iw-lc-text iw-lc-yticks" fill="currentColor" font-size="${size}" text-anchor="end">${beside(y, plot.x0 - 7)}</g>` +
    `<g class="iw-lc-text iw-lc-xticks" fill="currentColor" font-size="${size}" text-anchor="middle">` +
    x.ticks.ticks.map((t, i) => `<text x="${coord(x.at(t))}" y="${coord(plot.y1 + 6 + size)}">${x.labels[i]}</text>`).join('') +
    `</g>` +
    (melt ? `<g class="iw-lc-melt-text iw-lc-mticks" fill="${COLOURS.melt}" font-size="${size}" text-anchor="start">${beside(melt, plot.x1 + 7)}</g>` : '')
  );
}

function axisTitles(input: ChartInput, { plot, melt }: ChartLayout): string {
  const size = FONT.axisTitle;
  const midY = (plot.y0 + plot.y1) / 2;
  const xTitle = input.mode === 'inverse-radius' ? '1/(r₊ + r₋) (Å⁻¹), six-coordinate radii' : 'Charge product |z₊z₋|';
  return (
    `<text class="iw-lc-text iw-lc-ytitle" fill="currentColor" font-size="${size}" text-anchor="middle" transform="translate(${coord(PAD + size * 0.8)} ${coord(midY)}) rotate(-90)">Lattice energy (kJ/mol)</text>` +
    `<text class="iw-lc-text iw-lc-xtitle" fill="currentColor" font-size="${size}" text-anchor="middle" x="${coord((plot.x0 + plot.x1) / 2)}" y="${coord(input.height - PAD)}">${xTitle}</text>` +
    (melt
      ? `<text class="iw-lc-melt-text iw-lc-mtitle" fill="${COLOURS.melt}" font-size="${size}" text-anchor="middle" transform="translate(${coord(input.width - PAD - size * 0.3)} ${coord(midY)}) rotate(-90)">Melting point (°C)</text>`
      : '')
  );
}

function guideLines(guides: readonly GuideLine[]): string {
  return group(
    `<g class="iw-lc-guides">`,
    guides.map(({ guide, segment }) => {
      const { fit, chargeProduct } = guide;
      const tip =
        `Least-squares guide for |z₊z₋| = ${chargeProduct} (${fit.n} salts): U ≈ ${energyText(fit.slope)}·x ` +
        `${fit.intercept < 0 ? '−' : '+'} ${energyText(Math.abs(fit.intercept))} kJ/mol, x = 1/(r₊ + r₋) in Å⁻¹. ` +
        `A guide to the eye, not a model.`;
      return `<g class="iw-lc-guide-line" data-z="${coord(chargeProduct)}"><title>${escapeXml(tip)}</title>${guideStroke(segment)}</g>`;
    }),
  );
}

/** Melting points: a faint connector to the salt's energy marker, then the cross with its tooltip. */
function meltingPoints(plotted: readonly Plotted[], { marks, marker, melt }: ChartLayout): string {
  if (!melt) return '';
  const { radius, cross } = marker;
  const connectors = marks.flatMap(({ cx, cy, meltY }) => {
    if (meltY === null || Math.abs(meltY - cy) < radius + cross + 4) return [];
    const dir = meltY > cy ? 1 : -1;
    return [line(cx, cy + dir * (radius + 1.5), cx, meltY - dir * (cross + 1.5))];
  });
  const crosses = plotted.flatMap((p, i) => {
    const { cx, meltY } = marks[i];
    if (meltY === null || p.meltingPoint === null) return [];
    return [`<g class="iw-lc-mp"><title>${escapeXml(`${p.label}: melting point ${Math.round(p.meltingPoint)} °C`)}</title>${meltCross(cx, meltY, cross)}</g>`];
  });
  return (
    `<g class="iw-lc-melt iw-lc-connectors" stroke="${COLOURS.melt}" stroke-opacity="0.4" stroke-width="1" stroke-dasharray="1 3" fill="none">${connectors.join('')}</g>` +
    `<g class="iw-lc-melts">${crosses.join('')}</g>`
  );
}

/** Energy markers, each with its tooltip. */
function energyMarkers(input: ChartInput, { marks, marker }: ChartLayout): string {
  const points = input.plotted.map((p, i) => {
    const { cx, cy } = marks[i];
    const shape = p.estimate ? estimateMarker(cx, cy, marker.radius) : measuredMarker(cx, cy, marker.half);
    return `<g class="iw-lc-pt" data-kind="${p.estimate ? 'estimate' : 'measured'}"><title>${escapeXml(tooltip(p, input.mode))}</title>${shape}</g>`;
  });
  return `<g class="iw-lc-points">${points.join('')}</g>`;
}

function tooltip(p: Plotted, mode: ChartInput['mode']): string {
  const radius = p.inverseR0 !== null ? `1/(r₊ + r₋) = ${p.inverseR0.toFixed(3)} Å⁻¹` : '';
  const charge = p.chargeProduct !== null ? `|z₊z₋| = ${p.chargeProduct}` : '';
  const where = mode === 'inverse-radius' ? [radius, charge] : [charge, radius];
  const value = p.estimate ? `≈ ${energyText(p.kJ)} kJ/mol (estimate, ${p.method})` : `${energyText(p.kJ)} kJ/mol (${p.method}, from recalled enthalpies)`;
  const lines = [`${p.label}: ${value}`, where.filter(Boolean).join(', ')];
  if (p.meltingPoint !== null) lines.push(`melting point ${Math.round(p.meltingPoint)} °C`);
  return lines.join('\n');
}

/** Labels on top, with their leaders, then the guide captions. */
function labels(placement: LabelPlacement, guides: readonly GuideLine[]): string {
  const leaders = group(
    `<g class="iw-lc-axis iw-lc-leaders" stroke="currentColor" stroke-opacity="0.5" stroke-width="0.8" aria-hidden="true">`,
    placement.leaders.map((s: Segment) => line(s.x1, s.y1, s.x2, s.y2)),
  );
  const text = placement.labels.map((l) => `<text x="${coord(l.x)}" y="${coord(l.y)}">${escapeXml(l.text)}</text>`);
  const captions = group(
    `<g class="iw-lc-guide-text" fill="currentColor" fill-opacity="0.8" font-size="${FONT.guide}" font-style="italic" aria-hidden="true">`,
    placement.captions.flatMap((c, i) => (c ? [`<text x="${coord(c.x)}" y="${coord(c.y)}" text-anchor="middle">${escapeXml(guides[i].caption)}</text>`] : [])),
  );
  return (
    leaders + `<g class="iw-lc-text iw-lc-label iw-lc-labels" fill="currentColor" font-size="${FONT.label}" aria-hidden="true">${text.join('')}</g>` + captions
  );
}

// ---------------------------------------------------------------------------------------------------------
// Marks

function guideStroke(s: Segment): string {
  return line(s.x1, s.y1, s.x2, s.y2, ` class="iw-lc-guide" stroke="currentColor" stroke-opacity="0.6" stroke-width="1.5" stroke-dasharray="5 3"`);
}

function estimateMarker(cx: number, cy: number, r: number): string {
  return `<circle class="iw-lc-est" cx="${coord(cx)}" cy="${coord(cy)}" r="${coord(r)}" fill="none" stroke="${COLOURS.estimate}" stroke-width="1.8"/>`;
}

function measuredMarker(cx: number, cy: number, half: number): string {
  return `<rect class="iw-lc-meas" x="${coord(cx - half)}" y="${coord(cy - half)}" width="${coord(2 * half)}" height="${coord(2 * half)}" fill="${COLOURS.measured}" stroke="${COLOURS.measured}" stroke-width="1"/>`;
}

function meltCross(cx: number, cy: number, s: number): string {
  return (
    `<path class="iw-lc-melt" d="M${coord(cx - s)} ${coord(cy - s)}L${coord(cx + s)} ${coord(cy + s)}M${coord(cx - s)} ${coord(cy + s)}L${coord(cx + s)} ${coord(cy - s)}" ` +
    `fill="none" stroke="${COLOURS.melt}" stroke-width="1.8" stroke-linecap="round"/>`
  );
}
