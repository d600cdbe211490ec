/**
 * Usual cautions for substances that can hurt someone: strong acids and bases, corrosive weak acids,
 * oxidisers, flammable solvents, and toxic or carcinogenic substances. Classes follow the hazard classes of the GHS (UN Globally Harmonized System,
 * Rev. 9) as they are commonly applied to these substances (common practice). They are reminders, not a
 * safety judgement: the safety data sheet, local rules and a licensed chemist's review decide.
 */
import { analysisDerivedCache } from './cache';
import type { FormulaAnalysis } from './analyse';
import type { Formula, FormulaItem } from './formula/ast';

export type CautionClass = 'strong acid' | 'strong base' | 'oxidiser' | 'toxic' | 'carcinogen' | 'corrosive' | 'flammable';

export interface Caution {
  cls: CautionClass;
  text: string;
}

/** Strong acids: fully dissociated in water (common practice: the usual list of general chemistry). */
const STRONG_ACIDS = new Set(['HCl', 'HBr', 'HI', 'HNO3', 'H2SO4', 'HClO4', 'HClO3']);
/**
 * Weak acids that are still corrosive (GHS Skin Corr. 1 when concentrated), by the ways they are written.
 * Hydrofluoric acid also penetrates skin and binds calcium (the usual first aid is calcium gluconate gel).
 */
const CORROSIVE_WEAK_ACIDS: Record<string, string> = {
  HF: 'hydrofluoric acid: corrosive; penetrates the skin and causes deep burns that may not hurt at first, and is acutely toxic (binds calcium). Have calcium gluconate gel at hand as first aid and get medical help at once after any contact; follow the SDS',
  H3PO4: 'phosphoric acid: a weak acid, but corrosive when concentrated',
  CH3COOH: 'acetic acid: a weak acid, but corrosive when concentrated (glacial acetic acid)',
};
const ACID_FORMS: Record<string, string> = { CH3CO2H: 'CH3COOH', HC2H3O2: 'CH3COOH', HOAc: 'CH3COOH', AcOH: 'CH3COOH' };

/**
 * Flammable solvents (GHS Flam. Liq. 2; acetic acid Flam. Liq. 3), by Hill formula: every isomer of these
 * formulas is flammable too (dimethyl ether, 1-propanol, propanal). Methanol is also toxic (GHS Acute Tox. 3).
 */
const FLAMMABLE_BY_HILL: Record<string, string> = {
  CH4O: 'methanol',
  C2H6O: 'ethanol',
  C3H8O: 'isopropanol or propanol',
  C3H6O: 'acetone',
  C4H10O: 'diethyl ether or butanol',
  C6H14: 'hexane',
  C7H8: 'toluene',
  C4H8O2: 'ethyl acetate',
  C2H3N: 'acetonitrile',
  C4H8O: 'tetrahydrofuran or butanone',
};

const OXIDISING_ANIONS = new Set([
  'perchlorate',
  'chlorate',
  'chlorite',
  'hypochlorite',
  'bromate',
  'iodate',
  'periodate',
  'permanganate',
  'manganate',
  'chromate',
  'dichromate',
  'peroxodisulfate',
  'peroxide',
  'superoxide',
  'nitrate',
  'nitrite',
  'ferrate',
]);
const TOXIC_METALS: Record<string, string> = {
  Hg: 'mercury compound: toxic',
  Pb: 'lead compound: toxic, harms fertility',
  Cd: 'cadmium compound: toxic and carcinogenic',
  Tl: 'thallium compound: very toxic',
  As: 'arsenic compound: toxic and carcinogenic',
  Be: 'beryllium compound: toxic and carcinogenic',
  Ba: 'soluble barium salt: toxic if swallowed',
  Ni: 'nickel compound: skin sensitiser, suspected carcinogen',
  Co: 'cobalt compound: sensitiser, suspected carcinogen',
  Os: 'osmium compound: OsO₄ is volatile and very toxic',
};

/** Cyanide in the formula: the cyanide ion, or CN written as a group (a ligand, `[Fe(CN)6]`, `[Au(CN)2]`). */
function cyanideIn(f: Formula): boolean {
  const walk = (items: readonly FormulaItem[]): boolean =>
    items.some((it) => {
      if (it.kind !== 'group') return false;
      const [c, n] = it.items;
      if (it.items.length === 2 && c.kind === 'element' && n.kind === 'element' && c.symbol === 'C' && n.symbol === 'N' && c.count === 1 && n.count === 1)
        return true;
      return walk(it.items);
    });
  return f.parts.some((p) => walk(p.items));
}

/**
 * Cautions by formula text: they follow from the reading of the formula alone, not from the settings, and
 * the text an analysis keeps is already a flat copy (analyse.ts), so it is the key.
 */
const memo = analysisDerivedCache<Caution[]>(50_000, 16 * 1024 * 1024);

