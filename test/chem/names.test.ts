/**
 * Names both ways: formula → systematic name, and name → formula.
 *
 * Sources of the expected names:
 * - RB: IUPAC, Nomenclature of Inorganic Chemistry, Recommendations 2005 (the Red Book): the examples of
 *   IR-5 (stoichiometric names, Stock numbers, hydrates), IR-8 (acids, hydrogen prefixes written as one
 *   word) and IR-9 (coordination compounds), from memory.
 * - CRC: CRC Handbook of Chemistry and Physics, "Physical Constants of Inorganic Compounds" (whose entries
 *   use Stock names such as "Copper(II) sulfate pentahydrate"), from memory.
 * - MI: The Merck Index, for trade names (borax, Epsom salt), from memory.
 */
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { nameAtStart, nameOf, namesByPrefix, namesOf, readName } from '../../server/src/chem/names';
import { REAL } from '../fixtures/charge-sets';

const hill = (f: string) => analyseFormula(f).hill;

/** [formula, systematic name]: each checked both ways. RB and CRC (see the header), from memory. */
const PAIRS: Array<[string, string]> = [
  // Binary salts, one usual state (RB IR-5.4.2.2: no Stock number).
  ['NaCl', 'sodium chloride'],
  ['KBr', 'potassium bromide'],
  ['LiF', 'lithium fluoride'],
  ['CsI', 'caesium iodide'],
  ['MgO', 'magnesium oxide'],
  ['CaO', 'calcium oxide'],
  ['BaS', 'barium sulfide'],
  ['Al2O3', 'aluminium oxide'],
  ['AlCl3', 'aluminium chloride'],
  ['ZnO', 'zinc oxide'],
  ['ZnCl2', 'zinc chloride'],
  ['CdS', 'cadmium sulfide'],
  ['AgCl', 'silver chloride'],
  ['AgI', 'silver iodide'],
  ['Li3N', 'lithium nitride'],
  ['Mg3N2', 'magnesium nitride'],
  ['Ca3P2', 'calcium phosphide'],
  ['NaH', 'sodium hydride'],
  ['CaH2', 'calcium hydride'],
  ['SrF2', 'strontium fluoride'],
  // Stock numbers (RB IR-5.4.2.2; CRC entries).
  ['FeCl2', 'iron(II) chloride'],
  ['FeCl3', 'iron(III) chloride'],
  ['FeO', 'iron(II) oxide'],
  ['Fe2O3', 'iron(III) oxide'],
  ['CuCl', 'copper(I) chloride'],
  ['CuCl2', 'copper(II) chloride'],
  ['Cu2O', 'copper(I) oxide'],
  ['CuO', 'copper(II) oxide'],
  ['SnCl2', 'tin(II) chloride'],
  ['SnCl4', 'tin(IV) chloride'],
  ['SnO2', 'tin(IV) oxide'],
  ['PbO', 'lead(II) oxide'],
  ['PbO2', 'lead(IV) oxide'],
  ['MnO2', 'manganese(IV) oxide'],
  ['Cr2O3', 'chromium(III) oxide'],
  ['CrO3', 'chromium(VI) oxide'],
  ['TiO2', 'titanium(IV) oxide'],
  ['V2O5', 'vanadium(V) oxide'],
  ['CoCl2', 'cobalt(II) chloride'],
  ['NiO', 'nickel(II) oxide'],
  ['HgCl2', 'mercury(II) chloride'],
  ['Hg2Cl2', 'mercury(I) chloride'],
  ['OsO4', 'osmium(VIII) oxide'],
  ['Au2O3', 'gold(III) oxide'],
  // Salts of polyatomic ions (RB Table IX).
  ['Na2SO4', 'sodium sulfate'],
  ['Na2SO3', 'sodium sulfite'],
  ['Na2S2O3', 'sodium thiosulfate'],
  ['K2S2O8', 'potassium peroxodisulfate'],
  ['Na2S2O5', 'sodium disulfite'],
  ['KNO3', 'potassium nitrate'],
  ['NaNO2', 'sodium nitrite'],
  ['Ca3(PO4)2', 'calcium phosphate'],
  ['Na2CO3', 'sodium carbonate'],
  ['CaCO3', 'calcium carbonate'],
  ['KMnO4', 'potassium permanganate'],
  ['K2MnO4', 'potassium manganate'],
  ['K2CrO4', 'potassium chromate'],
  ['K2Cr2O7', 'potassium dichromate'],
  ['NaClO', 'sodium hypochlorite'],
  ['NaClO2', 'sodium chlorite'],
  ['NaClO3', 'sodium chlorate'],
  ['KClO4', 'potassium perchlorate'],
  ['KIO3', 'potassium iodate'],
  ['KBrO3', 'potassium bromate'],
  ['NaCN', 'sodium cyanide'],
  ['KSCN', 'potassium thiocyanate'],
  ['NaN3', 'sodium azide'],
  ['NaOH', 'sodium hydroxide'],
  ['Ca(OH)2', 'calcium hydroxide'],
  ['Al(OH)3', 'aluminium hydroxide'],
  ['NH4Cl', 'ammonium chloride'],
  ['(NH4)2SO4', 'ammonium sulfate'],
  ['NH4NO3', 'ammonium nitrate'],
  ['Fe2(SO4)3', 'iron(III) sulfate'],
  ['Pb(NO3)2', 'lead(II) nitrate'],
  ['Cu(NO3)2', 'copper(II) nitrate'],
  ['AgNO3', 'silver nitrate'],
  ['BaCl2', 'barium chloride'],
  ['Na2C2O4', 'sodium oxalate'],
  ['CH3COONa', 'sodium acetate'],
  ['NaBH4', 'sodium tetrahydroborate'],
  ['KBF4', 'potassium tetrafluoroborate'],
  ['Na2SiO3', 'sodium metasilicate'],
  ['UO2(NO3)2', 'uranyl nitrate'],
  // Acid salts: the hydrogen prefix joined (RB IR-8.5).
  ['NaHCO3', 'sodium hydrogencarbonate'],
  ['NaHSO4', 'sodium hydrogensulfate'],
  ['KH2PO4', 'potassium dihydrogenphosphate'],
  ['Na2HPO4', 'sodium hydrogenphosphate'],
  ['NaHSO3', 'sodium hydrogensulfite'],
  // Peroxides and superoxides (RB IR-5.3.3).
  ['Na2O2', 'sodium peroxide'],
  ['BaO2', 'barium peroxide'],
  ['KO2', 'potassium superoxide'],
  // Hydrates (RB IR-5.5; CRC).
  ['CuSO4·5H2O', 'copper(II) sulfate pentahydrate'],
  ['NiSO4·6H2O', 'nickel(II) sulfate hexahydrate'],
  ['MgSO4·7H2O', 'magnesium sulfate heptahydrate'],
  ['FeSO4·7H2O', 'iron(II) sulfate heptahydrate'],
  ['CoCl2·6H2O', 'cobalt(II) chloride hexahydrate'],
  ['CaCl2·2H2O', 'calcium chloride dihydrate'],
  ['Na2CO3·10H2O', 'sodium carbonate decahydrate'],
  ['Na2B4O7·10H2O', 'sodium tetraborate decahydrate'],
  ['Na2S2O3·5H2O', 'sodium thiosulfate pentahydrate'],
  ['Na2SO4·10H2O', 'sodium sulfate decahydrate'],
  ['CaSO4·0.5H2O', 'calcium sulfate hemihydrate'],
  ['BaCl2·2H2O', 'barium chloride dihydrate'],
  ['ZnSO4·H2O', 'zinc sulfate monohydrate'],
  ['Al2(SO4)3·18H2O', 'aluminium sulfate octadecahydrate'],
  // Coordination compounds (RB IR-9: ligands alphabetically, -ate in anions, the oxidation number).
  ['K3[Fe(CN)6]', 'potassium hexacyanidoferrate(III)'],
  ['K4[Fe(CN)6]', 'potassium hexacyanidoferrate(II)'],
  ['K4[Fe(CN)6]·3H2O', 'potassium hexacyanidoferrate(II) trihydrate'],
  ['[Cu(NH3)4]SO4', 'tetraamminecopper(II) sulfate'],
  ['[Co(NH3)6]Cl3', 'hexaamminecobalt(III) chloride'],
  ['[Co(NH3)5Cl]Cl2', 'pentaamminechloridocobalt(III) chloride'],
  ['[Ag(NH3)2]Cl', 'diamminesilver(I) chloride'],
  ['K2[PtCl4]', 'potassium tetrachloridoplatinate(II)'],
  ['K2[PtCl6]', 'potassium hexachloridoplatinate(IV)'],
  ['Na[Al(OH)4]', 'sodium tetrahydroxidoaluminate(III)'],
  ['K2[Ni(CN)4]', 'potassium tetracyanidonickelate(II)'],
  ['[Cr(H2O)6]Cl3', 'hexaaquachromium(III) chloride'],
  ['[Ni(CO)4]', 'tetracarbonylnickel(0)'],
  ['[Pt(NH3)2Cl2]', 'diamminedichloridoplatinum(II)'],
  ['[Co(en)3]Cl3', 'tris(ethane-1,2-diamine)cobalt(III) chloride'],
  ['Na3[Co(NO2)6]', 'sodium hexakis(nitrito-κN)cobaltate(III)'],
  ['K[Ag(CN)2]', 'potassium dicyanidoargentate(I)'],
  ['Na[Au(CN)2]', 'sodium dicyanidoaurate(I)'],
  ['K2[Zn(OH)4]', 'potassium tetrahydroxidozincate(II)'],
  ['K3[Cr(C2O4)3]', 'potassium trioxalatochromate(III)'], // simple ligand name: tri, not tris (RB Table IV)
  // Binary compounds of non-metals, multiplying prefixes (RB IR-5.2).
  ['CO', 'carbon monoxide'],
  ['CO2', 'carbon dioxide'],
  ['NO', 'nitrogen monoxide'],
  ['NO2', 'nitrogen dioxide'],
  ['N2O', 'dinitrogen oxide'],
  ['N2O4', 'dinitrogen tetraoxide'],
  ['N2O5', 'dinitrogen pentaoxide'],
  ['SO2', 'sulfur dioxide'],
  ['SO3', 'sulfur trioxide'],
  ['SF6', 'sulfur hexafluoride'],
  ['PCl3', 'phosphorus trichloride'],
  ['PCl5', 'phosphorus pentachloride'],
  ['P4O10', 'tetraphosphorus decaoxide'],
  ['CCl4', 'carbon tetrachloride'],
  ['CS2', 'carbon disulfide'],
  ['SiO2', 'silicon dioxide'],
  ['SiCl4', 'silicon tetrachloride'],
  ['SiC', 'silicon carbide'],
  ['BF3', 'boron trifluoride'],
  ['XeF4', 'xenon tetrafluoride'],
  ['ClF3', 'chlorine trifluoride'],
  ['IF7', 'iodine heptafluoride'],
  ['OF2', 'oxygen difluoride'],
  ['OCl2', 'oxygen dichloride'], // RB IR-5.2 example: oxygen precedes the halogens in Table VI
  ['O2Cl2', 'dioxygen dichloride'], // RB IR-5.2 example
  // Acids (RB IR-8, Table IR-8.1) and hydrogen compounds.
  ['H2SO4', 'sulfuric acid'],
  ['HNO3', 'nitric acid'],
  ['H3PO4', 'phosphoric acid'],
  ['H3PO3', 'phosphonic acid'],
  ['HClO4', 'perchloric acid'],
  ['HNO2', 'nitrous acid'],
  ['H2CO3', 'carbonic acid'],
  ['H3BO3', 'boric acid'],
  ['CH3COOH', 'acetic acid'],
  ['HCl', 'hydrogen chloride'],
  ['HF', 'hydrogen fluoride'],
  ['HCN', 'hydrogen cyanide'],
  ['H2O', 'water'],
  ['NH3', 'ammonia'],
  ['H2O2', 'hydrogen peroxide'],
  ['H2C2O4·2H2O', 'oxalic acid dihydrate'],
  // Elements (RB IR-3.4) and ions (RB IR-5.3).
  ['O2', 'dioxygen'],
  ['S8', 'octasulfur'],
  ['Fe', 'iron'],
];

