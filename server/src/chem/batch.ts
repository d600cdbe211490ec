/**
 * Batch arithmetic: a batch block's lines → per-ingredient moles, mass to weigh, concentration and mass
 * fraction; the ions of strong electrolytes, the ionic strength I = ½ Σ cᵢ zᵢ² and the net charge.
 *
 * Lines (each may end in a `#` comment):
 *   name: Rinse buffer R-7
 *   volume: 500 mL          final volume (L, mL, µL)
 *   total: 250 g            total mass of the batch, for wt% targets
 *   <formula> <number> <unit> [@ <assay>%]
 * Units: g mg µg kg (mass weighed), mol mmol µmol (amount: the tool computes the mass), M mM µM (target
 * concentration in the final volume), wt% (mass fraction of the total). An assay (`@ 99.5%`) says how much
 * of what is weighed is the substance: the mass to weigh is divided by it.
 *
 * One rule for lines in error: a line with any error (its formula, amount, unit, assay, or a target the
 * batch cannot resolve) is not counted. It is listed in `skipped` with the reason, its diagnostics stay on
 * its exact characters, and the cautions of its formula, where the formula is readable, still apply.
 * A header given twice: the first one that can be read counts; the later one is flagged and skipped.
 *
 * Model: every salt is taken as fully dissolved and dissociated into the ions of its formula; the ions are
 * not protonated or deprotonated further. Strong acids give up their first proton (H2SO4 → H⁺ + HSO₄⁻).
 * Weak acids and bases and molecular substances stay undissociated. Activities are not modelled.
 *
 * Solubility (an estimate): where a final volume is given, the water is taken as the final volume at
 * 1 g/mL less the dissolved mass (anhydrous: a hydrate's water counts as solvent), and each ingredient of
 * the solubility table (data/solubility.ts) is compared with its solubility in water at 20 or 25 °C.
 */
import { analyseFormula, type FormulaAnalysis } from './analyse';
import { cautionsFor, type Caution } from './cautions';
import { PRACTICALLY_INSOLUBLE_BELOW, SOLUBILITY, type SolubilityRow } from './data/solubility';
import { shiftDiagnostic, type ChemDiagnostic, type DiagnosticCode } from './diagnostic';
import { formulaAtoms, hillFormula, molarMass, partAtoms, subscriptDigits, type AtomCounts } from './formula/compute';
import { parseFormula } from './formula/parse';
import { joinSpacedAdduct } from './formula/spaced';
import { electrolyteIons } from './ions/dissociation';
import type { ChemSettings } from './settings';
import { DEFAULT_CHEM_SETTINGS } from './settings';

export interface BatchLine {
  text: string;
  /** Offset of the line's first character in the document. */
  start: number;
}

export type AmountUnit = 'g' | 'mg' | 'µg' | 'kg' | 'mol' | 'mmol' | 'µmol' | 'M' | 'mM' | 'µM' | 'wt%';

export interface IonShare {
  ion: string;
  /** ASCII form with caret charge (`SO4^2-`), the key ions are summed by. */
  key: string;
  charge: number;
  count: number;
}

/** An ingredient compared with its solubility in water (an estimate; see the module comment). */
export interface SolubilityCheck {
  /** The anhydrous substance compared, typeset (`CuSO₄`). */
  salt: string;
  row: SolubilityRow;
  /** Grams of the anhydrous substance in the batch. */
  anhydrousG: number;
  /** Estimated grams of it per 100 g water in the batch; null where the estimate leaves no water. */
  per100gWater: number | null;
  exceeds: boolean;
}

