import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { COMMON_HYDRATES } from '../../server/src/chem/data/hydrates';
import { createLanguageService, type TextEdit } from '../../server/src/service/languageService';
import { analyseDocument } from '../../server/src/service/document';
import { parseScaleTarget } from '../../server/src/service/batchEdits';

const service = createLanguageService();

/** Apply LSP edits (non-overlapping) to a text. */
function applyEdits(doc: ReturnType<typeof analyseDocument>, edits: TextEdit[]): string {
  const spans = edits.map((e) => ({ s: doc.lines.offsetAt(e.range.start), e: doc.lines.offsetAt(e.range.end), t: e.newText })).sort((a, b) => b.s - a.s);
  let text = doc.text;
  for (const x of spans) text = text.slice(0, x.s) + x.t + text.slice(x.e);
  return text;
}

const at = (doc: ReturnType<typeof analyseDocument>, needle: string) => {
  const o = doc.text.indexOf(needle);
  return { start: doc.lines.positionAt(o), end: doc.lines.positionAt(o) };
};

describe('another form of a weighed ingredient', () => {
  const note = ['# Bath N-4', '', '```batch', 'name: Nickel strike', 'volume: 1 L', 'NiSO4 150 g', 'H3BO3 30.0 g @ 99.5%', '```', ''].join('\n');
  const doc = analyseDocument(note, 'markdown');

  it('offers the hexahydrate and heptahydrate for NiSO4, and rewrites only the formula and the amount', () => {
    const actions = service.codeActions(doc, at(doc, 'NiSO4 150'));
    const hexa = actions.find((a) => a.title.includes('hexahydrate'));
    expect(hexa, actions.map((a) => a.title).join('\n')).toBeDefined();
    // m = 150 g × M(NiSO4·6H2O) / M(NiSO4) = 150 × 262.85 / 154.75 (CIAAW 2021 standard atomic weights).
    expect(hexa!.title).toBe('I have the hexahydrate: weigh 254.8 g NiSO₄·6H₂O');
    const out = applyEdits(doc, hexa!.edits);
    expect(out).toBe(note.replace('NiSO4 150 g', 'NiSO4·6H2O 254.8 g'));
    expect(actions.some((a) => a.title.includes('heptahydrate'))).toBe(true);
  });

  it('goes back from the hexahydrate to the anhydrous salt with the same moles', () => {
    const n2 = note.replace('NiSO4 150 g', 'NiSO4·6H2O 254.8 g');
    const d2 = analyseDocument(n2, 'markdown');
    const back = service.codeActions(d2, at(d2, 'NiSO4·6H2O')).find((a) => a.title.includes('anhydrous'));
    expect(back?.title).toBe('I have the anhydrous salt: weigh 150.0 g NiSO₄');
    expect(applyEdits(d2, back!.edits)).toBe(note.replace('NiSO4 150 g', 'NiSO4 150.0 g'));
    const moles = (t: string) => analyseDocument(t, 'markdown').batches[0].analysis.ingredients[0].moles as number;
    // Within the rounding of 4 significant figures.
    expect(Math.abs(moles(applyEdits(d2, back!.edits)) / moles(n2) - 1)).toBeLessThan(5e-4);
  });

  it('offers another assay where the line has one: m2 = m1 · a1 / a2', () => {
    const actions = service.codeActions(doc, at(doc, 'H3BO3'));
    const a98 = actions.find((a) => a.title.startsWith('The jar is 98 %'));
    // 30.0 g × 99.5 / 98 = 30.459 g → 30.46 g (4 significant figures, common practice).
    expect(a98?.title).toBe('The jar is 98 %: weigh 30.46 g H₃BO₃');
    expect(applyEdits(doc, a98!.edits)).toBe(note.replace('H3BO3 30.0 g @ 99.5%', 'H3BO3 30.46 g @ 98%'));
    // No assay change is offered on a line without one.
    expect(service.codeActions(doc, at(doc, 'NiSO4 150')).some((a) => a.title.startsWith('The jar'))).toBe(false);
  });

  it('offers nothing of the kind on a concentration line', () => {
    const d = analyseDocument('```batch\nvolume: 1 L\nNiSO4 0.5 M\n```\n', 'markdown');
    expect(service.codeActions(d, at(d, 'NiSO4')).filter((a) => a.kind === 'quickfix')).toEqual([]);
  });

  it('keys every hydrate row on a formula that reads as that salt', () => {
    for (const hill of Object.keys(COMMON_HYDRATES)) expect(analyseFormula(hill).ok, hill).toBe(true);
    expect(analyseFormula('NiSO4').hill in COMMON_HYDRATES).toBe(true);
    expect(analyseFormula('Na2HPO4').hill in COMMON_HYDRATES).toBe(true);
  });
});

