/**
 * Completion inside batch blocks (LSP `textDocument/completion`):
 *
 * - at the start of a line: the header keys not yet given (`name:`, `volume:`, `total:`, and `pH:`,
 *   `temperature:` once the batch reader takes them), and the substances: those the workspace's notes use first (ranked by how often they
 *   are written), then those of the tool's tables; each as its formula and, where it has one, as its name
 *   (typing `sodium ch` finds NaCl). The molar mass is the item's detail; what is inserted is the formula,
 *   which every batch line reads;
 * - after an amount: the units the line accepts (an ingredient's, `volume:`'s or `total:`'s, from the one
 *   table of units, chem/batch/units.ts);
 * - after `to `: `pH`.
 *
 * Every item carries a text edit that replaces what was typed of it. Outside batch blocks there is
 * nothing to complete.
 */
import type { FormulaAnalysis } from '../chem/analyse';
import { analyseFormula } from '../chem/analyse';
import { analyseBatch } from '../chem/batch';
import { BATCH_UNITS, type BatchUnit, type UnitKind, type UnitPlace } from '../chem/batch/units';
import { SOLUBILITY } from '../chem/data/solubility';
import { nameOf, namesByPrefix } from '../chem/names';
import { REAGENT_UNITS, type ReagentUnitKind } from '../chem/reagents';
import type { AnalysedDocument } from './document';
import { molarMassText } from './format';
import type { Range } from './positions';
import type { ServiceSettings } from './settings';
import { isWeighable, type Vocabulary } from './vocabulary';

/** LSP CompletionItemKind values used here. */
export const CompletionKind = { Text: 1, Property: 10, Unit: 11, Value: 12, Keyword: 14 } as const;

export interface CompletionItem {
  label: string;
  kind: number;
  detail?: string;
  labelDetails?: { detail?: string; description?: string };
  documentation?: string;
  sortText: string;
  filterText: string;
  textEdit: { range: Range; newText: string };
}

export interface CompletionList {
  /** More items match than were sent: the client asks again as the prefix grows. */
  isIncomplete: boolean;
  items: CompletionItem[];
}

/** Most items in one answer. */
export const MAX_ITEMS = 100;

/**
 * The header keys of a batch, in the order offered. A key is offered only where the batch reader reads it
 * as a header (`headerKeys`): `pH:` and `temperature:` come with the solution stage of the batch
 * pipeline, and are offered from the moment the reader takes them, never before (a key the reader does
 * not know would make the line an ingredient in error).
 */
export const BATCH_HEADER_KEYS: ReadonlyArray<{ key: string; detail: string }> = [
  { key: 'name', detail: 'the batch’s name (workspace symbols, tables)' },
  { key: 'volume', detail: 'final volume (L, mL): concentrations, ionic strength' },
  { key: 'total', detail: 'total mass of the batch, for wt% targets' },
  { key: 'pH', detail: 'the pH the batch is made up to' },
  { key: 'temperature', detail: 'temperature the batch is made up at' },
];

/** Whether the batch reader takes `<key>:` as a header: a line of it is never an ingredient, whatever its value. */
function readsAsHeader(key: string): boolean {
  const a = analyseBatch([{ text: `${key}: ?`, start: 0 }]);
  return a.ingredients.length === 0 && a.skipped.every((s) => s.kind === 'header');
}
let readable: ReadonlyArray<{ key: string; detail: string }> | undefined;
/** The header keys the batch reader reads (asked once). */
export const headerKeys = () => (readable ??= BATCH_HEADER_KEYS.filter((h) => readsAsHeader(h.key)));

const UNIT_DETAIL: Record<UnitKind, string> = {
  mass: 'mass weighed',
  amount: 'amount of substance (the mass to weigh is computed)',
  concentration: 'target concentration in the final volume (the mass to weigh is computed)',
  fraction: 'mass fraction of the total (needs total:)',
  volume: 'final volume',
};

