/**
 * Stage 1 of a batch: its lines read, each a header (`name:`, `volume:`, `total:`, `pH:`,
 * `temperature:`), an ingredient (formula, amount, unit, assay, or `to pH <value>`: an amount to solve for)
 * or a buffer to design (`phosphate buffer 0.1 M to pH 7.40`), with the findings of what cannot be read on
 * their exact characters. Nothing is computed yet: the volume and total a target needs are known only once
 * every line is read.
 *
 * A header given twice: the first one that can be read counts; a later one is set aside with a warning.
 */
import type { FormulaAnalysis } from '../analyse';
import type { ChemDiagnostic } from '../diagnostic';
import { reagentUnit, REAGENT_UNITS, type EquivalentRole, type ReagentUnit, type ShelfEntry } from '../reagents';
import type { ChemSettings } from '../settings';
import { bufferNamed, BUFFER_NAMES, type BufferSystem } from '../solution/buffers';
import { finding, tokens, type Token } from './tokens';
import type { BatchContext, BatchLine } from './types';
import { anhydrousOf } from './solubility';
import { isTankHeader, isTitreLine } from '../upkeep';
import { readSubstance } from './substance';
import { unitIn, unitList, type BatchUnit } from './units';

/** A line as written (the blanks around it trimmed), with its absolute offsets. */
export interface SourceLine {
  text: string;
  start: number;
  end: number;
}

/** An ingredient line as read. */
export interface IngredientLine {
  kind: 'ingredient';
  source: SourceLine;
  /** Offsets of the line without its comment and blanks. */
  lineStart: number;
  lineEnd: number;
  formula: Token;
  /** The formula's analysis (always made: its findings and cautions count even on a line not counted). */
  analysis: FormulaAnalysis;
  amount?: Token;
  /** The unit token, its text the unit as results write it (`ug` → `µg`); set only where it is accepted. */
  unit?: Token;
  unitInfo?: BatchUnit;
  /** The amount's number (NaN where it cannot be read). */
  value: number;
  /** Fraction 0–1 of what is weighed that is the substance. */
  assay: number;
  /** `to pH <value>`: the amount is solved for this pH (the range of `to pH <value>`). */
  solveFor?: { pH: number; start: number; end: number };
  /** This line's findings (absolute offsets). */
  diagnostics: ChemDiagnostic[];
  /** How the substance was written: a formula, a name, a shelf label. */
  via: 'formula' | 'name' | 'shelf';
  /** A name read exactly: the name as the tool writes it. */
  name?: string;
  /** A shelf label: its entry (formula, assay, density, lot). */
  shelf?: ShelfEntry;
  /** A name of a solution (bleach): the assay must be given. */
  solutionName?: { typical: string };
  /** What the reading of the substance assumed. */
  notes: string[];
  /** The assay as given (`@ 37%` or the shelf's), in percent; undefined where none was given. */
  assayPercent?: number;
  /** A unit of chem/reagents (g/L, %w/v, N, mL …) where the batch units do not have it. */
  reagentUnit?: ReagentUnit;
  /** Normality: the role its equivalents are counted by (`0.1 N acid`). */
  role?: EquivalentRole;
  /** `from <value> <unit>` or `from batch "<name>"`: a dilution of a stock. */
  stock?: StockRef;
  /** `d 1.21 g/mL` on the line (the label's density), or the shelf entry's. */
  densityGPerML?: number;
}

/** Where a line's stock comes from. */
export type StockRef =
  | { kind: 'value'; value: number; unit: string; text: string; start: number; end: number }
  | { kind: 'batch'; batch: string; value: number | null; error?: string; text: string; start: number; end: number };

/** A buffer line: `[sodium|potassium] <system> buffer <total> <M|mM> to pH <value>`. */
export interface BufferLine {
  kind: 'buffer';
  source: SourceLine;
  lineStart: number;
  lineEnd: number;
  /** The words naming the system (`potassium phosphate`). */
  name: Token;
  buffer?: { system: BufferSystem; counterIon: 'Na' | 'K' };
  /** Total concentration of the system's forms, M, and where it is written. */
  total?: { valueM: number; text: string; start: number; end: number };
  target?: { pH: number; start: number; end: number };
  diagnostics: ChemDiagnostic[];
}

/** A header line that does not count, with the finding that sets it aside. */
export interface SetAsideHeader {
  kind: 'header';
  source: SourceLine;
  finding: ChemDiagnostic;
}

