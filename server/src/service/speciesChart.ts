/**
 * Two charts of a batch's equilibrium for the HTML report, each one self-contained inline `<svg>` (no
 * scripts, fonts or links; colours through CSS variables with fallbacks, and presentation attributes as
 * well, as the lattice chart does):
 *
 * - The species distribution over pH (chem/solution/distribution.ts): one small panel per component that
 *   changes form over the range (an acid–base system, a metal and its complexes), the share of its total
 *   in each species from pH 0 to 14, each curve named at its peak and drawn in its own colour and dash
 *   pattern (never colour alone), and a dashed line at the batch's own pH.
 * - The saturation index of each solid the batch can form, as a bar from zero (saturation): to the right
 *   oversaturated, to the left undersaturated, the value and the word beside each bar.
 *
 * Pure string work; the same input gives the same svg (coordinates rounded to 2 decimals).
 */
import type { SolidSaturation } from '../chem/batch';
import type { SpeciesDistribution } from '../chem/solution/distribution';
import { coord, escapeXml, shorten, textWidth } from './chart/text';
import { niceTicks } from './chart/ticks';
import { MINUS } from './format';
import { pHText, siText } from './solution';

/** Curve colours (mid-tones readable on light and dark pages) and dash patterns, paired by index. */
const PALETTE = ['#3b7dd8', '#c2621a', '#2f9e6e', '#b3478f', '#8a6d1f', '#6b5fd0'];
const DASHES = ['', '6 3', '2 3', '8 3 2 3', '1 2', '10 4'];

export const SPECIES_CHART_CSS_VARIABLES = {
  '--iw-chart-text': 'titles, tick labels, curve labels (currentColor)',
  '--iw-chart-axis': 'axes and the zero line (currentColor)',
  '--iw-chart-grid': 'gridlines, at 15 % opacity (currentColor)',
  '--iw-chart-s0 … --iw-chart-s5': `the species curves (${PALETTE.join(', ')})`,
  '--iw-chart-over': 'bars of oversaturated solids (#c2621a)',
  '--iw-chart-under': 'bars of undersaturated solids (#3b7dd8)',
} as const;

const STYLE = [
  '.iw-eqchart{max-width:100%;height:auto;font-family:var(--iw-chart-font,system-ui,sans-serif)}',
  '.iw-eqchart .iw-ec-text{fill:var(--iw-chart-text,currentColor)}',
  '.iw-eqchart .iw-ec-axis{stroke:var(--iw-chart-axis,currentColor)}',
  '.iw-eqchart .iw-ec-grid{stroke:var(--iw-chart-grid,currentColor);stroke-opacity:.15}',
  ...PALETTE.map((c, k) => `.iw-eqchart .iw-ec-s${k}{stroke:var(--iw-chart-s${k},${c})}.iw-eqchart .iw-ec-t${k}{fill:var(--iw-chart-s${k},${c})}`),
  '.iw-eqchart .iw-ec-over{fill:var(--iw-chart-over,#c2621a)}',
  '.iw-eqchart .iw-ec-under{fill:var(--iw-chart-under,#3b7dd8)}',
].join('');

const FONT = { title: 13, tick: 10.5, label: 11, note: 10.5 };
const PAD = 12;

