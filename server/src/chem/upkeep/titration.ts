/**
 * A titre line, as a lab writes up the analysis of a bath: what was titrated, the aliquot, the titre and
 * the titrant, and (where it does not follow from the titrant) the mole ratio or the reaction.
 *
 *   titre NiSO4·6H2O: 5.00 mL sample, 21.30 mL 0.0500 M EDTA
 *   titre NiCl2·6H2O as Cl-: 2.00 mL sample, 14.75 mL 0.1000 M AgNO3, Ag+ + Cl- -> AgCl
 *   titration H2SO4: sample 10 mL diluted to 100 mL, 10 mL taken, 8.40 mL 0.1000 M NaOH, 1:2
 *   titre CuSO4·5H2O: 2.00 mL sample, 12.10 mL 0.0500 M EDTA, blank 0.05 mL   # duplicate of bath C3
 *
 * The line: the word `titre` or `titration`, the analyte (a formula, or a name the names reader knows),
 * optionally `as <species>` (the ion or element the result is also given as), a colon, then parts
 * separated by commas or semicolons, in any order:
 *   `<V> <mL|L|µL> sample` or `sample <V> <unit>`, optionally `diluted to <V> <unit>`: the aliquot of bath
 *   `<V> <unit> taken` (or `aliquot`): the part of the diluted sample titrated (only after `diluted to`)
 *   `<V> <unit> [of] <c> <M|mM|mol/L> <titrant>`: the titre, the titrant's concentration and the titrant
 *   `blank <V> <unit>`: a blank titre, taken off the titre
 *   `less <substance>`: the titre also counts the ion of another substance of the bath, found by its own
 *     titre line (EDTA takes all the nickel of a Watts bath, the chloride's too): that is taken off
 *   `<a>:<b>`: a mol of analyte react with b mol of titrant; `<n> eq`: n mol of titrant per mol of analyte
 *   a reaction with an arrow (`Ni2+ + EDTA4- -> NiEDTA2-`): read by chem/equation and balanced there
 * A `#` starts a comment. `EDTA` in a titrant or a reaction is ethylenediaminetetraacetate (the formula
 * reader's `(edta)`), whichever of its salts was weighed to make the titrant.
 *
 * Where no ratio or reaction is written, it follows from the titrant (common practice):
 *   EDTA: 1 mol per mol of the analyte's metal ion (complexometry, 1:1 complexes)
 *   a silver salt: 1 Ag⁺ per halide or thiocyanate ion of the analyte (argentometry)
 *   a thiocyanate: 1 SCN⁻ per Ag⁺ of the analyte (Volhard, direct)
 *   a strong base or acid: by the analyte's acid or base equivalents (chem/reagents/equivalents.ts)
 *   a redox titrant of that table: by electrons, where the analyte's redox equivalents are known
 * Anything else asks for the ratio or the reaction (`titre-ratio`).
 *
 * `readTitre` reads; `computeTitre` does the arithmetic and the plausibility checks. Both are pure and
 * never throw: what cannot be read is a finding on its exact characters.
 */
import { analyseFormula, type FormulaAnalysis } from '../analyse';
import { PRACTICALLY_INSOLUBLE_BELOW, type SolubilityRow } from '../data/solubility';
import type { ChemDiagnostic, DiagnosticCode, Severity } from '../diagnostic';
import { analyseReaction, findArrow, type Species } from '../equation';
import { formulaAtoms, hillFormula, molarMass, subscriptDigits } from '../formula/compute';
import { parseFormula } from '../formula/parse';
import { electrolyteIons } from '../ions/dissociation';
import { readName } from '../names';
import { equivalentsOf } from '../reagents';
import { anhydrousOf, solubilityRow } from '../batch/solubility';

// ---------------------------------------------------------------------------------------------------
// What a reading is.

export type TitreTokenKind =
  'keyword' | 'analyte' | 'as' | 'species' | 'colon' | 'separator' | 'number' | 'unit' | 'word' | 'titrant' | 'ratio' | 'reaction' | 'comment';

/** A piece of the line with its absolute offsets (for semantic tokens and hovers). */
export interface TitreToken {
  kind: TitreTokenKind;
  text: string;
  start: number;
  end: number;
}

/** A volume as written: its value in litres and where it stands (number and unit). */
export interface WrittenVolume {
  litres: number;
  text: string;
  start: number;
  end: number;
}

/** The ion or element the result is also given in g/L of (nickel for a nickel salt, chloride for chloride by silver). */
export interface Carrier {
  /** Typeset (`Ni²⁺`, `Cl⁻`, `Ni`). */
  display: string;
  /** As the formula reader writes it (`Ni^2+`, `Cl^-`, `Ni`). */
  key: string;
  /** Molar mass of the species, g/mol (an ion's electrons are not counted; CIAAW standard atomic weights). */
  molarMass: number;
  /** How many of it one formula unit of the analyte holds. */
  perAnalyte: number;
  /** Why this species: `as` written, the reaction, or the titrant's usual chemistry. */
  why: string;
}

export interface TitreRatio {
  /** Mol of titrant per mol of analyte (as the analyte's formula is written). */
  titrantPerAnalyte: number;
  source: 'written' | 'reaction' | 'titrant';
  /** How it was found, as a hover says it. */
  basis: string;
  /** Where the ratio or reaction is written (absent where it follows from the titrant). */
  start?: number;
  end?: number;
  /** The reaction as balanced, typeset, where one was written. */
  reaction?: string;
}

export interface TitreReading {
  ok: true;
  /** The line without its comment and blanks, and its absolute offsets. */
  text: string;
  start: number;
  end: number;
  keyword: { text: string; start: number; end: number };
  analyte: { text: string; start: number; end: number; analysis: FormulaAnalysis; formula: string; named?: string };
  /** `as <species>` where written. */
  as?: { text: string; start: number; end: number };
  sample: WrittenVolume;
  /** `diluted to <V>`, `<V> taken`. */
  dilution?: { to: WrittenVolume; taken: WrittenVolume };
  titre: WrittenVolume;
  blank?: WrittenVolume;
  /** `less <substance>`: other substances whose share of the carrier is taken off, each with how many of the carrier it holds. */
  less?: Array<{ text: string; start: number; end: number; formula: string; analysis: FormulaAnalysis; carrierCount: number }>;
  titrant: { text: string; start: number; end: number; display: string; analysis: FormulaAnalysis | null; edta: boolean };
  titrantM: { value: number; text: string; start: number; end: number };
  ratio: TitreRatio;
  /** Null where no species carries the analysis plainly (an acid titrated as a whole), with the reason. */
  carrier: Carrier | null;
  carrierNote?: string;
  tokens: TitreToken[];
  /** Findings that do not stop the reading (warnings, information), absolute offsets. */
  diagnostics: ChemDiagnostic[];
}

