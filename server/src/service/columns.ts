/**
 * The tables Ionwright shows, defined once: for each column its header, its alignment and how its cell is
 * read from the model (the text; the HTML where it says more, such as a typeset formula). Three small
 * renderers write any of them as Markdown (the tables "insert table" and `ionwright table` write, the
 * hover), HTML (the preview and the report) and plain text (aligned columns for a terminal).
 *
 * Tables: formulas, a batch's ingredients (every line, counted or not), a batch's ions, its equilibrium,
 * its safety reading (dangerous pairs, the steps of the heat of making up), findings.
 */
import type { FormulaAnalysis } from '../chem/analyse';
import type { BatchAnalysis, BatchIon, Ingredient, SkippedLine, SolidSaturation, SolutionSpecies } from '../chem/batch';
import { cautionsFor } from '../chem/cautions';
import type { Hazard, HeatStep } from '../chem/safety';
import type { LspDiagnostic } from './diagnostics';
import { chargeNumber, DASH, energy, molarMassText, oxidationText, percent, shortMethod, sig } from './format';
import { formulaText } from './format';
import { html, type Html, type HtmlValue, join, toHtml } from './html';
import type { ServiceSettings } from './settings';
import { hazardIngredients, hazardKindText, hazardText, stepKindText, stepKJText } from './safety';
import { saturationWord, siText } from './solution';
import { formulaSpan, typesetDisplay } from './typeset';

export type Align = 'left' | 'right';

export interface Column<R> {
  /** Stable name, to pick columns for a compact view. */
  key: string;
  head: string;
  /** A shorter header for compact views (the hover's table). */
  short?: string;
  align: Align;
  /** The cell as text (Markdown and plain text; HTML where `html` is absent). */
  text: (row: R) => string;
  /** The cell as HTML, where it says more than the text. */
  html?: (row: R) => HtmlValue;
  /** A class for the column's HTML cells (a column shown only in print). */
  cls?: string;
}

export type Columns<R> = ReadonlyArray<Column<R>>;

/** The columns of `cols` named by `keys`, in that order. */
export function pick<R>(cols: Columns<R>, keys: readonly string[]): Column<R>[] {
  return keys.map((k) => cols.find((c) => c.key === k)).filter((c): c is Column<R> => c !== undefined);
}

// ── renderers ─────────────────────────────────────────────────────────────

/** A Markdown table cell: pipes escaped, on one line. */
export const markdownCell = (t: string) => t.replace(/\|/g, '\\|').replace(/\r\n|\r|\n/g, ' ');

/** A row of Markdown cells. */
export const markdownRow = (cells: readonly string[]) => `| ${cells.map(markdownCell).join(' | ')} |`;

export interface RenderOptions {
  /** Use the columns' short headers. */
  short?: boolean;
}

/** A GitHub-flavoured Markdown table (header, alignment row, one line per row). */
export function markdownTable<R>(cols: Columns<R>, rows: readonly R[], o: RenderOptions = {}): string {
  const lines = [markdownRow(cols.map((c) => (o.short && c.short) || c.head)), `|${cols.map((c) => (c.align === 'right' ? '---:|' : '---|')).join('')}`];
  for (const r of rows) lines.push(markdownRow(cols.map((c) => c.text(r))));
  return lines.join('\n');
}

export interface HtmlTableOptions<R> extends RenderOptions {
  /** Classes of the table besides `iw-table`. */
  cls?: string;
  /** A class for a row (`iw-skipped`, `iw-error`). */
  rowClass?: (row: R) => string | undefined;
  /** A row written whole instead of cell by cell (a line not counted: its text, then its reason across the rest). */
  wide?: (row: R) => { first: HtmlValue; rest: HtmlValue; restClass?: string } | undefined;
}

/** An HTML table (`table.iw-table`), numbers right-aligned by `td.iw-n`. */
export function htmlTable<R>(cols: Columns<R>, rows: readonly R[], o: HtmlTableOptions<R> = {}): Html {
  const cellClass = (c: Column<R>) => [c.align === 'right' ? 'iw-n' : '', c.cls ?? ''].filter(Boolean).join(' ');
  const attr = (c: Column<R>) => (cellClass(c) ? html` class="${cellClass(c)}"` : '');
  const head = cols.map((c) => html`<th${attr(c)}>${(o.short && c.short) || c.head}</th>`);
  const body = rows.map((r) => {
    const cls = o.rowClass?.(r);
    const open = cls ? html`<tr class="${cls}">` : html`<tr>`;
    const wide = o.wide?.(r);
    if (wide) {
      return html`${open}<td>${wide.first}</td><td${wide.restClass ? html` class="${wide.restClass}"` : ''} colspan="${Math.max(1, cols.length - 1)}">${wide.rest}</td></tr>`;
    }
    const cells = cols.map((c) => html`<td${attr(c)}>${c.html ? c.html(r) : c.text(r)}</td>`);
    return html`${open}${cells}</tr>`;
  });
  return html`<table class="iw-table${o.cls ? ` ${o.cls}` : ''}"><thead><tr>${head}</tr></thead><tbody>${body}</tbody></table>`;
}

