/**
 * Formula → systematic English name, following IUPAC, Nomenclature of Inorganic Chemistry,
 * Recommendations 2005 (the "Red Book"):
 * - elements (IR-3.4: dioxygen, octasulfur), ions (IR-5.3: iron(3+), chloride, sulfate);
 * - salts: stoichiometric names with the Stock number of a metal of more than one usual state (IR-5.4.2.2:
 *   iron(III) chloride; sodium chloride), acid salts with the "hydrogen" prefix written as one word
 *   (IR-8.5: sodium hydrogencarbonate), peroxides and superoxides (IR-5.3.3), hydrates (IR-5.5:
 *   copper(II) sulfate pentahydrate);
 * - coordination compounds (IR-9): ligands in alphabetical order with multiplying prefixes, the central
 *   atom (with -ate in an anion: ferrate, cuprate) and its oxidation number, or the charge number where a
 *   ligand's formal charge is not innocent (nitrosyl): potassium hexacyanidoferrate(III);
 * - binary compounds of non-metals with multiplying prefixes (IR-5.2: dinitrogen tetraoxide, sulfur
 *   hexafluoride; "monoxide" as the allowed exception), the electropositive constituent first by the
 *   element sequence of Table VI, in which oxygen comes before the halogens: OCl2 is oxygen dichloride
 *   (an IR-5.2 example) and ClO2 dioxygen chloride, with the trade's names (chlorine dioxide) beside
 *   them from ./common.ts; the reader takes either order;
 * - acids by their usual names (IR-8, Table IR-8.1: sulfuric acid); the hydrogen halides as compounds
 *   (hydrogen chloride; its solution is hydrochloric acid).
 * What the reading leaves open (two cations, mixed valence, an organic formula with isomers) has no name
 * rather than a guessed one.
 */
import type { FormulaAnalysis } from '../analyse';
import type { IonInReading } from '../charge/balance';
import { element, isMetal } from '../data/elements';
import { ANIONS, CATIONS } from '../data/ions';
import type { FormulaItem, FormulaPart } from '../formula/ast';
import { parseFormula } from '../formula/parse';
import { acidByForm } from './acids';
import { COMMON_NAMES } from './common';
import { ligandByForm, type LigandDef } from './ligands';
import { ateName, COMPLEX_PREFIX, hydrateWord, PREFIX, ROMAN } from './words';

/** Metals named without an oxidation number: they have one state in their salts (IUPAC 2005, IR-5.4.2.2). */
export const ONE_STATE = new Set(['Li', 'Na', 'K', 'Rb', 'Cs', 'Be', 'Mg', 'Ca', 'Sr', 'Ba', 'Ra', 'Al', 'Zn', 'Cd', 'Ag', 'Ga', 'Sc', 'Y', 'La']);

/** Names of monatomic anions (IUPAC 2005, IR-5.3.3.2 and Table IX). */
export const MONATOMIC_ANIONS: Record<string, string> = {
  F: 'fluoride',
  Cl: 'chloride',
  Br: 'bromide',
  I: 'iodide',
  At: 'astatide',
  O: 'oxide',
  S: 'sulfide',
  Se: 'selenide',
  Te: 'telluride',
  N: 'nitride',
  P: 'phosphide',
  As: 'arsenide',
  Sb: 'antimonide',
  H: 'hydride',
  C: 'carbide',
  Si: 'silicide',
  Ge: 'germanide',
  B: 'boride',
};

/**
 * The element sequence of IUPAC 2005 Table VI for the non-metals, least electronegative first (up each
 * group: B, then Ge Si C, Sb As P N, H, Te Se S O, At I Br Cl F); the constituent later in it is named
 * last, with -ide.
 */
const SEQUENCE = ['Rn', 'Xe', 'Kr', 'Ar', 'Ne', 'He', 'B', 'Ge', 'Si', 'C', 'Sb', 'As', 'P', 'N', 'H', 'Te', 'Se', 'S', 'O', 'At', 'I', 'Br', 'Cl', 'F'];
const RANK = new Map(SEQUENCE.map((s, i) => [s, i]));

/** The ion name in IUPAC 2005 spelling: the "hydrogen" prefix joined to the anion (hydrogensulfate). */
export function anionName(name: string): string {
  return name.replace(/^((?:di|tri)?hydrogen) (?=[a-z]+$)/, '$1');
}