export interface TitreFailure {
  ok: false;
  text: string;
  start: number;
  end: number;
  tokens: TitreToken[];
  /** At least one error; absolute offsets inside the line. */
  diagnostics: ChemDiagnostic[];
}

export type TitreRead = TitreReading | TitreFailure;

// ---------------------------------------------------------------------------------------------------
// Small readers.

/** A text for a message: at most 40 characters of it. */
export const short = (t: string) => (t.length > 40 ? `${t.slice(0, 40)}…` : t);

const KEYWORD = /^(titre|titration)(?=\s|$)/i;
const NUMBER = /^(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const GLUED = /^((?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)([A-Za-zµ/]+)$/;
const VOLUME_UNITS: Record<string, { unit: string; factor: number }> = {
  L: { unit: 'L', factor: 1 },
  l: { unit: 'L', factor: 1 },
  mL: { unit: 'mL', factor: 1e-3 },
  ml: { unit: 'mL', factor: 1e-3 },
  µL: { unit: 'µL', factor: 1e-6 },
  uL: { unit: 'µL', factor: 1e-6 },
};
const CONCENTRATION_UNITS: Record<string, { unit: string; factor: number }> = {
  M: { unit: 'M', factor: 1 },
  'mol/L': { unit: 'M', factor: 1 },
  mM: { unit: 'mM', factor: 1e-3 },
  'mmol/L': { unit: 'mM', factor: 1e-3 },
};
/** Beyond this a volume or concentration is no lab figure (and no arithmetic is done on it). */
const MAX_FIGURE = 1e6;
/** A line longer than this is not read part by part (a titre line is one line of a note). */
export const MAX_TITRE_LINE = 2000;

interface Piece {
  text: string;
  start: number;
  end: number;
}

/** Blank-separated pieces of `text`, offsets absolute (`base` is where `text` starts), glued `5mL` split. */
function pieces(text: string, base: number): Piece[] {
  const out: Piece[] = [];
  const re = /\S+/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(text))) {
    const start = base + m.index;
    const g = GLUED.exec(m[0]);
    if (g && (VOLUME_UNITS[g[2]] || CONCENTRATION_UNITS[g[2]] || /^eq/i.test(g[2]))) {
      out.push({ text: g[1], start, end: start + g[1].length });
      out.push({ text: g[2], start: start + g[1].length, end: start + m[0].length });
    } else out.push({ text: m[0], start, end: start + m[0].length });
  }
  return out;
}

const spanOf = (a: Piece, b: Piece) => ({ start: a.start, end: b.end });

class Findings {
  list: ChemDiagnostic[] = [];
  add(code: DiagnosticCode, start: number, end: number, message: string, severity: Severity = 'error') {
    this.list.push({ code, severity, start, end: Math.max(end, start), message });
  }
  get failed() {
    return this.list.some((d) => d.severity === 'error');
  }
}

const volumeList = 'mL, L or µL';

/** `<number> <volume unit>` at `at`; a finding where it cannot be read. */
function readVolume(ps: Piece[], at: number, what: string, f: Findings, near: Piece): { volume: WrittenVolume; next: number } | null {
  const n = ps[at];
  if (!n) {
    f.add('titre-amount', near.start, near.end, `The ${what} has no volume: write it as a number and a unit (${volumeList}).`);
    return null;
  }
  if (!NUMBER.test(n.text)) {
    f.add('titre-amount', n.start, n.end, `'${short(n.text)}' is not a volume: the ${what} is a number and a unit (${volumeList}).`);
    return null;
  }
  const value = Number(n.text);
  const u = ps[at + 1];
  const unit = u ? VOLUME_UNITS[u.text] : undefined;
  if (!u || !unit) {
    f.add('titre-amount', u?.start ?? n.start, u?.end ?? n.end, `The ${what} needs a volume unit (${volumeList})${u ? `, not '${short(u.text)}'` : ''}.`);
    return null;
  }
  if (!(value > 0) || value > MAX_FIGURE) {
    f.add('titre-amount', n.start, u.end, `The ${what} must be a positive volume${value > MAX_FIGURE ? ' a lab can measure' : ''}.`);
    return null;
  }
  return { volume: { litres: value * unit.factor, text: `${n.text} ${unit.unit}`, start: n.start, end: u.end }, next: at + 2 };
}

// ---------------------------------------------------------------------------------------------------
// EDTA in a titrant or a reaction.

/** `EDTA` as the formula reader writes the ligand, with any charge kept: `EDTA4-` → `(edta)^4-`, `NiEDTA2-` → `Ni(edta)^2-`. */
function expandEdta(text: string): { text: string; back: (i: number) => number } {
  const re = /EDTA(\^?)(\d*[+\-−])?/g;
  const map: Array<{ from: number; to: number; length: number; original: number }> = [];
  let out = '';
  let last = 0;
  let m: RegExpExecArray | null;
  while ((m = re.exec(text))) {
    out += text.slice(last, m.index);
    const replacement = `(edta)${m[2] ? `^${m[2]}` : ''}`;
    map.push({ from: out.length, to: out.length + replacement.length, length: m[0].length, original: m.index });
    out += replacement;
    last = m.index + m[0].length;
  }
  out += text.slice(last);
  const back = (i: number) => {
    let shift = 0;
    for (const r of map) {
      if (i < r.from) break;
      if (i < r.to) return r.original + Math.min(i - r.from, r.length);
      shift = r.original + r.length - r.to;
    }
    return i + shift;
  };
  return { text: out, back };
}

const isEdtaSpecies = (atoms: Readonly<Record<string, number>>) => {
  // Any protonation of edta⁴⁻ (H₀…H₆): C10 N2 O8 with 12–18 H and nothing else.
  const keys = Object.keys(atoms);
  return keys.length === 4 && atoms.C === 10 && atoms.N === 2 && atoms.O === 8 && atoms.H >= 12 && atoms.H <= 18;
};

// ---------------------------------------------------------------------------------------------------
// The species of the analyte.

interface AnalyteSpecies {
  display: string;
  key: string;
  charge: number;
  count: number;
  molarMass: number;
  atoms: Record<string, number>;
}

function atomsOfKey(key: string): Record<string, number> | null {
  const p = parseFormula(key);
  return p.ok && p.formula ? formulaAtoms(p.formula) : null;
}

/** The analyte's ions (a salt) — or the analyte itself, where it stays whole. */
function speciesOf(a: FormulaAnalysis): AnalyteSpecies[] {
  const { ions } = electrolyteIons(a);
  const out: AnalyteSpecies[] = [];
  for (const i of ions) {
    const atoms = atomsOfKey(i.key);
    if (!atoms) continue;
    out.push({ display: i.ion, key: i.key, charge: i.charge, count: i.count, molarMass: molarMass(atoms).value, atoms });
  }
  return out;
}

