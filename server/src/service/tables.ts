/**
 * The computed tables Ionwright inserts into a report, as Markdown: one for the formulas of a section and
 * one per batch (ingredients, then ions and ionic strength, with the model's notes and the cautions).
 */
import type { BatchAnalysis, Ingredient } from '../chem/batch';
import { CAUTION_FOOTNOTE } from '../chem/cautions';
import type { FormulaAnalysis } from '../chem/analyse';
import { subscriptDigits } from '../chem/formula/compute';
import { oxidationText, energy } from './card';
import type { AnalysedDocument, BatchOccurrence, FormulaOccurrence } from './document';
import { DEFAULT_SETTINGS, type ServiceSettings } from './settings';

/** Escape a table cell. */
const cell = (t: string) => t.replace(/\|/g, '\\|').replace(/\n/g, ' ');
const row = (cells: string[]) => `| ${cells.map(cell).join(' | ')} |`;

/** Significant figures without exponent noise for the quantities a chemist weighs. */
export function sig(x: number | null | undefined, digits = 4): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return '—';
  if (x === 0) return '0';
  const abs = Math.abs(x);
  if (abs >= 1e6 || abs < 1e-4) return x.toExponential(digits - 1).replace('e', '×10^').replace('^+', '^');
  return Number(x.toPrecision(digits)).toString();
}

/** A lattice-energy method without its kind: 'Kapustinskii', 'Born–Haber'. */
export const shortMethod = (method: string) => method.replace(' equation', '').replace(' cycle', '');

/** An ingredient's amount as written, with its assay (`2.5 g @ 98 %`). */
export const amountText = (i: Ingredient) => i.amount.text + (i.assay < 1 ? ` @ ${sig(i.assay * 100)} %` : '');

/** A mass fraction as a percentage with one decimal, or a dash. */
export const fractionText = (x: number | null) => (x === null ? '—' : `${(x * 100).toFixed(1)} %`);

/** The ingredients the batch does not split into ions. */
export const undissociatedOf = (b: BatchAnalysis) => b.ingredients.filter((i) => i.undissociated && i.ions.length === 0);

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

/** The mass to weigh of the counted ingredients, g. */
export const weighedMass = (b: BatchAnalysis) => b.ingredients.reduce((s, i) => s + (i.massG ?? 0), 0);

/** '2 lines not counted' (the batch is incomplete), or '' when every line counts. */
export const notCountedText = (b: BatchAnalysis) => (b.skipped.length ? `${plural(b.skipped.length, 'line')} not counted` : '');

/** '3 ingredients', or '3 ingredients, 2 lines not counted — incomplete'. */
export function countsText(b: BatchAnalysis): string {
  const n = plural(b.ingredients.length, 'ingredient');
  return b.skipped.length ? `${n}, ${notCountedText(b)} — incomplete` : n;
}

/** The two share columns: of the weighed mass always, of the total where the batch gives one. */
export const shareHeads = (b: BatchAnalysis) => (b.totalMassG !== null ? ['Share of weighed mass', 'Share of total'] : ['Share of weighed mass']);
export const shareCells = (b: BatchAnalysis, i: Ingredient) => (b.totalMassG !== null ? [fractionText(i.massFraction), fractionText(i.fractionOfTotal)] : [fractionText(i.massFraction)]);

/** The batch's warnings on counted lines or on the batch (solubility, charge, formulas counted as written); a line not counted shows its reason instead. */
export const batchWarnings = (b: BatchAnalysis) =>
  b.diagnostics.filter((d) => d.severity === 'warning' && !b.skipped.some((s) => d.start >= s.lineStart && d.start <= s.lineEnd));

