/**
 * GHS hazard statements (H-codes with their standard wording) and pictograms for the substances the tool
 * knows, for the formula card.
 *
 * Sources:
 * - Wording of the statements: the GHS (UN, Rev. 9, 2021), Annex 3, and the EU CLP Regulation (EC)
 *   1272/2008, Annex III (which adds the EUH statements). From memory.
 * - Classifications: the harmonised classification of CLP Annex VI, Table 3 (as amended by the ATPs up to
 *   about 2022) where the substance has one (`harmonised`), otherwise as the suppliers' safety data sheets
 *   commonly classify it (`supplier`). From memory, every one: each reading says so and ends with "check
 *   the supplier's SDS" — a classification depends on concentration (specific limits for acids, bases and
 *   peroxide), form (powder, solution) and updates of the annex.
 * - Pictograms and signal word are derived from the statements by the GHS rules (Annex 1; CLP Article 26
 *   precedence: no exclamation mark beside the skull for acute toxicity, nor beside corrosion for
 *   irritation, nor beside the health hazard for sensitisation).
 */
import type { FormulaAnalysis } from '../analyse';
import { analysisDerivedCache } from '../cache';
import { nameOf } from '../names';
import { reactiveGroups } from './groups';
import { mainPart } from './substance';

/** Standard wording of the hazard statements used below (GHS Rev. 9 Annex 3; CLP Annex III for EUH). */
export const H_STATEMENTS: Readonly<Record<string, string>> = Object.freeze({
  H201: 'Explosive; mass explosion hazard.',
  H221: 'Flammable gas.',
  H224: 'Extremely flammable liquid and vapour.',
  H225: 'Highly flammable liquid and vapour.',
  H226: 'Flammable liquid and vapour.',
  H260: 'In contact with water releases flammable gases which may ignite spontaneously.',
  H271: 'May cause fire or explosion; strong oxidiser.',
  H272: 'May intensify fire; oxidiser.',
  H280: 'Contains gas under pressure; may explode if heated.',
  H290: 'May be corrosive to metals.',
  H300: 'Fatal if swallowed.',
  H301: 'Toxic if swallowed.',
  H302: 'Harmful if swallowed.',
  H310: 'Fatal in contact with skin.',
  H311: 'Toxic in contact with skin.',
  H312: 'Harmful in contact with skin.',
  H314: 'Causes severe skin burns and eye damage.',
  H315: 'Causes skin irritation.',
  H317: 'May cause an allergic skin reaction.',
  H318: 'Causes serious eye damage.',
  H319: 'Causes serious eye irritation.',
  H330: 'Fatal if inhaled.',
  H331: 'Toxic if inhaled.',
  H332: 'Harmful if inhaled.',
  H334: 'May cause allergy or asthma symptoms or breathing difficulties if inhaled.',
  H335: 'May cause respiratory irritation.',
  H336: 'May cause drowsiness or dizziness.',
  H340: 'May cause genetic defects.',
  H341: 'Suspected of causing genetic defects.',
  H350: 'May cause cancer.',
  H350i: 'May cause cancer by inhalation.',
  H351: 'Suspected of causing cancer.',
  H360D: 'May damage the unborn child.',
  H360F: 'May damage fertility.',
  H360FD: 'May damage fertility. May damage the unborn child.',
  H360Df: 'May damage the unborn child. Suspected of damaging fertility.',
  H361d: 'Suspected of damaging the unborn child.',
  H361f: 'Suspected of damaging fertility.',
  H370: 'Causes damage to organs.',
  H372: 'Causes damage to organs through prolonged or repeated exposure.',
  H373: 'May cause damage to organs through prolonged or repeated exposure.',
  H400: 'Very toxic to aquatic life.',
  H410: 'Very toxic to aquatic life with long lasting effects.',
  H411: 'Toxic to aquatic life with long lasting effects.',
  H412: 'Harmful to aquatic life with long lasting effects.',
  EUH014: 'Reacts violently with water.',
  EUH031: 'Contact with acids liberates toxic gas.',
  EUH032: 'Contact with acids liberates very toxic gas.',
  EUH071: 'Corrosive to the respiratory tract.',
});

