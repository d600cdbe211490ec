/**
 * A scatter chart of the lattice energies of the salts a notes file mentions, as one self-contained inline
 * `<svg>` string for the HTML report (no scripts, no external fonts, no stylesheet outside the svg).
 *
 * What it shows:
 * - x: 1/(r₊ + r₋) in Å⁻¹ (default; salts without known radii are left out and counted in the <desc>) or
 *   the charge product |z₊z₋|; y (left): lattice energy in kJ/mol. "Nice" ticks (1, 2, 2.5, 5 × 10ⁿ).
 * - Model estimates as hollow circles, Born–Haber values (from tabulated enthalpies, recalled) as filled squares,
 *   with a legend, so the two never differ by colour alone.
 * - Melting points, where known, on a second y axis on the right (°C) as crosses (×) at the salt's x,
 *   joined to the salt's energy marker by a faint dotted line, with their own legend entry. The right axis
 *   takes the melting-point colour; its title says what it is.
 * - In the inverse-radius mode, a dashed least-squares line per charge-product group with at least three
 *   salts at two or more distinct x values: a guide to the eye (U grows roughly with z₊z₋/r₀ by Coulomb's
 *   law), labelled as a guide and not as a model.
 * - Every marker has a <title> tooltip; the formula labels are nudged around markers and each other (a label
 *   pushed a line or more away gets a faint leader), and on a crowded chart (over 30 salts) a label that
 *   cannot be placed without overlap is left out and counted in the <desc> (its tooltip remains).
 * - On the charge-product axis, markers of salts sharing a charge product that would overlap are dodged
 *   sideways by less than 40 % of the gap between charge products.
 *
 * Theming: a <style> inside the svg, scoped by the class `iw-lattice`, reads CSS custom properties with
 * fallbacks (see `CHART_CSS_VARIABLES`); text, axes and grid follow `currentColor`, so the host sets
 * `color` on the container. The fallback accents are mid-tones with at least 3:1 contrast on both a white
 * and a #1e1e1e background. Elements also carry plain presentation attributes, so the chart stays legible if
 * a host's content security policy drops the <style>.
 *
 * Pure: no editor, LSP or file-system imports. Never throws; same input → same string; every coordinate
 * and size in the svg is rounded to 2 decimals (tick labels and tooltips carry the digits their values need).
 */

export interface LatticePoint {
  /** Display formula, Unicode (e.g. "MgO", "CaF₂", "Na₂SO₄"). */
  label: string;
  /** Lattice energy, positive, kJ/mol. */
  kJPerMol: number;
  /** E.g. "Kapustinskii equation", "Born–Mayer equation", "Born–Haber cycle". */
  method: string;
  /** Model estimate (true) or a Born–Haber value from tabulated enthalpies (false). */
  estimate: boolean;
  /** 1/(r₊ + r₋) in 1/Å, six-coordinate radii; null if unknown. */
  inverseR0: number | null;
  /** |z₊ z₋|. */
  chargeProduct: number;
  /** Where known. */
  meltingPointC?: number;
}

export interface LatticeChartOptions {
  /** Default 'inverse-radius'; points with inverseR0 null are left out in that mode and counted in the <desc>. */
  x?: 'inverse-radius' | 'charge-product';
  /** Default 640. */
  width?: number;
  /** Default 400. */
  height?: number;
  /** Default "Lattice energies". */
  title?: string;
}

/** The custom properties the chart reads, and what each colours (fallback in brackets). */
export const CHART_CSS_VARIABLES = {
  '--iw-chart-text': 'titles, tick labels, formula labels, legend text (currentColor)',
  '--iw-chart-axis': 'axis lines and tick marks (currentColor)',
  '--iw-chart-grid': 'gridlines, drawn at 15 % opacity (currentColor)',
  '--iw-chart-estimate': 'hollow circles of model estimates (#3b7dd8)',
  '--iw-chart-measured': 'filled squares of Born–Haber values (#b3478f)',
  '--iw-chart-melt': 'melting-point crosses, their connectors, the right axis (#c2621a)',
  '--iw-chart-guide': 'dashed least-squares guide lines and their labels, at 60 % opacity (currentColor)',
  '--iw-chart-halo': 'outline behind formula labels, set it to the page background to lift labels off gridlines (none)',
  '--iw-chart-font': 'font family (system-ui, sans-serif)',
} as const;

const DEFAULT_WIDTH = 640;
const DEFAULT_HEIGHT = 400;
const EMPTY_HEIGHT = 64;
const MIN_WIDTH = 200;
const MIN_HEIGHT = 160;
const MAX_SIZE = 4096;
/** Up to this many salts every label is drawn, overlapping or not; above it, unplaceable labels are left out. */
const ALWAYS_LABEL = 30;
const MAX_LABEL_CHARS = 22;
/** Label spots from this index on are a line or more away from the marker and get a leader line. */
const FAR_SPOTS = 8;

const COLOURS = {
  estimate: '#3b7dd8',
  measured: '#b3478f',
  melt: '#c2621a',
};

// ---------------------------------------------------------------------------------------------------------
// Numbers

/** A number for the svg: rounded to 2 decimals, no "-0", no exponent for the sizes a chart has. */
function n(v: number): string {
  if (!Number.isFinite(v)) return '0';
  const r = Math.round(v * 100) / 100;
  return Object.is(r, -0) || r === 0 ? '0' : String(r);
}

export interface Ticks {
  min: number;
  max: number;
  step: number;
  ticks: number[];
  /** Decimals needed to write every tick exactly. */
  decimals: number;
}

/**
 * Ticks at 1, 2, 2.5 or 5 × 10ⁿ steps covering [lo, hi] with about `target` intervals. With `integer`, steps
 * are whole numbers (no 2.5 and nothing below 1). A zero or non-finite span is widened around the value.
 */
