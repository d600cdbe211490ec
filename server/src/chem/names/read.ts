/**
 * Name → formula: systematic names (IUPAC 2005, as named by ./systematic.ts, and the older forms a label
 * still carries: chloro for chlorido, ferric for iron(III), sulphate, pentoxide), acid names, and the
 * shelf's names (./common.ts: borax, caustic soda, bleach).
 *
 * Matching is by a squashed key (./words.ts `squash`): case, spaces, hyphens and the British and American
 * spellings do not matter. A salt's name is read as its parts — cation (with its Stock number or charge
 * number), anion, hydrate — so every combination is read, not only the listed ones; a complex as its
 * ligands, central atom and oxidation number.
 *
 * What is never done: a name that is not read exactly is never taken as the nearest one. A misspelt name
 * (`sodium chlorade`) gets status `near` with the candidates it is close to (sodium chloride and sodium
 * chlorate), and no formula; a salt whose name leaves the metal's state open (`iron chloride`) gets
 * status `ambiguous` with each reading. A name read exactly that is within two letters of another
 * compound of the same stem (chlorate/chloride/chlorite, sulfite/sulfate, nitrite/nitrate) carries those
 * as `lookalikes`, for a hover to show.
 */
import { analyseFormula } from '../analyse';
import { BoundedCache, detach } from '../cache';
import { element, ELEMENTS, isMetal } from '../data/elements';
import { ANIONS, CATIONS } from '../data/ions';
import { ACIDS } from './acids';
import { COMMON_NAMES } from './common';
import { distanceWithin } from './fuzzy';
import { LIGANDS, type LigandDef } from './ligands';
import { anionName, MONATOMIC_ANIONS, ONE_STATE, systematicName } from './systematic';
import { formulaAtoms, hillFormula } from '../formula/compute';
import { parseFormula } from '../formula/parse';
import { ateName, COMPLEX_PREFIX, HYDRATE_WORDS, OLD_CATION_NAMES, PREFIX, ROMAN, ROMAN_VALUE, squash } from './words';

export type NameStatus = 'exact' | 'ambiguous' | 'near' | 'unknown';

export interface NameCandidate {
  /** The name as the tool writes it. */
  name: string;
  /** A formula the formula reader reads (ASCII; `·` before water of crystallisation). */
  formula: string;
  hill: string;
}

export interface NameReading {
  status: NameStatus;
  /** The text that was read (as given). */
  text: string;
  /** Offsets of the name within the text given (leading and trailing blanks left out). */
  start: number;
  end: number;
  /** Where status is `exact`: the formula, its Hill form and the name as the tool writes it. */
  formula?: string;
  hill?: string;
  name?: string;
  /** How it was read: a systematic or acid name, a shelf name from the table, an element, an ion. */
  via?: 'systematic' | 'shelf' | 'acid' | 'element' | 'ion';
  /** The name is of a solution in water (bleach, muriatic acid): the assay must come from the label. */
  solution?: { typical: string };
  /** `ambiguous` and `near`: each reading the name may mean; none is taken. */
  candidates: NameCandidate[];
  /** `exact`: compounds whose names differ by a letter or two (chlorate for chlorite). */
  lookalikes: NameCandidate[];
  /** What the reading assumed (an oxidation state not written, a trade name's meaning). */
  notes: string[];
  /** The warning for `ambiguous`, `near` and `unknown`. */
  message?: string;
}

// ---------------------------------------------------------------------------------------------------
// The parts names are read from.

interface Ion {
  /** The formula of one ion, as it stands in a formula (`NO3`, `Fe`, `[Fe(CN)6]`). */
  formula: string;
  charge: number;
  /** More than one atom: bracketed when counted (`(NO3)2`). */
  multi: boolean;
}

interface CationWord {
  symbol?: string;
  /** Fixed by the word (ferric, ammonium); else from the Stock number or the metal's usual state. */
  charge?: number;
  ion?: Ion;
}

const CATION_WORDS = new Map<string, CationWord>();
for (const e of ELEMENTS) if (isMetal(e.symbol)) CATION_WORDS.set(squash(e.name), { symbol: e.symbol });
for (const [word, v] of Object.entries(OLD_CATION_NAMES)) CATION_WORDS.set(word, { symbol: v.symbol, charge: v.charge });
for (const c of CATIONS) {
  if (c.name === 'mercury(I)') continue;
  CATION_WORDS.set(squash(c.name), { charge: c.charges[0], ion: { formula: c.forms[0], charge: c.charges[0], multi: true } });
}
CATION_WORDS.set('oxidanium', { charge: 1, ion: { formula: 'H3O', charge: 1, multi: true } });
CATION_WORDS.set('mercurous', { symbol: 'Hg', charge: 1 });

