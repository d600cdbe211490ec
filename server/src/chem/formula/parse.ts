/**
 * The formula parser: text → AST + diagnostics. It never throws and never recurses (brackets are
 * tracked on an explicit stack), and one bad token gives one diagnostic.
 *
 * Notation read (documented for users in README.md, "Formula notation"):
 * - element symbols (all 118; a capital and its lower-case letters form one symbol token),
 * - integer and decimal counts (`Fe0.95O`) and Unicode subscripts (`H₂O`),
 * - brackets `()`, `[]`, `{}` nested, each with a count,
 * - adducts and hydrates joined by `·`, `•`, `∙`, `⋅`, `*` or `.`, each part with an optional leading
 *   multiplier (`CaSO4·0.5H2O`, `·½H2O`, `·1/2H2O`).
 *   A `.` between two digits is a decimal point unless the number after it is followed by a common adduct
 *   molecule (water, ammonia, …): `CuSO4.5H2O` is the pentahydrate, `Fe0.95O` is non-stoichiometric.
 *   A `.` after a lone `0` is always a decimal point.
 * - charges: `^2-`, `^-2`, `^{2-}`, `^+`, superscripts `²⁻`, and bare trailing signs `Cl-`, `Ca++`, `Ca+2`.
 *   A bare `<digits><sign>` at the end is ambiguous (`Fe3+` vs `NH4+`): on a single element the last digit
 *   is the charge (`Fe3+` is Fe³⁺); otherwise the sign alone is the charge and the parser also offers the
 *   other reading (`SO42-` as SO₄²⁻), which the chemistry layer keeps when it names a known ion.
 * - spaces around an adduct dot other than `.` (`CuSO4 · 5H2O`, `CuSO4 · 5 H2O`), read as without,
 * - a count written `x` (`(NH4)2Sx`): read, but nothing is computed from it (its count is NaN),
 * - state symbols `(s)`, `(l)`, `(g)`, `(aq)`, `(cr)` at the very end,
 * - organic shorthand `Me Et Bu Ph Bn OAc` and ligand abbreviations `en py bpy phen acac ox edta`
 *   (ligands only inside brackets, so that words such as "Ben" are not read as B + en),
 * - Stock notation right after an element, `Fe(III)`, read as an oxidation state, not as iodine.
 */
import type { ChemDiagnostic, DiagnosticCode } from '../diagnostic';
import { isElementSymbol, isMetal } from '../data/elements';
import type { AbbrevNode, ElementNode, Formula, FormulaItem, FormulaPart, GroupNode, StateSymbol } from './ast';

export const MAX_COUNT = 1_000_000;
export const MAX_DEPTH = 32;
export const MAX_FORMULA_LENGTH = 4096;
export const MAX_CHARGE = 20;

export interface ParseResult {
  /** The formula read, or null when nothing usable could be read. */
  formula: Formula | null;
  diagnostics: ChemDiagnostic[];
  /** True when there is no error-severity diagnostic. */
  ok: boolean;
}

export const SUBSCRIPT_DIGITS = '₀₁₂₃₄₅₆₇₈₉';
export const SUPERSCRIPT_DIGITS = '⁰¹²³⁴⁵⁶⁷⁸⁹';
const SUP_PLUS = '⁺';
const SUP_MINUS = '⁻';
const FRACTIONS: Record<string, number> = { '½': 1 / 2, '⅓': 1 / 3, '⅔': 2 / 3, '¼': 1 / 4, '¾': 3 / 4 };
const SEPARATORS = new Set(['·', '•', '∙', '⋅', '*', '.']);
const OPENERS: Record<string, ')' | ']' | '}'> = { '(': ')', '[': ']', '{': '}' };
const STATES = new Set(['s', 'l', 'g', 'aq', 'cr']);
const ROMAN: Record<string, number> = { '0': 0, I: 1, II: 2, III: 3, IV: 4, V: 5, VI: 6, VII: 7, VIII: 8 };

