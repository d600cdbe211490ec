/**
 * Usual cautions for substances that can hurt someone: strong acids and bases, oxidisers, and toxic or
 * carcinogenic salts. Classes follow the hazard classes of the GHS (UN Globally Harmonized System,
 * Rev. 9) as they are commonly applied to these substances (common practice). They are reminders, not a
 * safety judgement: the safety data sheet, local rules and a licensed chemist's review decide.
 */
import type { FormulaAnalysis } from './analyse';

export type CautionClass = 'strong acid' | 'strong base' | 'oxidiser' | 'toxic' | 'carcinogen' | 'corrosive';

export interface Caution {
  cls: CautionClass;
  text: string;
}

const STRONG_ACIDS = new Set(['HCl', 'HBr', 'HI', 'HNO3', 'H2SO4', 'HClO4', 'HClO3', 'HF', 'H3PO4', 'CH3COOH']);
const ACID_TEXT: Record<string, string> = {
  HF: 'hydrofluoric acid: corrosive and acutely toxic; burns may not hurt at first',
  H3PO4: 'phosphoric acid: corrosive when concentrated',
  CH3COOH: 'acetic acid: corrosive when concentrated (glacial)',
};
const OXIDISING_ANIONS = new Set(['perchlorate', 'chlorate', 'chlorite', 'hypochlorite', 'bromate', 'iodate', 'periodate', 'permanganate', 'manganate', 'chromate', 'dichromate', 'peroxodisulfate', 'peroxide', 'superoxide', 'nitrate', 'ferrate']);
const TOXIC_METALS: Record<string, string> = {
  Hg: 'mercury compound: toxic', Pb: 'lead compound: toxic, harms fertility', Cd: 'cadmium compound: toxic and carcinogenic',
  Tl: 'thallium compound: very toxic', As: 'arsenic compound: toxic and carcinogenic', Be: 'beryllium compound: toxic and carcinogenic',
  Ba: 'soluble barium salt: toxic if swallowed', Ni: 'nickel compound: skin sensitiser, suspected carcinogen',
  Co: 'cobalt compound: sensitiser, suspected carcinogen', Os: 'osmium compound: OsO4 is volatile and very toxic',
};

const memo = new WeakMap<FormulaAnalysis, Caution[]>();

/** Cautions for one substance, from its analysis (memoised per analysis; treat as read-only). */
export function cautionsFor(a: FormulaAnalysis): Caution[] {
  let hit = memo.get(a);
  if (!hit) memo.set(a, (hit = compute(a)));
  return hit;
}

function compute(a: FormulaAnalysis): Caution[] {
  if (!a.ok || !a.formula) return [];
  const out: Caution[] = [];
  const ascii = a.formula.parts.length === 1 ? a.ascii.replace(/\^.*$/, '').replace(/\(.*\)$/, '') : '';
  const ions = a.charges?.ions ?? [];
  const names = new Set(ions.map((i) => i.ionName).filter(Boolean) as string[]);
  if (STRONG_ACIDS.has(ascii)) out.push({ cls: 'strong acid', text: ACID_TEXT[ascii] ?? 'strong acid: corrosive; add acid to water, never water to acid' });
  if (ions.some((i) => i.ionName === 'hydroxide') && ions.some((i) => i.element && ['Li', 'Na', 'K', 'Rb', 'Cs', 'Ca', 'Sr', 'Ba'].includes(i.element))) {
    out.push({ cls: 'strong base', text: 'strong base: corrosive; dissolving it releases heat' });
  }
  const ox = [...names].filter((n) => OXIDISING_ANIONS.has(n));
  if (ox.length || ascii === 'H2O2' || ascii === 'CrO3' || ascii === 'HClO4') {
    const what = ox.length ? ox.join(', ') : ascii === 'H2O2' ? 'peroxide' : 'strong oxidiser';
    out.push({ cls: 'oxidiser', text: `oxidiser (${what}): keep from organic matter and reducing agents${a.atoms.N && names.has('ammonium') && names.has('nitrate') ? '; ammonium nitrate can detonate' : ''}` });
  }
  if (names.has('cyanide') || ascii === 'HCN') out.push({ cls: 'toxic', text: 'cyanide: very toxic; acids release HCN gas' });
  if (names.has('azide')) out.push({ cls: 'toxic', text: 'azide: very toxic; forms explosive heavy-metal azides' });
  if (a.atoms.Cr && (a.charges?.oxidationStates?.Cr ?? 0) >= 6) out.push({ cls: 'carcinogen', text: 'chromium(VI): carcinogenic and sensitising' });
  if (ascii !== 'HF' && a.atoms.F && ions.some((i) => i.element === 'F')) out.push({ cls: 'toxic', text: 'soluble fluoride: toxic if swallowed' });
  for (const [el, text] of Object.entries(TOXIC_METALS)) {
    if (!a.atoms[el]) continue;
    if (el === 'Ba' && ions.some((i) => i.ionName === 'sulfate')) continue; // BaSO4 is insoluble
    out.push({ cls: el === 'Cd' || el === 'As' || el === 'Be' ? 'carcinogen' : 'toxic', text });
  }
  return out;
}

export const CAUTION_FOOTNOTE = 'Cautions are reminders, not a safety judgement: follow the safety data sheet (SDS) and local rules; nothing here replaces a licensed chemist\'s review.';
