/**
 * Reactive groups: what each ingredient is, for the incompatible-pair rules (rules.ts). A substance may
 * belong to several groups (nitric acid is a strong acid and a nitrate oxidiser; sodium peroxide is a
 * peroxide and water-reactive). Groups are read from the formula's ionic reading (ion names of
 * chem/data/ions.ts, metals, oxidation states), from the Hill formula of molecular substances (the usual
 * reagents: the table below), and, where the formula says nothing, from the name the line gave.
 *
 * The classes follow the reactive-hazard literature's grouping (Bretherick's Handbook of Reactive Chemical
 * Hazards, 8th ed., 2017, its group entries "oxidants", "reducants", "metal azides", "cyanides",
 * "ammoniacal silver compounds"…; the incompatibility charts of the usual laboratory safety guides, e.g.
 * Prudent Practices in the Laboratory, National Research Council, 2011, ch. 6). From memory.
 */
import type { FormulaAnalysis } from '../analyse';
import { analysisDerivedCache } from '../cache';
import { isMetal } from '../data/elements';
import type { IonInReading } from '../charge/balance';
import { ACID_SYSTEMS, ANION_SYSTEMS, MOLECULAR_ACID_BASE } from './data/acids';
import { mainPart } from './substance';

export type ReactiveGroup =
  | 'strong-acid'
  | 'acid'
  | 'strong-base'
  | 'hypochlorite'
  | 'chlorate'
  | 'nitrate'
  | 'permanganate'
  | 'chromium-vi'
  | 'peroxide'
  | 'reducer'
  | 'cyanide'
  | 'sulfide'
  | 'sulfite'
  | 'nitrite'
  | 'azide'
  | 'ammonia'
  | 'fuel'
  | 'metal'
  | 'water-reactive'
  | 'heavy-metal'
  | 'halogen'
  | 'halogenated-solvent';

/** The groups in plain words (for messages and hovers). */
export const GROUP_LABEL: Readonly<Record<ReactiveGroup, string>> = Object.freeze({
  'strong-acid': 'strong acid',
  acid: 'acid',
  'strong-base': 'strong base',
  hypochlorite: 'oxidiser (hypochlorite, chlorine bleach)',
  chlorate: 'oxidiser (chlorate, perchlorate, chlorite, bromate)',
  nitrate: 'oxidiser (nitrate, nitric acid)',
  permanganate: 'oxidiser (permanganate)',
  'chromium-vi': 'oxidiser (chromate, dichromate, chromium(VI))',
  peroxide: 'oxidiser (peroxide, persulfate)',
  reducer: 'reducer',
  cyanide: 'cyanide',
  sulfide: 'sulfide',
  sulfite: 'sulfite, bisulfite, thiosulfate',
  nitrite: 'nitrite',
  azide: 'azide',
  ammonia: 'ammonia, ammonium, amine',
  fuel: 'organic fuel (alcohol, glycol, sugar, solvent)',
  metal: 'metal (powder)',
  'water-reactive': 'water-reactive',
  'heavy-metal': 'heavy-metal salt',
  halogen: 'halogen',
  'halogenated-solvent': 'chlorinated solvent',
});

export interface GroupMember {
  group: ReactiveGroup;
  /** What the substance is, in plain words (`hypochlorite`, `ethanol`, `zinc`). */
  what: string;
  /** A finer kind some rules need: `nitric-acid`, `hydrochloric-acid`, `sulfuric-acid`, `perchlorate`, `chlorite`, `hydrogen-peroxide`, `persulfate`, `alcohol`, `ketone`, `amine-2`… */
  tag?: string;
  /** For acids: the pKa of the most acidic proton. */
  pKa?: number;
  /** For metals and heavy-metal salts: the element. */
  element?: string;
  /** For the acid-sensitive groups: the acid–base system whose protonated form is the gas (data/acids.ts). */
  system?: string;
}

/** Strongest pKa of an acid by system (the first step). */
const firstPKa = (id: string) => ACID_SYSTEMS[id].pKa[0];