/** Organic shorthand written with a capital (none is an element symbol). Sources: IUPAC Recommendations for abbreviations; common practice. */
export const SHORTHAND: Record<string, { atoms: Record<string, number>; charge: number; name: string }> = {
  Me: { atoms: { C: 1, H: 3 }, charge: 0, name: 'methyl' },
  Et: { atoms: { C: 2, H: 5 }, charge: 0, name: 'ethyl' },
  Bu: { atoms: { C: 4, H: 9 }, charge: 0, name: 'butyl' },
  Ph: { atoms: { C: 6, H: 5 }, charge: 0, name: 'phenyl' },
  Bn: { atoms: { C: 7, H: 7 }, charge: 0, name: 'benzyl' },
  OAc: { atoms: { C: 2, H: 3, O: 2 }, charge: -1, name: 'acetate' },
};

/** Ligand abbreviations written in lower case (IUPAC Red Book 2005, Table VII; common practice). */
export const LIGANDS: Record<string, { atoms: Record<string, number>; charge: number; name: string }> = {
  en: { atoms: { C: 2, H: 8, N: 2 }, charge: 0, name: 'ethane-1,2-diamine' },
  py: { atoms: { C: 5, H: 5, N: 1 }, charge: 0, name: 'pyridine' },
  bpy: { atoms: { C: 10, H: 8, N: 2 }, charge: 0, name: '2,2′-bipyridine' },
  phen: { atoms: { C: 12, H: 8, N: 2 }, charge: 0, name: '1,10-phenanthroline' },
  acac: { atoms: { C: 5, H: 7, O: 2 }, charge: -1, name: 'acetylacetonate' },
  ox: { atoms: { C: 2, O: 4 }, charge: -2, name: 'oxalate' },
  edta: { atoms: { C: 10, H: 12, N: 2, O: 8 }, charge: -4, name: 'ethylenediaminetetraacetate' },
};

/** Molecules that follow a hydrate/adduct dot; used only to read `CuSO4.5H2O` as an adduct. Longest first. */
const ADDUCT_MOLECULES = [
  'CO(NH2)2',
  'C2H5OH',
  'CH3OH',
  'CH3CN',
  'CH2Cl2',
  'CHCl3',
  'H2O2',
  'N2H4',
  'H2O',
  'D2O',
  'NH3',
  'HCl',
  'HF',
  'HBr',
  'SO2',
  'CO2',
  'EtOH',
  'MeOH',
];

const isDigit = (c: string | undefined) => c !== undefined && c >= '0' && c <= '9';
const isUpper = (c: string | undefined) => c !== undefined && c >= 'A' && c <= 'Z';
const isLower = (c: string | undefined) => c !== undefined && c >= 'a' && c <= 'z';
const isSubDigit = (c: string | undefined) => c !== undefined && SUBSCRIPT_DIGITS.includes(c);
const isSupDigit = (c: string | undefined) => c !== undefined && SUPERSCRIPT_DIGITS.includes(c);
const isSign = (c: string | undefined) => c === '+' || c === '-' || c === '−';
const isSpace = (c: string | undefined) => c === ' ' || c === '\t' || c === '\u00a0';
/** Adduct separators that may stand between spaces (`CuSO4 · 5H2O`); a spaced `.` is left to prose. */
const SPACED_SEPARATORS = new Set(['·', '•', '∙', '⋅', '*']);
const isSupSign = (c: string | undefined) => c === SUP_PLUS || c === SUP_MINUS;
const signOf = (c: string) => (c === '+' || c === SUP_PLUS ? 1 : -1);

export interface ParseOptions {
  /** How to read a bare trailing `<digits><sign>`; by default decided as described above. */
  bareDigit?: 'charge' | 'count';
}

/** Parse one formula. Offsets in the result are relative to `text`. */
export function parseFormula(text: string, options: ParseOptions = {}): ParseResult {
  return new FormulaParser(text, options).run();
}

interface OpenGroup {
  group: GroupNode;
  /** The item list the group was pushed onto. */
  parent: FormulaItem[];
}

class FormulaParser {
  private i = 0;
  private readonly diags: ChemDiagnostic[] = [];
  private readonly n: number;
  /** The item whose ASCII count ended right here, for the bare-charge ambiguity. */
  private lastCount: { item: FormulaItem; text: string; end: number } | undefined;
  private readonly variables: Array<{ start: number; end: number }> = [];

