/**
 * Bare formulas in prose: which words of a sentence are formulas. The rule is built to stay silent on
 * ordinary words ("I", "OK", "CO", "In", "As", "Ben", "Et al.") and to read what a chemist would
 * recognise as a formula at a glance (NaCl, CuSO4·5H2O, Fe3+, H2O).
 */
import type { FormulaItem } from '../chem/formula/ast';
import { parseFormula } from '../chem/formula/parse';
import type { FormulaRef, ProseMode } from './types';
import { BoundedCache, detach } from '../chem/cache';

/** Elements that are usually written as molecules in prose. */
const ELEMENT_MOLECULES = new Set(['H2', 'N2', 'O2', 'O3', 'F2', 'Cl2', 'Br2', 'I2', 'P4', 'S8', 'D2']);
/** Monatomic ions written with a single letter and a bare sign that are read in prose (C++ and B+ are not). */
const SINGLE_LETTER_IONS = new Set(['H+', 'K+', 'F-', 'I-', 'H-']);
/** Words and abbreviations that parse as formulas but are not (common practice, collected from notes). */
const STOPLIST = new Set(['NaN', 'HeLa', 'BSc', 'LiPo', 'Y2K', 'I2C', 'W3C', 'PoS', 'CoP', 'SiP', 'BaSiC', 'CaSe', 'NoSe', 'HoSe', 'CuTe', 'InK', 'SiNCe']);
const FORMULA_CHARS = /^[A-Za-z0-9()[\]{}·•∙⋅*.^+\-−₀-₉⁰-⁹⁺⁻½]+$/;
const ROMAN_GROUP = /\([IVX]+\)/;

const LEADING = new Set(['(', '[', '{', '"', "'", '“', '‘', '*', '_', '~', '<']);
const TRAILING = new Set(['.', ',', ';', ':', '!', '?', ')', ']', '}', '"', "'", '”', '’', '*', '_', '~', '>']);

function isSpace(c: string) {
  return c === ' ' || c === '\t' || c === '\n' || c === '\r' || c === '\u00a0' || c === '\f' || c === '\v';
}

const balance = (t: string, open: string, close: string) => {
  let b = 0;
  for (const ch of t) b += ch === open ? 1 : ch === close ? -1 : 0;
  return b;
};

/** Strip punctuation around a word, keeping brackets that belong to the formula. */
function trimToken(text: string, start: number, end: number): [number, number] {
  let s = start;
  let e = end;
  for (;;) {
    const t = text.slice(s, e);
    if (e - s === 0) return [s, e];
    const first = text[s];
    const last = text[e - 1];
    if (
      LEADING.has(first) &&
      !(first === '(' && balance(t, '(', ')') <= 0) &&
      !(first === '[' && balance(t, '[', ']') <= 0) &&
      !(first === '{' && balance(t, '{', '}') <= 0)
    ) {
      s++;
      continue;
    }
    if (
      TRAILING.has(last) &&
      !(last === ')' && balance(t, '(', ')') >= 0) &&
      !(last === ']' && balance(t, '[', ']') >= 0) &&
      !(last === '}' && balance(t, '{', '}') >= 0)
    ) {
      // A trailing '.' after a digit may be a hydrate dot only when something follows; at a word end it is punctuation.
      e--;
      continue;
    }
    return [s, e];
  }
}

function countSymbols(items: readonly FormulaItem[]): { tokens: number; elements: Set<string> } {
  let tokens = 0;
  const elements = new Set<string>();
  const stack: (readonly FormulaItem[])[] = [items];
  while (stack.length) {
    for (const it of stack.pop() as readonly FormulaItem[]) {
      if (it.kind === 'element') {
        tokens++;
        elements.add(it.symbol);
      } else if (it.kind === 'abbrev') {
        tokens++;
        for (const el of Object.keys(it.atoms)) elements.add(el);
      } else stack.push(it.items);
    }
  }
  return { tokens, elements };
}

const SIGN_FIRST_LABEL = /^[A-Z][a-z]?[+\-−][0-9]+$/;