/** Molecular substances by Hill formula: organic fuels, amines, reducers, solvents and the other reagents the rules name. */
const MOLECULAR: Readonly<Record<string, readonly Omit<GroupMember, 'pKa'>[]>> = Object.freeze({
  CH4O: [{ group: 'fuel', what: 'methanol', tag: 'alcohol' }],
  C2H6O: [{ group: 'fuel', what: 'ethanol', tag: 'alcohol' }],
  C3H8O: [{ group: 'fuel', what: 'propanol (isopropanol)', tag: 'alcohol' }],
  C4H10O: [{ group: 'fuel', what: 'butanol or diethyl ether', tag: 'alcohol' }],
  C2H6O2: [{ group: 'fuel', what: 'ethylene glycol', tag: 'glycol' }],
  C3H8O2: [{ group: 'fuel', what: 'propylene glycol', tag: 'glycol' }],
  C4H10O3: [{ group: 'fuel', what: 'diethylene glycol', tag: 'glycol' }],
  C3H8O3: [{ group: 'fuel', what: 'glycerol', tag: 'glycerol' }],
  C6H14O6: [{ group: 'fuel', what: 'sorbitol (a sugar alcohol)', tag: 'sugar' }],
  C12H22O11: [{ group: 'fuel', what: 'sucrose (a sugar)', tag: 'sugar' }],
  C6H12O6: [{ group: 'fuel', what: 'glucose (a sugar)', tag: 'sugar' }],
  C3H6O: [{ group: 'fuel', what: 'acetone', tag: 'ketone' }],
  C4H8O: [{ group: 'fuel', what: 'butanone or tetrahydrofuran', tag: 'ketone' }],
  C4H8O2: [{ group: 'fuel', what: 'ethyl acetate', tag: 'solvent' }],
  C6H14: [{ group: 'fuel', what: 'hexane', tag: 'solvent' }],
  C7H8: [{ group: 'fuel', what: 'toluene', tag: 'solvent' }],
  C8H10: [{ group: 'fuel', what: 'xylene', tag: 'solvent' }],
  C6H6: [{ group: 'fuel', what: 'benzene', tag: 'solvent' }],
  C2H3N: [{ group: 'fuel', what: 'acetonitrile', tag: 'solvent' }],
  C2H6OS: [{ group: 'fuel', what: 'dimethyl sulfoxide', tag: 'solvent' }],
  CH2O: [
    { group: 'fuel', what: 'formaldehyde', tag: 'aldehyde' },
    { group: 'reducer', what: 'formaldehyde', tag: 'formaldehyde' },
  ],
  C2H4O: [{ group: 'fuel', what: 'acetaldehyde', tag: 'aldehyde' }],
  CH2Cl2: [{ group: 'halogenated-solvent', what: 'dichloromethane' }],
  CHCl3: [{ group: 'halogenated-solvent', what: 'chloroform' }],
  CH5N: [{ group: 'ammonia', what: 'methylamine', tag: 'amine-1' }],
  C2H7N: [{ group: 'ammonia', what: 'ethylamine or dimethylamine', tag: 'amine-2' }],
  C3H9N: [{ group: 'ammonia', what: 'trimethylamine or propylamine', tag: 'amine-3' }],
  C4H11N: [{ group: 'ammonia', what: 'diethylamine or butylamine', tag: 'amine-2' }],
  C6H15N: [{ group: 'ammonia', what: 'triethylamine', tag: 'amine-3' }],
  C2H7NO: [{ group: 'ammonia', what: 'ethanolamine', tag: 'amine-1' }],
  C3H9NO: [{ group: 'ammonia', what: 'isopropanolamine', tag: 'amine-1' }],
  C4H11NO2: [{ group: 'ammonia', what: 'diethanolamine', tag: 'amine-2' }],
  C6H15NO3: [{ group: 'ammonia', what: 'triethanolamine', tag: 'amine-3' }],
  C9H21NO3: [{ group: 'ammonia', what: 'triisopropanolamine', tag: 'amine-3' }],
  C4H9NO: [{ group: 'ammonia', what: 'morpholine', tag: 'amine-2' }],
  C5H11N: [{ group: 'ammonia', what: 'piperidine', tag: 'amine-2' }],
  C4H11NO3: [{ group: 'ammonia', what: 'Tris', tag: 'amine-1' }],
  C2H8N2: [{ group: 'ammonia', what: 'ethylenediamine', tag: 'amine-1' }],
  C4H13N3: [{ group: 'ammonia', what: 'diethylenetriamine', tag: 'amine-2' }],
  H3N: [{ group: 'ammonia', what: 'ammonia', tag: 'ammonia' }],
  CH4N2O: [{ group: 'ammonia', what: 'urea', tag: 'urea' }],
  H4N2: [{ group: 'reducer', what: 'hydrazine', tag: 'hydrazine' }],
  H3NO: [{ group: 'reducer', what: 'hydroxylamine', tag: 'hydroxylamine' }],
  H3O2P: [{ group: 'reducer', what: 'hypophosphorous acid', tag: 'hypophosphite' }],
  H2O2: [{ group: 'peroxide', what: 'hydrogen peroxide', tag: 'hydrogen-peroxide' }],
  C2H4O3: [], // glycolic acid or peracetic acid: told apart by the written form below
  ClHO: [{ group: 'hypochlorite', what: 'hypochlorous acid', tag: 'hypochlorite', system: 'hocl' }],
  C3Cl3N3O3: [{ group: 'hypochlorite', what: 'trichloroisocyanuric acid (chlorine releaser)', tag: 'isocyanurate' }],
  ClHO4: [{ group: 'chlorate', what: 'perchloric acid', tag: 'perchlorate' }],
  ClHO3: [{ group: 'chlorate', what: 'chloric acid', tag: 'chlorate' }],
  HNO3: [{ group: 'nitrate', what: 'nitric acid', tag: 'nitric-acid' }],
  CrO3: [{ group: 'chromium-vi', what: 'chromium trioxide' }],
  CHN: [{ group: 'cyanide', what: 'hydrogen cyanide', tag: 'free', system: 'hcn' }],
  H2S: [{ group: 'sulfide', what: 'hydrogen sulfide', tag: 'soluble', system: 'h2s' }],
  O2S: [{ group: 'sulfite', what: 'sulfur dioxide', tag: 'sulfite', system: 'sulfite' }],
  HNO2: [{ group: 'nitrite', what: 'nitrous acid', system: 'hno2' }],
  HN3: [{ group: 'azide', what: 'hydrazoic acid', system: 'hn3' }],
  // Water-reactive molecular substances: acid chlorides and anhydrides.
  Cl4Si: [{ group: 'water-reactive', what: 'silicon tetrachloride', tag: 'chloride' }],
  Cl3P: [{ group: 'water-reactive', what: 'phosphorus trichloride', tag: 'chloride' }],
  Cl5P: [{ group: 'water-reactive', what: 'phosphorus pentachloride', tag: 'chloride' }],
  Cl3OP: [{ group: 'water-reactive', what: 'phosphoryl chloride', tag: 'chloride' }],
  Cl2OS: [{ group: 'water-reactive', what: 'thionyl chloride', tag: 'chloride' }],
  Cl2O2S: [{ group: 'water-reactive', what: 'sulfuryl chloride', tag: 'chloride' }],
  BCl3: [{ group: 'water-reactive', what: 'boron trichloride', tag: 'chloride' }],
  C2H3ClO: [{ group: 'water-reactive', what: 'acetyl chloride', tag: 'chloride' }],
  ClHO3S: [{ group: 'water-reactive', what: 'chlorosulfonic acid', tag: 'chloride' }],
  O10P4: [{ group: 'water-reactive', what: 'phosphorus pentoxide', tag: 'anhydride' }],
  O5P2: [{ group: 'water-reactive', what: 'phosphorus pentoxide', tag: 'anhydride' }],
  O3S: [{ group: 'water-reactive', what: 'sulfur trioxide', tag: 'anhydride' }],
});