const ANION_WORDS = new Map<string, Ion & { name: string }>();
const addAnion = (word: string, formula: string, charge: number, name: string) => {
  const k = squash(word);
  if (!ANION_WORDS.has(k)) ANION_WORDS.set(k, { formula, charge, multi: (formula.match(/[A-Z]/g)?.length ?? 0) > 1 || /\d/.test(formula), name });
};
for (const [symbol, word] of Object.entries(MONATOMIC_ANIONS)) {
  const q = element(symbol)?.commonStates.find((s) => s < 0);
  if (q) addAnion(word, symbol, q, word);
}
for (const an of ANIONS) {
  if (an.forms[0] === 'Sx') continue;
  an.charges.forEach((q) => {
    const name = an.namesByCharge?.[q] ?? an.name;
    addAnion(name, an.forms[0], q, name);
  });
}
// Trade names of anions (common practice): bicarbonate, bisulfate, metabisulfite, ethanoate, ferricyanide.
for (const [word, target] of [
  ['bicarbonate', 'hydrogen carbonate'],
  ['bisulfate', 'hydrogen sulfate'],
  ['bisulfite', 'hydrogen sulfite'],
  ['metabisulfite', 'disulfite'],
  ['pyrosulfite', 'disulfite'],
  ['ethanoate', 'acetate'],
  ['methanoate', 'formate'],
  ['orthophosphate', 'phosphate'],
  ['pyrophosphate', 'diphosphate'],
  ['monohydrogen phosphate', 'hydrogen phosphate'],
  ['tripolyphosphate', 'triphosphate'],
  ['hydrosulfite', 'dithionite'],
  ['persulfate', 'peroxodisulfate'],
  ['peroxydisulfate', 'peroxodisulfate'],
  ['hydrosulfide', 'hydrogen sulfide'],
  ['hypophosphite', 'hypophosphite'],
  ['phosphinate', 'hypophosphite'],
  ['borohydride', 'tetrahydroborate'],
  ['fluoroborate', 'tetrafluoroborate'],
  ['fluorosilicate', 'hexafluorosilicate'],
  ['edta', 'edetate'],
  ['lauryl sulfate', 'dodecyl sulfate'],
  ['laurylsulfate', 'dodecyl sulfate'],
] as const) {
  const t = ANION_WORDS.get(squash(target));
  if (t) ANION_WORDS.set(squash(word), t);
}
ANION_WORDS.set('ferricyanide', { formula: '[Fe(CN)6]', charge: -3, multi: true, name: 'hexacyanidoferrate(III)' });
ANION_WORDS.set('ferrocyanide', { formula: '[Fe(CN)6]', charge: -4, multi: true, name: 'hexacyanidoferrate(II)' });

const MAX_WORD = Math.max(...[...CATION_WORDS.keys(), ...ANION_WORDS.keys()].map((k) => k.length));

/** Ligand words, squashed, with the older names (chloro, cyano, aquo). Longest first. */
const LIGAND_WORDS: Array<[string, LigandDef]> = LIGANDS.flatMap((l) => [l.name, ...(l.older ?? [])].map((n): [string, LigandDef] => [squash(n), l])).sort(
  (a, b) => b[0].length - a[0].length,
);
const SIMPLE_PREFIXES = PREFIX.slice(2, 13)
  .map((p, i): [string, number] => [p, i + 2])
  .sort((a, b) => b[0].length - a[0].length);
const ENCLOSED_PREFIXES = COMPLEX_PREFIX.slice(2)
  .map((p, i): [string, number] => [p, i + 2])
  .sort((a, b) => b[0].length - a[0].length);

/** Central atoms of anionic complexes by their -ate names (ferrate, cuprate, cobaltate). */
const ATE_WORDS = new Map<string, string>();
for (const e of ELEMENTS) if (isMetal(e.symbol)) ATE_WORDS.set(ateName(e.symbol, e.name), e.symbol);

/** Shelf, acid, element and ion names read as a whole, by squashed key. */
interface WholeName {
  name: string;
  formula: string;
  via: NonNullable<NameReading['via']>;
  solution?: { typical: string };
  note?: string;
}
const WHOLE = new Map<string, WholeName>();
const addWhole = (word: string, w: WholeName) => {
  const k = squash(word);
  if (!WHOLE.has(k)) WHOLE.set(k, w);
};
for (const row of COMMON_NAMES) {
  for (const n of row.names)
    addWhole(n, {
      name: row.names[0],
      formula: row.formula,
      via: 'shelf',
      solution: row.solution,
      note: row.note ? `${row.names[0]}: ${row.note}` : undefined,
    });
}
for (const acid of ACIDS) {
  for (const n of [acid.name, ...(acid.aliases ?? [])])
    addWhole(n, { name: acid.name, formula: acid.forms[0], via: 'acid', solution: acid.typical ? { typical: acid.typical } : undefined });
  if (acid.compound) addWhole(acid.compound, { name: acid.compound, formula: acid.forms[0], via: 'acid' });
}
for (const e of ELEMENTS) addWhole(e.name, { name: e.name, formula: e.symbol, via: 'element' });
for (const [n, f] of [
  ['dihydrogen', 'H2'],
  ['dioxygen', 'O2'],
  ['dinitrogen', 'N2'],
  ['difluorine', 'F2'],
  ['dichlorine', 'Cl2'],
  ['dibromine', 'Br2'],
  ['diiodine', 'I2'],
  ['trioxygen', 'O3'],
  ['octasulfur', 'S8'],
  ['tetraphosphorus', 'P4'],
] as const)
  addWhole(n, { name: n, formula: f, via: 'element' });
// Spelling variants of element names (IUPAC 2005 Table I gives aluminium, caesium, sulfur).
for (const [n, f] of [['sulphur', 'S']] as const) addWhole(n, { name: 'sulfur', formula: f, via: 'element' });

// ---------------------------------------------------------------------------------------------------
// Reading.

/** Readings by squashed key, and by the text as written (a repeat skips the squashing). */
const cache = new BoundedCache<Omit<NameReading, 'text' | 'start' | 'end'>>(20_000, 16 * 1024 * 1024);
const byWritten = new BoundedCache<Omit<NameReading, 'text' | 'start' | 'end'>>(20_000, 8 * 1024 * 1024);

