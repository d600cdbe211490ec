/**
 * `check --format sarif` against the published SARIF 2.1.0 JSON schema, and the shape code-scanning
 * services need (relative URIs against %SRCROOT%, rules with default levels, ruleIndex).
 *
 * The schema: `sarif-2.1.0-rtm.5.json` as shipped in the npm package @microsoft/jest-sarif
 * (lib/schemas/), the SchemaStore copy of the OASIS SARIF 2.1.0 schema (its `id` is the SchemaStore
 * URL). It declares JSON Schema draft-04. Ajv 8 has no draft-04 mode, so the schema is compiled as
 * draft-07 (Ajv's default) with `id` moved to `$id`: for this schema the two drafts mean the same,
 * since the only keywords whose meaning changed between them (boolean exclusiveMinimum and
 * exclusiveMaximum) do not occur in it, which the first test checks. Formats (uri, uri-reference,
 * date-time) are checked with ajv-formats. One `pattern` in the schema (`language`) is not a valid
 * regular expression in Unicode mode, so patterns are compiled without the `u` flag, as draft-04's
 * ECMA-262 regular expressions are.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync, realpathSync, symlinkSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import Ajv from 'ajv';
import addFormats from 'ajv-formats';
import { describe, expect, it } from 'vitest';
import { tempFolders } from '../temp';
import { checkText } from '../../server/src/cli/analyse';
import { RULES } from '../../server/src/cli/sarif';
import { EVERY_CODE_NOTE } from '../fixtures/every-code';

/** Temporary folders of this file, removed when it is done. */
const mkdtempSync = tempFolders();

const CLI = join(__dirname, '../../dist/cli.js');
const SCHEMA_FILE = join(__dirname, '../../node_modules/@microsoft/jest-sarif/lib/schemas/sarif-2.1.0-rtm.5.json');
const schemaText = readFileSync(SCHEMA_FILE, 'utf8');
const published = JSON.parse(schemaText) as { $schema: string; id: string } & Record<string, unknown>;
const { $schema: _draft, id, ...body } = published;
const ajv = new Ajv({ allErrors: true, strict: false, unicodeRegExp: false });
addFormats(ajv);
const validate = ajv.compile({ $id: id, ...body });
const pkg = JSON.parse(readFileSync(join(__dirname, '../../package.json'), 'utf8'));

type Sarif = any;

function sarifOf(paths: string[], cwd: string) {
  const r = spawnSync('node', [CLI, 'check', ...paths, '--format', 'sarif'], { cwd, encoding: 'utf8' });
  const doc: Sarif = JSON.parse(r.stdout);
  const valid = validate(doc);
  return { r, doc, valid, errors: ajv.errorsText(validate.errors, { separator: '\n' }) };
}

const LEVEL = ['', 'error', 'warning', 'note', 'note'];

describe('the schema', () => {
  it('is draft-04 with nothing whose meaning differs in draft-07', () => {
    expect(published.$schema).toBe('http://json-schema.org/draft-04/schema#');
    expect(schemaText).not.toMatch(/"exclusive(Minimum|Maximum)"/);
    expect(schemaText).not.toMatch(/"\$id"/);
    // The validator rejects what the schema forbids.
    expect(validate({ version: '2.1.0', runs: [{ tool: { driver: { name: 'x' } }, columnKind: 'utf16' }] })).toBe(false);
    expect(
      validate({
        version: '2.1.0',
        runs: [
          {
            tool: { driver: { name: 'x' } },
            results: [{ message: { text: 'm' }, locations: [{ physicalLocation: { artifactLocation: { uri: 'a b/ü.md' } } }] }],
          },
        ],
      }),
    ).toBe(false);
    expect(validate({ version: '2.1.0', runs: [{ tool: { driver: { name: 'x' } }, results: [] }] })).toBe(true);
  });
});