const ALKALI = new Set(['Li', 'Na', 'K', 'Rb', 'Cs']);
const HALIDE_KEYS = new Set(['Cl^-', 'Br^-', 'I^-', 'SCN^-']);

function asCarrier(s: AnalyteSpecies, why: string): Carrier {
  return { display: s.display, key: s.key, molarMass: s.molarMass, perAnalyte: s.count, why };
}

/** The metal cation a complexometric or redox titration determines: the analyte's cation that is no alkali metal or ammonium. */
function metalCation(a: FormulaAnalysis): AnalyteSpecies | undefined {
  return speciesOf(a).find((s) => s.charge > 0 && Object.keys(s.atoms).length === 1 && !ALKALI.has(Object.keys(s.atoms)[0]));
}

// ---------------------------------------------------------------------------------------------------
// The ratio.

type RatioOutcome = { ratio: TitreRatio; carrier: Carrier | null; carrierNote?: string } | { error: string; start: number; end: number };

interface TitrantRef {
  display: string;
  analysis: FormulaAnalysis | null;
  edta: boolean;
}

/** The ratio that follows from the titrant's usual chemistry (common practice), or why none does. */
function ratioFromTitrant(analyte: FormulaAnalysis, titrant: TitrantRef, where: { start: number; end: number }): RatioOutcome {
  const ask = `write the mole ratio (\`1:1\`, \`2 eq\`) or the reaction`;
  if (titrant.edta) {
    const metal = metalCation(analyte);
    if (!metal) return { ...where, error: `${analyte.display} has no metal ion for EDTA to take: ${ask}.` };
    return {
      ratio: {
        titrantPerAnalyte: metal.count,
        source: 'titrant',
        basis: `1 EDTA per ${metal.display} (1:1 complex, common practice) × ${metal.count} ${metal.display} per ${analyte.display}`,
      },
      carrier: asCarrier(metal, 'the metal ion EDTA takes'),
    };
  }
  const t = titrant.analysis;
  const tIons = t ? speciesOf(t) : [];
  const silver = tIons.find((s) => s.key === 'Ag^+');
  if (silver) {
    const anion = speciesOf(analyte).find((s) => HALIDE_KEYS.has(s.key));
    if (!anion) return { ...where, error: `${analyte.display} has no halide or thiocyanate for ${titrant.display} to precipitate: ${ask}.` };
    return {
      ratio: {
        titrantPerAnalyte: anion.count / silver.count,
        source: 'titrant',
        basis: `1 Ag⁺ per ${anion.display} (argentometry, common practice) × ${anion.count} ${anion.display} per ${analyte.display}${silver.count !== 1 ? ` ÷ ${silver.count} Ag⁺ per ${titrant.display}` : ''}`,
      },
      carrier: asCarrier(anion, `the ion ${titrant.display} precipitates`),
    };
  }
  const scn = tIons.find((s) => s.key === 'SCN^-');
  if (scn) {
    const ag = speciesOf(analyte).find((s) => s.key === 'Ag^+');
    if (!ag) return { ...where, error: `${analyte.display} has no Ag⁺ for ${titrant.display} to precipitate: ${ask}.` };
    return {
      ratio: { titrantPerAnalyte: ag.count, source: 'titrant', basis: `1 SCN⁻ per Ag⁺ (Volhard, common practice) × ${ag.count} Ag⁺ per ${analyte.display}` },
      carrier: asCarrier(ag, 'the ion the thiocyanate precipitates'),
    };
  }
  if (t) {
    // Acid–base: the titrant's and the analyte's equivalents (chem/reagents/equivalents.ts).
    const tBase = equivalentsOf(t, 'base');
    const tAcid = equivalentsOf(t, 'acid');
    const pairs: Array<[typeof tBase, 'acid' | 'base']> = [
      [tBase, 'acid'],
      [tAcid, 'base'],
    ];
    for (const [te, analyteRole] of pairs) {
      if ('error' in te) continue;
      const ae = equivalentsOf(analyte, analyteRole);
      if ('error' in ae) continue;
      const hydroxide = analyteRole === 'base' ? speciesOf(analyte).find((s) => s.key === 'OH^-') : undefined;
      return {
        ratio: {
          titrantPerAnalyte: ae.perMole / te.perMole,
          source: 'titrant',
          basis: `${ae.basis} ÷ ${te.basis} (neutralisation)`,
        },
        carrier: hydroxide ? asCarrier(hydroxide, 'the hydroxide the acid neutralises') : null,
        carrierNote: hydroxide ? undefined : `${analyte.display} is titrated as a whole (an ${analyteRole}): no ion is given separately`,
      };
    }
    const tr = equivalentsOf(t, 'redox');
    const ar = equivalentsOf(analyte, 'redox');
    if (!('error' in tr) && !('error' in ar)) {
      const metal = metalCation(analyte);
      return {
        ratio: { titrantPerAnalyte: ar.perMole / tr.perMole, source: 'titrant', basis: `${ar.basis} ÷ ${tr.basis}` },
        carrier: metal ? asCarrier(metal, 'the ion the titrant oxidises or reduces') : null,
        carrierNote: metal ? undefined : `${analyte.display} is titrated as a whole (redox): no ion is given separately`,
      };
    }
  }
  return { ...where, error: `No mole ratio follows from ${titrant.display} with ${analyte.display}: ${ask}.` };
}

/** Which of the analyte's species (or the analyte itself, or one of its elements) a reaction's species is. */
function matchAnalyte(analyte: FormulaAnalysis, s: Species): AnalyteSpecies | null {
  const hill = hillFormula(s.atoms as Record<string, number>);
  const an = anhydrousOf(analyte);
  if (s.charge === 0 && (hill === analyte.hill || (an && hill === an.hill))) {
    return { display: analyte.display, key: analyte.ascii, charge: 0, count: 1, molarMass: analyte.molarMass?.value ?? NaN, atoms: { ...analyte.atoms } };
  }
  for (const sp of speciesOf(analyte)) if (sp.charge === s.charge && hillFormula(sp.atoms) === hill) return sp;
  return null;
}

function matchTitrant(titrant: TitrantRef, s: Species): number | null {
  if (titrant.edta) return isEdtaSpecies(s.atoms) ? 1 : null;
  const t = titrant.analysis;
  if (!t || !t.ok) return null;
  const hill = hillFormula(s.atoms as Record<string, number>);
  if (s.charge === 0 && hill === t.hill) return 1;
  const an = anhydrousOf(t);
  if (s.charge === 0 && an && hill === an.hill) return 1;
  for (const sp of speciesOf(t)) if (sp.charge === s.charge && hillFormula(sp.atoms) === hill) return sp.count;
  return null;
}