/** The formula of items as written, without brackets around the whole: `Fe(CN)6`, `CH3COOH`. */
export function itemsText(items: readonly FormulaItem[]): string {
  let s = '';
  for (const it of items) {
    const n = it.count === 1 ? '' : String(it.count);
    if (it.kind === 'element') s += it.symbol + n;
    else if (it.kind === 'abbrev') s += (it.count === 1 ? it.name : `(${it.name})`) + n;
    else s += (it.open === '[' ? '[' : '(') + itemsText(it.items) + (it.open === '[' ? ']' : ')') + n;
  }
  return s;
}

/** The number of water molecules of crystallisation (the parts after the first, each H2O), or undefined. */
export function waterOf(parts: readonly FormulaPart[]): number | undefined {
  let water = 0;
  for (const p of parts.slice(1)) {
    if (itemsText(p.items) !== 'H2O') return undefined;
    water += p.multiplier;
  }
  return water;
}

const withWater = (name: string, water: number) => {
  if (!water) return name;
  const w = hydrateWord(water);
  return w ? `${name} ${w}` : undefined;
};

/** The systematic name of an analysed formula, or undefined where the reading does not make it plain. */
export function systematicName(a: FormulaAnalysis): string | undefined {
  const f = a.formula;
  if (!a.ok || !f || !a.charges || f.variableCounts?.length) return undefined;
  const water = waterOf(f.parts);
  if (water === undefined) return undefined;
  const main = f.parts[0];
  const c = a.charges;
  if (c.basis === 'element' && f.parts.length === 1 && main.items.length === 1 && main.items[0].kind === 'element') {
    const it = main.items[0];
    const el = element(it.symbol);
    if (!el) return undefined;
    if (a.charge !== 0) return undefined;
    return it.count === 1 ? el.name : PREFIX[it.count] ? PREFIX[it.count] + el.name : undefined;
  }
  if (c.basis === 'ionic' && c.ions && c.balanced) {
    const n = ionicName(c.ions, a.charge);
    if (n) return withWater(n, water);
  }
  if (a.charge === 0) {
    const complex = complexSaltName(main.items);
    if (complex) return withWater(complex, water);
  }
  if (main.multiplier !== 1) return undefined;
  const bare = itemsText(main.items);
  if (a.charge !== 0) {
    // An ion the charge reading took as a molecule (HCO3⁻: a weak acid's anion).
    const ion = f.parts.length === 1 ? (ANION_BY_FORM.get(bare) ?? POLY_CATIONS.get(bare)) : undefined;
    return ion && ion.charge === a.charge ? anionName(ion.name) : undefined;
  }
  // Acids and named molecules, with their water of crystallisation (oxalic acid dihydrate).
  const acid = acidByForm(bare);
  const molecular = acid ? (acid.compound ?? acid.name) : (MOLECULAR_BY_FORM.get(bare) ?? binaryName(main.items));
  return molecular && (f.parts.length === 1 || molecular !== 'water') ? withWater(molecular, water) : undefined;
}

/** Molecular substances that IUPAC names outright (water, ammonia, ethanol), by written form. */
const MOLECULAR_BY_FORM = new Map<string, string>();
for (const row of COMMON_NAMES) if (row.iupac) for (const form of row.forms ?? [row.formula]) MOLECULAR_BY_FORM.set(form, row.iupac);

const CATION_NAMES = new Map(CATIONS.map((c) => [c.forms[0], c.name]));

/** The name of one or two ions (a lone ion, or a salt of one cation and one anion). */
function ionicName(ions: readonly IonInReading[], charge: number): string | undefined {
  if (ions.length === 1 && charge !== 0) return loneIonName(ions[0]);
  if (charge !== 0 || ions.length !== 2) return undefined;
  const cat = ions.find((i) => i.role === 'cation');
  const an = ions.find((i) => i.role === 'anion');
  if (!cat || !an) return undefined;
  const cation = cationName(cat);
  const anion = anionOf(an);
  if (!cation || !anion) return undefined;
  // A monatomic anion at other than its usual charge (CaSi2, a Zintl phase: not Ca2Si): the
  // stoichiometric name with multiplying prefixes (IUPAC 2005, IR-5.2).
  if (an.kind === 'monatomic-anion' && an.element && an.charge !== element(an.element)?.commonStates.find((s) => s < 0) && cat.kind === 'metal') {
    const el = element(cat.element ?? '');
    const pc = cat.count === 1 ? '' : PREFIX[cat.count];
    const pa = an.count === 1 ? '' : PREFIX[an.count];
    return el && pc !== undefined && pa !== undefined ? `${pc}${el.name} ${pa}${anion}` : undefined;
  }
  return `${cation} ${anion}`;
}

