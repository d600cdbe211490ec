/**
 * The shelf: the lab's reagents as they stand, so that a batch line may name one by its label.
 *
 * Where it is written: a fenced block tagged `shelf` in Markdown, or `shelf` … `end` in a .fnote file
 * (the notes scanner finds the block and hands its body here). One reagent a line:
 *
 *     <label>: <substance> [@ <assay> %] [; <field> <value>]…      # a comment
 *
 *     Acid A:        H2SO4 @ 96 %; density 1.835 g/mL; lot SA-2231; supplier Northwind
 *     Nickel jar 3:  nickel sulfate hexahydrate @ 99.0 %; lot N-0447
 *     Caustic 50:    NaOH @ 50 %; d 1.52 g/mL
 *     Sulfate, dry:  Na2SO4; hydrate 0; grade ACS
 *
 * - label: any text before the first `:` (unique on the shelf, compared without case and spacing);
 * - substance: a formula (`NiSO4·6H2O`) or a name (systematic or shelf name, read by chem/names); the
 *   hydrate form is part of it, or given by the `hydrate` field (a number or a word: `6`, `hexahydrate`);
 * - fields, each after a `;`: `assay <n> %` (also written `@ <n> %` after the substance), `density <n>
 *   g/mL` (or `d`; g/cm3 and kg/L read the same), `lot <text>`, `supplier <text>`, `grade <text>`,
 *   `hydrate <n|word>`, `note <text>`;
 * - `#` starts a comment; blank lines are skipped.
 *
 * Every line that is not read gives a finding at its exact offsets, and nothing on a line is dropped
 * without a word: an unknown field is reported, not ignored.
 */
import { analyseFormula } from '../analyse';
import { readName } from '../names/read';
import { squash, HYDRATE_WORDS } from '../names/words';
import { finding, type ReagentFinding } from './findings';
import { liquidOf } from './liquids';

export interface Span {
  start: number;
  end: number;
}

export interface ShelfEntry {
  label: string;
  labelSpan: Span;
  /** The substance as written, and the formula it was read as (hydrate field applied). */
  substance: { text: string; span: Span; formula: string; hill: string; name?: string; via: 'formula' | 'name'; solution?: boolean };
  assayPercent?: number;
  densityGPerML?: number;
  lot?: string;
  supplier?: string;
  grade?: string;
  note?: string;
  /** The whole line (without its comment). */
  span: Span;
  /** 0-based line within the text given. */
  line: number;
}

export interface Shelf {
  entries: ShelfEntry[];
  findings: ReagentFinding[];
}

const NUMBER = /^[-+]?(?:\d+\.?\d*|\.\d+)$/;

/** Parse a shelf block's body. Offsets are `offset` + the position in `text` (UTF-16 code units). */
export function parseShelf(text: string, offset = 0): Shelf {
  const entries: ShelfEntry[] = [];
  const findings: ReagentFinding[] = [];
  const seen = new Map<string, ShelfEntry>();
  let lineStart = 0;
  let lineNo = 0;
  while (lineStart <= text.length) {
    let lineEnd = text.indexOf('\n', lineStart);
    if (lineEnd < 0) lineEnd = text.length;
    let raw = text.slice(lineStart, lineEnd);
    if (raw.endsWith('\r')) raw = raw.slice(0, -1);
    const hash = raw.indexOf('#');
    const body = hash >= 0 ? raw.slice(0, hash) : raw;
    if (body.trim()) {
      const e = parseLine(body, offset + lineStart, lineNo, findings);
      if (e) {
        const key = squash(e.label);
        const prior = seen.get(key);
        if (prior)
          findings.push(
            finding(
              'shelf-duplicate',
              'warning',
              `The label '${e.label}' is on the shelf twice (line ${prior.line + 1}): batch lines take the first.`,
              e.labelSpan.start,
              e.labelSpan.end,
            ),
          );
        else seen.set(key, e);
        entries.push(e);
      }
    }
    lineStart = lineEnd + 1;
    lineNo++;
  }
  return { entries, findings };
}

/** Trimmed piece of `s` from `a` to `b`, with its absolute span. */
function piece(s: string, a: number, b: number, base: number): { text: string; span: Span } {
  while (a < b && /\s/.test(s[a])) a++;
  while (b > a && /\s/.test(s[b - 1])) b--;
  return { text: s.slice(a, b), span: { start: base + a, end: base + b } };
}