/** The ratio a written reaction gives: its analyte species and titrant species, balanced by chem/equation. */
function ratioFromReaction(analyte: FormulaAnalysis, titrant: TitrantRef, written: Piece): RatioOutcome | { findings: ChemDiagnostic[] } {
  const { text, back } = expandEdta(written.text);
  const r = analyseReaction(text);
  const at = (i: number) => written.start + back(i);
  if (!r.parsed.ok) {
    return {
      findings: r.parsed.diagnostics.map((d) => ({
        code: d.code,
        severity: d.severity,
        message: d.message,
        start: at(d.start),
        end: Math.max(at(d.end), at(d.start)),
      })),
    };
  }
  const species = [...r.parsed.reactants, ...r.parsed.products];
  let coefficients: number[] | null = null;
  let note = '';
  if (r.balance.status === 'already-balanced') coefficients = species.map((s) => s.coefficient ?? 1);
  else if (r.balance.status === 'balanced' && r.balance.coefficients) {
    coefficients = r.balance.coefficients;
    note = ` (balanced as ${r.balance.balancedDisplay})`;
  }
  if (!coefficients)
    return { error: `The reaction cannot be balanced (${r.balance.message}): write it balanced, or write the mole ratio instead.`, ...written };
  let a: { s: AnalyteSpecies; coef: number } | null = null;
  let t: { per: number; coef: number; display: string } | null = null;
  r.parsed.reactants.forEach((s, k) => {
    const coef = coefficients![k];
    const ta = matchTitrant(titrant, s);
    if (ta !== null && !t) {
      t = { per: ta, coef, display: s.formulaText };
      return;
    }
    const m = matchAnalyte(analyte, s);
    if (m && !a) a = { s: m, coef };
  });
  const names = speciesOf(analyte)
    .map((s) => s.display)
    .join(', ');
  if (!a)
    return {
      error: `None of the reaction's reactants is ${analyte.display}${names ? ` or one of its ions (${names})` : ''}: the reaction must take the analyte.`,
      ...written,
    };
  if (!t)
    return {
      error: `None of the reaction's reactants is the titrant ${titrant.display}${titrant.edta ? ' (an EDTA species)' : ' or one of its ions'}.`,
      ...written,
    };
  const A = a as { s: AnalyteSpecies; coef: number };
  const T = t as { per: number; coef: number; display: string };
  const ratio = ((T.coef / A.coef) * A.s.count) / T.per;
  const reaction = r.balance.balancedDisplay ?? undefined;
  const carrier = A.s.charge === 0 && A.s.key === analyte.ascii ? null : asCarrier(A.s, 'the species the reaction takes');
  return {
    ratio: {
      titrantPerAnalyte: ratio,
      source: 'reaction',
      basis: `${T.coef} ${T.display} per ${A.coef} ${A.s.display} from the reaction${note} × ${A.s.count} ${A.s.display} per ${analyte.display}${T.per !== 1 ? ` ÷ ${T.per} per ${titrant.display}` : ''}`,
      start: written.start,
      end: written.end,
      ...(reaction ? { reaction } : {}),
    },
    carrier,
    carrierNote: carrier ? undefined : `the reaction takes ${analyte.display} as a whole: no ion is given separately`,
  };
}

// ---------------------------------------------------------------------------------------------------
// Reading the line.

/** A formula or a name: its analysis, or the findings that say why not. */
function readSubstance(
  p: Piece,
  role: 'analyte' | 'titrant' | 'species',
): { analysis: FormulaAnalysis; formula: string; named?: string } | { findings: ChemDiagnostic[] } {
  const a = analyseFormula(p.text);
  if (a.ok && a.molarMass) return { analysis: a, formula: p.text };
  if (/\s/.test(p.text) || /^[a-z]/.test(p.text)) {
    const n = readName(p.text);
    if (n.status === 'exact' && n.formula) {
      const an = analyseFormula(n.formula);
      if (an.ok && an.molarMass) return { analysis: an, formula: n.formula, named: n.name };
    }
    const why = p.text.length <= 60 && n.message ? n.message : `'${short(p.text)}' is neither a formula nor a name the tool knows`;
    return { findings: [{ code: 'titre-analyte', severity: 'error', start: p.start, end: p.end, message: `The ${role}: ${why.replace(/\.$/, '')}.` }] };
  }
  const own = a.diagnostics.filter((d) => d.severity === 'error');
  if (own.length)
    return {
      findings: own.map((d) => ({ code: d.code, severity: d.severity, message: d.message, start: p.start + d.start, end: p.start + Math.max(d.end, d.start) })),
    };
  return {
    findings: [
      {
        code: 'titre-analyte',
        severity: 'error',
        start: p.start,
        end: p.end,
        message: `The ${role} ${a.display || p.text} has no molar mass to compute with.`,
      },
    ],
  };
}