function loneIonName(ion: IonInReading): string | undefined {
  if (ion.kind === 'complex') return complexName(ion.text, ion.charge);
  if (ion.text === 'Hg2') return 'dimercury(2+)'; // IUPAC 2005, IR-5.3.2.2
  if (ion.role === 'anion') return anionOf(ion);
  if (ion.kind === 'metal' && ion.element && Number.isInteger(ion.charge)) {
    const name = element(ion.element)?.name;
    return name && `${name}(${ion.charge}+)`;
  }
  return ion.ionName;
}

function cationName(cat: IonInReading): string | undefined {
  if (!Number.isInteger(cat.charge) || new Set(cat.states).size > 1) return undefined;
  if (cat.kind === 'metal' && cat.element) {
    const name = element(cat.element)?.name;
    return name && (ONE_STATE.has(cat.element) ? name : `${name}(${ROMAN[cat.charge] ?? cat.charge})`);
  }
  if (cat.kind === 'complex') return complexName(cat.text, cat.charge);
  if (cat.kind === 'polyatomic') return cat.ionName ?? CATION_NAMES.get(cat.text);
  return undefined;
}

function anionOf(an: IonInReading): string | undefined {
  if (an.kind === 'monatomic-anion' && an.element) return MONATOMIC_ANIONS[an.element];
  if (an.kind === 'polyatomic' && an.ionName) return anionName(an.ionName);
  if (an.kind === 'complex') return complexName(an.text, an.charge);
  return undefined;
}

interface LigandUse {
  ligand: LigandDef;
  count: number;
}

/** The ligands of a complex written `items` after its central atom, or undefined where one is unknown. */
function readLigands(items: readonly FormulaItem[]): LigandUse[] | undefined {
  const out: LigandUse[] = [];
  let i = 0;
  while (i < items.length) {
    const it = items[i];
    if (it.kind === 'group') {
      const l = ligandByForm(itemsText(it.items));
      if (!l) return undefined;
      out.push({ ligand: l, count: it.count });
      i++;
      continue;
    }
    if (it.kind === 'abbrev') {
      const l = ligandByForm(it.name);
      if (!l) return undefined;
      out.push({ ligand: l, count: it.count });
      i++;
      continue;
    }
    // A run of elements: the longest that names a ligand. One element carries its count (`Cl4`: four
    // chlorido); in a longer run only the last may have a count, read as part of the ligand first
    // (`NO2` nitrito-κN) and as the ligand's count otherwise.
    let found = false;
    for (let j = Math.min(items.length, i + 3); j > i && !found; j--) {
      const run = items.slice(i, j) as FormulaItem[];
      if (run.some((r, k) => r.kind !== 'element' || (k < run.length - 1 && r.count !== 1))) continue;
      const symbols = run.map((r) => (r as Extract<FormulaItem, { kind: 'element' }>).symbol).join('');
      const last = run[run.length - 1];
      const whole = run.length > 1 && last.count !== 1 ? ligandByForm(symbols + last.count) : undefined;
      const l = whole ?? ligandByForm(symbols);
      if (!l) continue;
      out.push({ ligand: l, count: whole ? 1 : last.count });
      i = j;
      found = true;
    }
    if (!found) return undefined;
  }
  return out;
}

const sortKey = (name: string) => name.replace(/^[\d,′-]+/, '').replace(/[^a-z]/g, '');

/** The ligand part of a complex's name: `tetraammine`, `bis(ethane-1,2-diamine)dichlorido`. */
function ligandWords(uses: LigandUse[]): string | undefined {
  const merged = new Map<LigandDef, number>();
  for (const u of uses) merged.set(u.ligand, (merged.get(u.ligand) ?? 0) + u.count);
  const parts: string[] = [];
  for (const [l, n] of [...merged].sort((x, y) => (sortKey(x[0].name) < sortKey(y[0].name) ? -1 : 1))) {
    if (!Number.isInteger(n) || n < 1) return undefined;
    if (l.enclosed) parts.push(n === 1 ? `(${l.name})` : `${COMPLEX_PREFIX[n] ?? `${n}`}(${l.name})`);
    else parts.push(n === 1 ? l.name : (PREFIX[n] ?? `${n}`) + l.name);
  }
  return parts.join('');
}

/**
 * The name of a complex written `text` (central atom first, then its ligands: `Fe(CN)6`, `Co(NH3)5Cl`)
 * carrying `charge`: hexacyanidoferrate(III), pentaamminechloridocobalt(III).
 */
