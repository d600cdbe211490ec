/**
 * The npm package of the command line stands on its own: `npm pack` of this folder (after the build
 * that npm test runs first), the packed files run from an unpacked tarball with no node_modules
 * anywhere, and the tarball installed with `npm install -g --prefix <tmp> --offline`, whose
 * `ionwright` then runs --help and check on a copied demo note.
 *
 * Every library is bundled into dist/ by esbuild, so package.json declares no run-time `dependencies`
 * (they are devDependencies): the install has nothing to fetch and works offline on any machine.
 */
import { spawnSync, type SpawnSyncReturns } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { tempFolders } from '../temp';

/** Temporary folders of this file, removed when it is done. */
const mkdtempSync = tempFolders();

const ROOT = join(__dirname, '../..');
const pkg = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8'));
const tmp = mkdtempSync(join(tmpdir(), 'ionwright-pack-'));
const sh = (cmd: string, args: string[], cwd = tmp): SpawnSyncReturns<string> => spawnSync(cmd, args, { cwd, encoding: 'utf8', timeout: 120_000 });

/** Packs once; the tests share the tarball. */
let packed: { tarball: string; files: string[] } | undefined;
function pack() {
  if (packed) return packed;
  const r = sh('npm', ['pack', '--pack-destination', tmp, '--json', '--ignore-scripts'], ROOT);
  expect(r.status, r.stderr).toBe(0);
  const [info] = JSON.parse(r.stdout) as Array<{ filename: string; files: Array<{ path: string }> }>;
  packed = { tarball: join(tmp, info.filename), files: info.files.map((f) => f.path).sort() };
  return packed;
}

/** A working folder with a copy of a demo note (it has an unknown element) and a clean note. */
function workFolder(examples: string) {
  const work = mkdtempSync(join(tmpdir(), 'ionwright-pack-work-'));
  copyFileSync(join(examples, 'rinse-trials.md'), join(work, 'rinse-trials.md'));
  mkdirSync(join(work, 'clean'));
  writeFileSync(join(work, 'clean', 'ok.md'), 'We used `NaCl` and `H2O`.\n');
  return work;
}

/** --help, --version, check with findings (1), check of a clean note (0), a parallel check. */
function exercise(command: string[], examples: string) {
  const run = (args: string[], cwd: string) => sh(command[0], [...command.slice(1), ...args], cwd);
  const work = workFolder(examples);
  const help = run(['--help'], work);
  expect(help.status, help.stderr).toBe(0);
  expect(help.stdout).toContain('ionwright check <path>...');
  expect(run(['--version'], work).stdout.trim()).toBe(`ionwright ${pkg.version}`);
  const found = run(['check', 'rinse-trials.md'], work);
  expect(found.status, found.stderr).toBe(1);
  expect(found.stdout).toMatch(/^rinse-trials\.md:\d+:\d+ error unknown-element /m);
  expect(run(['check', 'clean'], work).status).toBe(0);
  // Worker threads started from the installed bundle give the same findings.
  for (let i = 0; i < 6; i++) copyFileSync(join(examples, 'rinse-trials.md'), join(work, 'clean', `copy-${i}.md`));
  const one = run(['check', '.', '--format', 'json', '--jobs', '1'], work);
  const two = run(['check', '.', '--format', 'json', '--jobs', '2'], work);
  expect(two.stderr).toBe('');
  expect(two.status).toBe(1);
  expect(two.stdout).toBe(one.stdout);
}

describe('the npm package', () => {
  it('packs the bundle, the demo notes, README and LICENSE, and nothing of the sources', () => {
    const { files } = pack();
    for (const f of ['dist/cli.js', 'examples/plating-bath.fnote', 'examples/rinse-trials.md', 'README.md', 'LICENSE', 'package.json'])
      expect(files).toContain(f);
    expect(files.filter((f) => /^(server|client|test|bench|scripts|node_modules|data)\//.test(f) || f.endsWith('.map'))).toEqual([]);
    expect(pkg.bin.ionwright).toBe('dist/cli.js');
    expect(readFileSync(join(ROOT, 'dist/cli.js'), 'utf8').startsWith('#!/usr/bin/env node\n')).toBe(true);
  });

  it('runs from the unpacked tarball with no node_modules', () => {
    const { tarball } = pack();
    const dest = mkdtempSync(join(tmpdir(), 'ionwright-unpacked-'));
    expect(sh('tar', ['-xzf', tarball, '-C', dest]).status).toBe(0);
    const root = join(dest, 'package');
    expect(existsSync(join(root, 'node_modules'))).toBe(false);
    exercise(['node', join(root, 'dist/cli.js')], join(root, 'examples'));
  });

  it('installs globally into a temporary prefix offline, and its ionwright runs', () => {
    expect(pkg.dependencies ?? {}).toEqual({});
    const { tarball } = pack();
    const prefix = join(tmp, 'prefix');
    const r = sh('npm', ['install', '-g', '--prefix', prefix, tarball, '--offline', '--no-audit', '--no-fund']);
    expect(r.status, r.stderr).toBe(0);
    const bin = join(prefix, 'bin', 'ionwright');
    expect(existsSync(bin)).toBe(true);
    exercise([bin], join(prefix, 'lib', 'node_modules', 'ionwright', 'examples'));
  });
});