/** Read a titre line. `text` is one line (its first character at absolute offset `offset`); never throws. */
export function readTitre(text: string, offset: number): TitreRead {
  const f = new Findings();
  const tokens: TitreToken[] = [];
  const tok = (kind: TitreTokenKind, p: { text: string; start: number; end: number }) => tokens.push({ kind, text: p.text, start: p.start, end: p.end });
  const hash = text.indexOf('#');
  const body = hash >= 0 ? text.slice(0, hash) : text;
  const lead = body.length - body.trimStart().length;
  const trimmed = body.trim();
  const line = { text: trimmed, start: offset + lead, end: offset + lead + trimmed.length };
  const fail = (): TitreFailure => {
    if (hash >= 0) tok('comment', { text: text.slice(hash), start: offset + hash, end: offset + text.length });
    tokens.sort((x, y) => x.start - y.start);
    return { ok: false, ...line, tokens, diagnostics: f.list.sort((x, y) => x.start - y.start) };
  };
  if (trimmed.length > MAX_TITRE_LINE) {
    f.add('titre-syntax', line.start, line.start + 1, `A titre line of ${trimmed.length} characters is not read (at most ${MAX_TITRE_LINE}).`);
    return fail();
  }
  const kw = KEYWORD.exec(trimmed);
  if (!kw) {
    f.add('titre-syntax', line.start, line.end, "A titre line starts with the word 'titre' or 'titration'.");
    return fail();
  }
  const keyword = { text: kw[1], start: line.start, end: line.start + kw[1].length };
  tok('keyword', keyword);
  const afterKw = kw[1].length;
  const colon = trimmed.indexOf(':', afterKw);
  if (colon < 0) {
    f.add('titre-syntax', keyword.start, line.end, "No ':' after the analyte: write `titre <analyte>: <sample>, <titre> <c> M <titrant>`.");
    return fail();
  }
  tok('colon', { text: ':', start: line.start + colon, end: line.start + colon + 1 });

  // The analyte, and `as <species>`.
  const head = trimmed.slice(afterKw, colon);
  const headBase = line.start + afterKw;
  const headPieces = pieces(head, headBase);
  const asAt = headPieces.findIndex((p, k) => k > 0 && p.text.toLowerCase() === 'as');
  const analytePieces = asAt >= 0 ? headPieces.slice(0, asAt) : headPieces;
  const speciesPieces = asAt >= 0 ? headPieces.slice(asAt + 1) : [];
  let analyte: TitreReading['analyte'] | null = null;
  if (!analytePieces.length) {
    f.add('titre-syntax', keyword.start, line.start + colon + 1, 'No analyte: write what was titrated before the colon (`titre NiSO4·6H2O: …`).');
  } else {
    const p = {
      text: head.slice(analytePieces[0].start - headBase, analytePieces[analytePieces.length - 1].end - headBase),
      ...spanOf(analytePieces[0], analytePieces[analytePieces.length - 1]),
    };
    tok('analyte', p);
    const s = readSubstance(p, 'analyte');
    if ('findings' in s) f.list.push(...s.findings);
    else analyte = { ...p, analysis: s.analysis, formula: s.formula, ...(s.named ? { named: s.named } : {}) };
  }
  let asSpecies: { text: string; start: number; end: number; analysis: FormulaAnalysis } | null = null;
  if (asAt >= 0) {
    tok('as', headPieces[asAt]);
    if (speciesPieces.length !== 1) {
      const at = speciesPieces[1] ?? headPieces[asAt];
      f.add(
        'titre-syntax',
        at.start,
        (speciesPieces[speciesPieces.length - 1] ?? at).end,
        "After 'as', one ion or element the result is also given as (`as Ni`, `as Cl-`).",
      );
    } else {
      tok('species', speciesPieces[0]);
      const a = analyseFormula(speciesPieces[0].text);
      if (!a.ok || !a.molarMass)
        f.add('titre-analyte', speciesPieces[0].start, speciesPieces[0].end, `'${short(speciesPieces[0].text)}' is not an ion or element that can be read.`);
      else asSpecies = { ...speciesPieces[0], analysis: a };
    }
  }

  // The parts after the colon.
  let sample: WrittenVolume | null = null;
  let dilutedTo: WrittenVolume | null = null;
  let taken: WrittenVolume | null = null;
  let titre: WrittenVolume | null = null;
  let blank: WrittenVolume | null = null;
  const lessPieces: Array<{ piece: Piece; analysis: FormulaAnalysis; formula: string }> = [];
  let titrantPiece: Piece | null = null;
  let titrantM: TitreReading['titrantM'] | null = null;
  let writtenRatio: { value: number; text: string; start: number; end: number } | null = null;
  let reactionPiece: Piece | null = null;
  const tried = { sample: false, titre: false, blank: false };
  const repeated = new Set<string>();
  // One finding per kind of part given again (a pasted line need not give hundreds).
  const twice = (what: string, p: Piece) => {
    if (repeated.has(what)) return;
    repeated.add(what);
    f.add('titre-syntax', p.start, p.end, `The ${what} is given more than once; write it once.`);
  };

  const rest = trimmed.slice(colon + 1);
  const restBase = line.start + colon + 1;
  const parts: Piece[] = [];
  {
    const re = /[^,;]+|[,;]/g;
    let m: RegExpExecArray | null;
    while ((m = re.exec(rest))) {
      if (m[0] === ',' || m[0] === ';') {
        tok('separator', { text: m[0], start: restBase + m.index, end: restBase + m.index + 1 });
        continue;
      }
      const inner = m[0].trim();
      if (!inner) continue;
      const s = restBase + m.index + (m[0].length - m[0].trimStart().length);
      parts.push({ text: inner, start: s, end: s + inner.length });
    }
  }
  if (!parts.length) f.add('titre-syntax', line.start + colon, line.start + colon + 1, 'Nothing after the colon: write the sample, the titre and the titrant.');

  for (const part of parts) {
    const ps = pieces(part.text, part.start);
    const first = ps[0].text.toLowerCase();
    const ratioMatch = /^(\d+(?:\.\d+)?)\s*:\s*(\d+(?:\.\d+)?)$/.exec(part.text);
    if (findArrow(part.text)) {
      tok('reaction', part);
      if (reactionPiece || writtenRatio) twice('ratio or reaction', part);
      else reactionPiece = part;
      continue;
    }
    if (ratioMatch) {
      tok('ratio', part);
      const a = Number(ratioMatch[1]);
      const b = Number(ratioMatch[2]);
      if (reactionPiece || writtenRatio) twice('ratio or reaction', part);
      else if (!(a > 0 && b > 0)) f.add('titre-amount', part.start, part.end, 'A mole ratio of two positive numbers, analyte first: `1:1`, `1:2`.');
      else writtenRatio = { value: b / a, ...part };
      continue;
    }
    if (ps.length === 2 && NUMBER.test(ps[0].text) && /^(eq|eqs|equiv|equivalents?)\.?$/i.test(ps[1].text)) {
      tok('ratio', part);
      const n = Number(ps[0].text);
      if (reactionPiece || writtenRatio) twice('ratio or reaction', part);
      else if (!(n > 0) || n > MAX_FIGURE)
        f.add('titre-amount', part.start, part.end, 'Equivalents: a positive number of mol of titrant per mol of analyte (`2 eq`).');
      else writtenRatio = { value: n, ...part };
      continue;
    }
    const words = (list: Piece[] = ps) => {
      for (const p of list) tok(NUMBER.test(p.text) ? 'number' : VOLUME_UNITS[p.text] || CONCENTRATION_UNITS[p.text] ? 'unit' : 'word', p);
    };
    if (first === 'less' || first === 'minus') {
      tok('word', ps[0]);
      if (ps.length < 2) {
        f.add('titre-syntax', ps[0].start, ps[0].end, `'${ps[0].text}' needs the substance whose share is taken off (\`less NiCl2·6H2O\`).`);
        continue;
      }
      const sp = { text: part.text.slice(ps[1].start - part.start), start: ps[1].start, end: part.end };
      tok('species', sp);
      const sub = readSubstance(sp, 'species');
      if ('findings' in sub) f.list.push(...sub.findings);
      else lessPieces.push({ piece: sp, analysis: sub.analysis, formula: sub.formula });
      continue;
    }
    if (first === 'blank') {
      words();
      tried.blank = true;
      const v = readVolume(ps, 1, 'blank', f, ps[0]);
      if (v && v.next < ps.length) f.add('titre-syntax', ps[v.next].start, part.end, 'Unexpected text after the blank volume.');
      if (v && blank) twice('blank', part);
      else if (v) blank = v.volume;
      continue;
    }
    const sampleAt = ps.findIndex((p) => /^(sample|aliquot)$/i.test(p.text));
    const takenAt = ps.findIndex((p) => /^(taken|titrated)$/i.test(p.text));
    if (sampleAt === 0 || (sampleAt === 2 && ps.length >= 3)) {
      words();
      tried.sample = true;
      const v = readVolume(ps, sampleAt === 0 ? 1 : 0, 'sample', f, ps[0]);
      if (!v) continue;
      let next = sampleAt === 0 ? v.next : 3;
      if (sample) twice('sample', part);
      else sample = v.volume;
      if (ps[next] && ps[next].text.toLowerCase() === 'diluted') {
        if (ps[next + 1]?.text.toLowerCase() !== 'to') {
          f.add('titre-syntax', ps[next].start, ps[next].end, "Write 'diluted to <volume>'.");
          continue;
        }
        const d = readVolume(ps, next + 2, 'dilution', f, ps[next + 1]);
        if (!d) continue;
        dilutedTo = d.volume;
        next = d.next;
      }
      if (next < ps.length)
        f.add('titre-syntax', ps[next].start, part.end, 'Unexpected text after the sample: write `<V> mL sample` or `sample <V> mL diluted to <V> mL`.');
      continue;
    }
    if (takenAt === 2 && ps.length === 3) {
      words();
      const v = readVolume(ps, 0, 'aliquot taken', f, ps[0]);
      if (v && taken) twice('aliquot taken', part);
      else if (v) taken = v.volume;
      continue;
    }
    if (NUMBER.test(ps[0].text)) {
      // The titre: <V> <unit> [of] <c> <unit> <titrant>.
      tried.titre = true;
      const v = readVolume(ps, 0, 'titre', f, ps[0]);
      let k = v ? v.next : ps.length;
      if (ps[k]?.text.toLowerCase() === 'of') k++;
      words(ps.slice(0, Math.min(k + 2, ps.length)));
      if (!v) continue;
      const c = ps[k];
      const cu = ps[k + 1];
      if (!c || !NUMBER.test(c.text)) {
        f.add('titre-amount', (c ?? ps[k - 1]).start, (c ?? ps[k - 1]).end, "The titrant's concentration is missing: write `<titre> mL <c> M <titrant>`.");
        continue;
      }
      const cUnit = cu ? CONCENTRATION_UNITS[cu.text] : undefined;
      if (!cUnit) {
        const hint = cu?.text === 'N' ? ': give normality as molarity (M) and the ratio' : '';
        f.add(
          'titre-amount',
          (cu ?? c).start,
          (cu ?? c).end,
          `The titrant's concentration needs a unit (M, mM or mol/L)${cu ? `, not '${short(cu.text)}'` : ''}${hint}.`,
        );
        continue;
      }
      const value = Number(c.text) * cUnit.factor;
      if (!(value > 0) || value > 100) {
        f.add('titre-amount', c.start, cu.end, "The titrant's concentration must be a positive molarity (at most 100 M).");
        continue;
      }
      const titrantPieces = ps.slice(k + 2);
      if (!titrantPieces.length) {
        f.add('titre-syntax', c.start, cu.end, 'No titrant after its concentration: name it (`EDTA`, `AgNO3`, `NaOH`).');
        continue;
      }
      const tp = { text: part.text.slice(titrantPieces[0].start - part.start), start: titrantPieces[0].start, end: part.end };
      tok('titrant', tp);
      if (titre) {
        twice('titre', part);
        continue;
      }
      titre = v.volume;
      titrantM = { value, text: `${c.text} ${cUnit.unit}`, start: c.start, end: cu.end };
      titrantPiece = tp;
      continue;
    }
    words();
    f.add(
      'titre-syntax',
      part.start,
      part.end,
      `'${short(part.text)}' is no part of a titre line: a sample (\`5.00 mL sample\`), a titre (\`21.30 mL 0.0500 M EDTA\`), \`<V> mL taken\`, \`blank <V> mL\`, a ratio (\`1:1\`, \`2 eq\`) or a reaction.`,
    );
  }

  // What must be there, and what must agree.
  const end = { start: line.end - 1 < line.start ? line.start : line.end - 1, end: line.end };
  if (!sample && parts.length && !tried.sample)
    f.add('titre-syntax', end.start, end.end, 'No sample volume: write the aliquot of bath titrated (`5.00 mL sample`).');
  if (!titre && parts.length && !tried.titre)
    f.add('titre-syntax', end.start, end.end, 'No titre: write the volume and concentration of titrant used (`21.30 mL 0.0500 M EDTA`).');
  if (dilutedTo && !taken && !f.failed)
    f.add('titre-syntax', dilutedTo.start, dilutedTo.end, 'The sample is diluted: write the part titrated (`10 mL taken`).');
  if (taken && !dilutedTo && !f.failed)
    f.add('titre-syntax', taken.start, taken.end, "An aliquot 'taken' needs a dilution (`sample 10 mL diluted to 100 mL`).");
  if (sample && dilutedTo && dilutedTo.litres < sample.litres)
    f.add('titre-amount', dilutedTo.start, dilutedTo.end, `The sample (${sample.text}) cannot be diluted to less than itself (${dilutedTo.text}).`);
  if (dilutedTo && taken && taken.litres > dilutedTo.litres)
    f.add('titre-amount', taken.start, taken.end, `The part taken (${taken.text}) is more than the diluted sample (${dilutedTo.text}).`);
  if (titre && blank && blank.litres >= titre.litres)
    f.add('titre-amount', blank.start, blank.end, `The blank (${blank.text}) is not less than the titre (${titre.text}).`);

  // The titrant.
  let titrant: TitreReading['titrant'] | null = null;
  if (titrantPiece) {
    const edta = /EDTA|edta/.test(titrantPiece.text);
    if (edta) titrant = { ...titrantPiece, display: titrantPiece.text === 'EDTA' ? 'EDTA' : subscriptDigits(titrantPiece.text), analysis: null, edta: true };
    else {
      const s = readSubstance(titrantPiece, 'titrant');
      if ('findings' in s) f.list.push(...s.findings);
      else titrant = { ...titrantPiece, display: s.analysis.display, analysis: s.analysis, edta: false };
    }
  }

  if (f.failed || !analyte || !sample || !titre || !titrant || !titrantM) {
    if (!f.failed) f.add('titre-syntax', line.start, line.end, 'The titre line is incomplete.');
    return fail();
  }

  // The ratio and the species that carries the analysis.
  const where = { start: titrant.start, end: titrant.end };
  let outcome: RatioOutcome;
  if (reactionPiece) {
    const r = ratioFromReaction(analyte.analysis, titrant, reactionPiece);
    if ('findings' in r) {
      f.list.push(...r.findings);
      return fail();
    }
    outcome = r;
  } else if (writtenRatio) {
    const byTitrant = ratioFromTitrant(analyte.analysis, titrant, where);
    outcome = {
      ratio: {
        titrantPerAnalyte: writtenRatio.value,
        source: 'written',
        basis: `${writtenRatio.text} as written: ${fmt(writtenRatio.value)} mol titrant per mol ${analyte.analysis.display}`,
        start: writtenRatio.start,
        end: writtenRatio.end,
      },
      carrier: 'error' in byTitrant ? null : byTitrant.carrier,
      carrierNote: 'error' in byTitrant ? `no ion follows from ${titrant.display}: write \`as <ion>\` for one` : byTitrant.carrierNote,
    };
  } else outcome = ratioFromTitrant(analyte.analysis, titrant, where);
  if ('error' in outcome) {
    f.add('titre-ratio', outcome.start, outcome.end, outcome.error);
    return fail();
  }
  let { carrier, carrierNote } = outcome;
  if (asSpecies) {
    const c = carrierFromAs(analyte.analysis, asSpecies.analysis);
    if (!c) {
      f.add('titre-analyte', asSpecies.start, asSpecies.end, `${asSpecies.analysis.display} is not an ion or element of ${analyte.analysis.display}.`);
      return fail();
    }
    carrier = c;
    carrierNote = undefined;
  }
  const less: NonNullable<TitreReading['less']> = [];
  for (const l of lessPieces) {
    const n = carrier ? carrierCountIn(l.analysis, carrier) : 0;
    if (!carrier || !n) {
      f.add(
        'titre-analyte',
        l.piece.start,
        l.piece.end,
        carrier
          ? `${l.analysis.display} holds no ${carrier.display}: nothing of it can be taken off.`
          : `No ion carries this analysis, so nothing of ${l.analysis.display} can be taken off.`,
      );
      return fail();
    }
    less.push({ ...l.piece, formula: l.formula, analysis: l.analysis, carrierCount: n });
  }
  if (hash >= 0) tok('comment', { text: text.slice(hash), start: offset + hash, end: offset + text.length });
  tokens.sort((x, y) => x.start - y.start);
  const reading: TitreReading = {
    ok: true,
    ...line,
    keyword,
    analyte,
    sample,
    titre,
    titrant,
    titrantM,
    ratio: outcome.ratio,
    carrier,
    tokens,
    diagnostics: f.list.sort((x, y) => x.start - y.start),
  };
  if (asSpecies) reading.as = { text: asSpecies.text, start: asSpecies.start, end: asSpecies.end };
  if (dilutedTo && taken) reading.dilution = { to: dilutedTo, taken };
  if (blank) reading.blank = blank;
  if (less.length) reading.less = less;
  if (carrierNote) reading.carrierNote = carrierNote;
  return reading;
}