/** Width of a text in a terminal: code points (combining marks and wide characters are rare here). */
const width = (t: string) => [...t].length;

/** Plain text: columns padded to their widest cell, numbers right-aligned, a rule under the header. */
export function textTable<R>(cols: Columns<R>, rows: readonly R[], o: RenderOptions = {}): string {
  const grid = [cols.map((c) => (o.short && c.short) || c.head), ...rows.map((r) => cols.map((c) => c.text(r).replace(/\s*[\r\n]+\s*/g, ' ')))];
  const widths = cols.map((_, k) => Math.max(...grid.map((line) => width(line[k]))));
  const pad = (t: string, k: number) => {
    const gap = ' '.repeat(widths[k] - width(t));
    return cols[k].align === 'right' ? gap + t : t + gap;
  };
  const lines = grid.map((line) => line.map(pad).join('  ').trimEnd());
  lines.splice(1, 0, widths.map((w) => '─'.repeat(w)).join('  '));
  return lines.join('\n');
}

// ── formulas ──────────────────────────────────────────────────────────────

/** A lattice energy with its method, as a cell: `≈ 787 kJ/mol (Kapustinskii, est.)`, `(CuSO₄, …)` for a hydrate. */
function latticeText(a: FormulaAnalysis, s: ServiceSettings): string {
  const L = a.lattice;
  if (!L) return DASH;
  const salt = a.formula && a.formula.parts.length > 1 ? `${formulaText(L.salt)}, ` : '';
  return `${L.estimate ? '≈ ' : ''}${energy(L.kJPerMol, s)} (${salt}${shortMethod(L.method)}${L.estimate ? ', est.' : ''})`;
}

function latticeHtml(a: FormulaAnalysis, s: ServiceSettings): HtmlValue {
  const L = a.lattice;
  if (!L) return DASH;
  const salt = a.formula && a.formula.parts.length > 1 ? html`${typesetDisplay(formulaText(L.salt))}, ` : '';
  return html`${L.estimate ? '≈ ' : ''}${energy(L.kJPerMol, s)} <span class="iw-by">${salt}${shortMethod(L.method)}${L.estimate ? ', estimate' : ''}</span>`;
}

const balanceText = (a: FormulaAnalysis) => (a.charges ? (a.charges.balanced ? 'balanced' : `not balanced: ${a.charges.message}`) : DASH);

/** The formula table: one row per distinct readable formula. */
export function formulaColumns(s: ServiceSettings): Column<FormulaAnalysis>[] {
  return [
    {
      key: 'formula',
      head: 'Formula',
      align: 'left',
      text: (a) => a.display,
      html: (a) => {
        const c = cautionsFor(a);
        return html`${formulaSpan(a, s)}${c.length ? html` <span class="iw-caution-mark" title="${`caution: ${c.map((x) => x.text).join('; ')}`}">⚠</span>` : ''}`;
      },
    },
    { key: 'molarMass', head: 'Molar mass (g/mol)', align: 'right', text: (a) => molarMassText(a.molarMass?.value, s) },
    { key: 'bond', head: 'Bond type', align: 'left', text: (a) => a.bond?.type ?? DASH },
    { key: 'deltaEN', head: 'ΔEN (pair)', align: 'left', text: (a) => (a.bond ? `${a.bond.deltaEN.toFixed(2)} (${a.bond.pair.join('–')})` : DASH) },
    { key: 'ionic', head: 'Ionic character', align: 'right', text: (a) => (a.bond ? `${a.bond.percentIonic.toFixed(0)} %` : DASH) },
    { key: 'lattice', head: 'Lattice energy', align: 'left', text: (a) => latticeText(a, s), html: (a) => latticeHtml(a, s) },
    { key: 'oxidation', head: 'Oxidation states', align: 'left', text: (a) => (a.charges?.oxidationStates ? oxidationText(a.charges.oxidationStates) : DASH) },
    {
      key: 'balance',
      head: 'Charge balance',
      align: 'left',
      text: balanceText,
      html: (a) => (a.charges && !a.charges.balanced ? html`<span class="iw-formula iw-warning">not balanced</span>: ${a.charges.message}` : balanceText(a)),
    },
  ];
}