export const PICTOGRAMS: Readonly<Record<string, string>> = Object.freeze({
  GHS01: 'exploding bomb',
  GHS02: 'flame',
  GHS03: 'flame over circle',
  GHS04: 'gas cylinder',
  GHS05: 'corrosion',
  GHS06: 'skull and crossbones',
  GHS07: 'exclamation mark',
  GHS08: 'health hazard',
  GHS09: 'environment',
});

export const SDS_NOTE = "Classification from memory, not from the regulation's text: check the supplier's SDS.";

interface Entry {
  substance: string;
  codes: readonly string[];
  basis: 'harmonised' | 'supplier';
  note?: string;
}

const h = (substance: string, codes: string, note?: string): Entry => ({ substance, codes: codes.split(' '), basis: 'harmonised', ...(note ? { note } : {}) });
const sup = (substance: string, codes: string, note?: string): Entry => ({ substance, codes: codes.split(' '), basis: 'supplier', ...(note ? { note } : {}) });

const NI_SULFATE = 'H302 H332 H315 H317 H334 H341 H350i H360D H372 H400 H410';
const CO_SALT = 'H302 H317 H334 H341 H350i H360F H400 H410';
const DICHROMATE = 'H272 H301 H312 H330 H314 H317 H334 H340 H350 H360FD H372 H400 H410';
const CYANIDE_SALT = 'H290 H300 H310 H330 H372 H400 H410 EUH032';
const CD_SALT = 'H301 H330 H340 H350 H360FD H372 H400 H410';
const PERSULFATE = 'H272 H302 H315 H317 H319 H334 H335';

