/**
 * SARIF 2.1.0 output for `check --format sarif` (OASIS Static Analysis Results Interchange Format 2.1.0;
 * columns in UTF-16 code units, as in the LSP ranges the findings come in).
 *
 * Made for code-scanning services as well as for viewers: files under the working folder get relative,
 * percent-encoded URIs against the base `%SRCROOT%`, which `originalUriBaseIds` maps to the working
 * folder's file URI; files elsewhere get absolute file URIs. Every rule has an id, a short description
 * and a default level, and every result points at its rule with `ruleIndex`. Files that could not be
 * read or analysed are tool execution notifications, and make the run not successful.
 */
import { isAbsolute, relative, sep } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { LspDiagnostic } from '../service/diagnostics';
import { VERSION } from './version';

type Level = 'error' | 'warning' | 'note';
const LEVEL: Record<LspDiagnostic['severity'], Level> = { 1: 'error', 2: 'warning', 3: 'note', 4: 'note' };

/** Every finding the analysis makes, with the level it is reported at. */
export const RULES: Record<string, { level: Level; text: string }> = {
  'unknown-element': { level: 'error', text: 'A symbol in a formula that is no element (nor a known ligand abbreviation).' },
  'malformed-formula': { level: 'error', text: 'A formula that cannot be read: unbalanced brackets, stray characters, impossible counts.' },
  'charge-imbalance': { level: 'warning', text: 'A neutral formula whose ions or oxidation states cannot sum to zero, or an ion whose written charge disagrees with its composition.' },
  'no-standard-weight': { level: 'note', text: 'An element without a standard atomic weight; the molar mass uses the mass number of a long-lived isotope.' },
  'unbalanced-equation': { level: 'warning', text: 'A reaction whose atoms or charges differ between the sides.' },
  'ambiguous-equation': { level: 'note', text: 'A reaction that balances in more than one independent way.' },
  'impossible-equation': { level: 'note', text: 'A reaction that cannot be balanced with positive coefficients.' },
  'equation-too-large': { level: 'note', text: 'A reaction too large to be balanced exactly.' },
  'missing-arrow': { level: 'error', text: 'A reaction without an arrow between reactants and products.' },
  'multiple-arrows': { level: 'error', text: 'A reaction with more than one arrow.' },
  'empty-side': { level: 'error', text: 'A reaction with nothing before or after its arrow.' },
  'empty-species': { level: 'error', text: "A reaction with an empty place between '+' signs." },
  'bad-coefficient': { level: 'error', text: 'A coefficient in a reaction that is not a positive number.' },
  'missing-formula': { level: 'error', text: 'A coefficient in a reaction with no formula after it.' },
  'batch-header': { level: 'warning', text: "A batch header line (such as 'volume:') given twice." },
  'batch-amount': { level: 'error', text: 'An amount in a batch that is missing, not a positive number, or beyond what the batch can hold.' },
  'batch-unit': { level: 'error', text: 'A unit in a batch that is missing or unknown.' },
  'batch-syntax': { level: 'error', text: 'Unexpected text after an amount in a batch line.' },
  'batch-no-volume': { level: 'error', text: "A target concentration in a batch without the batch's final volume." },
  'batch-no-total': { level: 'error', text: "A wt% target in a batch without the batch's total mass." },
  'batch-charge': { level: 'warning', text: 'Ions listed on their own in a batch that leave it with a net charge.' },
  'batch-unclosed': { level: 'warning', text: 'A batch block that is never closed.' },
  'not-text': { level: 'warning', text: 'A notes file with NUL bytes, which does not look like text.' },
};

export const SRCROOT = '%SRCROOT%';

/** A relative path as a relative URI reference: each segment percent-encoded (so ':' cannot read as a scheme). */
function relativeUri(rel: string): string {
  return rel.split(sep).join('/').split('/').map(encodeURIComponent).join('/');
}

/** Where a file is, for `artifactLocation`: relative to %SRCROOT% inside the working folder, else absolute. */
export function artifactLocation(absPath: string, cwd: string): { uri: string; uriBaseId?: string } {
  const rel = relative(cwd, absPath);
  if (rel && !isAbsolute(rel) && rel !== '..' && !rel.startsWith('..' + sep)) return { uri: relativeUri(rel), uriBaseId: SRCROOT };
  return { uri: pathToFileURL(absPath).href };
}

export interface SarifOptions {
  /** The working folder; %SRCROOT%. */
  cwd: string;
  /** Files that could not be read or analysed (absolute paths). */
  problems?: Array<{ path: string; message: string }>;
}

export function toSarif(files: Array<{ path: string; diagnostics: LspDiagnostic[] }>, options: SarifOptions) {
  const rules: Array<{ id: string; shortDescription: { text: string }; defaultConfiguration: { level: Level } }> = [];
  const ruleIndex = new Map<string, number>();
  const addRule = (id: string, level: Level, text: string) => {
    ruleIndex.set(id, rules.length);
    rules.push({ id, shortDescription: { text }, defaultConfiguration: { level } });
  };
  for (const [id, r] of Object.entries(RULES)) addRule(id, r.level, r.text);
  // A code this catalogue does not know yet still gets a rule, at the level it was first seen with.
  for (const f of files) for (const d of f.diagnostics) if (!ruleIndex.has(d.code)) addRule(d.code, LEVEL[d.severity], d.code);

  const problems = options.problems ?? [];
  const base = pathToFileURL(options.cwd).href;
  return {
    $schema: 'https://json.schemastore.org/sarif-2.1.0.json',
    version: '2.1.0' as const,
    runs: [
      {
        tool: { driver: { name: 'ionwright', version: VERSION, semanticVersion: VERSION, rules } },
        originalUriBaseIds: { [SRCROOT]: { uri: base.endsWith('/') ? base : base + '/' } },
        columnKind: 'utf16CodeUnits' as const,
        invocations: [
          {
            executionSuccessful: problems.length === 0,
            ...(problems.length
              ? {
                  toolExecutionNotifications: problems.map((p) => ({
                    level: 'error' as const,
                    message: { text: p.message },
                    locations: [{ physicalLocation: { artifactLocation: artifactLocation(p.path, options.cwd) } }],
                  })),
                }
              : {}),
          },
        ],
        results: files.flatMap((f) => {
          const artifact = artifactLocation(f.path, options.cwd);
          return f.diagnostics.map((d) => ({
            ruleId: d.code,
            ruleIndex: ruleIndex.get(d.code) as number,
            level: LEVEL[d.severity],
            message: { text: d.message },
            locations: [
              {
                physicalLocation: {
                  artifactLocation: artifact,
                  region: {
                    startLine: d.range.start.line + 1,
                    startColumn: d.range.start.character + 1,
                    endLine: d.range.end.line + 1,
                    endColumn: d.range.end.character + 1,
                  },
                },
              },
            ],
          }));
        }),
      },
    ],
  };
}