export function complexName(text: string, charge: number): string | undefined {
  const parsed = parseFormula(text);
  if (!parsed.ok || !parsed.formula || parsed.formula.parts.length !== 1) return undefined;
  const items = parsed.formula.parts[0].items;
  const centre = items[0];
  if (!centre || centre.kind !== 'element' || centre.count !== 1 || !isMetal(centre.symbol)) return undefined;
  const uses = readLigands(items.slice(1));
  if (!uses || !uses.length) return undefined;
  const words = ligandWords(uses);
  const el = element(centre.symbol);
  if (!words || !el) return undefined;
  const metal = charge < 0 ? ateName(el.symbol, el.name) : el.name;
  const innocent = uses.every((u) => u.ligand.name !== 'nitrosyl');
  if (!innocent) return `${words}${metal}(${Math.abs(charge)}${charge < 0 ? '−' : '+'})`.replace(/\((0)[+−]\)$/, '(0)');
  const state = charge - uses.reduce((s, u) => s + u.ligand.charge * u.count, 0);
  if (!Number.isInteger(state) || state < 0 || state >= ROMAN.length) return undefined;
  return `${words}${metal}(${ROMAN[state]})`;
}

const ANION_BY_FORM = new Map<string, { name: string; charge: number }>();
for (const an of ANIONS) for (const form of an.forms) if (!ANION_BY_FORM.has(form)) ANION_BY_FORM.set(form, { name: an.name, charge: an.charges[0] });
const POLY_CATIONS = new Map<string, { name: string; charge: number }>(CATIONS.map((c) => [c.forms[0], { name: c.name, charge: c.charges[0] }]));

/**
 * A salt with a complex in square brackets that the ionic reading did not take (a neutral complex
 * `[Ni(CO)4]`, or a counter-ion of one usual charge beside the complex: `Na2[Fe(CN)5NO]`).
 */
function complexSaltName(items: readonly FormulaItem[]): string | undefined {
  const brackets = items.filter((it) => it.kind === 'group' && it.open === '[');
  if (brackets.length !== 1) return undefined;
  const complex = brackets[0] as Extract<FormulaItem, { kind: 'group' }>;
  const others = items.filter((it) => it !== complex);
  const inner = itemsText(complex.items);
  if (!others.length) return complex.count === 1 ? complexName(inner, 0) : undefined;
  if (others.length !== 1) return undefined;
  const o = others[0];
  let counter: { name: string; charge: number } | undefined;
  if (o.kind === 'element' && ONE_STATE.has(o.symbol)) {
    const el = element(o.symbol);
    const q = el?.commonStates.find((s) => s > 0);
    if (el && q) counter = { name: el.name, charge: q };
  } else if (o.kind === 'element' && MONATOMIC_ANIONS[o.symbol] && !isMetal(o.symbol)) {
    const el = element(o.symbol);
    const q = el?.commonStates.find((s) => s < 0);
    if (q) counter = { name: MONATOMIC_ANIONS[o.symbol], charge: q };
  } else if (o.kind === 'group') {
    const key = itemsText(o.items);
    counter = POLY_CATIONS.get(key) ?? ANION_BY_FORM.get(key);
  }
  if (!counter) return undefined;
  const total = counter.charge * o.count;
  if (total % complex.count !== 0) return undefined;
  const charge = -total / complex.count;
  const cname = complexName(inner, charge);
  if (!cname) return undefined;
  const counterName = counter.charge < 0 ? anionName(counter.name) : counter.name;
  return charge < 0 ? `${counterName} ${cname}` : `${cname} ${counterName}`;
}

/** A binary compound of two non-metals: `dinitrogen tetraoxide`, `sulfur hexafluoride`, `carbon monoxide`. */
function binaryName(items: readonly FormulaItem[]): string | undefined {
  if (items.length !== 2 || items.some((it) => it.kind !== 'element')) return undefined;
  const [x, y] = items as Array<Extract<FormulaItem, { kind: 'element' }>>;
  if (x.symbol === y.symbol || !RANK.has(x.symbol) || !RANK.has(y.symbol) || x.symbol === 'H' || y.symbol === 'H') return undefined;
  const [first, second] = (RANK.get(x.symbol) as number) < (RANK.get(y.symbol) as number) ? [x, y] : [y, x];
  const ide = MONATOMIC_ANIONS[second.symbol];
  const el = element(first.symbol);
  if (!ide || !el || !PREFIX[first.count] || !PREFIX[second.count]) return undefined;
  const head = first.count === 1 ? el.name : PREFIX[first.count] + el.name;
  let tail: string;
  if (second.count === 1) tail = first.count === 1 && second.symbol === 'O' ? 'monoxide' : ide;
  else tail = PREFIX[second.count] + ide;
  return `${head} ${tail}`;
}
