/**
 * Dangerous pairs: which reactive groups (groups.ts) react dangerously together, what forms, what harm it
 * does, the usual advice, and where the rule comes from. Each rule is data; hazards.ts applies them.
 *
 * Sources, named per rule: Bretherick's Handbook of Reactive Chemical Hazards (P. G. Urben, ed., 8th ed.,
 * Elsevier 2017), by the entry the rule rests on; Prudent Practices in the Laboratory (National Research
 * Council, 2011), chapter 6 and its table of incompatible chemicals; and, where named, regulations that
 * exist because of the pair. EVERY RULE IS FROM MEMORY of those works (none was at hand when the table was
 * typed), and says so.
 *
 * Conditions (all must hold for the rule to apply):
 * - `acidBelowPH`: the gas forms from the acid-sensitive side when the batch is acid enough. The batch's
 *   pH decides where one is known (from the solution chemistry, or the safety reading's own estimate for
 *   a batch with water): the rule applies below that pH, whatever acid brought it there. In a batch with
 *   no water (a dry mix) the pair alone decides (moisture or later dissolving brings them together).
 * - `dry`: only in a batch with no water (a powder or liquid blend of the reagents themselves).
 * - `concentrated`: the named side makes up at least this mass fraction of the whole batch.
 * - `bothConcentrated`: both sides as supplied are concentrated (an acid of 30 % or more, a solid base or
 *   one of 30 % or more): their meeting, not the batch, is the danger.
 * - `water`: side b is the batch's water (an aqueous batch).
 *
 * Left out on purpose (the cautions of the card cover them, or they are the point of the recipe): carbon
 * dioxide from carbonates with acids (foaming; pressure in a closed vessel), hydrofluoric acid from
 * fluorides with strong acids (pickling and conversion baths hold it by design), and the dilution of a
 * single concentrated acid or base (the heat reading, heat.ts, gives its temperature rise and advice).
 */
import type { ReactiveGroup } from './groups';

/** What forms, as a stable kebab-case key (the `kind` of a hazard). */
export type HazardKind =
  | 'chlorine'
  | 'chloramines'
  | 'chloroform'
  | 'chlorine-dioxide'
  | 'cyanogen-chloride'
  | 'hydrogen-cyanide'
  | 'hydrogen-sulfide'
  | 'sulfur-dioxide'
  | 'nitrogen-oxides'
  | 'hydrazoic-acid'
  | 'nitrosamines'
  | 'bis-chloromethyl-ether'
  | 'hydrogen'
  | 'oxygen'
  | 'fire-explosion'
  | 'explosive-compound'
  | 'violent-reaction'
  | 'violent-heat'
  | 'water-reactive';

/** The harm, in one of a few plain classes. */
export type HarmClass = 'toxic gas' | 'fire or explosion' | 'explosive compound' | 'violent reaction' | 'flammable gas' | 'carcinogen';

export interface Side {
  groups: readonly ReactiveGroup[];
  /** Only members with one of these tags (a member's `tag` may hold several, separated by spaces). */
  tags?: readonly string[];
  /** Not members with one of these tags. */
  notTags?: readonly string[];
  /** Only members of these elements (metals, heavy-metal salts). */
  elements?: readonly string[];
  /** Only acids whose strongest proton has a pKa below this. */
  maxPKa?: number;
}

export interface Conditions {
  acidBelowPH?: number;
  dry?: true;
  concentrated?: { side: 'a' | 'b'; minFraction: number };
  bothConcentrated?: true;
  water?: true;
}

export interface PairRule {
  id: string;
  a: Side;
  /** Absent for `water` rules: the other party is the batch's water. */
  b?: Side;
  kind: HazardKind;
  harmClass: HarmClass;
  /** What forms, in plain words. */
  product: string;
  /** What it does to people or things, in plain words. */
  harm: string;
  /** The usual advice. */
  advice: string;
  source: string;
  when?: Conditions;
  /** One substance carrying both sides (a silver ammine, lead azide) counts. */
  self?: true;
}

const ACIDS: readonly ReactiveGroup[] = ['strong-acid', 'acid'];
const BRETHERICK = (entry: string) => `Bretherick's Handbook of Reactive Chemical Hazards (8th ed., 2017), ${entry}; from memory`;
const PRUDENT = 'Prudent Practices in the Laboratory (NRC, 2011), ch. 6, incompatible chemicals; from memory';