export interface BatchHeaders {
  name: string | null;
  volumeL: number | null;
  totalMassG: number | null;
  /** Where the `total:` value is written, for a finding about it. */
  totalRange: { start: number; end: number } | null;
  /** `pH:` — the pH the batch is expected at, and where it is written. */
  pH: { value: number; start: number; end: number } | null;
  /** `temperature:` in °C (25 unless given). */
  temperatureC: number;
  temperatureGiven: boolean;
}

export interface ReadBatch {
  headers: BatchHeaders;
  /** Titre lines (bath upkeep, chem/upkeep), as written with their absolute starts: no ingredients. */
  titres: Array<{ text: string; start: number }>;
  /** The `tank:` header (the litres of bath in the tank now), where given. */
  tankLine: { text: string; start: number } | null;
  /** The ingredient lines and the headers set aside, in the order written (counted headers are in `headers`). */
  lines: Array<IngredientLine | BufferLine | SetAsideHeader>;
  /** The findings of the headers set aside. */
  diagnostics: ChemDiagnostic[];
}

const NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const MAX_AMOUNT = 1e9;
const HEADER = /^(name|volume|total|ph|temperature)\s*:\s*(.*)$/i;

type HeaderKey = 'name' | 'volume' | 'total' | 'ph' | 'temperature';

/** The pH a header or a line may ask for (a pH meter's range and a little beyond). */
const PH_RANGE = [-1, 15] as const;
/** Temperatures of the model: liquid water at 1 atm. */
const TEMPERATURE_RANGE = [0, 100] as const;

/** A non-blank line: what it says (its comment cut off), where, and as written. */
interface Located {
  source: SourceLine;
  /** The line without its comment, starting at offset `base`. */
  text: string;
  base: number;
  trimmed: string;
  lineStart: number;
  lineEnd: number;
}

function locate({ text: raw, start }: BatchLine): Located | null {
  const hash = raw.indexOf('#');
  const text = hash >= 0 ? raw.slice(0, hash) : raw;
  const trimmed = text.trim();
  if (trimmed === '') return null;
  const source = { text: raw.trim(), start: start + (raw.length - raw.trimStart().length), end: start + raw.trimEnd().length };
  return { source, text, base: start, trimmed, lineStart: start + (text.length - text.trimStart().length), lineEnd: start + text.trimEnd().length };
}

/** Read a batch block's lines (stage 1). */
export function readLines(lines: readonly BatchLine[], openName: string | null, settings: ChemSettings, context: BatchContext = {}): ReadBatch {
  const headers: BatchHeaders = { name: openName, volumeL: null, totalMassG: null, totalRange: null, pH: null, temperatureC: 25, temperatureGiven: false };
  const counted = new Set<HeaderKey>(openName ? ['name'] : []);
  const out: ReadBatch = { headers, titres: [], tankLine: null, diagnostics: [] as ChemDiagnostic[], lines: [] };
  for (const line of lines) {
    const at = locate(line);
    if (!at) continue;
    if (isTitreLine(at.trimmed)) {
      out.titres.push({ text: line.text, start: line.start });
      continue;
    }
    // A header line that does not count: its finding, and the line listed as not counted.
    const setAside = (d: ChemDiagnostic | null) => {
      if (!d) return;
      out.diagnostics.push(d);
      out.lines.push({ kind: 'header', source: at.source, finding: d });
    };
    if (isTankHeader(at.trimmed)) {
      if (out.tankLine) setAside(finding('batch-header', at.lineStart, at.lineEnd, `'tank:' is given twice; the first one counts.`, 'warning'));
      else out.tankLine = { text: line.text, start: line.start };
      continue;
    }
    const makeUp = MAKE_UP.exec(at.trimmed);
    if (makeUp) {
      setAside(readMakeUp(headers, counted, makeUp, at));
      continue;
    }
    const header = HEADER.exec(at.trimmed);
    if (!header) {
      out.lines.push(bufferWord(at) ? readBuffer(at) : readIngredient(at, settings, context));
      continue;
    }
    setAside(readHeader(headers, counted, openName, header, at));
  }
  return out;
}

/**
 * `water to 1 L`, `make up to 500 mL with water`: the final volume, as a `volume:` header says it. Where a
 * `volume:` is given as well, the two must agree.
 */
