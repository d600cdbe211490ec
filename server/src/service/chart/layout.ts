/**
 * Where everything goes: the legend rows under the title, the plot area between the axes, the scales, the
 * markers and the guide lines, in svg pixels. The labels are placed afterwards (labels.ts).
 */
import type { Rect, Segment } from './geometry';
import type { ChartInput, Plotted, XMode } from './input';
import { textWidth, tickText } from './text';
import { edgeToEdge, leastSquares, niceTicks, paddedRange, ticksWithin, type LineFit, type Ticks } from './ticks';

export const FONT = { title: 14, tick: 11, label: 11.5, legend: 11.5, axisTitle: 12, guide: 10, note: 10.5 } as const;
/** Space between the svg's edge and anything drawn. */
export const PAD = 12;
/** Baseline of the title. */
export const TITLE_Y = PAD + 12;

export type LegendKind = 'est' | 'meas' | 'melt' | 'guide';
export interface LegendItem {
  kind: LegendKind;
  text: string;
  /** Left edge of the entry and the baseline of its text. */
  x: number;
  y: number;
}

export interface Axis {
  ticks: Ticks;
  /** The tick values as written. */
  labels: string[];
  /** Value → pixel. */
  at: (value: number) => number;
}

/** A least-squares line through the salts of one charge product (data units). */
export interface Guide {
  chargeProduct: number;
  fit: LineFit;
  /** The x range of its salts. */
  x0: number;
  x1: number;
}

/** A guide as drawn: the part of the line inside the plot, and its caption. */
export interface GuideLine {
  guide: Guide;
  segment: Segment;
  caption: string;
}

/** Where a salt's marks are: its energy marker and, where known, its melting-point cross (same x). */
export interface PointMarks {
  cx: number;
  cy: number;
  meltY: number | null;
}

export interface MarkerSize {
  /** Circle radius. */
  radius: number;
  /** Half the side of a square. */
  half: number;
  /** Half the width of a melting-point cross. */
  cross: number;
}

export interface ChartLayout {
  legend: LegendItem[];
  plot: Rect;
  x: Axis;
  y: Axis;
  /** The right axis, when any melting point is known. */
  melt: Axis | null;
  marker: MarkerSize;
  /** One per plotted salt, in the same order. */
  marks: PointMarks[];
  guides: GuideLine[];
  /** Guides fitted, including those clipped away (the legend names them). */
  fittedGuides: number;
}

export function layOutChart(input: ChartInput): ChartLayout {
  const { plotted, mode, width, height } = input;
  const fitted = fitGuides(plotted, mode);
  const legend = layOutLegend(legendEntries(plotted, fitted.length > 0), width);
  const plotTop = (legend.length ? legend[legend.length - 1].y : TITLE_Y) + 18;
  const plotHeight = Math.max(20, height - (FONT.tick + 8 + FONT.axisTitle + 10 + PAD) - plotTop);
  const plotBottom = plotTop + plotHeight;
  const vertical = (ticks: Ticks) => (v: number) => plotBottom - ((v - ticks.min) / (ticks.max - ticks.min)) * plotHeight;

  const yTicks = niceTicks(
    ...paddedRange(
      plotted.map((p) => p.kJ),
      0.05,
    ),
    clamp(Math.round(plotHeight / 48), 2, 10),
  );
  const y = axis(yTicks, vertical(yTicks));
  const meltingPoints = meltingPointsOf(plotted);
  const meltTicks = meltingPoints.length ? niceTicks(...paddedRange(meltingPoints, 0.05), yTicks.ticks.length - 1) : null;
  const melt = meltTicks ? axis(meltTicks, vertical(meltTicks)) : null;

  const plotLeft = sideMargin(y);
  const plotRight = Math.max(plotLeft + 40, width - (melt ? sideMargin(melt) : PAD + 8));
  const plotWidth = plotRight - plotLeft;
  const [xMin, xMax] = xDomain(
    plotted.map((p) => p.x),
    mode,
    plotWidth,
  );
  const xTicks = ticksWithin(xMin, xMax, clamp(Math.round(plotWidth / 80), 2, 12), mode === 'charge-product');
  const x = axis(xTicks, (v) => plotLeft + ((v - xMin) / (xMax - xMin)) * plotWidth);

  const marker = markerSize(plotted.length);
  const marks = plotted.map((p) => ({ cx: x.at(p.x), cy: y.at(p.kJ), meltY: melt && p.meltingPoint !== null ? melt.at(p.meltingPoint) : null }));
  if (mode === 'charge-product')
    dodge(
      marks,
      plotted.map((p) => p.x),
      marker.radius,
      plotWidth / (xMax - xMin),
    );
  const guides = fitted.flatMap((g) => guideLine(g, x, y));
  return { legend, plot: { x0: plotLeft, y0: plotTop, x1: plotRight, y1: plotBottom }, x, y, melt, marker, marks, guides, fittedGuides: fitted.length };
}

