/**
 * What the analysis reads a formula as, case by case against chemistry references: the ions, the
 * oxidation states (averages and per site), the charge-balance verdict and its suggestion, the bond pair,
 * what a batch dissociates. Sources beside each check: N. N. Greenwood & A. Earnshaw, Chemistry of the
 * Elements, 2nd ed. (1997) ("G&E"); CRC Handbook of Chemistry and Physics ("CRC"); IUPAC Red Book 2005
 * ("Red Book"); IUPAC, Pure Appl. Chem. 88 (2016) 831 (the definition of oxidation state); "from memory"
 * where recalled without the book at hand.
 */
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { analyseBatch, dissociate } from '../../server/src/chem/batch';
import { cardJson } from '../../server/src/service/card';
import { formulaCardMarkdown } from '../../server/src/service/hover';
import { DEFAULT_SETTINGS } from '../../server/src/service/settings';

const ch = (f: string) => analyseFormula(f).charges!;
const ox = (f: string) => ch(f).oxidationStates!;
const ionLabels = (f: string) => ch(f).ions!.map((i) => `${i.count} ${i.label}`);
const flagged = (f: string) => !ch(f).balanced;

describe('metal dioxides are oxides, not peroxides', () => {
  // G&E: MnO2 (pyrolusite), PbO2, SnO2 (cassiterite), CrO2, VO2, TiO2 (rutile), ZrO2 are M(IV) oxides.
  it.each(['MnO2', 'PbO2', 'SnO2', 'CrO2', 'VO2', 'TiO2', 'ZrO2'])('%s is M⁴⁺ + 2 O²⁻', (f) => {
    const el = f.replace('O2', '');
    expect(ox(f)[el]).toBe(4);
    expect(ox(f).O).toBe(-2);
    expect(ch(f).ions!.some((i) => i.ionName === 'peroxide')).toBe(false);
    // No oxidiser caution from a peroxide that is not there (a caution may still name the metal).
    expect(analyseFormula(f).charges!.message).toContain('2 O²⁻');
  });
  // G&E ch. 4 and 14: BaO2 and Na2O2 peroxides, KO2 superoxide, KO3 ozonide; FeS2 (pyrite) is Fe²⁺ S₂²⁻.
  it.each([
    ['BaO2', 'peroxide', { Ba: 2, O: -1 }],
    ['Na2O2', 'peroxide', { Na: 1, O: -1 }],
    ['KO2', 'superoxide', { K: 1, O: -0.5 }],
    ['KO3', 'ozonide', { K: 1, O: -1 / 3 }],
    ['FeS2', 'disulfide', { Fe: 2, S: -1 }],
  ] as const)('%s stays a %s', (f, name, states) => {
    expect(ch(f).ions!.some((i) => i.ionName === name)).toBe(true);
    for (const [el, q] of Object.entries(states)) expect(ox(f)[el]).toBeCloseTo(q, 4);
  });
  it('puts Mn³⁺ and Co³⁺ in the usual set: Mn3O4 is Mn²⁺ + 2 Mn³⁺, Co3O4 Co²⁺ + 2 Co³⁺ (G&E, hausmannite and Co3O4 spinels)', () => {
    expect(ch('Mn3O4').message).toContain('Mn²⁺ + 2 Mn³⁺');
    expect(ch('Co3O4').message).toContain('Co²⁺ + 2 Co³⁺');
    expect(ch('Pb3O4').message).toContain('2 Pb²⁺ + Pb⁴⁺'); // red lead, G&E ch. 10
    expect(ox('Mn2O3').Mn).toBe(3);
  });
  it('gives MnO2 a lattice estimate for Mn⁴⁺ and no peroxide caution', () => {
    const card = cardJson(analyseFormula('MnO2'));
    expect(card.latticeEnergy?.inputs).toMatchObject({ charges: { cation: 4, anion: -2 } });
    expect(formulaCardMarkdown(analyseFormula('MnO2'), DEFAULT_SETTINGS)).not.toContain('peroxide');
  });
});