/** By Hill formula of the main part (a hydrate shares its salt's entry). */
const BY_HILL: Readonly<Record<string, Entry>> = Object.freeze({
  NiO4S: h('nickel(II) sulfate', NI_SULFATE),
  Cl2Ni: h('nickel(II) chloride', 'H301 H331 H315 H317 H334 H341 H350i H360D H372 H400 H410'),
  N2NiO6: h('nickel(II) nitrate', 'H272 H302 H332 H315 H318 H317 H334 H341 H350i H360D H372 H400 H410'),
  Ni: h('nickel (metal, powder)', 'H317 H351 H372 H412'),
  CoO4S: h('cobalt(II) sulfate', CO_SALT),
  Cl2Co: h('cobalt(II) chloride', CO_SALT),
  CoN2O6: h('cobalt(II) nitrate', `H272 H318 ${CO_SALT}`),
  Cr2K2O7: h('potassium dichromate', DICHROMATE),
  Cr2Na2O7: h('sodium dichromate', DICHROMATE),
  Cr2H8N2O7: h('ammonium dichromate', 'H272 H301 H312 H330 H314 H317 H334 H340 H350 H360FD H372 H400 H410'),
  CrO3: h('chromium(VI) trioxide', 'H271 H301 H311 H330 H314 H317 H334 H340 H350 H361f H372 H400 H410'),
  CrK2O4: h('potassium chromate', 'H315 H317 H319 H335 H340 H350i H400 H410'),
  CrNa2O4: h('sodium chromate', 'H301 H312 H330 H314 H317 H334 H340 H350 H360FD H372 H400 H410'),
  N2O6Pb: h('lead(II) nitrate', 'H272 H302 H332 H318 H360Df H373 H400 H410'),
  C4H6O4Pb: h('lead(II) acetate', 'H360Df H373 H400 H410'),
  CdO4S: h('cadmium sulfate', CD_SALT),
  CdCl2: h('cadmium chloride', CD_SALT),
  BH3O3: h('boric acid', 'H360FD'),
  B4Na2O7: h('disodium tetraborate (borax, anhydrous or hydrated)', 'H360FD'),
  CNNa: h('sodium cyanide', CYANIDE_SALT),
  CKN: h('potassium cyanide', CYANIDE_SALT),
  CHN: h('hydrogen cyanide', 'H224 H300 H310 H330 H400 H410'),
  C2AuKN2: sup('potassium dicyanoaurate(I)', 'H301 H311 H331 H410 EUH032'),
  C6FeK3N6: sup('potassium hexacyanoferrate(III)', 'EUH032', 'not classified as acutely toxic; acids release HCN'),
  C6FeK4N6: sup('potassium hexacyanoferrate(II)', 'EUH032', 'not classified as acutely toxic; acids release HCN'),
  FNa: h('sodium fluoride', 'H301 H315 H319 EUH032'),
  FK: h('potassium fluoride', 'H301 H311 H331'),
  FH4N: h('ammonium fluoride', 'H301 H311 H331'),
  FH: h('hydrogen fluoride (hydrofluoric acid)', 'H300 H310 H330 H314'),
  F2HK: h('potassium hydrogen difluoride', 'H301 H314'),
  F2H5N: h('ammonium hydrogen difluoride', 'H301 H314'),
  ClH: h('hydrochloric acid (25 % and more)', 'H290 H314 H335', 'specific concentration limits: below 25 % H315, H319, H335'),
  H2O4S: h('sulfuric acid (15 % and more)', 'H290 H314', 'specific concentration limits: 5–15 % H315, H319'),
  HNO3: h('nitric acid (65 % and more)', 'H272 H290 H314 H331 EUH071', 'below 65 % not an oxidiser; specific limits apply'),
  ClHO4: h('perchloric acid (over 50 %)', 'H271 H290 H314'),
  H3O4P: h('phosphoric acid (25 % and more)', 'H290 H314', 'specific concentration limits: 10–25 % H315, H319'),
  BrH: h('hydrobromic acid', 'H314 H335'),
  C2H4O2: h('acetic acid (90 % and more)', 'H226 H314', 'specific concentration limits: 25–90 % H314 only, 10–25 % H315, H319'),
  CH2O2: h('formic acid', 'H226 H302 H314 H331 EUH071'),
  C2H2O4: h('oxalic acid', 'H302 H312 H318'),
  H3NO3S: h('sulfamic acid', 'H315 H319 H412'),
  C6H8O7: sup('citric acid', 'H319'),
  HNaO: h('sodium hydroxide', 'H290 H314', 'specific concentration limits: 0.5–2 % H315, H319'),
  HKO: h('potassium hydroxide', 'H290 H302 H314'),
  HLiO: sup('lithium hydroxide', 'H301 H314'),
  CaH2O2: sup('calcium hydroxide', 'H315 H318 H335'),
  CaO: sup('calcium oxide', 'H315 H318 H335'),
  H3N: h('ammonia (aqueous, 25 % and more; the gas adds H221, H280, H331)', 'H314 H335 H400'),
  ClNaO: h('sodium hypochlorite solution', 'H290 H314 H318 H400 H410 EUH031'),
  CaCl2O2: h('calcium hypochlorite', 'H272 H302 H314 H400 H410 EUH031'),
  ClNaO3: h('sodium chlorate', 'H271 H302 H411'),
  ClKO3: h('potassium chlorate', 'H271 H302 H332 H411'),
  ClNaO4: sup('sodium perchlorate', 'H271 H302 H319'),
  ClKO4: sup('potassium perchlorate', 'H271 H302'),
  ClH4NO4: h('ammonium perchlorate', 'H201 H271'),
  ClNaO2: h('sodium chlorite', 'H272 H301 H310 H314 H318 H400 H410'),
  KMnO4: h('potassium permanganate', 'H272 H302 H361d H373 H400 H410'),
  H2O2: h(
    'hydrogen peroxide (70 % and more)',
    'H271 H302 H332 H314 H335 H412',
    'specific concentration limits: 50–70 % H272 H314, 35–50 % H318, 8–35 % H319; below 8 % not classified',
  ),
  NNaO3: sup('sodium nitrate', 'H272 H302 H319'),
  KNO3: sup('potassium nitrate', 'H272'),
  H4N2O3: sup('ammonium nitrate', 'H272 H319'),
  AgNO3: h('silver nitrate', 'H272 H314 H400 H410'),
  CuN2O6: sup('copper(II) nitrate', 'H272 H302 H315 H318 H400 H410'),
  H8N2O8S2: h('ammonium peroxodisulfate', PERSULFATE),
  Na2O8S2: h('sodium peroxodisulfate', PERSULFATE),
  K2O8S2: h('potassium peroxodisulfate', PERSULFATE),
  NNaO2: h('sodium nitrite', 'H272 H301 H319 H400'),
  Na2O2: h('sodium peroxide', 'H271 H314'),
  N3Na: h('sodium azide', 'H300 H310 H373 H400 H410 EUH032'),
  Na2S: sup('sodium sulfide', 'H290 H301 H311 H314 H400 EUH031'),
  CuO4S: h('copper(II) sulfate', 'H302 H315 H319 H400 H410'),
  O4SZn: h('zinc sulfate', 'H302 H318 H400 H410'),
  Cl2Zn: h('zinc chloride', 'H302 H314 H400 H410'),
  Cl3Fe: sup('iron(III) chloride', 'H290 H302 H315 H318'),
  AlCl3: h('aluminium chloride (anhydrous)', 'H314 EUH014'),
  H4N2: h('hydrazine', 'H226 H301 H311 H331 H314 H317 H350 H400 H410'),
  CH2O: h('formaldehyde (formalin)', 'H301 H311 H331 H314 H317 H335 H341 H350'),
  CH4O: h('methanol', 'H225 H301 H311 H331 H370'),
  C2H6O: h('ethanol', 'H225', 'suppliers add H319'),
  C3H8O: h('propan-2-ol (isopropanol)', 'H225 H319 H336'),
  C3H6O: h('acetone', 'H225 H319 H336', 'also EUH066 (repeated exposure may cause skin dryness or cracking)'),
  C2H6O2: h('ethylene glycol', 'H302 H373'),
  Na2O5S2: h('sodium disulfite (metabisulfite)', 'H302 H318 EUH031'),
  HNaO3S: h('sodium hydrogen sulfite', 'H302 EUH031'),
  Cl2Hg: h('mercury(II) chloride', 'H300 H314 H341 H361f H372 H400 H410'),
  ClH4N: h('ammonium chloride', 'H302 H319'),
  C10H14N2Na2O8: h('disodium edetate', 'H332 H373'),
});