/**
 * The substances of the tool's own tables offered after the workspace's: the salts, acids, bases and
 * buffer substances of the solubility table (chem/data/solubility.ts). The reagent shelf (densities,
 * assays, shelf names) adds its entries here when it lands.
 */
function toolSubstances(): readonly FormulaAnalysis[] {
  return (toolList ??= SOLUBILITY.map((r) => analyseFormula(r.formula)).filter(isWeighable));
}
let toolList: FormulaAnalysis[] | undefined;

interface Candidate {
  analysis: FormulaAnalysis;
  text: string;
  /** How often the workspace writes it (0: from the tool's tables). */
  uses: number;
}

const NUMBER = /^(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const GLUED = /^((?:\d+(?:\.\d*)?|\.\d+))([A-Za-zµ%/]*)$/;

/** What to complete at an offset of a batch line, from the text of the line before it. */
type Slot =
  | { kind: 'start'; word: string; from: number }
  | { kind: 'name'; words: string; from: number }
  | { kind: 'unit'; place: UnitPlace; typed: string; from: number }
  | { kind: 'to'; typed: string; from: number }
  | { kind: 'stock'; typed: string; from: number };

function slotOf(before: string, base: number): Slot | undefined {
  if (before.includes('#')) return undefined; // a comment
  const lead = before.length - before.trimStart().length;
  const text = before.slice(lead);
  const from = base + lead;
  if (/^\S*$/.test(text)) return { kind: 'start', word: text, from };
  const header = /^(volume|total)\s*:\s*(\S*)(\s*)(\S*)$/i.exec(text);
  if (header) {
    const place = header[1].toLowerCase() as UnitPlace;
    const [, , amount, gap, unit] = header;
    if (gap && NUMBER.test(amount)) return { kind: 'unit', place, typed: unit, from: base + before.length - unit.length };
    const glued = !gap ? GLUED.exec(amount) : null;
    if (glued) return { kind: 'unit', place, typed: glued[2], from: base + before.length - glued[2].length };
    return undefined;
  }
  // `from batch "Acid st|`: the names of the other batches of the note.
  const stock = /\sfrom\s+batch\s+"([^"]*)$/.exec(text);
  if (stock) return { kind: 'stock', typed: stock[1], from: base + before.length - stock[1].length - 1 };
  if (/^[A-Za-z][A-Za-z(),' -]*$/.test(text) && !/^\S+\s+to(\s|$)/.test(text)) return { kind: 'name', words: text, from };
  const parts = text.split(/\s+/);
  const last = parts[parts.length - 1];
  const lastFrom = base + before.length - last.length;
  if (parts.length === 2) {
    const glued = GLUED.exec(last);
    if (glued && glued[2] !== '') return { kind: 'unit', place: 'ingredient', typed: glued[2], from: base + before.length - glued[2].length };
    return undefined;
  }
  if (parts.length === 3 && parts[1] === 'to') return { kind: 'to', typed: last, from: lastFrom };
  if (parts.length === 3 && NUMBER.test(parts[1])) return { kind: 'unit', place: 'ingredient', typed: last, from: lastFrom };
  return undefined;
}

/** A prefix test, case-insensitive, at the start of the text or of one of its words. */
function matches(filter: string, typed: string): boolean {
  if (typed === '') return true;
  const f = filter.toLowerCase();
  const t = typed.toLowerCase();
  if (f.startsWith(t)) return true;
  for (let i = f.indexOf(' '); i >= 0; i = f.indexOf(' ', i + 1)) if (f.startsWith(t, i + 1)) return true;
  return false;
}

/** The substances in the order offered: the workspace's by use, then the tool's (memoised per vocabulary). */
const ordered = new WeakMap<Vocabulary, Candidate[]>();
let toolOnly: Candidate[] | undefined;
function candidates(vocabulary: Vocabulary | undefined): Candidate[] {
  if (!vocabulary) return (toolOnly ??= orderCandidates(undefined));
  let c = ordered.get(vocabulary);
  if (!c) ordered.set(vocabulary, (c = orderCandidates(vocabulary)));
  return c;
}

/** A substance's name and molar mass as shown, computed once per analysis and number of decimals. */
const shown = new WeakMap<FormulaAnalysis, { decimals: number; name: string | undefined; mass: string }>();
function shownOf(a: FormulaAnalysis, settings: ServiceSettings) {
  let s = shown.get(a);
  if (!s || s.decimals !== settings.decimals)
    shown.set(a, (s = { decimals: settings.decimals, name: nameOf(a), mass: `${molarMassText(a.molarMass?.value, settings)} g/mol` }));
  return s;
}

function orderCandidates(vocabulary: Vocabulary | undefined): Candidate[] {
  const out: Candidate[] = [];
  const seen = new Set<string>();
  if (vocabulary) {
    const used = [...vocabulary.values()].sort((a, b) => b.count - a.count || (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
    for (const e of used) {
      seen.add(e.key);
      out.push({ analysis: e.analysis, text: e.text, uses: e.count });
    }
  }
  for (const a of toolSubstances()) {
    if (seen.has(a.display)) continue;
    seen.add(a.display);
    out.push({ analysis: a, text: a.input, uses: 0 });
  }
  return out;
}

const usesText = (n: number) => (n === 0 ? 'from Ionwright’s tables' : `written ${n} time${n === 1 ? '' : 's'} in the workspace’s notes`);

/**
 * Completion at `offset`. `vocabulary` is what the workspace's notes use (this note's included); without
 * it only the tool's tables are offered.
 */
export function completion(doc: AnalysedDocument, offset: number, settings: ServiceSettings, vocabulary?: Vocabulary): CompletionList | null {
  const block = doc.blockAt(offset);
  if (!block) return null;
  const o = offset - block.start;
  const batch = block.rel.batches.find((b) => b.ref.start <= o && o <= b.ref.end);
  if (!batch) return null;
  const line = batch.ref.lines.find((l) => l.start <= o && o <= l.end);
  if (!line) return null;
  const slot = slotOf(line.text.slice(0, o - line.start), block.start + line.start);
  if (!slot) return null;
  const range = doc.lines.range(slot.from, offset);
  const items: CompletionItem[] = [];
  let more = false;
  const push = (item: Omit<CompletionItem, 'textEdit' | 'sortText'> & { newText: string }) => {
    if (items.length >= MAX_ITEMS) {
      more = true;
      return;
    }
    const { newText, ...rest } = item;
    items.push({ ...rest, sortText: String(items.length).padStart(4, '0'), textEdit: { range, newText } });
  };

  if (slot.kind === 'unit') {
    const units = (BATCH_UNITS as readonly BatchUnit[]).filter((u) => u.places.includes(slot.place));
    // The units messages name first, then the other spellings accepted there.
    units.sort((a, b) => Number(b.listed.includes(slot.place)) - Number(a.listed.includes(slot.place)));
    for (const u of units) {
      const filterText = [u.unit, ...u.aliases].join(' ');
      if (!matches(filterText, slot.typed)) continue;
      push({ label: u.unit, kind: CompletionKind.Unit, detail: UNIT_DETAIL[u.kind], filterText, newText: u.unit });
    }
    // The bench's units on an ingredient line (chem/reagents): per volume, normality, a liquid's volume.
    if (slot.place === 'ingredient')
      for (const u of REAGENT_UNITS) {
        const filterText = [u.unit, ...u.aliases].join(' ');
        if (!matches(filterText, slot.typed)) continue;
        push({ label: u.unit, kind: CompletionKind.Unit, detail: REAGENT_UNIT_DETAIL[u.kind], filterText, newText: u.unit });
      }
    return { isIncomplete: false, items };
  }
  if (slot.kind === 'stock') {
    for (const other of doc.batches) {
      const name = other.analysis.name;
      if (name === batch.analysis.name || !name || name.includes('"') || !matches(name, slot.typed)) continue;
      const n = other.analysis.ingredients.length;
      push({
        label: name,
        kind: CompletionKind.Value,
        detail: `a batch of this note: ${n} ingredient${n === 1 ? '' : 's'}`,
        filterText: name,
        newText: `"${name}"`,
      });
    }
    return { isIncomplete: false, items };
  }
  if (slot.kind === 'to') {
    if (matches('pH', slot.typed))
      push({ label: 'pH', kind: CompletionKind.Keyword, detail: 'the amount that brings the batch to this pH is solved', filterText: 'pH', newText: 'pH ' });
    return { isIncomplete: false, items };
  }

  if (slot.kind === 'start' && /^[A-Za-z]*$/.test(slot.word)) {
    const given = new Set(
      batch.ref.lines
        .filter((l) => l !== line)
        .map((l) => /^\s*([A-Za-z]+)\s*:/.exec(l.text)?.[1]?.toLowerCase())
        .filter((k): k is string => !!k),
    );
    if (batch.ref.openName) given.add('name');
    for (const h of headerKeys()) {
      if (given.has(h.key.toLowerCase()) || !matches(h.key, slot.word)) continue;
      push({ label: `${h.key}:`, kind: CompletionKind.Property, detail: h.detail, filterText: h.key, newText: `${h.key}: ` });
    }
  }
  const typed = slot.kind === 'start' ? slot.word : slot.words;
  for (const c of candidates(vocabulary)) {
    const a = c.analysis;
    const { mass, name } = shownOf(a, settings);
    if (slot.kind === 'start' && matches(c.text, typed))
      push({
        label: c.text,
        kind: CompletionKind.Value,
        detail: mass,
        labelDetails: { detail: ` ${mass}`, ...(name ? { description: name } : {}) },
        documentation: `${a.display}${name ? ` — ${name}` : ''}: ${mass} (Hill ${a.hill}); ${usesText(c.uses)}.`,
        filterText: c.text,
        newText: `${c.text} `,
      });
    if (name && matches(name, typed))
      push({
        label: name,
        kind: CompletionKind.Text,
        detail: `${a.display} · ${mass}`,
        labelDetails: { description: `${a.display} · ${mass}` },
        documentation: `Inserts the formula ${c.text} (${mass}); ${usesText(c.uses)}.`,
        filterText: name,
        newText: `${c.text} `,
      });
  }
  // The trade's and the systematic names the batch reader reads (borax, caustic soda), inserted as written:
  // the line reads the name, and the hover says what it was read as.
  if (typed.length >= 3 && /^[A-Za-z]/.test(typed))
    for (const e of namesByPrefix(typed, 20)) {
      if (!matches(e.name, typed) || items.some((x) => x.label === e.name)) continue;
      const a = analyseFormula(e.formula);
      const { mass } = shownOf(a, settings);
      push({
        label: e.name,
        kind: CompletionKind.Text,
        detail: `${a.display} · ${mass}`,
        labelDetails: { description: `${a.display} · ${mass}` },
        documentation: `The ${e.kind === 'shelf' ? 'shelf' : e.kind} name ${e.name}, read as ${a.display} (${mass}).`,
        filterText: e.name,
        newText: `${e.name} `,
      });
    }
  return { isIncomplete: more, items };
}

const REAGENT_UNIT_DETAIL: Record<ReagentUnitKind, string> = {
  massPerVolume: 'mass per final volume (the mass to weigh is computed)',
  weightPerVolumePercent: 'grams per 100 mL of final volume',
  volumePercent: 'millilitres of the liquid per 100 mL of final volume',
  ppm: 'parts per million: mg/L by final volume, mg/kg by total mass',
  molality: 'moles per kilogram of solvent',
  normality: 'equivalents per litre (the role is said in the hover)',
  volume: 'a liquid poured as supplied (its density and assay give the amount)',
};