describe('implausible valences in salts are not balanced', () => {
  // G&E: nickel(II), copper(I, II), iron(II, III), chromium(II, III) in their sulfates and nitrates.
  it.each([
    ['Ni(SO4)2', 'NiSO4', 'Ni⁴⁺'],
    ['Cu(NO3)3', 'Cu(NO3)2', 'Cu³⁺'],
    ['Fe(SO4)2', 'FeSO4', 'Fe⁴⁺'],
    ['Cr(NO3)4', 'Cr(NO3)3', 'Cr⁴⁺'],
  ])('%s is flagged, suggesting %s, and says %s is no salt state', (f, fix, state) => {
    const c = ch(f);
    expect(c.balanced).toBe(false);
    expect(c.suggestions[0]).toBe(fix);
    expect(c.message).toContain(state);
    expect(analyseFormula(fix).charges!.balanced).toBe(true);
  });
  it('proposes both iron sulfates for Fe(SO4)2 (criss-cross with Fe²⁺ and Fe³⁺)', () => {
    expect(ch('Fe(SO4)2').suggestions.slice(0, 2)).toEqual(['FeSO4', 'Fe2(SO4)3']);
  });
  // G&E: ceric sulfate, titanium(IV) sulfate, lead tetraacetate, tin(IV) chloride, zirconium sulfate.
  it.each(['Ce(SO4)2', 'Ti(SO4)2', 'Pb(CH3COO)4', 'SnCl4', 'Zr(SO4)2', 'WCl6', 'UF6'])('real high-valent %s stays balanced', (f) => {
    expect(ch(f).balanced).toBe(true);
  });
});

describe('oxidation-state ties by electronegativity; carbonyls; nitrogen by group', () => {
  it('SiC is Si +4, C −4; SO2Cl2 is S +6, O −2, Cl −1 (IUPAC 2016 definition: electrons to the more electronegative atom)', () => {
    expect(ox('SiC')).toMatchObject({ Si: 4, C: -4 });
    expect(ox('SO2Cl2')).toMatchObject({ S: 6, O: -2, Cl: -1 });
  });
  it('metal carbonyls are M(0): Ni(CO)4, Fe(CO)5, Cr(CO)6 (Red Book IR-10; G&E ch. 8)', () => {
    for (const [f, m] of [
      ['Ni(CO)4', 'Ni'],
      ['Fe(CO)5', 'Fe'],
      ['Cr(CO)6', 'Cr'],
    ]) {
      expect(ox(f)[m], f).toBe(0);
      expect(ox(f)).toMatchObject({ C: 2, O: -2 });
    }
  });
  // From memory (textbook group values): amines, amides, nitriles, amino acids N −3; nitro N +3.
  it.each([
    ['H2NCH2COOH', -3, 1], // glycine: C average +1
    ['CH3CH2NO2', 3, -2], // nitroethane: C average −2
    ['CH3CN', -3, 0], // acetonitrile: CH3 −3, CN +3
    ['CH3CONH2', -3, 0], // acetamide
    ['CO(NH2)2', -3, 4], // urea
    ['C6H5NH2', -3, -4 / 6], // aniline
  ])('%s: N %d, C average %d', (f, n, c) => {
    expect(ox(f).N).toBe(n);
    expect(ox(f).C).toBeCloseTo(c, 4);
  });
  it('gives no firm N (or C) state for a molecular formula with isomers of different N states, and says why (C2H5NO2: glycine or nitroethane)', () => {
    const c = ch('C2H5NO2');
    expect(c.balanced).toBe(true);
    expect(c.oxidationStates).not.toHaveProperty('N');
    expect(c.oxidationStates).not.toHaveProperty('C');
    expect(c.oxidationStates).toMatchObject({ H: 1, O: -2 });
    expect(c.undetermined.map((u) => u.element)).toEqual(['N', 'C']);
    expect(c.undetermined[0].reason).toContain('glycine');
    const card = cardJson(analyseFormula('C2H5NO2'));
    expect(card.oxidationStatesBySite.some((x) => x.element === 'N')).toBe(false);
    expect(card.oxidationStatesUndetermined[0].element).toBe('N');
    expect(formulaCardMarkdown(analyseFormula('C2H5NO2'), DEFAULT_SETTINGS)).toContain('No state given for N');
  });
  it('a molecular formula with one N and no O, F or Cl fixes N at −3 (pyridine C5H5N)', () => {
    expect(ox('C5H5N').N).toBe(-3);
  });
});

