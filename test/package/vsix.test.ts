/**
 * The .vsix as the marketplace and VS Code see it: packed with @vscode/vsce into a temp folder, then read
 * back as the zip it is. Checks what goes in (bundles, grammars, styles, icon, docs) and what stays out
 * (sources, tests, node_modules, source maps), and that the manifest inside declares what the editor needs.
 */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { builtinModules } from 'node:module';
import { beforeAll, describe, expect, it } from 'vitest';
import { tempFolders } from '../temp';

import yauzl from 'yauzl';

/** Temporary folders of this file, removed when it is done. */
const mkdtempSync = tempFolders();

const ROOT = join(__dirname, '../..');

function readZip(path: string): Promise<Map<string, Buffer>> {
  return new Promise((resolve, reject) => {
    const files = new Map<string, Buffer>();
    yauzl.open(path, { lazyEntries: true }, (err, zip) => {
      if (err || !zip) return reject(err);
      zip.on('entry', (entry: yauzl.Entry) => {
        if (entry.fileName.endsWith('/')) return zip.readEntry();
        zip.openReadStream(entry, (e, stream) => {
          if (e || !stream) return reject(e);
          const chunks: Buffer[] = [];
          stream.on('data', (c: Buffer) => chunks.push(c));
          stream.on('end', () => {
            files.set(entry.fileName, Buffer.concat(chunks));
            zip.readEntry();
          });
        });
      });
      zip.on('end', () => resolve(files));
      zip.on('error', reject);
      zip.readEntry();
    });
  });
}

describe('the .vsix', () => {
  let files: Map<string, Buffer>;
  let manifest: any;
  beforeAll(async () => {
    const out = join(mkdtempSync(join(tmpdir(), 'ionwright-vsix-')), 'ionwright.vsix');
    // npm test has just built dist/; pack with the flags of `npm run package`, into a temp folder.
    const pkg = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8'));
    const flags = (pkg.scripts.package as string)
      .split('vsce package')[1]
      .trim()
      .split(/\s+/)
      .filter((f, k, all) => f !== '-o' && all[k - 1] !== '-o');
    execFileSync(process.execPath, [join(ROOT, 'node_modules/@vscode/vsce/vsce'), 'package', ...flags, '-o', out], { cwd: ROOT, stdio: 'pipe' });
    files = await readZip(out);
    manifest = JSON.parse(files.get('extension/package.json')!.toString('utf8'));
  }, 120_000);

  it('holds the bundles, grammars, styles, icon and docs', () => {
    // vsce stores the docs under the marketplace's names: readme.md, changelog.md, LICENSE.txt.
    for (const f of [
      'dist/extension.js',
      'dist/server.js',
      'dist/cli.js',
      'dist/browser/server.js',
      'dist/browser/extension.js',
      'media/preview.css',
      'media/icon.png',
      'readme.md',
      'changelog.md',
      'LICENSE.txt',
      'package.json',
      'syntaxes/fnote.tmLanguage.json',
      'syntaxes/chem-formula.tmLanguage.json',
      'syntaxes/markdown-formulas.tmLanguage.json',
      'syntaxes/fnote.language-configuration.json',
    ]) {
      expect(files.has(`extension/${f}`), f).toBe(true);
    }
  });

  it('carries the README written for the marketplace page', () => {
    expect(files.get('extension/readme.md')!.toString('utf8')).toBe(readFileSync(join(ROOT, 'docs/marketplace.md'), 'utf8'));
  });

  it('leaves out sources, tests, dependencies and source maps', () => {
    for (const name of files.keys()) {
      expect(name, name).not.toMatch(/^extension\/(server\/src|client\/src|test|bench|node_modules|scripts|data)\//);
      expect(name, name).not.toMatch(/\.(map|ts)$/);
    }
  });

  it('every file the manifest points at is in the package', () => {
    const paths = [
      manifest.main,
      manifest.browser,
      manifest.icon,
      ...manifest.contributes['markdown.previewStyles'],
      ...manifest.contributes.grammars.map((g: { path: string }) => g.path),
      ...manifest.contributes.languages.map((l: { configuration: string }) => l.configuration),
    ];
    for (const p of paths) expect(files.has(`extension/${p.replace(/^\.\//, '')}`), p).toBe(true);
  });

  it('declares languages, grammars, commands, menus, settings, activation, the preview plugin and workspace trust', () => {
    const c = manifest.contributes;
    expect(c.languages.map((l: { id: string }) => l.id)).toContain('fnote');
    expect(c.grammars.length).toBeGreaterThanOrEqual(3);
    expect(c.commands.length).toBeGreaterThanOrEqual(5);
    expect(Object.keys(c.menus)).toEqual(expect.arrayContaining(['editor/context', 'commandPalette']));
    expect(Object.keys(c.configuration.properties)).toContain('ionwright.preview.typesetFormulas');
    expect(manifest.activationEvents).toEqual(expect.arrayContaining(['onLanguage:markdown', 'onLanguage:fnote']));
    expect(c['markdown.markdownItPlugins']).toBe(true);
    expect(manifest.capabilities.untrustedWorkspaces.supported).toBe(true);
    expect(manifest.engines.vscode).toMatch(/^\^1\./);
  });

  it('the bundled client needs nothing at run time beyond VS Code and Node built-ins', () => {
    const src = files.get('extension/dist/extension.js')!.toString('utf8');
    const required = new Set([...src.matchAll(/\brequire\("([^"]+)"\)/g)].map((m) => m[1]));
    const builtins = new Set([...builtinModules, ...builtinModules.map((m) => `node:${m}`)]);
    const foreign = [...required].filter((r) => r !== 'vscode' && !builtins.has(r));
    expect(foreign).toEqual([]);
  });
});
