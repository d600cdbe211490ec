/**
 * Every line of a batch shows: counted, or listed as not counted with the reason (chem/batch/amounts.ts). One rule
 * for all line errors, the first header counting, and the two shares (of the weighed mass, of the total).
 * Recipes are invented (a fictional metal-finishing shop). Molar masses in hand calculations are sums of
 * IUPAC/CIAAW 2021 abridged atomic weights (H 1.0080, N 14.007, O 15.999, F 18.998, Na 22.990, S 32.06,
 * Cl 35.45, K 39.098, Fe 55.845).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseBatch } from '../../server/src/chem/batch';
import { batchLines } from '../fixtures/batch';

/** Lines of a block with their offsets, as the scanner hands them over (block starting at offset 0). */
const lines = batchLines;
const batch = (block: string, openName: string | null = null) => analyseBatch(lines(block), openName);

const NH4HF2 = 14.007 + 5 * 1.008 + 2 * 18.998;
const Fe2SO43 = 2 * 55.845 + 3 * (32.06 + 4 * 15.999);

/** An invented desmut bath whose two acid lines are written by volume, which this batch syntax cannot weigh. */
const DESMUT = ['name: Desmut D-4', 'volume: 2 L', 'HNO3 120 gal @ 68%   # nitric, by volume', '(NH4)HF2 30 g', 'H2SO4 80 gal', 'Fe2(SO4)3 33 g'].join('\n');

describe('a desmut bath with two acid lines in error', () => {
  const b = batch(DESMUT);

  it('counts the two weighed salts and lists the two acid lines as not counted, with the reason', () => {
    expect(b.ingredients.map((i) => i.formulaText)).toEqual(['(NH4)HF2', 'Fe2(SO4)3']);
    expect(b.skipped.map((s) => s.text)).toEqual(['HNO3 120 gal @ 68%   # nitric, by volume', 'H2SO4 80 gal']);
    for (const s of b.skipped) {
      expect(s.kind).toBe('ingredient');
      expect(s.code).toBe('batch-unit');
      expect(s.reason).toContain("Unknown unit 'gal'");
      expect(DESMUT.slice(s.lineStart, s.lineEnd)).toBe(s.text);
    }
    // 30 g + 33 g is what is weighed; the shares are of those 63 g only.
    expect(b.ingredients.reduce((s, i) => s + (i.massG ?? 0), 0)).toBeCloseTo(63, 12);
    expect(b.ingredients[0].moles).toBeCloseTo(30 / NH4HF2, 6);
    expect(b.ingredients[1].moles).toBeCloseTo(33 / Fe2SO43, 6);
  });

  it('keeps the diagnostics on the exact characters of each unit', () => {
    const units = b.diagnostics.filter((d) => d.code === 'batch-unit');
    expect(units.map((d) => DESMUT.slice(d.start, d.end))).toEqual(['gal', 'gal']);
    expect(units.every((d) => d.severity === 'error')).toBe(true);
  });

  it('does not lose the acid cautions of the lines not counted (their formulas are readable)', () => {
    // One line per caution, naming every substance it applies to.
    expect(b.cautions.map((c) => c.text)).toContain(
      'HNO₃ (line not counted), H₂SO₄ (line not counted): strong acid: corrosive; add acid to water, never water to acid',
    );
    expect(b.skipped[0].cautions.map((c) => c.cls)).toEqual(['strong acid']);
  });
});