const MAKE_UP =
  /^(?:(?:(?:DI|deionised|deionized|distilled|purified|demineralised|demineralized)\s+)?water\s+to|make\s+up\s+to|made\s+up\s+to|top\s+up\s+to|fill\s+to)(?:\s+(.*?))?(\s+with\s+\S.*)?$/i;

function readMakeUp(headers: BatchHeaders, counted: Set<HeaderKey>, m: RegExpExecArray, at: Located): ChemDiagnostic | null {
  const valueText = m[1] ?? '';
  const valueStart = at.lineStart + at.trimmed.indexOf(valueText, at.trimmed.length - valueText.length - (m[2]?.length ?? 0));
  if (!valueText.trim()) return finding('batch-amount', at.lineStart, at.lineEnd, `'${at.trimmed}' needs the volume to make up to, e.g. 'water to 1 L'.`);
  const read = readHeaderValue('volume', valueText, valueStart, at.lineStart, at.lineEnd);
  if ('error' in read) return read.error;
  if (counted.has('volume')) {
    if (headers.volumeL !== null && Math.abs(read.value - headers.volumeL) <= 1e-9 * headers.volumeL) return null;
    return finding(
      'batch-header',
      at.lineStart,
      at.lineEnd,
      `The batch is made up to ${valueText.trim()} here, but its final volume is already ${headers.volumeL} L; the first one counts.`,
      'warning',
    );
  }
  counted.add('volume');
  headers.volumeL = read.value;
  return null;
}

/** Take a header into `headers` where it is the first readable one of its key; else the finding that sets it aside. */
function readHeader(headers: BatchHeaders, counted: Set<HeaderKey>, openName: string | null, header: RegExpExecArray, at: Located): ChemDiagnostic | null {
  const key = header[1].toLowerCase() as HeaderKey;
  if (counted.has(key)) {
    const message =
      key === 'name' && headers.name === openName && openName !== null
        ? `This batch is already named '${openName}' on its opening line; the first name counts.`
        : `'${key === 'ph' ? 'pH' : key}:' is given twice; the first one counts.`;
    return finding('batch-header', at.lineStart, at.lineEnd, message, 'warning');
  }
  if (key === 'name') {
    const valueText = header[2].trim();
    if (valueText) {
      headers.name = valueText;
      counted.add(key);
    }
    return null;
  }
  const valueStart = at.lineStart + at.trimmed.length - header[2].length;
  if (key === 'ph' || key === 'temperature') {
    const v = key === 'ph' ? readPHHeader(header[2], valueStart, at) : readTemperature(header[2], valueStart, at);
    if ('error' in v) return v.error;
    counted.add(key);
    if (key === 'ph') headers.pH = { value: v.value, start: valueStart, end: valueStart + header[2].trimEnd().length };
    else {
      headers.temperatureC = v.value;
      headers.temperatureGiven = true;
    }
    return null;
  }
  const read = readHeaderValue(key, header[2], valueStart, at.lineStart, at.lineEnd);
  if ('error' in read) return read.error;
  counted.add(key);
  if (key === 'volume') headers.volumeL = read.value;
  else {
    headers.totalMassG = read.value;
    headers.totalRange = { start: valueStart, end: valueStart + header[2].trimEnd().length };
  }
  return null;
}

const readNumber = (t: string) => (NUMBER.test(t) ? Number(t) : NaN);

/** A number and a unit written together: `0.1M` (a buffer's total), `5g` / `2wt%` / `1%w/v` (an amount), `1.5M` / `250g/L` (a stock). */
const GLUED_NUMBER = String.raw`((?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)`;
const GLUED_UNIT = new RegExp(`^${GLUED_NUMBER}([A-Za-zµ/]+)$`);
const GLUED_QUANTITY = new RegExp(`^${GLUED_NUMBER}((?:wt)?%(?:[wv]\\/[wv])?|[A-Za-zµ/]+)$`);
const GLUED_STOCK = new RegExp(`^${GLUED_NUMBER}([A-Za-zµ/%]+)$`);

/** A token of a number and a unit written together, as two tokens; null where it is not one. */
function splitGlued(tok: Token, pattern: RegExp): [Token, Token] | null {
  const m = pattern.exec(tok.text);
  if (!m) return null;
  const cut = tok.start + m[1].length;
  return [
    { text: m[1], start: tok.start, end: cut },
    { text: m[2], start: cut, end: tok.end },
  ];
}