export function niceTicks(lo: number, hi: number, target = 5, integer = false): Ticks {
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) {
    lo = 0;
    hi = 1;
  }
  const LIMIT = 1e300; // keeps hi − lo finite
  lo = Math.max(-LIMIT, Math.min(LIMIT, lo));
  hi = Math.max(-LIMIT, Math.min(LIMIT, hi));
  if (lo > hi) [lo, hi] = [hi, lo];
  if (hi - lo < 1e-12 * Math.max(1, Math.abs(hi))) {
    // Around a value too small to scale (zero, denormals), widen by 1.
    const half = Math.abs(lo) < 1e-200 ? 1 : Math.abs(lo) * 0.1;
    lo -= half;
    hi += half;
  }
  const count = Math.max(1, Math.min(20, Math.round(Number.isFinite(target) ? target : 5)));
  const raw = (hi - lo) / count;
  const exp = Math.floor(Math.log10(raw));
  const mag = Math.pow(10, exp);
  const mults = integer && exp <= 0 ? [1, 2, 5, 10] : [1, 2, 2.5, 5, 10];
  let mult = mults.find((m) => m * mag >= raw * (1 - 1e-9)) ?? 10;
  let step = mult * mag;
  if (integer && step < 1) {
    step = 1;
    mult = 1;
  }
  const clean = (v: number) => parseFloat(v.toPrecision(12));
  step = clean(step);
  if (!(step > 0) || !Number.isFinite(step)) return niceTicks(0, 1, target, integer);
  // The outermost multiples of the step that still cover [lo, hi], checked on the cleaned values so that
  // floating-point noise neither drops a bound nor adds a tick.
  let first = Math.floor(lo / step);
  if (clean((first + 1) * step) <= lo) first++;
  if (clean(first * step) > lo) first--;
  let last = Math.ceil(hi / step);
  if (clean((last - 1) * step) >= hi) last--;
  if (clean(last * step) < hi) last++;
  if (last <= first) last = first + 1;
  const ticks: number[] = [];
  for (let k = first; k <= last && ticks.length < 200; k++) ticks.push(clean(k * step));
  const stepExp = Math.floor(Math.log10(step) + 1e-9);
  const decimals = Math.max(0, -stepExp + (mult === 2.5 ? 1 : 0));
  return { min: ticks[0], max: ticks[ticks.length - 1], step, ticks, decimals };
}

export interface LineFit {
  slope: number;
  intercept: number;
  n: number;
}

/** Ordinary least squares y = intercept + slope·x; null for fewer than two points or a single x value. */
export function leastSquares(xs: readonly number[], ys: readonly number[]): LineFit | null {
  const m = Math.min(xs.length, ys.length);
  if (m < 2) return null;
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < m; i++) {
    sx += xs[i];
    sy += ys[i];
  }
  const mx = sx / m;
  const my = sy / m;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < m; i++) {
    sxx += (xs[i] - mx) * (xs[i] - mx);
    sxy += (xs[i] - mx) * (ys[i] - my);
  }
  if (!(sxx > 1e-12 * Math.max(1, mx * mx)) || !Number.isFinite(sxy)) return null;
  const slope = sxy / sxx;
  return { slope, intercept: my - slope * mx, n: m };
}

// ---------------------------------------------------------------------------------------------------------
// Text