/** Escape text for Markdown prose (messages may quote what the user wrote). */
export const escapeMarkdown = (t: string) => t.replace(/([\\`*_[\]<>|])/g, '\\$1');

/** Inline code for Markdown that survives any backticks in the text. */
export function codeSpan(t: string): string {
  const runs = t.match(/`+/g) ?? [];
  const fence = '`'.repeat(Math.max(0, ...runs.map((r) => r.length)) + 1);
  const pad = t.startsWith('`') || t.endsWith('`') ? ' ' : '';
  return `${fence}${pad}${t}${pad}${fence}`;
}

function latticeCell(a: FormulaAnalysis, s: ServiceSettings): string {
  const L = a.lattice;
  if (!L) return '—';
  const short = shortMethod(L.method);
  const salt = a.formula && a.formula.parts.length > 1 ? `${subscriptDigits(L.salt)}, ` : '';
  return `${L.estimate ? '≈ ' : ''}${energy(L.kJPerMol, s)} (${salt}${short}${L.estimate ? ', est.' : ''})`;
}

/** Markdown table of formulas (unique, in order of appearance, readable ones only). */
export function formulaTable(formulas: readonly FormulaAnalysis[], settings: ServiceSettings = DEFAULT_SETTINGS, title?: string): string {
  const seen = new Set<string>();
  const list = formulas.filter((a) => a.ok && a.molarMass && !seen.has(a.ascii) && seen.add(a.ascii));
  if (list.length === 0) return '';
  const lines: string[] = [];
  if (title) lines.push(`**${title}** (computed by Ionwright)`, '');
  lines.push(row(['Formula', 'Molar mass (g/mol)', 'Bond type', 'ΔEN (pair)', 'Lattice energy', 'Oxidation states']));
  lines.push('|---|---:|---|---|---|---|');
  for (const a of list) {
    lines.push(row([
      a.display,
      (a.molarMass as { value: number }).value.toFixed(settings.decimals),
      a.bond?.type ?? '—',
      a.bond ? `${a.bond.deltaEN.toFixed(2)} (${a.bond.pair.join('–')})` : '—',
      latticeCell(a, settings),
      a.charges?.oxidationStates ? oxidationText(a.charges.oxidationStates) : '—',
    ]));
  }
  const notes: string[] = [];
  if (list.some((a) => a.lattice?.estimate)) notes.push('Lattice energies marked ≈ are model estimates (typically 5–10 % low; more for salts with covalent character).');
  if (list.some((a) => a.charges && !a.charges.balanced)) notes.push('Some formulas are not charge-balanced; see the warnings in the notes.');
  if (notes.length) lines.push('', ...notes.map((n) => `_${n}_`));
  return lines.join('\n');
}

/** Markdown tables of a batch: every line shows, counted in the table or listed as not counted with the reason. */
export function batchTable(b: BatchAnalysis, settings: ServiceSettings = DEFAULT_SETTINGS): string {
  const lines: string[] = [];
  const head = [b.name ?? 'Batch', b.volumeL !== null ? `final volume ${sig(b.volumeL * 1000)} mL` : null, b.totalMassG !== null ? `total ${sig(b.totalMassG)} g` : null].filter(Boolean).join(', ');
  lines.push(`**${head}**${b.skipped.length ? ` — **incomplete: ${notCountedText(b)}**` : ''} (computed by Ionwright)`, '');
  const heads = shareHeads(b);
  lines.push(row(['Ingredient', 'Amount', 'Molar mass (g/mol)', 'To weigh (g)', 'Moles (mol)', 'Concentration (M)', ...heads]));
  lines.push(`|---|---|---:|---:|---:|---:|${heads.map(() => '---:|').join('')}`);
  for (const i of b.ingredients) {
    lines.push(row([
      i.formula,
      amountText(i),
      i.molarMass.toFixed(settings.decimals),
      sig(i.massG),
      sig(i.moles),
      sig(i.concentrationM),
      ...shareCells(b, i),
    ]));
  }
  if (b.ingredients.length === 0) lines.push(row(['(none counted)', '', '', '', '', '', ...heads.map(() => '')]));
  if (b.skipped.length) {
    lines.push('', `**Not counted** (left out of every figure here; fix the line to count it):`, ...b.skipped.map((s) => `- ${codeSpan(s.text)} — ${escapeMarkdown(s.reason)}`));
  }
  if (b.ions.length) {
    lines.push('', row(['Ion', 'Charge', 'Concentration (M)']), '|---|---:|---:|');
    for (const ion of b.ions) lines.push(row([ion.ion, ion.charge > 0 ? `+${ion.charge}` : String(ion.charge), sig(ion.concentrationM)]));
  }
  lines.push('');
  if (b.ionicStrengthM !== null) lines.push(`Ionic strength I = ½ Σ cᵢzᵢ² = ${sig(b.ionicStrengthM)} M; net charge ${sig(b.netChargeEqPerL ?? 0, 2)} eq/L.`);
  const undissociated = undissociatedOf(b).map((i) => i.formula);
  if (undissociated.length) lines.push(`Not split into ions: ${undissociated.join(', ')}.`);
  for (const n of b.notes) lines.push(`_${n}_`);
  const warnings = batchWarnings(b);
  if (warnings.length) lines.push('', '**Warnings**', ...warnings.map((d) => `- ${escapeMarkdown(d.message)}`));
  if (b.cautions.length) {
    lines.push('', '**Cautions**', ...b.cautions.map((c) => `- ${c.text}`), '', `_${CAUTION_FOOTNOTE}_`);
  }
  return lines.join('\n');
}

export interface SectionTables {
  title: string;
  start: number;
  end: number;
  formulas: FormulaOccurrence[];
  batches: BatchOccurrence[];
}

/** Formulas and batches grouped by section (items before the first heading form a section of their own). */
export function sectionsOf(doc: AnalysedDocument): SectionTables[] {
  const out: SectionTables[] = [];
  const first = doc.sections[0]?.start ?? doc.text.length;
  const pre: SectionTables = { title: 'Notes', start: 0, end: first, formulas: [], batches: [] };
  if (first > 0) out.push(pre);
  for (const s of doc.sections) out.push({ title: s.title, start: s.start, end: s.end, formulas: [], batches: [] });
  const find = (offset: number) => {
    let lo = 0;
    let hi = out.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (out[mid].start <= offset) lo = mid;
      else hi = mid - 1;
    }
    return out[lo];
  };
  if (out.length === 0) out.push(pre);
  for (const f of doc.formulas) find(f.ref.start).formulas.push(f);
  for (const b of doc.batches) find(b.ref.start).batches.push(b);
  return out;
}

/** The tables of one section: its formulas, then each batch ('' when there is nothing to tabulate). */
export function sectionTables(s: SectionTables, settings: ServiceSettings): string {
  const parts: string[] = [];
  const ft = formulaTable(s.formulas.map((f) => f.analysis), settings, `Formulas — ${s.title}`);
  if (ft) parts.push(ft);
  for (const b of s.batches) parts.push(batchTable(b.analysis, settings));
  return parts.join('\n\n');
}

/** All tables of a document, as `ionwright table` prints them. */
export function documentTables(doc: AnalysedDocument, settings: ServiceSettings = doc.settings): string {
  return sectionsOf(doc).map((s) => sectionTables(s, settings)).filter(Boolean).join('\n\n');
}