/** Empty the names' cache (for cold-start measurements). */
export function clearNameCache(): void {
  cache.clear();
  byWritten.clear();
}

/** Read a name as a formula. Never throws; `status` says whether a formula was found. */
export function readName(text: string): NameReading {
  const lead = text.length - text.trimStart().length;
  const trimmed = text.trim();
  const place = { text, start: lead, end: lead + trimmed.length };
  // As written first (no squashing on a repeat), then by the squashed key.
  let r = byWritten.get(trimmed);
  if (!r) {
    const key = squash(trimmed);
    r = cache.get(key);
    if (!r) {
      r = key ? readKey(key, trimmed) : unknown(trimmed, 'no name is written');
      cache.set(detach(key), r, 512 + 4 * key.length);
    }
    byWritten.set(detach(trimmed), r, 256 + 2 * trimmed.length);
  }
  return { text: place.text, start: place.start, end: place.end, ...r };
}

type Reading = Omit<NameReading, 'text' | 'start' | 'end'>;

const hillOf = (formula: string) => analyseFormula(formula).hill;
/** The Hill formula from the parse alone (for compounds only shown, never analysed). */
const quickHill = (formula: string) => {
  const p = parseFormula(formula);
  return p.formula ? hillFormula(formulaAtoms(p.formula)) : formula;
};
const candidate = (formula: string, name?: string): NameCandidate => ({
  name: name ?? systematicName(analyseFormula(formula)) ?? formula,
  formula,
  hill: hillOf(formula),
});

function unknown(written: string, why?: string): Reading {
  return {
    status: 'unknown',
    candidates: [],
    lookalikes: [],
    notes: [],
    message: why
      ? `'${written}': ${why}.`
      : `'${written}' is not a name the tool knows: write the formula, a systematic name (nickel(II) sulfate hexahydrate) or a shelf name (borax, caustic soda).`,
  };
}

function readKey(key: string, written: string): Reading {
  const whole = WHOLE.get(key);
  if (whole) return fromWhole(whole);
  // An anion alone is the ion.
  const ion = ANION_WORDS.get(key);
  if (ion) {
    const formula = `${ion.formula}^${Math.abs(ion.charge) === 1 ? '' : Math.abs(ion.charge)}-`;
    return { status: 'exact', formula, hill: hillOf(formula), name: ion.name, via: 'ion', candidates: [], lookalikes: [], notes: [] };
  }
  // A cation alone: iron(3+), ammonium, dimercury(2+); a complex ion alone.
  const lone = readLoneCation(key) ?? loneComplex(key);
  if (lone)
    return { status: 'exact', formula: lone.formula, hill: hillOf(lone.formula), name: lone.name, via: 'ion', candidates: [], lookalikes: [], notes: [] };
  // A solution named as one: `sodium hydroxide solution`, `aqueous ammonia`.
  const bare = /^(.{3,}?)(?:solution|\(aq\))$/.exec(key)?.[1] ?? /^aqueous(.{3,})$/.exec(key)?.[1];
  if (bare) {
    const r = readKey(bare, written);
    if (r.status !== 'exact') return r;
    return {
      ...r,
      solution: r.solution ?? { typical: 'as on the label' },
      notes: [...r.notes, `'${written}' is a solution in water: its strength must come from the label`],
    };
  }
  const water = splitWater(key);
  if (water.error) return unknown(written, water.error);
  // A shelf or acid name with its water named: citric acid monohydrate, borax pentahydrate.
  const named = water.n || water.anhydrous ? WHOLE.get(water.core) : undefined;
  if (named && named.via !== 'element') {
    const formula = named.formula.split('·')[0] + (water.n ? `·${water.n === 1 ? '' : water.n}H2O` : '');
    const r = fromWhole({ ...named, formula });
    return { ...r, name: systematicName(analyseFormula(formula)) ?? r.name };
  }
  const readings = readCore(water.core);
  if (readings.kind === 'found') {
    const suffix = water.n ? `·${water.n === 1 ? '' : water.n}H2O` : '';
    const found = readings.found.map((f) => ({ ...f, formula: f.formula + suffix }));
    const notes = [...readings.notes];
    if (water.anhydrous) notes.push('anhydrous: no water of crystallisation');
    if (found.length === 1) {
      const f = found[0];
      const name = systematicName(analyseFormula(f.formula)) ?? written;
      // Named by the anion put in (cheap: no analysis of compounds merely shown).
      // Hydrates of the -ide lookalikes are mostly no compounds: only the oxoanions are shown for them.
      const shown = (f.lookalikes ?? []).filter((l) => !suffix || !/ide$/.test(l.anion));
      const lookalikes = shown.map((l) => ({
        name: name.replace(anionName(l.instead), anionName(l.anion)),
        formula: l.formula + suffix,
        hill: quickHill(l.formula + suffix),
      }));
      return {
        status: 'exact',
        formula: f.formula,
        hill: hillOf(f.formula),
        name,
        via: 'systematic',
        candidates: [],
        lookalikes,
        notes,
      };
    }
    const candidates = found.map((f) => candidate(f.formula));
    return {
      status: 'ambiguous',
      candidates,
      lookalikes: [],
      notes,
      message: `'${written}' ${readings.why ?? 'can be read more than one way'}: ${orList(candidates)}? Write the one you mean.`,
    };
  }
  if (readings.kind === 'error') return unknown(written, readings.error);
  return nearMisses(key, written);
}

const ionFormula = (formula: string, charge: number) => `${formula}^${Math.abs(charge) === 1 ? '' : Math.abs(charge)}${charge < 0 ? '-' : '+'}`;