/** Elements as substances that are halogens. */
const HALOGENS: Readonly<Record<string, string>> = { Cl2: 'chlorine', Br2: 'bromine', I2: 'iodine' };

/** Metals that give hydrogen with acids (standard potential below zero, common practice), and with strong bases (amphoteric). */
const ACTIVE_METALS = new Set(['Li', 'Na', 'K', 'Rb', 'Cs', 'Be', 'Mg', 'Ca', 'Sr', 'Ba', 'Al', 'Zn', 'Fe', 'Sn', 'Mn', 'Cr', 'Ni', 'Co', 'Cd', 'Ti', 'Pb']);
const AMPHOTERIC_METALS = new Set(['Al', 'Zn', 'Sn', 'Pb', 'Be', 'Ga', 'Si']);
const ALKALI_METALS = new Set(['Li', 'Na', 'K', 'Rb', 'Cs']);
const WATER_REACTIVE_METALS = new Set([...ALKALI_METALS, 'Ca', 'Sr', 'Ba']);
/** Cations whose salts form explosive azides, catalyse peroxide decomposition, or (Ag, Au, Hg) explosive compounds with ammonia. */
const HEAVY_METALS = new Set(['Pb', 'Cu', 'Ag', 'Hg', 'Cd', 'Zn', 'Ni', 'Co', 'Fe', 'Mn', 'Cr', 'Au', 'Tl', 'Pt', 'Pd']);
/** Cyanide complexes that hold their cyanide firmly (acid releases HCN only when strong, or hot). */
const STABLE_CYANIDE_CENTRES = new Set(['Au', 'Fe', 'Co', 'Pt', 'Pd', 'Cr', 'Mn', 'Ru', 'Os', 'Ir', 'Rh']);
/** Anhydrous chlorides and bromides that react violently with water, fuming hydrogen chloride. */
const FUMING_HALIDES = new Set(['AlCl3', 'AlBr3', 'TiCl4', 'SnCl4', 'ZrCl4', 'SbCl5', 'FeCl3']);
/** Strong bases by cation (hydroxides, oxides, alkoxides of these). */
const STRONG_BASE_CATIONS = new Set(['Li', 'Na', 'K', 'Rb', 'Cs', 'Ca', 'Sr', 'Ba']);