describe('one rule for every line error: not counted, listed with the reason, the finding on its characters', () => {
  it.each([
    // [block, code, the characters the finding covers, what the reason says]
    ['volume: 1 L\nNaCl 5 g @ 105%', 'batch-amount', '@ 105%', 'Assay 105 % must be above 0'],
    ['volume: 1 L\nNaCl 5 gallons', 'batch-unit', 'gallons', "Unknown unit 'gallons'"],
    ['volume: 1 L\nNaCl 5 g extra', 'batch-syntax', 'extra', "Unexpected 'extra'"],
    ['volume: 1 L\nNaCl', 'batch-amount', 'NaCl', 'needs an amount and a unit'],
    ['volume: 1 L\nNaCl -5 g', 'batch-amount', '-5', 'not a positive number'],
    ['volume: 1 L\nNaCl 5', 'batch-unit', '5', 'needs a unit'],
    ['NaCl 0.1 M', 'batch-no-volume', '0.1 M', "needs the batch's final volume"],
    ['NaCl 2 wt%', 'batch-no-total', '2 wt%', "needs the batch's total mass"],
    ['total: 10 g\nNaCl 120 wt%', 'batch-amount', '120 wt%', 'more than the whole batch'],
    ['volume: 1 L\nNaXx 5 g', 'unknown-element', 'Xx', 'Xx'],
    ['volume: 1 L\nCa(NO3 5 g', 'malformed-formula', '(', ''],
    ['volume: 1 L\n   NaCl 5 g @ 105%', 'batch-amount', '@ 105%', 'Assay'],
  ])('%j: %s on %j', (block, code, text, reason) => {
    const b = batch(block);
    const d = b.diagnostics.find((x) => x.code === code);
    expect(d, JSON.stringify(b.diagnostics)).toBeDefined();
    expect(block.slice(d!.start, d!.end)).toBe(text);
    expect(d!.severity).toBe('error');
    expect(b.ingredients).toEqual([]);
    expect(b.skipped).toHaveLength(1);
    expect(b.skipped[0].code).toBe(code);
    expect(b.skipped[0].reason).toContain(reason);
    expect(block.slice(b.skipped[0].lineStart, b.skipped[0].lineEnd)).toBe(b.skipped[0].text);
    expect(b.ionicStrengthM ?? 0).toBe(0);
  });

  it('an assay in error no longer counts the line with the assay dropped (it was counted at 100 % before)', () => {
    const b = batch('volume: 1 L\nNaCl 5 g @ 105%\nKCl 1 g');
    expect(b.ingredients.map((i) => i.formulaText)).toEqual(['KCl']);
    expect(b.ingredients[0].massFraction).toBe(1);
  });

  it('a warning does not set a line aside: CaNO3 is counted as written, with its charge warning', () => {
    const b = batch('volume: 1 L\nCaNO3 1 g');
    expect(b.skipped).toEqual([]);
    expect(b.ingredients).toHaveLength(1);
    expect(b.diagnostics.map((d) => [d.code, d.severity])).toEqual([['charge-imbalance', 'warning']]);
  });

  it('a line that is not counted with a formula that cannot be read carries no cautions and no analysis', () => {
    const b = batch('volume: 1 L\nK2Cr2Xx 1 g');
    expect(b.skipped[0].analysis).toBeUndefined();
    expect(b.cautions).toEqual([]);
  });

  it('a hazardous substance on a line without an amount still brings its caution', () => {
    const b = batch('volume: 1 L\nK2Cr2O7\nNaCl 1 g');
    expect(b.skipped[0].code).toBe('batch-amount');
    expect(b.cautions.map((c) => c.text)).toContain('K₂Cr₂O₇ (line not counted): chromium(VI): carcinogenic and sensitising');
  });

  it('a header that cannot be read is listed too; a later readable one counts', () => {
    const b = batch('volume: 2 gallons\nvolume: 1 L\nNaCl 1 g');
    expect(b.volumeL).toBe(1);
    expect(b.skipped.map((s) => [s.kind, s.text, s.code])).toEqual([['header', 'volume: 2 gallons', 'batch-unit']]);
    expect(b.diagnostics.filter((d) => d.code === 'batch-header')).toEqual([]);
  });

  it('text after a volume is an error on that text, not silently ignored', () => {
    const block = 'volume: 1 L final\nNaCl 1 g';
    const b = batch(block);
    const d = b.diagnostics.find((x) => x.code === 'batch-syntax')!;
    expect(block.slice(d.start, d.end)).toBe('final');
    expect(b.volumeL).toBeNull();
    expect(b.skipped[0].kind).toBe('header');
  });

  it('a hydrate written with a space is not read as an amount without a word: the hint says how to write it', () => {
    const block = 'volume: 20 L\nNa2SiO3 5H2O 200 g';
    const b = batch(block);
    const d = b.diagnostics.find((x) => x.code === 'batch-amount')!;
    expect(block.slice(d.start, d.end)).toBe('5H2O');
    expect(d.message).toContain("'Na2SiO3·5H2O'");
    expect(b.skipped[0].reason).toBe(d.message);
  });

  it('ingredients that weigh more than the total get a warning on the total: 60 wt% + 50 wt% of 100 g', () => {
    const block = 'total: 100 g\nNaCl 60 wt%\nKCl 50 wt%';
    const d = batch(block).diagnostics.find((x) => x.code === 'batch-total')!;
    expect(d.severity).toBe('warning');
    expect(block.slice(d.start, d.end)).toBe('100 g');
    expect(d.message).toContain('110 %');
    expect(batch('total: 100 g\nNaCl 60 wt%\nKCl 40 wt%').diagnostics).toEqual([]);
  });

  it('a block made only of errors counts nothing and lists every line', () => {
    const b = batch('NaCl 1 parsec\nKCl\n# a comment\n\nNaXx 2 g');
    expect(b.ingredients).toEqual([]);
    expect(b.skipped.map((s) => s.text)).toEqual(['NaCl 1 parsec', 'KCl', 'NaXx 2 g']);
  });
});