/** A cation's name alone, with its charge number or a fixed charge: `iron(3+)`, `ammonium`, `dimercury(2+)`. */
function readLoneCation(key: string): { formula: string; name: string } | undefined {
  if (key === 'dimercury(2+)') return { formula: 'Hg2^2+', name: 'dimercury(2+)' };
  for (let len = 1; len <= key.length && len <= MAX_WORD; len++) {
    const word = CATION_WORDS.get(key.slice(0, len));
    if (!word) continue;
    const marker = readMarker(key, len);
    if ((marker ? marker.end : len) !== key.length) continue;
    if (word.ion) return marker ? undefined : { formula: ionFormula(word.ion.formula, word.ion.charge), name: key };
    if (!marker || !word.symbol) continue;
    const cations = cationsFor(word, marker);
    if (typeof cations === 'string' || cations.ions.length !== 1) continue;
    const ion = cations.ions[0];
    return { formula: ionFormula(ion.formula, ion.charge), name: `${element(word.symbol)?.name}(${ion.charge}+)` };
  }
  return undefined;
}

/** A complex ion's name alone: `hexacyanidoferrate(III)`, `tetraamminecopper(II)`. */
function loneComplex(key: string): { formula: string; name: string } | undefined {
  for (const anionic of [true, false]) {
    const c = readComplex(key, 0, anionic);
    if (c && c.end === key.length && c.ion.charge !== 0) return { formula: ionFormula(c.ion.formula, c.ion.charge), name: c.ion.name };
  }
  return undefined;
}

function fromWhole(w: WholeName): Reading {
  const notes: string[] = [];
  if (w.note) notes.push(w.note);
  if (w.solution) notes.push(`${w.name} is a solution in water: its strength (usually ${w.solution.typical}) must come from the label`);
  const sys = w.via === 'shelf' ? systematicName(analyseFormula(w.formula)) : undefined;
  if (sys && squash(sys) !== squash(w.name)) notes.push(`${w.name} is read as ${sys}`);
  return {
    status: 'exact',
    formula: w.formula,
    hill: hillOf(w.formula),
    name: w.name,
    via: w.via,
    solution: w.solution,
    candidates: [],
    lookalikes: [],
    notes,
  };
}

const orList = (cs: NameCandidate[]) =>
  cs.length === 1
    ? `${cs[0].name} (${cs[0].formula})`
    : cs
        .slice(0, -1)
        .map((c) => `${c.name} (${c.formula})`)
        .join(', ') + ` or ${cs[cs.length - 1].name} (${cs[cs.length - 1].formula})`;

const HYDRATE_BY_LENGTH = [...HYDRATE_WORDS].sort((a, b) => b[0].length - a[0].length);

/** Split the water of crystallisation off a squashed name: `…pentahydrate`, `…water(1/5)`, `anhydrous…`. */
function splitWater(key: string): { core: string; n: number; anhydrous?: boolean; error?: string } {
  const addition = /water\((\d+)\/(\d+(?:\.\d+)?)\)$/.exec(key);
  if (addition) return { core: key.slice(0, addition.index), n: Number(addition[2]) / Number(addition[1]) };
  for (const [word, n] of HYDRATE_BY_LENGTH) if (key.endsWith(word) && key.length > word.length) return { core: key.slice(0, -word.length), n };
  for (const word of ['anhydrous', 'anhydrate', 'anhyd', 'anh'])
    if (key.startsWith(word) && key.length > word.length + 3) return { core: key.slice(word.length), n: 0, anhydrous: true };
  for (const word of ['anhydrous', 'anhydrate', 'anhyd'])
    if (key.endsWith(word) && key.length > word.length + 3) return { core: key.slice(0, -word.length), n: 0, anhydrous: true };
  if (/hydrated?$/.test(key) && key.length > 8)
    return { core: key, n: 0, error: 'the hydrate does not say how many water molecules (write monohydrate, hexahydrate, …)' };
  return { core: key, n: 0 };
}

interface Found {
  formula: string;
  /** Compounds (formula without water) whose names differ by a letter or two: their anion and ours. */
  lookalikes?: Array<{ formula: string; anion: string; instead: string }>;
}
type CoreReading = { kind: 'found'; found: Found[]; notes: string[]; why?: string } | { kind: 'error'; error: string } | { kind: 'none' };

/** The oxidation or charge number written right after a cation's name: `(ii)`, `(2+)`, `(+2)`. */
function readMarker(s: string, i: number): { value: number; end: number; charge: boolean } | undefined {
  if (s[i] !== '(') return undefined;
  const close = s.indexOf(')', i);
  if (close < 0 || close - i > 6) return undefined;
  const inner = s.slice(i + 1, close);
  if (inner in ROMAN_VALUE) return { value: ROMAN_VALUE[inner], end: close + 1, charge: false };
  const m = /^(\d)(\+|−)?$|^\+(\d)$/.exec(inner);
  if (m) return { value: Number(m[1] ?? m[3]), end: close + 1, charge: !!(m[2] || m[3]) };
  return undefined;
}