export interface Ingredient {
  formulaText: string;
  formula: string;
  analysis: FormulaAnalysis;
  lineStart: number;
  lineEnd: number;
  formulaStart: number;
  formulaEnd: number;
  amount: { value: number; unit: AmountUnit; text: string; start: number; end: number };
  /** Fraction 0–1 of what is weighed that is the substance. */
  assay: number;
  molarMass: number;
  moles: number | null;
  /** Mass to weigh, g (assay included). */
  massG: number | null;
  concentrationM: number | null;
  /** Share 0–1 of the weighed mass (the counted ingredients), with or without `total:`. */
  massFraction: number | null;
  /** Share 0–1 of the batch's `total:` mass; null where no total is given. */
  fractionOfTotal: number | null;
  ions: IonShare[];
  /** Why it is not split into ions, when it is not. */
  undissociated?: string;
  cautions: Caution[];
  /** Where the substance is in the solubility table and the batch has a final volume. */
  solubility?: SolubilityCheck;
}

/** A line of the block that is not counted, and why. */
export interface SkippedLine {
  kind: 'ingredient' | 'header';
  /** The line as written (without the blanks around it). */
  text: string;
  /** Absolute offsets of `text`. */
  lineStart: number;
  lineEnd: number;
  /** Why it is not counted: the messages of its errors (or of the warning that set it aside). */
  reason: string;
  /** Code of the first finding that set it aside. */
  code: DiagnosticCode;
  /** The formula as written on an ingredient line, with its offsets. */
  formulaText?: string;
  formulaStart?: number;
  formulaEnd?: number;
  /** The formula's analysis where it is readable: its cautions still apply. */
  analysis?: FormulaAnalysis;
  cautions: Caution[];
}

export interface BatchIon {
  ion: string;
  key: string;
  charge: number;
  concentrationM: number;
}

export interface BatchAnalysis {
  name: string | null;
  volumeL: number | null;
  totalMassG: number | null;
  /** The counted ingredient lines, in order. */
  ingredients: Ingredient[];
  /** Every other non-blank line that was not counted, in order; a batch with any is incomplete. */
  skipped: SkippedLine[];
  ions: BatchIon[];
  ionicStrengthM: number | null;
  netChargeEqPerL: number | null;
  /** Estimated grams of water (final volume × 1 g/mL less the dissolved mass); null without a volume. */
  waterG: number | null;
  diagnostics: ChemDiagnostic[];
  cautions: Caution[];
  notes: string[];
}

const MASS: Record<string, number> = { g: 1, mg: 1e-3, µg: 1e-6, ug: 1e-6, kg: 1e3 };
const MOLES: Record<string, number> = { mol: 1, mmol: 1e-3, µmol: 1e-6, umol: 1e-6 };
const CONC: Record<string, number> = { M: 1, mM: 1e-3, µM: 1e-6, uM: 1e-6, 'mol/L': 1, 'mmol/L': 1e-3 };
const VOLUME: Record<string, number> = { L: 1, l: 1, mL: 1e-3, ml: 1e-3, µL: 1e-6, uL: 1e-6 };
const MASS_TOTAL: Record<string, number> = { g: 1, kg: 1e3, mg: 1e-3 };
const NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const MAX_AMOUNT = 1e9;

interface Token {
  text: string;
  start: number;
  end: number;
}

function tokens(line: string, base: number): Token[] {
  const out: Token[] = [];
  const re = /\S+/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(line))) out.push({ text: m[0], start: base + m.index, end: base + m.index + m[0].length });
  return out;
}

function err(code: DiagnosticCode, start: number, end: number, message: string, severity: ChemDiagnostic['severity'] = 'error'): ChemDiagnostic {
  return { code, severity, start, end, message };
}

const dissociated = new WeakMap<FormulaAnalysis, { ions: IonShare[]; undissociated?: string }>();

/** Ions of a strong electrolyte, or why it stays whole (memoised per analysis; read-only). */
export function dissociate(a: FormulaAnalysis): { ions: IonShare[]; undissociated?: string } {
  let hit = dissociated.get(a);
  if (!hit) dissociated.set(a, (hit = electrolyteIons(a)));
  return hit;
}

// ── reading the lines ─────────────────────────────────────────────────────

/** An ingredient line as read, before the batch's volume and total are known. */
interface PendingLine {
  raw: { text: string; start: number; end: number };
  formula: Token;
  analysis: FormulaAnalysis;
  amount?: Token;
  unit?: Token;
  value: number;
  assay: number;
  lineStart: number;
  lineEnd: number;
  /** This line's findings (absolute offsets). */
  diagnostics: ChemDiagnostic[];
}