export const PAIR_RULES: readonly PairRule[] = Object.freeze<PairRule[]>([
  // ── hypochlorite and other chlorine releasers ──
  {
    id: 'hypochlorite-acid',
    a: { groups: ['hypochlorite'] },
    b: { groups: ACIDS, maxPKa: 5.5 },
    when: { acidBelowPH: 7 },
    kind: 'chlorine',
    harmClass: 'toxic gas',
    product: 'chlorine gas (Cl₂) (below about pH 5 most of the chlorine; between pH 5 and 7 where the acid is poured in)',
    harm: 'a toxic gas that burns the eyes, throat and lungs; a few breaths in a small room do harm',
    advice: 'Never acidify bleach: keep hypochlorite and acids (descalers, vinegar, acid cleaners) in separate batches and containers',
    source: `${BRETHERICK('"Sodium hypochlorite: acids" and "Chlorine"')}; ${PRUDENT}`,
  },
  {
    id: 'hypochlorite-ammonia',
    a: { groups: ['hypochlorite'] },
    b: { groups: ['ammonia'] },
    kind: 'chloramines',
    harmClass: 'toxic gas',
    product: 'chloramines (NH₂Cl, NHCl₂) and, with excess chlorine or acid, nitrogen trichloride (NCl₃)',
    harm: 'toxic gases that injure the lungs; nitrogen trichloride can explode',
    advice: 'Never mix bleach or chlorine releasers with ammonia, ammonium salts, amines or urea',
    source: `${BRETHERICK('"Sodium hypochlorite: ammonia" and "Nitrogen trichloride"')}; ${PRUDENT}`,
  },
  {
    id: 'hypochlorite-organic',
    a: { groups: ['hypochlorite'] },
    b: { groups: ['fuel'], tags: ['alcohol', 'ketone', 'aldehyde'] },
    kind: 'chloroform',
    harmClass: 'toxic gas',
    product: 'chloroform and other chlorinated compounds (the haloform reaction), with heat',
    harm: 'toxic vapours; with concentrated hypochlorite the reaction can run away',
    advice: 'Do not combine hypochlorite with alcohols, acetone or aldehydes',
    source: BRETHERICK('"Sodium hypochlorite" (alcohols, ketones) and "Calcium hypochlorite: organic matter"'),
  },
  {
    id: 'hypochlorite-peroxide',
    a: { groups: ['hypochlorite'], notTags: ['chlorine'] },
    b: { groups: ['peroxide'], tags: ['hydrogen-peroxide', 'peracid'] },
    kind: 'oxygen',
    harmClass: 'violent reaction',
    product: 'a rapid release of oxygen (each destroys the other)',
    harm: 'foaming and spattering of a corrosive liquid; pressure in a closed container',
    advice: 'Keep hypochlorite and peroxide products apart',
    source: BRETHERICK('"Hydrogen peroxide: sodium hypochlorite"'),
  },
  {
    id: 'hypochlorite-cyanide',
    a: { groups: ['hypochlorite'] },
    b: { groups: ['cyanide'] },
    when: { acidBelowPH: 10 },
    kind: 'cyanogen-chloride',
    harmClass: 'toxic gas',
    product: 'cyanogen chloride (ClCN), which forms below about pH 10',
    harm: 'a very toxic gas',
    advice:
      'Cyanide is destroyed with hypochlorite only above pH 10.5, with the pH and redox potential controlled, under a written procedure; do not combine them in a batch',
    source: `${BRETHERICK('"Cyanides: hypochlorites"')}; alkaline chlorination practice for plating wastes (pH above 10), from memory`,
  },
  {
    id: 'isocyanurate-hypochlorite',
    a: { groups: ['hypochlorite'], tags: ['isocyanurate'] },
    b: { groups: ['hypochlorite'], tags: ['hypochlorite'] },
    kind: 'fire-explosion',
    harmClass: 'fire or explosion',
    product: 'a violent reaction with heat and chlorine, and explosive nitrogen trichloride (the pool-chemical mix-up)',
    harm: 'fire, explosion and a toxic gas cloud',
    advice: 'Never mix chlorinated isocyanurates (TCCA, dichloroisocyanurate) with calcium or sodium hypochlorite, even as traces in a scoop',
    source: BRETHERICK('"Trichloroisocyanuric acid: calcium hypochlorite"'),
  },
  // ── cyanide, sulfide, sulfite, nitrite, azide with acids ──
  {
    id: 'cyanide-acid',
    a: { groups: ['cyanide'], tags: ['free'] },
    b: { groups: ACIDS, maxPKa: 8.5 },
    when: { acidBelowPH: 10.5 },
    kind: 'hydrogen-cyanide',
    harmClass: 'toxic gas',
    product: 'hydrogen cyanide gas (HCN)',
    harm: 'a very toxic gas, fatal within minutes at a few hundred ppm; not everyone can smell it',
    advice:
      'Keep cyanide solutions alkaline (plating practice keeps them above pH 11); never add acids, acid salts or acid rinses to cyanide, and keep acids out of the cyanide area',
    source: `${BRETHERICK('"Hydrogen cyanide" and "Sodium cyanide: acids"')}; CLP EUH032 ("contact with acids liberates very toxic gas")`,
  },
  {
    id: 'cyanide-complex-acid',
    a: { groups: ['cyanide'], tags: ['stable-complex'] },
    b: { groups: ['strong-acid'] },
    when: { acidBelowPH: 2 },
    kind: 'hydrogen-cyanide',
    harmClass: 'toxic gas',
    product: 'hydrogen cyanide (HCN), slowly, and fast on warming',
    harm: 'a very toxic gas',
    advice: 'Keep strong acids away from cyanide complexes (hexacyanoferrates, aurocyanide), above all when hot',
    source: BRETHERICK('"Potassium hexacyanoferrate(III): acids" and "Cyanides"'),
  },
  {
    id: 'sulfide-acid',
    a: { groups: ['sulfide'] },
    b: { groups: ACIDS, maxPKa: 7.5 },
    when: { acidBelowPH: 9 },
    kind: 'hydrogen-sulfide',
    harmClass: 'toxic gas',
    product: 'hydrogen sulfide gas (H₂S)',
    harm: 'a very toxic gas that deadens the sense of smell, so it goes unnoticed as it rises',
    advice: 'Keep sulfide solutions alkaline and away from acids; add nothing acid to a sulfide bath',
    source: `${BRETHERICK('"Hydrogen sulfide" and "Sodium sulfide: acids"')}; CLP EUH031`,
  },
  {
    id: 'sulfite-acid',
    a: { groups: ['sulfite'] },
    b: { groups: ACIDS, maxPKa: 3 },
    when: { acidBelowPH: 3 },
    kind: 'sulfur-dioxide',
    harmClass: 'toxic gas',
    product: 'sulfur dioxide (SO₂) (thiosulfate also throws down sulfur)',
    harm: 'a toxic, choking gas that can set off asthma',
    advice: 'Add sulfites, bisulfites or thiosulfate only to solutions that are not strongly acid, with ventilation',
    source: `${BRETHERICK('"Sodium disulfite: acids" and "Sodium thiosulfate: acids"')}; CLP EUH031`,
  },
  {
    id: 'nitrite-acid',
    a: { groups: ['nitrite'] },
    b: { groups: ACIDS, maxPKa: 4 },
    when: { acidBelowPH: 4 },
    kind: 'nitrogen-oxides',
    harmClass: 'toxic gas',
    product: 'nitrous acid, which breaks down to nitrogen oxides (NO, NO₂)',
    harm: 'toxic gases; nitrogen dioxide injures the lungs hours after it is breathed',
    advice: 'Keep nitrite away from acids; where a procedure acidifies nitrite, do it cold, in a fume cupboard',
    source: BRETHERICK('"Sodium nitrite: acids"'),
  },
  {
    id: 'azide-acid',
    a: { groups: ['azide'] },
    b: { groups: ACIDS, maxPKa: 4 },
    when: { acidBelowPH: 6 },
    kind: 'hydrazoic-acid',
    harmClass: 'toxic gas',
    product: 'hydrazoic acid (HN₃)',
    harm: 'a volatile acid that is very toxic and explosive',
    advice: 'Keep azide solutions neutral or alkaline and away from acids',
    source: BRETHERICK('"Hydrogen azide" and "Sodium azide: acids"'),
  },
  {
    id: 'chlorite-acid',
    a: { groups: ['chlorate'], tags: ['chlorite'] },
    b: { groups: ACIDS, maxPKa: 4 },
    when: { acidBelowPH: 4 },
    kind: 'chlorine-dioxide',
    harmClass: 'toxic gas',
    product: 'chlorine dioxide gas (ClO₂)',
    harm: 'a toxic gas that explodes above about 10 % in air',
    advice: 'Acidify chlorite only in a chlorine-dioxide generator made for it, never in a batch vessel',
    source: BRETHERICK('"Sodium chlorite: acids" and "Chlorine dioxide"'),
  },
  {
    id: 'chlorate-acid',
    a: { groups: ['chlorate'], tags: ['chlorate'] },
    b: { groups: ['strong-acid'] },
    kind: 'chlorine-dioxide',
    harmClass: 'fire or explosion',
    product: 'chlorine dioxide (ClO₂), explosively with concentrated sulfuric acid',
    harm: 'a toxic, explosive gas',
    advice: 'Keep chlorates away from strong acids',
    source: BRETHERICK('"Potassium chlorate: sulfuric acid"'),
  },
  {
    id: 'perchlorate-sulfuric',
    a: { groups: ['chlorate'], tags: ['perchlorate'] },
    b: { groups: ['strong-acid'], tags: ['sulfuric-acid'] },
    when: { concentrated: { side: 'b', minFraction: 0.8 } },
    kind: 'explosive-compound',
    harmClass: 'explosive compound',
    product: 'anhydrous perchloric acid',
    harm: 'explodes on standing or on touching organic matter',
    advice: 'Never bring perchlorates or perchloric acid together with concentrated sulfuric acid or other dehydrating agents',
    source: BRETHERICK('"Perchloric acid: dehydrating agents"'),
  },
  // ── nitrite, ammonia, amines ──
  {
    id: 'nitrite-ammonium',
    a: { groups: ['nitrite'] },
    b: { groups: ['ammonia'], tags: ['ammonium', 'ammonia'] },
    kind: 'explosive-compound',
    harmClass: 'explosive compound',
    product: 'ammonium nitrite, which breaks down to nitrogen with heat',
    harm: 'a runaway decomposition with gas on warming; explosive when concentrated or dried',
    advice: 'Do not combine nitrites with ammonium salts or ammonia',
    source: BRETHERICK('"Ammonium nitrite"'),
  },
  {
    id: 'nitrite-amine',
    a: { groups: ['nitrite'] },
    b: { groups: ['ammonia'], tags: ['amine-2', 'amine-3'] },
    kind: 'nitrosamines',
    harmClass: 'carcinogen',
    product: 'N-nitrosamines (such as N-nitrosodiethanolamine), formed slowly, faster when acid',
    harm: 'potent carcinogens',
    advice:
      'Do not combine nitrite with secondary or tertiary amines (the metalworking-fluid rules forbid it); choose a nitrite-free inhibitor or a primary amine',
    source: 'TRGS 611 (Germany), nitrite in water-mixed metalworking fluids with amines; IARC Monographs vol. 17, N-nitroso compounds; from memory',
  },
  {
    id: 'silver-ammonia',
    a: { groups: ['heavy-metal'], elements: ['Ag', 'Au', 'Hg'] },
    b: { groups: ['ammonia'], tags: ['ammonia', 'ammine'] },
    self: true,
    kind: 'explosive-compound',
    harmClass: 'explosive compound',
    product: 'silver nitride and related "fulminating" compounds, which ammoniacal silver (gold, mercury) solutions deposit on standing',
    harm: 'a dark deposit that explodes at a touch, even when wet',
    advice:
      "Make ammoniacal silver solutions (Tollens' reagent, silvering baths) just before use, in the smallest amount, never store them, and destroy what is left at once with dilute acid",
    source: BRETHERICK('"Silver compounds: ammonia" and "Silver nitride"'),
  },
  {
    id: 'halogen-ammonia',
    a: { groups: ['halogen'], elements: ['I', 'Br'] },
    b: { groups: ['ammonia'], tags: ['ammonia'] },
    kind: 'explosive-compound',
    harmClass: 'explosive compound',
    product: 'nitrogen triiodide (or tribromide)',
    harm: 'a contact explosive once dry',
    advice: 'Do not combine iodine or bromine with ammonia',
    source: BRETHERICK('"Nitrogen triiodide"'),
  },
  // ── azides ──
  {
    id: 'azide-heavy-metal',
    a: { groups: ['azide'] },
    b: { groups: ['heavy-metal', 'metal'], elements: ['Pb', 'Cu', 'Ag', 'Hg', 'Cd', 'Zn', 'Ni', 'Co', 'Tl'] },
    self: true,
    kind: 'explosive-compound',
    harmClass: 'explosive compound',
    product: 'heavy-metal azides (of lead, copper, silver, mercury…)',
    harm: 'shock-sensitive explosives, which also build up in drains and on brass and copper fittings',
    advice: 'Keep azide away from heavy-metal salts and from copper, lead or brass; never pour azide solutions to the drain',
    source: BRETHERICK('"Metal azides" and "Sodium azide: heavy metals"'),
  },
  {
    id: 'azide-chlorinated-solvent',
    a: { groups: ['azide'] },
    b: { groups: ['halogenated-solvent'] },
    kind: 'explosive-compound',
    harmClass: 'explosive compound',
    product: 'di- and triazidomethane',
    harm: 'extremely sensitive explosives',
    advice: 'Never use dichloromethane or chloroform with sodium azide',
    source: BRETHERICK('"Sodium azide: dichloromethane"'),
  },
  // ── oxidisers with fuels ──
  {
    id: 'chlorate-fuel',
    a: { groups: ['chlorate'], tags: ['chlorate', 'perchlorate', 'bromate'] },
    b: { groups: ['fuel'] },
    kind: 'fire-explosion',
    harmClass: 'fire or explosion',
    product: 'a fuel–oxidiser mixture that burns fiercely or explodes; solutions dry to sensitive residues in cloth, wood and bench tops',
    harm: 'fire or explosion',
    advice: 'Keep chlorates, perchlorates and bromates away from sugars, alcohols, glycols, solvents and all organic matter',
    source: BRETHERICK('"Chlorates", "Perchlorates" (group entries) and "Potassium chlorate: sugars"'),
  },
  {
    id: 'chlorate-ammonium',
    a: { groups: ['chlorate'], tags: ['chlorate'] },
    b: { groups: ['ammonia'], tags: ['ammonium'] },
    kind: 'explosive-compound',
    harmClass: 'explosive compound',
    product: 'ammonium chlorate',
    harm: 'explodes on drying or warming',
    advice: 'Do not combine chlorates with ammonium salts',
    source: BRETHERICK('"Ammonium chlorate"'),
  },
  {
    id: 'nitric-acid-fuel',
    a: { groups: ['nitrate'], tags: ['nitric-acid'] },
    b: { groups: ['fuel'] },
    kind: 'fire-explosion',
    harmClass: 'fire or explosion',
    product: 'a violent oxidation and nitrate esters; waste mixtures in closed bottles build pressure and burst',
    harm: 'fire, explosion, nitrogen oxides',
    advice: 'Keep nitric acid away from alcohols, glycols, glycerol, sugars, acetone and solvents; never cap a bottle of a nitric acid–organic mixture',
    source: BRETHERICK('"Nitric acid: alcohols", "Nitric acid: glycerol" and "Nitric acid: acetone"'),
  },
  {
    id: 'nitric-acid-metal',
    a: { groups: ['nitrate'], tags: ['nitric-acid'] },
    b: { groups: ['metal'] },
    kind: 'nitrogen-oxides',
    harmClass: 'toxic gas',
    product: 'nitrogen oxides (brown NO₂ fumes) as the metal dissolves',
    harm: 'toxic gases; nitrogen dioxide injures the lungs hours after it is breathed',
    advice: 'Dissolve metals in nitric acid only in a fume cupboard, in small portions',
    source: BRETHERICK('"Nitric acid: metals"'),
  },
  {
    id: 'nitrate-fuel-dry',
    a: { groups: ['nitrate'], tags: ['nitrate-salt'] },
    b: { groups: ['fuel'] },
    when: { dry: true },
    kind: 'fire-explosion',
    harmClass: 'fire or explosion',
    product: 'a fuel–oxidiser mixture (like black powder) that burns fiercely once lit',
    harm: 'fire; ammonium nitrate mixtures can detonate',
    advice: 'Do not blend nitrates with sugars, glycerol or other fuels as solids',
    source: BRETHERICK('"Nitrates" (group entry) and "Ammonium nitrate: organic materials"'),
  },
  {
    id: 'permanganate-fuel',
    a: { groups: ['permanganate'] },
    b: { groups: ['fuel'] },
    kind: 'fire-explosion',
    harmClass: 'fire or explosion',
    product: 'fire: glycerol, glycols and some alcohols ignite on solid permanganate; in solution a violent oxidation',
    harm: 'fire',
    advice: 'Keep permanganate away from glycerol, glycols, alcohols, sugars and solvents',
    source: BRETHERICK('"Potassium permanganate: glycerol" and "Potassium permanganate: organic materials"'),
  },
  {
    id: 'permanganate-hydrochloric',
    a: { groups: ['permanganate'] },
    b: { groups: ['strong-acid'], tags: ['hydrochloric-acid'] },
    kind: 'chlorine',
    harmClass: 'toxic gas',
    product: 'chlorine gas (Cl₂)',
    harm: 'a toxic gas that burns the eyes, throat and lungs',
    advice: 'Acidify permanganate with sulfuric acid, never hydrochloric',
    source: BRETHERICK('"Potassium permanganate: hydrochloric acid"'),
  },
  {
    id: 'permanganate-sulfuric',
    a: { groups: ['permanganate'] },
    b: { groups: ['strong-acid'], tags: ['sulfuric-acid'] },
    when: { concentrated: { side: 'b', minFraction: 0.8 } },
    kind: 'explosive-compound',
    harmClass: 'explosive compound',
    product: 'manganese heptoxide (Mn₂O₇), an explosive oil',
    harm: 'explodes on warming or on touching organic matter',
    advice: 'Dilute the sulfuric acid first; never add permanganate to concentrated sulfuric acid',
    source: BRETHERICK('"Potassium permanganate: sulfuric acid"'),
  },
  {
    id: 'chromium-fuel',
    a: { groups: ['chromium-vi'] },
    b: { groups: ['fuel'] },
    kind: 'fire-explosion',
    harmClass: 'fire or explosion',
    product: 'a violent oxidation (chromic acid with acetone, ethanol or glycerol ignites)',
    harm: 'fire, spattering of a carcinogenic oxidiser',
    advice: 'Keep chromium(VI) away from alcohols, acetone, glycerol and solvents',
    source: BRETHERICK('"Chromium trioxide: organic materials" and "Chromic acid: acetone"'),
  },
  {
    id: 'peroxide-fuel',
    a: { groups: ['peroxide'], tags: ['hydrogen-peroxide', 'peracid'] },
    b: { groups: ['fuel'] },
    when: { concentrated: { side: 'a', minFraction: 0.08 } },
    kind: 'fire-explosion',
    harmClass: 'fire or explosion',
    product: 'mixtures of concentrated peroxide with organic liquids that can detonate',
    harm: 'explosion',
    advice: 'Keep hydrogen peroxide above about 8 % away from organic solvents, alcohols and glycols',
    source: BRETHERICK('"Hydrogen peroxide: organic compounds"'),
  },
  {
    id: 'peroxide-acetone',
    a: { groups: ['peroxide'], tags: ['hydrogen-peroxide', 'peracid'] },
    b: { groups: ['fuel'], tags: ['ketone'] },
    kind: 'explosive-compound',
    harmClass: 'explosive compound',
    product: 'acetone peroxides (TATP), above all with acid',
    harm: 'a primary explosive, sensitive to friction and heat',
    advice: 'Never combine hydrogen peroxide with acetone or butanone',
    source: BRETHERICK('"Hydrogen peroxide: ketones" and "3,3,6,6,9,9-Hexamethyl-1,2,4,5,7,8-hexaoxonane"'),
  },
  {
    id: 'piranha',
    a: { groups: ['peroxide'], tags: ['hydrogen-peroxide'] },
    b: { groups: ['strong-acid'], tags: ['sulfuric-acid'] },
    when: { concentrated: { side: 'b', minFraction: 0.5 } },
    kind: 'violent-reaction',
    harmClass: 'violent reaction',
    product: 'piranha solution: violent heat and gas, explosive with any organic matter',
    harm: 'explosion, severe burns',
    advice: 'Make piranha only under a written procedure, in small amounts, acid first and peroxide slowly; never store it or close its container',
    source: BRETHERICK('"Hydrogen peroxide: sulfuric acid"'),
  },
  {
    id: 'peroxide-metal',
    a: { groups: ['peroxide'], tags: ['hydrogen-peroxide'] },
    b: { groups: ['heavy-metal', 'metal'], elements: ['Fe', 'Cu', 'Mn', 'Co', 'Cr', 'Ag', 'Ni', 'Pb', 'Hg', 'Pt', 'Pd', 'Zn'] },
    when: { concentrated: { side: 'a', minFraction: 0.08 } },
    kind: 'oxygen',
    harmClass: 'violent reaction',
    product: 'a catalysed decomposition of the peroxide: oxygen and heat, faster as it warms',
    harm: 'boiling over, a burst closed container',
    advice: 'Keep concentrated hydrogen peroxide away from metal salts and metals; vent its containers',
    source: BRETHERICK('"Hydrogen peroxide: metals, metal salts"'),
  },
  // ── oxidisers with reducers ──
  {
    id: 'oxidiser-reducer',
    a: { groups: ['chlorate', 'permanganate', 'chromium-vi', 'peroxide', 'hypochlorite'] },
    b: { groups: ['reducer'] },
    kind: 'violent-reaction',
    harmClass: 'violent reaction',
    product: 'a violent redox reaction with heat and gas (hydrazine and hypophosphite ignite with strong oxidisers)',
    harm: 'fire, explosion or a boil-over',
    advice: 'Keep strong oxidisers and reducers (hydrazine, hydroxylamine, hypophosphite, borohydride, dithionite, formaldehyde) in separate batches',
    source: BRETHERICK('"Oxidants" and "Reducants" (group entries), "Hydrazine: oxidants"'),
  },
  {
    id: 'nitric-acid-reducer',
    a: { groups: ['nitrate'], tags: ['nitric-acid'] },
    b: { groups: ['reducer'] },
    kind: 'violent-reaction',
    harmClass: 'violent reaction',
    product: 'a violent redox reaction with nitrogen oxides',
    harm: 'fire, toxic gas',
    advice: 'Keep nitric acid away from reducers',
    source: BRETHERICK('"Nitric acid: reducants"'),
  },
  {
    id: 'oxidiser-salts-dry',
    a: { groups: ['cyanide', 'sulfite'] },
    b: { groups: ['chlorate', 'nitrate', 'nitrite', 'permanganate'] },
    when: { dry: true },
    kind: 'fire-explosion',
    harmClass: 'fire or explosion',
    product: 'a mixture that explodes on heating or friction',
    harm: 'explosion',
    advice: 'Do not blend cyanides, sulfites or thiosulfate with chlorates, nitrates, nitrites or permanganate as solids',
    source: BRETHERICK('"Metal cyanides: metal chlorates, nitrites" and "Sodium thiosulfate: oxidants"'),
  },
  // ── metals ──
  {
    id: 'metal-acid',
    a: { groups: ['metal'], tags: ['active'] },
    b: { groups: ACIDS, maxPKa: 3, notTags: ['nitric-acid'] },
    kind: 'hydrogen',
    harmClass: 'flammable gas',
    product: 'hydrogen gas as the metal dissolves',
    harm: 'a flammable gas that forms explosive mixtures with air; pressure in a closed vessel',
    advice: 'Dissolve metals in acid only with ventilation, away from flames and sparks, in an open vessel',
    source: `${BRETHERICK('"Hydrogen" and "Metals: acids"')}; ${PRUDENT}`,
  },
  {
    id: 'metal-base',
    a: { groups: ['metal'], tags: ['amphoteric'] },
    b: { groups: ['strong-base'] },
    kind: 'hydrogen',
    harmClass: 'flammable gas',
    product: 'hydrogen gas, with much heat (aluminium and zinc dissolve in caustic)',
    harm: 'a flammable gas and a boil-over of hot caustic',
    advice: 'Keep aluminium, zinc and tin (powder or scrap) out of caustic solutions',
    source: BRETHERICK('"Aluminium: sodium hydroxide" and "Zinc: bases"'),
  },
  {
    id: 'metal-chlorate',
    a: { groups: ['metal'] },
    b: { groups: ['chlorate'] },
    kind: 'fire-explosion',
    harmClass: 'fire or explosion',
    product: 'a flash-powder mixture',
    harm: 'explodes on friction, impact or heating',
    advice: 'Never mix metal powders with chlorates or perchlorates',
    source: BRETHERICK('"Metal powders: chlorates" and "Aluminium: potassium perchlorate"'),
  },
  {
    id: 'metal-oxidiser-dry',
    a: { groups: ['metal'] },
    b: { groups: ['nitrate', 'permanganate', 'peroxide', 'chromium-vi'] },
    when: { dry: true },
    kind: 'fire-explosion',
    harmClass: 'fire or explosion',
    product: 'a metal–oxidiser mixture that burns violently once lit',
    harm: 'fire or explosion',
    advice: 'Do not blend metal powders with nitrates, permanganate, peroxides or chromates',
    source: BRETHERICK('"Metal powders: oxidants"'),
  },
  {
    id: 'alkali-metal-chlorinated',
    a: { groups: ['water-reactive'], tags: ['alkali-metal'] },
    b: { groups: ['halogenated-solvent'] },
    kind: 'fire-explosion',
    harmClass: 'fire or explosion',
    product: 'an explosive reaction, set off by impact',
    harm: 'explosion',
    advice: 'Never use alkali metals with chlorinated solvents',
    source: BRETHERICK('"Sodium: halocarbons"'),
  },
  {
    id: 'hydride-acid',
    a: { groups: ['reducer'], tags: ['hydride'] },
    b: { groups: ACIDS, maxPKa: 5 },
    kind: 'hydrogen',
    harmClass: 'flammable gas',
    product: 'a rapid release of hydrogen',
    harm: 'a flammable gas, foaming and pressure',
    advice: 'Add borohydride to acid only slowly, cold, with venting, under a written procedure',
    source: BRETHERICK('"Sodium tetrahydroborate: acids"'),
  },
  // ── acids and bases ──
  {
    id: 'acid-base-concentrated',
    a: { groups: ['strong-acid'] },
    b: { groups: ['strong-base'] },
    when: { bothConcentrated: true },
    kind: 'violent-heat',
    harmClass: 'violent reaction',
    product: 'violent heat where the concentrated acid meets the concentrated base',
    harm: 'boiling and spattering of corrosive liquid',
    advice: 'Dilute the acid and dissolve the base separately first, then combine them slowly with stirring and cooling',
    source: `${BRETHERICK('"Neutralisation incidents" and "Sodium hydroxide: acids"')}; common practice`,
  },
  {
    id: 'sulfuric-fuel',
    a: { groups: ['strong-acid'], tags: ['sulfuric-acid'] },
    b: { groups: ['fuel'], tags: ['sugar', 'glycerol', 'glycol', 'alcohol'] },
    when: { concentrated: { side: 'a', minFraction: 0.8 } },
    kind: 'violent-reaction',
    harmClass: 'violent reaction',
    product: 'charring with heat and fumes (sulfur dioxide, carbon monoxide; acrolein from glycerol)',
    harm: 'toxic fumes, spattering of hot acid',
    advice: 'Keep concentrated sulfuric acid away from sugars, glycerol and alcohols',
    source: BRETHERICK('"Sulfuric acid: carbohydrates" and "Sulfuric acid: glycerol"'),
  },
  {
    id: 'formaldehyde-hydrochloric',
    a: { groups: ['fuel'], tags: ['aldehyde'] },
    b: { groups: ['strong-acid'], tags: ['hydrochloric-acid'] },
    kind: 'bis-chloromethyl-ether',
    harmClass: 'carcinogen',
    product: 'bis(chloromethyl) ether in the vapour',
    harm: 'a potent human carcinogen, even at traces',
    advice: 'Do not combine formaldehyde (formalin) with hydrochloric acid or chlorides in acid',
    source: 'OSHA 29 CFR 1910.1003/1910.1008 (bis-chloromethyl ether); IARC Group 1; from memory',
  },
  // ── water-reactive solids in an aqueous batch ──
  {
    id: 'water-reactive',
    a: { groups: ['water-reactive'] },
    when: { water: true },
    kind: 'water-reactive',
    harmClass: 'violent reaction',
    product: 'a violent reaction with the batch water',
    harm: 'heat, spattering and gas',
    advice:
      'Do not add it to water; it needs a written procedure of its own (slow addition to a large excess of cold water or another quench, under inert gas)',
    source: BRETHERICK('"Water-reactive compounds" (group entry)'),
  },
]);

/** What each kind of water-reactive solid gives with water. */
export const WATER_PRODUCTS: Readonly<Record<string, string>> = Object.freeze({
  'alkali-metal': 'hydrogen, which catches fire, and caustic spatter',
  metal: 'hydrogen and heat',
  hydride: 'hydrogen, which may catch fire',
  carbide: 'a flammable gas (acetylene from calcium carbide, methane from aluminium carbide)',
  nitride: 'ammonia and heat',
  phosphide: 'phosphine, a very toxic gas that can catch fire by itself',
  amide: 'ammonia and heat; old sodium amide may explode',
  chloride: 'hydrogen chloride fumes with violent heat',
  anhydride: 'violent heat and an acid mist',
  oxide: 'much heat (slaking), enough to boil water locally or ignite paper',
  peroxide: 'oxygen and much heat',
});