describe('states per site (contract, second round)', () => {
  it('NH4NO3: N −3 in NH₄⁺ and +5 in NO₃⁻, the average +1 kept in oxidationStates', () => {
    const card = cardJson(analyseFormula('NH4NO3'));
    expect(card.oxidationStates!.N).toBe(1);
    expect(card.oxidationStatesBySite).toEqual(
      expect.arrayContaining([
        { element: 'N', state: -3, count: 1, site: 'NH₄⁺' },
        { element: 'N', state: 5, count: 1, site: 'NO₃⁻' },
      ]),
    );
  });
  it('Fe3O4: one Fe²⁺ and two Fe³⁺ sites (G&E, inverse spinel)', () => {
    const sites = cardJson(analyseFormula('Fe3O4')).oxidationStatesBySite.filter((x) => x.element === 'Fe');
    expect(sites).toEqual([
      { element: 'Fe', state: 2, count: 1, site: 'Fe²⁺' },
      { element: 'Fe', state: 3, count: 2, site: 'Fe³⁺' },
    ]);
  });
  it('hydrate water is a site of its own, counted with its multiplier', () => {
    const sites = cardJson(analyseFormula('CuSO4·5H2O')).oxidationStatesBySite;
    expect(sites).toEqual(
      expect.arrayContaining([
        { element: 'H', state: 1, count: 10, site: 'H₂O' },
        { element: 'Cu', state: 2, count: 1, site: 'Cu²⁺' },
      ]),
    );
  });
  it('nitroaniline shows both N groups (−3 amine, +3 nitro)', () => {
    const n = ch('H2NC6H4NO2')
      .sites!.filter((x) => x.element === 'N')
      .map((x) => x.state);
    expect(n).toEqual([-3, 3]);
  });
});

describe('real reagents stay balanced, read as the ions they are', () => {
  it.each([
    ['Na2S4O6', 'S₄O₆²⁻', { S: 2.5 }], // tetrathionate, G&E ch. 15
    ['Na2S2O6', 'S₂O₆²⁻', { S: 5 }], // dithionate
    ['Na2S4', 'S₄²⁻', { S: -0.5 }], // polysulfide
    ['Ni(SO3NH2)2', 'SO₃NH₂⁻', { N: -3, S: 6 }], // nickel sulfamate, common plating spelling
    ['Ni(NH2SO3)2', 'NH₂SO₃⁻', { N: -3, S: 6 }],
    ['NaOCH3', 'OCH₃⁻', { C: -2 }], // sodium methoxide
    ['Al(OC3H7)3', 'OC₃H₇⁻', {}], // aluminium isopropoxide
    ['NaBO3·4H2O', 'BO₃⁻', { B: 3 }], // sodium perborate (trade formula)
    ['KO3', 'O₃⁻', {}], // potassium ozonide
    ['NaH2PO2·H2O', 'H₂PO₂⁻', { P: 1 }], // sodium hypophosphite
    ['Na4P2O7', 'P₂O₇⁴⁻', { P: 5 }],
    ['K4P2O7', 'P₂O₇⁴⁻', { P: 5 }],
    ['Na5P3O10', 'P₃O₁₀⁵⁻', { P: 5 }], // sodium tripolyphosphate
    ['C12H25NaO4S', 'C₁₂H₂₅SO₄⁻', { S: 6 }], // sodium dodecyl sulfate
    ['NaC12H25SO4', 'C₁₂H₂₅SO₄⁻', { S: 6 }],
  ] as const)('%s reads with %s', (f, ion, states) => {
    expect(ch(f).balanced).toBe(true);
    expect(ch(f).basis).toBe('ionic');
    expect(ch(f).ions!.map((i) => i.label)).toContain(ion);
    for (const [el, q] of Object.entries(states)) expect(ox(f)[el], `${f} ${el}`).toBeCloseTo(q, 4);
  });
  it('sulfamic acid H3NSO3 is S +6, N −3 (G&E ch. 15)', () => {
    expect(ox('H3NSO3')).toMatchObject({ S: 6, N: -3, H: 1, O: -2 });
  });
  it('(NH4)2Sx reads as ammonium polysulfide; S, which depends on x, has no state, and no molar mass is made up', () => {
    const a = analyseFormula('(NH4)2Sx');
    expect(a.charges!.balanced).toBe(true);
    expect(ionLabels('(NH4)2Sx')).toEqual(['2 NH₄⁺', '1 Sx²⁻']);
    expect(a.charges!.oxidationStates).toEqual({ H: 1, N: -3 });
    expect(a.molarMass).toBeNull();
    expect(a.diagnostics.find((d) => d.code === 'variable-count')).toMatchObject({ severity: 'warning', start: 7, end: 8 });
  });
});

