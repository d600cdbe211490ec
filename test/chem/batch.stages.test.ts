/**
 * The stages of a batch (chem/batch/): each returns plain data that keeps the line it came from, so a line
 * can be followed from reading to the result, and the stages run one by one give what `analyseBatch` gives.
 * Recipes are invented (a fictional anodising line); NaCl 58.44 g/mol, KCl 74.55 g/mol from IUPAC/CIAAW
 * 2021 abridged atomic weights (Na 22.990, K 39.098, Cl 35.45).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseBatch } from '../../server/src/chem/batch';
import { batchLines } from '../fixtures/batch';
import { computeAmounts } from '../../server/src/chem/batch/amounts';
import { checkBatch } from '../../server/src/chem/batch/checks';
import { mixIons } from '../../server/src/chem/batch/mix';
import { readLines } from '../../server/src/chem/batch/read';
import { DEFAULT_CHEM_SETTINGS } from '../../server/src/chem/settings';

const lines = batchLines;

const KCL = 39.098 + 35.45;
const SEAL = ['name: Seal S-3', 'volume: 2 L', 'NaCl 0.1 M   # brine', 'volume: 3 L', 'KCl 14.91 g', 'NaXx 1 g', '', 'Na^+ 0.05 M'].join('\n');

describe('the stages of a batch, one by one', () => {
  const read = readLines(lines(SEAL), null, DEFAULT_CHEM_SETTINGS);
  const amounts = computeAmounts(read);
  const mix = mixIons(amounts.counted, read.headers.volumeL);

  it('reading: the counted headers, and every other line with its source as written', () => {
    expect(read.headers).toMatchObject({ name: 'Seal S-3', volumeL: 2, totalMassG: null });
    expect(read.lines.map((l) => [l.kind, SEAL.slice(l.source.start, l.source.end)])).toEqual([
      ['ingredient', 'NaCl 0.1 M   # brine'],
      ['header', 'volume: 3 L'],
      ['ingredient', 'KCl 14.91 g'],
      ['ingredient', 'NaXx 1 g'],
      ['ingredient', 'Na^+ 0.05 M'],
    ]);
    expect(read.diagnostics.map((d) => d.code)).toEqual(['batch-header']);
  });

  it('amounts: 0.1 M in 2 L is 0.2 mol NaCl (11.69 g); 14.91 g KCl is 0.2 mol; the line in error is set aside with its reason', () => {
    expect(amounts.counted.map((c) => c.line.formula.text)).toEqual(['NaCl', 'KCl', 'Na^+']);
    expect(amounts.counted[0].moles).toBeCloseTo(0.2, 12);
    expect(amounts.counted[0].massG).toBeCloseTo(0.2 * 58.44, 2);
    expect(amounts.counted[1].moles).toBeCloseTo(14.91 / KCL, 4);
    expect(amounts.skipped.map((s) => [s.kind, s.text, s.code])).toEqual([
      ['header', 'volume: 3 L', 'batch-header'],
      ['ingredient', 'NaXx 1 g', 'unknown-element'],
    ]);
  });

  it('mix: the ions of the counted lines over 2 L, and the listed Na⁺ left without a counter-ion', () => {
    const c = Object.fromEntries(mix.ions.map((i) => [i.key, i.concentrationM]));
    expect(c['Na^+']).toBeCloseTo(0.1 + 0.05, 12);
    expect(c['K^+']).toBeCloseTo(14.91 / KCL / 2, 4);
    expect(mix.diagnostics.map((d) => [d.code, SEAL.slice(d.start, d.end)])).toEqual([['batch-charge', 'Na^+ 0.05 M']]);
  });

  it('run in order, give what analyseBatch gives', () => {
    const checks = checkBatch(amounts, read.headers);
    const b = analyseBatch(lines(SEAL));
    expect(b.ingredients.map((i) => i.moles)).toEqual(amounts.counted.map((x) => x.moles));
    expect(b.ions).toEqual(mix.ions);
    expect(b.cautions).toEqual(checks.batchCautions);
    const all = [...read.diagnostics, ...amounts.diagnostics, ...mix.diagnostics, ...checks.diagnostics].sort((x, y) => x.start - y.start);
    expect(b.diagnostics).toEqual(all);
  });
});

describe('property: a line followed through the stages', () => {
  const piece = fc.constantFrom(
    'NaCl 5 g',
    'KCl 0.1 M',
    'CuSO4 · 5H2O 2 g',
    'NaCl 5 g @ 105%',
    'H2SO4 10 mL',
    'KBr',
    'volume: 1 L',
    'volume: 2 L',
    'total: 10 g',
    'name: A',
    '# note',
    '',
    'SO4^2- 1 mM',
    'BaSO4 1 g',
  );
  it('every ingredient line read is counted or set aside, never both, and every result points back at its line', () => {
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 10 }), (list) => {
        const block = list.join('\n');
        const read = readLines(lines(block), null, DEFAULT_CHEM_SETTINGS);
        const amounts = computeAmounts(read);
        expect(amounts.counted.length + amounts.skipped.length).toBe(read.lines.length);
        const b = analyseBatch(lines(block));
        for (const i of b.ingredients) expect(block.slice(i.formulaStart, i.formulaEnd)).toBe(i.formulaText);
        for (const s of b.skipped) expect(block.slice(s.lineStart, s.lineEnd)).toBe(s.text);
        expect(b.ingredients.length + b.skipped.length).toBe(read.lines.length);
      }),
      { seed: 20261203, numRuns: 300 },
    );
  });
});