/** Families, where no entry of its own: the classification of the family's usual soluble salt. */
function family(a: FormulaAnalysis): Entry[] {
  const out: Entry[] = [];
  const atoms = a.atoms;
  const groups = reactiveGroups(a);
  const ionic = a.charges?.basis === 'ionic';
  if (groups.some((g) => g.group === 'cyanide' && g.tag === 'free'))
    out.push(h('cyanide salt (as the salts of hydrogen cyanide)', 'H300 H310 H330 H400 H410 EUH032'));
  if (groups.some((g) => g.group === 'chromium-vi')) out.push(h('chromium(VI) compound (as the dichromates)', DICHROMATE));
  if (ionic && atoms.Ni) out.push(h('nickel compound (as nickel(II) sulfate)', NI_SULFATE));
  if (ionic && atoms.Co) out.push(h('cobalt compound (as cobalt(II) sulfate)', CO_SALT));
  if (ionic && atoms.Cd) out.push(h('cadmium compound (as the soluble cadmium salts)', CD_SALT));
  if (ionic && atoms.Pb) out.push(h('lead compound (as the lead compounds entry)', 'H302 H332 H360Df H373 H400 H410'));
  if (ionic && atoms.Hg) out.push(h('mercury compound (as the inorganic mercury compounds entry)', 'H300 H310 H330 H373 H400 H410'));
  if (ionic && atoms.B && atoms.O && !atoms.F) out.push(h('borate (as boric acid and the borates)', 'H360FD'));
  const ions = a.charges?.ions ?? [];
  const soluble = ions.filter((i) => i.role === 'cation').every((i) => i.ionName === 'ammonium' || ['Li', 'Na', 'K', 'Rb', 'Cs'].includes(i.element ?? ''));
  if (ionic && soluble && ions.some((i) => i.kind === 'monatomic-anion' && i.element === 'F')) out.push(h('soluble fluoride (as sodium fluoride)', 'H301'));
  return out;
}

export interface GhsStatement {
  code: string;
  text: string;
}

export interface GhsReading {
  /** What the classification is for. */
  substance: string;
  statements: GhsStatement[];
  pictograms: Array<{ code: string; name: string }>;
  signalWord: 'Danger' | 'Warning' | null;
  /** `harmonised` (CLP Annex VI) or `supplier` (as SDSs commonly classify it); `family` where it is the family's. */
  basis: string;
  notes: string[];
  fromMemory: true;
  /** Always: check the supplier's SDS. */
  sds: string;
}

