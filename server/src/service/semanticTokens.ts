/**
 * Semantic tokens (LSP `textDocument/semanticTokens/full` and `/range`): the pieces of every formula and
 * equation Ionwright reads — in prose, inline code, formula lines, reaction blocks and batch blocks — so
 * that the editor's theme colours them. Only the standard token types of the protocol are used (the
 * legend), each for what it means there; the colours are the theme's:
 *
 *   type        a formula's body (`CuSO4`, `H2O`, `[Co(NH3)6]Cl3`), the electron `e-`
 *   number      a coefficient (`2` in `2 H2O`), a hydrate's multiplier (`5` in `·5H2O`), a batch amount
 *   modifier    a charge (`^2-`, `²⁻`, `3+` in `Fe3+`)
 *   enumMember  a state symbol (`(aq)`, `(s)`)
 *   operator    a reaction arrow, a `+` between species, a hydrate dot
 *   property    a batch header key (`volume`), a titre line's keyword
 *   comment     a `#` comment in a batch
 *
 * What is a formula is decided by the analysis (the same as for hovers and diagnostics): a word of prose
 * gets tokens only where Ionwright reads it as a formula. Tokens are computed per block at offsets
 * relative to the block and memoised by the block's result, so an edit recomputes the tokens of the
 * blocks it touched only.
 */
import type { Formula } from '../chem/formula/ast';
import type { Species } from '../chem/equation/parse';
import type { TitreTokenKind } from '../chem/upkeep';
import type { AnalysedDocument, BlockResult } from './document';

export const TOKEN_TYPES = ['type', 'number', 'modifier', 'enumMember', 'operator', 'property', 'comment'] as const;
export type TokenType = (typeof TOKEN_TYPES)[number];
export const TOKEN_MODIFIERS: readonly string[] = [];
export const SEMANTIC_TOKENS_LEGEND = { tokenTypes: [...TOKEN_TYPES], tokenModifiers: [...TOKEN_MODIFIERS] };

const T = { type: 0, number: 1, modifier: 2, enumMember: 3, operator: 4, property: 5, comment: 6 } as const;

/** The token type of each piece of a titre line (the others get none). */
const TITRE_TYPE: Partial<Record<TitreTokenKind, number>> = {
  keyword: T.property,
  analyte: T.type,
  titrant: T.type,
  species: T.type,
  number: T.number,
  ratio: T.number,
};

/** Tokens as flat triples (start, length, type), offsets relative to some base. */
type Triples = number[];

function pushToken(out: Triples, start: number, end: number, type: number) {
  if (end > start) out.push(start, end - start, type);
}

/** The tokens of a parsed formula whose text starts at `base`. */
function formulaTokens(f: Formula, base: number, out: Triples) {
  const text = f.text;
  for (let k = 0; k < f.parts.length; k++) {
    const p = f.parts[k];
    if (k > 0) {
      // The hydrate or adduct dot between two parts (spaces around it are not coloured).
      const prev = f.parts[k - 1].end;
      let a = prev;
      let b = p.start;
      while (a < b && /\s/.test(text[a])) a++;
      while (b > a && /\s/.test(text[b - 1])) b--;
      pushToken(out, base + a, base + b, T.operator);
    }
    let from = p.start;
    if (p.multiplierText) {
      const m = text.indexOf(p.multiplierText, p.start);
      if (m >= 0) {
        pushToken(out, base + m, base + m + p.multiplierText.length, T.number);
        from = m + p.multiplierText.length;
      }
    }
    if (p.items.length) pushToken(out, base + Math.max(from, p.items[0].start), base + p.items[p.items.length - 1].end, T.type);
  }
  if (f.chargeSpan) pushToken(out, base + f.chargeSpan.start, base + f.chargeSpan.end, T.modifier);
  if (f.stateSpan) pushToken(out, base + f.stateSpan.start, base + f.stateSpan.end, T.enumMember);
}

function speciesTokens(s: Species, base: number, out: Triples) {
  if (s.coefficientStart !== undefined && s.coefficientEnd !== undefined) pushToken(out, base + s.coefficientStart, base + s.coefficientEnd, T.number);
  if (s.isElectron) pushToken(out, base + s.formulaStart, base + s.formulaEnd, T.type);
  else if (s.formula) formulaTokens(s.formula, base + s.formulaStart, out);
}

const HEADER_KEY = /^(\s*)([A-Za-z]+)(\s*):/;

