/**
 * The presentation model: numbers, charges and formulas written one way (service/format.ts), the table
 * columns defined once and rendered to Markdown, HTML and text (service/columns.ts), and quick fixes in the
 * notation the user typed.
 */
import { load } from 'cheerio';
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { analyseDocument } from '../../server/src/service/document';
import { codeActions } from '../../server/src/service/actions';
import { batchColumns, countedRows, formulaColumns, htmlTable, ION_COLUMNS, markdownTable, textTable } from '../../server/src/service/columns';
import { chargeNumber, energy, fixed, formulaText, massText, MINUS, percent, perLitreText, sig, signed } from '../../server/src/service/format';
import { DEFAULT_SETTINGS } from '../../server/src/service/settings';
import { batchTable, batchText } from '../../server/src/service/tables';

const applyEdits = (
  text: string,
  edits: Array<{ range: { start: { line: number; character: number }; end: { line: number; character: number } }; newText: string }>,
) => {
  const lines = text.split('\n');
  const off = (p: { line: number; character: number }) => lines.slice(0, p.line).reduce((s, l) => s + l.length + 1, 0) + p.character;
  let out = text;
  for (const e of [...edits].reverse()) out = out.slice(0, off(e.range.start)) + e.newText + out.slice(off(e.range.end));
  return out;
};

describe('numbers, charges and formulas', () => {
  it('one minus sign (U+2212) in every written-out number and charge', () => {
    expect(MINUS).toBe('\u2212');
    expect(signed(-2)).toBe('−2');
    expect(signed(8 / 3)).toBe('+2.667');
    expect(signed(0)).toBe('0');
    expect(chargeNumber(-1)).toBe('−1');
    expect(sig(-0.5)).toBe('−0.5');
    expect(sig(1.2346e-5)).toBe('1.235×10⁻⁵');
    expect(sig(2.5e7)).toBe('2.500×10⁷');
  });

  it('significant figures, settings decimals and thousands (narrow no-break space from 10 000)', () => {
    // 0.1000 M NaCl in 500 mL: 0.05 × 58.44 = 2.922 g (common textbook example)
    expect(sig(0.05 * 58.44)).toBe('2.922');
    expect(sig(2000)).toBe('2000');
    expect(sig(12500)).toBe('12\u202f500');
    expect(fixed(58.4428, 2)).toBe('58.44');
    expect(fixed(58.4428, 3)).toBe('58.443');
    expect(percent(0.8)).toBe('80.0 %');
    expect(sig(null)).toBe('—');
    expect(massText(240)).toBe('240 g');
    expect(massText(0.002)).toBe('2 mg');
    expect(massText(1.5e-5)).toBe('15 µg');
    expect(perLitreText(53.59)).toBe('53.6 g/L');
    expect(perLitreText(0.00125)).toBe('1.25 mg/L');
    expect(energy(787.4, DEFAULT_SETTINGS)).toBe('787 kJ/mol');
    expect(energy(787.4, { ...DEFAULT_SETTINGS, energyUnit: 'kcal/mol' })).toBe('188 kcal/mol'); // 787.4 / 4.184 = 188.2
  });

  it('formulas in Unicode display, whatever notation they were typed in', () => {
    expect(formulaText('SO4^2-')).toBe('SO₄²⁻');
    expect(formulaText('CuSO4*5H2O')).toBe('CuSO₄·5H₂O');
    expect(formulaText('Ca(NO3)2')).toBe('Ca(NO₃)₂');
  });
});