type HeaderKey = 'name' | 'volume' | 'total';

/** A `volume:` or `total:` value, or the finding that says why it cannot be read. */
function readHeaderValue(key: 'volume' | 'total', value: string, valueStart: number, lineStart: number, lineEnd: number): { value: number } | { error: ChemDiagnostic } {
  const tk = tokens(value, valueStart);
  const table = key === 'volume' ? VOLUME : MASS_TOTAL;
  const unitsList = key === 'volume' ? 'L, mL or µL' : 'g or kg';
  if (tk.length === 0) return { error: err('batch-amount', lineStart, lineEnd, `'${key}:' needs a number and a unit (${unitsList}).`) };
  let num = tk[0].text;
  let unit = tk[1]?.text;
  const glued = /^([0-9.eE+-]+)([A-Za-zµ]+)$/.exec(num);
  if (glued && !unit) {
    num = glued[1];
    unit = glued[2];
  }
  const v = NUMBER.test(num) ? Number(num) : NaN;
  if (!(v > 0) || v > MAX_AMOUNT) return { error: err('batch-amount', tk[0].start, tk[0].end, `'${tk[0].text}' is not a positive number.`) };
  if (!unit || !(unit in table)) {
    const u = tk[1] ?? tk[0];
    return { error: err('batch-unit', u.start, u.end, unit ? `Unknown unit '${unit}' for ${key}; use ${unitsList}.` : `'${key}:' needs a unit (${unitsList}).`) };
  }
  if (tk.length > 2) {
    const extra = tk.slice(2);
    return { error: err('batch-syntax', extra[0].start, extra[extra.length - 1].end, `Unexpected '${extra.map((t) => t.text).join(' ')}' after the ${key}.`) };
  }
  return { value: v * table[unit] };
}

const UNIT_ALIASES: Record<string, string> = { '%w/w': 'wt%', '%': 'wt%', ug: 'µg', umol: 'µmol', uM: 'µM', 'mol/L': 'M', 'mmol/L': 'mM' };