/** The tokens of one block, relative to its start, sorted and without overlaps. */
function blockTokens(rel: BlockResult): Int32Array {
  const out: Triples = [];
  for (const f of rel.formulas) if (f.analysis.formula) formulaTokens(f.analysis.formula, f.ref.start, out);
  for (const r of rel.reactions) {
    const p = r.analysis.parsed;
    const base = r.ref.start;
    const sides = [p.reactants, p.products];
    for (const side of sides)
      for (let k = 0; k < side.length; k++) {
        if (k > 0) for (let i = side[k - 1].end; i < side[k].start; i++) if (p.text[i] === '+') pushToken(out, base + i, base + i + 1, T.operator);
        speciesTokens(side[k], base, out);
      }
    if (p.arrow) pushToken(out, base + p.arrow.start, base + p.arrow.end, T.operator);
  }
  for (const b of rel.batches) {
    for (const line of b.ref.lines) {
      const hash = line.text.indexOf('#');
      if (hash >= 0) pushToken(out, line.start + hash, line.start + line.text.trimEnd().length, T.comment);
      const h = HEADER_KEY.exec(hash >= 0 ? line.text.slice(0, hash) : line.text);
      if (h) pushToken(out, line.start + h[1].length, line.start + h[1].length + h[2].length, T.property);
    }
    for (const i of b.analysis.ingredients) {
      // A line that names its substance (`sodium chloride 5 g`) has an analysis of the formula, not of the
      // text written: the name is one token.
      if (i.analysis.formula && i.analysis.input === i.formulaText) formulaTokens(i.analysis.formula, i.formulaStart, out);
      else pushToken(out, i.formulaStart, i.formulaEnd, T.type);
      pushToken(out, i.amount.start, i.amount.start + i.amount.text.split(' ')[0].length, T.number);
    }
    for (const s of b.analysis.skipped)
      if (s.analysis?.formula && s.formulaStart !== undefined && s.formulaText === s.analysis.input) formulaTokens(s.analysis.formula, s.formulaStart, out);
    // Titre lines (bath upkeep): the keyword as a key, the substances as formulas, the figures as numbers.
    for (const t of b.analysis.upkeep?.titres ?? [])
      for (const tk of 'reading' in t ? t.reading.tokens : t.tokens) {
        const type = TITRE_TYPE[tk.kind];
        if (type !== undefined) pushToken(out, tk.start, tk.end, type);
      }
  }
  // Sorted by start; a token that overlaps the one before it is dropped (the protocol allows no overlaps).
  const n = out.length / 3;
  const order = Array.from({ length: n }, (_, k) => k).sort((a, b) => out[a * 3] - out[b * 3] || out[a * 3 + 1] - out[b * 3 + 1]);
  const res: number[] = [];
  let end = -1;
  for (const k of order) {
    const s = out[k * 3];
    if (s < end) continue;
    res.push(s, out[k * 3 + 1], out[k * 3 + 2]);
    end = s + out[k * 3 + 1];
  }
  return Int32Array.from(res);
}

/** Where line `line`'s content ends (before its line break). */
function contentEnd(text: string, starts: Uint32Array, line: number): number {
  if (line + 1 >= starts.length) return text.length;
  const next = starts[line + 1];
  return text.charCodeAt(next - 1) === 10 && text.charCodeAt(next - 2) === 13 ? next - 2 : next - 1;
}

const memo = new WeakMap<BlockResult, Int32Array>();
const tokensOf = (rel: BlockResult) => {
  let t = memo.get(rel);
  if (!t) memo.set(rel, (t = blockTokens(rel)));
  return t;
};

/** A decoded token, for tests and tools: line, character, length, type. */
export interface SemanticToken {
  line: number;
  character: number;
  length: number;
  type: TokenType;
}

/**
 * The tokens of the note, or of the blocks overlapping [start, end), in the protocol's relative encoding
 * (five numbers per token: Δline, Δcharacter, length, type, modifiers). A token that would run across a
 * line break is left out (clients need not support those).
 */
export function semanticTokens(doc: AnalysedDocument, range?: { start: number; end: number }): { data: number[] } {
  const data: number[] = [];
  const starts = doc.lines.starts;
  const text = doc.text;
  let line = 0;
  let prevLine = 0;
  let prevChar = 0;
  for (const b of doc.blocks) {
    if (range && (b.end < range.start || b.start > range.end)) continue;
    const t = tokensOf(b.rel);
    for (let k = 0; k < t.length; k += 3) {
      const s = b.start + t[k];
      const len = t[k + 1];
      if (range && (s + len <= range.start || s >= range.end)) continue;
      while (line + 1 < starts.length && starts[line + 1] <= s) line++;
      if (s + len > contentEnd(text, starts, line)) continue;
      const ch = s - starts[line];
      data.push(line - prevLine, line === prevLine ? ch - prevChar : ch, len, t[k + 2], 0);
      prevLine = line;
      prevChar = ch;
    }
  }
  return { data };
}

/** The relative encoding decoded (tests, the browser comparison). */
export function decodeTokens(data: readonly number[]): SemanticToken[] {
  const out: SemanticToken[] = [];
  let line = 0;
  let ch = 0;
  for (let k = 0; k + 4 < data.length; k += 5) {
    line += data[k];
    ch = data[k] === 0 ? ch + data[k + 1] : data[k + 1];
    out.push({ line, character: ch, length: data[k + 2], type: TOKEN_TYPES[data[k + 3]] });
  }
  return out;
}