function readCore(core: string): CoreReading {
  const out: Found[] = [];
  const notes: string[] = [];
  let why: string | undefined;
  let error: string | undefined;
  // Cation word (with a multiplying prefix, `disodium`), then anion word; or two cations (a double salt).
  for (const [prefix, count] of CATION_COUNTS) {
    if (!core.startsWith(prefix)) continue;
    for (const head of cationHeads(core, prefix.length)) {
      const rest = core.slice(head.end);
      const anion = ANION_WORDS.get(rest) ?? readComplex(rest, 0, true)?.ion;
      if (anion) {
        const cations = cationsFor(head.word, head.marker);
        if (typeof cations === 'string') {
          error = cations;
          continue;
        }
        if (cations.note) notes.push(cations.note);
        if (cations.ions.length > 1) why = `names no oxidation state of ${element(head.word.symbol ?? '')?.name ?? 'the metal'}`;
        for (const cat of cations.ions) {
          const formula = count ? countedSalt(cat, count, anion) : salt(cat, anion);
          if (!formula) {
            error = `${count} × ${cat.formula} (${cat.charge}+) does not balance ${anion.name} (${-anion.charge}−)`;
            continue;
          }
          const lookalikes = count
            ? []
            : [...(LOOKALIKES.get(rest) ?? [])].flatMap((other) => {
                const o = ANION_WORDS.get(other);
                return o ? [{ formula: salt(cat, o), anion: o.name, instead: anion.name }] : [];
              });
          out.push({ formula, lookalikes });
        }
        continue;
      }
      if (count) continue;
      // A second cation: alum (aluminium potassium sulfate), Mohr's salt (ammonium iron(II) sulfate).
      for (const second of cationHeads(core, head.end)) {
        const an = ANION_WORDS.get(core.slice(second.end));
        if (!an) continue;
        const a = cationsFor(head.word, head.marker);
        const b = cationsFor(second.word, second.marker);
        if (typeof a === 'string' || typeof b === 'string' || a.ions.length !== 1 || b.ions.length !== 1) continue;
        const formula = doubleSalt(a.ions[0], b.ions[0], an);
        if (formula) out.push({ formula });
      }
    }
  }
  // A complex cation, then an anion.
  if (!out.length) {
    const complex = readComplex(core, 0, false);
    if (complex) {
      const anion = ANION_WORDS.get(core.slice(complex.end));
      if (anion) out.push({ formula: salt(complex.ion, anion) });
      else if (complex.end === core.length && complex.ion.charge === 0) out.push({ formula: complex.ion.formula });
    }
  }
  // A binary compound with multiplying prefixes: dinitrogen tetraoxide, titanium dioxide.
  if (!out.length) {
    const binary = readBinary(core);
    if (binary) out.push({ formula: binary });
  }
  if (out.length) {
    const seen = new Set<string>();
    return { kind: 'found', found: out.filter((f) => !seen.has(f.formula) && seen.add(f.formula)), notes, why };
  }
  return error ? { kind: 'error', error } : { kind: 'none' };
}

/**
 * The metals whose usual salts have one state the trade means when it writes no number (copper
 * sulfate is copper(II) sulfate; common practice). Others with more than one usual state are ambiguous.
 */
const USUAL_STATE: Record<string, number> = { Cu: 2, Ni: 2, Co: 2, Mn: 2, Pb: 2, Bi: 3, Cr: 3 };

function cationsFor(word: CationWord, marker: ReturnType<typeof readMarker>): { ions: Ion[]; note?: string } | string {
  if (word.ion) return { ions: [word.ion] };
  const symbol = word.symbol as string;
  const el = element(symbol);
  if (!el) return 'not a known element';
  const ionOf = (q: number): Ion => (symbol === 'Hg' && q === 1 ? { formula: 'Hg2', charge: 2, multi: false } : { formula: symbol, charge: q, multi: false });
  if (word.charge !== undefined) {
    if (marker) return `'${el.name}' already says its state; a number after it is one too many`;
    return { ions: [ionOf(word.charge)] };
  }
  if (marker) {
    const q = marker.value;
    const known = new Set([...el.commonStates, ...el.otherStates, ...el.icsdStates]);
    if (q <= 0 || !known.has(q))
      return `${el.name}(${ROMAN[q] ?? q}) is not a known state of ${el.name} (known: ${
        [...known]
          .filter((s) => s > 0)
          .sort((a, b) => a - b)
          .map((s) => ROMAN[s] ?? s)
          .join(', ') || 'none'
      })`;
    return { ions: [ionOf(q)] };
  }
  const positive = el.commonStates.filter((s) => s > 0);
  if (ONE_STATE.has(symbol)) return { ions: [ionOf(positive[0] ?? 1)] };
  const usual = USUAL_STATE[symbol];
  if (usual) return { ions: [ionOf(usual)], note: `the name gives no oxidation state; read as ${el.name}(${ROMAN[usual]}), the usual salt` };
  // The states its compounds are found in (ICSD), else the common ones: one is read, more are asked.
  const found = el.icsdStates.filter((s) => s > 0);
  const states = found.length ? found : positive;
  if (states.length === 1) return { ions: [ionOf(states[0])], note: `the name gives no oxidation state; read as ${el.name}(${ROMAN[states[0]]})` };
  if (!states.length) return `${el.name} has no usual cationic state`;
  return { ions: states.map(ionOf) };
}

const gcd = (a: number, b: number): number => (b ? gcd(b, a % b) : a);

/** Multiplying prefixes a salt's name may give its cation (`disodium hydrogen phosphate`); '' first. */
const CATION_COUNTS: Array<[string, number]> = [
  ['', 0],
  ['di', 2],
  ['tri', 3],
  ['tetra', 4],
  ['mono', 1],
];

