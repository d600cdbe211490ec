/**
 * GHS hazard statements on the card. Wording against the GHS (UN, Rev. 9, 2021, Annex 3) and CLP
 * Annex III; classifications against the harmonised entries of CLP Annex VI (all from memory, as the
 * table is); pictograms against the labels those classifications give (CLP Article 26 precedence).
 */
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { ghsFor, H_STATEMENTS, PICTOGRAMS, SDS_NOTE } from '../../server/src/chem/safety';
import { pictogramsFor } from '../../server/src/chem/safety/ghs';

const codes = (f: string) => ghsFor(analyseFormula(f))?.statements.map((s) => s.code) ?? [];
const pictos = (f: string) => ghsFor(analyseFormula(f))?.pictograms.map((p) => p.code) ?? [];

describe('standard wording (GHS Rev. 9 Annex 3; CLP Annex III)', () => {
  it('statements read as the regulation words them', () => {
    expect(H_STATEMENTS.H314).toBe('Causes severe skin burns and eye damage.');
    expect(H_STATEMENTS.H300).toBe('Fatal if swallowed.');
    expect(H_STATEMENTS.H350i).toBe('May cause cancer by inhalation.');
    expect(H_STATEMENTS.H360FD).toBe('May damage fertility. May damage the unborn child.');
    expect(H_STATEMENTS.H272).toBe('May intensify fire; oxidiser.');
    expect(H_STATEMENTS.H410).toBe('Very toxic to aquatic life with long lasting effects.');
    expect(H_STATEMENTS.EUH032).toBe('Contact with acids liberates very toxic gas.');
  });
  it('pictograms by their GHS names', () => {
    expect(PICTOGRAMS.GHS05).toBe('corrosion');
    expect(PICTOGRAMS.GHS06).toBe('skull and crossbones');
    expect(PICTOGRAMS.GHS08).toBe('health hazard');
  });
  it('every statement used has its wording', () => {
    for (const f of ['NiSO4', 'K2Cr2O7', 'NaCN', 'HNO3', 'H2O2', 'NaOCl', 'KMnO4', 'CrO3', 'HF', 'NaN3', 'Na2S2O5'])
      for (const s of ghsFor(analyseFormula(f))!.statements) expect(s.text, `${f} ${s.code}`).toMatch(/\.$/);
  });
});

describe('the substances the brief names (CLP Annex VI, from memory)', () => {
  it('nickel salts: sensitiser, carcinogen by inhalation, reproductive toxicant', () => {
    for (const f of ['NiSO4·6H2O', 'NiCl2·6H2O', 'Ni(NO3)2·6H2O', 'NiCO3'])
      expect(codes(f), f).toEqual(expect.arrayContaining(['H317', 'H334', 'H350i', 'H360D', 'H372']));
  });
  it('cobalt salts: H350i, H360F', () => {
    for (const f of ['CoSO4·7H2O', 'CoCl2·6H2O']) expect(codes(f), f).toEqual(expect.arrayContaining(['H317', 'H334', 'H350i', 'H360F']));
  });
  it('chromium(VI): H340, H350 (and the family for an unlisted chromate)', () => {
    for (const f of ['K2Cr2O7', 'Na2Cr2O7·2H2O', 'CrO3', 'Na2CrO4', 'SrCrO4']) expect(codes(f), f).toEqual(expect.arrayContaining(['H340']));
    expect(ghsFor(analyseFormula('SrCrO4'))!.basis).toMatch(/family/);
  });
  it('lead and cadmium', () => {
    expect(codes('Pb(NO3)2')).toEqual(expect.arrayContaining(['H360Df', 'H373']));
    expect(codes('PbCl2')).toEqual(expect.arrayContaining(['H360Df']));
    expect(codes('CdSO4')).toEqual(expect.arrayContaining(['H340', 'H350', 'H360FD']));
  });
  it('boric acid and the borates: H360FD', () => {
    for (const f of ['H3BO3', 'Na2B4O7·10H2O', 'Na2B4O7·5H2O']) expect(codes(f), f).toEqual(['H360FD']);
    expect(ghsFor(analyseFormula('H3BO3'))!.signalWord).toBe('Danger');
  });
  it('cyanides: fatal by every route, EUH032', () => {
    for (const f of ['NaCN', 'KCN', 'CuCN', 'Zn(CN)2']) expect(codes(f), f).toEqual(expect.arrayContaining(['H300', 'H310', 'H330', 'EUH032']));
  });
  it('fluorides; calcium fluoride, insoluble, is not given the soluble salts’ toxicity', () => {
    expect(codes('NaF')).toContain('H301');
    expect(codes('HF')).toEqual(expect.arrayContaining(['H300', 'H310', 'H330', 'H314']));
    expect(codes('CsF')).toContain('H301');
    expect(ghsFor(analyseFormula('CaF2'))).toBeNull();
  });
  it('strong acids and bases: H314', () => {
    for (const f of ['HCl', 'H2SO4', 'HNO3', 'HClO4', 'NaOH', 'KOH']) expect(codes(f), f).toContain('H314');
  });
  it('oxidisers: H271 or H272', () => {
    for (const f of ['KClO3', 'NaClO3', 'KMnO4', 'H2O2', 'NaNO3', 'KNO3', 'K2S2O8', 'NaNO2', 'Ca(OCl)2'])
      expect(
        codes(f).some((c) => c === 'H271' || c === 'H272'),
        f,
      ).toBe(true);
  });
  it('anhydrous aluminium chloride reacts with water; its hexahydrate is not given that', () => {
    expect(codes('AlCl3')).toContain('EUH014');
    expect(codes('AlCl3·6H2O')).not.toContain('EUH014');
  });
});