// ── batches ───────────────────────────────────────────────────────────────

/** An ingredient's amount as written, with its assay (`2.5 g @ 98 %`). */
export const amountText = (i: Ingredient) => i.amount.text + (i.assay < 1 ? ` @ ${sig(i.assay * 100)} %` : '') + (i.stock ? ` ${i.stock}` : '');

/** A name or shelf label as the line wrote it, after the formula it was read as (` (borax)`); empty for a formula. */
export const asWritten = (i: Ingredient) => (i.via === 'formula' ? '' : ` (${i.formulaText})`);

/** A line of a batch in a table: a counted ingredient or a line not counted. */
export type BatchRow = { ingredient: Ingredient; skipped?: undefined } | { skipped: SkippedLine; ingredient?: undefined };

/** Every line of the batch in the order written: counted ingredients and lines not counted. */
export function batchRows(b: BatchAnalysis): BatchRow[] {
  const rows: Array<BatchRow & { at: number }> = [
    ...b.ingredients.map((i) => ({ at: i.lineStart, ingredient: i })),
    ...b.skipped.map((l) => ({ at: l.lineStart, skipped: l })),
  ];
  return rows.sort((x, y) => x.at - y.at);
}

/** The counted rows only. */
export const countedRows = (b: BatchAnalysis): BatchRow[] => b.ingredients.map((i) => ({ ingredient: i }));

/**
 * A batch's ingredient columns: what is weighed or poured, the amount written, the molar mass, the mass to
 * weigh, the moles, the concentration in the final volume, the share of the weighed mass and (with a
 * `total:`) the share of the total. `cell` decorates the ingredient cell in HTML (the preview's markers).
 */
export function batchColumns(b: BatchAnalysis, s: ServiceSettings, cell?: (i: Ingredient) => HtmlValue): Column<BatchRow>[] {
  const n = (f: (i: Ingredient) => string) => (r: BatchRow) => (r.ingredient ? f(r.ingredient) : '');
  const cols: Column<BatchRow>[] = [
    {
      key: 'ingredient',
      head: 'Ingredient',
      align: 'left',
      text: (r) => (r.ingredient ? r.ingredient.formula + asWritten(r.ingredient) : r.skipped.text),
      html: (r) =>
        r.ingredient
          ? html`${r.ingredient.analysis.ok ? formulaSpan(r.ingredient.analysis, s) : r.ingredient.formulaText}${asWritten(r.ingredient)}${cell?.(r.ingredient)}`
          : html`<code>${r.skipped.text}</code>`,
    },
    { key: 'amount', head: 'Amount', align: 'left', text: n(amountText) },
    { key: 'molarMass', head: 'Molar mass (g/mol)', align: 'right', text: n((i) => molarMassText(i.molarMass, s)) },
    { key: 'weigh', head: 'To weigh (g)', align: 'right', text: n((i) => (i.measure === 'weigh' ? sig(i.massG) : `(${sig(i.massG)})`)) },
    { key: 'moles', head: 'Moles (mol)', short: 'mol', align: 'right', text: n((i) => sig(i.moles)) },
    { key: 'concentration', head: 'Concentration (M)', short: 'M', align: 'right', text: n((i) => sig(i.concentrationM)) },
    { key: 'share', head: 'Share of weighed mass', align: 'right', text: n((i) => percent(i.massFraction)) },
  ];
  // Liquids poured and stocks taken: the volume to measure, in a column of its own where any line has one.
  if (b.ingredients.some((i) => i.volumeML !== null))
    cols.splice(4, 0, { key: 'pour', head: 'To pour (mL)', align: 'right', text: n((i) => (i.volumeML === null ? '' : sig(i.volumeML))) });
  if (b.totalMassG !== null) cols.push({ key: 'shareOfTotal', head: 'Share of total', align: 'right', text: n((i) => percent(i.fractionOfTotal)) });
  return cols;
}

/** The keys of the hover's compact batch table. */
export const COMPACT_BATCH = ['ingredient', 'weigh', 'pour', 'moles', 'concentration', 'share', 'shareOfTotal'] as const;