describe('a salt reads the same whatever order it is written in', () => {
  const pairs: Array<[string, string, string]> = [
    ['C6H5Na3O7', 'Na3C6H5O7', 'C₆H₅O₇³⁻'], // trisodium citrate
    ['C6H11NaO7', 'NaC6H11O7', 'C₆H₁₁O₇⁻'], // sodium gluconate
    ['C12H25NaO4S', 'NaC12H25SO4', 'C₁₂H₂₅SO₄⁻'], // SDS
    ['Na2O4S', 'Na2SO4', 'SO₄²⁻'], // a Hill formula
  ];
  it.each(pairs)('%s and %s give the same ions', (a, b, anion) => {
    expect(ionLabels(a)).toEqual(ionLabels(b).map((x) => x.replace(/[A-Za-z]/, (m) => m)));
    expect(ch(a).ions!.map((i) => i.label)).toContain(anion);
    expect(ch(a).oxidationStates).toEqual(ch(b).oxidationStates);
  });
  it.each([
    ['(NH4)2CO3', ['2 NH₄⁺', '1 CO₃²⁻']],
    ['CH3COONH4', ['1 NH₄⁺', '1 CH₃COO⁻']],
    ['NH4HCO3', ['1 NH₄⁺', '1 HCO₃⁻']],
    ['C10H14N2Na2O8', ['2 Na⁺', '1 C₁₀H₁₄N₂O₈²⁻']], // disodium EDTA (H2edta²⁻), CRC
    ['K[Au(CN)2]', ['1 K⁺', '1 [Au(CN)₂]⁻']], // potassium dicyanoaurate(I), G&E ch. 28
  ] as const)('%s reads as %j', (f, ions) => {
    expect(ionLabels(f)).toEqual(ions);
  });
  it('flags a Hill-order salt with a cation too few and proposes the right count', () => {
    expect(flagged('C6H5Na2O7')).toBe(true);
    expect(ch('C6H5Na2O7').suggestions[0]).toBe('Na3C6H5O7');
    // Urea is not read as ammonium cyanate: no NH4 is written.
    expect(ch('CO(NH2)2').basis).toBe('molecular');
    expect(ch('CH4N2O').basis).toBe('molecular');
  });
});

describe('batches dissociate the strong electrolytes whatever their spelling', () => {
  const ionsOf = (f: string) => dissociate(analyseFormula(f)).ions.map((i) => `${i.count} ${i.key}`);
  it.each([
    ['C6H5Na3O7', ['3 Na^+', '1 C6H5O7^3-']],
    ['(NH4)2CO3', ['2 NH4^+', '1 CO3^2-']],
    ['CH3COONH4', ['1 NH4^+', '1 CH3COO^-']],
    ['NH4HCO3', ['1 NH4^+', '1 HCO3^-']],
    ['C6H11NaO7', ['1 Na^+', '1 C6H11O7^-']],
    ['C10H14N2Na2O8', ['2 Na^+', '1 C10H14N2O8^2-']],
    ['C12H25NaO4S', ['1 Na^+', '1 C12H25SO4^-']],
    ['K[Au(CN)2]', ['1 K^+', '1 [Au(CN)2]^-']],
  ] as const)('%s → %j', (f, ions) => {
    expect(ionsOf(f)).toEqual(ions);
  });
  it('gives a trisodium citrate batch its ionic strength: 0.1 M → I = ½(0.3·1 + 0.1·9) = 0.6 M (I = ½ Σ cz²)', () => {
    const text = 'volume: 1 L\nC6H5Na3O7 0.1 M';
    let at = 0;
    const b = analyseBatch(
      text.split('\n').map((t) => {
        const l = { text: t, start: at };
        at += t.length + 1;
        return l;
      }),
    );
    expect(b.ionicStrengthM).toBeCloseTo(0.6, 10);
  });
  it('reads ammonium hydroxide as aqueous ammonia, a weak base (CRC: Kb 1.8 × 10⁻⁵), not NH₄⁺ + OH⁻', () => {
    const d = dissociate(analyseFormula('NH4OH'));
    expect(d.ions).toEqual([]);
    expect(d.undissociated).toContain('weak base');
  });
});

describe('bond pairs are bonds the substance has', () => {
  it('HNO3 is O–H (most polar of O–H and N–O), not H–N', () => {
    const b = analyseFormula('HNO3').bond!;
    expect(b.pair).toEqual(['H', 'O']);
    expect(b.note).toContain('N–O');
  });
  it('NH4Cl: ionic between NH₄⁺ and Cl⁻, the N–H bond of the cation named as covalent', () => {
    const b = cardJson(analyseFormula('NH4Cl')).bond!;
    expect(b.pair).toEqual(['H', 'N']);
    expect(b.type).toBe('polar covalent'); // ΔEN 3.04 − 2.20 = 0.84 (Pauling values)
    expect(b.deltaEN).toBeCloseTo(0.84, 2);
    expect(b.betweenIons).toEqual({ cation: 'NH₄⁺', anion: 'Cl⁻', type: 'ionic' });
  });
  it("keeps the metal–anion pair of a metal salt, with the anion's own bond listed (Na2SO4: Na–O ionic, S–O within SO₄²⁻)", () => {
    const b = analyseFormula('Na2SO4').bond!;
    expect(b.pair).toEqual(['Na', 'O']);
    expect(b.within?.[0]).toMatchObject({ ion: 'SO₄²⁻', pair: ['S', 'O'] });
  });
});
