/**
 * The catalogue of diagnostic codes (chem/codes.ts): the README's table lists exactly its codes, with
 * the same severities; every code raised is in it, at its severity; a code outside it (or reserved) is a
 * type error; the SARIF rules are the catalogue's.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkText } from '../../server/src/cli/analyse';
import { RULES } from '../../server/src/cli/sarif';
import { DIAGNOSTIC_CATALOGUE, DIAGNOSTIC_CODES, isDiagnosticCode, type CatalogueCode } from '../../server/src/chem/codes';
import type { ChemDiagnostic } from '../../server/src/chem/diagnostic';
import { editorDiagnostics } from '../../server/src/service/diagnostics';
import { analyseDocument } from '../../server/src/service/document';
import { EVERY_CODE_NOTE } from '../fixtures/every-code';
import { upkeepEveryCode } from '../fixtures/upkeep-every-code';

const ROOT = join(__dirname, '../..');
const SEVERITY_NAME = ['', 'error', 'warning', 'information', 'hint'];
const entries = Object.entries(DIAGNOSTIC_CATALOGUE) as Array<[CatalogueCode, (typeof DIAGNOSTIC_CATALOGUE)[CatalogueCode]]>;

/** The rows of the README's table of codes, as written. */
function readmeRows() {
  const readme = readFileSync(join(ROOT, 'README.md'), 'utf8');
  const at = readme.indexOf('\n## Diagnostic codes\n');
  expect(at, 'README has a "Diagnostic codes" section').toBeGreaterThan(0);
  const section = readme.slice(at + 1, readme.indexOf('\n## ', at + 1));
  const rows = section.split('\n').filter((l) => l.startsWith('| `'));
  return rows.map((row) => {
    const m = /^\| `([^`]+)` \| ([a-z]+)( \(reserved\))? \| ([^|]+) \| ([^|]+) \|$/.exec(row);
    expect(m, row).not.toBeNull();
    return { code: m![1], severity: m![2], reserved: m![3] !== undefined, raisedBy: m![4].trim(), description: m![5].trim() };
  });
}

/** The table the README should hold, for the message of a failing check. */
const expectedTable = () =>
  entries.map(([c, e]) => `| \`${c}\` | ${e.severity}${e.reserved ? ' (reserved)' : ''} | ${e.raisedBy.join(', ')} | ${e.description} |`).join('\n');

describe('the README table of codes', () => {
  it('lists exactly the catalogue, in its order, with the same severities, reserved marks, layers and descriptions', () => {
    const rows = readmeRows();
    const want = entries.map(([code, e]) => ({
      code,
      severity: e.severity,
      reserved: e.reserved === true,
      raisedBy: e.raisedBy.join(', '),
      description: e.description,
    }));
    expect(rows, `the README's table should read:\n${expectedTable()}`).toEqual(want);
  });
});