const clamp = (v: number, lo: number, hi: number) => Math.max(lo, Math.min(hi, v));

/**
 * The x axis runs edge to edge: 1/(r₊ + r₋) from the first salt to the last with 3 % of the plot's width
 * (at least 12 px) beside them; the charge product with half a unit beside the outer values (room for the
 * dodged stacks), or one unit for a single value.
 */
function xDomain(xs: readonly number[], mode: XMode, plotWidth: number): [number, number] {
  if (mode === 'inverse-radius') return edgeToEdge(xs, plotWidth, Math.max(12, plotWidth * 0.03));
  const lo = Math.min(...xs);
  const hi = Math.max(...xs);
  const margin = hi > lo ? 0.5 : 1;
  return [lo - margin, hi + margin];
}

export const meltingPointsOf = (plotted: readonly Plotted[]): number[] => plotted.flatMap((p) => (p.meltingPoint !== null ? [p.meltingPoint] : []));

function axis(ticks: Ticks, at: (v: number) => number): Axis {
  return { ticks, labels: ticks.ticks.map((t) => tickText(t, ticks.decimals)), at };
}

/** Room for an axis title, the tick labels and the ticks beside the plot. */
function sideMargin(a: Axis): number {
  return PAD + FONT.axisTitle + 10 + Math.max(...a.labels.map((s) => textWidth(s, FONT.tick))) + 8;
}

/** Smaller markers on a crowded chart. */
function markerSize(points: number): MarkerSize {
  return points > 100 ? { radius: 3, half: 3, cross: 2.75 } : { radius: 4.5, half: 4.25, cross: 3.75 };
}

// ---------------------------------------------------------------------------------------------------------
// Legend

function legendEntries(plotted: readonly Plotted[], hasGuides: boolean): Array<{ kind: LegendKind; text: string }> {
  const entries: Array<{ kind: LegendKind; text: string }> = [];
  if (plotted.some((p) => p.estimate)) entries.push({ kind: 'est', text: 'model estimate' });
  if (plotted.some((p) => !p.estimate)) entries.push({ kind: 'meas', text: 'Born–Haber cycle (from recalled enthalpies)' });
  if (plotted.some((p) => p.meltingPoint !== null)) entries.push({ kind: 'melt', text: 'melting point (right axis, °C)' });
  if (hasGuides) entries.push({ kind: 'guide', text: 'least-squares guide per |z₊z₋|, not a model' });
  return entries;
}

/** Entries in rows under the title, wrapped to the width. */
function layOutLegend(entries: Array<{ kind: LegendKind; text: string }>, width: number): LegendItem[] {
  const items: LegendItem[] = [];
  let x = PAD;
  let y = TITLE_Y + 20;
  for (const entry of entries) {
    const entryWidth = 22 + textWidth(entry.text, FONT.legend) + 16;
    if (x > PAD && x + entryWidth > width - PAD) {
      x = PAD;
      y += 17;
    }
    items.push({ ...entry, x, y });
    x += entryWidth;
  }
  return items;
}

// ---------------------------------------------------------------------------------------------------------
// Guides

/**
 * In the inverse-radius mode, a least-squares line per charge-product group with at least three salts spread
 * over at least 5 % of their mean x: a line through points that share nearly one x says nothing.
 */