describe('pictograms and signal word from the statements (GHS Annex 1; CLP Article 26)', () => {
  it('the labels of the harmonised classifications', () => {
    expect(pictos('NaOH')).toEqual(['GHS05']);
    expect(pictos('H2SO4')).toEqual(['GHS05']);
    expect(pictos('HNO3')).toEqual(['GHS03', 'GHS05', 'GHS06']);
    expect(pictos('NiSO4·6H2O')).toEqual(['GHS07', 'GHS08', 'GHS09']);
    expect(pictos('K2Cr2O7')).toEqual(['GHS03', 'GHS05', 'GHS06', 'GHS08', 'GHS09']);
    expect(pictos('NaCN')).toEqual(['GHS05', 'GHS06', 'GHS08', 'GHS09']);
    expect(pictos('H3BO3')).toEqual(['GHS08']);
  });
  it('no exclamation mark beside the skull for acute toxicity, nor beside corrosion for irritation', () => {
    expect(pictogramsFor(['H301', 'H302'])).toEqual(['GHS06']);
    expect(pictogramsFor(['H314', 'H319'])).toEqual(['GHS05']);
    expect(pictogramsFor(['H314', 'H335'])).toEqual(['GHS05', 'GHS07']);
    expect(pictogramsFor(['H334', 'H317'])).toEqual(['GHS08']);
  });
  it('signal words', () => {
    expect(ghsFor(analyseFormula('NaOH'))!.signalWord).toBe('Danger');
    expect(ghsFor(analyseFormula('KNO3'))!.signalWord).toBe('Warning');
  });
});

describe('always deferring to the SDS', () => {
  it('every reading is marked from memory and ends with the SDS sentence', () => {
    for (const f of ['NiSO4', 'NaOH', 'KNO3', 'NiCO3', 'C6H8O7']) {
      const r = ghsFor(analyseFormula(f))!;
      expect(r.fromMemory).toBe(true);
      expect(r.sds).toBe(SDS_NOTE);
      expect(r.basis).toMatch(/from memory/);
    }
    expect(SDS_NOTE).toMatch(/check the supplier's SDS/);
  });
  it('substances the tool does not know get no reading rather than a guess', () => {
    for (const f of ['NaCl', 'C12H22O11', 'KCl', 'Xx']) expect(ghsFor(analyseFormula(f)), f).toBeNull();
  });
});