  constructor(
    private readonly s: string,
    private readonly options: ParseOptions,
  ) {
    this.n = s.length;
  }

  private error(start: number, end: number, message: string, code: DiagnosticCode = 'malformed-formula', data?: Record<string, unknown>) {
    this.diags.push({ code, severity: 'error', message, start, end, ...(data ? { data } : {}) });
  }

  run(): ParseResult {
    const s = this.s;
    if (this.n === 0) {
      this.error(0, 0, 'Empty formula.');
      return this.result(null);
    }
    if (this.n > MAX_FORMULA_LENGTH) {
      this.error(0, this.n, `Formula is ${this.n} characters long; the limit is ${MAX_FORMULA_LENGTH}.`);
      return this.result(null);
    }
    const formula: Formula = { text: s, parts: [], charge: 0, chargeNotation: 'none' };
    let part = this.startPart();
    formula.parts.push(part);
    let items = part.items;
    const stack: OpenGroup[] = [];

    while (this.i < this.n) {
      const c = s[this.i];
      if (isUpper(c)) {
        this.readSymbol(items);
      } else if (c in OPENERS) {
        if (stack.length === 0 && this.stateAt(this.i) !== undefined) {
          this.readState(formula);
          break;
        }
        const stock = this.stockAt(this.i, items);
        if (stock) {
          stock.node.stock = stock.value;
          stock.node.end = this.i = stock.end;
          continue;
        }
        if (stack.length >= MAX_DEPTH) {
          this.error(this.i, this.n, `Brackets are nested deeper than ${MAX_DEPTH} levels.`);
          this.i = this.n;
          stack.length = 0;
          return this.result(null);
        }
        const group: GroupNode = { kind: 'group', open: c as GroupNode['open'], items: [], count: 1, start: this.i, end: this.i + 1 };
        items.push(group);
        stack.push({ group, parent: items });
        items = group.items;
        this.i++;
      } else if (c === ')' || c === ']' || c === '}') {
        const top = stack.pop();
        if (!top) {
          this.error(this.i, this.i + 1, `'${c}' has no matching opening bracket.`);
          this.i++;
          continue;
        }
        const want = OPENERS[top.group.open];
        if (want !== c) {
          this.error(this.i, this.i + 1, `'${c}' closes '${top.group.open}' (at character ${top.group.start + 1}); expected '${want}'.`);
        }
        if (top.group.items.length === 0) this.error(top.group.start, this.i + 1, 'Empty brackets.');
        this.i++;
        top.group.count = this.readCount(top.group);
        top.group.end = this.i;
        items = top.parent;
      } else if (isLower(c)) {
        this.readLowercase(items, stack.length > 0);
      } else if (SEPARATORS.has(c)) {
        this.closeAll(stack);
        part.end = this.i;
        if (isSpace(s[this.i - 1])) while (part.end > part.start && isSpace(s[part.end - 1])) part.end--;
        this.i++;
        if (SPACED_SEPARATORS.has(c)) while (isSpace(s[this.i])) this.i++;
        part = this.startPart();
        formula.parts.push(part);
        items = part.items;
      } else if (c === '^' || isSupDigit(c) || isSupSign(c) || isSign(c)) {
        this.closeAll(stack);
        this.readCharge(formula);
        if (this.i < this.n && this.stateAt(this.i) !== undefined) this.readState(formula);
        if (this.i < this.n) {
          this.error(this.i, this.n, 'Nothing may follow the charge except a state symbol such as (aq).');
          this.i = this.n;
        }
        break;
      } else if (isDigit(c) || isSubDigit(c)) {
        const start = this.i;
        while (isDigit(s[this.i]) || isSubDigit(s[this.i]) || s[this.i] === '.') this.i++;
        this.error(start, this.i, `The number '${s.slice(start, this.i)}' does not follow an element or a bracket.`);
      } else if (c === ' ' || c === '\t' || c === '\u00a0') {
        // Spaces around an adduct dot are read as without (`CuSO4 · 5H2O`, `CuSO4 · 5 H2O`).
        let j = this.i;
        while (isSpace(s[j])) j++;
        if (s[j] !== undefined && SPACED_SEPARATORS.has(s[j]) && stack.length === 0 && part.items.length > 0) {
          this.i = j;
          continue;
        }
        this.error(this.i, this.i + 1, 'Space inside a formula.');
        this.i++;
      } else {
        const cp = s.codePointAt(this.i) as number;
        const len = cp > 0xffff ? 2 : 1;
        const shown = cp < 0x20 || cp === 0x7f ? `U+${cp.toString(16).toUpperCase().padStart(4, '0')}` : `'${s.slice(this.i, this.i + len)}'`;
        this.error(this.i, this.i + len, `Unexpected character ${shown} in a formula.`);
        this.i += len;
      }
    }
    this.closeAll(stack);
    part.end = Math.min(this.i, formula.chargeSpan?.start ?? this.i, formula.stateSpan?.start ?? this.i);
    formula.parts.forEach((p, k) => {
      if (p.items.length > 0) return;
      if (k > 0) this.error(p.start - 1, p.end, `Nothing follows '${s[p.start - 1]}'.`);
      else if (p.multiplierText !== '') this.error(p.start, p.end, `Multiplier '${p.multiplierText}' has nothing to multiply.`);
      else if (formula.parts.length > 1) this.error(0, 1, `Nothing comes before '${s[p.end]}'.`);
    });
    if (formula.parts.every((p) => p.items.length === 0) && this.diags.length === 0) {
      this.error(0, this.n, 'No element symbols in this formula.');
    }
    if (this.variables.length) formula.variableCounts = this.variables;
    return this.result(formula);
  }

