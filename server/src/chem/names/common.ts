/**
 * Names the trade and the shelf use: borax, Epsom salt, caustic soda, soda ash, blue vitriol, bleach;
 * and the substances a formulation names rather than writes (water, ethanol, glycerol, urea).
 *
 * Each row: the names (the first is the one shown beside the systematic name), the formula (ASCII, `·`
 * for water of crystallisation), and a source:
 * - MI: The Merck Index (common and trade names of chemicals), from memory;
 * - RB: IUPAC, Nomenclature of Inorganic Chemistry, Recommendations 2005 (names IUPAC retains: water,
 *   ammonia, hydrazine; IR-6.2.1 parent hydrides);
 * - BB: IUPAC, Nomenclature of Organic Chemistry, Recommendations 2013 (the "Blue Book": ethanol,
 *   propan-2-ol, propane-1,2,3-triol), from memory;
 * - CP: common practice (shelf and trade usage).
 *
 * `iupac`: a name IUPAC itself gives the substance (used on cards where the inorganic rules give none).
 * `byForm`: matched only when written in one of `forms` (an organic Hill formula has isomers).
 * `solution`: the name is of a solution in water, sold at an assay that the label must give; `typical`
 * is the usual range in percent by mass, for the message only.
 */
export interface CommonName {
  names: string[];
  formula: string;
  iupac?: string;
  forms?: string[];
  byForm?: boolean;
  solution?: { typical: string };
  note?: string;
  src: string;
}

