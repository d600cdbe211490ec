/**
 * What the hover shows first: the formula's identity (formula, name where the reading makes it plain,
 * molar mass) and its charge verdict, then composition, one line each for bonding and lattice energy,
 * the details below the rule; on a batch line, the mass to weigh and, with a volume, g/L of the salt and
 * of its metal. One caution disclaimer per hover.
 * Reference values: IUPAC/CIAAW 2021 abridged standard atomic weights (Ni 58.693, S 32.06, O 15.999,
 * H 1.008).
 */
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { CAUTION_FOOTNOTE } from '../../server/src/chem/cautions';
import { cardText } from '../../server/src/service/card';
import { analyseDocument } from '../../server/src/service/document';
import { formulaCardMarkdown, hover } from '../../server/src/service/hover';
import { nameOf as knownName } from '../../server/src/chem/names';
import { DEFAULT_SETTINGS } from '../../server/src/service/settings';

const hoverAt = (src: string) => {
  const offset = src.indexOf('|');
  const doc = analyseDocument(src.slice(0, offset) + src.slice(offset + 1), 'markdown');
  return hover(doc, offset)?.markdown ?? '';
};

const count = (text: string, part: string) => text.split(part).length - 1;

describe('the formula hover', () => {
  const md = formulaCardMarkdown(analyseFormula('NiSO4·6H2O'), DEFAULT_SETTINGS);
  const [above, below] = md.split('\n---\n');

  it('leads with formula, name and molar mass, then the charge verdict', () => {
    // 58.693 + 32.06 + 4 × 15.999 + 6 × (2 × 1.008 + 15.999) = 262.84 (CIAAW 2021)
    expect(md.split('\n')[0]).toBe('**NiSO₄·6H₂O** · nickel(II) sulfate hexahydrate · **262.84 g/mol**');
    expect(md.split('\n')[2]).toMatch(/^✓ Balanced: Ni²⁺ \+ SO₄²⁻/);
  });

  it('puts composition before bonding and lattice energy, one line each, and the details below the rule', () => {
    const lines = above.split('\n').filter(Boolean);
    const at = (re: RegExp) => lines.findIndex((l) => re.test(l));
    expect(at(/^Composition: /)).toBeGreaterThan(at(/^✓ Balanced/));
    expect(at(/^Bonding: /)).toBeGreaterThan(at(/^Composition: /));
    expect(lines.filter((l) => /^Bonding: /.test(l))).toHaveLength(1);
    expect(lines.filter((l) => /^Lattice energy /.test(l))).toHaveLength(1);
    expect(above).not.toContain('Inputs:');
    expect(below).toContain('Inputs:');
    expect(below).toContain('Hill H12NiO10S');
  });

  it('carries one caution disclaimer', () => {
    expect(count(md, CAUTION_FOOTNOTE)).toBe(1);
    expect(md).toContain('nickel compound');
  });

  it('names only what the reading makes plain (IUPAC 2005 stoichiometric names)', () => {
    expect(knownName(analyseFormula('CuSO4·5H2O'))).toBe('copper(II) sulfate pentahydrate');
    expect(knownName(analyseFormula('NaCl'))).toBe('sodium chloride');
    expect(knownName(analyseFormula('FeCl3'))).toBe('iron(III) chloride');
    expect(knownName(analyseFormula('SO4^2-'))).toBe('sulfate');
    expect(knownName(analyseFormula('Fe3O4'))).toBeUndefined(); // mixed valence: no single Stock number
    expect(knownName(analyseFormula('C6H12O6'))).toBeUndefined();
    expect(knownName(analyseFormula('KAl(SO4)2·12H2O'))).toBeUndefined(); // two cations: not guessed
  });

  it('offers the corrected formula in Unicode notation', () => {
    expect(formulaCardMarkdown(analyseFormula('CaNO3'), DEFAULT_SETTINGS)).toContain('Try **Ca(NO₃)₂**');
  });
});