describe('the columns, rendered three ways from one definition', () => {
  const doc = analyseDocument('```batch\nname: Rinse K-1\nvolume: 500 mL\nNaCl 0.1000 M\nK2SO4 1 g\n```\n', 'markdown');
  const b = doc.batches[0].analysis;
  const cols = batchColumns(b, DEFAULT_SETTINGS);

  it('the same headers and cells in Markdown, HTML and text', () => {
    const md = markdownTable(cols, countedRows(b));
    const $ = load(htmlTable(cols, countedRows(b)).value);
    const text = textTable(cols, countedRows(b));
    const heads = cols.map((c) => c.head);
    expect(md.split('\n')[0]).toBe(`| ${heads.join(' | ')} |`);
    expect(
      $('thead th')
        .map((_, e) => $(e).text())
        .get(),
    ).toEqual(heads);
    expect(text.split('\n')[0].split(/\s{2,}/)).toEqual(heads);
    // 0.05 mol NaCl: 2.922 g
    expect(md).toContain('| NaCl | 0.1000 M | 58.44 | 2.922 |');
    expect($('tbody tr').first().find('td').eq(3).text()).toBe('2.922');
    expect(text.split('\n')[2]).toMatch(/^NaCl\s+0\.1000 M\s+58\.44\s+2\.922\s/);
  });

  it('numbers right-aligned in all three', () => {
    const md = markdownTable(cols, countedRows(b));
    expect(md.split('\n')[1]).toBe('|---|---|---:|---:|---:|---:|---:|');
    const $ = load(htmlTable(cols, countedRows(b)).value);
    expect($('tbody tr').first().find('td').eq(2).hasClass('iw-n')).toBe(true);
    const [head, , row] = textTable(cols, countedRows(b)).split('\n');
    // The right edge of the molar mass column is where its header ends.
    expect(row.indexOf('58.44') + '58.44'.length).toBe(head.indexOf('Molar mass (g/mol)') + 'Molar mass (g/mol)'.length);
  });

  it('the ion table writes charges with the true minus sign in Markdown too', () => {
    const md = markdownTable(ION_COLUMNS, b.ions);
    expect(md).toContain('| Cl⁻ | −1 |');
    expect(md).not.toMatch(/\| -1 \|/);
    expect(batchTable(b)).toContain('| SO₄²⁻ | −2 |');
  });

  it('the plain-text batch shows every line, the ions and the ionic strength', () => {
    const incomplete = analyseDocument('```batch\nvolume: 1 L\nNaCl 1 g\nKCl 3 furlongs\n```\n', 'markdown').batches[0].analysis;
    const t = batchText(incomplete);
    expect(t.split('\n')[0]).toBe('Batch, final volume 1 L — INCOMPLETE: 1 line not counted');
    expect(t).toContain('not counted: KCl 3 furlongs');
    expect(t).toMatch(/Na⁺\s+\+1/);
  });

  it('the formula table: the same columns in the inserted Markdown and the report', () => {
    const a = analyseFormula('NaCl');
    const md = markdownTable(formulaColumns(DEFAULT_SETTINGS), [a]);
    expect(md.split('\n')[0]).toBe(
      '| Formula | Molar mass (g/mol) | Bond type | ΔEN (pair) | Ionic character | Lattice energy | Oxidation states | Charge balance |',
    );
    expect(md).toContain('| NaCl | 58.44 | ionic |');
    expect(md).toContain('Na +1, Cl −1');
  });
});

describe('quick fixes in the notation typed', () => {
  const fix = (text: string, formula: string) => {
    const doc = analyseDocument(text, 'markdown');
    const at = text.indexOf(formula);
    return codeActions(doc, at, at, ['quickfix'])[0];
  };

  it('ASCII typed, ASCII written: CaNO3 → Ca(NO3)2; the title in Unicode', () => {
    const text = 'Whiteboard: `CaNO3`\n';
    const a = fix(text, 'CaNO3');
    expect(a.title).toBe('Replace with Ca(NO₃)₂');
    expect(applyEdits(text, a.edits)).toBe('Whiteboard: `Ca(NO3)2`\n');
  });

  it('Unicode typed, Unicode written: CaNO₃ → Ca(NO₃)₂', () => {
    const text = 'Whiteboard: `CaNO₃`\n';
    const a = fix(text, 'CaNO₃');
    expect(a.title).toBe('Replace with Ca(NO₃)₂');
    expect(applyEdits(text, a.edits)).toBe('Whiteboard: `Ca(NO₃)₂`\n');
  });

  it('an ion with the wrong charge: superscripts stay superscripts, carets stay carets', () => {
    // Sulfate is SO₄²⁻ (IUPAC Red Book 2005).
    const uni = 'Rinse: `SO₄³⁻`\n';
    expect(applyEdits(uni, fix(uni, 'SO₄³⁻').edits)).toBe('Rinse: `SO₄²⁻`\n');
    const caret = 'Rinse: `SO4^3-`\n';
    expect(applyEdits(caret, fix(caret, 'SO4^3-').edits)).toBe('Rinse: `SO4^2-`\n');
  });

  it('an equation is balanced in the arrow and formulas typed; the title and message in Unicode', () => {
    const text = 'Line: `H2 + O2 -> H2O`\n';
    const a = fix(text, 'H2 + O2');
    expect(a.title).toBe('Balance the equation: 2 H₂ + O₂ → 2 H₂O');
    expect(applyEdits(text, a.edits)).toBe('Line: `2 H2 + O2 -> 2 H2O`\n');
    expect(a.fixes?.diagnostic.message).toContain('Balanced: 2 H₂ + O₂ → 2 H₂O');
    const eq = 'Line: `Fe^3+ + Cu <=> Fe^2+ + Cu^2+`\n';
    expect(fix(eq, 'Fe^3+').title).toBe('Balance the equation: 2 Fe³⁺ + Cu ⇌ 2 Fe²⁺ + Cu²⁺');
  });
});