describe('a header given twice: the first one counts, the second is flagged on its exact range', () => {
  it.each([
    ['name: Desmut D-4\nname: Desmut D-5\nNaCl 1 g', 'name: Desmut D-5', "'name:' is given twice; the first one counts."],
    ['volume: 1 L\nvolume: 2 L\nNaCl 1 g', 'volume: 2 L', "'volume:' is given twice; the first one counts."],
    ['total: 100 g\ntotal: 200 g  # from the old sheet\nNaCl 1 wt%', 'total: 200 g', "'total:' is given twice; the first one counts."],
  ])('%j', (block, range, message) => {
    const b = batch(block);
    const d = b.diagnostics.find((x) => x.code === 'batch-header')!;
    expect(d.severity).toBe('warning');
    expect(block.slice(d.start, d.end)).toBe(range);
    expect(d.message).toBe(message);
    expect(b.skipped.map((s) => s.code)).toEqual(['batch-header']);
  });

  it('uses the first name, as the message says (it used the second before)', () => {
    expect(batch('name: Desmut D-4\nname: Desmut D-5').name).toBe('Desmut D-4');
    expect(batch('volume: 1 L\nvolume: 2 L').volumeL).toBe(1);
    expect(batch('total: 100 g\ntotal: 200 g').totalMassG).toBe(100);
  });

  it('a name on the opening line (`.fnote` batch Rinse, or after ```batch) is the first name', () => {
    const block = '  name: Other\n  NaCl 1 g';
    const b = batch(block, 'Rinse R-2');
    expect(b.name).toBe('Rinse R-2');
    const d = b.diagnostics.find((x) => x.code === 'batch-header')!;
    expect(block.slice(d.start, d.end)).toBe('name: Other');
    expect(d.message).toBe("This batch is already named 'Rinse R-2' on its opening line; the first name counts.");
  });
});

describe('two shares with two names: of the weighed mass, and of the total', () => {
  it('without total: the share of the weighed mass; no share of a total', () => {
    const b = batch('volume: 1 L\nNaCl 3 g\nKCl 1 g');
    expect(b.ingredients.map((i) => i.massFraction)).toEqual([0.75, 0.25]);
    expect(b.ingredients.map((i) => i.fractionOfTotal)).toEqual([null, null]);
  });

  it('with total: both — 5 g NaCl and 1.25 g KCl in a 250 g batch are 80 % / 20 % of what is weighed, 2 % / 0.5 % of the total', () => {
    const b = batch('total: 250 g\nNaCl 2 wt%\nKCl 0.5 wt%');
    expect(b.ingredients[0].massFraction).toBeCloseTo(0.8, 12);
    expect(b.ingredients[1].massFraction).toBeCloseTo(0.2, 12);
    expect(b.ingredients[0].fractionOfTotal).toBeCloseTo(0.02, 12);
    expect(b.ingredients[1].fractionOfTotal).toBeCloseTo(0.005, 12);
  });

  it('the share of the total is of what is weighed: 10 g of a 98 % salt in a 200 g batch is 5 % of the total', () => {
    const b = batch('total: 200 g\nNaCl 10 g @ 98%');
    expect(b.ingredients[0].fractionOfTotal).toBeCloseTo(0.05, 12);
  });
});

describe('property: every non-blank line is either counted, read as a header, or listed as not counted — once', () => {
  const piece = fc.constantFrom(
    'NaCl 5 g',
    'KCl 0.1 M',
    'CuSO4·5H2O 2 wt%',
    'NaCl 5 g @ 105%',
    'NaCl 5 gallons',
    'NaXx 1 g',
    'H2SO4 10 mL',
    'NaCl',
    '  KBr 2g',
    'volume: 1 L',
    'volume: 2 furlongs',
    'total: 100 g',
    'name: A',
    'name: B',
    '# comment',
    '',
    'Ca(NO3 1 g',
    'NaCl 1 g extra',
    'Na+ 0.1 M',
  );
  it('holds on random blocks, and no error lies on a counted line', () => {
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 12 }), (list) => {
        const block = list.join('\n');
        const b = batch(block);
        const counted = new Set(b.ingredients.map((i) => i.lineStart));
        const skipped = new Set(b.skipped.map((s) => s.lineStart));
        expect(counted.size).toBe(b.ingredients.length);
        expect(skipped.size).toBe(b.skipped.length);
        for (const l of lines(block)) {
          const content = l.text.replace(/#.*$/, '');
          if (!content.trim()) continue;
          const at = l.start + (l.text.length - l.text.trimStart().length);
          const header = /^\s*(name|volume|total)\s*:/i.test(content);
          const n = (counted.has(at) ? 1 : 0) + (skipped.has(at) ? 1 : 0);
          expect(n, `${JSON.stringify(l.text)} in ${JSON.stringify(block)}`).toBe(header && !skipped.has(at) ? 0 : 1);
        }
        for (const d of b.diagnostics.filter((x) => x.severity === 'error')) {
          expect(
            b.ingredients.some((i) => d.start >= i.lineStart && d.start <= i.lineEnd),
            d.message,
          ).toBe(false);
        }
      }),
      { seed: 20261203, numRuns: 400 },
    );
  });
});