describe('formula → systematic name', () => {
  it(`names ${PAIRS.length} formulas as IUPAC 2005 and the CRC Handbook do (from memory)`, () => {
    expect(PAIRS.length).toBeGreaterThanOrEqual(100);
    const wrong = PAIRS.map(([f, n]) => [f, n, nameOf(analyseFormula(f))]).filter(([, n, got]) => got !== n);
    expect(wrong).toEqual([]);
  });

  it('names ions with the charge number (RB IR-5.3.2.2: iron(3+)) and anions by their names', () => {
    expect(nameOf(analyseFormula('Fe^3+'))).toBe('iron(3+)');
    expect(nameOf(analyseFormula('SO4^2-'))).toBe('sulfate');
    expect(nameOf(analyseFormula('HCO3^-'))).toBe('hydrogencarbonate');
    expect(nameOf(analyseFormula('[Fe(CN)6]^3-'))).toBe('hexacyanidoferrate(III)');
    expect(nameOf(analyseFormula('Hg2^2+'))).toBe('dimercury(2+)');
    expect(nameOf(analyseFormula('NH4^+'))).toBe('ammonium');
  });

  it('follows Table VI for the halogen oxides and gives the trade name beside (RB IR-5.2, from memory)', () => {
    expect(namesOf(analyseFormula('ClO2'))).toEqual({ systematic: 'dioxygen chloride', common: ['chlorine dioxide'] });
    expect(namesOf(analyseFormula('Cl2O7')).common).toEqual(['dichlorine heptoxide']);
    // Either order reads back.
    expect(readName('dichlorine oxide').hill).toBe('Cl2O');
    expect(readName('oxygen dichloride').hill).toBe('Cl2O');
    expect(readName('potassium tris(oxalato)chromate(III)').hill).toBe(hill('K3[Cr(C2O4)3]'));
    expect(nameOf(analyseFormula('[MoCl6]^3-'))).toBe('hexachloridomolybdate(III)');
  });

  it('gives a charge number, not an oxidation number, where a ligand is not innocent (nitrosyl; RB IR-9.1.2.8)', () => {
    expect(nameOf(analyseFormula('Na2[Fe(CN)5NO]'))).toBe('sodium pentacyanidonitrosylferrate(2−)');
  });

  it('leaves unnamed what the reading leaves open', () => {
    expect(nameOf(analyseFormula('Fe3O4'))).toBeUndefined(); // mixed valence
    expect(nameOf(analyseFormula('C6H12O6'))).toBeUndefined(); // glucose, fructose, galactose
    expect(nameOf(analyseFormula('C2H4O2'))).toBeUndefined(); // acetic acid or methyl formate
    expect(nameOf(analyseFormula('KAl(SO4)2·12H2O'))).toBeUndefined(); // two cations
    expect(nameOf(analyseFormula('Xq2'))).toBeUndefined();
  });

  it('puts the trade name beside the systematic one (MI, from memory)', () => {
    expect(namesOf(analyseFormula('CuSO4·5H2O'))).toEqual({ systematic: 'copper(II) sulfate pentahydrate', common: ['blue vitriol'] });
    expect(namesOf(analyseFormula('Na2B4O7·10H2O')).common).toEqual(['borax']);
    expect(namesOf(analyseFormula('NaOH')).common).toEqual(['caustic soda']);
    expect(namesOf(analyseFormula('NaHCO3')).common).toEqual(['baking soda']);
    expect(namesOf(analyseFormula('NaClO')).common).toEqual(['bleach (solution)']);
    expect(namesOf(analyseFormula('HCl')).common).toContain('hydrochloric acid (solution)');
    expect(namesOf(analyseFormula('KAl(SO4)2·12H2O'))).toEqual({ systematic: undefined, common: ['alum'] });
    expect(namesOf(analyseFormula('C6H12O6')).common).toEqual([]); // an isomer is not named by its formula
  });
});