/** The cation words at `from` of a squashed key, each with its Stock or charge number and where it ends. */
function cationHeads(core: string, from: number) {
  const out: Array<{ word: CationWord; marker: ReturnType<typeof readMarker>; end: number }> = [];
  for (let len = 1; from + len < core.length && len <= MAX_WORD; len++) {
    const word = CATION_WORDS.get(core.slice(from, from + len));
    if (!word) continue;
    const marker = readMarker(core, from + len);
    out.push({ word, marker, end: marker ? marker.end : from + len });
  }
  return out;
}

/** A salt whose name counts its cation: balanced by the anion's count in lowest terms, or undefined. */
function countedSalt(cat: Ion, count: number, an: Ion): string | undefined {
  const plus = cat.charge * count;
  const minus = -an.charge;
  if (plus % minus !== 0) return undefined;
  const na = plus / minus;
  if (gcd(count, na) !== 1) return undefined;
  const part = (ion: Ion, n: number) => (n === 1 ? ion.formula : ion.multi && !ion.formula.startsWith('[') ? `(${ion.formula})${n}` : `${ion.formula}${n}`);
  return part(cat, count) + part(an, na);
}

/**
 * A double salt of two cations and one anion: one of the cation of higher charge and the fewest of the
 * other that the anion balances (alums M(I)M(III)(SO4)2, Tutton's salts M(I)2M(II)(SO4)2).
 */
function doubleSalt(a: Ion, b: Ion, an: Ion): string | undefined {
  const [hi, lo] = a.charge >= b.charge ? [a, b] : [b, a];
  const minus = -an.charge;
  for (let n = 1; n <= 4; n++) {
    const plus = hi.charge + n * lo.charge;
    if (plus % minus !== 0) continue;
    const part = (ion: Ion, k: number) => (k === 1 ? ion.formula : ion.multi ? `(${ion.formula})${k}` : `${ion.formula}${k}`);
    return part(lo, n) + part(hi, 1) + part(an, plus / minus);
  }
  return undefined;
}

/** The formula of the salt of a cation and an anion, by the criss-cross of their charges. */
function salt(cat: Ion, an: Ion): string {
  const qc = cat.charge;
  const qa = -an.charge;
  const g = gcd(qc, qa);
  const nc = qa / g;
  const na = qc / g;
  const part = (ion: Ion, n: number) => (n === 1 ? ion.formula : ion.multi && !ion.formula.startsWith('[') ? `(${ion.formula})${n}` : `${ion.formula}${n}`);
  return part(cat, nc) + part(an, na);
}

/**
 * A complex's name at `i` of a squashed key: ligands (with multiplying prefixes), the central atom (an
 * -ate name where `anionic`), its oxidation number or the complex's charge number.
 */
function readComplex(s: string, i: number, anionic: boolean): { ion: Ion & { name: string }; end: number } | undefined {
  const ligands: Array<{ l: LigandDef; n: number }> = [];
  let j = i;
  for (;;) {
    const next = readLigand(s, j);
    if (!next) break;
    ligands.push({ l: next.l, n: next.n });
    j = next.end;
  }
  if (!ligands.length) return undefined;
  let symbol: string | undefined;
  for (let len = Math.min(14, s.length - j); len > 1 && !symbol; len--) {
    const w = s.slice(j, j + len);
    const sym = anionic ? ATE_WORDS.get(w) : CATION_WORDS.get(w)?.symbol;
    if (sym && !CATION_WORDS.get(w)?.charge) {
      symbol = sym;
      j += len;
    }
  }
  if (!symbol) return undefined;
  const marker = readMarker(s, j);
  if (!marker) return undefined;
  j = marker.end;
  const ligandCharge = ligands.reduce((t, x) => t + x.l.charge * x.n, 0);
  const charge = marker.charge || marker.value === 0 ? (anionic ? -marker.value : marker.value) : marker.value + ligandCharge;
  if (anionic ? charge >= 0 : charge < 0) return undefined;
  const body = ligands.map(({ l, n }) => {
    const f = l.forms[0];
    const single = /^[A-Z][a-z]?$/.test(f);
    return single ? f + (n === 1 ? '' : n) : `(${f})${n === 1 ? '' : n}`;
  });
  const formula = `[${symbol}${body.join('')}]`;
  return { ion: { formula, charge, multi: true, name: s.slice(i, j) }, end: j };
}

function readLigand(s: string, i: number): { l: LigandDef; n: number; end: number } | undefined {
  for (const [p, n] of ENCLOSED_PREFIXES) {
    if (!s.startsWith(p + '(', i)) continue;
    const close = s.indexOf(')', i + p.length);
    const inner = s.slice(i + p.length + 1, close);
    const l = LIGAND_WORDS.find(([w]) => w === inner)?.[1];
    if (l && close > 0) return { l, n, end: close + 1 };
  }
  if (s[i] === '(') {
    const close = s.indexOf(')', i);
    const l = LIGAND_WORDS.find(([w]) => w === s.slice(i + 1, close))?.[1];
    if (l && close > 0) return { l, n: 1, end: close + 1 };
  }
  for (const [p, n] of [...SIMPLE_PREFIXES, ['', 1] as [string, number]]) {
    if (!s.startsWith(p, i)) continue;
    for (const [w, l] of LIGAND_WORDS) if (s.startsWith(w, i + p.length)) return { l, n, end: i + p.length + w.length };
  }
  return undefined;
}

