/**
 * The memos of the chemistry core that follow from a formula's analysis (its cautions, what it gives in
 * water) are kept by formula text in the shared bounded cache, not by the analysis object: an equal
 * analysis made again (other settings, or after the formula cache was dropped) finds them, and clearing the
 * formula cache clears them too. Ions by common practice (IUPAC Red Book 2005 names: sulfate SO₄²⁻).
 */
import { describe, expect, it } from 'vitest';
import { analyseFormula, clearFormulaCache } from '../../server/src/chem/analyse';
import { dissociate } from '../../server/src/chem/batch';
import { analysisDerivedCache, clearAnalysisDerived } from '../../server/src/chem/cache';
import { cautionsFor } from '../../server/src/chem/cautions';
import { DEFAULT_CHEM_SETTINGS } from '../../server/src/chem/settings';

const other = { ...DEFAULT_CHEM_SETTINGS, ionicAbove: 2.0 };

describe('memos of what follows from an analysis', () => {
  it('find an equal analysis made under other settings: one dissociation and one caution list per formula text', () => {
    const a = analyseFormula('Na2SO4');
    const b = analyseFormula('Na2SO4', other);
    expect(a).not.toBe(b);
    expect(dissociate(b)).toBe(dissociate(a));
    expect(dissociate(a).ions.map((i) => [i.key, i.count])).toEqual([
      ['Na^+', 2],
      ['SO4^2-', 1],
    ]);
    const k1 = analyseFormula('K2Cr2O7');
    const k2 = analyseFormula('K2Cr2O7', other);
    expect(cautionsFor(k2)).toBe(cautionsFor(k1));
    expect(cautionsFor(k1).map((c) => c.cls)).toContain('carcinogen');
  });

  it('are cleared with the formula cache, and give the same answer after', () => {
    const before = dissociate(analyseFormula('CaCl2'));
    const cautions = cautionsFor(analyseFormula('HF'));
    clearFormulaCache();
    const after = dissociate(analyseFormula('CaCl2'));
    expect(after).not.toBe(before);
    expect(after).toEqual(before);
    expect(cautionsFor(analyseFormula('HF'))).not.toBe(cautions);
    expect(cautionsFor(analyseFormula('HF'))).toEqual(cautions);
  });

  it('are bounded like every other cache, and emptied by clearAnalysisDerived', () => {
    const c = analysisDerivedCache<number>(2, 1e6);
    for (const k of ['a', 'b', 'c']) c.set(k, 1);
    expect(c.size).toBe(2);
    clearAnalysisDerived();
    expect(c.size).toBe(0);
  });
});