describe('scaling a batch', () => {
  const note = ['```batch', 'name: Rinse R-9', 'volume: 500 mL', 'KH2PO4 3.40 g', 'Na2HPO4·7H2O 6.70 g', 'NaCl 0.10 M', 'H2SO4 2.5 mmol', '```', ''].join('\n');
  const doc = analyseDocument(note, 'markdown');
  const conc = (t: string) => analyseDocument(t, 'markdown').batches[0].analysis.ingredients.map((i) => i.concentrationM as number);

  it('offers ×2, ×5, ×10, ½ and to 1 L, 10 L, 100 L (without repeating a size)', () => {
    const titles = service
      .codeActions(doc, at(doc, 'KH2PO4'))
      .filter((a) => a.title.startsWith('Scale'))
      .map((a) => a.title);
    expect(titles).toEqual([
      "Scale 'Rinse R-9' to 1 L (×2)",
      "Scale 'Rinse R-9' to 2.5 L (×5)",
      "Scale 'Rinse R-9' to 5 L (×10)",
      "Scale 'Rinse R-9' to 250 mL (×0.5)",
      "Scale 'Rinse R-9' to 10 L (×20)",
      "Scale 'Rinse R-9' to 100 L (×200)",
    ]);
  });

  for (const target of ['×2', '0.5', '10 L', '100 L', '37 mL'])
    it(`keeps every concentration within the rounding (${target})`, () => {
      const r = service.scaleBatchEdit(doc, at(doc, 'KH2PO4').start, target);
      if (!('edits' in r)) throw new Error(r.reason);
      const out = applyEdits(doc, r.edits);
      const before = conc(note);
      const after = conc(out);
      // 4 significant figures of a mass, 3 of a volume: within 0.1 %; the small masses of the 37 mL batch
      // are read to 0.1 mg (0.25 g KH2PO4: 0.04 %).
      after.forEach((c, k) => expect(Math.abs(c / before[k] - 1), `${target} line ${k}`).toBeLessThan(2e-3));
      // The concentration line is untouched; only amounts and the volume change.
      expect(out).toContain('NaCl 0.10 M');
      expect(out.split('\n').length).toBe(note.split('\n').length);
    });

  it('rewrites the volume header and the amounts exactly', () => {
    const r = service.scaleBatchEdit(doc, at(doc, 'KH2PO4').start, '10 L');
    if (!('edits' in r)) throw new Error(r.reason);
    expect(applyEdits(doc, r.edits)).toBe(
      note.replace('500 mL', '10 L').replace('3.40 g', '68.00 g').replace('6.70 g', '134.0 g').replace('2.5 mmol', '50 mmol'),
    );
  });

  it('rewrites a `water to` line too, and refuses a batch with a line it could not read', () => {
    const t = '```batch\nname: W\nNaCl 5 g\nwater to 1 L\n```\n';
    const d = analyseDocument(t, 'markdown');
    const r = service.scaleBatchEdit(d, at(d, 'NaCl').start, '×3');
    if (!('edits' in r)) throw new Error(r.reason);
    expect(applyEdits(d, r.edits)).toContain('water to 3 L');
    const bad = analyseDocument('```batch\nvolume: 1 L\nNaCl 5 g\nXq 2 g\n```\n', 'markdown');
    const refused = service.scaleBatchEdit(bad, at(bad, 'NaCl').start, '×2');
    expect('reason' in refused && refused.reason).toMatch(/could not be read/);
  });

  it('reads the targets a user types, and says what it expects otherwise', () => {
    expect(parseScaleTarget('×3')).toEqual({ factor: 3 });
    expect(parseScaleTarget('0,5')).toEqual({ factor: 0.5 });
    expect(parseScaleTarget('500 mL')).toEqual({ volumeL: 0.5 });
    expect(parseScaleTarget('5 kg')).toEqual({ totalMassG: 5000 });
    expect(parseScaleTarget('lots')).toMatchObject({ reason: expect.stringContaining('no size') });
    expect(parseScaleTarget('0')).toMatchObject({ reason: expect.stringContaining('above zero') });
  });
});