/** A `pH:` value: one number in the range of a pH. */
function readPHHeader(value: string, valueStart: number, at: Located): { value: number } | { error: ChemDiagnostic } {
  const tk = tokens(value, valueStart);
  if (tk.length === 0) return { error: finding('batch-amount', at.lineStart, at.lineEnd, `'pH:' needs a number, e.g. 'pH: 7.40'.`) };
  const v = readNumber(tk[0].text);
  if (!Number.isFinite(v) || v < PH_RANGE[0] || v > PH_RANGE[1])
    return { error: finding('batch-amount', tk[0].start, tk[0].end, `'${tk[0].text}' is not a pH (a number from ${PH_RANGE[0]} to ${PH_RANGE[1]}).`) };
  if (tk.length > 1) {
    const extra = tk.slice(1);
    return { error: finding('batch-syntax', extra[0].start, extra[extra.length - 1].end, `Unexpected '${extra.map((t) => t.text).join(' ')}' after the pH.`) };
  }
  return { value: v };
}

/** A `temperature:` value in °C or K, from 0 to 100 °C. */
function readTemperature(value: string, valueStart: number, at: Located): { value: number } | { error: ChemDiagnostic } {
  const tk = tokens(value, valueStart);
  if (tk.length === 0)
    return { error: finding('batch-amount', at.lineStart, at.lineEnd, `'temperature:' needs a number and a unit, e.g. 'temperature: 40 °C'.`) };
  const glued = /^([+-]?[0-9.eE+-]*[0-9.])(°C|°|C|degC|K)$/.exec(tk[0].text);
  const num = glued ? glued[1] : tk[0].text;
  const unit = glued ? glued[2] : tk[1]?.text;
  const rest = tk.slice(glued ? 1 : 2);
  const v = readNumber(num);
  if (!Number.isFinite(v)) return { error: finding('batch-amount', tk[0].start, tk[0].end, `'${tk[0].text}' is not a temperature.`) };
  if (unit === undefined || !/^(°C|°|C|degC|K)$/.test(unit)) {
    const t = tk[1] ?? tk[0];
    return {
      error: finding('batch-unit', t.start, t.end, unit ? `Unknown unit '${unit}' for temperature; use °C or K.` : `'temperature:' needs a unit: °C or K.`),
    };
  }
  if (rest.length)
    return {
      error: finding('batch-syntax', rest[0].start, rest[rest.length - 1].end, `Unexpected '${rest.map((t) => t.text).join(' ')}' after the temperature.`),
    };
  const c = unit === 'K' ? v - 273.15 : v;
  if (c < TEMPERATURE_RANGE[0] || c > TEMPERATURE_RANGE[1])
    return {
      error: finding('batch-amount', tk[0].start, (tk[1] ?? tk[0]).end, `${value.trim()} is outside the model's range of 0 to 100 °C (liquid water at 1 atm).`),
    };
  return { value: Math.round(c * 1e6) / 1e6 };
}

/** A `volume:` or `total:` value, or the finding that says why it cannot be read. */
function readHeaderValue(
  key: 'volume' | 'total',
  value: string,
  valueStart: number,
  lineStart: number,
  lineEnd: number,
): { value: number } | { error: ChemDiagnostic } {
  const tk = tokens(value, valueStart);
  const units = unitList(key);
  if (tk.length === 0) return { error: finding('batch-amount', lineStart, lineEnd, `'${key}:' needs a number and a unit (${units}).`) };
  let num = tk[0].text;
  let unit = tk[1]?.text;
  const glued = /^([0-9.eE+-]+)([A-Za-zµ]+)$/.exec(num);
  if (glued && !unit) {
    num = glued[1];
    unit = glued[2];
  }
  const v = NUMBER.test(num) ? Number(num) : NaN;
  if (!(v > 0) || v > MAX_AMOUNT) return { error: finding('batch-amount', tk[0].start, tk[0].end, `'${tk[0].text}' is not a positive number.`) };
  const u = unit === undefined ? undefined : unitIn(key, unit);
  if (!u) {
    const at = tk[1] ?? tk[0];
    return { error: finding('batch-unit', at.start, at.end, unit ? `Unknown unit '${unit}' for ${key}; use ${units}.` : `'${key}:' needs a unit (${units}).`) };
  }
  if (tk.length > 2) {
    const extra = tk.slice(2);
    return {
      error: finding('batch-syntax', extra[0].start, extra[extra.length - 1].end, `Unexpected '${extra.map((t) => t.text).join(' ')}' after the ${key}.`),
    };
  }
  return { value: v * u.factor };
}