describe('the batch-line hover', () => {
  const NOTE = '# EN-2 (invented)\n\n```batch\nname: EN-2 make-up\nvolume: 1 L\nNiSO4·6H2O 240 g\nNaH2PO2·H2O 30 g\nPb(NO3)2 2 mg\n```\n';

  it('gives g/L of the salt and of its metal where the batch has a volume', () => {
    const md = hoverAt(NOTE.replace('NiSO4·6H2O 240', 'NiSO4·6H2|O 240'));
    // 240 g in 1 L: 240 g/L of the salt; Ni 240 × 58.693 / 262.85 = 53.59 g/L (by hand, CIAAW 2021 weights).
    expect(md).toContain('**240 g/L** NiSO₄·6H₂O · **53.6 g/L** Ni');
    expect(md.split('\n')[0]).toBe('**NiSO₄·6H₂O** · nickel(II) sulfate hexahydrate · 240 g');
    expect(md.split('\n')[2]).toMatch(/^weigh \*\*240 g\*\*/);
  });

  it('has no g/L without a final volume', () => {
    const md = hoverAt('```batch\nNa|Cl 5 g\n```\n');
    expect(md).not.toContain('g/L');
  });

  it('mg/L below 1 g/L, for the salt and its metal', () => {
    // 2 mg Pb(NO3)2 in 1 L: Pb 2 × 207.2 / 331.2 = 1.25 mg/L (CIAAW 2021: Pb 207.2), below 1 g/L in mg/L;
    // the mass to weigh as a balance shows it.
    const md = hoverAt(NOTE.replace('Pb(NO3)2', 'Pb(NO|3)2'));
    expect(md).toContain('**2 mg/L** Pb(NO₃)₂ · **1.25 mg/L** Pb');
    expect(md).toContain('weigh **2 mg**');
  });

  it('names each metal of a double salt', () => {
    // 10 g KAl(SO4)2·12H2O (474.37 g/mol) in 1 L: K 10 × 39.098 / 474.37 = 824 mg/L, Al 10 × 26.982 / 474.37 = 569 mg/L (by hand, CIAAW 2021)
    const md = hoverAt('```batch\nvolume: 1 L\nKAl(SO4)2·12H|2O 10 g\n```\n');
    expect(md).toContain('**10 g/L** KAl(SO₄)₂·12H₂O · **824 mg/L** K · **569 mg/L** Al');
  });

  it('shows the caution disclaimer once, also in the batch summary with several hazardous substances', () => {
    const line = hoverAt(NOTE.replace('Pb(NO3)2', 'Pb(NO|3)2'));
    expect(count(line, CAUTION_FOOTNOTE)).toBe(1);
    const summary = hoverAt(NOTE.replace('```batch', '```ba|tch'));
    expect(count(summary, CAUTION_FOOTNOTE)).toBe(1);
    expect(summary).toContain('lead compound');
    expect(summary).toContain('nickel compound');
  });
});

describe('oxidation states by site', () => {
  // NH4NO3: N −3 in the ammonium ion, +5 in the nitrate ion (IUPAC Red Book 2005, IR-4.6.1: oxidation
  // numbers are assigned per atom; the average +1 is not a state any N atom has).
  it('the hover and the text card give a split element by site, never only its average', () => {
    const a = analyseFormula('NH4NO3');
    const md = formulaCardMarkdown(a, DEFAULT_SETTINGS);
    expect(md).toContain('Oxidation states: H +1, N −3 in NH₄⁺ and +5 in NO₃⁻, O −2');
    expect(md).not.toMatch(/N \+1\b/);
    expect(cardText(a)).toContain('oxidation       H +1, N −3 in NH₄⁺ and +5 in NO₃⁻, O −2');
    // Fe3O4: one Fe²⁺ and two Fe³⁺ (magnetite, an inverse spinel; Greenwood & Earnshaw, from memory).
    expect(cardText(analyseFormula('Fe3O4'))).toContain('Fe +2 in Fe²⁺ and +3 in 2 Fe³⁺');
  });
});