const ELEMENT_WORDS = new Map<string, string>(ELEMENTS.map((e) => [squash(e.name), e.symbol]));
ELEMENT_WORDS.set('sulphur', 'S');
const IDE_WORDS = new Map<string, string>(Object.entries(MONATOMIC_ANIONS).map(([sym, w]) => [w, sym]));
const ALL_PREFIXES = PREFIX.slice(1)
  .map((p, i): [string, number] => [p, i + 1])
  .sort((a, b) => b[0].length - a[0].length);

/** `[prefix]element [prefix]…ide`: the formula, element order as named (N2O4, SF6, CO, TiO2). */
function readBinary(core: string): string | undefined {
  const counted = (s: string, words: Map<string, string>): { symbol: string; n: number; end: number } | undefined => {
    for (const [p, n] of [...ALL_PREFIXES, ['', 1] as [string, number]]) {
      if (!s.startsWith(p)) continue;
      for (let len = Math.min(14, s.length - p.length); len >= 3; len--) {
        const sym = words.get(s.slice(p.length, p.length + len));
        if (sym) return { symbol: sym, n, end: p.length + len };
      }
      if (p === 'mono' && s.startsWith('monoxide')) return { symbol: 'O', n: 1, end: 8 };
    }
    return undefined;
  };
  const first = counted(core, ELEMENT_WORDS);
  if (!first) return undefined;
  const rest = core.slice(first.end);
  const second = rest === 'monoxide' ? { symbol: 'O', n: 1, end: rest.length } : counted(rest, IDE_WORDS);
  if (!second || second.end !== rest.length || second.symbol === first.symbol) return undefined;
  const c = (n: number) => (n === 1 ? '' : String(n));
  const formula = `${first.symbol}${c(first.n)}${second.symbol}${c(second.n)}`;
  // A metal's compound must balance with its states (disodium chloride is no compound).
  if (isMetal(first.symbol) && !analyseFormula(formula).charges?.balanced) return undefined;
  return formula;
}

/** Anion words within two letters of another of the same stem (first four letters). */
const LOOKALIKES = new Map<string, Set<string>>();
{
  const words = [...ANION_WORDS.keys()].filter((w) => w.length >= 5);
  for (const a of words)
    for (const b of words) {
      if (a >= b || a.slice(0, 4) !== b.slice(0, 4) || Math.abs(a.length - b.length) > 1 || ANION_WORDS.get(a) === ANION_WORDS.get(b)) continue;
      if (distanceWithin(a, b, 2) <= 2) {
        if (!LOOKALIKES.has(a)) LOOKALIKES.set(a, new Set());
        if (!LOOKALIKES.has(b)) LOOKALIKES.set(b, new Set());
        LOOKALIKES.get(a)!.add(b);
        LOOKALIKES.get(b)!.add(a);
      }
    }
}

// ---------------------------------------------------------------------------------------------------
// Near misses: never taken, always shown.

/** A hydrate word near the end of a key (`hexahydrat`, `pentahydrte`): the key without it, and its count. */
function nearHydrate(key: string): { core: string; n: number } | undefined {
  for (const [word, n] of HYDRATE_BY_LENGTH)
    for (const len of [word.length, word.length - 1, word.length + 1]) {
      if (len >= key.length - 2) continue;
      const tail = key.slice(key.length - len);
      if (tail !== word && distanceWithin(tail, word, 1) <= 1) return { core: key.slice(0, key.length - len), n };
    }
  return undefined;
}

function nearMisses(key: string, written: string): Reading {
  const water = splitWater(key);
  const hydrate = !water.n && !water.anhydrous ? nearHydrate(key) : undefined;
  const core = hydrate ? hydrate.core : water.error ? key : water.core;
  const n = hydrate ? hydrate.n : water.error ? 0 : water.n;
  const suffix = n ? `·${n === 1 ? '' : n}H2O` : '';
  const found = new Map<string, number>();
  // A misspelt hydrate word counts one letter to every candidate.
  const extra = hydrate ? 1 : 0;
  const add = (formula: string, d: number) => {
    if (!found.has(formula) || (found.get(formula) as number) > d + extra) found.set(formula, d + extra);
  };
  const MAX = 2;
  // The salt read exactly but its hydrate word misspelt: one letter off.
  if (hydrate) {
    const exact = readCore(core);
    if (exact.kind === 'found') for (const f of exact.found) add(f.formula + suffix, 0);
  }
  // The cation read exactly, the anion near.
  for (let len = 1; len < core.length && len <= MAX_WORD; len++) {
    const word = CATION_WORDS.get(core.slice(0, len));
    if (!word) continue;
    let i = len;
    const marker = readMarker(core, i);
    if (marker) i = marker.end;
    const rest = core.slice(i);
    const cations = cationsFor(word, marker);
    if (typeof cations === 'string') continue;
    for (const [w, an] of ANION_WORDS) {
      const d = distanceWithin(rest, w, MAX);
      if (d <= MAX) for (const cat of cations.ions) add(salt(cat, an) + suffix, d);
    }
  }
  // The anion read exactly, the cation near.
  for (const [w, an] of ANION_WORDS) {
    if (!core.endsWith(w) || core.length === w.length) continue;
    let head = core.slice(0, core.length - w.length);
    const mark = /\((?:[ivx]+|\d\+?)\)$/.exec(head);
    const marker = mark ? readMarker(head, mark.index) : undefined;
    if (mark) head = head.slice(0, mark.index);
    for (const [cw, word] of CATION_WORDS) {
      const d = distanceWithin(head, cw, MAX);
      if (d > MAX || d === 0) continue;
      const cations = cationsFor(word, marker);
      if (typeof cations !== 'string') for (const cat of cations.ions) add(salt(cat, an) + suffix, d);
    }
  }
  // A whole name near a shelf, acid or element name.
  if (key.length >= 4)
    for (const [w, whole] of WHOLE) {
      const limit = w.length >= 8 ? MAX : 1;
      const d = distanceWithin(key, w, limit);
      if (d <= limit) add(whole.formula, d);
    }
  if (!found.size) return unknown(written);
  const best = Math.min(...found.values());
  const chosen = [...found].filter(([, d]) => d <= best + 1).sort((a, b) => a[1] - b[1]);
  const candidates = chosen.slice(0, 4).map(([f]) => {
    const whole = [...WHOLE.values()].find((w) => w.formula === f && w.via !== 'element');
    return candidate(f, systematicName(analyseFormula(f)) ?? whole?.name);
  });
  return {
    status: 'near',
    candidates,
    lookalikes: [],
    notes: [],
    message: `'${written}' is not a name the tool knows, and a near name is never taken for it: did you mean ${orList(candidates)}?`,
  };
}