/** The ions of a batch: each ion, its charge (true minus sign) and its concentration. */
export const ION_COLUMNS: Columns<BatchIon> = [
  { key: 'ion', head: 'Ion', align: 'left', text: (x) => x.ion, html: (x) => typesetDisplay(x.ion) },
  { key: 'charge', head: 'Charge', align: 'right', text: (x) => chargeNumber(x.charge) },
  { key: 'concentration', head: 'Concentration (M)', align: 'right', text: (x) => sig(x.concentrationM) },
];

// ── the equilibrium ───────────────────────────────────────────────────────

/** The species of a batch's equilibrium: each species, its charge, its concentration and its activity. */
export const SPECIES_COLUMNS: Columns<SolutionSpecies> = [
  { key: 'species', head: 'Species', align: 'left', text: (x) => x.display, html: (x) => typesetDisplay(x.display) },
  { key: 'charge', head: 'Charge', align: 'right', text: (x) => chargeNumber(x.charge) },
  { key: 'concentration', head: 'Concentration (M)', align: 'right', text: (x) => sig(x.concentrationM, 3) },
  { key: 'activity', head: 'Activity', align: 'right', text: (x) => sig(x.activity, 3) },
];

/** The solids a batch can form: the solid, its saturation index log(IAP/Ksp), what that means. */
export const SATURATION_COLUMNS: Columns<SolidSaturation> = [
  {
    key: 'solid',
    head: 'Solid',
    align: 'left',
    text: (x) => `${x.display} (${x.name})`,
    html: (x) => html`${typesetDisplay(x.display)} <span class="iw-by">${x.name}</span>`,
  },
  { key: 'si', head: 'Saturation index', short: 'SI', align: 'right', text: (x) => siText(x.saturationIndex) },
  {
    key: 'state',
    head: 'State',
    align: 'left',
    text: (x) => saturationWord(x.saturationIndex),
    html: (x) => (x.saturationIndex > 0 ? html`<span class="iw-warning">${saturationWord(x.saturationIndex)}</span>` : saturationWord(x.saturationIndex)),
  },
];

// ── safety ────────────────────────────────────────────────────────────────

/** A batch's dangerous pairs: what forms, from which ingredients, the harm, and what to know. */
export const HAZARD_COLUMNS: Columns<Hazard> = [
  {
    key: 'forms',
    head: 'Forms',
    align: 'left',
    text: hazardKindText,
    html: (h) => html`<span class="iw-warning">${hazardKindText(h)}</span>`,
  },
  {
    key: 'ingredients',
    head: 'From',
    align: 'left',
    text: hazardIngredients,
    html: (h) =>
      join(
        h.ingredients.map((f) => typesetDisplay(f)),
        ' + ',
      ),
  },
  { key: 'harm', head: 'Harm', align: 'left', text: (h) => h.harm },
  { key: 'message', head: 'What to know', align: 'left', text: hazardText },
];

/** The steps of a batch's heat of making up: the step, the ingredient, its ΔH and how it was obtained. */
export const HEAT_STEP_COLUMNS: Columns<HeatStep> = [
  { key: 'step', head: 'Step', align: 'left', text: (st) => stepKindText[st.kind] },
  {
    key: 'ingredient',
    head: 'Ingredient',
    align: 'left',
    text: (st) => st.ingredient ?? 'between ingredients',
    html: (st) => (st.ingredient ? typesetDisplay(st.ingredient) : 'between ingredients'),
  },
  { key: 'kJ', head: 'ΔH (kJ)', align: 'right', text: stepKJText },
  { key: 'method', head: 'How', align: 'left', text: (st) => (st.source ? `${st.method} — ${st.source}` : st.method) },
];

// ── findings ──────────────────────────────────────────────────────────────

export const SEVERITY_WORD = { 1: 'error', 2: 'warning', 3: 'information', 4: 'hint' } as const;

/** Findings in LSP shape: where (1-based line and column), how severe, the code and the message. */
export const FINDING_COLUMNS: Columns<LspDiagnostic> = [
  { key: 'at', head: 'Line:col', align: 'left', text: (d) => `${d.range.start.line + 1}:${d.range.start.character + 1}` },
  { key: 'severity', head: 'Severity', align: 'left', text: (d) => SEVERITY_WORD[d.severity] },
  { key: 'code', head: 'Code', align: 'left', text: (d) => d.code, html: (d) => html`<code>${d.code}</code>` },
  { key: 'message', head: 'Message', align: 'left', text: (d) => d.message },
];

export { join, toHtml };