/** An ingredient line: its substance (always analysed, for its findings and cautions), amount, unit and what follows. */
function readIngredient(at: Located, settings: ChemSettings, context: BatchContext): IngredientLine {
  const sub = readSubstance(at.text, at.base, settings, context);
  const { formula, analysis } = sub;
  const [amount, unit, ...rest] = sub.rest;
  const line: IngredientLine = {
    kind: 'ingredient',
    source: at.source,
    lineStart: at.lineStart,
    lineEnd: at.lineEnd,
    formula,
    analysis,
    value: NaN,
    assay: 1,
    diagnostics: sub.diagnostics,
    via: sub.via,
    notes: sub.notes,
  };
  if (sub.name) line.name = sub.name;
  if (sub.solution) line.solutionName = sub.solution;
  if (sub.shelf) {
    line.shelf = sub.shelf;
    if (sub.shelf.densityGPerML !== undefined) line.densityGPerML = sub.shelf.densityGPerML;
    if (sub.shelf.assayPercent !== undefined) {
      line.assayPercent = sub.shelf.assayPercent;
      line.assay = sub.shelf.assayPercent / 100;
    }
  }
  const diagnostics = line.diagnostics;
  if (!amount)
    diagnostics.push(finding('batch-amount', formula.start, formula.end, `'${formula.text}' needs an amount and a unit, e.g. '${formula.text} 5.0 g'.`));
  else if (amount.text.toLowerCase() === 'to' && unit && /^ph/i.test(unit.text)) readPHTarget(line, amount, unit, rest, context);
  else readQuantity(line, amount, unit, rest, context);
  return line;
}

/** `to pH <value> [@ assay%]`: the pH the amount is solved for, into `line`. */
function readPHTarget(line: IngredientLine, to: Token, ph: Token, rest: Token[], context: BatchContext): void {
  const target = readPH(to, ph, rest, line.diagnostics);
  if (!target) return;
  line.solveFor = target.at;
  line.amount = { text: `to pH ${target.text}`, start: to.start, end: target.at.end };
  if (target.rest.length) readTail(line, target.rest, context, false);
}

/** `to pH <value>` from its tokens (the value may be glued: `pH7.0`); the findings into `diagnostics`. */
function readPH(
  to: Token,
  ph: Token,
  rest: Token[],
  diagnostics: ChemDiagnostic[],
): { at: { pH: number; start: number; end: number }; text: string; rest: Token[] } | null {
  const glued = /^ph(.+)$/i.exec(ph.text);
  let valueTok: Token | undefined;
  let more = rest;
  if (glued) valueTok = { text: glued[1], start: ph.start + 2, end: ph.end };
  else if (ph.text.toLowerCase() === 'ph') [valueTok, ...more] = rest;
  if (!valueTok) {
    diagnostics.push(finding('batch-amount', to.start, ph.end, `'to pH' needs the pH, e.g. 'to pH 7.00'.`));
    return null;
  }
  const v = readNumber(valueTok.text);
  if (!Number.isFinite(v) || v < PH_RANGE[0] || v > PH_RANGE[1]) {
    diagnostics.push(finding('batch-amount', valueTok.start, valueTok.end, `'${valueTok.text}' is not a pH (a number from ${PH_RANGE[0]} to ${PH_RANGE[1]}).`));
    return null;
  }
  return { at: { pH: v, start: to.start, end: valueTok.end }, text: valueTok.text, rest: more };
}

/** Whether a line is a buffer line: the word `buffer` after at least one other word. */
function bufferWord(at: Located): boolean {
  return /^\S.*?\s+buffer(\s|$)/i.test(at.trimmed);
}

