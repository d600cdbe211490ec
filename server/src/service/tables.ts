/**
 * The computed tables Ionwright inserts into a report, as Markdown: one for the formulas of a section and
 * one per batch (ingredients, then ions and ionic strength, with the model's notes, the safety reading and
 * the cautions).
 * The columns are defined once in columns.ts; the same definitions give the preview's and the report's
 * HTML and the plain text (`batchText`).
 */
import type { BatchAnalysis, BatchSolution } from '../chem/batch';
import { CAUTION_FOOTNOTE } from '../chem/cautions';
import type { FormulaAnalysis } from '../chem/analyse';
import {
  amountText,
  batchColumns,
  batchRows,
  countedRows,
  formulaColumns,
  HAZARD_COLUMNS,
  ION_COLUMNS,
  markdownRow,
  markdownTable,
  SATURATION_COLUMNS,
  SPECIES_COLUMNS,
  textTable,
} from './columns';
import { ADDITIONS_NOTE } from '../chem/upkeep';
import type { AnalysedDocument, BatchOccurrence, FormulaOccurrence } from './document';
import { additionLines, titreLine } from './upkeep';
import { percent, plural, sig, volumeText } from './format';
import { DEFAULT_SETTINGS, type ServiceSettings } from './settings';
import { hasSafety, hazardIngredients, hazardKindText, hazardText, heatAdvice, heatSummary, NO_HEAT, SAFETY_NOTICE } from './safety';
import { capacityText, limitsLine, pHLine, precipitateText, solvedText } from './solution';

export { amountText, sig };

/** A mass fraction as a percentage with one decimal, or a dash. */
export const fractionText = (x: number | null) => percent(x);

/** The ingredients the batch does not split into ions. */
export const undissociatedOf = (b: BatchAnalysis) => b.ingredients.filter((i) => i.undissociated && i.ions.length === 0);

/** The mass to weigh of the counted ingredients, g. */
/** Grams weighed out (the lines poured or taken from a stock are measured by volume, not weighed). */
export const weighedMass = (b: BatchAnalysis) => b.ingredients.reduce((s, i) => s + (i.measure === 'weigh' ? (i.massG ?? 0) : 0), 0);

/** '2 lines not counted' (the batch is incomplete), or '' when every line counts. */
export const notCountedText = (b: BatchAnalysis) => (b.skipped.length ? `${plural(b.skipped.length, 'line')} not counted` : '');

/** '3 ingredients', or '3 ingredients, 2 lines not counted — incomplete'. */
export function countsText(b: BatchAnalysis): string {
  const n = plural(b.ingredients.length, 'ingredient');
  return b.skipped.length ? `${n}, ${notCountedText(b)} — incomplete` : n;
}

/** Codes whose findings the safety section shows instead of the list of warnings. */
const SAFETY_CODES: ReadonlySet<string> = new Set(['batch-incompatible', 'batch-heat']);

/**
 * The batch's warnings on counted lines or on the batch (solubility, charge, formulas counted as written); a
 * line not counted shows its reason instead, and the safety section shows the safety reading's.
 */
export const batchWarnings = (b: BatchAnalysis) =>
  b.diagnostics.filter((d) => d.severity === 'warning' && !SAFETY_CODES.has(d.code) && !b.skipped.some((s) => d.start >= s.lineStart && d.start <= s.lineEnd));

/** The safety section of a batch's Markdown: the dangerous pairs as a table, the heat estimate, the advice, the notice. */
export function safetyMarkdown(b: BatchAnalysis): string[] {
  if (!hasSafety(b)) return [];
  const out = ['', '**Safety** (an aid, not a safety assessment)'];
  if (b.hazards.length) out.push('', markdownTable(HAZARD_COLUMNS, b.hazards));
  else out.push('', "No dangerous pair of ingredients in Ionwright's tables.");
  if (b.heat) {
    out.push('', escapeMarkdown(heatSummary(b.heat)) + '.');
    for (const a of heatAdvice(b.heat)) out.push(`- ⚠ ${escapeMarkdown(a)}`);
    out.push('', `_${escapeMarkdown(b.heat.method)}._`);
  } else out.push('', NO_HEAT);
  out.push('', `_${escapeMarkdown(SAFETY_NOTICE)}_`);
  return out;
}