const memo = analysisDerivedCache<GroupMember[]>(20_000, 4 * 1024 * 1024);
const byAnalysis = new WeakMap<FormulaAnalysis, GroupMember[]>();

/**
 * The reactive groups of a substance. `name` is the name the line gave, where it was named: read only when
 * the formula places the substance in no group. Memoised; treat the result as read-only.
 */
export function reactiveGroups(a: FormulaAnalysis, name?: string): GroupMember[] {
  if (!name) {
    // Per analysis (analyses are shared and read-only): the hot path of every batch.
    let own = byAnalysis.get(a);
    if (!own) byAnalysis.set(a, (own = classify(a)));
    return own;
  }
  const key = `${a.input}\u0000${name}`;
  let hit = memo.get(key);
  if (!hit) {
    hit = classify(a);
    if (!hit.length && name) hit = byName(name);
    memo.set(key, hit, 64 + 96 * hit.length);
  }
  return hit;
}

function classify(a: FormulaAnalysis): GroupMember[] {
  if (!a.ok || !a.formula) return [];
  const main = mainPart(a);
  if (!main) return [];
  const out: GroupMember[] = [];
  const c = a.charges;
  const ascii = a.formula.parts.length === 1 ? a.ascii.replace(/\((?:aq|s|l|g|cr)\)$/, '') : '';
  // Adducts: hydrogen peroxide in percarbonate or urea peroxide.
  for (const [hill] of main.adducts) if (hill === 'H2O2') out.push({ group: 'peroxide', what: 'hydrogen peroxide (adduct)', tag: 'hydrogen-peroxide' });

  if (c?.basis === 'element' && a.formula.parts.length === 1) {
    const symbols = Object.keys(main.atoms);
    if (symbols.length === 1) {
      const el = symbols[0];
      if (HALOGENS[main.hill]) {
        out.push({ group: 'halogen', what: HALOGENS[main.hill], element: el });
        if (el === 'Cl') out.push({ group: 'hypochlorite', what: 'chlorine', tag: 'chlorine' });
      } else if (isMetal(el) || el === 'Si') {
        const tags = [ACTIVE_METALS.has(el) ? 'active' : '', AMPHOTERIC_METALS.has(el) ? 'amphoteric' : ''].filter(Boolean).join(' ');
        out.push({ group: 'metal', what: elementWord(el), element: el, tag: tags || undefined });
        if (WATER_REACTIVE_METALS.has(el))
          out.push({ group: 'water-reactive', what: elementWord(el), element: el, tag: ALKALI_METALS.has(el) ? 'alkali-metal' : 'metal' });
      }
    }
    return out;
  }

  if (c?.basis === 'ionic' && c.ions && c.balanced) {
    ionic(c.ions, main.hill, a, out);
    return out;
  }

  // Molecular substances.
  if (a.charge !== 0) return out;
  const mol = MOLECULAR[main.hill];
  if (main.hill === 'C2H4O3') {
    if (/COOOH|CO3H/.test(ascii)) out.push({ group: 'peroxide', what: 'peracetic acid', tag: 'peracid' });
  }
  if (mol) for (const m of mol) out.push({ ...m });
  const ab = MOLECULAR_ACID_BASE[main.hill];
  if (ab) {
    if (ab.strong) out.push({ group: 'strong-acid', what: ab.name, tag: acidTag(main.hill), pKa: -3 });
    else if (ab.system && ACID_SYSTEMS[ab.system].z0 <= 0 && firstPKa(ab.system) < 8) out.push({ group: 'acid', what: ab.name, pKa: firstPKa(ab.system) });
    else if (ab.fixed && ab.fixed < 0) out.push({ group: 'acid', what: ab.name, pKa: 1.0 });
  }
  return out;
}