  private result(formula: Formula | null): ParseResult {
    const ok = !this.diags.some((d) => d.severity === 'error');
    return { formula, diagnostics: this.diags, ok };
  }

  private closeAll(stack: OpenGroup[]) {
    while (stack.length) {
      const top = stack.pop() as OpenGroup;
      this.error(top.group.start, top.group.start + 1, `'${top.group.open}' is never closed.`);
      top.group.end = this.i;
    }
  }

  /** Start an adduct part: read its optional leading multiplier. */
  private startPart(): FormulaPart {
    const s = this.s;
    const start = this.i;
    let multiplier = 1;
    if (s[this.i] !== undefined && s[this.i] in FRACTIONS) {
      multiplier = FRACTIONS[s[this.i]];
      this.i++;
    } else if (isDigit(s[this.i])) {
      // A leading multiplier may be a decimal (`CaCl2·1.5H2O`, `Na2CO3·1.5H2O2`): a dot right after the
      // multiplier's digits cannot start another adduct part.
      const m = this.readNumber(true);
      multiplier = m;
      if (s[this.i] === '/' && isDigit(s[this.i + 1])) {
        this.i++;
        const d = this.readNumber();
        multiplier = d === 0 ? NaN : m / d;
      }
      if (!(multiplier > 0)) this.error(start, this.i, `Multiplier '${s.slice(start, this.i)}' must be greater than zero.`);
      else if (multiplier > MAX_COUNT) this.error(start, this.i, `Multiplier ${s.slice(start, this.i)} is beyond the limit of ${MAX_COUNT}.`);
      if (!(multiplier > 0 && multiplier <= MAX_COUNT)) multiplier = 1;
    }
    const multiplierText = s.slice(start, this.i);
    // `5 H2O`: a space between a multiplier and the molecule it multiplies.
    if (multiplierText !== '' && isSpace(s[this.i])) {
      let j = this.i;
      while (isSpace(s[j])) j++;
      if (isUpper(s[j]) || s[j] === '(' || s[j] === '[') this.i = j;
    }
    return { multiplier, multiplierText, items: [], start, end: this.i };
  }

  /** Read ASCII digits with an optional decimal part (subject to the hydrate-dot rule). */
  private readNumber(multiplier = false): number {
    const s = this.s;
    const start = this.i;
    while (isDigit(s[this.i])) this.i++;
    if (s[this.i] === '.' && isDigit(s[this.i + 1]) && (multiplier || s.slice(start, this.i) === '0' || !this.dotStartsAdduct(this.i))) {
      this.i++;
      while (isDigit(s[this.i])) this.i++;
    }
    return Number(s.slice(start, this.i));
  }