export const COMMON_NAMES: CommonName[] = [
  // Shelf names of inorganic salts, oxides and hydroxides.
  { names: ['borax', 'sodium borate decahydrate', 'borax decahydrate'], formula: 'Na2B4O7·10H2O', src: 'MI, CP' },
  { names: ['Epsom salt', 'Epsom salts', 'epsomite'], formula: 'MgSO4·7H2O', src: 'MI, CP' },
  { names: ['caustic soda', 'lye', 'soda lye'], formula: 'NaOH', src: 'MI, CP' },
  { names: ['caustic potash', 'potash lye'], formula: 'KOH', src: 'MI, CP' },
  { names: ['soda ash', 'calcined soda'], formula: 'Na2CO3', src: 'MI, CP' },
  { names: ['washing soda', 'sal soda', 'soda crystals'], formula: 'Na2CO3·10H2O', src: 'MI, CP' },
  { names: ['baking soda', 'bicarbonate of soda', 'sodium bicarbonate'], formula: 'NaHCO3', src: 'MI, CP' },
  { names: ['slaked lime', 'hydrated lime', 'lime water'], formula: 'Ca(OH)2', src: 'MI, CP' },
  { names: ['quicklime', 'burnt lime', 'lime'], formula: 'CaO', src: 'MI, CP' },
  { names: ['chalk', 'limestone', 'calcite', 'whiting'], formula: 'CaCO3', src: 'MI, CP' },
  { names: ['alum', 'potash alum', 'potassium alum'], formula: 'KAl(SO4)2·12H2O', src: 'MI, CP' },
  { names: ['ammonium alum', 'ammonia alum'], formula: 'NH4Al(SO4)2·12H2O', src: 'MI' },
  { names: ['blue vitriol', 'bluestone', 'blue copperas'], formula: 'CuSO4·5H2O', src: 'MI, CP' },
  { names: ['green vitriol', 'copperas'], formula: 'FeSO4·7H2O', src: 'MI, CP' },
  { names: ['white vitriol'], formula: 'ZnSO4·7H2O', src: 'MI' },
  { names: ["Glauber's salt", 'Glauber salt', 'mirabilite'], formula: 'Na2SO4·10H2O', src: 'MI, CP' },
  { names: ['salt cake'], formula: 'Na2SO4', src: 'MI' },
  { names: ['common salt', 'table salt', 'rock salt', 'halite'], formula: 'NaCl', src: 'MI, CP' },
  { names: ['saltpetre', 'nitre', 'niter'], formula: 'KNO3', src: 'MI, CP' },
  { names: ['Chile saltpetre', 'soda nitre'], formula: 'NaNO3', src: 'MI' },
  { names: ['sal ammoniac'], formula: 'NH4Cl', src: 'MI, CP' },
  { names: ["Mohr's salt", 'Mohr salt'], formula: '(NH4)2Fe(SO4)2·6H2O', src: 'MI, CP' },
  { names: ['gypsum'], formula: 'CaSO4·2H2O', src: 'MI, CP' },
  { names: ['plaster of Paris'], formula: 'CaSO4·0.5H2O', src: 'MI, CP' },
  { names: ['potash', 'pearl ash'], formula: 'K2CO3', src: 'MI, CP' },
  { names: ['muriate of potash', 'MOP'], formula: 'KCl', src: 'CP' },
  { names: ['sulfate of potash', 'SOP'], formula: 'K2SO4', src: 'CP' },
  { names: ['trisodium phosphate', 'TSP'], formula: 'Na3PO4', src: 'CP' },
  { names: ['disodium phosphate', 'DSP'], formula: 'Na2HPO4', src: 'CP' },
  { names: ['monosodium phosphate', 'MSP'], formula: 'NaH2PO4', src: 'CP' },
  { names: ['dipotassium phosphate', 'DKP'], formula: 'K2HPO4', src: 'CP' },
  { names: ['monopotassium phosphate', 'MKP'], formula: 'KH2PO4', src: 'CP' },
  { names: ['hypo'], formula: 'Na2S2O3·5H2O', src: 'MI, CP' },
  { names: ['sodium metabisulfite', 'metabisulfite'], formula: 'Na2S2O5', src: 'MI, CP' },
  { names: ['potassium metabisulfite'], formula: 'K2S2O5', src: 'MI, CP' },
  { names: ['Rochelle salt', 'Seignette salt'], formula: 'KNaC4H4O6·4H2O', byForm: false, src: 'MI' },
  { names: ['cream of tartar'], formula: 'KC4H5O6', src: 'MI, CP' },
  { names: ['calomel'], formula: 'Hg2Cl2', src: 'MI' },
  { names: ['corrosive sublimate'], formula: 'HgCl2', src: 'MI' },
  { names: ['red lead', 'minium'], formula: 'Pb3O4', src: 'MI' },
  { names: ['litharge', 'massicot'], formula: 'PbO', src: 'MI' },
  { names: ['sugar of lead'], formula: 'Pb(CH3COO)2·3H2O', src: 'MI' },
  { names: ['lunar caustic'], formula: 'AgNO3', src: 'MI' },
  { names: ["Condy's crystals"], formula: 'KMnO4', src: 'MI' },
  { names: ['titania', 'titanium white', 'rutile'], formula: 'TiO2', src: 'MI, CP' },
  { names: ['silica', 'quartz'], formula: 'SiO2', src: 'MI, CP' },
  { names: ['alumina', 'corundum'], formula: 'Al2O3', src: 'MI, CP' },
  { names: ['magnesia'], formula: 'MgO', src: 'MI, CP' },
  { names: ['milk of magnesia'], formula: 'Mg(OH)2', src: 'MI' },
  { names: ['red prussiate of potash', 'potassium ferricyanide'], formula: 'K3[Fe(CN)6]', src: 'MI, CP' },
  { names: ['yellow prussiate of potash', 'potassium ferrocyanide'], formula: 'K4[Fe(CN)6]·3H2O', src: 'MI, CP' },
  { names: ['ferric chloride'], formula: 'FeCl3', src: 'CP' },
  { names: ['laughing gas', 'nitrous oxide'], formula: 'N2O', src: 'MI, CP' },
  { names: ['nitric oxide'], formula: 'NO', src: 'MI, CP' },
  { names: ['dry ice'], formula: 'CO2', src: 'CP' },
  { names: ['chlorine dioxide'], formula: 'ClO2', src: 'CP' },
  { names: ['dichlorine monoxide', 'chlorine monoxide'], formula: 'Cl2O', src: 'CP' },
  { names: ['dichlorine heptoxide'], formula: 'Cl2O7', src: 'CP' },
  { names: ['iodine pentoxide', 'diiodine pentoxide'], formula: 'I2O5', src: 'CP' },
  { names: ['phosphorus pentoxide'], formula: 'P4O10', src: 'CP' },
  { names: ['disodium EDTA', 'edetate disodium', 'EDTA disodium salt dihydrate'], formula: 'Na2C10H14N2O8·2H2O', src: 'MI, CP' },
  { names: ['EDTA', 'edetic acid', 'ethylenediaminetetraacetic acid'], formula: 'C10H16N2O8', src: 'MI, CP' },
  // Solutions sold under the name of the solution (the assay is on the label).
  {
    names: ['bleach', 'liquid bleach', 'sodium hypochlorite solution', 'Javel water', 'eau de Javel'],
    formula: 'NaClO',
    solution: { typical: '5–15 %: household 5–6 %, trade 10–15 %' },
    note: 'a solution of sodium hypochlorite; its strength falls on standing',
    src: 'MI, CP',
  },
  { names: ['muriatic acid', 'spirit of salt'], formula: 'HCl', solution: { typical: '28–36 %, often 31.45 % (20 °Bé)' }, src: 'MI, CP' },
  { names: ['aqua fortis'], formula: 'HNO3', solution: { typical: '60–70 %' }, src: 'MI' },
  { names: ['oil of vitriol'], formula: 'H2SO4', solution: { typical: '93–98 %' }, src: 'MI' },
  {
    names: ['ammonia solution', 'ammonia water', 'aqua ammonia', 'spirit of hartshorn'],
    formula: 'NH3',
    solution: { typical: '25–30 %' },
    note: 'the assay of ammonia solution is given as NH3',
    src: 'MI, CP',
  },
  {
    names: ['ammonium hydroxide'],
    formula: 'NH4OH',
    solution: { typical: '25–30 % (as NH3)' },
    note: 'sold as ammonia solution, whose assay is given as NH3',
    src: 'MI, CP',
  },
  { names: ['hydrogen peroxide solution', 'peroxide'], formula: 'H2O2', solution: { typical: '3–35 %' }, src: 'CP' },
  // Molecular substances with names IUPAC retains or gives (cards use `iupac`).
  { names: ['water', 'distilled water', 'deionised water', 'DI water', 'purified water'], formula: 'H2O', iupac: 'water', forms: ['H2O'], src: 'RB' },
  { names: ['ammonia'], formula: 'NH3', iupac: 'ammonia', forms: ['NH3'], src: 'RB' },
  { names: ['hydrogen peroxide'], formula: 'H2O2', iupac: 'hydrogen peroxide', forms: ['H2O2'], src: 'RB' },
  { names: ['hydrazine'], formula: 'N2H4', iupac: 'hydrazine', forms: ['N2H4', 'H2NNH2'], src: 'RB' },
  { names: ['methane'], formula: 'CH4', iupac: 'methane', forms: ['CH4'], src: 'RB' },
  { names: ['silane'], formula: 'SiH4', iupac: 'silane', forms: ['SiH4'], src: 'RB' },
  { names: ['phosphine', 'phosphane'], formula: 'PH3', iupac: 'phosphane', forms: ['PH3'], src: 'RB' },
  { names: ['hydrogen sulfide'], formula: 'H2S', iupac: 'hydrogen sulfide', forms: ['H2S'], src: 'RB' },
  { names: ['ozone'], formula: 'O3', iupac: 'trioxygen', forms: ['O3'], src: 'RB' },
  {
    names: ['ethanol', 'ethyl alcohol', 'alcohol', 'grain alcohol'],
    formula: 'C2H5OH',
    iupac: 'ethanol',
    forms: ['C2H5OH', 'CH3CH2OH', 'EtOH'],
    byForm: true,
    src: 'BB, CP',
  },
  { names: ['methanol', 'methyl alcohol', 'wood alcohol'], formula: 'CH3OH', iupac: 'methanol', forms: ['CH3OH', 'MeOH', 'CH4O'], byForm: true, src: 'BB, CP' },
  {
    names: ['isopropanol', 'isopropyl alcohol', 'propan-2-ol', '2-propanol', 'IPA', 'rubbing alcohol'],
    formula: '(CH3)2CHOH',
    iupac: 'propan-2-ol',
    forms: ['(CH3)2CHOH', 'CH3CH(OH)CH3', 'iPrOH'],
    byForm: true,
    src: 'BB, CP',
  },
  {
    names: ['glycerol', 'glycerin', 'propane-1,2,3-triol', 'glycerine'],
    formula: 'C3H5(OH)3',
    iupac: 'propane-1,2,3-triol',
    forms: ['C3H5(OH)3', 'HOCH2CH(OH)CH2OH'],
    byForm: true,
    src: 'BB, CP',
  },
  {
    names: ['ethylene glycol', 'ethane-1,2-diol', 'monoethylene glycol', 'MEG', 'glycol'],
    formula: 'HOCH2CH2OH',
    iupac: 'ethane-1,2-diol',
    forms: ['HOCH2CH2OH', 'C2H4(OH)2', '(CH2OH)2'],
    byForm: true,
    src: 'BB, CP',
  },
  {
    names: ['propylene glycol', 'propane-1,2-diol', 'monopropylene glycol', 'MPG'],
    formula: 'CH3CH(OH)CH2OH',
    iupac: 'propane-1,2-diol',
    forms: ['CH3CH(OH)CH2OH', 'C3H6(OH)2'],
    byForm: true,
    src: 'BB, CP',
  },
  {
    names: ['acetone', 'propan-2-one', 'propanone', 'dimethyl ketone'],
    formula: '(CH3)2CO',
    iupac: 'propan-2-one',
    forms: ['(CH3)2CO', 'CH3COCH3'],
    byForm: true,
    src: 'BB, CP',
  },
  { names: ['urea', 'carbamide'], formula: 'CO(NH2)2', iupac: 'urea', forms: ['CO(NH2)2', '(NH2)2CO'], byForm: true, src: 'BB, CP' },
  // Sugars: named, never named from a formula (C6H12O6 is glucose, fructose or galactose).
  { names: ['glucose', 'dextrose', 'D-glucose'], formula: 'C6H12O6', forms: [], byForm: true, src: 'BB, CP' },
  { names: ['sucrose', 'sugar', 'cane sugar'], formula: 'C12H22O11', forms: [], byForm: true, src: 'BB, CP' },
];