/** A buffer line: the system, its total concentration, the target pH. */
function readBuffer(at: Located): BufferLine {
  const tk = tokens(at.text, at.base);
  const k = tk.findIndex((t, i) => i > 0 && t.text.toLowerCase() === 'buffer');
  const words = tk.slice(0, k);
  const name = { text: words.map((t) => t.text).join(' '), start: words[0].start, end: words[words.length - 1].end };
  const line: BufferLine = { kind: 'buffer', source: at.source, lineStart: at.lineStart, lineEnd: at.lineEnd, name, diagnostics: [] };
  const d = line.diagnostics;
  const named = bufferNamed(name.text);
  if (named) line.buffer = { system: named.buffer, counterIon: named.counterIon };
  else
    d.push(
      finding(
        'batch-buffer',
        name.start,
        name.end,
        `'${name.text}' is no buffer system of the tables; one of: ${BUFFER_NAMES.join(', ')} (with 'sodium' or 'potassium' before it for the counter-ion).`,
      ),
    );
  let rest = tk.slice(k + 1);
  const example = `'${name.text} buffer 0.1 M to pH 7.40'`;
  if (rest.length === 0) {
    d.push(finding('batch-buffer', tk[k].start, tk[k].end, `A buffer line needs its total concentration and pH: ${example}.`));
    return line;
  }
  // The total: `0.1 M`, `100 mM`, `0.1M`.
  let amount = rest[0];
  let unit: Token | undefined = rest[1];
  const glued = splitGlued(amount, GLUED_UNIT);
  if (glued) {
    [amount, unit] = glued;
    rest = [amount, unit, ...rest.slice(1)];
  }
  const value = readNumber(amount.text);
  const u = unit ? unitIn('ingredient', unit.text) : undefined;
  if (!(value > 0) || value > MAX_AMOUNT) d.push(finding('batch-amount', amount.start, amount.end, `'${amount.text}' is not a positive concentration.`));
  else if (!u || u.kind !== 'concentration') {
    const at2 = unit ?? amount;
    d.push(finding('batch-unit', at2.start, at2.end, `A buffer's total is a concentration: M, mM or µM (as in ${example}).`));
  } else line.total = { valueM: value * u.factor, text: `${amount.text} ${u.unit}`, start: amount.start, end: (unit as Token).end };
  const after = rest.slice(2);
  if (after.length < 2 || after[0].text.toLowerCase() !== 'to' || !/^ph/i.test(after[1].text)) {
    const from = after[0] ?? unit ?? amount;
    const to = after[after.length - 1] ?? from;
    d.push(finding('batch-buffer', from.start, to.end, `A buffer line ends in the pH it is made to: ${example}.`));
    return line;
  }
  const target = readPH(after[0], after[1], after.slice(2), d);
  if (!target) return line;
  line.target = target.at;
  if (target.rest.length) {
    const r = target.rest;
    d.push(finding('batch-syntax', r[0].start, r[r.length - 1].end, `Unexpected '${r.map((t) => t.text).join(' ')}' after the pH.`));
  }
  return line;
}

/** The amount, unit and assay after the formula, into `line` (its findings too). */
function readQuantity(line: IngredientLine, amount: Token, unitTok: Token | undefined, rest: Token[], context: BatchContext): void {
  const { formula, diagnostics } = line;
  let amountTok = amount;
  let unit = unitTok;
  // `5g`, `2wt%`: the number and the unit written together.
  const glued = splitGlued(amount, GLUED_QUANTITY);
  if (glued && (!unitTok || unitTok.text.startsWith('@') || /^(?:from|acid|base|redox|ion|as)$/i.test(unitTok.text))) {
    [amountTok, unit] = glued;
    if (unitTok) rest.unshift(unitTok);
  }
  line.amount = amountTok;
  const value = NUMBER.test(amountTok.text) ? Number(amountTok.text) : NaN;
  if (/^\d*(?:H2O|H₂O)$/.test(amount.text)) {
    diagnostics.push(
      finding(
        'batch-amount',
        amount.start,
        amount.end,
        `'${amount.text}' after the formula reads as the amount; write the hydrate as one formula, e.g. '${formula.text}·${amount.text}' or '${formula.text}.${amount.text}'.`,
      ),
    );
    return;
  }
  if (!Number.isFinite(value) || value <= 0 || value > MAX_AMOUNT) {
    diagnostics.push(
      finding(
        'batch-amount',
        amountTok.start,
        amountTok.end,
        Number.isFinite(value) && value > MAX_AMOUNT
          ? `Amount ${amountTok.text} is beyond the limit of ${MAX_AMOUNT}.`
          : `'${amountTok.text}' is not a positive number.`,
      ),
    );
    return;
  }
  line.value = value;
  // A unit of two words (`% w/v`, `ppm w/w`).
  if (unit && rest.length && reagentUnit(`${unit.text} ${rest[0].text}`)) {
    const second = rest.shift() as Token;
    unit = { text: `${unit.text} ${second.text}`, start: unit.start, end: second.end };
  }
  if (readUnit(line, amountTok, unit) && rest.length) readTail(line, rest, context, true);
}