  /** Is the `.` at `dot` (between digits) a hydrate dot, as in `CuSO4.5H2O`? */
  private dotStartsAdduct(dot: number): boolean {
    const s = this.s;
    let j = dot + 1;
    while (isDigit(s[j])) j++;
    if (s[j] === '.' && isDigit(s[j + 1])) {
      j++;
      while (isDigit(s[j])) j++;
    }
    return startsWithAdductMolecule(s, j);
  }

  /** Read the count after an element or bracket; 1 when none is written. */
  private readCount(item: FormulaItem): number {
    const s = this.s;
    const start = this.i;
    let value: number;
    if (s[this.i] === 'x' && !isLower(s[this.i + 1])) {
      this.i++;
      return this.variableCount(start);
    }
    if (isDigit(s[this.i])) {
      value = this.readNumber();
      this.lastCount = { item, text: s.slice(start, this.i), end: this.i };
    } else if (isSubDigit(s[this.i])) {
      let digits = '';
      while (isSubDigit(s[this.i]) || (s[this.i] === '.' && isSubDigit(s[this.i + 1]) && digits !== '')) {
        digits += s[this.i] === '.' ? '.' : String(SUBSCRIPT_DIGITS.indexOf(s[this.i]));
        this.i++;
      }
      value = Number(digits);
    } else {
      return 1;
    }
    const text = s.slice(start, this.i);
    if (value === 0) {
      this.error(start, this.i, `A count of zero ('${text}') leaves the ${item.kind === 'group' ? 'bracket' : 'symbol'} out; remove it.`);
      return 1;
    }
    if (value > MAX_COUNT) {
      this.error(start, this.i, `Count ${text} is beyond the limit of ${MAX_COUNT}.`);
      return 1;
    }
    return value;
  }

  /** A count written `x`: NaN, recorded on the formula. */
  private variableCount(start: number): number {
    this.variables.push({ start, end: this.i });
    return NaN;
  }

  private readSymbol(items: FormulaItem[]) {
    const s = this.s;
    const start = this.i;
    this.i++;
    while (isLower(s[this.i])) this.i++;
    // `Sx`: no symbol ends in x, so a trailing x is a count (`(NH4)2Sx`).
    if (s[this.i - 1] === 'x' && this.i - start >= 2 && isElementSymbol(s.slice(start, this.i - 1))) this.i--;
    let token = s.slice(start, this.i);
    if (token === 'O' && s.startsWith('Ac', this.i) && !isLower(s[this.i + 2])) {
      this.i += 2;
      token = 'OAc';
    }
    if (isElementSymbol(token)) {
      const node: ElementNode = { kind: 'element', symbol: token, count: 1, start, end: this.i, symbolEnd: this.i };
      node.count = this.readCount(node);
      node.end = this.i;
      items.push(node);
      return;
    }
    const short = SHORTHAND[token];
    if (short) {
      const node: AbbrevNode = { kind: 'abbrev', name: token, atoms: short.atoms, charge: short.charge, count: 1, start, end: this.i };
      node.count = this.readCount(node);
      node.end = this.i;
      items.push(node);
      return;
    }
    const end = this.i;
    let from = start;
    let suggestions = symbolSuggestions(token);
    // 'CL2': an element letter followed by an unknown capital; suggest the two-letter symbol over both.
    const prev = items[items.length - 1];
    if (
      prev &&
      prev.kind === 'element' &&
      prev.end === start &&
      prev.symbol.length === 1 &&
      token.length === 1 &&
      isElementSymbol(prev.symbol + token.toLowerCase())
    ) {
      items.pop();
      from = prev.start;
      suggestions = [prev.symbol + token.toLowerCase()];
      token = prev.symbol + token;
    }
    const hint = suggestions.length ? ` Did you mean ${suggestions.map((x) => `'${x}'`).join(' or ')}?` : '';
    this.error(from, end, `'${token}' is not an element symbol.${hint}`, 'unknown-element', suggestions.length ? { suggestions } : undefined);
    // Consume its count so that one bad symbol gives one diagnostic.
    const placeholder: ElementNode = { kind: 'element', symbol: token, count: 1, start, end, symbolEnd: end };
    this.readCount(placeholder);
  }