describe('name → formula', () => {
  it(`reads back every one of the ${PAIRS.length} names as its formula`, () => {
    const wrong = PAIRS.map(([f, n]) => [f, n, readName(n)] as const)
      .filter(([f, , r]) => r.status !== 'exact' || r.hill !== hill(f))
      .map(([f, n, r]) => [f, n, r.status, r.formula]);
    expect(wrong).toEqual([]);
  });

  it('reads back the name of every named compound of the real-compound set (test/fixtures/charge-sets.ts)', () => {
    const named = Object.values(REAL)
      .flat()
      .map((f) => [f, nameOf(analyseFormula(f))] as const)
      .filter(([, n]) => n);
    expect(named.length).toBeGreaterThan(350);
    const wrong = named.filter(([f, n]) => readName(n as string).hill !== hill(f));
    expect(wrong).toEqual([]);
    expect(nameOf(analyseFormula('CaSi2'))).toBe('calcium disilicide'); // a Zintl phase: stoichiometric name (RB IR-5.2)
    expect(readName('iron(3+)').formula).toBe('Fe^3+');
    expect(readName('tetraamminecopper(II)').formula).toBe('[Cu(NH3)4]^2+');
  });

  it('reads the shelf names (MI, from memory; common practice)', () => {
    const shelf: Array<[string, string]> = [
      ['borax', 'Na2B4O7·10H2O'],
      ['Epsom salt', 'MgSO4·7H2O'],
      ['Epsom salts', 'MgSO4·7H2O'],
      ['caustic soda', 'NaOH'],
      ['caustic potash', 'KOH'],
      ['soda ash', 'Na2CO3'],
      ['baking soda', 'NaHCO3'],
      ['slaked lime', 'Ca(OH)2'],
      ['quicklime', 'CaO'],
      ['alum', 'KAl(SO4)2·12H2O'],
      ['blue vitriol', 'CuSO4·5H2O'],
      ['muriatic acid', 'HCl'],
      ['bleach', 'NaClO'],
      ['washing soda', 'Na2CO3·10H2O'],
      ["Glauber's salt", 'Na2SO4·10H2O'],
      ['sal ammoniac', 'NH4Cl'],
      ["Mohr's salt", '(NH4)2Fe(SO4)2·6H2O'],
      ['isopropyl alcohol', 'C3H8O'],
      ['glycerine', 'C3H8O3'],
    ];
    for (const [name, f] of shelf) expect([name, readName(name).hill]).toEqual([name, hill(f)]);
  });

  it('says that bleach and muriatic acid are solutions whose strength is on the label', () => {
    const bleach = readName('bleach');
    expect(bleach.solution?.typical).toMatch(/%/);
    expect(bleach.notes.join(' ')).toMatch(/from the label/);
    expect(readName('muriatic acid').solution).toBeDefined();
    expect(readName('sodium hypochlorite').solution).toBeUndefined();
  });

  it('is tolerant of case, spacing, hyphens and British or American spelling', () => {
    for (const n of [
      'Copper (II) Sulphate Penta-hydrate',
      'COPPER(II) SULFATE PENTAHYDRATE',
      'copper(II)sulfate pentahydrate',
      'copper(2+) sulfate pentahydrate',
      'cupric sulphate pentahydrate',
      'copper(II) sulfate—water (1/5)',
    ])
      expect([n, readName(n).hill]).toEqual([n, 'CuH10O9S']);
    expect(readName('aluminum sulfate').hill).toBe(hill('Al2(SO4)3'));
    expect(readName('cesium chloride').hill).toBe('ClCs');
    expect(readName('dinitrogen pentoxide').hill).toBe('N2O5');
    expect(readName('sodium hydrogen carbonate').hill).toBe(hill('NaHCO3'));
    expect(readName('potassium hexacyanoferrate(III)').hill).toBe(hill('K3[Fe(CN)6]'));
    expect(readName('ferrous sulfate heptahydrate').hill).toBe(hill('FeSO4·7H2O'));
  });

  it('reads acids and shelf names with their water, and solutions named as such', () => {
    expect(readName('citric acid monohydrate').hill).toBe(hill('C6H8O7·H2O'));
    expect(readName('borax pentahydrate').hill).toBe(hill('Na2B4O7·5H2O'));
    const naoh = readName('sodium hydroxide solution');
    expect([naoh.formula, !!naoh.solution]).toEqual(['NaOH', true]);
    expect(readName('aqueous ammonia').formula).toBe('NH3');
  });

  it('reads counted cations and double salts', () => {
    expect(readName('disodium hydrogen phosphate dodecahydrate').hill).toBe(hill('Na2HPO4·12H2O'));
    expect(readName('trisodium citrate dihydrate').hill).toBe(hill('Na3C6H5O7·2H2O'));
    expect(readName('aluminium potassium sulfate dodecahydrate').hill).toBe(hill('KAl(SO4)2·12H2O'));
    expect(readName('ammonium iron(II) sulfate hexahydrate').hill).toBe(hill('(NH4)2Fe(SO4)2·6H2O'));
    expect(readName('disodium chloride').status).toBe('unknown'); // 2 Na+ do not balance one Cl−
  });

  it('never takes a near name for another compound: chlorate/chloride, sulfite/sulfate, nitrite/nitrate', () => {
    const cases: Array<[string, string[]]> = [
      ['sodium chlorade', ['NaCl', 'NaClO3']],
      ['sodium sulfote', ['Na2SO4', 'Na2SO3']],
      ['potassium nitrte', ['KNO2', 'KNO3']],
      ['sodium chloricde', ['NaCl']],
      ['nickel sulfate hexahydrat', ['NiSO4·6H2O']], // a misspelt hydrate word is not taken either
    ];
    for (const [name, expected] of cases) {
      const r = readName(name);
      expect(r.status).toBe('near');
      expect(r.formula).toBeUndefined();
      for (const f of expected) expect(r.candidates.map((c) => c.formula)).toContain(f);
      expect(r.message).toMatch(/never taken/);
    }
  });

  it('reads an exact name as itself and shows the compounds a letter or two away', () => {
    const chlorite = readName('sodium chlorite');
    expect(chlorite.formula).toBe('NaClO2');
    expect(chlorite.lookalikes.map((l) => l.formula).sort()).toEqual(['NaCl', 'NaClO3']);
    const sulfite = readName('sodium sulfite');
    expect(sulfite.formula).toBe('Na2SO3');
    expect(sulfite.lookalikes.map((l) => l.formula)).toContain('Na2SO4');
    expect(readName('potassium nitrate').lookalikes.map((l) => l.formula)).toContain('KNO2');
  });

  it('asks which state where the name gives none and the metal has two usual ones', () => {
    const r = readName('iron chloride');
    expect(r.status).toBe('ambiguous');
    expect(r.candidates.map((c) => c.formula)).toEqual(['FeCl2', 'FeCl3']);
    expect(r.message).toMatch(/iron\(II\) chloride.*iron\(III\) chloride/);
    // Copper sulfate is copper(II) sulfate in the trade (common practice); the note says so.
    const cu = readName('copper sulfate');
    expect(cu.formula).toBe('CuSO4');
    expect(cu.notes.join(' ')).toMatch(/copper\(II\)/);
  });

  it('refuses a state the metal does not have, and a hydrate without its number', () => {
    expect(readName('iron(VII) chloride').message).toMatch(/not a known state of iron/);
    expect(readName('sodium sulfate hydrate').status).toBe('unknown');
    expect(readName('').status).toBe('unknown');
    expect(readName('xyzzy').status).toBe('unknown');
  });

  it('gives the offsets of the name in the text', () => {
    const r = readName('  borax ');
    expect([r.start, r.end]).toEqual([2, 7]);
  });
});

