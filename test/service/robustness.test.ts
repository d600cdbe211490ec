/**
 * Hostile input: arbitrary Unicode, control characters, enormous numbers, deep nesting, a 1 MB single
 * line, binary files, empty files. Each gives a result or a diagnostic, without a throw or a stack
 * overflow; the time bounds here only catch hangs (speed is measured in `npm run bench`).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { analyseBatch } from '../../server/src/chem/batch';
import { analyseReaction } from '../../server/src/chem/equation';
import { cardJson } from '../../server/src/service/card';
import { documentDiagnostics } from '../../server/src/service/diagnostics';
import { analyseDocument } from '../../server/src/service/document';
import { hover } from '../../server/src/service/hover';
import { codeActions } from '../../server/src/service/actions';
import { documentTables } from '../../server/src/service/tables';
import { createLanguageService } from '../../server/src/service/languageService';
import { run, type CliIO } from '../../server/src/cli/main';
import type { NotesLanguage } from '../../server/src/notes/types';

const HANG = 5000;
const ls = createLanguageService();
const timed = <T>(fn: () => T): T => {
  const t0 = Date.now();
  const r = fn();
  expect(Date.now() - t0).toBeLessThan(HANG);
  return r;
};

/** Every number in a card or table is finite, and masses are not negative. */
function honest(value: unknown, path = ''): void {
  if (typeof value === 'number') {
    expect(Number.isFinite(value), path).toBe(true);
    if (/molarMass|massG|moles|concentration|massFraction|kJPerMol|ionicStrength/.test(path)) expect(value, path).toBeGreaterThanOrEqual(0);
  } else if (Array.isArray(value)) value.forEach((v, i) => honest(v, `${path}[${i}]`));
  else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) honest(v, `${path}.${k}`);
}

function checkDocument(text: string, language: NotesLanguage) {
  const doc = analyseDocument(text, language);
  const diags = documentDiagnostics(doc);
  for (const d of diags) {
    expect(d.range.start.line).toBeGreaterThanOrEqual(0);
    expect(d.range.end.line).toBeLessThan(doc.lines.lineCount);
    expect(d.range.start.line < d.range.end.line || d.range.start.character <= d.range.end.character).toBe(true);
  }
  for (const x of doc.diagnostics) {
    expect(x.start).toBeGreaterThanOrEqual(0);
    expect(x.end).toBeLessThanOrEqual(text.length);
  }
  honest(
    doc.batches.map((b) =>
      b.analysis.ingredients.map((i) => ({ massG: i.massG, moles: i.moles, concentration: i.concentrationM, massFraction: i.massFraction })),
    ),
    'batches',
  );
  return doc;
}

describe('fuzzing the notes scanner and the whole analysis', () => {
  const alphabet = fc.constantFrom(
    ...'`# \n\r\t-*>|[](){}^+·.0123456789NaClHOFeSCuK=→⇌~<!-->é🧪\u0000\u0007\u202e'.split(''),
    '```',
    '```batch\n',
    '```reaction\n',
    'volume: 1 L\n',
    'NaCl 5 g\n',
    'batch\n',
    'end\n',
    'section: A\n',
    'reaction: H2 + O2 -> H2O\n',
    'formula: NaCl\n',
  );
  for (const language of ['markdown', 'fnote'] as const) {
    it(`notes made of formula and Markdown pieces never throw (${language})`, () => {
      fc.assert(
        fc.property(
          fc.array(alphabet, { maxLength: 120 }).map((a) => a.join('')),
          (text) => {
            const doc = checkDocument(text, language);
            // Hovers and code actions anywhere answer without throwing.
            const notes = [ls.noteSummary(doc, 'file:///fuzz.md')];
            for (let o = 0; o <= text.length; o += 7) {
              hover(doc, o);
              codeActions(doc, o, o);
              // And the typing features.
              const p = doc.lines.positionAt(o);
              ls.completion(doc, p, notes[0].vocabulary);
              ls.definition(doc, p, notes);
              ls.weighingListAt(doc, p);
            }
            documentTables(doc);
            const whole = { start: { line: 0, character: 0 }, end: doc.lines.positionAt(text.length) };
            for (const h of ls.inlayHints(doc, whole)) expect(h.label).toMatch(/^⇒ \d/);
            ls.semanticTokens(doc);
            ls.foldingRanges(doc).forEach((f) => expect(f.endLine).toBeGreaterThan(f.startLine));
            ls.workspaceSymbols(notes, 'a');
          },
        ),
        { numRuns: 1500 },
      );
    });
    it(`arbitrary Unicode and control characters never throw (${language})`, () => {
      fc.assert(
        fc.property(fc.string({ unit: 'binary', maxLength: 300 }), (text) => {
          checkDocument(text, language);
        }),
        { numRuns: 1500 },
      );
    });
  }
});

