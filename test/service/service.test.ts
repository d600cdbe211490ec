/**
 * The language service, called directly on notes with a `|` cursor marker (hover text, diagnostics,
 * code actions and their edits, symbols, code lenses). Chemistry values are checked elsewhere against
 * their sources; here the editor behaviour is checked.
 */
import { describe, expect, it } from 'vitest';
import { codeActions, sectionTableEdit, tableEditForSelection, type EditOutcome } from '../../server/src/service/actions';
import { documentDiagnostics } from '../../server/src/service/diagnostics';
import { analyseDocument } from '../../server/src/service/document';
import { hover } from '../../server/src/service/hover';
import { codeLenses, documentSymbols } from '../../server/src/service/symbols';
import type { NotesLanguage } from '../../server/src/notes/types';

function at(src: string, language: NotesLanguage = 'markdown') {
  const offset = src.indexOf('|');
  const text = offset >= 0 ? src.slice(0, offset) + src.slice(offset + 1) : src;
  return { doc: analyseDocument(text, language), offset, text };
}
const hoverAt = (src: string, language: NotesLanguage = 'markdown') => {
  const { doc, offset } = at(src, language);
  return hover(doc, offset)?.markdown ?? null;
};

/** Apply LSP-style edits (line/character) to a text. */
function applyEdits(
  text: string,
  edits: Array<{ range: { start: { line: number; character: number }; end: { line: number; character: number } }; newText: string }>,
) {
  const doc = analyseDocument(text, 'markdown');
  const list = edits.map((e) => ({ s: doc.lines.offsetAt(e.range.start), e: doc.lines.offsetAt(e.range.end), t: e.newText })).sort((a, b) => b.s - a.s);
  let out = text;
  for (const x of list) out = out.slice(0, x.s) + x.t + out.slice(x.e);
  return out;
}

describe('hover', () => {
  it('shows the card of a formula in a code span: formula, molar mass, balance, bonding, lattice energy', () => {
    const md = hoverAt('Weighed `Na|Cl` for the rinse.')!;
    // Identity first: formula, name, molar mass.
    // The trade's name beside the systematic one (common salt).
    expect(md).toMatch(/^\*\*NaCl\*\* · sodium chloride \(common salt\) · \*\*58\.44 g\/mol\*\*/);
    expect(md).toContain('Na⁺ + Cl⁻');
    expect(md).toContain('Bonding: **ionic**');
    expect(md).toContain('Lattice energy');
    expect(md).toContain('Born–Haber');
    expect(md).toContain('Inputs:');
  });

  it('shows subscripts and the hydrate, and says a lattice estimate is an estimate', () => {
    const md = hoverAt('The bath uses `CuSO4.|5H2O`.')!;
    expect(md).toContain('CuSO₄·5H₂O');
    expect(md).toContain('(estimate)');
    expect(md).toContain('for CuSO₄');
  });

  it('warns in the card when the formula is not charge-balanced, with the fix', () => {
    const md = hoverAt('Old label: `CaN|O3`.')!;
    expect(md).toContain('Not charge-balanced');
    expect(md).toContain('Ca²⁺ with one NO₃⁻ leaves +1');
    expect(md).toContain('Try **Ca(NO₃)₂**');
  });

  it('finds the formula after multi-byte text (UTF-16 offsets)', () => {
    const md = hoverAt('Zürich 🧪 notes: `K|Cl` weighed.')!;
    expect(md).toMatch(/^\*\*KCl\*\*/);
  });

  it('reads bare formulas in prose but not ordinary words', () => {
    expect(hoverAt('We dissolved Na|Cl in water.')).toMatch(/^\*\*NaCl\*\*/);
    expect(hoverAt('I think C|O is fine.')).toBeNull();
    expect(hoverAt('I| think so.')).toBeNull();
    expect(hoverAt('This is O|K now.')).toBeNull();
    expect(hoverAt('I|n the morning.')).toBeNull();
    expect(hoverAt('A|s usual.')).toBeNull();
    // Sample and batch labels are not sign-first ions in prose; in code they are.
    expect(hoverAt('Sealing bath S|-2 ran hot.')).toBeNull();
    expect(hoverAt('Vial B-1|2 was empty.')).toBeNull();
    expect(hoverAt('Sulfide `S|-2` in the rinse.')).toMatch(/^\*\*S²⁻\*\*/);
    expect(hoverAt('the iron is Fe3|+ here')).toMatch(/^\*\*Fe³⁺\*\*/);
  });

  it('on a batch line: moles, mass, concentration', () => {
    const md = hoverAt('```batch\nvolume: 500 mL\nNa|Cl 0.1 M\n```\n')!;
    expect(md).toContain('weigh **2.922 g**');
    expect(md).toContain('0.05 mol');
    expect(md).toContain('**0.1 M** in 500 mL');
  });

  it('on a batch header: the whole batch summary', () => {
    const md = hoverAt('```ba|tch\nname: Rinse\nvolume: 1 L\nNaCl 5.844 g\nKCl 0.7455 g\n```\n')!;
    expect(md).toMatch(/^\*\*Rinse\*\* · 2 ingredients/);
    // The pH first (neutral salts of strong acids and bases in water: pH 7.00 at 25 °C, pKw 13.995 — CRC Handbook "Ion product of water").
    expect(md.split('\n')[2]).toMatch(/^\*\*pH 7\.00 \(equilibrium estimate\)\*\*/);
    expect(md).toContain('Nominal ionic strength');
    expect(md).toContain('The ions and ionic strength above are nominal');
  });

  it('on an equation: balanced or not, and the balanced form', () => {
    expect(hoverAt('`2 H2 + O2 -|> 2 H2O`')).toContain('**Balanced** ✓');
    const md = hoverAt('`Fe + O2 -|> Fe2O3`')!;
    expect(md).toContain('**Not balanced**');
    expect(md).toContain('4 Fe + 3 O2 -> 2 Fe2O3');
  });

  it('shows cautions for hazardous substances', () => {
    expect(hoverAt('```batch\nvolume: 1 L\nK2Cr2|O7 1 g\n```')).toContain('chromium(VI)');
  });

  it('works in .fnote notes', () => {
    expect(hoverAt('formula: NaCl, K|Br\n', 'fnote')).toMatch(/^\*\*KBr\*\*/);
    expect(hoverAt('batch Rinse\n  volume: 1 L\n  Na|Cl 1 g\nend\n', 'fnote')).toContain('weigh **1 g**');
  });
});

