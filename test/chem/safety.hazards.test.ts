/**
 * Dangerous pairs caught, ordinary formulations left alone. Each dangerous case names the published
 * reactive-hazard entry it rests on (Bretherick's Handbook of Reactive Chemical Hazards, 8th ed., 2017;
 * Prudent Practices in the Laboratory, NRC 2011) — from memory, as the rule table is. Each ordinary
 * formulation is a recipe of common practice (the usual buffer, plating, cleaning and bench recipes, from
 * memory); false alarms are counted as carefully as misses, and both rates are asserted.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyseFormula } from '../../server/src/chem/analyse';
import { batchHazards, HAZARD_CAUTION, PAIR_RULES, readBatchSafety, reactiveGroups, SAFETY_NOTICE, type HazardKind } from '../../server/src/chem/safety';
import { mix, type Line } from '../fixtures/safety';

interface Case {
  name: string;
  lines: Line[];
  volumeL?: number | null;
  pH?: number;
  /** Kinds that must be raised (dangerous cases). */
  expect?: HazardKind[];
  source: string;
}

const DANGEROUS: Case[] = [
  {
    name: 'bleach into an acid descaler (HCl)',
    lines: [
      ['NaOCl', 100, 'g', 0.12],
      ['HCl', 200, 'g', 0.1],
    ],
    volumeL: 1,
    expect: ['chlorine'],
    source: 'Bretherick, "Sodium hypochlorite: acids"',
  },
  {
    name: 'bleach and a phosphoric-acid descaler',
    lines: [
      ['H3PO4', 100, 'g', 0.2],
      ['NaOCl', 50, 'g', 0.05],
    ],
    volumeL: 1,
    expect: ['chlorine'],
    source: 'Bretherick, "Sodium hypochlorite: acids"',
  },
  {
    name: 'bleach and a citric-acid descaler',
    lines: [
      ['C6H8O7', 60, 'g'],
      ['NaOCl', 50, 'g', 0.05],
    ],
    volumeL: 1,
    expect: ['chlorine'],
    source: 'Bretherick, "Sodium hypochlorite: acids"',
  },
  {
    name: 'bleach and vinegar in excess',
    lines: [
      ['NaOCl', 50, 'g', 0.05],
      ['CH3COOH', 500, 'g', 0.05],
    ],
    volumeL: 1,
    expect: ['chlorine'],
    source: 'Prudent Practices, incompatible chemicals (hypochlorite: acids)',
  },
  {
    name: 'bleach and household ammonia',
    lines: [
      ['NaOCl', 50, 'g', 0.05],
      ['NH3', 50, 'g', 0.1],
    ],
    volumeL: 1,
    expect: ['chloramines'],
    source: 'Bretherick, "Sodium hypochlorite: ammonia"',
  },
  {
    name: 'bleach and ammonium chloride',
    lines: [
      ['NH4Cl', 10, 'g'],
      ['NaOCl', 50, 'g', 0.05],
    ],
    volumeL: 1,
    expect: ['chloramines'],
    source: 'Bretherick, "Nitrogen trichloride"',
  },
  {
    name: 'bleach and isopropanol',
    lines: [
      ['NaOCl', 100, 'g', 0.12],
      ['C3H7OH', 200, 'g'],
    ],
    volumeL: 1,
    expect: ['chloroform'],
    source: 'Bretherick, "Sodium hypochlorite" (alcohols)',
  },
  {
    name: 'trichloroisocyanuric acid and calcium hypochlorite (pool chemicals)',
    lines: [
      ['Ca(OCl)2', 50, 'g'],
      ['C3Cl3N3O3', 50, 'g'],
    ],
    volumeL: null,
    expect: ['fire-explosion'],
    source: 'Bretherick, "Trichloroisocyanuric acid: calcium hypochlorite"',
  },
  {
    name: 'an acidified cyanide strike',
    lines: [
      ['NaCN', 10, 'g'],
      ['CuCN', 5, 'g'],
      ['HCl', 30, 'g', 0.37],
    ],
    volumeL: 1,
    expect: ['hydrogen-cyanide'],
    source: 'Bretherick, "Sodium cyanide: acids"',
  },
  {
    name: 'potassium cyanide and sulfuric acid',
    lines: [
      ['KCN', 5, 'g'],
      ['H2SO4', 10, 'g', 0.96],
    ],
    volumeL: 1,
    expect: ['hydrogen-cyanide'],
    source: 'Bretherick, "Hydrogen cyanide"',
  },
  {
    name: 'cyanide brought to pH 8 by a phosphate buffer (no strong acid)',
    lines: [
      ['NaCN', 5, 'g'],
      ['NaH2PO4', 24, 'g'],
    ],
    volumeL: 1,
    expect: ['hydrogen-cyanide'],
    source: 'HCN pKa 9.21 (CRC Handbook, dissociation constants): at pH 8 most cyanide is HCN',
  },
  {
    name: 'sodium sulfide and hydrochloric acid',
    lines: [
      ['Na2S', 10, 'g'],
      ['HCl', 30, 'g', 0.37],
    ],
    volumeL: 1,
    expect: ['hydrogen-sulfide'],
    source: 'Bretherick, "Sodium sulfide: acids"',
  },
  {
    name: 'iron(II) sulfide and hydrochloric acid (dry, then wetted)',
    lines: [
      ['FeS', 10, 'g'],
      ['HCl', 30, 'g', 0.37],
    ],
    volumeL: null,
    expect: ['hydrogen-sulfide'],
    source: 'Bretherick, "Hydrogen sulfide"',
  },
  {
    name: 'metabisulfite and sulfuric acid',
    lines: [
      ['Na2S2O5', 20, 'g'],
      ['H2SO4', 30, 'g', 0.96],
    ],
    volumeL: 1,
    expect: ['sulfur-dioxide'],
    source: 'Bretherick, "Sodium disulfite: acids"',
  },
  {
    name: 'thiosulfate and hydrochloric acid',
    lines: [
      ['Na2S2O3·5H2O', 25, 'g'],
      ['HCl', 50, 'g', 0.37],
    ],
    volumeL: 1,
    expect: ['sulfur-dioxide'],
    source: 'Bretherick, "Sodium thiosulfate: acids"',
  },
  {
    name: 'sodium nitrite and hydrochloric acid',
    lines: [
      ['NaNO2', 10, 'g'],
      ['HCl', 30, 'g', 0.37],
    ],
    volumeL: 1,
    expect: ['nitrogen-oxides'],
    source: 'Bretherick, "Sodium nitrite: acids"',
  },
  {
    name: 'nitrite inhibitor with triethanolamine (a metalworking fluid)',
    lines: [
      ['C6H15NO3', 50, 'g'],
      ['NaNO2', 10, 'g'],
    ],
    volumeL: 1,
    expect: ['nitrosamines'],
    source: 'TRGS 611; IARC Monographs vol. 17',
  },
  {
    name: 'sodium nitrite and ammonium chloride',
    lines: [
      ['NaNO2', 20, 'g'],
      ['NH4Cl', 15, 'g'],
    ],
    volumeL: 0.2,
    expect: ['explosive-compound'],
    source: 'Bretherick, "Ammonium nitrite"',
  },
  {
    name: 'sodium azide and hydrochloric acid',
    lines: [
      ['NaN3', 1, 'g'],
      ['HCl', 10, 'g', 0.37],
    ],
    volumeL: 1,
    expect: ['hydrazoic-acid'],
    source: 'Bretherick, "Hydrogen azide"',
  },
  {
    name: 'sodium azide with lead nitrate',
    lines: [
      ['Pb(NO3)2', 5, 'g'],
      ['NaN3', 1, 'g'],
    ],
    volumeL: 1,
    expect: ['explosive-compound'],
    source: 'Bretherick, "Metal azides"',
  },
  {
    name: 'azide preservative added to a copper sulfate bath',
    lines: [
      ['CuSO4·5H2O', 25, 'g'],
      ['NaN3', 0.2, 'g'],
    ],
    volumeL: 1,
    expect: ['explosive-compound'],
    source: 'Bretherick, "Sodium azide: heavy metals"',
  },
  {
    name: 'sodium azide in dichloromethane',
    lines: [
      ['NaN3', 2, 'g'],
      ['CH2Cl2', 100, 'g'],
    ],
    volumeL: null,
    expect: ['explosive-compound'],
    source: 'Bretherick, "Sodium azide: dichloromethane"',
  },
  {
    name: "Tollens' reagent (silver nitrate and ammonia)",
    lines: [
      ['AgNO3', 5, 'g'],
      ['NH3', 20, 'g', 0.25],
    ],
    volumeL: 0.1,
    expect: ['explosive-compound'],
    source: 'Bretherick, "Silver compounds: ammonia"',
  },
  {
    name: 'diamminesilver nitrate on its own',
    lines: [['[Ag(NH3)2]NO3', 5, 'g']],
    volumeL: 0.1,
    expect: ['explosive-compound'],
    source: 'Bretherick, "Silver nitride"',
  },
  {
    name: 'iodine and ammonia',
    lines: [
      ['I2', 5, 'g'],
      ['NH3', 20, 'g', 0.25],
    ],
    volumeL: 0.1,
    expect: ['explosive-compound'],
    source: 'Bretherick, "Nitrogen triiodide"',
  },
  {
    name: 'nitric acid in ethanol (an etchant made strong)',
    lines: [
      ['C2H5OH', 400, 'g'],
      ['HNO3', 50, 'g', 0.65],
    ],
    volumeL: 0.5,
    expect: ['fire-explosion'],
    source: 'Bretherick, "Nitric acid: alcohols"',
  },
  {
    name: 'nitric acid on copper',
    lines: [
      ['Cu', 10, 'g'],
      ['HNO3', 100, 'g', 0.65],
    ],
    volumeL: 0.5,
    expect: ['nitrogen-oxides'],
    source: 'Bretherick, "Nitric acid: metals"',
  },
  {
    name: 'permanganate and glycerol',
    lines: [
      ['KMnO4', 10, 'g'],
      ['C3H8O3', 5, 'g'],
    ],
    volumeL: null,
    expect: ['fire-explosion'],
    source: 'Bretherick, "Potassium permanganate: glycerol"',
  },
  {
    name: 'permanganate and hydrochloric acid',
    lines: [
      ['KMnO4', 3, 'g'],
      ['HCl', 20, 'g', 0.37],
    ],
    volumeL: 1,
    expect: ['chlorine'],
    source: 'Bretherick, "Potassium permanganate: hydrochloric acid"',
  },
  {
    name: 'permanganate into concentrated sulfuric acid',
    lines: [
      ['H2SO4', 50, 'g', 0.96],
      ['KMnO4', 2, 'g'],
    ],
    volumeL: null,
    expect: ['explosive-compound'],
    source: 'Bretherick, "Potassium permanganate: sulfuric acid"',
  },
  {
    name: 'dichromate and acetone',
    lines: [
      ['K2Cr2O7', 10, 'g'],
      ['C3H6O', 50, 'g'],
    ],
    volumeL: 0.5,
    expect: ['fire-explosion'],
    source: 'Bretherick, "Chromic acid: acetone"',
  },
  {
    name: 'potassium chlorate and sugar (dry)',
    lines: [
      ['KClO3', 30, 'g'],
      ['C12H22O11', 20, 'g'],
    ],
    volumeL: null,
    expect: ['fire-explosion'],
    source: 'Bretherick, "Potassium chlorate: sugars"',
  },
  {
    name: 'potassium chlorate and sulfuric acid',
    lines: [
      ['KClO3', 10, 'g'],
      ['H2SO4', 20, 'g', 0.96],
    ],
    volumeL: null,
    expect: ['chlorine-dioxide'],
    source: 'Bretherick, "Potassium chlorate: sulfuric acid"',
  },
  {
    name: 'sodium chlorite and hydrochloric acid',
    lines: [
      ['NaClO2', 10, 'g'],
      ['HCl', 30, 'g', 0.37],
    ],
    volumeL: 1,
    expect: ['chlorine-dioxide'],
    source: 'Bretherick, "Sodium chlorite: acids"',
  },
  {
    name: '30 % hydrogen peroxide and acetone',
    lines: [
      ['C3H6O', 50, 'g'],
      ['H2O2', 50, 'g', 0.3],
    ],
    volumeL: null,
    expect: ['explosive-compound'],
    source: 'Bretherick, "Hydrogen peroxide: ketones"',
  },
  {
    name: 'piranha (sulfuric acid and hydrogen peroxide, 3:1)',
    lines: [
      ['H2SO4', 165, 'g', 0.96],
      ['H2O2', 33, 'g', 0.3],
    ],
    volumeL: null,
    expect: ['violent-reaction'],
    source: 'Bretherick, "Hydrogen peroxide: sulfuric acid"',
  },
  {
    name: 'hydrazine and hydrogen peroxide',
    lines: [
      ['N2H4', 5, 'g'],
      ['H2O2', 20, 'g', 0.3],
    ],
    volumeL: 0.1,
    expect: ['violent-reaction'],
    source: 'Bretherick, "Hydrazine: oxidants"',
  },
  {
    name: 'zinc in hydrochloric acid',
    lines: [
      ['Zn', 10, 'g'],
      ['HCl', 100, 'g', 0.37],
    ],
    volumeL: 0.5,
    expect: ['hydrogen'],
    source: 'Prudent Practices (metals: acids)',
  },
  {
    name: 'aluminium in caustic soda',
    lines: [
      ['NaOH', 40, 'g'],
      ['Al', 10, 'g'],
    ],
    volumeL: 0.5,
    expect: ['hydrogen'],
    source: 'Bretherick, "Aluminium: sodium hydroxide"',
  },
  {
    name: 'aluminium powder and potassium perchlorate',
    lines: [
      ['Al', 10, 'g'],
      ['KClO4', 20, 'g'],
    ],
    volumeL: null,
    expect: ['fire-explosion'],
    source: 'Bretherick, "Aluminium: potassium perchlorate"',
  },
  {
    name: 'potassium nitrate and sugar (dry)',
    lines: [
      ['KNO3', 60, 'g'],
      ['C12H22O11', 40, 'g'],
    ],
    volumeL: null,
    expect: ['fire-explosion'],
    source: 'Bretherick, "Nitrates" (group entry)',
  },
  { name: 'sodium hydride into water', lines: [['NaH', 5, 'g']], volumeL: 1, expect: ['water-reactive'], source: 'Bretherick, "Sodium hydride: water"' },
  {
    name: 'calcium carbide into water',
    lines: [
      ['CaC2', 10, 'g'],
      ['H2O', 500, 'g'],
    ],
    volumeL: null,
    expect: ['water-reactive'],
    source: 'Bretherick, "Calcium carbide: water"',
  },
  {
    name: 'calcium phosphide into water',
    lines: [['Ca3P2', 5, 'g']],
    volumeL: 1,
    expect: ['water-reactive'],
    source: 'Bretherick, "Calcium phosphide: water"',
  },
  {
    name: 'anhydrous aluminium chloride into water',
    lines: [['AlCl3', 50, 'g']],
    volumeL: 1,
    expect: ['water-reactive'],
    source: 'Bretherick, "Aluminium chloride: water"',
  },
  {
    name: 'concentrated sulfuric acid and caustic pellets',
    lines: [
      ['H2SO4', 100, 'g', 0.96],
      ['NaOH', 80, 'g'],
    ],
    volumeL: 2,
    expect: ['violent-heat'],
    source: 'Bretherick, "Sodium hydroxide: acids"',
  },
  {
    name: 'formalin and hydrochloric acid',
    lines: [
      ['CH2O', 50, 'g', 0.37],
      ['HCl', 50, 'g', 0.37],
    ],
    volumeL: 0.5,
    expect: ['bis-chloromethyl-ether'],
    source: 'OSHA 29 CFR 1910.1008',
  },
  {
    name: 'borohydride and hydrochloric acid',
    lines: [
      ['NaBH4', 2, 'g'],
      ['HCl', 30, 'g', 0.37],
    ],
    volumeL: 0.5,
    expect: ['hydrogen'],
    source: 'Bretherick, "Sodium tetrahydroborate: acids"',
  },
  {
    name: 'cyanide and hypochlorite at pH 8 (from the solution chemistry)',
    lines: [
      ['NaCN', 5, 'g'],
      ['NaOCl', 100, 'g', 0.12],
    ],
    volumeL: 1,
    pH: 8,
    expect: ['cyanogen-chloride'],
    source: 'Bretherick, "Cyanides: hypochlorites"',
  },
];