/** Every unit an ingredient line may be given in, for the messages (made once). */
let INGREDIENT_UNITS: string | undefined;
const ingredientUnits = () =>
  (INGREDIENT_UNITS ??= `${unitList('ingredient').replace(' or ', ', ')}, ${REAGENT_UNITS.filter(
    (u) => !u.unit.includes(' ') && u.unit !== 'kg/L' && u.unit !== 'µg/L',
  )
    .map((u) => u.unit)
    .join(', ')}`);

/** The unit after the amount, into `line`; false where it is missing or not a unit of an ingredient. */
function readUnit(line: IngredientLine, amount: Token, unit: Token | undefined): boolean {
  if (!unit) {
    line.diagnostics.push(finding('batch-unit', amount.start, amount.end, `'${amount.text}' needs a unit: ${ingredientUnits()}.`));
    return false;
  }
  const u = unitIn('ingredient', unit.text);
  if (u) {
    line.unit = { text: u.unit, start: unit.start, end: unit.end };
    line.unitInfo = u;
    return true;
  }
  const r = reagentUnit(unit.text);
  if (r) {
    line.unit = { text: r.unit, start: unit.start, end: unit.end };
    line.reagentUnit = r;
    return true;
  }
  line.diagnostics.push(finding('batch-unit', unit.start, unit.end, `Unknown unit '${unit.text}'; use ${ingredientUnits()}.`));
  return false;
}

const ROLES = new Set(['acid', 'base', 'redox', 'ion']);

/**
 * What may follow the amount, in any order: an assay (`@ 96%`), a stock to dilute (`from 1.5 M`,
 * `from batch "Acid stock"`), and for a normality the role its equivalents are counted by (`acid`,
 * `as base`). Anything else is a finding on its characters.
 */
function readTail(line: IngredientLine, rest: Token[], context: BatchContext, stockAllowed: boolean): void {
  const d = line.diagnostics;
  let i = 0;
  const unexpected = (from: number, what: string) => {
    const r = rest.slice(from);
    d.push(finding('batch-syntax', r[0].start, r[r.length - 1].end, `Unexpected '${r.map((t) => t.text).join(' ')}' after the amount; ${what}.`));
  };
  while (i < rest.length) {
    const t = rest[i];
    const word = t.text.toLowerCase();
    if (t.text.startsWith('@')) {
      // `@ 96%`, `@96%`, `@ 96 %`
      let j = i;
      let text = t.text;
      while (!/%$/.test(text) && j + 1 < rest.length && j - i < 2) text += rest[++j].text;
      const m = /^@((?:\d+(?:\.\d*)?|\.\d+))%$/.exec(text);
      if (!m) {
        d.push(finding('batch-syntax', t.start, rest[j].end, `An assay is written '@ 99.5%'.`));
        return;
      }
      const pct = Number(m[1]);
      if (!(pct > 0 && pct <= 100)) d.push(finding('batch-amount', t.start, rest[j].end, `Assay ${m[1]} % must be above 0 and at most 100.`));
      else {
        if (line.shelf?.assayPercent !== undefined && line.shelf.assayPercent !== pct)
          line.notes.push(`The line's assay (${pct} %) is used, not the shelf entry's (${line.shelf.assayPercent} %).`);
        line.assay = pct / 100;
        line.assayPercent = pct;
      }
      i = j + 1;
      continue;
    }
    if (word === 'd' || word === 'density' || word === 'ρ') {
      // `d 1.21 g/mL`, `d 1.21`, `density 1.21 g/cm3`: the label's density, which wins over the table's.
      const num = rest[i + 1];
      const v = num && NUMBER.test(num.text) ? Number(num.text) : NaN;
      if (!(v > 0.3 && v < 3)) {
        d.push(finding('batch-amount', t.start, (num ?? t).end, `A density is written 'd 1.21 g/mL' (g/mL, between 0.3 and 3).`));
        return;
      }
      let j = i + 2;
      if (rest[j] && /^(?:g\/mL|g\/ml|g\/cm3|g\/cm³|kg\/L|kg\/l)$/.test(rest[j].text)) j++;
      line.densityGPerML = v;
      i = j;
      continue;
    }
    if (word === 'from' && stockAllowed) {
      const used = readStock(line, rest, i, context);
      if (used < 0) return;
      i = used;
      continue;
    }
    if (line.reagentUnit?.kind === 'normality' && (ROLES.has(word) || (word === 'as' && ROLES.has(rest[i + 1]?.text.toLowerCase() ?? '')))) {
      if (word === 'as') i++;
      line.role = rest[i].text.toLowerCase() as EquivalentRole;
      i++;
      continue;
    }
    unexpected(i, stockAllowed ? `after it may come an assay ('@ 96%') or a stock ('from 1.5 M', 'from batch "Acid stock"')` : `an assay is written '@ 99.5%'`);
    return;
  }
}