function parseLine(body: string, base: number, line: number, findings: ReagentFinding[]): ShelfEntry | undefined {
  const whole = piece(body, 0, body.length, base);
  const colon = body.indexOf(':');
  if (colon < 0) {
    findings.push(
      finding(
        'shelf-syntax',
        'error',
        `A shelf line is '<label>: <substance> [@ <assay> %] [; <field> <value>]…'; this one has no ':' after its label.`,
        whole.span.start,
        whole.span.end,
      ),
    );
    return undefined;
  }
  const label = piece(body, 0, colon, base);
  if (!label.text) {
    findings.push(finding('shelf-syntax', 'error', 'The label before the colon is empty.', base + colon, base + colon + 1));
    return undefined;
  }
  // Fields after ';'.
  const cuts: number[] = [];
  for (let i = colon + 1; i < body.length; i++) if (body[i] === ';') cuts.push(i);
  const firstEnd = cuts.length ? cuts[0] : body.length;
  // The substance, with an optional `@ <assay> %`.
  let subEnd = firstEnd;
  let assayPercent: number | undefined;
  const at = body.lastIndexOf('@', firstEnd - 1);
  if (at > colon) {
    const assay = piece(body, at + 1, firstEnd, base);
    const value = readPercent(assay.text);
    if (value === undefined)
      findings.push(finding('shelf-syntax', 'error', `After '@' comes the assay in percent ('@ 96 %'), not '${assay.text}'.`, base + at, assay.span.end));
    else if (!(value > 0 && value <= 100))
      findings.push(finding('shelf-syntax', 'error', `An assay of ${value} % is outside 0–100 %.`, assay.span.start, assay.span.end));
    else assayPercent = value;
    subEnd = at;
  }
  const sub = piece(body, colon + 1, subEnd, base);
  if (!sub.text) {
    findings.push(finding('shelf-syntax', 'error', `'${label.text}' names no substance after the colon.`, label.span.start, whole.span.end));
    return undefined;
  }
  const fields: Partial<ShelfEntry> & { hydrate?: number } = {};
  let hydrateSpan: Span | undefined;
  for (let k = 0; k < cuts.length; k++) {
    const f = piece(body, cuts[k] + 1, k + 1 < cuts.length ? cuts[k + 1] : body.length, base);
    if (!f.text) continue;
    const m = /^(\S+)\s*(.*)$/.exec(f.text) as RegExpExecArray;
    const key = m[1].toLowerCase();
    const value = m[2].trim();
    const bad = (message: string) => findings.push(finding('shelf-syntax', 'error', message, f.span.start, f.span.end));
    if (!value) {
      bad(`The field '${m[1]}' has no value.`);
      continue;
    }
    switch (key) {
      case 'assay': {
        const v = readPercent(value);
        if (v === undefined || !(v > 0 && v <= 100)) bad(`An assay is a percentage within 0–100 % ('assay 96 %'), not '${value}'.`);
        else if (assayPercent !== undefined && assayPercent !== v) bad(`The assay is given twice (${assayPercent} % and ${v} %).`);
        else assayPercent = v;
        break;
      }
      case 'density':
      case 'd': {
        const dm = /^((?:\d+\.?\d*|\.\d+))\s*(g\/mL|g\/ml|g\/cm3|g\/cm³|kg\/L|kg\/l)?$/.exec(value);
        const v = dm ? Number(dm[1]) : NaN;
        if (!dm || !(v > 0.3 && v < 5)) bad(`A density is written 'density 1.84 g/mL' (0.3–5 g/mL), not '${value}'.`);
        else fields.densityGPerML = v;
        break;
      }
      case 'lot':
        fields.lot = value;
        break;
      case 'supplier':
        fields.supplier = value;
        break;
      case 'grade':
        fields.grade = value;
        break;
      case 'note':
        fields.note = value;
        break;
      case 'hydrate': {
        const word = HYDRATE_WORDS.find(([w]) => w === value.toLowerCase())?.[1];
        const n = NUMBER.test(value) ? Number(value) : value.toLowerCase() === 'anhydrous' ? 0 : word;
        if (n === undefined || !(n >= 0 && n <= 20)) bad(`'hydrate' takes the number of water molecules (0–20) or a word (hexahydrate), not '${value}'.`);
        else {
          fields.hydrate = n;
          hydrateSpan = f.span;
        }
        break;
      }
      default:
        bad(`'${m[1]}' is not a shelf field (assay, density, lot, supplier, grade, hydrate, note).`);
    }
  }
  const substance = readSubstance(sub.text, sub.span, fields.hydrate, hydrateSpan, findings);
  if (!substance) return undefined;
  if (assayPercent === undefined && fields.densityGPerML === undefined) {
    const liquid = liquidOf(analyseFormula(substance.formula));
    const needs = substance.solution || (liquid?.kind === 'aqueous' && !liquid.table.pureLiquid);
    if (needs)
      findings.push(
        finding(
          'assay-needed',
          'warning',
          `'${sub.text}' is sold as a solution: give its assay ('@ 37 %') so that batch lines can pour it${liquid?.kind === 'aqueous' ? ` (commercial ${liquid.table.commercial})` : ''}.`,
          sub.span.start,
          sub.span.end,
        ),
      );
  }
  const e: ShelfEntry = { label: label.text, labelSpan: label.span, substance, span: whole.span, line };
  if (assayPercent !== undefined) e.assayPercent = assayPercent;
  for (const k of ['densityGPerML', 'lot', 'supplier', 'grade', 'note'] as const)
    if (fields[k] !== undefined) (e as unknown as Record<string, unknown>)[k] = fields[k];
  return e;
}