/** How many of the carrier one formula unit of `a` holds (by ion, or by element for an element carrier). */
function carrierCountIn(a: FormulaAnalysis, c: Carrier): number {
  const atoms = atomsOfKey(c.key);
  if (!atoms) return 0;
  const els = Object.keys(atoms);
  if (!/[+-]$/.test(c.key) && els.length === 1) return a.atoms[els[0]] ?? 0;
  return speciesOf(a).find((s) => s.key === c.key)?.count ?? 0;
}

/** `as Ni` (an element of the analyte, counted by atoms) or `as Cl-` (one of its ions). */
function carrierFromAs(analyte: FormulaAnalysis, as: FormulaAnalysis): Carrier | null {
  const mm = as.molarMass?.value ?? NaN;
  if (as.charge !== 0) {
    const s = speciesOf(analyte).find((x) => x.charge === as.charge && hillFormula(x.atoms) === as.hill);
    return s ? { display: s.display, key: s.key, molarMass: s.molarMass, perAnalyte: s.count, why: "written with 'as'" } : null;
  }
  const els = Object.keys(as.atoms);
  if (els.length === 1 && as.atoms[els[0]] === 1 && analyte.atoms[els[0]] > 0)
    return { display: as.display, key: as.ascii, molarMass: mm, perAnalyte: analyte.atoms[els[0]], why: "written with 'as'" };
  return null;
}