/** Verdicts per word and mode (words are at most 80 characters; kept as flat copies, see chem/cache.ts). */
const verdicts: Record<ProseMode, BoundedCache<boolean>> = {
  off: new BoundedCache(1, 1024),
  conservative: new BoundedCache(100_000, 32 * 1024 * 1024),
  eager: new BoundedCache(100_000, 32 * 1024 * 1024),
};

/** Is this word (already trimmed) a formula a chemist would recognise? Memoised per word. */
export function isProseFormula(word: string, mode: ProseMode): boolean {
  if (mode === 'off' || word.length < 2 || word.length > 80) return false;
  const c0 = word.charCodeAt(0);
  if (!((c0 >= 65 && c0 <= 90) || c0 === 40 || c0 === 91)) return false;
  const memo = verdicts[mode];
  const hit = memo.get(word);
  if (hit !== undefined) return hit;
  const v = judge(word, mode);
  memo.set(detach(word), v);
  return v;
}

function judge(word: string, mode: ProseMode): boolean {
  if (!FORMULA_CHARS.test(word) || STOPLIST.has(word) || ROMAN_GROUP.test(word)) return false;
  // One symbol, then a sign, then digits ("S-2", "B-12", "C+3") is a sample or batch label in prose far more
  // often than an ion written sign-first; in code spans it is still read as an ion.
  if (SIGN_FIRST_LABEL.test(word)) return false;
  const hasLower = /[a-z]/.test(word);
  const hasDigit = /[0-9₀-₉]/.test(word);
  const hasCharge = /[\^⁺⁻]|[+\-−]$/.test(word);
  const hasAdduct = /[·•∙⋅*]/.test(word);
  if (mode === 'conservative' && !hasLower && !hasDigit && !hasCharge && !hasAdduct) return false;
  const parsed = parseFormula(word);
  if (!parsed.ok || !parsed.formula) return false;
  const f = parsed.formula;
  if (f.state) return true;
  const { tokens, elements } = countSymbols(f.parts.flatMap((p) => p.items));
  if (tokens >= 2 && elements.size >= 2) return true;
  if (ELEMENT_MOLECULES.has(word)) return true;
  if (f.charge !== 0) {
    if (f.chargeNotation === 'bare' && /^[A-Z][+\-−]$/.test(word)) return SINGLE_LETTER_IONS.has(word.replace('−', '-'));
    return tokens >= 1;
  }
  return false;
}

/** Find bare formulas in a stretch of prose. */
export function scanProse(text: string, start: number, end: number, mode: ProseMode, out: FormulaRef[] | { push(x: FormulaRef): void }) {
  if (mode === 'off') return;
  let i = start;
  while (i < end) {
    while (i < end && isSpace(text[i])) i++;
    const ws = i;
    let upper = false;
    while (i < end && !isSpace(text[i])) {
      const c = text.charCodeAt(i);
      if (c >= 65 && c <= 90) upper = true;
      i++;
    }
    if (i === ws) break;
    // Every formula has a capital letter: most words are skipped here.
    if (!upper) continue;
    // Split on '/', '–' and on a hyphen that joins a word ("NaOH-treated"), not on a charge ("Cl-").
    let a = ws;
    for (let k = ws; k <= i; k++) {
      const ch = text[k];
      const split = k === i || ch === '/' || ch === '–' || ch === '—' || (ch === '-' && k + 1 < i && /[A-Za-z]/.test(text[k + 1]) && k > a);
      if (!split) continue;
      const [s, e] = trimToken(text, a, k);
      if (e - s >= 2) {
        const word = text.slice(s, e);
        if (isProseFormula(word, mode)) out.push({ kind: 'formula', text: word, start: s, end: e, source: 'prose' });
      }
      a = k + 1;
    }
  }
}

/** Forget the memoised verdicts (for benchmarks that measure a cold start). */
export function clearProseCache() {
  for (const m of Object.values(verdicts)) m.clear();
}
