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
import { DIAGNOSTIC_CATALOGUE, DIAGNOSTIC_CODES } from '../chem/codes';
import { SEVERITY_NUMBER } from '../chem/diagnostic';
import type { LspDiagnostic } from '../service/diagnostics';
import { jsonNumber, jsonString, jsonText, recurringJson, writeJsonArray, type OutputWriter } from './text';
import { VERSION } from './version';

type Level = 'error' | 'warning' | 'note';
/** SARIF has no hint: information and hints are notes. */
const LEVEL: Record<LspDiagnostic['severity'], Level> = { 1: 'error', 2: 'warning', 3: 'note', 4: 'note' };

/**
 * A rule for every code findings are raised with, from the catalogue (chem/codes.ts), at the level it is
 * raised at; reserved codes get a rule once a stage raises them.
 */
export const RULES: Record<string, { level: Level; text: string }> = Object.fromEntries(
  DIAGNOSTIC_CODES.map((code) => [code, { level: LEVEL[SEVERITY_NUMBER[DIAGNOSTIC_CATALOGUE[code].severity]], text: DIAGNOSTIC_CATALOGUE[code].description }]),
);

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
  /** Files that could not be read or analysed (absolute paths): error notifications, the run not successful. */
  problems?: Array<{ path: string; message: string }>;
  /** What was left out on purpose, such as symbolic links not followed (absolute paths): note notifications. */
  notes?: Array<{ path: string; message: string }>;
}

type Files = Array<{ path: string; diagnostics: LspDiagnostic[] }>;

/** The log without its results, and the index of each rule. */
function sarifHead(files: Files, options: SarifOptions) {
  const rules: Array<{ id: string; shortDescription: { text: string }; defaultConfiguration: { level: Level } }> = [];
  const ruleIndex = new Map<string, number>();
  const addRule = (id: string, level: Level, text: string) => {
    ruleIndex.set(id, rules.length);
    rules.push({ id, shortDescription: { text }, defaultConfiguration: { level } });
  };
  for (const [id, r] of Object.entries(RULES)) addRule(id, r.level, r.text);
  // A code from outside the catalogue (the types rule it out; a worker's message is data) still gets a
  // rule, at the level it was first seen with.
  for (const f of files) for (const d of f.diagnostics) if (!ruleIndex.has(d.code)) addRule(d.code, LEVEL[d.severity], d.code);

  const problems = options.problems ?? [];
  const notifications = [
    ...problems.map((p) => ({ level: 'error' as const, path: p.path, message: p.message })),
    ...(options.notes ?? []).map((p) => ({ level: 'note' as const, path: p.path, message: p.message })),
  ];
  const base = pathToFileURL(options.cwd).href;
  const log = {
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
            ...(notifications.length
              ? {
                  toolExecutionNotifications: notifications.map((p) => ({
                    level: p.level,
                    message: { text: p.message },
                    locations: [{ physicalLocation: { artifactLocation: artifactLocation(p.path, options.cwd) } }],
                  })),
                }
              : {}),
          },
        ],
        results: [] as unknown[],
      },
    ],
  };
  return { log, ruleIndex };
}

type Finding = { artifact: { uri: string; uriBaseId?: string }; d: LspDiagnostic; ruleIndex: number };

/** The findings, in the files' order, each with its file's location and its rule. */
function* findings(files: Files, ruleIndex: Map<string, number>, cwd: string): Generator<Finding> {
  for (const f of files) {
    const artifact = artifactLocation(f.path, cwd);
    for (const d of f.diagnostics) yield { artifact, d, ruleIndex: ruleIndex.get(d.code) as number };
  }
}

/** One SARIF result. */
function result({ artifact, d, ruleIndex }: Finding) {
  return {
    ruleId: d.code,
    ruleIndex,
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
  };
}

/**
 * `indentedJson(result(f), inner)`, written directly (millions of findings spend most of their time
 * here); the artifact's text is made once per file.
 */
function resultRenderer() {
  let lastArtifact: Finding['artifact'] | undefined;
  let artifactText = '';
  return (f: Finding, inner: string): string => {
    const i1 = inner + '  ';
    const i2 = i1 + '  ';
    const i3 = i2 + '  ';
    const i4 = i3 + '  ';
    const i5 = i4 + '  ';
    if (f.artifact !== lastArtifact) {
      lastArtifact = f.artifact;
      artifactText = jsonText(f.artifact).replace(/\n/g, '\n' + i4);
    }
    const { d } = f;
    const num = jsonNumber;
    return (
      `${inner}{\n${i1}"ruleId": ${recurringJson(d.code)},\n${i1}"ruleIndex": ${num(f.ruleIndex)},\n${i1}"level": "${LEVEL[d.severity]}",\n` +
      `${i1}"message": {\n${i2}"text": ${jsonString(d.message)}\n${i1}},\n${i1}"locations": [\n${i2}{\n${i3}"physicalLocation": {\n` +
      `${i4}"artifactLocation": ${artifactText},\n${i4}"region": {\n` +
      `${i5}"startLine": ${num(d.range.start.line + 1)},\n${i5}"startColumn": ${num(d.range.start.character + 1)},\n` +
      `${i5}"endLine": ${num(d.range.end.line + 1)},\n${i5}"endColumn": ${num(d.range.end.character + 1)}\n` +
      `${i4}}\n${i3}}\n${i2}}\n${i1}]\n${inner}}`
    );
  };
}

/** The whole SARIF log as one object (for small inputs and tests; `writeSarif` streams the same text). */
export function toSarif(files: Files, options: SarifOptions) {
  const { log, ruleIndex } = sarifHead(files, options);
  log.runs[0].results = [...findings(files, ruleIndex, options.cwd)].map(result);
  return log;
}

/** Where the results go in the log's text: a string that no path or message can be (JSON escapes the NUL). */
const RESULTS_MARK = '\\u0000results';

/**
 * The SARIF log written result by result: the same text as `jsonText(toSarif(files, options))`, without
 * ever holding it as one string.
 */
export async function writeSarif(w: OutputWriter, files: Files, options: SarifOptions): Promise<void> {
  const { log, ruleIndex } = sarifHead(files, options);
  (log.runs[0] as { results: unknown }).results = '\u0000results'; // written by JSON as RESULTS_MARK
  const text = jsonText(log);
  const mark = `"results": "${RESULTS_MARK}"`;
  const at = text.indexOf(mark);
  const lineStart = text.lastIndexOf('\n', at) + 1;
  const indent = text.slice(lineStart, at);
  const before = text.slice(0, at + '"results": '.length);
  const after = text.slice(at + mark.length);
  // `before` ends inside the line that opens the array: write it without its last line, which
  // writeJsonArray writes with the '['.
  const head = before.slice(0, lineStart - 1);
  const p = w.line(head);
  if (p) await p;
  await writeJsonArray(w, findings(files, ruleIndex, options.cwd), { indent, open: before.slice(lineStart), close: after, render: resultRenderer() });
}