  private readLowercase(items: FormulaItem[], inBrackets: boolean) {
    const s = this.s;
    const start = this.i;
    while (isLower(s[this.i])) this.i++;
    const token = s.slice(start, this.i);
    const lig = LIGANDS[token];
    if (lig && inBrackets) {
      const node: AbbrevNode = { kind: 'abbrev', name: token, atoms: lig.atoms, charge: lig.charge, count: 1, start, end: this.i };
      node.count = this.readCount(node);
      node.end = this.i;
      items.push(node);
      return;
    }
    const cap = token[0].toUpperCase() + token.slice(1);
    if (token.length <= 2 && isElementSymbol(cap)) {
      this.error(start, this.i, `'${token}' is not an element symbol; symbols start with a capital letter: '${cap}'.`, 'unknown-element', {
        suggestions: [cap],
      });
    } else if (lig) {
      this.error(start, this.i, `The ligand abbreviation '${token}' must stand in brackets, e.g. (${token}).`);
    } else {
      this.error(start, this.i, `'${token}' is neither an element symbol nor a known ligand abbreviation.`, 'unknown-element');
    }
    this.readCount({ kind: 'element', symbol: token, count: 1, start, end: this.i, symbolEnd: this.i });
  }

  /** Stock notation right after an element: `Fe(III)`, `Cu(I)`, `Mn(0)`. */
  private stockAt(i: number, items: FormulaItem[]): { node: ElementNode; value: number; end: number } | undefined {
    const last = items[items.length - 1];
    if (!last || last.kind !== 'element' || last.end !== i || last.count !== 1 || last.stock !== undefined || !isMetal(last.symbol)) return undefined;
    const close = this.s.indexOf(')', i);
    // '(I)2' is a bracketed iodine with a count, not Stock notation.
    if (close < 0 || close - i > 6 || isDigit(this.s[close + 1]) || isSubDigit(this.s[close + 1])) return undefined;
    const value = ROMAN[this.s.slice(i + 1, close)];
    return value === undefined ? undefined : { node: last, value, end: close + 1 };
  }

  private stateAt(i: number): StateSymbol | undefined {
    const s = this.s;
    if (s[i] !== '(') return undefined;
    const close = s.indexOf(')', i);
    if (close < 0 || close - i > 3) return undefined;
    const inner = s.slice(i + 1, close);
    if (!STATES.has(inner)) return undefined;
    // A state symbol ends the formula.
    return close === this.n - 1 ? (inner as StateSymbol) : undefined;
  }

  private readState(formula: Formula) {
    const start = this.i;
    const close = this.s.indexOf(')', start);
    formula.state = this.s.slice(start + 1, close) as StateSymbol;
    formula.stateSpan = { start, end: close + 1 };
    this.i = close + 1;
  }