function readPercent(text: string): number | undefined {
  const m = /^((?:\d+\.?\d*|\.\d+))\s*%?$/.exec(text.trim());
  return m ? Number(m[1]) : undefined;
}

/** A substance written as a formula or a name, with the hydrate field applied. */
function readSubstance(
  text: string,
  span: Span,
  hydrate: number | undefined,
  hydrateSpan: Span | undefined,
  findings: ReagentFinding[],
): ShelfEntry['substance'] | undefined {
  const looksLikeName = /\s/.test(text) || /^[a-z]{3,}$/.test(text) || /^[A-Z][a-z]{3,}/.test(text);
  let formula: string | undefined;
  let name: string | undefined;
  let via: 'formula' | 'name' = 'formula';
  let solution = false;
  if (!looksLikeName) {
    const a = analyseFormula(text);
    if (a.ok && !a.diagnostics.some((d) => d.severity === 'error')) formula = text;
  }
  // A formula followed by `solution` (`NaOH solution`): the formula.
  const solutionOf = /^(\S+)\s+solution$/i.exec(text)?.[1];
  if (!formula && solutionOf) {
    const a = analyseFormula(solutionOf);
    if (a.ok && !a.diagnostics.some((d) => d.severity === 'error')) {
      formula = solutionOf;
      solution = true;
    }
  }
  if (!formula) {
    const r = readName(text);
    if (r.status !== 'exact') {
      findings.push(finding('shelf-substance', r.status === 'unknown' ? 'error' : 'warning', r.message ?? `'${text}' is not read.`, span.start, span.end));
      return undefined;
    }
    formula = r.formula as string;
    name = r.name;
    via = 'name';
    solution = !!r.solution;
  }
  if (hydrate !== undefined) {
    const a = analyseFormula(formula);
    const parts = a.formula?.parts ?? [];
    const written = parts.slice(1).reduce((s, p) => s + p.multiplier, 0);
    if (parts.length > 1 && written !== hydrate) {
      findings.push(
        finding(
          'shelf-syntax',
          'error',
          `The substance has ${written} H2O but the hydrate field says ${hydrate}.`,
          hydrateSpan?.start ?? span.start,
          hydrateSpan?.end ?? span.end,
        ),
      );
      return undefined;
    }
    if (parts.length === 1 && hydrate > 0) formula = `${formula}·${hydrate === 1 ? '' : hydrate}H2O`;
  }
  const out: ShelfEntry['substance'] = { text, span, formula, hill: analyseFormula(formula).hill, via };
  if (name) out.name = name;
  if (solution) out.solution = true;
  return out;
}

/** The shelf entry a batch line names by `label` (case and spacing ignored); the first where two share it. */
export function shelfEntry(shelf: Shelf, label: string): ShelfEntry | undefined {
  const key = squash(label);
  return shelf.entries.find((e) => squash(e.label) === key);
}

/**
 * The shelf label a batch line begins with (`Acid A 10 mL`, `"Nickel jar 3" 25 g`): the longest label
 * that the line's first words spell (case and spacing ignored; quotes around the label allowed), and
 * where it ends in the line. Undefined where no label matches.
 */
export function labelAtStart(shelf: Shelf, line: string): { entry: ShelfEntry; start: number; end: number } | undefined {
  const lead = line.length - line.trimStart().length;
  const quote = line[lead] === '"' ? line.indexOf('"', lead + 1) : -1;
  if (quote > lead) {
    const entry = shelfEntry(shelf, line.slice(lead + 1, quote));
    return entry ? { entry, start: lead, end: quote + 1 } : undefined;
  }
  // Word ends, then the longest prefix of words that is a label.
  const ends: number[] = [];
  const re = /\S+/g;
  re.lastIndex = lead;
  let m: RegExpExecArray | null;
  while ((m = re.exec(line)) && ends.length < 8) ends.push(m.index + m[0].length);
  for (let k = ends.length; k >= 1; k--) {
    const entry = shelfEntry(shelf, line.slice(lead, ends[k - 1]));
    if (entry) return { entry, start: lead, end: ends[k - 1] };
  }
  return undefined;
}
