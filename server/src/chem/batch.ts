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
 * Model: every salt is taken as fully dissolved and dissociated into the ions of its formula; the ions are
 * not protonated or deprotonated further. Strong acids give up their first proton (H2SO4 → H⁺ + HSO₄⁻).
 * Weak acids and bases and molecular substances stay undissociated. Activities are not modelled.
 */
import { analyseFormula, type FormulaAnalysis } from './analyse';
import { cautionsFor, type Caution } from './cautions';
import { shiftDiagnostic, type ChemDiagnostic } from './diagnostic';
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
  massFraction: number | null;
  ions: IonShare[];
  /** Why it is not split into ions, when it is not. */
  undissociated?: string;
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
  ingredients: Ingredient[];
  ions: BatchIon[];
  ionicStrengthM: number | null;
  netChargeEqPerL: number | null;
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

function err(code: string, start: number, end: number, message: string, severity: ChemDiagnostic['severity'] = 'error'): ChemDiagnostic {
  return { code, severity, start, end, message };
}

const dissociated = new WeakMap<FormulaAnalysis, { ions: IonShare[]; undissociated?: string }>();

/** Ions of a strong electrolyte, or why it stays whole (memoised per analysis; read-only). */
export function dissociate(a: FormulaAnalysis): { ions: IonShare[]; undissociated?: string } {
  let hit = dissociated.get(a);
  if (!hit) dissociated.set(a, (hit = electrolyteIons(a)));
  return hit;
}