const acidTag = (hill: string): string | undefined =>
  ({ ClH: 'hydrochloric-acid', H2O4S: 'sulfuric-acid', HNO3: 'nitric-acid', ClHO4: 'perchloric-acid', O3S: 'sulfuric-acid' })[hill];

function ionic(ions: readonly IonInReading[], hill: string, a: FormulaAnalysis, out: GroupMember[]) {
  const cations = ions.filter((i) => i.role === 'cation');
  const anions = ions.filter((i) => i.role === 'anion');
  const names = new Set(anions.map((i) => i.ionName).filter(Boolean) as string[]);
  const metals = cations.filter((i) => i.kind === 'metal').map((i) => i.element ?? '');
  const onlyAlkaliLike = cations.every((i) => (i.kind === 'metal' && STRONG_BASE_CATIONS.has(i.element ?? '')) || i.ionName === 'ammonium');
  const has = (n: string) => names.has(n);

  // Bases
  if (cations.some((i) => i.kind === 'metal' && STRONG_BASE_CATIONS.has(i.element ?? ''))) {
    const basicAnion = anions.find(
      (i) =>
        i.ionName === 'hydroxide' ||
        (i.ionName && /oxide$/.test(i.ionName) && i.ionName !== 'peroxide' && i.ionName !== 'superoxide') ||
        (i.kind === 'monatomic-anion' && i.element === 'O'),
    );
    if (basicAnion)
      out.push({ group: 'strong-base', what: basicAnion.ionName === 'hydroxide' ? 'hydroxide' : basicAnion.ionName ? basicAnion.ionName : 'oxide' });
  }
  // Acids: acidic salts and acid readings with a proton.
  if (cations.some((i) => i.kind === 'proton' || i.ionName === 'hydronium') && !anions.some((i) => i.ionName && ANION_SYSTEMS[i.ionName]))
    out.push({ group: 'strong-acid', what: 'acid', pKa: -1 });
  for (const an of anions) {
    const sys = an.ionName ? ANION_SYSTEMS[an.ionName] : undefined;
    if (!sys) continue;
    const s = ACID_SYSTEMS[sys[0]];
    // The protons the anion still carries: an acid if its next proton has pKa below 8.
    const level = protonsCarried(an) / sys[1];
    if (level > 0) {
      const step = s.pKa.length - Math.ceil(level - 1e-9);
      const pKa = s.pKa[step];
      if (pKa !== undefined && pKa < 8) out.push({ group: 'acid', what: an.ionName ?? 'acid salt', pKa });
    }
  }
  if (cations.some((i) => i.ionName === 'ammonium')) out.push({ group: 'ammonia', what: 'ammonium', tag: 'ammonium' });
  for (const cat of cations) {
    if (cat.kind === 'metal' && cat.element === 'Fe' && cat.charge === 3) out.push({ group: 'acid', what: 'iron(III) salt (acidic in water)', pKa: 2.19 });
    if (cat.kind === 'metal' && cat.element === 'Al' && cat.charge === 3 && !onlyAlkaliLike)
      out.push({ group: 'acid', what: 'aluminium salt (acidic in water)', pKa: 4.97 });
  }
  // Oxidisers
  if (has('hypochlorite')) out.push({ group: 'hypochlorite', what: 'hypochlorite', tag: 'hypochlorite', system: 'hocl' });
  if (has('dichloroisocyanurate')) out.push({ group: 'hypochlorite', what: 'dichloroisocyanurate (chlorine releaser)', tag: 'isocyanurate' });
  for (const n of ['chlorate', 'perchlorate', 'chlorite', 'bromate', 'iodate', 'periodate'])
    if (has(n)) out.push({ group: 'chlorate', what: n, tag: n, ...(n === 'chlorite' ? { system: 'hclo2' } : {}) });
  if (has('nitrate')) out.push({ group: 'nitrate', what: 'nitrate', tag: 'nitrate-salt' });
  if (has('permanganate') || has('manganate')) out.push({ group: 'permanganate', what: 'permanganate' });
  if ((a.charges?.oxidationStates?.Cr ?? 0) >= 6 || has('chromate') || has('dichromate'))
    out.push({ group: 'chromium-vi', what: has('dichromate') ? 'dichromate' : has('chromate') ? 'chromate' : 'chromium(VI)' });
  if (has('peroxide') || has('superoxide')) out.push({ group: 'peroxide', what: has('peroxide') ? 'metal peroxide' : 'superoxide', tag: 'metal-peroxide' });
  if (has('peroxodisulfate')) out.push({ group: 'peroxide', what: 'persulfate', tag: 'persulfate' });
  if (has('perborate')) out.push({ group: 'peroxide', what: 'perborate', tag: 'perborate' });
  // Reducers
  if (has('hypophosphite')) out.push({ group: 'reducer', what: 'hypophosphite', tag: 'hypophosphite' });
  if (has('tetrahydroborate')) out.push({ group: 'reducer', what: 'borohydride', tag: 'hydride' });
  if (has('dithionite')) out.push({ group: 'reducer', what: 'dithionite', tag: 'dithionite' });
  if (cations.some((i) => i.ionName === 'hydrazinium')) out.push({ group: 'reducer', what: 'hydrazinium salt', tag: 'hydrazine' });
  if (hill === 'ClH4NO' || hill === 'H8N2O6S') out.push({ group: 'reducer', what: 'hydroxylammonium salt', tag: 'hydroxylamine' });
  // Cyanide
  const free = cations.every(
    (i) => i.ionName === 'ammonium' || (i.kind === 'metal' && STRONG_BASE_CATIONS.has(i.element ?? '')) || (i.kind === 'metal' && i.element === 'Mg'),
  );
  if (has('cyanide')) out.push({ group: 'cyanide', what: free ? 'cyanide' : 'metal cyanide', tag: 'free', system: 'hcn' });
  for (const ion of ions) {
    if (ion.kind !== 'complex' || !/\(CN\)|CN\)?\d*\]?$|\(CN\)\d/.test(ion.text)) continue;
    const centre = /^([A-Z][a-z]?)/.exec(ion.text)?.[1] ?? '';
    out.push({
      group: 'cyanide',
      what: `cyanide complex of ${elementWord(centre)}`,
      tag: STABLE_CYANIDE_CENTRES.has(centre) ? 'stable-complex' : 'free',
      system: 'hcn',
    });
  }
  // Sulfide
  const sulfideAnion =
    anions.some((i) => i.kind === 'monatomic-anion' && i.element === 'S') || has('hydrogen sulfide') || has('disulfide') || has('polysulfide');
  if (sulfideAnion) {
    // Sulfides that acids dissolve with H2S: soluble ones and FeS, MnS, ZnS, CdS, NiS, CoS; not CuS, PbS, Ag2S, HgS (common practice).
    const insoluble = metals.some((m) => ['Cu', 'Pb', 'Ag', 'Hg', 'Bi', 'Sb', 'As', 'Sn', 'Mo', 'W'].includes(m));
    if (!insoluble) out.push({ group: 'sulfide', what: free ? 'sulfide' : 'metal sulfide', tag: free ? 'soluble' : 'metal', system: 'h2s' });
  }
  for (const n of ['sulfite', 'hydrogen sulfite', 'disulfite', 'thiosulfate', 'dithionite'])
    if (has(n))
      out.push({
        group: 'sulfite',
        what: n === 'disulfite' ? 'metabisulfite (disulfite)' : n,
        tag: n === 'thiosulfate' ? 'thiosulfate' : 'sulfite',
        system: 'sulfite',
      });
  if (has('nitrite')) out.push({ group: 'nitrite', what: 'nitrite', system: 'hno2' });
  if (has('azide')) out.push({ group: 'azide', what: 'azide', system: 'hn3' });
  // Heavy metals (simple cations and complex centres)
  const heavy = new Set<string>();
  for (const m of metals) if (HEAVY_METALS.has(m)) heavy.add(m);
  for (const ion of ions) {
    if (ion.kind !== 'complex') continue;
    const centre = /^\[?([A-Z][a-z]?)/.exec(ion.text)?.[1] ?? '';
    if (HEAVY_METALS.has(centre)) heavy.add(centre);
    // Ammine complexes of silver and gold: the ammoniacal solution that deposits explosives on standing.
    if ((centre === 'Ag' || centre === 'Au') && /NH3/.test(ion.text)) out.push({ group: 'ammonia', what: 'ammine complex', tag: 'ammine' });
  }
  for (const el of heavy) out.push({ group: 'heavy-metal', what: `${elementWord(el)} salt`, element: el });
  // Water-reactive solids
  const anionEls = new Set(anions.filter((i) => i.kind === 'monatomic-anion').map((i) => i.element));
  if (anionEls.has('H')) out.push({ group: 'water-reactive', what: 'hydride', tag: 'hydride' });
  if (has('tetrahydroaluminate')) out.push({ group: 'water-reactive', what: 'lithium aluminium hydride', tag: 'hydride' });
  if (has('acetylide') || anionEls.has('C')) out.push({ group: 'water-reactive', what: 'carbide', tag: 'carbide' });
  if (anionEls.has('N') && !names.size) out.push({ group: 'water-reactive', what: 'nitride', tag: 'nitride' });
  if (anionEls.has('P')) out.push({ group: 'water-reactive', what: 'phosphide', tag: 'phosphide' });
  if (has('amide')) out.push({ group: 'water-reactive', what: 'sodium amide', tag: 'amide' });
  if (main(a) && FUMING_HALIDES.has(a.ascii.replace(/\(.*\)$/, '')) && mainWater(a) === 0 && hill !== 'Cl3Fe')
    out.push({ group: 'water-reactive', what: `anhydrous ${a.ascii}`, tag: 'chloride' });
  if ((has('peroxide') || has('superoxide')) && metals.some((m) => ALKALI_METALS.has(m)))
    out.push({ group: 'water-reactive', what: 'alkali-metal peroxide', tag: 'peroxide' });
  if (anionEls.has('O') && metals.length === 1 && ['Ca', 'Na', 'K', 'Li', 'Ba', 'Sr'].includes(metals[0]))
    out.push({ group: 'water-reactive', what: metals[0] === 'Ca' ? 'quicklime (calcium oxide)' : 'alkali oxide', tag: 'oxide' });
}