describe('a batch with lines in error (an invented desmut bath whose acids are written by volume)', () => {
  const DESMUT = '# Desmut\n\n```batch\nname: Desmut D-4\nvolume: 2 L\nHNO3 120 gal @ 68%\n(NH4)HF2 30 g\nH2SO4 80 gal\nFe2(SO4)3 33 g\n```\n';
  const doc = analyseDocument(DESMUT, 'markdown');

  it('the summary hover counts what is counted, lists what is not with the reason, and keeps the acid caution', () => {
    const md = hoverAt(DESMUT.replace('```batch', '```ba|tch'))!;
    expect(md).toMatch(/^\*\*Desmut D-4\*\* · 2 ingredients, 2 lines not counted — incomplete · 63 g to weigh · 2 L/);
    expect(md).toContain("- `HNO3 120 gal @ 68%` — Unknown unit 'gal'");
    expect(md).toContain("- `H2SO4 80 gal` — Unknown unit 'gal'");
    expect(md).toContain('⚠ HNO₃ (line not counted), H₂SO₄ (line not counted): strong acid');
  });

  it('a hover on a line not counted says so, why, and its cautions, over the exact line', () => {
    const { doc: d, offset } = at(DESMUT.replace('H2SO4 80', 'H2S|O4 80'));
    const h = hover(d, offset)!;
    expect(h.markdown).toMatch(/^`H2SO4 80 gal` — \*\*not counted\*\*/);
    expect(h.markdown).toContain("Unknown unit 'gal'");
    expect(h.markdown).toContain('strong acid');
    expect(h.range).toEqual({ start: { line: 7, character: 0 }, end: { line: 7, character: 12 } });
  });

  it('the same in .fnote, indented, with the range on the line as written', () => {
    const { doc: d, offset } = at('batch Desmut D-4\n  volume: 2 L\n  HN|O3 120 gal\nend\n', 'fnote');
    const h = hover(d, offset)!;
    expect(h.markdown).toContain('**not counted**');
    expect(h.range).toEqual({ start: { line: 2, character: 2 }, end: { line: 2, character: 14 } });
  });

  it('the code lens and the outline say the batch is incomplete', () => {
    const [lens] = codeLenses(doc);
    expect(lens.title).toMatch(/^2 ingredients · ⚠ 2 lines not counted \(incomplete\) · 63 g to weigh · I = /);
    expect(lens.title).toContain('⚠ cautions');
    expect(documentSymbols(doc)[0].children[0].detail).toBe('2 ingredients, 2 lines not counted — incomplete, 2 L');
  });

  it('the inserted table marks the batch incomplete and lists the lines not counted, with the acid caution', () => {
    const act = codeActions(doc, DESMUT.indexOf('(NH4)'), DESMUT.indexOf('(NH4)'), ['refactor']).find((a) => a.kind === 'refactor.rewrite')!;
    const out = applyEdits(DESMUT, act.edits);
    expect(out).toContain('**Desmut D-4, final volume 2 L** — **incomplete: 2 lines not counted** (computed by Ionwright)');
    expect(out).toContain("- `HNO3 120 gal @ 68%` — Unknown unit 'gal'");
    expect(out).toContain('- HNO₃ (line not counted), H₂SO₄ (line not counted): strong acid');
  });

  it('an ingredient hover gives both shares where the batch has a total: 5 g NaCl of 6.25 g weighed, of a 250 g total', () => {
    const md = hoverAt('```batch\ntotal: 250 g\nNa|Cl 2 wt%\nKCl 0.5 wt%\n```\n')!;
    expect(md).toContain('80.0 % of the weighed mass');
    expect(md).toContain('2.0 % of the total 250 g');
    const sum = hoverAt('```ba|tch\ntotal: 250 g\nNaCl 2 wt%\nKCl 0.5 wt%\n```\n')!;
    expect(sum).toContain('| Ingredient | To weigh (g) | mol | M | Share of weighed mass | Share of total |');
    expect(sum).toContain('| NaCl | 5 | 0.08556 | — | 80.0 % | 2.0 % |');
  });

  it('an ingredient hover gives its solubility in water and the estimate for the batch', () => {
    const md = hoverAt('```batch\nvolume: 100 mL\nNa|Cl 40 g\n```\n')!;
    // 36 g per 100 g water at 25 °C: the table value (from memory); 40 g in about 60 g of water.
    expect(md).toContain('⚠ Solubility of NaCl in water: 36 g per 100 g water at 25 °C — from memory');
    expect(md).toContain('about 66.7 g per 100 g water here (estimate)');
  });
});