function svgOpen(width: number, height: number, id: string): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" class="iw-eqchart" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" role="img" aria-labelledby="${id}-title ${id}-desc" font-size="${FONT.label}">`;
}

const text = (x: number, y: number, body: string, attrs = '') =>
  `<text class="iw-ec-text" fill="currentColor" x="${coord(x)}" y="${coord(y)}"${attrs}>${escapeXml(body)}</text>`;
const line = (x1: number, y1: number, x2: number, y2: number, attrs: string) =>
  `<line${attrs} x1="${coord(x1)}" y1="${coord(y1)}" x2="${coord(x2)}" y2="${coord(y2)}"/>`;

const percent = (f: number) => `${Math.round(f * 100)} %`;

export interface EquilibriumChartOptions {
  /** A unique id for the svg's title and description. */
  id: string;
  title: string;
  width?: number;
}

/** The species distribution over pH, one panel per component. */
/** The opening of a chart: the svg element, its title and description (for screen readers), the style, the title line. */
function chartHead(width: number, height: number, o: { id: string; title: string }, desc: string): string[] {
  return [
    svgOpen(width, height, o.id),
    `<title id="${o.id}-title">${escapeXml(o.title)}</title>`,
    `<desc id="${o.id}-desc">${escapeXml(desc)}</desc>`,
    `<style>${STYLE}</style>`,
    text(PAD, PAD + 12, shorten(o.title, Math.floor((width - 2 * PAD) / 7.5)), ` font-size="${FONT.title}" font-weight="600"`),
  ];
}

export function speciesChart(d: SpeciesDistribution, o: EquilibriumChartOptions): string {
  const width = Math.max(320, Math.round(o.width ?? 640));
  const left = 48;
  const right = 16;
  const panelH = 128;
  const gap = 44;
  const top = PAD + 52;
  const x0 = left;
  const x1 = width - right;
  const lo = d.pH[0];
  const hi = d.pH[d.pH.length - 1];
  const X = (pH: number) => x0 + ((pH - lo) / (hi - lo || 1)) * (x1 - x0);
  const n = d.groups.length;
  const height = n ? top + n * (panelH + gap) : PAD * 2 + 44;
  const desc = describeDistribution(d);
  const out = chartHead(width, height, o, desc);
  if (!n) {
    out.push(text(PAD, PAD + 36, 'No component of this batch changes form between pH 0 and 14.', ` font-size="${FONT.note}"`), '</svg>');
    return out.join('');
  }
  const inRange = d.batchPH >= lo && d.batchPH <= hi;
  d.groups.forEach((g, k) => {
    const py0 = top + k * (panelH + gap);
    const py1 = py0 + panelH;
    const Y = (f: number) => py1 - f * panelH;
    out.push(text(x0, py0 - 8, `${g.name} (${g.display}, ${totalText(g.totalM)} in all)`, ` font-size="${FONT.label}" font-weight="600"`));
    // Grid and axes.
    for (const f of [0, 0.5, 1]) {
      out.push(line(x0, Y(f), x1, Y(f), ` class="iw-ec-grid" stroke="currentColor" stroke-opacity="0.15"`));
      out.push(text(x0 - 6, Y(f) + 3.5, percent(f), ` font-size="${FONT.tick}" text-anchor="end"`));
    }
    out.push(line(x0, py1, x1, py1, ` class="iw-ec-axis" stroke="currentColor"`), line(x0, py0, x0, py1, ` class="iw-ec-axis" stroke="currentColor"`));
    for (let t = Math.ceil(lo); t <= hi; t += 2) {
      out.push(line(X(t), py1, X(t), py1 + 4, ` class="iw-ec-axis" stroke="currentColor"`));
      out.push(text(X(t), py1 + 15, String(t), ` font-size="${FONT.tick}" text-anchor="middle"`));
    }
    if (k === n - 1) out.push(text((x0 + x1) / 2, py1 + 30, 'pH', ` font-size="${FONT.tick}" text-anchor="middle"`));
    // Curves: a polyline per run of converged points.
    const placed: Array<{ x: number; y: number; w: number; h: number }> = [];
    g.series.forEach((s, c) => {
      const cls = c % PALETTE.length;
      // Colour and dash both by index, offset once the palette wraps: no two curves of a panel look alike.
      const dash = DASHES[(c + Math.floor(c / PALETTE.length)) % DASHES.length];
      let run: string[] = [];
      const flush = () => {
        if (run.length > 1)
          out.push(
            `<polyline class="iw-ec-s${cls}" fill="none" stroke="${PALETTE[cls]}" stroke-width="1.8"${dash ? ` stroke-dasharray="${dash}"` : ''} points="${run.join(' ')}"/>`,
          );
        run = [];
      };
      s.fraction.forEach((f, p) => {
        if (Number.isNaN(f)) flush();
        else run.push(`${coord(X(d.pH[p]))},${coord(Y(Math.min(1, Math.max(0, f))))}`);
      });
      flush();
      // The label at the curve's peak, moved off labels already placed.
      let best = 0;
      s.fraction.forEach((f, p) => {
        if (!Number.isNaN(f) && f > (s.fraction[best] ?? -1)) best = p;
      });
      const w = textWidth(s.display, FONT.label) + 4;
      const h = FONT.label + 2;
      const px = X(d.pH[best]);
      const py = Y(s.fraction[best]);
      const clampX = (x: number) => Math.min(Math.max(x, x0 + 2), x1 - w);
      const clampY = (y: number) => Math.min(Math.max(y, py0 + h), py1 - 3);
      const hits = (x: number, y: number) => placed.some((b) => x < b.x + b.w && x + w > b.x && y - h < b.y && y > b.y - b.h);
      // Above the peak, below it, to either side, further up or down: the first place that is free.
      const candidates = [
        [px - w / 2, py - 5],
        [px - w / 2, py + h + 3],
        [px - w - 6, py - 5],
        [px + 6, py - 5],
        [px - w / 2, py - 5 - h],
        [px - w / 2, py + 2 * h + 3],
        [px - w - 6, py + h + 3],
        [px + 6, py + h + 3],
      ].map(([x, y]) => [clampX(x), clampY(y)]);
      const [lx, ly] = candidates.find(([x, y]) => !hits(x, y)) ?? candidates[0];
      placed.push({ x: lx, y: ly, w, h });
      out.push(
        `<text class="iw-ec-t${cls}" fill="${PALETTE[cls]}" x="${coord(lx + 2)}" y="${coord(ly)}" font-size="${FONT.label}">${escapeXml(s.display)}</text>`,
      );
    });
    if (inRange) out.push(line(X(d.batchPH), py0, X(d.batchPH), py1, ` class="iw-ec-axis" stroke="currentColor" stroke-dasharray="4 3"`));
  });
  if (inRange) out.push(text(X(d.batchPH), top - 26, `batch pH ${pHText(d.batchPH)}`, ` font-size="${FONT.note}" text-anchor="middle"`));
  if (d.unconverged) out.push(text(x1, PAD + 12, `${d.unconverged} points not converged (gaps)`, ` font-size="${FONT.note}" text-anchor="end" opacity="0.8"`));
  out.push('</svg>');
  return out.join('');
}

const totalText = (c: number) =>
  c >= 0.1 ? `${Number(c.toPrecision(3))} M` : c >= 1e-4 ? `${Number((c * 1e3).toPrecision(3))} mM` : `${Number((c * 1e6).toPrecision(2))} µM`;

/** What the chart says at the batch's pH, for the svg's description. */
function describeDistribution(d: SpeciesDistribution): string {
  if (!d.groups.length) return 'No component of this batch changes form between pH 0 and 14.';
  const at = d.pH.reduce((b, p, k) => (Math.abs(p - d.batchPH) < Math.abs(d.pH[b] - d.batchPH) ? k : b), 0);
  const parts = d.groups.map((g) => {
    const shares = g.series
      .map((s) => ({ s, f: s.fraction[at] }))
      .filter((x) => !Number.isNaN(x.f) && x.f >= 0.05)
      .sort((a, b) => b.f - a.f)
      .map((x) => `${percent(x.f)} ${x.s.display}`);
    return `${g.name}: ${shares.join(', ') || 'no species above 5 %'}`;
  });
  return `Share of each component's total in each species from pH ${d.pH[0]} to ${d.pH[d.pH.length - 1]}, activity coefficients held at the batch's. At the batch's pH ${pHText(d.batchPH)}: ${parts.join('; ')}.`;
}