const main = (a: FormulaAnalysis) => mainPart(a);
const mainWater = (a: FormulaAnalysis) => mainPart(a)?.water ?? 0;

/** Protons an anion still carries that it can give up (HSO₄⁻ 1, H₂PO₄⁻ 2, HCO₃⁻ 1, SO₄²⁻ 0; S₂O₅²⁻ 2 over its two sulfite units), from its charge and its system. */
function protonsCarried(an: IonInReading): number {
  const sys = an.ionName ? ANION_SYSTEMS[an.ionName] : undefined;
  if (!sys) return 0;
  const s = ACID_SYSTEMS[sys[0]];
  const units = sys[1];
  // Charge of the fully deprotonated units minus the ion's charge = protons left on the ion.
  const fullyDeprotonated = units * (s.z0 - s.pKa.length);
  return Math.max(0, Math.round(an.charge - fullyDeprotonated));
}

const ELEMENT_WORDS: Readonly<Record<string, string>> = {
  Li: 'lithium',
  Na: 'sodium',
  K: 'potassium',
  Rb: 'rubidium',
  Cs: 'caesium',
  Be: 'beryllium',
  Mg: 'magnesium',
  Ca: 'calcium',
  Sr: 'strontium',
  Ba: 'barium',
  Al: 'aluminium',
  Zn: 'zinc',
  Fe: 'iron',
  Sn: 'tin',
  Mn: 'manganese',
  Cr: 'chromium',
  Ni: 'nickel',
  Co: 'cobalt',
  Cd: 'cadmium',
  Ti: 'titanium',
  Pb: 'lead',
  Cu: 'copper',
  Ag: 'silver',
  Au: 'gold',
  Hg: 'mercury',
  Tl: 'thallium',
  Pt: 'platinum',
  Pd: 'palladium',
  Si: 'silicon',
  Ga: 'gallium',
};
const elementWord = (el: string) => ELEMENT_WORDS[el] ?? el;