describe('fuzzing the batch reader and the balancer', () => {
  it('arbitrary batch lines give diagnostics, never NaN, Infinity or negative masses', () => {
    const token = fc.constantFrom(
      'NaCl',
      'CuSO4·5H2O',
      'Xx',
      '(',
      '5',
      '-3',
      '1e400',
      '0',
      'NaN',
      'Infinity',
      'g',
      'M',
      'mM',
      'wt%',
      '@',
      '99.5%',
      '@120%',
      'volume:',
      'total:',
      'name:',
      'L',
      'mL',
      '#',
      '1e-320',
      '0.0000001',
      '   ',
    );
    fc.assert(
      fc.property(
        fc.array(
          fc.array(token, { maxLength: 6 }).map((t) => t.join(' ')),
          { maxLength: 12 },
        ),
        (lines) => {
          let at = 0;
          const b = analyseBatch(
            lines.map((text) => {
              const l = { text, start: at };
              at += text.length + 1;
              return l;
            }),
          );
          honest({
            ions: b.ions.map((x) => ({ concentration: x.concentrationM })),
            ionicStrength: b.ionicStrengthM ?? 0,
            i: b.ingredients.map((i) => ({ massG: i.massG ?? 0, moles: i.moles ?? 0 })),
          });
        },
      ),
      { numRuns: 2000 },
    );
  });

  it('equations with many species or huge coefficients finish or say they are too large', () => {
    const many = Array.from({ length: 60 }, (_, i) => `C${i + 1}H${2 * i + 4}`).join(' + ') + ' + O2 -> CO2 + H2O';
    const r = timed(() => analyseReaction(many));
    expect(['too-large', 'ambiguous', 'balanced']).toContain(r.balance.status);
    const huge = timed(() => analyseReaction('C999999H999998 + O2 -> CO2 + H2O'));
    expect(['balanced', 'too-large']).toContain(huge.balance.status);
    if (huge.balance.coefficients) honest(huge.balance.coefficients);
  });
});

describe('hostile inputs from the issue', () => {
  it('enormous numbers get a diagnostic', () => {
    const a = analyseFormula('H99999999999999999999');
    expect(a.molarMass).toBeNull();
    expect(a.diagnostics[0]).toMatchObject({ code: 'malformed-formula', severity: 'error' });
    honest(cardJson(analyseFormula('C1000000H2000000')));
  });

  it('20,000 nested parentheses give one clear diagnostic, no stack overflow', () => {
    const deep = '('.repeat(20_000) + 'H' + ')'.repeat(20_000);
    const doc = timed(() => analyseDocument('`' + deep + '`', 'markdown'));
    expect(doc.diagnostics.map((d) => d.code)).toContain('malformed-formula');
    expect(timed(() => analyseReaction(deep + ' -> H')).ok).toBe(false);
  });

  it('a 1 MB single line is analysed', () => {
    const line = 'We used `NaCl` and NaXx2 then '.repeat(35_000);
    const doc = timed(() => analyseDocument(line, 'markdown'));
    expect(doc.formulas.length).toBeGreaterThan(30_000);
    expect(doc.lines.lineCount).toBe(1);
  });

  it('a binary file named .md and an empty file give results, not errors', () => {
    const bytes = Buffer.alloc(4096);
    let x = 12345;
    for (let i = 0; i < bytes.length; i++) bytes[i] = (x = (x * 1103515245 + 12345) & 0x7fffffff) & 0xff;
    checkDocument(bytes.toString('utf8'), 'markdown');
    expect(analyseDocument('', 'markdown').diagnostics).toEqual([]);
    expect(analyseDocument('', 'fnote').diagnostics).toEqual([]);
  });

  it('no NaN, Infinity or negative numbers reach a card', () => {
    fc.assert(
      fc.property(fc.stringMatching(/^[A-Z][a-z]?[0-9]{0,7}(\([A-Z][a-z]?[0-9]{0,3}\)[0-9]{0,3})?(·[0-9]{0,2}H2O)?$/), (f) => {
        honest(cardJson(analyseFormula(f)));
      }),
      { numRuns: 3000 },
    );
  });
});

describe('the command line on bad input', () => {
  /** An in-memory file system: some paths fail to read. */
  function io(files: Record<string, string | Error>, dirs: Record<string, string[] | Error>): CliIO & { outText: string; errText: string } {
    const self = {
      outText: '',
      errText: '',
      cwd: '/',
      out: (t: string) => void (self.outText += t + '\n'),
      err: (t: string) => void (self.errText += t + '\n'),
      readFile: (p: string) => {
        const f = files[p];
        if (f === undefined || f instanceof Error) throw f ?? new Error('ENOENT');
        return f;
      },
      readDir: (p: string) => {
        const d = dirs[p];
        if (d === undefined || d instanceof Error) throw d ?? new Error('ENOENT');
        return d;
      },
      isDirectory: (p: string) => {
        if (p in dirs) return true;
        if (p in files) return false;
        throw new Error('ENOENT');
      },
    };
    return self;
  }

  it('a folder check continues past an unreadable file and an unreadable folder, reports them, and exits 2', async () => {
    const fs = io(
      { '/notes/a.md': 'Used `NaCl`.', '/notes/b.md': new Error('EACCES'), '/notes/c.fnote': 'formula: KCl' },
      { '/notes': ['a.md', 'b.md', 'c.fnote', 'locked'], '/notes/locked': new Error('EACCES') },
    );
    const code = await run(['check', '/notes', '--format', 'json'], fs);
    expect(code).toBe(2);
    expect(JSON.parse(fs.outText)).toEqual([]);
    expect(fs.errText).toContain('notes/b.md: cannot be read');
    expect(fs.errText).toContain('notes/locked: folder cannot be read');
    expect(fs.outText).not.toContain('at ');
  });

  it('an internal failure is one line, not a stack trace', async () => {
    const fs = io({}, {});
    fs.isDirectory = () => {
      throw Object.assign(new Error('boom'), { stack: 'Error: boom\n    at somewhere' });
    };
    expect(await run(['check', '/x'], fs)).toBe(2);
    expect(fs.errText.trim().split('\n')).toHaveLength(1);
  });
});
