/**
 * Incremental re-analysis must give exactly what a full analysis of the new text gives: checked on
 * random edits (fast-check) to generated notes, in Markdown and in .fnote.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { generateNotes } from '../../bench/generate';
import { analyseDocument, diffRegion, updateDocument, type AnalysedDocument } from '../../server/src/service/document';
import { LineIndex } from '../../server/src/service/positions';
import type { NotesLanguage } from '../../server/src/notes/types';

/** Everything observable about an analysed document, as plain data. */
function summary(d: AnalysedDocument) {
  return {
    formulas: d.formulas.map((f) => [f.ref.start, f.ref.end, f.ref.text, f.ref.source, f.analysis.ascii]),
    reactions: d.reactions.map((r) => [r.ref.start, r.ref.end, r.ref.text, r.analysis.balance.status]),
    batches: d.batches.map((b) => [
      b.ref.start,
      b.ref.end,
      b.ref.lines.map((l) => l.start),
      b.analysis.ingredients.map((i) => [i.formulaStart, i.lineEnd, i.moles]),
    ]),
    diagnostics: d.diagnostics.map((x) => [x.start, x.end, x.code]),
    sections: d.sections.map((s) => [s.start, s.end, s.title]),
    lines: d.lines.starts,
  };
}

const edit = fc.record({
  at: fc.double({ min: 0, max: 1, noNaN: true }),
  del: fc.integer({ min: 0, max: 40 }),
  ins: fc
    .array(
      fc.constantFrom(
        'a',
        ' ',
        '\n',
        '\n\n',
        '`',
        '```',
        '```batch\n',
        '```\n',
        '#',
        '# ',
        'NaCl',
        ' 5 g',
        '->',
        '·',
        '\r\n',
        '-',
        '    ',
        'batch\n',
        'end\n',
        'é',
        '🧪',
        'section: X\n',
      ),
      { maxLength: 6 },
    )
    .map((a) => a.join('')),
});

function applyEdit(text: string, e: { at: number; del: number; ins: string }) {
  const at = Math.floor(e.at * text.length);
  return text.slice(0, at) + e.ins + text.slice(Math.min(text.length, at + e.del));
}

const fnoteBase = [
  '# plating notes',
  'section: Strike',
  'formula: NiCl2·6H2O, H3BO3',
  'The bath uses `NiSO4·6H2O`.',
  'batch Strike',
  '  volume: 1 L',
  '  NiSO4·6H2O 240 g',
  'end',
  'reaction: Ni^2+ + 2 e^- -> Ni',
  'section: Converter',
  'reaction: Fe2O3 + H3PO4 -> FePO4 + H2O',
  '',
].join('\n');

describe('incremental re-analysis', () => {
  for (const [language, base] of [
    ['markdown', generateNotes(12_000, 3)],
    ['fnote', fnoteBase.repeat(8)],
  ] as Array<[NotesLanguage, string]>) {
    it(`equals a full analysis after random edits (${language})`, () => {
      fc.assert(
        fc.property(fc.array(edit, { minLength: 1, maxLength: 4 }), (edits) => {
          let doc = analyseDocument(base, language);
          let text = base;
          for (const e of edits) {
            const next = applyEdit(text, e);
            doc = updateDocument(doc, next);
            text = next;
            expect(summary(doc)).toEqual(summary(analyseDocument(text, language)));
          }
        }),
        { numRuns: 150 },
      );
    });
  }

  // A note that is one enormous line is read in pieces (LONG_BLOCK); edits must still equal a full analysis.
  const oneLine = generateNotes(70_000, 11).replace(/\r?\n/g, ' ');
  for (const language of ['markdown', 'fnote'] as NotesLanguage[]) {
    it(`equals a full analysis after random edits to one long line (${language})`, () => {
      fc.assert(
        fc.property(fc.array(edit, { minLength: 1, maxLength: 3 }), (edits) => {
          let doc = analyseDocument(oneLine, language);
          let text = oneLine;
          for (const e of edits) {
            const next = applyEdit(text, e);
            doc = updateDocument(doc, next);
            text = next;
            expect(summary(doc)).toEqual(summary(analyseDocument(text, language)));
          }
        }),
        { numRuns: 25 },
      );
    });
  }

  it('re-reads only the piece of a long line that an edit touched', () => {
    const text = generateNotes(400_000, 13).replace(/\r?\n/g, ' ');
    const doc = analyseDocument(text, 'markdown');
    expect(doc.blocks.length).toBeGreaterThan(10);
    expect(doc.diagnostics.filter((d) => d.code === 'long-paragraph')).toHaveLength(1);
    const at = text.indexOf(' ', text.length >> 1);
    const next = text.slice(0, at) + ' `NaCl`' + text.slice(at);
    const updated = updateDocument(doc, next, { start: at, oldEnd: at, newEnd: at + 7 });
    const before = new Set(doc.blocks.map((b) => b.rel));
    const fresh = updated.blocks.filter((b) => !before.has(b.rel));
    expect(fresh.length).toBeLessThanOrEqual(2);
    expect(summary(updated)).toEqual(summary(analyseDocument(next, 'markdown')));
  });

  it('uses a change hint when given one (the server knows the edited range)', () => {
    const base = generateNotes(8000, 5);
    const doc = analyseDocument(base, 'markdown');
    const at = base.indexOf('NaCl');
    const text = base.slice(0, at) + 'KCl' + base.slice(at + 4);
    const updated = updateDocument(doc, text, { start: at, oldEnd: at + 4, newEnd: at + 3 });
    expect(summary(updated)).toEqual(summary(analyseDocument(text, 'markdown')));
    // Without a hint the common prefix and suffix give the smallest region: 'Na' became 'K'.
    expect(diffRegion(base, text)).toEqual({ start: at, oldEnd: at + 2, newEnd: at + 1 });
  });

  it('keeps line starts exact through edits with CRLF and lone CR', () => {
    fc.assert(
      fc.property(fc.string({ unit: fc.constantFrom('a', '\n', '\r', '\r\n', 'b'), maxLength: 40 }), edit, (s, e) => {
        const idx = new LineIndex(s);
        const t = applyEdit(s, e);
        const h = diffRegion(s, t);
        expect(idx.update(t, h.start, h.oldEnd, h.newEnd).starts).toEqual(new LineIndex(t).starts);
      }),
      { numRuns: 3000 },
    );
  });
});