describe('check --format sarif', () => {
  const dir = realpathSync(mkdtempSync(join(tmpdir(), 'ionwright-sarif-')));
  mkdirSync(join(dir, 'notes'));
  writeFileSync(join(dir, 'notes', 'errors.md'), 'We weighed `NaXx` and `Ca(NO3`.\n');
  writeFileSync(join(dir, 'notes', 'warnings.md'), 'The label says `Al(OH)2`; the board says `Fe + O2 -> Fe2O3`.\n');
  writeFileSync(join(dir, 'notes', 'info.fnote'), 'formula: TcO2\nreaction: H2 + O2 -> H2O + H2O2\n');

  it('of a folder with errors, warnings and notes is valid, and says what json says', () => {
    const { r, doc, valid, errors } = sarifOf(['notes'], dir);
    expect(errors).toBe('No errors');
    expect(valid).toBe(true);
    expect(r.status).toBe(1);
    const run = doc.runs[0];
    const results = run.results as Sarif[];
    expect(new Set(results.map((x) => x.level))).toEqual(new Set(['error', 'warning', 'note']));

    // One result per json finding, in the same order, at the same place (1-based, end exclusive).
    const json = JSON.parse(spawnSync('node', [CLI, 'check', 'notes', '--format', 'json'], { cwd: dir, encoding: 'utf8' }).stdout);
    expect(results).toHaveLength(json.length);
    results.forEach((x, i) => {
      const d = json[i];
      const loc = x.locations[0].physicalLocation;
      expect(loc.artifactLocation).toEqual({ uri: d.file, uriBaseId: '%SRCROOT%' });
      expect(loc.region).toEqual({
        startLine: d.range.start.line + 1,
        startColumn: d.range.start.character + 1,
        endLine: d.range.end.line + 1,
        endColumn: d.range.end.character + 1,
      });
      expect(x.message.text).toBe(d.message);
      expect(x.ruleId).toBe(d.code);
      expect(x.level).toBe(LEVEL[d.severity]);
      // ruleIndex points at the rule, which knows this code and the level it is reported at.
      const rule = run.tool.driver.rules[x.ruleIndex];
      expect(rule.id).toBe(x.ruleId);
      expect(rule.defaultConfiguration.level).toBe(x.level);
      expect(rule.shortDescription.text).toBe(RULES[x.ruleId].text);
    });

    expect(run.tool.driver.name).toBe('ionwright');
    expect(run.tool.driver.version).toBe(pkg.version);
    expect(run.columnKind).toBe('utf16CodeUnits');
    expect(run.originalUriBaseIds['%SRCROOT%'].uri).toBe(`file://${dir}/`);
    expect(run.invocations).toEqual([{ executionSuccessful: true }]);
    for (const rule of run.tool.driver.rules) expect(['error', 'warning', 'note']).toContain(rule.defaultConfiguration.level);
  });

  it('of a clean folder is valid with no results, and exits 0', () => {
    const clean = mkdtempSync(join(tmpdir(), 'ionwright-sarif-clean-'));
    writeFileSync(join(clean, 'ok.md'), 'We used `NaCl` and `H2O`.\n');
    const { r, doc, valid, errors } = sarifOf(['.'], clean);
    expect(errors).toBe('No errors');
    expect(valid).toBe(true);
    expect(r.status).toBe(0);
    expect(doc.runs[0].results).toEqual([]);
    expect(doc.runs[0].tool.driver.rules.length).toBe(Object.keys(RULES).length);
  });

  it('of a file with a non-ASCII name in a non-ASCII folder: a percent-encoded URI that leads back to the file', () => {
    const sub = join(dir, 'Prüfstand ß');
    mkdirSync(sub, { recursive: true });
    const file = join(sub, 'Bäder 🧪 #1.md');
    writeFileSync(file, 'Über 🧪 `NaXx`.\n');
    const { doc, valid, errors } = sarifOf([join('Prüfstand ß', 'Bäder 🧪 #1.md')], dir);
    expect(errors).toBe('No errors');
    expect(valid).toBe(true);
    const run = doc.runs[0];
    const loc = run.results[0].locations[0].physicalLocation.artifactLocation;
    expect(loc).toEqual({ uri: 'Pr%C3%BCfstand%20%C3%9F/B%C3%A4der%20%F0%9F%A7%AA%20%231.md', uriBaseId: '%SRCROOT%' });
    expect(fileURLToPath(new URL(loc.uri, run.originalUriBaseIds['%SRCROOT%'].uri))).toBe(file);
    // Columns count UTF-16 code units: 11 before 'Xx' (15 bytes in UTF-8, 10 code points).
    expect(run.results[0].locations[0].physicalLocation.region.startColumn).toBe(12);
  });

  it('of a file outside the working folder: an absolute file URI, no base', () => {
    const elsewhere = mkdtempSync(join(tmpdir(), 'ionwright-sarif-cwd-'));
    const { doc, valid, errors } = sarifOf([join(dir, 'notes', 'errors.md')], elsewhere);
    expect(errors).toBe('No errors');
    expect(valid).toBe(true);
    const loc = doc.runs[0].results[0].locations[0].physicalLocation.artifactLocation;
    expect(loc.uriBaseId).toBeUndefined();
    expect(fileURLToPath(loc.uri)).toBe(join(dir, 'notes', 'errors.md'));
  });

  it('with a file that cannot be read: still valid, the run not successful, a notification for that file, exit 2', (ctx) => {
    const broken = mkdtempSync(join(tmpdir(), 'ionwright-sarif-broken-'));
    writeFileSync(join(broken, 'a.md'), '`NaXx`\n');
    spawnSync('mkfifo', [join(broken, 'pipe.md')]);
    if (!existsSync(join(broken, 'pipe.md'))) ctx.skip('mkfifo is not available');
    const { r, doc, valid, errors } = sarifOf(['.'], broken);
    expect(errors).toBe('No errors');
    expect(valid).toBe(true);
    expect(r.status).toBe(2);
    expect(r.stderr).toBe('ionwright: pipe.md: cannot be read: a named pipe, not a regular file\n');
    const [inv] = doc.runs[0].invocations;
    expect(inv.executionSuccessful).toBe(false);
    expect(inv.toolExecutionNotifications).toEqual([
      {
        level: 'error',
        message: { text: 'cannot be read: a named pipe, not a regular file' },
        locations: [{ physicalLocation: { artifactLocation: { uri: 'pipe.md', uriBaseId: '%SRCROOT%' } } }],
      },
    ]);
    expect(doc.runs[0].results).toHaveLength(1);
  });
});

