/**
 * The layers, enforced on the source: every import of every file under server/src and client/src is read
 * and checked against what its layer may use.
 *
 *   chem     pure chemistry: imports nothing but chem (no notes, service, LSP, editor or Node module)
 *   notes    scanning: chem and notes only (no LSP types, no Node)
 *   service  the language service: chem, notes, service, shared; no transport (vscode-languageserver,
 *            vscode-jsonrpc), no editor, no Node module (the caller hands it text); type-only imports of
 *            markdown-it (the host hands its instance over); pure libraries named in the rule (rbush)
 *   shared   constants both ends use: imports nothing but shared and package.json
 *   server   LSP wiring: anything but cli and client
 *   cli      the command line: anything but server and client
 *   client   VS Code: service (the preview plugin, configuration), shared, client; never server or cli
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = join(__dirname, '..');
const SRC = { server: join(ROOT, 'server/src'), client: join(ROOT, 'client/src') };

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((n) => {
    const p = join(dir, n);
    return statSync(p).isDirectory() ? files(p) : /\.ts$/.test(n) && !n.endsWith('.d.ts') ? [p] : [];
  });
}

/** The layer a file belongs to: the first folder under server/src, or 'client'. */
function layerOf(file: string): string {
  if (file.startsWith(SRC.client)) return 'client';
  const rel = relative(SRC.server, file);
  if (rel.startsWith('..')) return rel.includes('package.json') ? 'package.json' : 'outside';
  return rel.split(/[\\/]/)[0];
}

interface Import {
  spec: string;
  typeOnly: boolean;
  line: number;
}

/** Static imports and re-exports, dynamic import() and require() calls. */
function importsOf(text: string): Import[] {
  const out: Import[] = [];
  const lines = text.split('\n');
  const re =
    /(?:^|\s)(import|export)\s+(type\s+)?[^'";]*?from\s+['"]([^'"]+)['"]|import\s*\(\s*['"]([^'"]+)['"]\s*\)|require\(\s*['"]([^'"]+)['"]\s*\)|^import\s+['"]([^'"]+)['"]/gm;
  let m: RegExpExecArray | null;
  while ((m = re.exec(text))) {
    const spec = m[3] ?? m[4] ?? m[5] ?? m[6];
    const line = text.slice(0, m.index).split('\n').length;
    out.push({ spec, typeOnly: !!m[2] && !!m[3], line });
  }
  void lines;
  return out;
}

const ALLOWED: Record<string, { layers: string[]; packages: RegExp | null; typePackages?: RegExp }> = {
  chem: { layers: ['chem'], packages: null },
  notes: { layers: ['chem', 'notes'], packages: null },
  // Pure libraries that run anywhere are fine in the service (rbush: the chart's collision index).
  service: { layers: ['chem', 'notes', 'service', 'shared'], packages: /^rbush$/, typePackages: /^markdown-it$/ },
  shared: { layers: ['shared', 'package.json'], packages: null },
  server: {
    layers: ['chem', 'notes', 'service', 'shared', 'server'],
    packages: /^(vscode-languageserver(\/.*)?|vscode-languageserver-textdocument|vscode-jsonrpc(\/.*)?|node:.*)$/,
  },
  cli: { layers: ['chem', 'notes', 'service', 'shared', 'cli', 'package.json', 'media'], packages: /^(node:.*|markdown-it)$/ },
  client: { layers: ['client', 'service', 'shared'], packages: /^(vscode|vscode-languageclient(\/.*)?|node:.*|markdown-it)$/ },
};

describe('the layers', () => {
  const all = [...files(SRC.server), ...files(SRC.client)];

  it('finds the source files and their imports', () => {
    expect(all.length).toBeGreaterThan(40);
    expect(
      importsOf("import { a } from './x';\nimport type { B } from 'markdown-it';\nconst c = require('node:fs');").map((i) => [i.spec, i.typeOnly]),
    ).toEqual([
      ['./x', false],
      ['markdown-it', true],
      ['node:fs', false],
    ]);
  });

  for (const file of all) {
    const layer = layerOf(file);
    const name = relative(ROOT, file);
    it(`${name} imports only what the ${layer} layer may`, () => {
      const rule = ALLOWED[layer];
      expect(rule, `no rule for layer ${layer}`).toBeDefined();
      for (const imp of importsOf(readFileSync(file, 'utf8'))) {
        const where = `${name}:${imp.line} imports '${imp.spec}'`;
        if (imp.spec.startsWith('.')) {
          const target = resolve(dirname(file), imp.spec);
          const targetLayer = target.startsWith(join(ROOT, 'media'))
            ? 'media'
            : layerOf(target.endsWith('.json') || target.endsWith('.css') ? target : target + '.ts');
          expect(rule.layers, where).toContain(targetLayer);
        } else if (imp.typeOnly && rule.typePackages?.test(imp.spec)) {
          continue;
        } else {
          expect(rule.packages?.test(imp.spec) ?? false, where).toBe(true);
        }
      }
    });
  }
});