describe('the catalogue', () => {
  it('has the codes and severities the outside contract names', () => {
    // The contract (docs/contract.md of the project): codes outside checks rely on, with their severity.
    const contract = { 'unknown-element': 'error', 'malformed-formula': 'error', 'charge-imbalance': 'warning', 'unbalanced-equation': 'warning' } as const;
    for (const [code, severity] of Object.entries(contract)) expect(DIAGNOSTIC_CATALOGUE[code as CatalogueCode].severity, code).toBe(severity);
    // The second round's batch codes are warnings, all raised now (the safety stage raises the last two).
    for (const code of ['batch-precipitation', 'batch-incompatible', 'batch-heat'] as const) {
      expect(DIAGNOSTIC_CATALOGUE[code].severity, code).toBe('warning');
      expect('reserved' in DIAGNOSTIC_CATALOGUE[code], code).toBe(false);
      expect(isDiagnosticCode(code), code).toBe(true);
    }
  });

  it('has kebab-case codes, one-line descriptions ending in a full stop, and a layer for each', () => {
    for (const [code, e] of entries) {
      expect(code).toMatch(/^[a-z]+(-[a-z]+)+$/);
      expect(e.description).toMatch(/^[A-Z].*\.$/);
      expect(e.description).not.toMatch(/[\n|]/);
      expect(e.raisedBy.length, code).toBeGreaterThan(0);
    }
  });

  it('is what the SARIF rules are made of: every raised code, at its level, and nothing else', () => {
    const level = { error: 'error', warning: 'warning', information: 'note', hint: 'note' } as const;
    expect(Object.keys(RULES)).toEqual([...DIAGNOSTIC_CODES]);
    for (const code of DIAGNOSTIC_CODES)
      expect(RULES[code]).toEqual({ level: level[DIAGNOSTIC_CATALOGUE[code].severity], text: DIAGNOSTIC_CATALOGUE[code].description });
  });

  it('has no code that the sources never raise, and the sources quote no code outside it', () => {
    const sources: string[] = [];
    const walk = (dir: string) => {
      for (const name of readdirSync(dir)) {
        const p = join(dir, name);
        if (statSync(p).isDirectory()) walk(p);
        else if (p.endsWith('.ts') && !p.endsWith(join('chem', 'codes.ts'))) sources.push(readFileSync(p, 'utf8'));
      }
    };
    walk(join(ROOT, 'server/src'));
    const text = sources.join('\n');
    for (const code of DIAGNOSTIC_CODES) expect(text.includes(`'${code}'`), code).toBe(true);
    // Every `code: '…'` and `code === '…'` in the sources names a catalogue code.
    const quoted = [...text.matchAll(/\bcode(?:\s*:|\s*[!=]==)\s*'([a-z]+(?:-[a-z]+)+)'/g)].map((m) => m[1]);
    expect(quoted.length).toBeGreaterThan(5);
    for (const code of quoted) expect(isDiagnosticCode(code), code).toBe(true);
  });

  it('types the code: a code outside the catalogue cannot be raised', () => {
    const ok: ChemDiagnostic = { code: 'batch-solubility', severity: 'warning', start: 0, end: 1, message: 'm' };
    // @ts-expect-error — not a code of the catalogue
    const unknown: ChemDiagnostic = { code: 'batch-typo', severity: 'warning', start: 0, end: 1, message: 'm' };
    const heat: ChemDiagnostic = { code: 'batch-heat', severity: 'warning', start: 0, end: 1, message: 'm' };
    expect([ok, unknown, heat].map((d) => isDiagnosticCode(d.code))).toEqual([true, false, true]);
  });
});

describe('the codes raised', () => {
  it('are in the catalogue, each at the severity the catalogue gives it', () => {
    const note = EVERY_CODE_NOTE;
    const seen = new Map<string, number>();
    for (const d of checkText('all.md', note)) seen.set(d.code, d.severity);
    const long = analyseDocument('`NaCl` '.repeat(6000), 'markdown');
    for (const d of [...long.diagnostics]) seen.set(d.code, ['', 'error', 'warning', 'information', 'hint'].indexOf(d.severity));
    for (const d of editorDiagnostics(analyseDocument('`NaXx` `KXx`', 'markdown'), 1)) seen.set(d.code, d.severity);
    // Bath upkeep (chem/upkeep) is not read from notes yet: its findings are taken from it directly.
    for (const d of upkeepEveryCode()) seen.set(d.code, SEVERITY_NAME.indexOf(d.severity));
    // All of the catalogue is reached but `equation-too-large`, which needs a reaction beyond the balancer's
    // limits, and `batch-equilibrium`, which needs a batch the solver cannot converge on (test/chem/solution.solver.test.ts
    // checks the message where the iterations are cut short).
    expect(DIAGNOSTIC_CODES.filter((c) => !seen.has(c))).toEqual(['equation-too-large', 'batch-equilibrium']);
    for (const [code, severity] of seen) {
      expect(isDiagnosticCode(code), code).toBe(true);
      expect(SEVERITY_NAME[severity], code).toBe(DIAGNOSTIC_CATALOGUE[code as CatalogueCode].severity);
    }
  });
});