/** Analyse a batch block's lines. Offsets in diagnostics are absolute (the lines carry their offsets). */
export function analyseBatch(lines: BatchLine[], openName: string | null = null, settings: ChemSettings = DEFAULT_CHEM_SETTINGS): BatchAnalysis {
  const diagnostics: ChemDiagnostic[] = [];
  let name: string | null = openName;
  let volumeL: number | null = null;
  let totalMassG: number | null = null;
  const pending: Array<{ formula: Token; amount: Token; unit: Token; assay: number; lineStart: number; lineEnd: number; value: number }> = [];
  const seenHeaders = new Set<string>();

  for (const { text: raw, start } of lines) {
    const hash = raw.indexOf('#');
    const text = hash >= 0 ? raw.slice(0, hash) : raw;
    const trimmed = text.trim();
    if (trimmed === '') continue;
    const lineStart = start + (text.length - text.trimStart().length);
    const lineEnd = start + text.trimEnd().length;
    const header = /^(name|volume|total)\s*:\s*(.*)$/i.exec(trimmed);
    if (header) {
      const key = header[1].toLowerCase();
      const valueStart = lineStart + trimmed.length - header[2].length;
      const valueText = header[2].trim();
      if (seenHeaders.has(key)) diagnostics.push(err('batch-header', lineStart, lineEnd, `'${key}:' is given twice; the first one counts.`, 'warning'));
      seenHeaders.add(key);
      if (seenHeaders.size && key !== 'name' && seenHeaders.has(key) && diagnostics.some((d) => d.start === lineStart)) continue;
      if (key === 'name') {
        name = valueText || name;
        continue;
      }
      const tk = tokens(header[2], valueStart);
      const table = key === 'volume' ? VOLUME : MASS_TOTAL;
      const unitsList = key === 'volume' ? 'L, mL or µL' : 'g or kg';
      if (tk.length === 0) {
        diagnostics.push(err('batch-amount', lineStart, lineEnd, `'${key}:' needs a number and a unit (${unitsList}).`));
        continue;
      }
      let num = tk[0].text;
      let unit = tk[1]?.text;
      const glued = /^([0-9.eE+-]+)([A-Za-zµ]+)$/.exec(num);
      if (glued && !unit) {
        num = glued[1];
        unit = glued[2];
      }
      const v = NUMBER.test(num) ? Number(num) : NaN;
      if (!(v > 0) || v > MAX_AMOUNT) {
        diagnostics.push(err('batch-amount', tk[0].start, tk[0].end, `'${tk[0].text}' is not a positive number.`));
        continue;
      }
      if (!unit || !(unit in table)) {
        const u = tk[1] ?? tk[0];
        diagnostics.push(err('batch-unit', u.start, u.end, unit ? `Unknown unit '${unit}' for ${key}; use ${unitsList}.` : `'${key}:' needs a unit (${unitsList}).`));
        continue;
      }
      if (key === 'volume') volumeL = v * table[unit];
      else totalMassG = v * table[unit];
      continue;
    }
    const tk = joinSpacedAdduct(tokens(text, start), text, start);
    const [formula, amount, unitTok, ...rest] = tk;
    if (!amount) {
      diagnostics.push(err('batch-amount', formula.start, formula.end, `'${formula.text}' needs an amount and a unit, e.g. '${formula.text} 5.0 g'.`));
      continue;
    }
    let amountTok = amount;
    let unit = unitTok;
    const glued = /^((?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)((?:wt)?%|[A-Za-zµ/]+)$/.exec(amount.text);
    if (glued && (!unitTok || unitTok.text.startsWith('@'))) {
      amountTok = { text: glued[1], start: amount.start, end: amount.start + glued[1].length };
      unit = { text: glued[2], start: amountTok.end, end: amount.end };
      if (unitTok) rest.unshift(unitTok);
    }
    const value = NUMBER.test(amountTok.text) ? Number(amountTok.text) : NaN;
    if (!Number.isFinite(value) || value <= 0 || value > MAX_AMOUNT) {
      diagnostics.push(err('batch-amount', amountTok.start, amountTok.end, Number.isFinite(value) && value > MAX_AMOUNT ? `Amount ${amountTok.text} is beyond the limit of ${MAX_AMOUNT}.` : `'${amountTok.text}' is not a positive number.`));
      continue;
    }
    if (!unit) {
      diagnostics.push(err('batch-unit', amountTok.start, amountTok.end, `'${amountTok.text}' needs a unit: g, mg, kg, mol, mmol, M, mM or wt%.`));
      continue;
    }
    let unitText = unit.text === '%w/w' || unit.text === '%' ? 'wt%' : unit.text;
    if (unitText === 'ug') unitText = 'µg';
    if (unitText === 'umol') unitText = 'µmol';
    if (unitText === 'uM') unitText = 'µM';
    if (unitText === 'mol/L') unitText = 'M';
    if (unitText === 'mmol/L') unitText = 'mM';
    if (!(unitText in MASS) && !(unitText in MOLES) && !(unitText in CONC) && unitText !== 'wt%') {
      const hint = unitText in VOLUME ? ' A volume of a liquid needs its density; give the mass or the amount instead.' : '';
      diagnostics.push(err('batch-unit', unit.start, unit.end, `Unknown unit '${unit.text}'; use g, mg, kg, mol, mmol, M, mM or wt%.${hint}`));
      continue;
    }
    let assay = 1;
    const restText = rest.map((r) => r.text).join(' ');
    if (rest.length) {
      const m = /^@\s*((?:\d+(?:\.\d*)?|\.\d+))\s*%$/.exec(restText);
      const r0 = rest[0];
      const rl = rest[rest.length - 1];
      if (!m) diagnostics.push(err('batch-syntax', r0.start, rl.end, `Unexpected '${restText}' after the amount; an assay is written '@ 99.5%'.`));
      else {
        const p = Number(m[1]);
        if (!(p > 0 && p <= 100)) diagnostics.push(err('batch-amount', r0.start, rl.end, `Assay ${m[1]} % must be above 0 and at most 100.`));
        else assay = p / 100;
      }
    }
    pending.push({ formula, amount: amountTok, unit: { ...unit, text: unitText }, assay, lineStart, lineEnd, value });
  }

  const ingredients: Ingredient[] = [];
  for (const p of pending) {
    const a = analyseFormula(p.formula.text, settings);
    for (const d of a.diagnostics) {
      if (d.severity === 'information') continue;
      diagnostics.push(shiftDiagnostic(d, p.formula.start));
    }
    if (!a.ok || !a.molarMass) continue;
    const M = a.molarMass.value;
    const u = p.unit.text as AmountUnit;
    let moles: number | null = null;
    let massG: number | null = null;
    if (u in MASS) {
      massG = p.value * MASS[u];
      moles = (massG * p.assay) / M;
    } else if (u in MOLES) {
      moles = p.value * MOLES[u];
      massG = (moles * M) / p.assay;
    } else if (u in CONC) {
      if (volumeL === null) {
        diagnostics.push(err('batch-no-volume', p.amount.start, p.unit.end, `A target concentration needs the batch's final volume: add a line 'volume: 500 mL'.`));
      } else {
        moles = p.value * CONC[u] * volumeL;
        massG = (moles * M) / p.assay;
      }
    } else if (u === 'wt%') {
      if (totalMassG === null) diagnostics.push(err('batch-no-total', p.amount.start, p.unit.end, `A wt% target needs the batch's total mass: add a line 'total: 250 g'.`));
      else if (p.value > 100) diagnostics.push(err('batch-amount', p.amount.start, p.unit.end, `${p.value} wt% is more than the whole batch.`));
      else {
        const substance = (p.value / 100) * totalMassG;
        moles = substance / M;
        massG = substance / p.assay;
      }
    }
    const d = dissociate(a);
    ingredients.push({
      formulaText: p.formula.text, formula: a.display, analysis: a, lineStart: p.lineStart, lineEnd: p.lineEnd,
      formulaStart: p.formula.start, formulaEnd: p.formula.end,
      amount: { value: p.value, unit: u, text: `${p.amount.text} ${p.unit.text}`, start: p.amount.start, end: p.unit.end },
      assay: p.assay, molarMass: M, moles, massG,
      concentrationM: moles !== null && volumeL ? moles / volumeL : null,
      massFraction: null, ions: d.ions, ...(d.undissociated ? { undissociated: d.undissociated } : {}), cautions: cautionsFor(a),
    });
  }
  const totalWeighed = ingredients.reduce((s, i) => s + (i.massG ?? 0), 0);
  const denominator = totalMassG ?? totalWeighed;
  for (const i of ingredients) i.massFraction = i.massG !== null && denominator > 0 ? i.massG / denominator : null;

  // Ions of the whole mix.
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
  // One line per caution, naming every ingredient it applies to.
  const byText = new Map<string, { cls: Caution['cls']; who: string[] }>();
  for (const i of ingredients) for (const c of i.cautions) {
    const at = byText.get(c.text);
    if (at) at.who.push(i.formula);
    else byText.set(c.text, { cls: c.cls, who: [i.formula] });
  }
  const cautions: Caution[] = [...byText].map(([text, v]) => ({ cls: v.cls, text: `${v.who.join(', ')}: ${text}` }));
  const notes = ['Salts are taken as fully dissolved and dissociated; weak acids and bases are treated as undissociated; activities are not modelled.'];
  if (volumeL === null && ingredients.length) notes.push('No final volume given: concentrations and ionic strength are not computed.');
  diagnostics.sort((a, b) => a.start - b.start);
  return { name, volumeL, totalMassG, ingredients, ions, ionicStrengthM, netChargeEqPerL, diagnostics, cautions, notes };
}