const ORDINARY: Case[] = [
  {
    // A plating tank's pH trimmed with the concentrated acid and the 50 % caustic, each added to the bath.
    name: 'a 200 L nickel bath trimmed with sulfuric acid and caustic',
    lines: [
      ['NiSO4·6H2O', 50000, 'g'],
      ['H3BO3', 8000, 'g'],
      ['H2SO4', 40, 'g', 0.96],
      ['NaOH', 60, 'g', 0.5],
    ],
    volumeL: 200,
    source: 'common practice (pH adjustment of a plating bath)',
  },
  {
    name: 'phosphate-buffered saline',
    lines: [
      ['NaCl', 8, 'g'],
      ['KCl', 0.2, 'g'],
      ['Na2HPO4', 1.44, 'g'],
      ['KH2PO4', 0.24, 'g'],
    ],
    volumeL: 1,
    source: 'common practice (the usual PBS recipe)',
  },
  {
    name: 'PBS with 0.05 % sodium azide as preservative',
    lines: [
      ['NaCl', 8, 'g'],
      ['KCl', 0.2, 'g'],
      ['Na2HPO4', 1.44, 'g'],
      ['KH2PO4', 0.24, 'g'],
      ['NaN3', 0.5, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  { name: 'normal saline', lines: [['NaCl', 9, 'g']], volumeL: 1, source: 'common practice' },
  {
    name: 'Tris–HCl buffer, pH 8',
    lines: [
      ['C4H11NO3', 12.1, 'g'],
      ['HCl', 7, 'g', 0.37],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'Watts nickel bath',
    lines: [
      ['NiSO4·6H2O', 300, 'g'],
      ['NiCl2·6H2O', 45, 'g'],
      ['H3BO3', 40, 'g'],
    ],
    volumeL: 1,
    source: 'common practice (Watts formulation)',
  },
  {
    name: 'acid copper bath',
    lines: [
      ['CuSO4·5H2O', 200, 'g'],
      ['H2SO4', 52, 'g', 0.96],
      ['HCl', 0.15, 'g', 0.37],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'cyanide copper strike',
    lines: [
      ['CuCN', 22, 'g'],
      ['NaCN', 33, 'g'],
      ['Na2CO3', 15, 'g'],
      ['NaOH', 5, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'acid chloride zinc bath',
    lines: [
      ['ZnCl2', 70, 'g'],
      ['KCl', 200, 'g'],
      ['H3BO3', 25, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'acid electroless nickel',
    lines: [
      ['NiSO4·6H2O', 26, 'g'],
      ['NaH2PO2·H2O', 24, 'g'],
      ['C3H6O3', 30, 'g', 0.88],
      ['NaOH', 3, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'EDTA 0.1 M, pH 8',
    lines: [
      ['C10H14N2Na2O8·2H2O', 37.2, 'g'],
      ['NaOH', 4, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'citrate buffer',
    lines: [
      ['C6H8O7', 9.6, 'g'],
      ['Na3C6H5O7·2H2O', 14.7, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'acetate buffer',
    lines: [
      ['CH3COOH', 6, 'g'],
      ['CH3COONa', 8.2, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'glycerol humectant with potassium nitrate (a toothpaste base)',
    lines: [
      ['C3H8O3', 300, 'g'],
      ['C6H14O6', 100, 'g'],
      ['KNO3', 50, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'hand rub (WHO formulation 1)',
    lines: [
      ['C2H5OH', 672, 'g', 0.94],
      ['C3H8O3', 18, 'g', 0.98],
      ['H2O2', 42, 'g', 0.03],
    ],
    volumeL: 1,
    source: 'WHO Guide to local production of hand rub formulations (2010), from memory',
  },
  {
    name: 'carbonate buffer',
    lines: [
      ['Na2CO3', 3.2, 'g'],
      ['NaHCO3', 5.9, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'borate buffer',
    lines: [
      ['H3BO3', 6.2, 'g'],
      ['Na2B4O7·10H2O', 9.5, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'a balanced salt solution',
    lines: [
      ['NaCl', 8, 'g'],
      ['KCl', 0.4, 'g'],
      ['CaCl2·2H2O', 0.19, 'g'],
      ['NaHCO3', 0.35, 'g'],
      ['C6H12O6', 1, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'hard chromium bath',
    lines: [
      ['CrO3', 250, 'g'],
      ['H2SO4', 2.6, 'g', 0.96],
    ],
    volumeL: 1,
    source: 'common practice (100:1 ratio)',
  },
  {
    name: 'acid hardening fixer',
    lines: [
      ['Na2S2O3·5H2O', 240, 'g'],
      ['Na2SO3', 15, 'g'],
      ['CH3COOH', 48, 'g', 0.28],
      ['H3BO3', 7.5, 'g'],
      ['KAl(SO4)2·12H2O', 15, 'g'],
    ],
    volumeL: 1,
    source: 'common practice (the classic acid fixer)',
  },
  {
    name: 'ammonium sulfate and urea fertiliser',
    lines: [
      ['(NH4)2SO4', 100, 'g'],
      ['CO(NH2)2', 50, 'g'],
      ['KCl', 20, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'ferric chloride etchant',
    lines: [
      ['FeCl3·6H2O', 400, 'g'],
      ['HCl', 20, 'g', 0.37],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'diluted bleach disinfectant',
    lines: [
      ['NaOCl', 100, 'g', 0.12],
      ['NaOH', 1, 'g'],
    ],
    volumeL: 10,
    source: 'common practice',
  },
  { name: '3 % hydrogen peroxide from 30 %', lines: [['H2O2', 100, 'g', 0.3]], volumeL: 1, source: 'common practice' },
  {
    name: 'acidified permanganate titrant',
    lines: [
      ['KMnO4', 3.16, 'g'],
      ['H2SO4', 50, 'g', 0.96],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  { name: 'dichromate titrant', lines: [['K2Cr2O7', 4.9, 'g']], volumeL: 1, source: 'common practice' },
  {
    name: 'thiosulfate titrant',
    lines: [
      ['Na2S2O3·5H2O', 24.8, 'g'],
      ['Na2CO3', 0.1, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: "Lugol's iodine",
    lines: [
      ['I2', 50, 'g'],
      ['KI', 100, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'nitrite–borate corrosion inhibitor',
    lines: [
      ['NaNO2', 20, 'g'],
      ['Na2B4O7·10H2O', 10, 'g'],
      ['NaOH', 1, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'glycol coolant with nitrite and borax',
    lines: [
      ['C2H6O2', 500, 'g'],
      ['NaNO2', 3, 'g'],
      ['Na2B4O7·10H2O', 5, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'nitrite-free metalworking concentrate (TEA and boric acid)',
    lines: [
      ['C6H15NO3', 100, 'g'],
      ['H3BO3', 50, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'sugar syrup with citric acid',
    lines: [
      ['C12H22O11', 500, 'g'],
      ['C6H8O7', 5, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'phosphoric–citric descaler',
    lines: [
      ['H3PO4', 120, 'g', 0.85],
      ['C6H8O7', 50, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'alkaline cleaner',
    lines: [
      ['NaOH', 20, 'g'],
      ['Na2CO3', 30, 'g'],
      ['Na2SiO3', 20, 'g'],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  { name: 'oxalic acid rust remover', lines: [['C2H2O4·2H2O', 50, 'g']], volumeL: 1, source: 'common practice' },
  {
    name: 'acid gold strike (aurocyanide in citrate)',
    lines: [
      ['K[Au(CN)2]', 4, 'g'],
      ['C6H8O7', 60, 'g'],
      ['KH2PO4', 20, 'g'],
    ],
    volumeL: 1,
    source: 'common practice (acid gold, pH 3.5–4.5)',
  },
  {
    name: 'salt with ferrocyanide anticaking agent',
    lines: [
      ['NaCl', 100, 'g'],
      ['K4[Fe(CN)6]·3H2O', 0.001, 'g'],
    ],
    volumeL: 1,
    source: 'common practice (E536)',
  },
  {
    name: 'cuprammonium solution',
    lines: [
      ['CuSO4·5H2O', 10, 'g'],
      ['NH3', 40, 'g', 0.25],
    ],
    volumeL: 0.5,
    source: 'common practice',
  },
  { name: 'hexamminecobalt(III) chloride solution', lines: [['[Co(NH3)6]Cl3', 2.7, 'g']], volumeL: 0.1, source: 'common practice' },
  {
    name: 'electroless copper (EDTA, formaldehyde, caustic)',
    lines: [
      ['CuSO4·5H2O', 10, 'g'],
      ['C10H14N2Na2O8·2H2O', 30, 'g'],
      ['NaOH', 10, 'g'],
      ['CH2O', 10, 'g', 0.37],
    ],
    volumeL: 1,
    source: 'common practice',
  },
  {
    name: 'silver nitrate, nitric-acid stabilised',
    lines: [
      ['AgNO3', 17, 'g'],
      ['HNO3', 1, 'g', 0.65],
    ],
    volumeL: 1,
    source: 'common practice',
  },
];

const kindsOf = (c: Case) => readBatchSafety(mix(c.lines, { volumeL: c.volumeL ?? null, pH: c.pH ?? null })).hazards.map((h) => h.kind);

describe('dangerous pairs are caught', () => {
  for (const c of DANGEROUS) {
    it(`${c.name} (${c.source})`, () => {
      const kinds = kindsOf(c);
      for (const k of c.expect ?? []) expect(kinds, c.name).toContain(k);
    });
  }
});

describe('ordinary formulations raise nothing', () => {
  for (const c of ORDINARY) {
    it(`${c.name} (${c.source})`, () => {
      expect(kindsOf(c), c.name).toEqual([]);
    });
  }
});

describe('the rates', () => {
  it('at least 20 dangerous pairs, all caught; at least 20 ordinary formulations, no false alarm', () => {
    const caught = DANGEROUS.filter((c) => (c.expect ?? []).every((k) => kindsOf(c).includes(k))).length;
    const falseAlarms = ORDINARY.filter((c) => kindsOf(c).length > 0).length;
    expect(DANGEROUS.length).toBeGreaterThanOrEqual(20);
    expect(ORDINARY.length).toBeGreaterThanOrEqual(20);
    expect(caught / DANGEROUS.length).toBe(1);
    expect(falseAlarms / ORDINARY.length).toBe(0);
  });
});

describe('the warning', () => {
  const bleachAcid = mix(
    [
      ['NaOCl', 100, 'g', 0.12],
      ['HCl', 200, 'g', 0.1],
    ],
    { volumeL: 1 },
  );
  bleachAcid.ingredients[0].line = 4;
  bleachAcid.ingredients[1].line = 7;
  const [h] = batchHazards(bleachAcid);

  it('goes on the later of the two lines and names both, the product and the harm, with the usual caution', () => {
    expect(h.at).toBe(1);
    expect(h.lines).toEqual([4, 7]);
    expect(h.ingredients).toEqual(['NaOCl', 'HCl']);
    expect(h.message).toMatch(/sodium hypochlorite \(NaOCl\)/i);
    expect(h.message).toMatch(/hydrochloric acid \(HCl\)/);
    expect(h.message).toMatch(/chlorine gas \(Cl₂\)/);
    expect(h.message).toMatch(/toxic gas/);
    expect(h.message).toContain(HAZARD_CAUTION);
    expect(h.source).toMatch(/Bretherick/);
  });

  it('the later line decides whatever the order of the ingredients', () => {
    const b = mix(
      [
        ['HCl', 200, 'g', 0.1],
        ['NaOCl', 100, 'g', 0.12],
      ],
      { volumeL: 1 },
    );
    b.ingredients[0].line = 9;
    b.ingredients[1].line = 2;
    const [x] = batchHazards(b);
    expect(x.at).toBe(0);
    expect(x.lines).toEqual([2, 9]);
  });

  it('names every partner of one substance in one warning', () => {
    const hs = batchHazards(
      mix(
        [
          ['NaOCl', 100, 'g', 0.12],
          ['HCl', 100, 'g', 0.1],
          ['H2SO4', 20, 'g', 0.96],
        ],
        { volumeL: 1 },
      ),
    );
    const chlorine = hs.filter((x) => x.kind === 'chlorine');
    expect(chlorine).toHaveLength(1);
    expect(chlorine[0].ingredients).toEqual(['NaOCl', 'HCl', 'H₂SO₄']);
  });

  it('the hover sentence defers to the SDS, local codes and licensed practice', () => {
    expect(SAFETY_NOTICE).toMatch(/aid, not a safety assessment/);
    for (const w of ['SDS', 'procedures', 'local codes', 'licensed practice']) expect(SAFETY_NOTICE).toContain(w);
  });

  it('every rule names its source and says it is from memory', () => {
    for (const r of PAIR_RULES) expect(r.source, r.id).toMatch(/from memory/);
  });
});

describe('the pH decides the acid-sensitive pairs', () => {
  const cyanideAcid: Line[] = [
    ['NaCN', 10, 'g'],
    ['NaOH', 20, 'g'],
    ['HCl', 5, 'g', 0.37],
  ];
  it('a cyanide bath kept alkaline by excess caustic (estimated pH) raises no HCN warning', () => {
    const r = readBatchSafety(mix(cyanideAcid, { volumeL: 1 }));
    expect(r.pH?.from).toBe('estimate');
    expect(r.pH!.value).toBeGreaterThan(12);
    expect(r.hazards.map((x) => x.kind)).not.toContain('hydrogen-cyanide');
  });
  it("the solution chemistry's pH takes precedence over the estimate", () => {
    const r = readBatchSafety(mix(cyanideAcid, { volumeL: 1, pH: 9 }));
    expect(r.pH).toEqual({ value: 9, from: 'solution' });
    const h = r.hazards.find((x) => x.kind === 'hydrogen-cyanide');
    expect(h?.pH).toEqual({ value: 9, from: 'solution' });
    expect(h?.message).toMatch(/pH is 9\.0 \(from the solution chemistry\)/);
  });
  it('in a dry blend (no water at all) the pair alone decides; dissolved in excess caustic it is alkaline', () => {
    const dry: Line[] = [
      ['NaCN', 10, 'g'],
      ['NaOH', 20, 'g'],
      ['C6H8O7', 5, 'g'],
    ];
    const r = readBatchSafety(mix(dry, { volumeL: null }));
    expect(r.pH).toBeNull();
    expect(r.hazards.map((x) => x.kind)).toContain('hydrogen-cyanide');
    expect(kindsOf({ name: '', lines: dry, volumeL: 1, source: '' })).not.toContain('hydrogen-cyanide');
  });
  it('sulfide in a strongly alkaline bath is left alone; at pH 6 it is mostly H2S whatever made it so (pKa 7.0, CRC)', () => {
    expect(
      kindsOf({
        name: '',
        lines: [
          ['Na2S', 10, 'g'],
          ['NaOH', 10, 'g'],
        ],
        volumeL: 1,
        source: '',
      }),
    ).toEqual([]);
    const r = readBatchSafety(
      mix(
        [
          ['Na2S', 10, 'g'],
          ['NaOH', 10, 'g'],
        ],
        { volumeL: 1, pH: 6 },
      ),
    );
    expect(r.hazards.map((x) => x.kind)).toEqual(['hydrogen-sulfide']);
    expect(r.hazards[0].ingredients).toEqual(['Na₂S']);
    expect(r.hazards[0].message).toMatch(/at this pH gives hydrogen sulfide/);
  });
});

describe('reactive groups', () => {
  const groups = (f: string, name?: string) => reactiveGroups(analyseFormula(f), name).map((g) => g.group);
  it('by formula (Bretherick group entries)', () => {
    expect(groups('NaOCl')).toContain('hypochlorite');
    expect(groups('Ca(OCl)2')).toContain('hypochlorite');
    expect(groups('KClO4')).toContain('chlorate');
    expect(groups('HNO3')).toEqual(expect.arrayContaining(['nitrate', 'strong-acid']));
    expect(groups('KMnO4')).toContain('permanganate');
    expect(groups('K2Cr2O7')).toContain('chromium-vi');
    expect(groups('CrO3')).toContain('chromium-vi');
    expect(groups('H2O2')).toContain('peroxide');
    expect(groups('K2S2O8')).toContain('peroxide');
    expect(groups('Na2CO3·1.5H2O2')).toContain('peroxide');
    expect(groups('NaH2PO2')).toContain('reducer');
    expect(groups('KCN')).toContain('cyanide');
    expect(groups('Na2S')).toContain('sulfide');
    expect(groups('Na2S2O5')).toContain('sulfite');
    expect(groups('NaNO2')).toContain('nitrite');
    expect(groups('NaN3')).toContain('azide');
    expect(groups('NH4Cl')).toContain('ammonia');
    expect(groups('C6H15NO3')).toContain('ammonia');
    expect(groups('C3H8O3')).toContain('fuel');
    expect(groups('C12H22O11')).toContain('fuel');
    expect(groups('Zn')).toContain('metal');
    expect(groups('Na')).toEqual(expect.arrayContaining(['metal', 'water-reactive']));
    expect(groups('LiAlH4')).toContain('water-reactive');
    expect(groups('CaC2')).toContain('water-reactive');
    expect(groups('AlCl3')).toContain('water-reactive');
    expect(groups('NaOH')).toContain('strong-base');
    expect(groups('H2SO4')).toContain('strong-acid');
  });
  it('the hydrate of aluminium chloride is not water-reactive; nor are salts, buffers or sugars in any group they should not be', () => {
    expect(groups('AlCl3·6H2O')).not.toContain('water-reactive');
    expect(groups('NaCl')).toEqual([]);
    expect(groups('Na2HPO4')).toEqual([]);
    expect(groups('K4[Fe(CN)6]')).toEqual(['cyanide', 'heavy-metal']);
    expect(reactiveGroups(analyseFormula('K4[Fe(CN)6]')).find((g) => g.group === 'cyanide')?.tag).toBe('stable-complex');
  });
  it('by name where the formula says nothing (common practice shelf names)', () => {
    expect(groups('Xx', 'bleach')).toContain('hypochlorite');
    expect(groups('Xx', 'muriatic acid')).toContain('strong-acid');
  });
});

describe('never a crash', () => {
  const pool = [
    'NaOCl',
    'HCl',
    'NaCN',
    'H2SO4',
    'NaOH',
    'KMnO4',
    'C3H8O3',
    'NH3',
    'NaN3',
    'CuSO4·5H2O',
    'H2O',
    'Zn',
    'NaH',
    'Xq2',
    '(((',
    'H2O2',
    'AgNO3',
    'Fe3O4',
    'SO4^2-',
  ];
  it('any mix of ingredients, amounts and volumes gives plain data (property test)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.tuple(
            fc.constantFrom(...pool),
            fc.oneof(fc.constant(0), fc.double({ min: 1e-6, max: 1e4, noNaN: true })),
            fc.double({ min: 0.01, max: 1, noNaN: true }),
          ),
          { maxLength: 8 },
        ),
        fc.option(fc.double({ min: 1e-4, max: 1e3, noNaN: true })),
        fc.option(fc.double({ min: -2, max: 16, noNaN: true })),
        (lines, volumeL, pH) => {
          const r = readBatchSafety(
            mix(
              lines.map(([f, g, a]) => [f, g, 'g', a] as const),
              { volumeL, pH },
            ),
          );
          for (const h of r.hazards) {
            expect(h.message.length).toBeGreaterThan(20);
            expect(h.lines.length).toBe(h.ingredients.length);
          }
          if (r.heat) expect(Number.isFinite(r.heat.kJ)).toBe(true);
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe('acid salts by the protons they still carry (CRC pKa values)', () => {
  const acidPKa = (f: string) => reactiveGroups(analyseFormula(f)).find((g) => g.group === 'acid')?.pKa;
  it('per unit of their system', () => {
    expect(acidPKa('NaHSO4')).toBe(1.99);
    expect(acidPKa('NaH2PO4')).toBe(7.2);
    expect(acidPKa('Na2HPO4')).toBeUndefined(); // pKa 12.35: not an acid here
    expect(acidPKa('NaHCO3')).toBeUndefined(); // pKa 10.33
    expect(acidPKa('Na2S2O5')).toBe(7.17); // two HSO3⁻ units
    expect(acidPKa('K2Cr2O7')).toBe(6.51); // two HCrO4⁻ units
    expect(acidPKa('KHF2')).toBe(3.17); // HF + F⁻
    expect(acidPKa('Na2B4O7')).toBeUndefined(); // boric acid pKa 9.24
  });
});

describe('lines the amounts stage did not count', () => {
  it('still carry their hazards; an acid or base of unknown amount leaves the pH unknown', () => {
    const b = mix(
      [
        ['NaOCl', 50, 'g', 0.12],
        ['HCl', 10, 'g', 0.37],
      ],
      { volumeL: 1 },
    );
    b.ingredients[1].moles = null;
    b.ingredients[1].massG = null;
    const r = readBatchSafety(b);
    expect(r.pH).toBeNull();
    expect(r.hazards.map((h) => h.kind)).toContain('chlorine');
  });
});