/**
 * Shelf and trade names, read only where the formula places the substance in no group (the names module
 * resolves most names to formulas first). Common practice: the usual labels of cleaning and pool products.
 */
const NAME_WORDS: ReadonlyArray<readonly [RegExp, GroupMember[]]> = [
  [/\b(chlorine )?bleach\b|hypochlorite/i, [{ group: 'hypochlorite', what: 'hypochlorite bleach', tag: 'hypochlorite', system: 'hocl' }]],
  [/\bvinegar\b/i, [{ group: 'acid', what: 'vinegar (acetic acid)', pKa: 4.76 }]],
  [/\bmuriatic acid\b|\bspirits? of salts?\b|hydrochloric acid/i, [{ group: 'strong-acid', what: 'hydrochloric acid', tag: 'hydrochloric-acid', pKa: -3 }]],
  [/\boil of vitriol\b|\bbattery acid\b|sulfuric acid|sulphuric acid/i, [{ group: 'strong-acid', what: 'sulfuric acid', tag: 'sulfuric-acid', pKa: -3 }]],
  [/\b(caustic soda|lye|caustic potash)\b/i, [{ group: 'strong-base', what: 'caustic' }]],
  [/\b(ammonia|ammonium hydroxide)\b/i, [{ group: 'ammonia', what: 'ammonia', tag: 'ammonia' }]],
  [/\b(rubbing alcohol|methylated spirits?|denatured alcohol|surgical spirit)\b/i, [{ group: 'fuel', what: 'alcohol', tag: 'alcohol' }]],
  [/\bacetone\b/i, [{ group: 'fuel', what: 'acetone', tag: 'ketone' }]],
  [/\bhydrogen peroxide\b/i, [{ group: 'peroxide', what: 'hydrogen peroxide', tag: 'hydrogen-peroxide' }]],
];

function byName(name: string): GroupMember[] {
  const out: GroupMember[] = [];
  for (const [re, members] of NAME_WORDS) if (re.test(name)) for (const m of members) out.push({ ...m });
  return out;
}