// ---------------------------------------------------------------------------------------------------
// The arithmetic.

/** A number for a basis text: four significant digits, whole numbers as they are. */
export const fmt = (x: number): string => (Number.isInteger(x) && Math.abs(x) < 1e6 ? String(x) : String(Number(x.toPrecision(4))));

/** Beyond this many times the target (or below its inverse) a result is flagged: common practice for a slip of dilution or unit. */
export const TARGET_FACTOR = 3;

export interface TitreOptions {
  /** The batch's target for this substance, mol/L of the analyte as written (hydrate forms compare by mol). */
  targetM?: number;
  /** Where the target is written, for the message. */
  targetText?: string;
  /** For each `less` substance of the reading, in order: its concentration in the bath (mol/L), from its own titre. */
  lessM?: readonly number[];
}

export interface TitreResult {
  reading: TitreReading;
  /** mol of titrant used (titre less blank). */
  titrantMol: number;
  /** mol of analyte in the part titrated. */
  analyteMol: number;
  /** Bath volume per volume titrated: 1, or (diluted to ÷ sample) for a diluted sample. */
  dilutionFactor: number;
  /** The bath's concentration of the analyte, mol/L (after any `less`). */
  concentrationM: number;
  /** Before the `less` substances were taken off, where any were. */
  totalM?: number;
  /** g/L of the analyte as written (a hydrate with its water). */
  saltGPerL: number;
  /** g/L of the ion or element that carries the analysis; null where none does (with `carrierNote`). */
  carrierGPerL: number | null;
  /** The estimate against the solubility table (anhydrous g per 100 g water), where the salt is in it. */
  solubility?: { row: SolubilityRow; per100gWater: number | null; exceeds: boolean };
  /** Measured ÷ target, where a target is given. */
  ofTarget?: number;
  /** The arithmetic, line by line, for the hover. */
  basis: string[];
  diagnostics: ChemDiagnostic[];
}

const litresText = (v: WrittenVolume) => v.text;

