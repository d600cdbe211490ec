/**
 * `check --shard i/n` and `merge-sarif`, through the built dist/cli.js: the n parts are disjoint, their
 * union is the unsharded check (findings and files, in every format), the split is by path alone (the
 * same in another clone, unchanged for the other files when one is added), and the shards' SARIF logs
 * merge into one log equal to the unsharded one's results, valid against the SARIF 2.1.0 schema.
 */
import { spawnSync } from 'node:child_process';
import { cpSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Ajv from 'ajv';
import addFormats from 'ajv-formats';
import { describe, expect, it } from 'vitest';
import { generateNotes } from '../../bench/generate';
import { readShard, shardKey, shardOf } from '../../server/src/cli/shard';
import { tempFolders } from '../temp';

const mkdtempSync = tempFolders();
const CLI = join(__dirname, '../../dist/cli.js');

/** A folder of notes in subfolders (non-ASCII names among them), each with a few findings. */
function notesFolder(n: number): string {
  const dir = mkdtempSync(join(tmpdir(), 'ionwright-shard-'));
  for (let i = 0; i < n; i++) {
    const sub = join(dir, 'notes', i % 3 === 0 ? 'bench' : i % 3 === 1 ? 'Prüfstand' : 'line-2/baths');
    mkdirSync(sub, { recursive: true });
    const text = generateNotes(1_500 + ((i * 997) % 3_000), 40 + i);
    writeFileSync(join(sub, i % 4 === 3 ? `trial-${i}.fnote` : `notes ${i}.md`), i % 4 === 3 ? 'formula: CaNO3\nformula: NaCl\n' : text);
  }
  return dir;
}

function cli(args: string[], cwd: string) {
  const r = spawnSync(process.execPath, [CLI, ...args], { cwd, encoding: 'utf8', maxBuffer: 256 * 1024 * 1024 });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

type Finding = { file: string; range: unknown; code: string; message: string };
const json = (args: string[], cwd: string): Finding[] => JSON.parse(cli([...args, '--format', 'json'], cwd).stdout);
const key = (f: Finding) => JSON.stringify([f.file, f.range, f.code, f.message]);

describe('check --shard', () => {
  const dir = notesFolder(30);
  const all = json(['check', 'notes'], dir);

  it('the parts are disjoint and together are the unsharded check, for any number of parts', () => {
    expect(all.length).toBeGreaterThan(30);
    for (const n of [1, 2, 3, 7]) {
      const parts = Array.from({ length: n }, (_, i) => json(['check', 'notes', '--shard', `${i + 1}/${n}`], dir));
      const files = parts.map((p) => new Set(p.map((f) => f.file)));
      for (let a = 0; a < n; a++) for (let b = a + 1; b < n; b++) expect([...files[a]].filter((f) => files[b].has(f))).toEqual([]);
      expect(parts.flat().map(key).sort()).toEqual(all.map(key).sort());
    }
  });

  it('counts the files of its part and of all in the text summary; exit status as check’s', () => {
    const texts = [1, 2, 3].map((i) => cli(['check', 'notes', '--shard', `${i}/3`], dir));
    const counts = texts.map((t) => Number(/^(\d+) files? checked \(part \d of 3; 30 files found in all\)/m.exec(t.stdout)?.[1]));
    expect(counts.reduce((a, b) => a + b, 0)).toBe(30);
    // A part with an error-severity finding exits 1, as check does.
    for (const t of texts) expect(t.status).toBe(/[1-9]\d* errors?/.test(t.stdout.split('\n').filter(Boolean).pop()!) ? 1 : 0);
  });

  it('splits by path alone: another clone splits alike, and adding a file moves no other', () => {
    const copy = mkdtempSync(join(tmpdir(), 'ionwright-shard-copy-'));
    cpSync(join(dir, 'notes'), join(copy, 'notes'), { recursive: true });
    const filesOf = (cwd: string, i: number) => json(['check', 'notes', '--shard', `${i}/4`], cwd).map((f) => f.file);
    const before = [1, 2, 3, 4].map((i) => new Set(filesOf(copy, i)));
    expect(before.map((s) => [...s].sort())).toEqual([1, 2, 3, 4].map((i) => [...new Set(filesOf(dir, i))].sort()));
    writeFileSync(join(copy, 'notes', 'bench', 'added.md'), 'We weighed `CaNO3`.\n');
    const after = [1, 2, 3, 4].map((i) => new Set(filesOf(copy, i)));
    for (let i = 0; i < 4; i++) for (const f of before[i]) expect(after[i].has(f), f).toBe(true);
    expect(after.filter((s) => s.has(join('notes', 'bench', 'added.md'))).length).toBe(1);
  });

  it('refuses a part that does not exist, with one line and status 2', () => {
    for (const bad of ['0/3', '4/3', '1/0', 'x', '1-3', '2/']) {
      const r = cli(['check', 'notes', '--shard', bad], dir);
      expect(r.status, bad).toBe(2);
      expect(r.stderr.trim().split('\n'), bad).toEqual([`ionwright: --shard must be <i>/<n> with 1 ≤ i ≤ n ≤ 10000 (got '${bad}')`]);
    }
  });

  it('reads the part from the path relative to the working folder, with / separators', () => {
    expect(shardKey('notes/a b.md', '/lab')).toBe('notes/a b.md');
    expect(shardKey('/lab/notes/x.md', '/lab')).toBe('notes/x.md');
    expect(readShard(' 2 / 5 ')).toEqual({ index: 2, count: 5 });
    // FNV-1a of "a" is 0xe40c292c (the published test vector of the 32-bit hash) = 3826002220; mod 7 = 5.
    expect(shardOf('a', 7)).toBe((3826002220 % 7) + 1);
  });
});

describe('merge-sarif', () => {
  const dir = notesFolder(12);
  const SCHEMA = JSON.parse(readFileSync(join(__dirname, '../../node_modules/@microsoft/jest-sarif/lib/schemas/sarif-2.1.0-rtm.5.json'), 'utf8'));
  const { $schema: _draft, id, ...body } = SCHEMA;
  const ajv = new Ajv({ allErrors: true, strict: false, unicodeRegExp: false });
  addFormats(ajv);
  // The OASIS SARIF 2.1.0 schema as shipped in @microsoft/jest-sarif (see sarif.test.ts for how it is compiled).
  const validate = ajv.compile({ $id: id, ...body });

  it('merges the shards’ logs into one run whose results are the unsharded check’s, in its order', () => {
    const paths: string[] = [];
    for (let i = 1; i <= 3; i++) {
      const p = join(dir, `shard-${i}.sarif`);
      writeFileSync(p, cli(['check', 'notes', '--shard', `${i}/3`, '--format', 'sarif'], dir).stdout);
      paths.push(p);
    }
    const merged = cli(['merge-sarif', ...paths], dir);
    expect(merged.status, merged.stderr).toBe(0);
    const log = JSON.parse(merged.stdout);
    expect(validate(log), ajv.errorsText(validate.errors)).toBe(true);
    const whole = JSON.parse(cli(['check', 'notes', '--format', 'sarif'], dir).stdout);
    expect(log.runs).toHaveLength(1);
    expect(log.runs[0].results.length).toBeGreaterThan(10);
    expect(log.runs[0].results).toEqual(whole.runs[0].results);
    expect(log.runs[0].tool.driver.rules).toEqual(whole.runs[0].tool.driver.rules);
    expect(log.runs[0].invocations).toHaveLength(3);
  });

  it('refuses what is not an Ionwright SARIF log, naming the file', () => {
    writeFileSync(join(dir, 'other.sarif'), JSON.stringify({ version: '2.1.0', runs: [{ tool: { driver: { name: 'elsewhere' } } }] }));
    writeFileSync(join(dir, 'broken.sarif'), '{');
    let r = cli(['merge-sarif', 'other.sarif'], dir);
    expect([r.status, r.stderr.trim()]).toEqual([2, "ionwright: other.sarif: a run of 'elsewhere', not of ionwright"]);
    r = cli(['merge-sarif', 'broken.sarif'], dir);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^ionwright: broken\.sarif: not a SARIF log/);
    r = cli(['merge-sarif', 'missing.sarif'], dir);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^ionwright: missing\.sarif: cannot be read/);
    r = cli(['merge-sarif'], dir);
    expect([r.status, r.stderr.trim()]).toEqual([2, 'ionwright: merge-sarif needs at least one SARIF file']);
  });
});