/** The saturation index of each solid as a bar from zero. */
export function saturationChart(solids: readonly SolidSaturation[], o: EquilibriumChartOptions): string {
  const width = Math.max(320, Math.round(o.width ?? 640));
  const rowH = 22;
  const labels = solids.map((s) => `${s.display} ${s.name}`);
  const labelW = Math.min(Math.max(...labels.map((l) => textWidth(l, FONT.label)), 60) + 12, width * 0.42);
  const x0 = PAD + labelW;
  const x1 = width - PAD - 92;
  const top = PAD + 40;
  const height = top + Math.max(1, solids.length) * rowH + 30;
  const reach = Math.min(12, Math.max(2, ...solids.map((s) => Math.ceil(Math.abs(s.saturationIndex)))));
  const ticks = niceTicks(-reach, reach, 6, true);
  const lo = ticks.min;
  const hi = ticks.max;
  const X = (v: number) => x0 + ((Math.min(hi, Math.max(lo, v)) - lo) / (hi - lo)) * (x1 - x0);
  const over = solids.filter((s) => s.saturationIndex > 0);
  const desc = solids.length
    ? `Saturation index log10(IAP/Ksp) of each solid: ${solids.map((s) => `${s.display} ${siText(s.saturationIndex)}`).join(', ')}. ${over.length ? `Oversaturated: ${over.map((s) => s.display).join(', ')}.` : 'None is oversaturated.'}`
    : 'No solid of the table can form from this batch.';
  const out = chartHead(width, height, o, desc);
  out.push(text(PAD, PAD + 28, 'right of 0: oversaturated (would come out); left: undersaturated', ` font-size="${FONT.note}" opacity="0.85"`));
  if (!solids.length) {
    out.push(text(PAD, top + 14, 'No solid of the table can form from this batch.', ` font-size="${FONT.note}"`), '</svg>');
    return out.join('');
  }
  const bottom = top + solids.length * rowH;
  for (const t of ticks.ticks) {
    out.push(
      line(X(t), top - 4, X(t), bottom, ` class="${t === 0 ? 'iw-ec-axis' : 'iw-ec-grid'}" stroke="currentColor"${t === 0 ? '' : ' stroke-opacity="0.15"'}`),
    );
    out.push(text(X(t), bottom + 14, t < 0 ? `${MINUS}${-t}` : t > 0 ? `+${t}` : '0', ` font-size="${FONT.tick}" text-anchor="middle"`));
  }
  out.push(text((x0 + x1) / 2, bottom + 27, 'saturation index', ` font-size="${FONT.tick}" text-anchor="middle"`));
  solids.forEach((s, k) => {
    const y = top + k * rowH;
    const v = s.saturationIndex;
    const a = X(0);
    const b = X(v);
    const cls = v > 0 ? 'iw-ec-over' : 'iw-ec-under';
    out.push(text(x0 - 8, y + 15, shorten(labels[k], 40), ` font-size="${FONT.label}" text-anchor="end"`));
    out.push(
      `<rect class="${cls}" fill="${v > 0 ? '#c2621a' : '#3b7dd8'}" x="${coord(Math.min(a, b))}" y="${coord(y + 4)}" width="${coord(Math.max(1, Math.abs(b - a)))}" height="${coord(rowH - 8)}"><title>${escapeXml(`${s.display} (${s.name}): SI ${siText(v)}, log Ksp ${s.logKsp}`)}</title></rect>`,
    );
    const beyond = v > hi || v < lo ? ' (off the scale)' : '';
    out.push(text(x1 + 6, y + 15, `${siText(v)} ${v > 0 ? 'over' : 'under'}${beyond}`, ` font-size="${FONT.tick}"`));
  });
  out.push('</svg>');
  return out.join('');
}