/** Cautions for one substance, from its analysis (memoised by formula text; treat as read-only). */
export function cautionsFor(a: FormulaAnalysis): Caution[] {
  let hit = memo.get(a.input);
  if (!hit) {
    hit = compute(a);
    memo.set(a.input, hit, 64 + hit.reduce((n, c) => n + 48 + 2 * c.text.length, 0));
  }
  return hit;
}

function compute(a: FormulaAnalysis): Caution[] {
  if (!a.ok || !a.formula) return [];
  const out: Caution[] = [];
  const written = a.formula.parts.length === 1 ? a.ascii.replace(/\^.*$/, '').replace(/\(.*\)$/, '') : '';
  const ascii = ACID_FORMS[written] ?? written;
  const ions = a.charges?.ions ?? [];
  const names = new Set(ions.map((i) => i.ionName).filter(Boolean) as string[]);
  if (STRONG_ACIDS.has(ascii)) out.push({ cls: 'strong acid', text: 'strong acid: corrosive; add acid to water, never water to acid' });
  if (CORROSIVE_WEAK_ACIDS[ascii]) out.push({ cls: 'corrosive', text: CORROSIVE_WEAK_ACIDS[ascii] });
  if (ascii === 'HF') out.push({ cls: 'toxic', text: 'hydrogen fluoride: fatal on skin contact or if swallowed or inhaled' });
  if (ions.some((i) => i.ionName === 'hydroxide') && ions.some((i) => i.element && ['Li', 'Na', 'K', 'Rb', 'Cs', 'Ca', 'Sr', 'Ba'].includes(i.element))) {
    out.push({ cls: 'strong base', text: 'strong base: corrosive; dissolving it releases heat' });
  }
  const ox = [...names].filter((n) => OXIDISING_ANIONS.has(n));
  if (ox.length || ascii === 'H2O2' || ascii === 'CrO3' || ascii === 'HClO4') {
    const what = ox.length ? ox.join(', ') : ascii === 'H2O2' ? 'peroxide' : 'strong oxidiser';
    out.push({
      cls: 'oxidiser',
      text: `oxidiser (${what}): keep from organic matter and reducing agents${a.atoms.N && names.has('ammonium') && names.has('nitrate') ? '; ammonium nitrate can detonate' : ''}`,
    });
  }
  if (names.has('nitrite')) out.push({ cls: 'toxic', text: 'nitrite: toxic if swallowed (methaemoglobinaemia); acids release nitrogen oxides' });
  if (names.has('cyanide') || ascii === 'HCN') out.push({ cls: 'toxic', text: 'cyanide: very toxic; acids release HCN gas' });
  else if (cyanideIn(a.formula))
    out.push({
      cls: 'toxic',
      text: 'cyanide complex: acids (and for some, heat or light) release HCN gas; treat as a cyanide, very toxic, unless the SDS says otherwise',
    });
  if (names.has('azide')) out.push({ cls: 'toxic', text: 'azide: very toxic; forms explosive heavy-metal azides' });
  if (a.atoms.Cr && (a.charges?.oxidationStates?.Cr ?? 0) >= 6) out.push({ cls: 'carcinogen', text: 'chromium(VI): carcinogenic and sensitising' });
  if (names.has('hydrogen difluoride')) {
    // Bifluorides (NH4HF2, KHF2) are HF in solid form: acidic in water, with HF's burns (from memory:
    // the usual SDS of ammonium bifluoride lists the same first aid as for hydrofluoric acid).
    out.push({
      cls: 'corrosive',
      text: 'hydrogen difluoride (bifluoride): releases hydrofluoric acid in water or with acids; penetrating burns and fluoride poisoning as with HF. Have calcium gluconate gel at hand; follow the SDS',
    });
  } else if (ascii !== 'HF' && a.atoms.F && ions.some((i) => i.element === 'F')) out.push({ cls: 'toxic', text: 'soluble fluoride: toxic if swallowed' });
  const solvent = a.formula.parts.length === 1 && a.charge === 0 ? FLAMMABLE_BY_HILL[a.hill] : undefined;
  if (solvent)
    out.push({
      cls: 'flammable',
      text: `highly flammable (${solvent}): keep from flames, sparks and hot surfaces; the vapour forms explosive mixtures with air`,
    });
  if (a.hill === 'CH4O' && a.formula.parts.length === 1)
    out.push({ cls: 'toxic', text: 'methanol: toxic if swallowed, inhaled or absorbed through the skin (blindness)' });
  if (ascii === 'CH3COOH') out.push({ cls: 'flammable', text: 'flammable (acetic acid: flash point about 40 °C)' });
  for (const [el, text] of Object.entries(TOXIC_METALS)) {
    if (!a.atoms[el]) continue;
    if (el === 'Ba' && ions.some((i) => i.ionName === 'sulfate')) continue; // BaSO4 is insoluble
    out.push({ cls: el === 'Cd' || el === 'As' || el === 'Be' ? 'carcinogen' : 'toxic', text });
  }
  return out;
}

export const CAUTION_FOOTNOTE =
  "Cautions are reminders, not a safety judgement: follow the safety data sheet (SDS), local codes and licensed practice; nothing here replaces a qualified chemist's review.";