/** The bath's concentration from a titre, with the checks: solubility, and the target where given. */
export function computeTitre(reading: TitreReading, options: TitreOptions = {}): TitreResult {
  const { analyte, titrantM, ratio, carrier } = reading;
  const a = analyte.analysis;
  const titreL = reading.titre.litres - (reading.blank?.litres ?? 0);
  const titrantMol = titreL * titrantM.value;
  const analyteMol = titrantMol / ratio.titrantPerAnalyte;
  const titratedL = reading.dilution ? reading.dilution.taken.litres : reading.sample.litres;
  const dilutionFactor = reading.dilution ? reading.dilution.to.litres / reading.sample.litres : 1;
  const totalM = (analyteMol / titratedL) * dilutionFactor;
  const lessFindings: ChemDiagnostic[] = [];
  let concentrationM = totalM;
  const lessLines: string[] = [];
  if (reading.less && carrier) {
    let carrierM = totalM * carrier.perAnalyte;
    reading.less.forEach((l, k) => {
      const m = options.lessM?.[k];
      if (m === undefined || !(m >= 0)) {
        lessFindings.push({
          code: 'titre-analyte',
          severity: 'error',
          start: l.start,
          end: l.end,
          message: `No titre of ${l.analysis.display} in this batch to take off: the figure is all the ${carrier.display} the titrant found.`,
        });
        return;
      }
      carrierM -= m * l.carrierCount;
      lessLines.push(
        `less ${l.analysis.display}: ${fmt(m)} mol/L × ${l.carrierCount} ${carrier.display} = ${fmt(m * l.carrierCount)} mol/L of ${carrier.display} taken off`,
      );
    });
    concentrationM = carrierM / carrier.perAnalyte;
  }
  const mm = a.molarMass?.value ?? NaN;
  const saltGPerL = concentrationM * mm;
  const carrierGPerL = carrier ? concentrationM * carrier.perAnalyte * carrier.molarMass : null;
  const ml = (l: number) => fmt(l * 1000);
  const basis: string[] = [];
  const blank = reading.blank ? ` − ${ml(reading.blank.litres)} mL blank` : '';
  basis.push(`titrant: (${ml(reading.titre.litres)} mL${blank}) × ${fmt(titrantM.value)} mol/L = ${fmt(titrantMol * 1000)} mmol ${reading.titrant.display}`);
  basis.push(`ratio: ${fmt(ratio.titrantPerAnalyte)} mol titrant per mol ${a.display} (${ratio.basis})`);
  basis.push(`${a.display} titrated: ${fmt(titrantMol * 1000)} ÷ ${fmt(ratio.titrantPerAnalyte)} = ${fmt(analyteMol * 1000)} mmol in ${ml(titratedL)} mL`);
  if (reading.dilution)
    basis.push(
      `dilution: ${litresText(reading.sample)} made up to ${litresText(reading.dilution.to)}, ${litresText(reading.dilution.taken)} taken: × ${fmt(dilutionFactor)}`,
    );
  basis.push(`bath: ${fmt(analyteMol * 1000)} mmol ÷ ${ml(titratedL)} mL${dilutionFactor !== 1 ? ` × ${fmt(dilutionFactor)}` : ''} = ${fmt(totalM)} mol/L`);
  if (lessLines.length && carrier) {
    basis.push(`${carrier.display} found: ${fmt(totalM)} × ${carrier.perAnalyte} = ${fmt(totalM * carrier.perAnalyte)} mol/L`);
    basis.push(...lessLines);
    basis.push(`${a.display}: what is left ÷ ${carrier.perAnalyte} = ${fmt(concentrationM)} mol/L`);
  }
  basis.push(`${a.display}: ${fmt(concentrationM)} mol/L × ${fmt(mm)} g/mol = ${fmt(saltGPerL)} g/L`);
  if (carrier && carrierGPerL !== null)
    basis.push(
      `${carrier.display} (${carrier.why}): ${fmt(concentrationM)} × ${carrier.perAnalyte} × ${fmt(carrier.molarMass)} g/mol = ${fmt(carrierGPerL)} g/L`,
    );
  else if (reading.carrierNote) basis.push(`no ion given separately: ${reading.carrierNote}`);
  const out: TitreResult = {
    reading,
    titrantMol,
    analyteMol,
    dilutionFactor,
    concentrationM,
    saltGPerL,
    carrierGPerL,
    basis,
    diagnostics: [...reading.diagnostics, ...lessFindings],
  };
  if (concentrationM !== totalM) out.totalM = totalM;
  if (concentrationM <= 0) {
    out.diagnostics.push({
      code: 'titre-implausible',
      severity: 'warning',
      start: reading.start,
      end: reading.end,
      message: `Nothing of ${a.display} is left once the other substances are taken off (${fmt(concentrationM)} mol/L): check both titres.`,
    });
  }

  // Above the solubility (an estimate, as the batch's own check: water ≈ 1000 g/L less the dissolved salt).
  const an = anhydrousOf(a);
  const row = an ? solubilityRow(an.hill) : a.charge === 0 ? solubilityRow(a.hill) : undefined;
  if (row && an) {
    const anhydrousGPerL = concentrationM * an.molarMass;
    const waterG = 1000 - anhydrousGPerL;
    const per100 = waterG > 0 ? (anhydrousGPerL / waterG) * 100 : null;
    const exceeds = per100 === null || per100 > row.gPer100gWater;
    out.solubility = { row, per100gWater: per100, exceeds };
    if (exceeds) {
      const sol = `${fmt(row.gPer100gWater)} g per 100 g water at ${row.temperatureC} °C`;
      const kind = row.gPer100gWater < PRACTICALLY_INSOLUBLE_BELOW ? ' (practically insoluble)' : '';
      out.diagnostics.push({
        code: 'titre-implausible',
        severity: 'warning',
        start: reading.start,
        end: reading.end,
        message: `${fmt(anhydrousGPerL)} g/L of ${subscriptDigits(row.formula)} is above its solubility of ${sol}${kind}: check the sample volume, the dilution and the titrant's units. Estimate: water ≈ 1000 g/L less the dissolved salt.`,
        data: { concentrationM, per100gWater: per100, solubility: row.gPer100gWater },
      });
    }
  }
  // Far from the target: the usual sign of a dilution or unit slip (common practice: 3× either way).
  const target = options.targetM;
  if (target !== undefined && target > 0) {
    const ofTarget = concentrationM / target;
    out.ofTarget = ofTarget;
    basis.push(`target ${fmt(target)} mol/L${options.targetText ? ` (${options.targetText})` : ''}: ${fmt(ofTarget * 100)} % of target`);
    if (ofTarget > TARGET_FACTOR || ofTarget < 1 / TARGET_FACTOR) {
      out.diagnostics.push({
        code: 'titre-implausible',
        severity: 'warning',
        start: reading.start,
        end: reading.end,
        message: `${fmt(concentrationM)} mol/L of ${a.display} is ${ofTarget > 1 ? `${fmt(ofTarget)} times` : `${fmt(ofTarget * 100)} % of`} the batch's target (${fmt(target)} mol/L): more than ${TARGET_FACTOR}× away is the usual sign of a dilution or unit slip (common practice). Check the sample volume, the dilution and the titrant before making additions.`,
        data: { concentrationM, targetM: target, ofTarget },
      });
    }
  }
  out.diagnostics.sort((x, y) => x.start - y.start);
  return out;
}