describe('check --format sarif with files left out', () => {
  it('a link not followed is a note notification (the run still successful), a file not UTF-8 an error one; valid either way', () => {
    const root = realpathSync(mkdtempSync(join(tmpdir(), 'ionwright-sarif-links-')));
    mkdirSync(join(root, 'notes'));
    mkdirSync(join(root, 'outside'));
    writeFileSync(join(root, 'notes', 'a.md'), '`NaXx`\n');
    writeFileSync(join(root, 'outside', 'o.md'), '`Qq`\n');
    symlinkSync('../outside', join(root, 'notes', 'elsewhere'));
    const links = sarifOf(['notes'], root);
    expect(links.errors).toBe('No errors');
    expect(links.r.status).toBe(1);
    expect(links.doc.runs[0].invocations).toEqual([
      {
        executionSuccessful: true,
        toolExecutionNotifications: [
          {
            level: 'note',
            message: { text: 'symbolic link not followed: it leads out of the folder named on the command line' },
            locations: [{ physicalLocation: { artifactLocation: { uri: 'notes/elsewhere', uriBaseId: '%SRCROOT%' } } }],
          },
        ],
      },
    ]);
    writeFileSync(join(root, 'notes', 'latin1.md'), Buffer.from([0x4b, 0xfc, 0x68, 0x6c, 0x0a]));
    const both = sarifOf(['notes'], root);
    expect(both.errors).toBe('No errors');
    expect(both.r.status).toBe(2);
    const [inv] = both.doc.runs[0].invocations;
    expect(inv.executionSuccessful).toBe(false);
    expect(inv.toolExecutionNotifications.map((n: Sarif) => [n.level, n.message.text])).toEqual([
      ['error', 'skipped: not UTF-8 text (invalid byte 0xFC at offset 1, line 1)'],
      ['note', 'symbolic link not followed: it leads out of the folder named on the command line'],
    ]);
  });
});

describe('the rule catalogue', () => {
  it('has every code the analysis reports, at the level it reports it', () => {
    const text = EVERY_CODE_NOTE;
    const seen = new Map<string, number>();
    for (const d of checkText('all.md', text)) seen.set(d.code, d.severity);
    expect(seen.size).toBeGreaterThanOrEqual(20);
    for (const [code, severity] of seen) {
      expect(RULES[code], code).toBeDefined();
      expect(RULES[code].level, code).toBe(LEVEL[severity]);
    }
  });
});