/** `from <value> <unit>` or `from batch "<name>"` at `rest[i]`; the index after it, or −1 after a finding. */
function readStock(line: IngredientLine, rest: Token[], i: number, context: BatchContext): number {
  const d = line.diagnostics;
  const from = rest[i];
  const next = rest[i + 1];
  if (!next) {
    d.push(finding('batch-stock', from.start, from.end, `'from' needs the stock: 'from 1.5 M' or 'from batch "Acid stock"'.`));
    return -1;
  }
  if (next.text.toLowerCase() === 'batch') {
    // The name in quotes, which may hold blanks: joined from the tokens up to the closing quote.
    let j = i + 2;
    let text = rest[j]?.text ?? '';
    while (j + 1 < rest.length && !(text.length > 1 && /["”»']$/.test(text))) text += ' ' + rest[++j].text;
    const m = /^["“«']([^"”»']+)["”»']$/.exec(text);
    if (!m) {
      d.push(finding('batch-stock', from.start, (rest[j] ?? next).end, `A stock batch is named in quotes: 'from batch "Acid stock"'.`));
      return -1;
    }
    const name = m[1].trim();
    const start = from.start;
    const end = rest[j].end;
    const stock = context.stockOf?.(name);
    const ref: StockRef = { kind: 'batch', batch: name, value: null, text: `from batch "${name}"`, start, end };
    line.stock = ref;
    if (!stock) ref.error = `No batch named '${name}' in this document to take the stock from.`;
    else if (stock.volumeL === null) ref.error = `The stock batch '${name}' has no final volume, so it has no concentration to dilute from.`;
    else {
      const hill = line.analysis.hill;
      const anhydrous = anhydrousHillOf(line.analysis);
      const found = stock.ingredients.find((s) => s.hill === hill || s.anhydrousHill === anhydrous);
      if (!found || found.concentrationM === null)
        ref.error = `The stock batch '${name}' has no counted ${line.analysis.display}${stock.ingredients.length ? ` (it has ${stock.ingredients.map((s) => s.formula).join(', ')})` : ''}; a line of it that is not counted, or a stock taken back from this batch, gives no concentration.`;
      else ref.value = found.concentrationM;
    }
    return j + 1;
  }
  // `from 1.5 M`, `from 1.5M`, `from 250 g/L`
  let num = next;
  let unit = rest[i + 2];
  let used = i + 3;
  const glued = splitGlued(next, GLUED_STOCK);
  if (glued) {
    [num, unit] = glued;
    used = i + 2;
  }
  const value = NUMBER.test(num.text) ? Number(num.text) : NaN;
  if (!(value > 0) || !unit) {
    d.push(finding('batch-stock', from.start, (unit ?? next).end, `'from' needs the stock's concentration: 'from 1.5 M' or 'from 250 g/L'.`));
    return -1;
  }
  let unitText = unit.text;
  if (unitText === '%' && rest[used] && /^[wv]\/v$/.test(rest[used].text)) unitText += rest[used++].text;
  const u = unitIn('ingredient', unitText)?.unit ?? reagentUnit(unitText)?.unit ?? unitText;
  line.stock = { kind: 'value', value, unit: u, text: `from ${num.text} ${u}`, start: from.start, end: rest[used - 1].end };
  return used;
}

/** The Hill formula without water of crystallisation (what a stock's concentration is of). */
function anhydrousHillOf(a: FormulaAnalysis): string {
  return anhydrousOf(a)?.hill ?? a.hill;
}