describe('diagnostics', () => {
  it('point at the exact characters, with LSP shape', () => {
    const text = 'Intro é 🧪\nUsed `NaXx` and `CaNO3`, then `Fe + O2 -> Fe2O3`.\n';
    const d = documentDiagnostics(analyseDocument(text, 'markdown'));
    const by = Object.fromEntries(d.map((x) => [x.code, x]));
    const line1 = text.split('\n')[1];
    expect(by['unknown-element'].range).toEqual({ start: { line: 1, character: line1.indexOf('Xx') }, end: { line: 1, character: line1.indexOf('Xx') + 2 } });
    expect(by['unknown-element'].severity).toBe(1);
    expect(by['charge-imbalance'].range.start.character).toBe(line1.indexOf('CaNO3'));
    expect(by['charge-imbalance'].severity).toBe(2);
    expect(by['unbalanced-equation'].range.start.character).toBe(line1.indexOf('Fe +'));
    expect(by['unbalanced-equation'].data).toMatchObject({ balanced: '4 Fe + 3 O2 -> 2 Fe2O3' });
    expect(d.every((x) => x.source === 'ionwright')).toBe(true);
  });

  it('leave other fenced code alone', () => {
    expect(documentDiagnostics(analyseDocument('```python\nx = NaXx\n```\n    indented `Xx`\n', 'markdown'))).toEqual([]);
  });
});