describe('a name at the start of a batch line', () => {
  it('ends the name before the amount and keeps digits that belong to the name', () => {
    const a = nameAtStart('nickel sulfate hexahydrate 25 g');
    expect([a.status, a.formula, a.end]).toEqual(['exact', 'NiSO4·6H2O', 26]);
    const b = nameAtStart('propan-2-ol 10 mL');
    expect([b.hill, b.end]).toEqual(['C3H8O', 11]);
    const c = nameAtStart('caustic soda 40g');
    expect([c.formula, c.end]).toEqual(['NaOH', 12]);
  });

  it('reports a near name over all the words before the amount', () => {
    const r = nameAtStart('sodium chlorade 5 g');
    expect([r.status, r.start, r.end]).toEqual(['near', 0, 15]);
  });
});

describe('names by prefix (for completion)', () => {
  it('finds shelf and systematic names by their beginning, case and spacing ignored', () => {
    expect(namesByPrefix('Epsom').map((e) => e.formula)).toContain('MgSO4·7H2O');
    const nickel = namesByPrefix('nickel(II) sul');
    expect(nickel.map((e) => e.name)).toContain('nickel(II) sulfate');
    expect(namesByPrefix('caustic').map((e) => e.name)).toEqual(['caustic potash', 'caustic soda']);
    expect(namesByPrefix('zzzz')).toEqual([]);
    expect(namesByPrefix('s', 5)).toHaveLength(5);
  });
});