function fitGuides(plotted: readonly Plotted[], mode: XMode): Guide[] {
  if (mode !== 'inverse-radius') return [];
  const groups = new Map<number, Plotted[]>();
  for (const p of plotted) if (p.chargeProduct !== null) groups.set(p.chargeProduct, [...(groups.get(p.chargeProduct) ?? []), p]);
  const guides: Guide[] = [];
  for (const chargeProduct of [...groups.keys()].sort((a, b) => a - b)) {
    const group = groups.get(chargeProduct) as Plotted[];
    if (group.length < 3) continue;
    const xs = group.map((p) => p.x);
    const meanX = xs.reduce((a, b) => a + b, 0) / xs.length;
    const [x0, x1] = [Math.min(...xs), Math.max(...xs)];
    if (x1 - x0 < 0.05 * Math.abs(meanX)) continue;
    const fit = leastSquares(
      xs,
      group.map((p) => p.kJ),
    );
    if (!fit || !Number.isFinite(fit.slope) || !Number.isFinite(fit.intercept)) continue;
    guides.push({ chargeProduct, fit, x0, x1 });
  }
  return guides;
}

/** The guide over its salts' x range, clipped to the energy axis; none if nothing of it is inside. */
function guideLine(guide: Guide, x: Axis, y: Axis): GuideLine[] {
  const span = clipToY(guide.x0, guide.x1, guide.fit, y.ticks.min, y.ticks.max);
  if (!span) return [];
  const energy = (v: number) => guide.fit.intercept + guide.fit.slope * v;
  const [a, b] = span;
  return [
    {
      guide,
      segment: { x1: x.at(a), y1: y.at(energy(a)), x2: x.at(b), y2: y.at(energy(b)) },
      caption: `guide, |z₊z₋| = ${guide.chargeProduct}`,
    },
  ];
}

/** The part of the fitted line over [x0, x1] whose value lies within [ymin, ymax]; null if none. */
function clipToY(x0: number, x1: number, fit: LineFit, ymin: number, ymax: number): [number, number] | null {
  const { slope, intercept } = fit;
  if (slope === 0) return intercept >= ymin && intercept <= ymax ? [x0, x1] : null;
  const xa = (ymin - intercept) / slope;
  const xb = (ymax - intercept) / slope;
  const a = Math.max(x0, Math.min(xa, xb));
  const b = Math.min(x1, Math.max(xa, xb));
  return a < b ? [a, b] : null;
}

// ---------------------------------------------------------------------------------------------------------
// Stacks on the charge-product axis

/**
 * On the charge-product axis many salts share one x value. Markers that would overlap are moved sideways
 * (0, +d, −d, +2d, …, d a marker's width) by less than 40 % of the gap to the next x value, so the x order is
 * kept and the stack can be read; the tooltip keeps the exact values. Changes `marks` in place.
 */
function dodge(marks: PointMarks[], xs: readonly number[], radius: number, pxPerUnit: number): void {
  const distinct = [...new Set(xs)].sort((a, b) => a - b);
  let gap = Infinity;
  for (let i = 1; i < distinct.length; i++) gap = Math.min(gap, (distinct[i] - distinct[i - 1]) * pxPerUnit);
  const step = 2 * radius + 2;
  const maxSteps = Math.max(0, Math.floor((Math.min(gap, 200) * 0.4) / step));
  const groups = new Map<number, number[]>();
  xs.forEach((x, i) => groups.set(x, [...(groups.get(x) ?? []), i]));
  for (const [, members] of [...groups].sort((a, b) => a[0] - b[0])) {
    const done: PointMarks[] = [];
    for (const i of members) {
      marks[i].cx = clearestOffset(marks[i], done, step, maxSteps);
      done.push(marks[i]);
    }
  }
}

/** The first sideways position (0, +d, −d, …) a marker's width clear of `done`, else the clearest one. */
function clearestOffset(mark: PointMarks, done: readonly PointMarks[], step: number, maxSteps: number): number {
  let best = mark.cx;
  let bestClearance = -Infinity;
  for (let k = 0; k <= 2 * maxSteps; k++) {
    const x = mark.cx + (k % 2 ? 1 : -1) * Math.ceil(k / 2) * step;
    const clearance = Math.min(Infinity, ...done.map((o) => Math.hypot(o.cx - x, o.cy - mark.cy)));
    if (clearance >= step - 1) return x;
    if (clearance > bestClearance) {
      bestClearance = clearance;
      best = x;
    }
  }
  return best;
}