/** An ingredient line (`text` without its comment, starting at offset `base`): its formula (always analysed, for its findings and cautions), amount, unit and assay. */
function readIngredient(raw: PendingLine['raw'], text: string, base: number, lineStart: number, lineEnd: number, settings: ChemSettings): PendingLine {
  // A hydrate written with spaces around its dot (`CuSO4 · 5H2O`) is one formula, as on a card.
  const tk = joinSpacedAdduct(tokens(text, base), text, base);
  const [formula, amount, unitTok, ...rest] = tk;
  const analysis = analyseFormula(formula.text, settings);
  const diagnostics: ChemDiagnostic[] = [];
  for (const d of analysis.diagnostics) if (d.severity !== 'information') diagnostics.push(shiftDiagnostic(d, formula.start));
  const p: PendingLine = { raw, formula, analysis, value: NaN, assay: 1, lineStart, lineEnd, diagnostics };
  if (!amount) {
    diagnostics.push(err('batch-amount', formula.start, formula.end, `'${formula.text}' needs an amount and a unit, e.g. '${formula.text} 5.0 g'.`));
    return p;
  }
  let amountTok = amount;
  let unit = unitTok;
  const glued = /^((?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)((?:wt)?%|[A-Za-zµ/]+)$/.exec(amount.text);
  if (glued && (!unitTok || unitTok.text.startsWith('@'))) {
    amountTok = { text: glued[1], start: amount.start, end: amount.start + glued[1].length };
    unit = { text: glued[2], start: amountTok.end, end: amount.end };
    if (unitTok) rest.unshift(unitTok);
  }
  p.amount = amountTok;
  const value = NUMBER.test(amountTok.text) ? Number(amountTok.text) : NaN;
  if (/^\d*(?:H2O|H₂O)$/.test(amount.text)) {
    diagnostics.push(err('batch-amount', amount.start, amount.end, `'${amount.text}' after the formula reads as the amount; write the hydrate as one formula, e.g. '${formula.text}·${amount.text}' or '${formula.text}.${amount.text}'.`));
    return p;
  }
  if (!Number.isFinite(value) || value <= 0 || value > MAX_AMOUNT) {
    diagnostics.push(err('batch-amount', amountTok.start, amountTok.end, Number.isFinite(value) && value > MAX_AMOUNT ? `Amount ${amountTok.text} is beyond the limit of ${MAX_AMOUNT}.` : `'${amountTok.text}' is not a positive number.`));
    return p;
  }
  p.value = value;
  if (!unit) {
    diagnostics.push(err('batch-unit', amountTok.start, amountTok.end, `'${amountTok.text}' needs a unit: g, mg, kg, mol, mmol, M, mM or wt%.`));
    return p;
  }
  const unitText = UNIT_ALIASES[unit.text] ?? unit.text;
  if (!(unitText in MASS) && !(unitText in MOLES) && !(unitText in CONC) && unitText !== 'wt%') {
    const hint = unitText in VOLUME ? ' A volume of a liquid needs its density; give the mass or the amount instead.' : '';
    diagnostics.push(err('batch-unit', unit.start, unit.end, `Unknown unit '${unit.text}'; use g, mg, kg, mol, mmol, M, mM or wt%.${hint}`));
    return p;
  }
  p.unit = { ...unit, text: unitText };
  if (rest.length) {
    const restText = rest.map((r) => r.text).join(' ');
    const m = /^@\s*((?:\d+(?:\.\d*)?|\.\d+))\s*%$/.exec(restText);
    const r0 = rest[0];
    const rl = rest[rest.length - 1];
    if (!m) diagnostics.push(err('batch-syntax', r0.start, rl.end, `Unexpected '${restText}' after the amount; an assay is written '@ 99.5%'.`));
    else {
      const pct = Number(m[1]);
      if (!(pct > 0 && pct <= 100)) diagnostics.push(err('batch-amount', r0.start, rl.end, `Assay ${m[1]} % must be above 0 and at most 100.`));
      else p.assay = pct / 100;
    }
  }
  return p;
}

/** Moles and mass to weigh of a line, once the volume and total are known; a target that cannot be met is an error on the line. */
function amountsOf(p: PendingLine, M: number, volumeL: number | null, totalMassG: number | null): { moles: number; massG: number } | null {
  const u = (p.unit as Token).text;
  const amount = p.amount as Token;
  const unitEnd = (p.unit as Token).end;
  if (u in MASS) {
    const massG = p.value * MASS[u];
    return { massG, moles: (massG * p.assay) / M };
  }
  if (u in MOLES) {
    const moles = p.value * MOLES[u];
    return { moles, massG: (moles * M) / p.assay };
  }
  if (u in CONC) {
    if (volumeL === null) {
      p.diagnostics.push(err('batch-no-volume', amount.start, unitEnd, `A target concentration needs the batch's final volume: add a line 'volume: 500 mL'.`));
      return null;
    }
    const moles = p.value * CONC[u] * volumeL;
    return { moles, massG: (moles * M) / p.assay };
  }
  if (totalMassG === null) {
    p.diagnostics.push(err('batch-no-total', amount.start, unitEnd, `A wt% target needs the batch's total mass: add a line 'total: 250 g'.`));
    return null;
  }
  if (p.value > 100) {
    p.diagnostics.push(err('batch-amount', amount.start, unitEnd, `${p.value} wt% is more than the whole batch.`));
    return null;
  }
  const substance = (p.value / 100) * totalMassG;
  return { moles: substance / M, massG: substance / p.assay };
}

/** The reason a line is set aside: its error messages, in order. */
function reasonOf(diagnostics: readonly ChemDiagnostic[]): { reason: string; code: DiagnosticCode } {
  const errors = diagnostics.filter((d) => d.severity === 'error').sort((a, b) => a.start - b.start);
  const list = errors.length ? errors : diagnostics;
  return { reason: [...new Set(list.map((d) => d.message))].join(' '), code: list[0]?.code ?? 'batch-syntax' };
}

function skippedIngredient(p: PendingLine, fallback?: ChemDiagnostic): SkippedLine {
  const { reason, code } = fallback ? { reason: fallback.message, code: fallback.code } : reasonOf(p.diagnostics);
  const readable = p.analysis.ok && p.analysis.molarMass ? p.analysis : undefined;
  return {
    kind: 'ingredient', text: p.raw.text, lineStart: p.raw.start, lineEnd: p.raw.end, reason, code,
    formulaText: p.formula.text, formulaStart: p.formula.start, formulaEnd: p.formula.end,
    ...(readable ? { analysis: readable } : {}), cautions: readable ? cautionsFor(readable) : [],
  };
}

// ── solubility ────────────────────────────────────────────────────────────

const WATER_MOLAR_MASS = molarMass({ H: 2, O: 1 }).value;
let solubilityIndex: Map<string, SolubilityRow> | null = null;

/** The solubility table by the Hill formula of each anhydrous substance (built on first use). */
function solubilityRow(hill: string): SolubilityRow | undefined {
  if (!solubilityIndex) {
    solubilityIndex = new Map();
    for (const row of SOLUBILITY) {
      const parsed = parseFormula(row.formula);
      if (parsed.ok && parsed.formula) solubilityIndex.set(hillFormula(formulaAtoms(parsed.formula)), row);
    }
  }
  return solubilityIndex.get(hill);
}

/** The anhydrous part of a formula: its atoms less the water of crystallisation, and that water per formula unit. */
export function anhydrousOf(a: FormulaAnalysis): { atoms: AtomCounts; hill: string; molarMass: number; water: number } | null {
  if (!a.ok || !a.formula || a.charge !== 0) return null;
  let water = 0;
  a.formula.parts.forEach((part, k) => {
    if (k === 0) return;
    const at = partAtoms(part);
    const keys = Object.keys(at);
    if (keys.length === 2 && at.O > 0 && at.H === 2 * at.O) water += at.O;
  });
  const atoms: AtomCounts = { ...a.atoms };
  if (water) {
    atoms.H -= 2 * water;
    atoms.O -= water;
    for (const el of Object.keys(atoms)) if (Math.abs(atoms[el]) < 1e-9) delete atoms[el];
  }
  if (Object.keys(atoms).length === 0) return null;
  return { atoms, hill: hillFormula(atoms), molarMass: molarMass(atoms).value, water };
}

const fmt = (x: number) => (x >= 100 ? String(Math.round(x)) : String(Number(x.toPrecision(3))));
const ESTIMATE = 'Estimate: water ≈ final volume × 1 g/mL less the dissolved mass';

/**
 * Compare each counted ingredient of the solubility table with its solubility in the estimated water of
 * the batch, and warn (`batch-solubility`, on the amount) where it is exceeded. Returns the water estimate.
 */
function checkSolubility(ingredients: Ingredient[], volumeL: number | null, diagnostics: ChemDiagnostic[]): number | null {
  if (volumeL === null) return null;
  const solutionG = volumeL * 1000;
  const parts = ingredients.map((i) => {
    const an = i.moles === null || i.massG === null || i.analysis.hill === 'H2O' ? null : anhydrousOf(i.analysis);
    // Everything weighed dissolves into the solution except the hydrate water, which joins the solvent.
    const dissolved = i.massG === null || i.analysis.hill === 'H2O' ? 0 : Math.max(0, i.massG - (an ? (i.moles as number) * an.water * WATER_MOLAR_MASS : 0));
    return { i, an, dissolved };
  });
  const dissolvedG = parts.reduce((s, x) => s + x.dissolved, 0);
  const waterG = solutionG - dissolvedG;
  const estimate = `${ESTIMATE} (${fmt(Math.max(waterG, 0))} g of water in ${fmt(solutionG)} mL, with ${fmt(dissolvedG)} g dissolved).`;
  let warned = false;
  for (const { i, an } of parts) {
    if (!an) continue;
    const row = solubilityRow(an.hill);
    if (!row) continue;
    const salt = subscriptDigits(row.formula);
    const anhydrousG = (i.moles as number) * an.molarMass;
    const per100 = waterG > 0 ? (anhydrousG / waterG) * 100 : null;
    const exceeds = per100 === null || per100 > row.gPer100gWater;
    i.solubility = { salt, row, anhydrousG, per100gWater: per100, exceeds };
    if (!exceeds) continue;
    warned = true;
    const basis = an.water ? ' (anhydrous; the hydrate water is counted as solvent)' : '';
    const sol = `${fmt(row.gPer100gWater)} g per 100 g water at ${row.temperatureC} °C`;
    const rescue = row.gPer100gWater < 1 ? ' unless another ingredient dissolves it (an acid or a complexing agent)' : '';
    let message: string;
    if (per100 === null) {
      message = `${salt}: the dissolved mass (${fmt(dissolvedG)} g) is more than the ${fmt(solutionG)} mL final volume can hold at about 1 g/mL, so no water is left to dissolve it; ${salt} dissolves to ${sol}. ${ESTIMATE}.`;
    } else {
      const undissolved = anhydrousG - (row.gPer100gWater * waterG) / 100;
      const head = row.gPer100gWater < PRACTICALLY_INSOLUBLE_BELOW
        ? `${salt} is practically insoluble in water (${sol}): about ${fmt(undissolved)} g of the ${fmt(anhydrousG)} g${basis} would stay undissolved${rescue}.`
        : `${salt}: about ${fmt(per100)} g per 100 g water${basis}, above its solubility of ${sol}: about ${fmt(undissolved)} g would not dissolve${rescue}.`;
      // Where even all of the final volume as water would hold it, the estimate of the water decides.
      const near = (anhydrousG / solutionG) * 100 <= row.gPer100gWater ? ' Near saturation: a denser solution holds more water than this estimate, so it may still dissolve.' : '';
      message = `${head} ${estimate}${near}`;
    }
    diagnostics.push({ code: 'batch-solubility', severity: 'warning', start: i.amount.start, end: i.amount.end, message, data: { salt: row.formula, solubility: row.gPer100gWater, temperatureC: row.temperatureC, per100gWater: per100 } });
  }
  if (waterG <= 0 && !warned && parts.length) {
    const big = parts.reduce((a, b) => (b.dissolved > a.dissolved ? b : a));
    diagnostics.push({
      code: 'batch-solubility', severity: 'warning', start: big.i.amount.start, end: big.i.amount.end,
      message: `The dissolved mass (${fmt(dissolvedG)} g) is more than the ${fmt(solutionG)} mL final volume can hold at about 1 g/mL: no water is left to dissolve it. ${ESTIMATE}.`,
    });
  }
  return waterG;
}

// ── the batch ─────────────────────────────────────────────────────────────

/** Analyse a batch block's lines. Offsets in diagnostics are absolute (the lines carry their offsets). */
export function analyseBatch(lines: BatchLine[], openName: string | null = null, settings: ChemSettings = DEFAULT_CHEM_SETTINGS): BatchAnalysis {
  const diagnostics: ChemDiagnostic[] = [];
  /** Findings, counted ingredients and set-aside lines, in the order of the lines. */
  const order: Array<{ pending?: PendingLine; skipped?: SkippedLine }> = [];
  let name: string | null = openName;
  let volumeL: number | null = null;
  let totalMassG: number | null = null;
  let totalRange: { start: number; end: number } | null = null;
  /** Headers read so far (the first readable one counts). */
  const counted = new Set<HeaderKey>(openName ? ['name'] : []);

  for (const { text: raw, start } of lines) {
    const hash = raw.indexOf('#');
    const text = hash >= 0 ? raw.slice(0, hash) : raw;
    const trimmed = text.trim();
    if (trimmed === '') continue;
    const lineStart = start + (text.length - text.trimStart().length);
    const lineEnd = start + text.trimEnd().length;
    const rawLine = { text: raw.trim(), start: start + (raw.length - raw.trimStart().length), end: start + raw.trimEnd().length };
    const header = /^(name|volume|total)\s*:\s*(.*)$/i.exec(trimmed);
    if (!header) {
      order.push({ pending: readIngredient(rawLine, text, start, lineStart, lineEnd, settings) });
      continue;
    }
    const key = header[1].toLowerCase() as HeaderKey;
    const setAside = (d: ChemDiagnostic) => {
      diagnostics.push(d);
      order.push({ skipped: { kind: 'header', text: rawLine.text, lineStart: rawLine.start, lineEnd: rawLine.end, reason: d.message, code: d.code, cautions: [] } });
    };
    if (counted.has(key)) {
      const message = key === 'name' && name === openName && openName !== null
        ? `This batch is already named '${openName}' on its opening line; the first name counts.`
        : `'${key}:' is given twice; the first one counts.`;
      setAside(err('batch-header', lineStart, lineEnd, message, 'warning'));
      continue;
    }
    const valueText = header[2].trim();
    if (key === 'name') {
      if (valueText) {
        name = valueText;
        counted.add(key);
      }
      continue;
    }
    const valueStart = lineStart + trimmed.length - header[2].length;
    const read = readHeaderValue(key, header[2], valueStart, lineStart, lineEnd);
    if ('error' in read) {
      setAside(read.error);
      continue;
    }
    counted.add(key);
    if (key === 'volume') volumeL = read.value;
    else {
      totalMassG = read.value;
      totalRange = { start: valueStart, end: valueStart + header[2].trimEnd().length };
    }
  }

  const ingredients: Ingredient[] = [];
  const skipped: SkippedLine[] = [];
  for (const o of order) {
    if (o.skipped) {
      skipped.push(o.skipped);
      continue;
    }
    const p = o.pending as PendingLine;
    const a = p.analysis;
    const readable = p.unit !== undefined && !p.diagnostics.some((d) => d.severity === 'error');
    const M = a.molarMass?.value;
    const amounts = readable && a.ok && M ? amountsOf(p, M, volumeL, totalMassG) : null;
    diagnostics.push(...p.diagnostics);
    if (!amounts || p.diagnostics.some((d) => d.severity === 'error')) {
      const fallback = p.diagnostics.some((d) => d.severity === 'error') ? undefined : err('malformed-formula', p.formula.start, p.formula.end, `'${p.formula.text}' has no molar mass.`);
      if (fallback) diagnostics.push(fallback);
      skipped.push(skippedIngredient(p, fallback));
      continue;
    }
    const d = dissociate(a);
    const unit = p.unit as Token;
    const amount = p.amount as Token;
    ingredients.push({
      formulaText: p.formula.text, formula: a.display, analysis: a, lineStart: p.lineStart, lineEnd: p.lineEnd,
      formulaStart: p.formula.start, formulaEnd: p.formula.end,
      amount: { value: p.value, unit: unit.text as AmountUnit, text: `${amount.text} ${unit.text}`, start: amount.start, end: unit.end },
      assay: p.assay, molarMass: M as number, moles: amounts.moles, massG: amounts.massG,
      concentrationM: volumeL ? amounts.moles / volumeL : null,
      massFraction: null, fractionOfTotal: null, ions: d.ions, ...(d.undissociated ? { undissociated: d.undissociated } : {}), cautions: cautionsFor(a),
    });
  }
  const totalWeighed = ingredients.reduce((s, i) => s + (i.massG ?? 0), 0);
  for (const i of ingredients) {
    i.massFraction = i.massG !== null && totalWeighed > 0 ? i.massG / totalWeighed : null;
    i.fractionOfTotal = i.massG !== null && totalMassG !== null ? i.massG / totalMassG : null;
  }

  if (totalMassG !== null && totalRange && totalWeighed > totalMassG * (1 + 1e-9)) {
    diagnostics.push(err('batch-total', totalRange.start, totalRange.end, `The ingredients weigh ${fmt(totalWeighed)} g, more than the batch's total of ${fmt(totalMassG)} g; the shares of the total add up to ${fmt((totalWeighed / totalMassG) * 100)} %.`, 'warning'));
  }
  const mix = ionsOf(ingredients, volumeL, diagnostics);
  const waterG = checkSolubility(ingredients, volumeL, diagnostics);
  const notes = ['Salts are taken as fully dissolved and dissociated; weak acids and bases are treated as undissociated; activities are not modelled.'];
  if (volumeL === null && ingredients.length) notes.push('No final volume given: concentrations and ionic strength are not computed.');
  diagnostics.sort((x, y) => x.start - y.start);
  return { name, volumeL, totalMassG, ingredients, skipped, ...mix, waterG, diagnostics, cautions: batchCautions(ingredients, skipped), notes };
}

/** The ions of the whole mix, the ionic strength and the net charge (with a warning for ions listed on their own that do not balance). */
function ionsOf(ingredients: readonly Ingredient[], volumeL: number | null, diagnostics: ChemDiagnostic[]) {
  const ionMap = new Map<string, BatchIon>();
  let listedCharge = 0;
  let listedAny = false;
  if (volumeL) {
    for (const i of ingredients) {
      if (i.moles === null) continue;
      for (const ion of i.ions) {
        const c = (i.moles * ion.count) / volumeL;
        const at = ionMap.get(ion.key);
        if (at) at.concentrationM += c;
        else ionMap.set(ion.key, { ion: ion.ion, key: ion.key, charge: ion.charge, concentrationM: c });
        if (i.analysis.charge !== 0) {
          listedCharge += c * ion.charge;
          listedAny = true;
        }
      }
    }
  }
  const ions = [...ionMap.values()];
  const ionicStrengthM = volumeL ? 0.5 * ions.reduce((s, x) => s + x.concentrationM * x.charge * x.charge, 0) : null;
  const rawNet = volumeL ? ions.reduce((s, x) => s + x.concentrationM * x.charge, 0) : null;
  // Rounding noise of a neutral recipe is reported as the zero it is.
  const scale = ions.reduce((s, x) => s + Math.abs(x.concentrationM * x.charge), 0);
  const netChargeEqPerL = rawNet === null ? null : Math.abs(rawNet) <= 1e-9 * Math.max(scale, 1e-12) ? 0 : rawNet;
  if (listedAny && Math.abs(listedCharge) > 1e-9 * Math.max(1, ...ions.map((x) => x.concentrationM))) {
    const first = ingredients.find((i) => i.analysis.charge !== 0);
    if (first) diagnostics.push({
      code: 'batch-charge', severity: 'warning', start: first.lineStart, end: first.lineEnd,
      message: `The ions listed on their own leave a net charge of ${listedCharge > 0 ? '+' : ''}${listedCharge.toPrecision(3)} eq/L; add counter-ions or list the salts instead.`,
    });
  }
  return { ions, ionicStrengthM, netChargeEqPerL };
}

/** One line per caution, naming every ingredient it applies to; a line not counted still carries its formula's cautions. */
function batchCautions(ingredients: readonly Ingredient[], skipped: readonly SkippedLine[]): Caution[] {
  const byText = new Map<string, { cls: Caution['cls']; who: string[] }>();
  const add = (who: string, list: readonly Caution[]) => {
    for (const c of list) {
      const at = byText.get(c.text);
      if (at) {
        if (!at.who.includes(who)) at.who.push(who);
      } else byText.set(c.text, { cls: c.cls, who: [who] });
    }
  };
  for (const i of ingredients) add(i.formula, i.cautions);
  for (const s of skipped) if (s.analysis) add(`${s.analysis.display} (line not counted)`, s.cautions);
  return [...byText].map(([text, v]) => ({ cls: v.cls, text: `${v.who.join(', ')}: ${text}` }));
}