const DANGER = new Set([
  'H201',
  'H224',
  'H225',
  'H260',
  'H271',
  'H300',
  'H301',
  'H310',
  'H311',
  'H314',
  'H318',
  'H330',
  'H331',
  'H334',
  'H340',
  'H350',
  'H350i',
  'H360D',
  'H360F',
  'H360FD',
  'H360Df',
  'H370',
  'H372',
]);

/** Pictograms from the statements (GHS Annex 1), with the CLP Article 26 precedence. */
export function pictogramsFor(codes: readonly string[]): string[] {
  const c = new Set(codes);
  const any = (...xs: string[]) => xs.some((x) => c.has(x));
  const out: string[] = [];
  if (any('H201')) out.push('GHS01');
  if (any('H221', 'H224', 'H225', 'H226', 'H260')) out.push('GHS02');
  if (any('H271', 'H272')) out.push('GHS03');
  if (any('H280')) out.push('GHS04');
  const corrosion = any('H290', 'H314', 'H318');
  if (corrosion) out.push('GHS05');
  const skull = any('H300', 'H301', 'H310', 'H311', 'H330', 'H331');
  if (skull) out.push('GHS06');
  const health = any('H334', 'H340', 'H341', 'H350', 'H350i', 'H351', 'H360D', 'H360F', 'H360FD', 'H360Df', 'H361d', 'H361f', 'H370', 'H372', 'H373');
  const exclaim = (!skull && any('H302', 'H312', 'H332')) || (!corrosion && any('H315', 'H319')) || (!c.has('H334') && c.has('H317')) || any('H335', 'H336');
  if (exclaim) out.push('GHS07');
  if (health) out.push('GHS08');
  if (any('H400', 'H410', 'H411')) out.push('GHS09');
  return out.sort();
}

const memo = analysisDerivedCache<GhsReading | { none: true }>(20_000, 16 * 1024 * 1024);

/** The GHS reading of a substance the tool knows; null for any other. Memoised; treat as read-only. */
export function ghsFor(a: FormulaAnalysis): GhsReading | null {
  const hit = memo.get(a.input);
  if (hit) return 'none' in hit ? null : hit;
  const r = compute(a);
  memo.set(a.input, r ?? { none: true }, r ? 2048 : 32);
  return r;
}

function compute(a: FormulaAnalysis): GhsReading | null {
  const main = mainPart(a);
  if (!main || !a.ok) return null;
  let own: Entry | undefined = BY_HILL[main.hill];
  // An entry for the anhydrous form only (aluminium chloride) does not fit its hydrate.
  if (own && main.water && /anhydrous/.test(own.substance)) own = undefined;
  const entries = own ? [own] : family(a);
  if (!entries.length) return null;
  const codes: string[] = [];
  for (const e of entries) for (const code of e.codes) if (!codes.includes(code)) codes.push(code);
  const notes = entries.map((e) => e.note).filter((x): x is string => !!x);
  if (main.water && own) notes.push('the hydrates share the classification of the salt');
  const basis = own
    ? own.basis === 'harmonised'
      ? 'harmonised classification (CLP Annex VI), from memory'
      : "as suppliers' SDSs commonly classify it (no harmonised entry), from memory"
    : "the family's harmonised classification (CLP Annex VI), from memory: this substance's own may differ";
  const signalWord = codes.some((x) => DANGER.has(x)) ? 'Danger' : codes.some((x) => /^H/.test(x) && !['H411', 'H412'].includes(x)) ? 'Warning' : null;
  return {
    substance: own ? own.substance : `${nameOf(a) ?? a.display}: ${entries.map((e) => e.substance).join('; ')}`,
    statements: codes.map((code) => ({ code, text: H_STATEMENTS[code] ?? '' })),
    pictograms: pictogramsFor(codes).map((code) => ({ code, name: PICTOGRAMS[code] })),
    signalWord,
    basis,
    notes,
    fromMemory: true,
    sds: SDS_NOTE,
  };
}