describe('code actions', () => {
  it('replace a mis-balanced formula with each suggestion', () => {
    const text = 'Bottle 14: `Al(OH)2` and `FeCl`.\n';
    const doc = analyseDocument(text, 'markdown');
    const s = text.indexOf('Al(OH)2');
    const acts = codeActions(doc, s, s);
    // The title in Unicode notation; the edit in the notation typed (checked below).
    expect(acts[0]).toMatchObject({ title: 'Replace with Al(OH)₃', kind: 'quickfix', isPreferred: true });
    expect(applyEdits(text, acts[0].edits)).toBe('Bottle 14: `Al(OH)3` and `FeCl`.\n');
    const f = text.indexOf('FeCl');
    expect(
      codeActions(doc, f, f)
        .filter((a) => a.kind === 'quickfix')
        .map((a) => a.title),
    ).toEqual(['Replace with FeCl₂', 'Replace with FeCl₃']);
  });

  it('fix an unknown symbol by its case', () => {
    const text = 'Label says `NaCL`.\n';
    const acts = codeActions(analyseDocument(text, 'markdown'), text.indexOf('CL'), text.indexOf('CL'), ['quickfix']);
    expect(applyEdits(text, acts[0].edits)).toBe('Label says `NaCl`.\n');
  });

  it('balance an equation in place', () => {
    const text = 'Whiteboard: `Fe + O2 -> Fe2O3`\n';
    const acts = codeActions(analyseDocument(text, 'markdown'), 14, 14, ['quickfix']);
    expect(acts[0].title).toBe('Balance the equation: 4 Fe + 3 O₂ → 2 Fe₂O₃');
    expect(applyEdits(text, acts[0].edits)).toBe('Whiteboard: `4 Fe + 3 O2 -> 2 Fe2O3`\n');
  });

  it('fix a formula inside a batch block', () => {
    const text = '```batch\nvolume: 1 L\nCaNO3 1 g\n```\n';
    const doc = analyseDocument(text, 'markdown');
    const s = text.indexOf('CaNO3');
    const fix = codeActions(doc, s, s, ['quickfix'])[0];
    expect(applyEdits(text, fix.edits)).toContain('Ca(NO3)2 1 g');
  });

  it('fix a formula on a batch line that is not counted (its unit is wrong too)', () => {
    const text = '```batch\nvolume: 1 L\nCaNO3 1 gallon\n```\n';
    const doc = analyseDocument(text, 'markdown');
    const s = text.indexOf('CaNO3');
    const fix = codeActions(doc, s, s, ['quickfix'])[0];
    expect(applyEdits(text, fix.edits)).toContain('Ca(NO3)2 1 gallon');
  });

  it('insert the computed table below the batch or the paragraph', () => {
    const text = '# Trial\n\n```batch\nname: A\nvolume: 1 L\nNaCl 1 g\n```\nAfter.\n';
    const doc = analyseDocument(text, 'markdown');
    const act = codeActions(doc, text.indexOf('NaCl'), text.indexOf('NaCl'), ['refactor']).find((a) => a.kind === 'refactor.rewrite')!;
    const out = applyEdits(text, act.edits);
    expect(out.indexOf('**A, final volume 1 L**')).toBeGreaterThan(out.indexOf('```\n'));
    expect(out.indexOf('**A, final volume')).toBeLessThan(out.indexOf('After.'));
    expect(out.startsWith(text.slice(0, text.indexOf('After.')))).toBe(true);

    const para = 'We used `NaCl` and `KBr` today.\nSecond line.\n\nNext.\n';
    const p = codeActions(analyseDocument(para, 'markdown'), 9, 9, ['refactor.rewrite'])[0];
    const out2 = applyEdits(para, p.edits);
    expect(out2).toMatch(/Second line\.\n\n\| Formula \|/);
    expect(out2.endsWith('\n\nNext.\n')).toBe(true);
  });

  it('the table of a selection lists just the selected formulas; an empty selection takes the section', () => {
    const text = '# A\nUse `NaCl`, `KCl`.\n# B\nUse `LiF`.\n';
    const doc = analyseDocument(text, 'markdown');
    const sel = editOf(tableEditForSelection(doc, text.indexOf('`NaCl`'), text.indexOf('`NaCl`') + 6));
    expect(sel.newText).toContain('NaCl');
    expect(sel.newText).not.toContain('KCl');
    const sec = editOf(sectionTableEdit(doc, text.indexOf('LiF')));
    expect(sec.newText).toContain('Formulas — B');
    expect(sec.newText).toContain('LiF');
    expect(sec.newText).not.toContain('NaCl');
  });
});

function editOf(o: EditOutcome) {
  if (!('edit' in o)) throw new Error(`no edit: ${o.reason}`);
  return o.edit;
}

describe('symbols and lenses', () => {
  const text = '# Bench\n\n```batch\nname: Rinse A\nvolume: 1 L\nNaCl 1 g\n```\n\n## Reactions\n\n`2 H2 + O2 -> 2 H2O`\n';
  const doc = analyseDocument(text, 'markdown');
  it('put sections, batches and reactions in the outline', () => {
    const syms = documentSymbols(doc);
    expect(syms.map((s) => s.name)).toEqual(['Bench', 'Reactions']);
    expect(syms[0].children.map((c) => c.name)).toEqual(['Rinse A']);
    expect(syms[1].children.map((c) => c.name)).toEqual(['2 H2 + O2 -> 2 H2O']);
  });
  it('give each batch a lens with its totals', () => {
    const [lens] = codeLenses(doc);
    expect(lens.title).toMatch(/^1 ingredient · 1 g to weigh · I = 0\.0171 M/);
    expect(lens.range.start.line).toBe(2);
  });
});