/** The safety section of a batch as plain text. */
export function safetyText(b: BatchAnalysis): string[] {
  if (!hasSafety(b)) return [];
  const out = ['', 'Safety (an aid, not a safety assessment):'];
  if (b.hazards.length) out.push(...b.hazards.map((h) => `  ⚠ ${hazardIngredients(h)} → ${hazardKindText(h)} (${h.harm}): ${hazardText(h)}`));
  else out.push("  No dangerous pair of ingredients in Ionwright's tables.");
  if (b.heat) out.push(`  ${heatSummary(b.heat)}.`, ...heatAdvice(b.heat).map((a) => `  ⚠ ${a}`), `  ${b.heat.method}.`);
  else out.push(`  ${NO_HEAT}`);
  out.push(SAFETY_NOTICE);
  return out;
}

/** Escape text for Markdown prose (messages may quote what the user wrote): the one Markdown escaper. */
export const escapeMarkdown = (t: string) => t.replace(/([\\`*_[\]<>|])/g, '\\$1');

/** Inline code for Markdown that survives any backticks in the text. */
export function codeSpan(t: string): string {
  const runs = t.match(/`+/g) ?? [];
  const fence = '`'.repeat(Math.max(0, ...runs.map((r) => r.length)) + 1);
  const pad = t.startsWith('`') || t.endsWith('`') ? ' ' : '';
  return `${fence}${pad}${t}${pad}${fence}`;
}

/** Distinct readable formulas (by their ASCII form), in order. */
export function distinct(formulas: readonly FormulaAnalysis[]): FormulaAnalysis[] {
  const seen = new Set<string>();
  return formulas.filter((a) => a.ok && a.molarMass && !seen.has(a.ascii) && seen.add(a.ascii));
}

/** Markdown table of formulas (unique, in order of appearance, readable ones only). */
export function formulaTable(formulas: readonly FormulaAnalysis[], settings: ServiceSettings = DEFAULT_SETTINGS, title?: string): string {
  const list = distinct(formulas);
  if (list.length === 0) return '';
  const lines: string[] = [];
  if (title) lines.push(`**${escapeMarkdown(title)}** (computed by Ionwright)`, '');
  lines.push(markdownTable(formulaColumns(settings), list));
  const notes: string[] = [];
  if (list.some((a) => a.lattice?.estimate))
    notes.push('Lattice energies marked ≈ are model estimates (typically 5–10 % low; more for salts with covalent character).');
  if (list.some((a) => a.charges && !a.charges.balanced)) notes.push('Some formulas are not charge-balanced; see the warnings in the notes.');
  if (notes.length) lines.push('', ...notes.map((n) => `_${n}_`));
  return lines.join('\n');
}

/** The head of a batch's table: name, final volume, total. */
export function batchHead(b: BatchAnalysis): string {
  return [b.name ?? 'Batch', b.volumeL !== null ? `final volume ${volumeText(b.volumeL)}` : null, b.totalMassG !== null ? `total ${sig(b.totalMassG)} g` : null]
    .filter(Boolean)
    .join(', ');
}

/** The ionic-strength line of a batch, or undefined without a volume. */
export const ionicStrengthText = (b: BatchAnalysis) =>
  b.ionicStrengthM !== null
    ? `Ionic strength I = ½ Σ cᵢzᵢ² = ${sig(b.ionicStrengthM)} M${b.solution ? ' (nominal: full dissociation)' : ''}; net charge ${sig(b.netChargeEqPerL ?? 0, 2)} eq/L.`
    : undefined;

/** The species a table lists: those at 1 µM or more (at least the six most concentrated); the count of the rest. */
export function tabledSpecies(s: BatchSolution): { listed: BatchSolution['species']; rest: number } {
  const listed = s.species.filter((x, k) => k < 6 || x.concentrationM >= 1e-6);
  return { listed, rest: s.species.length - listed.length };
}

/** The summary line of a batch's equilibrium: pH, ionic strength, buffer capacity. */
export const solutionSummary = (b: BatchAnalysis, s: BatchSolution) =>
  `${pHLine(b, s)} · I = ${sig(s.ionicStrengthM, 3)} M at equilibrium · buffer capacity ${capacityText(s.bufferCapacity)}`;

/** Lines about the equilibrium under a batch's tables: what would come out, the solved lines, the limits. */
export function solutionNotes(b: BatchAnalysis, s: BatchSolution): string[] {
  const out: string[] = [];
  for (const x of s.saturation) {
    if (!(x.saturationIndex > 0)) break;
    const p = precipitateText(s, x);
    if (p) out.push(`${x.display} (${x.name}): ${p}.`);
  }
  for (const i of b.ingredients) {
    if (i.buffer && i.buffer.role === 'base') continue;
    const t = solvedText(i);
    if (t) out.push(`${i.buffer ? '' : `${i.formula}: `}${t}.`);
  }
  out.push(limitsLine(s));
  // The model's own notes that the line of limits does not already say (temperature, what is left out).
  for (const n of s.notes) if (!/^(Davies activity coefficients|pH and precipitation are estimates|I = )/.test(n)) out.push(n);
  return out;
}

/** Markdown tables of a batch: every line shows, counted in the table or listed as not counted with the reason. */
export function batchTable(b: BatchAnalysis, settings: ServiceSettings = DEFAULT_SETTINGS): string {
  const lines: string[] = [];
  lines.push(`**${escapeMarkdown(batchHead(b))}**${b.skipped.length ? ` — **incomplete: ${notCountedText(b)}**` : ''} (computed by Ionwright)`, '');
  const cols = batchColumns(b, settings);
  lines.push(markdownTable(cols, countedRows(b)));
  if (b.ingredients.length === 0) lines.push(markdownRow(['(none counted)', ...cols.slice(1).map(() => '')]));
  if (b.skipped.length) {
    lines.push(
      '',
      `**Not counted** (left out of every figure here; fix the line to count it):`,
      ...b.skipped.map((s) => `- ${codeSpan(s.text)} — ${escapeMarkdown(s.reason)}`),
    );
  }
  if (b.ions.length) lines.push('', markdownTable(ION_COLUMNS, b.ions));
  lines.push('');
  const strength = ionicStrengthText(b);
  if (strength) lines.push(strength);
  const sol = b.solution;
  if (sol && sol.converged) {
    const { listed, rest } = tabledSpecies(sol);
    lines.push('', `**Solution at equilibrium**: ${escapeMarkdown(solutionSummary(b, sol))}`, '', markdownTable(SPECIES_COLUMNS, listed));
    if (rest) lines.push('', `_${rest} more species below 1 µM._`);
    if (sol.saturation.length) lines.push('', markdownTable(SATURATION_COLUMNS, sol.saturation));
    lines.push('', ...solutionNotes(b, sol).map((n) => `_${escapeMarkdown(n)}_`), '');
  } else if (sol) lines.push('', `_The equilibrium did not converge: no pH is given._`, '');
  if (b.upkeep) {
    lines.push(
      '**Upkeep** (estimate)',
      '',
      ...b.upkeep.titres.map((t) => `- Titre: ${escapeMarkdown(titreLine(t))}`),
      ...additionLines(b.upkeep).map((a) => `- ${escapeMarkdown(a)}`),
    );
    if (b.upkeep.additions) lines.push('', `_${escapeMarkdown(ADDITIONS_NOTE)}_`);
    lines.push('');
  }
  const undissociated = undissociatedOf(b).map((i) => i.formula);
  if (undissociated.length) lines.push(`Not split into ions: ${undissociated.join(', ')}.`);
  for (const n of b.notes) lines.push(`_${n}_`);
  const warnings = batchWarnings(b);
  if (warnings.length) lines.push('', '**Warnings**', ...warnings.map((d) => `- ${escapeMarkdown(d.message)}`));
  lines.push(...safetyMarkdown(b));
  if (b.cautions.length) {
    lines.push('', '**Cautions**', ...b.cautions.map((c) => `- ${c.text}`), '', `_${CAUTION_FOOTNOTE}_`);
  }
  return lines.join('\n');
}

/**
 * A batch as plain text for a terminal: the same columns, aligned, every line in the order written (a line
 * not counted with its reason), then the ions, the ionic strength, warnings and cautions.
 */
export function batchText(b: BatchAnalysis, settings: ServiceSettings = DEFAULT_SETTINGS): string {
  const lines = [`${batchHead(b)}${b.skipped.length ? ` — INCOMPLETE: ${notCountedText(b)}` : ''}`, ''];
  const cols = batchColumns(b, settings);
  lines.push(textTable(cols, countedRows(b)));
  for (const s of b.skipped) lines.push(`  not counted: ${s.text} — ${s.reason}`);
  if (b.ions.length) lines.push('', textTable(ION_COLUMNS, b.ions));
  const strength = ionicStrengthText(b);
  if (strength) lines.push('', strength);
  const sol = b.solution;
  if (sol && sol.converged) {
    const { listed, rest } = tabledSpecies(sol);
    lines.push('', `Solution at equilibrium: ${solutionSummary(b, sol)}`, '', textTable(SPECIES_COLUMNS, listed));
    if (rest) lines.push(`  (${rest} more species below 1 µM)`);
    if (sol.saturation.length) lines.push('', textTable(SATURATION_COLUMNS, sol.saturation));
    lines.push('', ...solutionNotes(b, sol));
  } else if (sol) lines.push('', 'The equilibrium did not converge: no pH is given.');
  if (b.upkeep) {
    lines.push('', 'Upkeep (estimate):', ...b.upkeep.titres.map((t) => `  titre: ${titreLine(t)}`), ...additionLines(b.upkeep).map((a) => `  ${a}`));
    if (b.upkeep.additions) lines.push(`  ${ADDITIONS_NOTE}`);
  }
  for (const n of b.notes) lines.push(n);
  for (const d of batchWarnings(b)) lines.push(`warning: ${d.message}`);
  lines.push(...safetyText(b));
  if (b.cautions.length) lines.push('', 'Cautions:', ...b.cautions.map((c) => `  ${c.text}`), CAUTION_FOOTNOTE);
  return lines.join('\n');
}

/** The formula table as plain text. */
export function formulaTableText(formulas: readonly FormulaAnalysis[], settings: ServiceSettings = DEFAULT_SETTINGS): string {
  const list = distinct(formulas);
  return list.length ? textTable(formulaColumns(settings), list) : '';
}

/** Every line of a batch, in the order written (for renderers that show the lines not counted in place). */
export { batchRows };

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
  const ft = formulaTable(
    s.formulas.map((f) => f.analysis),
    settings,
    `Formulas — ${s.title}`,
  );
  if (ft) parts.push(ft);
  for (const b of s.batches) parts.push(batchTable(b.analysis, settings));
  return parts.join('\n\n');
}

/** All tables of a document, as `ionwright table` prints them. */
export function documentTables(doc: AnalysedDocument, settings: ServiceSettings = doc.settings): string {
  return sectionsOf(doc)
    .map((s) => sectionTables(s, settings))
    .filter(Boolean)
    .join('\n\n');
}