/** Text for XML: characters XML 1.0 forbids (controls, lone surrogates) removed, the five specials escaped. */
function xml(s: string): string {
  return s
    .replace(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g, '')
    .replace(/[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g, '')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&apos;');
}

const asText = (v: unknown): string => (typeof v === 'string' ? v : v === null || v === undefined ? '' : String(v));

/** Collapse whitespace (a label is one line). */
const oneLine = (s: string) => s.replace(/\s+/g, ' ').trim();

function shorten(s: string, max: number): string {
  const cps = Array.from(s);
  return cps.length <= max ? s : cps.slice(0, max - 1).join('') + '…';
}

/**
 * Rough advance width of a string in a sans-serif face, in px: no font metrics at hand, so a per-class guess
 * erring wide (the wider common system faces), which errs towards more room between labels.
 */
export function textWidth(s: string, fontSize: number): number {
  let em = 0;
  for (const ch of s) {
    if (/[ijlI1.,;:|!'\s]/.test(ch)) em += 0.32;
    else if (/[()[\]]/.test(ch)) em += 0.4;
    else if (/[mwMW]/.test(ch)) em += 0.9;
    else if (/[A-Z]/.test(ch)) em += 0.72;
    else if (/[0-9]/.test(ch)) em += 0.62;
    else if (/[a-z]/.test(ch)) em += 0.58;
    else if (/[\u2080-\u209F\u2070-\u207F\u00B2\u00B3\u00B9]/.test(ch)) em += 0.4;
    else em += 0.62;
  }
  return em * fontSize;
}

/** An energy the way the tooltip and <desc> say it: whole kJ/mol from 100 up, else 3 significant figures. */
function energyText(v: number): string {
  return Math.abs(v) >= 100 ? String(Math.round(v)) : String(Number(v.toPrecision(3)));
}

function tickText(v: number, decimals: number): string {
  const s = v.toFixed(decimals);
  return (/^-0(\.0*)?$/.test(s) ? s.slice(1) : s).replace(/^-/, '−');
}

// ---------------------------------------------------------------------------------------------------------
// Input

interface Plotted {
  label: string;
  shown: string;
  kJ: number;
  method: string;
  estimate: boolean;
  x: number;
  inverseR0: number | null;
  z: number | null;
  mp: number | null;
}

const finite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

function clampSize(v: unknown, fallback: number, min: number): number {
  if (!finite(v)) return fallback;
  return Math.round(Math.min(MAX_SIZE, Math.max(min, v)));
}

/** FNV-1a, for ids that are unique per chart content yet deterministic. */
function hash(s: string): string {
  let h = 0x811c9dc5;
  for (let i = 0; i < s.length; i++) {
    h ^= s.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return (h >>> 0).toString(36);
}

// ---------------------------------------------------------------------------------------------------------
// Geometry of labels

interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

const overlap = (a: Box, b: Box) =>
  Math.max(0, Math.min(a.x1, b.x1) - Math.max(a.x0, b.x0)) * Math.max(0, Math.min(a.y1, b.y1) - Math.max(a.y0, b.y0));

/** Boxes bucketed on a coarse grid so 500 labels cost little. */
class BoxIndex {
  private cells = new Map<string, Box[]>();
  constructor(private size = 40) {}
  private keys(b: Box): string[] {
    const out: string[] = [];
    for (let i = Math.floor(b.x0 / this.size); i <= Math.floor(b.x1 / this.size); i++)
      for (let j = Math.floor(b.y0 / this.size); j <= Math.floor(b.y1 / this.size); j++) out.push(`${i},${j}`);
    return out;
  }
  add(b: Box) {
    for (const k of this.keys(b)) {
      const list = this.cells.get(k);
      if (list) list.push(b);
      else this.cells.set(k, [b]);
    }
  }
  overlapWith(b: Box, except?: Box): number {
    const seen = new Set<Box>();
    let sum = 0;
    for (const k of this.keys(b))
      for (const o of this.cells.get(k) ?? []) {
        if (o === except || seen.has(o)) continue;
        seen.add(o);
        sum += overlap(b, o);
      }
    return sum;
  }
}

// ---------------------------------------------------------------------------------------------------------
// Style

const STYLE = [
  '.iw-lattice{max-width:100%;height:auto;font-family:var(--iw-chart-font,system-ui,sans-serif)}',
  '.iw-lattice .iw-lc-text{fill:var(--iw-chart-text,currentColor)}',
  '.iw-lattice .iw-lc-axis{stroke:var(--iw-chart-axis,currentColor)}',
  '.iw-lattice .iw-lc-grid{stroke:var(--iw-chart-grid,currentColor);stroke-opacity:.15}',
  '.iw-lattice .iw-lc-est{stroke:var(--iw-chart-estimate,#3b7dd8)}',
  '.iw-lattice .iw-lc-meas{fill:var(--iw-chart-measured,#b3478f);stroke:var(--iw-chart-measured,#b3478f)}',
  '.iw-lattice .iw-lc-melt{stroke:var(--iw-chart-melt,#c2621a)}',
  '.iw-lattice .iw-lc-melt-text{fill:var(--iw-chart-melt,#c2621a)}',
  '.iw-lattice .iw-lc-guide{stroke:var(--iw-chart-guide,currentColor)}',
  '.iw-lattice .iw-lc-guide-text{fill:var(--iw-chart-guide,currentColor)}',
  '.iw-lattice .iw-lc-label{paint-order:stroke;stroke:var(--iw-chart-halo,none);stroke-width:3px;stroke-linejoin:round}',
].join('');

function svgOpen(width: number, height: number, id: string, extra = ''): string {
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" class="iw-lattice" width="${width}" height="${height}" ` +
    `viewBox="0 0 ${width} ${height}" role="img" aria-labelledby="${id}-title ${id}-desc"${extra}>`
  );
}

function emptyChart(width: number, title: string, reason: string, id: string): string {
  const message = 'No salts with lattice energies to chart.';
  const desc = reason ? `${message} ${reason}` : message;
  return [
    svgOpen(width, EMPTY_HEIGHT, id),
    `<title id="${id}-title">${xml(title)}</title>`,
    `<desc id="${id}-desc">${xml(desc)}</desc>`,
    `<style>${STYLE}</style>`,
    `<g class="iw-lc-text" fill="currentColor" font-size="13">`,
    `<text x="12" y="${reason ? 26 : 37}">${xml(message)}</text>`,
    reason ? `<text x="12" y="46" font-size="11" opacity="0.8">${xml(shorten(reason, Math.floor((width - 24) / 6)))}</text>` : '',
    `</g>`,
    `</svg>`,
  ].join('');
}

// ---------------------------------------------------------------------------------------------------------
// The chart

export function latticeChart(points: LatticePoint[], options?: LatticeChartOptions): string {
  const opts: LatticeChartOptions = options && typeof options === 'object' ? options : {};
  const mode: 'inverse-radius' | 'charge-product' = opts.x === 'charge-product' ? 'charge-product' : 'inverse-radius';
  const W = clampSize(opts.width, DEFAULT_WIDTH, MIN_WIDTH);
  const H = clampSize(opts.height, DEFAULT_HEIGHT, MIN_HEIGHT);
  const title = oneLine(asText(opts.title)) || 'Lattice energies';
  const list: unknown[] = Array.isArray(points) ? points : [];

  // Which salts can be plotted, and why the others cannot.
  const plotted: Plotted[] = [];
  const noRadius: string[] = [];
  let invalid = 0;
  for (const raw of list) {
    if (!raw || typeof raw !== 'object') {
      invalid++;
      continue;
    }
    const p = raw as Partial<LatticePoint>;
    const label = oneLine(asText(p.label)) || '?';
    const kJ = p.kJPerMol;
    if (!finite(kJ) || kJ <= 0) {
      invalid++;
      continue;
    }
    const inv = finite(p.inverseR0) && p.inverseR0 > 0 ? p.inverseR0 : null;
    const z = finite(p.chargeProduct) && p.chargeProduct > 0 ? p.chargeProduct : null;
    let x: number;
    if (mode === 'inverse-radius') {
      if (p.inverseR0 === null || p.inverseR0 === undefined) {
        noRadius.push(label);
        continue;
      }
      if (inv === null) {
        invalid++;
        continue;
      }
      x = inv;
    } else {
      if (z === null) {
        invalid++;
        continue;
      }
      x = z;
    }
    plotted.push({
      label,
      shown: shorten(label, MAX_LABEL_CHARS),
      kJ,
      method: oneLine(asText(p.method)) || (p.estimate === false ? 'Born–Haber cycle' : 'model'),
      estimate: p.estimate !== false,
      x,
      inverseR0: inv,
      z,
      mp: finite(p.meltingPointC) ? p.meltingPointC : null,
    });
  }
  const cmp = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);
  plotted.sort(
    (a, b) =>
      a.x - b.x ||
      b.kJ - a.kJ ||
      cmp(a.label, b.label) ||
      cmp(a.method, b.method) ||
      Number(a.estimate) - Number(b.estimate) ||
      (a.mp ?? -Infinity) - (b.mp ?? -Infinity) ||
      0,
  );

  const leftOut: string[] = [];
  if (noRadius.length)
    leftOut.push(
      `${noRadius.length} ${noRadius.length === 1 ? 'salt' : 'salts'} without known ionic radii left out` +
        ` (${noRadius.slice(0, 6).join(', ')}${noRadius.length > 6 ? ', …' : ''}).`,
    );
  if (invalid) leftOut.push(`${invalid} ${invalid === 1 ? 'entry' : 'entries'} with missing or invalid values left out.`);

  const id = `iw-lc-${hash(JSON.stringify([mode, W, H, title, plotted, noRadius, invalid]))}`;
  if (plotted.length === 0) return emptyChart(W, title, leftOut.join(' '), id);

  // Scales.
  const xs = plotted.map((p) => p.x);
  const ys = plotted.map((p) => p.kJ);
  const mps = plotted.filter((p) => p.mp !== null).map((p) => p.mp as number);
  const hasMelt = mps.length > 0;
  const padded = (vals: number[], fraction: number): [number, number] => {
    let lo = Math.min(...vals);
    let hi = Math.max(...vals);
    // A narrow range (one salt, or near-equal values) is shown as at least 20 % of its magnitude, so that
    // small differences do not look large.
    const least = Math.max(Math.abs(lo), Math.abs(hi)) * 0.2 || 1;
    if (hi - lo < least) {
      const mid = (lo + hi) / 2;
      lo = mid - least / 2;
      hi = mid + least / 2;
    }
    const span = hi - lo;
    let a = lo - span * fraction;
    const b = hi + span * fraction;
    if (Math.min(...vals) >= 0 && a < 0) a = 0;
    return [a, b];
  };

  const fsTick = 11;
  const fsLabel = 11.5;
  const fsLegend = 11.5;
  const fsAxisTitle = 12;
  const pad = 12;

  const hasEst = plotted.some((p) => p.estimate);
  const hasMeas = plotted.some((p) => !p.estimate);

  // Guides: per charge-product group, inverse-radius mode only.
  interface Guide {
    z: number;
    fit: LineFit;
    x0: number;
    x1: number;
  }
  const guides: Guide[] = [];
  if (mode === 'inverse-radius') {
    const groups = new Map<number, Plotted[]>();
    for (const p of plotted) if (p.z !== null) groups.set(p.z, [...(groups.get(p.z) ?? []), p]);
    for (const z of [...groups.keys()].sort((a, b) => a - b)) {
      const g = groups.get(z) as Plotted[];
      if (g.length < 3) continue;
      // A line through points that share nearly one x says nothing: ask for a spread of 5 % of their mean x.
      const xs = g.map((p) => p.x);
      const meanX = xs.reduce((a, b) => a + b, 0) / xs.length;
      if (Math.max(...xs) - Math.min(...xs) < 0.05 * Math.abs(meanX)) continue;
      const fit = leastSquares(g.map((p) => p.x), g.map((p) => p.kJ));
      if (!fit || !Number.isFinite(fit.slope) || !Number.isFinite(fit.intercept)) continue;
      guides.push({ z, fit, x0: Math.min(...g.map((p) => p.x)), x1: Math.max(...g.map((p) => p.x)) });
    }
  }

  // Legend entries, only for the kinds present, in rows under the title wrapped to the width.
  const legend: Array<{ kind: 'est' | 'meas' | 'melt' | 'guide'; text: string }> = [];
  if (hasEst) legend.push({ kind: 'est', text: 'model estimate' });
  if (hasMeas) legend.push({ kind: 'meas', text: 'Born–Haber cycle (from recalled enthalpies)' });
  if (hasMelt) legend.push({ kind: 'melt', text: 'melting point (right axis, °C)' });
  if (guides.length) legend.push({ kind: 'guide', text: 'least-squares guide per |z₊z₋|, not a model' });
  const legendItems: Array<{ kind: string; text: string; x: number; y: number }> = [];
  const titleY = pad + 12;
  let lx = pad;
  let ly = titleY + 20;
  for (const item of legend) {
    const w = 22 + textWidth(item.text, fsLegend) + 16;
    if (lx > pad && lx + w > W - pad) {
      lx = pad;
      ly += 17;
    }
    legendItems.push({ kind: item.kind, text: item.text, x: lx, y: ly });
    lx += w;
  }
  const plotTop = (legend.length ? ly : titleY) + 18;

  const plotH = Math.max(20, H - (fsTick + 8 + fsAxisTitle + 10 + pad) - plotTop);
  const plotBottom = plotTop + plotH;
  const yT = niceTicks(...padded(ys, 0.05), Math.max(2, Math.min(10, Math.round(plotH / 48))));
  const mT = hasMelt ? niceTicks(...padded(mps, 0.05), yT.ticks.length - 1) : null;
  const yLabels = yT.ticks.map((t) => tickText(t, yT.decimals));
  const mLabels = mT ? mT.ticks.map((t) => tickText(t, mT.decimals)) : [];
  const leftMargin = pad + fsAxisTitle + 10 + Math.max(...yLabels.map((s) => textWidth(s, fsTick))) + 8;
  const rightMargin = mT ? pad + fsAxisTitle + 10 + Math.max(...mLabels.map((s) => textWidth(s, fsTick))) + 8 : pad + 8;
  const plotLeft = leftMargin;
  const plotRight = Math.max(plotLeft + 40, W - rightMargin);
  const plotW = plotRight - plotLeft;
  const xT = niceTicks(...padded(xs, 0.06), Math.max(2, Math.min(12, Math.round(plotW / 80))), mode === 'charge-product');

  const sx = (v: number) => plotLeft + ((v - xT.min) / (xT.max - xT.min)) * plotW;
  const sy = (v: number) => plotBottom - ((v - yT.min) / (yT.max - yT.min)) * plotH;
  const sm = (v: number) => (mT ? plotBottom - ((v - mT.min) / (mT.max - mT.min)) * plotH : plotBottom);
  // Marker geometry; obstacles for the labels.
  const dense = plotted.length > 100;
  const r = dense ? 3 : 4.5;
  const half = dense ? 3 : 4.25;
  const cross = dense ? 2.75 : 3.75;
  const obstacles = new BoxIndex();
  const placed = new BoxIndex();
  const centres = plotted.map((p) => ({ cx: sx(p.x), cy: sy(p.kJ), my: p.mp !== null ? sm(p.mp) : null }));
  if (mode === 'charge-product') dodge(centres, plotted.map((p) => p.x), r, plotW / (xT.max - xT.min));
  const markerBoxes: Box[] = centres.map(({ cx, cy }) => ({ x0: cx - r - 1, y0: cy - r - 1, x1: cx + r + 1, y1: cy + r + 1 }));
  for (const b of markerBoxes) obstacles.add(b);
  for (const c of centres)
    if (c.my !== null) obstacles.add({ x0: c.cx - cross - 1, y0: c.my - cross - 1, x1: c.cx + cross + 1, y1: c.my + cross + 1 });

  // Guides: segments clipped to the energy range.
  const guideSegs: Array<{ g: Guide; x1: number; y1: number; x2: number; y2: number; tx: number; ty: number; text: string }> = [];
  for (const g of guides) {
    const seg = clipToY(g.x0, g.x1, g.fit, yT.min, yT.max);
    if (!seg) continue;
    const [a, b] = seg;
    const x1 = sx(a);
    const y1 = sy(g.fit.intercept + g.fit.slope * a);
    const x2 = sx(b);
    const y2 = sy(g.fit.intercept + g.fit.slope * b);
    // The line itself is an obstacle for labels: small boxes along it.
    const len = Math.hypot(x2 - x1, y2 - y1);
    const steps = Math.max(1, Math.ceil(len / 6));
    for (let k = 0; k <= steps; k++) {
      const px = x1 + ((x2 - x1) * k) / steps;
      const py = y1 + ((y2 - y1) * k) / steps;
      obstacles.add({ x0: px - 2.5, y0: py - 2.5, x1: px + 2.5, y1: py + 2.5 });
    }
    guideSegs.push({ g, x1, y1, x2, y2, tx: 0, ty: 0, text: `guide, |z₊z₋| = ${g.z}` });
  }
  // Their captions: the least crowded of a few spots along the line, above or below it.
  for (const s of guideSegs) {
    const tw = textWidth(s.text, 10);
    let best: { x: number; y: number; box: Box; score: number } | null = null;
    for (const t of [0.5, 0.35, 0.65, 0.2, 0.8, 0.05, 0.95])
      for (const below of [false, true]) {
        const px = s.x1 + (s.x2 - s.x1) * t;
        const py = s.y1 + (s.y2 - s.y1) * t;
        const x = Math.max(plotLeft + 2 + tw / 2, Math.min(plotRight - 2 - tw / 2, px));
        const y = below ? py + 14 : py - 6;
        const box = { x0: x - tw / 2, y0: y - 9, x1: x + tw / 2, y1: y + 2 };
        const outside = box.y0 < plotTop || box.y1 > plotBottom - 1;
        const score = obstacles.overlapWith(box) + (outside ? 1e6 : 0);
        if (!best || score < best.score - 0.5) best = { x, y, box, score };
      }
    if (!best) continue;
    s.tx = best.x;
    s.ty = best.y;
    obstacles.add(best.box);
  }

  // Formula labels, nudged: the first free spot of sixteen around the marker, else the least crowded one.
  const labelOut: string[] = [];
  const leaders: string[] = [];
  let omitted = 0;
  const lh = fsLabel;
  plotted.forEach((p, i) => {
    const { cx, cy } = centres[i];
    const w = textWidth(p.shown, fsLabel);
    const g = r + 3;
    // [left edge of the text, baseline]
    const spots: Array<[number, number]> = [
      [cx + g, cy + lh * 0.35],
      [cx - g - w, cy + lh * 0.35],
      [cx - w / 2, cy - g - 1],
      [cx - w / 2, cy + g + lh * 0.8],
      [cx + g - 2, cy - g],
      [cx + g - 2, cy + g + lh * 0.7],
      [cx - g - w + 2, cy - g],
      [cx - g - w + 2, cy + g + lh * 0.7],
      // FAR_SPOTS: one and two lines further out, for stacks of near-equal values
      [cx + g, cy + lh * 1.35],
      [cx + g, cy - lh * 0.65],
      [cx - g - w, cy + lh * 1.35],
      [cx - g - w, cy - lh * 0.65],
      [cx + g, cy + lh * 2.35],
      [cx + g, cy - lh * 1.65],
      [cx - g - w, cy + lh * 2.35],
      [cx - g - w, cy - lh * 1.65],
    ];
    let best: { x: number; y: number; box: Box; score: number; k: number } | null = null;
    for (let k = 0; k < spots.length; k++) {
      const [bx, by] = spots[k];
      const box = { x0: bx, y0: by - lh * 0.8, x1: bx + w, y1: by + lh * 0.2 };
      const outside = box.x0 < plotLeft + 1 || box.x1 > plotRight - 1 || box.y0 < plotTop - 6 || box.y1 > plotBottom - 1;
      const score = obstacles.overlapWith(box, markerBoxes[i]) + placed.overlapWith(box) + (outside ? 1e6 : 0) + k * 0.01;
      if (!best || score < best.score) best = { x: bx, y: by, box, score, k };
      if (score < 1) break;
    }
    if (!best) return;
    if (best.score >= 1 && plotted.length > ALWAYS_LABEL) {
      omitted++;
      return;
    }
    placed.add(best.box);
    labelOut.push(`<text x="${n(best.x)}" y="${n(best.y)}">${xml(p.shown)}</text>`);
    if (best.k >= FAR_SPOTS) {
      // A label a line or more away from its marker gets a faint leader to it.
      const b = best.box;
      const tx = Math.max(b.x0, Math.min(b.x1, cx));
      const ty = Math.max(b.y0, Math.min(b.y1, cy));
      const len = Math.hypot(tx - cx, ty - cy);
      if (len > r + 4) {
        const ux = (tx - cx) / len;
        const uy = (ty - cy) / len;
        leaders.push(`<line x1="${n(cx + ux * (r + 1.5))}" y1="${n(cy + uy * (r + 1.5))}" x2="${n(tx - ux)}" y2="${n(ty - uy)}"/>`);
      }
    }
  });

  // The description.
  const descParts: string[] = [];
  const xName = mode === 'inverse-radius' ? '1/(r₊ + r₋) in Å⁻¹' : 'the charge product |z₊z₋|';
  const nEst = plotted.filter((p) => p.estimate).length;
  const nMeas = plotted.length - nEst;
  descParts.push(
    `Scatter chart of lattice energy (kJ/mol) against ${xName} for ${plotted.length} ${plotted.length === 1 ? 'salt' : 'salts'}: ` +
      `${nEst} model ${nEst === 1 ? 'estimate' : 'estimates'} (hollow circles) and ${nMeas} ` +
      `Born–Haber ${nMeas === 1 ? 'value' : 'values'} from tabulated enthalpies, recalled (filled squares).`,
  );
  const top = plotted.reduce((a, b) => (b.kJ > a.kJ ? b : a));
  const bottom = plotted.reduce((a, b) => (b.kJ < a.kJ ? b : a));
  const say = (p: Plotted) => `${p.label} ${p.estimate ? '≈ ' : ''}${energyText(p.kJ)} kJ/mol`;
  descParts.push(plotted.length === 1 ? `${say(top)}.` : `Highest ${say(top)}; lowest ${say(bottom)}.`);
  if (hasMelt) descParts.push(`Melting points of ${mps.length} ${mps.length === 1 ? 'salt' : 'salts'} on the right axis (°C, crosses).`);
  if (guideSegs.length)
    descParts.push(`Dashed least-squares guides, not models, for ${guideSegs.map((s) => `|z₊z₋| = ${s.g.z}`).join(', ')}.`);
  if (omitted) descParts.push(`${omitted} formula labels left out to avoid overlap; every point has a tooltip.`);
  descParts.push(...leftOut);

  const out: string[] = [];
  // Frame: head, style, title, legend.
  out.push(svgOpen(W, H, id, ` font-size="${fsLabel}"`));
  out.push(`<title id="${id}-title">${xml(title)}</title>`);
  out.push(`<desc id="${id}-desc">${xml(descParts.join(' '))}</desc>`);
  out.push(`<style>${STYLE}</style>`);
  out.push(
    `<text class="iw-lc-text iw-lc-title" fill="currentColor" x="${n(pad)}" y="${n(titleY)}" font-size="14" font-weight="600">${xml(shorten(title, Math.floor((W - 2 * pad) / 8)))}</text>`,
  );
  if (legendItems.length) {
    out.push(`<g class="iw-lc-legend">`);
    for (const it of legendItems) {
      const mx = it.x + 8;
      const my = it.y - 4;
      out.push(`<g class="iw-lc-legend-item" data-kind="${it.kind}">`);
      if (it.kind === 'est') out.push(markerEst(mx, my, 4.5));
      else if (it.kind === 'meas') out.push(markerMeas(mx, my, 4.25));
      else if (it.kind === 'melt') out.push(markerMelt(mx, my, 3.75));
      else out.push(guideLine(mx - 8, my, mx + 8, my));
      out.push(`<text class="iw-lc-text" fill="currentColor" x="${n(it.x + 20)}" y="${n(it.y)}" font-size="${fsLegend}">${xml(it.text)}</text>`);
      out.push(`</g>`);
    }
    out.push(`</g>`);
  }

  // Grid.
  out.push(`<g class="iw-lc-grid" stroke="currentColor" stroke-opacity="0.15" stroke-width="1">`);
  for (const t of yT.ticks) out.push(`<line x1="${n(plotLeft)}" y1="${n(sy(t))}" x2="${n(plotRight)}" y2="${n(sy(t))}"/>`);
  for (const t of xT.ticks) out.push(`<line x1="${n(sx(t))}" y1="${n(plotTop)}" x2="${n(sx(t))}" y2="${n(plotBottom)}"/>`);
  out.push(`</g>`);

  // The plot area itself (transparent), so a host or a check can read its bounds.
  out.push(
    `<rect class="iw-lc-plot" x="${n(plotLeft)}" y="${n(plotTop)}" width="${n(plotW)}" height="${n(plotH)}" fill="none" stroke="none"/>`,
  );

  // Axes.
  out.push(`<g class="iw-lc-axis" stroke="currentColor" stroke-width="1" fill="none">`);
  out.push(`<path d="M${n(plotLeft)} ${n(plotTop)}V${n(plotBottom)}H${n(plotRight)}"/>`);
  for (const t of yT.ticks) out.push(`<line x1="${n(plotLeft - 4)}" y1="${n(sy(t))}" x2="${n(plotLeft)}" y2="${n(sy(t))}"/>`);
  for (const t of xT.ticks) out.push(`<line x1="${n(sx(t))}" y1="${n(plotBottom)}" x2="${n(sx(t))}" y2="${n(plotBottom + 4)}"/>`);
  out.push(`</g>`);
  if (mT) {
    out.push(`<g class="iw-lc-melt" stroke="${COLOURS.melt}" stroke-width="1" fill="none">`);
    out.push(`<path d="M${n(plotRight)} ${n(plotTop)}V${n(plotBottom)}"/>`);
    for (const t of mT.ticks) out.push(`<line x1="${n(plotRight)}" y1="${n(sm(t))}" x2="${n(plotRight + 4)}" y2="${n(sm(t))}"/>`);
    out.push(`</g>`);
  }

  // Tick labels and axis titles.
  out.push(`<g class="iw-lc-text iw-lc-yticks" fill="currentColor" font-size="${fsTick}" text-anchor="end">`);
  yT.ticks.forEach((t, i) => out.push(`<text x="${n(plotLeft - 7)}" y="${n(sy(t) + fsTick * 0.35)}">${yLabels[i]}</text>`));
  out.push(`</g>`);
  out.push(`<g class="iw-lc-text iw-lc-xticks" fill="currentColor" font-size="${fsTick}" text-anchor="middle">`);
  for (const t of xT.ticks) out.push(`<text x="${n(sx(t))}" y="${n(plotBottom + 6 + fsTick)}">${tickText(t, xT.decimals)}</text>`);
  out.push(`</g>`);
  if (mT) {
    out.push(`<g class="iw-lc-melt-text iw-lc-mticks" fill="${COLOURS.melt}" font-size="${fsTick}" text-anchor="start">`);
    mT.ticks.forEach((t, i) => out.push(`<text x="${n(plotRight + 7)}" y="${n(sm(t) + fsTick * 0.35)}">${mLabels[i]}</text>`));
    out.push(`</g>`);
  }
  const midY = (plotTop + plotBottom) / 2;
  out.push(
    `<text class="iw-lc-text iw-lc-ytitle" fill="currentColor" font-size="${fsAxisTitle}" text-anchor="middle" transform="translate(${n(pad + fsAxisTitle * 0.8)} ${n(midY)}) rotate(-90)">Lattice energy (kJ/mol)</text>`,
  );
  out.push(
    `<text class="iw-lc-text iw-lc-xtitle" fill="currentColor" font-size="${fsAxisTitle}" text-anchor="middle" x="${n((plotLeft + plotRight) / 2)}" y="${n(H - pad)}">` +
      `${mode === 'inverse-radius' ? '1/(r₊ + r₋) (Å⁻¹), six-coordinate radii' : 'Charge product |z₊z₋|'}</text>`,
  );
  if (mT)
    out.push(
      `<text class="iw-lc-melt-text iw-lc-mtitle" fill="${COLOURS.melt}" font-size="${fsAxisTitle}" text-anchor="middle" transform="translate(${n(W - pad - fsAxisTitle * 0.3)} ${n(midY)}) rotate(-90)">Melting point (°C)</text>`,
    );

  // Guide lines.
  if (guideSegs.length) {
    out.push(`<g class="iw-lc-guides">`);
    for (const s of guideSegs) {
      const { fit, z } = s.g;
      const tip =
        `Least-squares guide for |z₊z₋| = ${z} (${fit.n} salts): U ≈ ${energyText(fit.slope)}·x ` +
        `${fit.intercept < 0 ? '−' : '+'} ${energyText(Math.abs(fit.intercept))} kJ/mol, x = 1/(r₊ + r₋) in Å⁻¹. ` +
        `A guide to the eye, not a model.`;
      out.push(`<g class="iw-lc-guide-line" data-z="${n(z)}"><title>${xml(tip)}</title>${guideLine(s.x1, s.y1, s.x2, s.y2)}</g>`);
    }
    out.push(`</g>`);
  }

  // Melting points: a faint connector to the salt's energy marker, then the cross with its tooltip.
  if (hasMelt) {
    out.push(
      `<g class="iw-lc-melt iw-lc-connectors" stroke="${COLOURS.melt}" stroke-opacity="0.4" stroke-width="1" stroke-dasharray="1 3" fill="none">`,
    );
    for (const c of centres) {
      if (c.my === null || Math.abs(c.my - c.cy) < r + cross + 4) continue;
      const dir = c.my > c.cy ? 1 : -1;
      out.push(`<line x1="${n(c.cx)}" y1="${n(c.cy + dir * (r + 1.5))}" x2="${n(c.cx)}" y2="${n(c.my - dir * (cross + 1.5))}"/>`);
    }
    out.push(`</g>`);
    out.push(`<g class="iw-lc-melts">`);
    plotted.forEach((p, i) => {
      const c = centres[i];
      if (c.my === null || p.mp === null) return;
      out.push(`<g class="iw-lc-mp"><title>${xml(`${p.label}: melting point ${Math.round(p.mp)} °C`)}</title>${markerMelt(c.cx, c.my, cross)}</g>`);
    });
    out.push(`</g>`);
  }

  // Energy markers, each with its tooltip.
  out.push(`<g class="iw-lc-points">`);
  plotted.forEach((p, i) => {
    const c = centres[i];
    const xText =
      mode === 'inverse-radius'
        ? `1/(r₊ + r₋) = ${(p.inverseR0 as number).toFixed(3)} Å⁻¹${p.z !== null ? `, |z₊z₋| = ${p.z}` : ''}`
        : `|z₊z₋| = ${p.z}${p.inverseR0 !== null ? `, 1/(r₊ + r₋) = ${p.inverseR0.toFixed(3)} Å⁻¹` : ''}`;
    const value = p.estimate
      ? `≈ ${energyText(p.kJ)} kJ/mol (estimate, ${p.method})`
      : `${energyText(p.kJ)} kJ/mol (${p.method}, from recalled enthalpies)`;
    const lines = [`${p.label}: ${value}`, xText];
    if (p.mp !== null) lines.push(`melting point ${Math.round(p.mp)} °C`);
    out.push(
      `<g class="iw-lc-pt" data-kind="${p.estimate ? 'estimate' : 'measured'}"><title>${xml(lines.join('\n'))}</title>` +
        `${p.estimate ? markerEst(c.cx, c.cy, r) : markerMeas(c.cx, c.cy, half)}</g>`,
    );
  });
  out.push(`</g>`);

  // Labels on top, with their leaders.
  if (leaders.length) {
    out.push(`<g class="iw-lc-axis iw-lc-leaders" stroke="currentColor" stroke-opacity="0.5" stroke-width="0.8" aria-hidden="true">`);
    out.push(...leaders);
    out.push(`</g>`);
  }
  out.push(`<g class="iw-lc-text iw-lc-label iw-lc-labels" fill="currentColor" font-size="${fsLabel}" aria-hidden="true">`);
  out.push(...labelOut);
  out.push(`</g>`);
  if (guideSegs.length) {
    out.push(`<g class="iw-lc-guide-text" fill="currentColor" fill-opacity="0.8" font-size="10" font-style="italic" aria-hidden="true">`);
    for (const s of guideSegs) out.push(`<text x="${n(s.tx)}" y="${n(s.ty)}" text-anchor="middle">${xml(s.text)}</text>`);
    out.push(`</g>`);
  }
  out.push(`</svg>`);
  return out.join('');
}

function guideLine(x1: number, y1: number, x2: number, y2: number): string {
  return `<line class="iw-lc-guide" stroke="currentColor" stroke-opacity="0.6" stroke-width="1.5" stroke-dasharray="5 3" x1="${n(x1)}" y1="${n(y1)}" x2="${n(x2)}" y2="${n(y2)}"/>`;
}

function markerEst(cx: number, cy: number, r: number): string {
  return `<circle class="iw-lc-est" cx="${n(cx)}" cy="${n(cy)}" r="${n(r)}" fill="none" stroke="${COLOURS.estimate}" stroke-width="1.8"/>`;
}

function markerMeas(cx: number, cy: number, half: number): string {
  return `<rect class="iw-lc-meas" x="${n(cx - half)}" y="${n(cy - half)}" width="${n(2 * half)}" height="${n(2 * half)}" fill="${COLOURS.measured}" stroke="${COLOURS.measured}" stroke-width="1"/>`;
}

function markerMelt(cx: number, cy: number, s: number): string {
  return (
    `<path class="iw-lc-melt" d="M${n(cx - s)} ${n(cy - s)}L${n(cx + s)} ${n(cy + s)}M${n(cx - s)} ${n(cy + s)}L${n(cx + s)} ${n(cy - s)}" ` +
    `fill="none" stroke="${COLOURS.melt}" stroke-width="1.8" stroke-linecap="round"/>`
  );
}

/**
 * On the charge-product axis many salts share one x value. Markers that would overlap are moved sideways
 * (0, +d, −d, +2d, …, d a marker's width) by less than 40 % of the gap to the next x value, so the x order is
 * kept and the stack can be read; the tooltip keeps the exact values. Changes `centres` in place.
 */
function dodge(centres: Array<{ cx: number; cy: number }>, xs: number[], r: number, pxPerUnit: number): void {
  const distinct = [...new Set(xs)].sort((a, b) => a - b);
  let gap = Infinity;
  for (let i = 1; i < distinct.length; i++) gap = Math.min(gap, (distinct[i] - distinct[i - 1]) * pxPerUnit);
  const d = 2 * r + 2;
  const maxK = Math.max(0, Math.floor((Math.min(gap, 200) * 0.4) / d));
  const groups = new Map<number, number[]>();
  xs.forEach((x, i) => groups.set(x, [...(groups.get(x) ?? []), i]));
  for (const [, idx] of [...groups].sort((a, b) => a[0] - b[0])) {
    const done: Array<{ cx: number; cy: number }> = [];
    for (const i of idx) {
      const c = centres[i];
      const base = c.cx;
      let best = base;
      let bestClear = -Infinity;
      for (let k = 0; k <= 2 * maxK; k++) {
        const off = (k % 2 ? 1 : -1) * Math.ceil(k / 2) * d;
        const x = base + off;
        const clear = Math.min(Infinity, ...done.map((o) => Math.hypot(o.cx - x, o.cy - c.cy)));
        if (clear >= d - 1) {
          best = x;
          break;
        }
        if (clear > bestClear) {
          bestClear = clear;
          best = x;
        }
      }
      c.cx = best;
      done.push(c);
    }
  }
}

/** The part of the fitted line over [x0, x1] whose value lies within [ymin, ymax]; null if none. */
function clipToY(x0: number, x1: number, fit: LineFit, ymin: number, ymax: number): [number, number] | null {
  let a = x0;
  let b = x1;
  const { slope, intercept } = fit;
  if (slope === 0) return intercept >= ymin && intercept <= ymax ? [a, b] : null;
  const xa = (ymin - intercept) / slope;
  const xb = (ymax - intercept) / slope;
  a = Math.max(a, Math.min(xa, xb));
  b = Math.min(b, Math.max(xa, xb));
  return a < b ? [a, b] : null;
}