// ---------------------------------------------------------------------------------------------------
// Names on a line, and names by prefix.

/** Words that end a name on a batch line: the amount's keywords (`to pH`, `from 1.5 M`, `@ 96%`). */
const STOP_WORDS = new Set(['to', 'from', '@', 'at', 'as']);
const AMOUNT = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?[a-zA-Zµ%/]*$/;

/**
 * The name at the start of a line such as `nickel sulfate hexahydrate 25 g`: every word before the first
 * amount (a number, or a number with its unit) or keyword (`to`, `from`, `@`, `at`, `as`), read as one
 * name. `start` and `end` are where the name stands in `line`; `status` says whether it was read.
 */
export function nameAtStart(line: string): NameReading {
  // One pass over the words: the name runs from the first word to the last before an amount or keyword.
  let first = -1;
  let end = -1;
  let i = 0;
  const n = line.length;
  while (i < n) {
    while (i < n && isBlank(line.charCodeAt(i))) i++;
    if (i >= n) break;
    let j = i;
    while (j < n && !isBlank(line.charCodeAt(j))) j++;
    const c = line.charCodeAt(i);
    const numeric = (c >= 48 && c <= 57) || c === 46 || c === 43 || c === 45;
    const word = numeric || j - i <= 4 ? line.slice(i, j) : '';
    if ((numeric && AMOUNT.test(word) && !/^\d+-/.test(word)) || (word && STOP_WORDS.has(word.toLowerCase()))) break;
    if (first < 0) first = i;
    end = j;
    i = j;
  }
  if (first < 0) return { ...readName(''), text: line, start: 0, end: 0 };
  const r = readName(line.slice(first, end));
  r.text = line;
  r.start = first;
  r.end = end;
  return r;
}

const isBlank = (c: number) => c === 32 || c === 9 || c === 160;

export interface NameEntry {
  /** The name as shown. */
  name: string;
  formula: string;
  kind: 'shelf' | 'acid' | 'element' | 'systematic';
}

let index: { keys: string[]; entries: NameEntry[] } | undefined;

/** Every shelf, acid and element name, and the salts of the usual cations and anions (built once). */
function nameIndex() {
  if (index) return index;
  const entries: NameEntry[] = [];
  for (const row of COMMON_NAMES) for (const n of row.names) entries.push({ name: n, formula: row.formula, kind: 'shelf' });
  for (const acid of ACIDS)
    for (const n of [acid.name, ...(acid.aliases ?? []), ...(acid.compound ? [acid.compound] : [])])
      entries.push({ name: n, formula: acid.forms[0], kind: 'acid' });
  for (const e of ELEMENTS) entries.push({ name: e.name, formula: e.symbol, kind: 'element' });
  const cations: Array<{ name: string; ion: Ion }> = [];
  for (const e of ELEMENTS) {
    if (!isMetal(e.symbol) || e.z > 83) continue;
    const states = e.commonStates.filter((s) => s > 0);
    for (const q of states)
      cations.push({ name: ONE_STATE.has(e.symbol) ? e.name : `${e.name}(${ROMAN[q]})`, ion: { formula: e.symbol, charge: q, multi: false } });
  }
  cations.push({ name: 'ammonium', ion: { formula: 'NH4', charge: 1, multi: true } });
  const anions = new Map<Ion & { name: string }, true>();
  for (const an of ANION_WORDS.values()) anions.set(an, true);
  for (const c of cations)
    for (const an of anions.keys()) {
      if (an.formula.startsWith('[')) continue;
      const f = salt(c.ion, an);
      entries.push({ name: `${c.name} ${an.name.replace(/^((?:di)?hydrogen) /, '$1')}`, formula: f, kind: 'systematic' });
    }
  const keyed = entries.map((e) => ({ e, k: squash(e.name) })).sort((a, b) => (a.k < b.k ? -1 : a.k > b.k ? 1 : 0));
  index = { keys: keyed.map((x) => x.k), entries: keyed.map((x) => x.e) };
  return index;
}

/** Names that begin with `prefix` (case, spacing, hyphens and spelling variants ignored), for completion. */
export function namesByPrefix(prefix: string, limit = 20): NameEntry[] {
  const { keys, entries } = nameIndex();
  const p = squash(prefix);
  let lo = 0;
  let hi = keys.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (keys[mid] < p) lo = mid + 1;
    else hi = mid;
  }
  const out: NameEntry[] = [];
  for (let i = lo; i < keys.length && out.length < limit && keys[i].startsWith(p); i++) out.push(entries[i]);
  return out;
}