  private readCharge(formula: Formula) {
    const s = this.s;
    const start = this.i;
    let magnitude: number;
    let sign: number;
    let notation: Formula['chargeNotation'] = 'explicit';
    if (s[this.i] === '^') {
      this.i++;
      const brace = s[this.i] === '{';
      if (brace) this.i++;
      let digits = '';
      while (isDigit(s[this.i])) digits += s[this.i++];
      let signs = '';
      while (isSign(s[this.i])) signs += s[this.i++];
      if (digits === '') while (isDigit(s[this.i])) digits += s[this.i++];
      if (brace) {
        if (s[this.i] === '}') this.i++;
        else this.error(this.i, this.i, "Expected '}' to close the charge.");
      }
      if (signs === '') {
        this.error(start, this.i, "A charge after '^' needs a sign: ²⁻ or ⁺ (typed ^2- or ^+).");
        return;
      }
      if (new Set(signs.replace(/−/g, '-')).size > 1 || (digits !== '' && signs.length > 1)) {
        this.error(start, this.i, `Charge '${s.slice(start, this.i)}' is not readable; write it as ²⁻ or ⁺ (typed ^2- or ^+).`);
        return;
      }
      sign = signOf(signs[0]);
      magnitude = digits === '' ? signs.length : Number(digits);
    } else if (isSupDigit(s[this.i]) || isSupSign(s[this.i])) {
      let digits = '';
      while (isSupDigit(s[this.i])) digits += String(SUPERSCRIPT_DIGITS.indexOf(s[this.i++]));
      let signs = '';
      while (isSupSign(s[this.i])) signs += s[this.i++];
      if (digits === '') while (isSupDigit(s[this.i])) digits += String(SUPERSCRIPT_DIGITS.indexOf(s[this.i++]));
      if (signs === '') {
        this.error(start, this.i, 'A superscript charge needs ⁺ or ⁻.');
        return;
      }
      if (new Set(signs).size > 1 || (digits !== '' && signs.length > 1)) {
        this.error(start, this.i, `Charge '${s.slice(start, this.i)}' is not readable.`);
        return;
      }
      sign = signOf(signs[0]);
      magnitude = digits === '' ? signs.length : Number(digits);
    } else {
      notation = 'bare';
      let signs = '';
      while (isSign(s[this.i])) signs += s[this.i++];
      let digits = '';
      while (isDigit(s[this.i])) digits += s[this.i++];
      if (new Set(signs.replace(/−/g, '-')).size > 1 || (digits !== '' && signs.length > 1)) {
        this.error(start, this.i, `Charge '${s.slice(start, this.i)}' is not readable; write it as ²⁻ or ⁺ (typed ^2- or ^+).`);
        return;
      }
      sign = signOf(signs[0]);
      magnitude = digits === '' ? signs.length : Number(digits);
      const lc = this.lastCount;
      if (digits === '' && signs.length === 1 && lc && lc.end === start && /^[0-9]+$/.test(lc.text) && !lc.text.endsWith('0')) {
        const monatomic =
          formula.parts.length === 1 && formula.parts[0].items.length === 1 && formula.parts[0].items[0] === lc.item && lc.item.kind === 'element';
        const mode = this.options.bareDigit ?? (monatomic ? 'charge' : 'count');
        if (mode === 'charge') {
          const rest = lc.text.slice(0, -1);
          lc.item.count = rest === '' ? 1 : Number(rest);
          lc.item.end = start - 1;
          magnitude = Number(lc.text.slice(-1));
          notation = 'bare-digit';
          formula.chargeSpan = { start: start - 1, end: this.i };
        }
        if (this.options.bareDigit === undefined) {
          const other = parseFormula(s, { bareDigit: mode === 'charge' ? 'count' : 'charge' });
          if (other.ok && other.formula) formula.alternative = other.formula;
        }
      }
    }
    if (magnitude > MAX_CHARGE) {
      this.error(start, this.i, `Charge of ${magnitude} is beyond the limit of ${MAX_CHARGE}.`);
      return;
    }
    formula.charge = sign * magnitude;
    formula.chargeNotation = notation;
    if (!formula.chargeSpan) formula.chargeSpan = { start, end: this.i };
  }
}

/** Does `s` at `j` start with a common adduct molecule that ends there (`H2O`, `NH3`, …)? */
export function startsWithAdductMolecule(s: string, j = 0): boolean {
  for (const m of ADDUCT_MOLECULES) {
    if (s.startsWith(m, j)) {
      const after = s[j + m.length];
      if (after === undefined || SEPARATORS.has(after) || after === '^' || isSign(after) || after === '(' || isSupDigit(after) || isSupSign(after)) return true;
    }
  }
  return false;
}

/** Case fixes and one-letter slips for an unknown symbol (`Nacl` → `NaCl`, `CL` → `Cl`). */
export function symbolSuggestions(token: string): string[] {
  const out = new Set<string>();
  const cap = token[0].toUpperCase() + token.slice(1).toLowerCase();
  if (isElementSymbol(cap)) out.add(cap);
  // Split into two symbols: 'Nacl' → 'Na' + 'Cl'.
  for (let k = 1; k < token.length; k++) {
    const a = token.slice(0, k);
    const b = token.slice(k);
    const A = a[0].toUpperCase() + a.slice(1).toLowerCase();
    const B = b[0].toUpperCase() + b.slice(1).toLowerCase();
    if (isElementSymbol(A) && isElementSymbol(B)) out.add(A + B);
  }
  out.delete(token);
  return [...out].slice(0, 3);
}
