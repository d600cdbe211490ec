/**
 * The command line: the language service over files. All IO is here; the service is pure.
 * Exit status: 0 ran without error-severity findings; 1 ran with them; 2 usage or input problem
 * (one line on stderr, never a stack trace).
 */
import { relative, resolve } from 'node:path';
import { analyseFormula } from '../chem/analyse';
import { cardJson, cardText } from '../service/card';
import { documentDiagnostics, type LspDiagnostic } from '../service/diagnostics';
import { DEFAULT_SETTINGS } from '../service/settings';
import { extraCommands } from './commands';
import { loadFiles, nodeIO, parse, UsageError, USAGE, type CliIO, type FileProblem } from './io';
import { toSarif } from './sarif';

export { nodeIO, type CliIO };

const SEVERITY_WORD = { 1: 'error', 2: 'warning', 3: 'info', 4: 'hint' } as const;

function cmdCard(args: string[], io: CliIO): number {
  const { values, positionals } = parse(args, { json: { type: 'boolean' } });
  if (positionals.length === 0) throw new UsageError('card needs at least one formula');
  const analyses = positionals.map((p) => analyseFormula(p.trim(), DEFAULT_SETTINGS.chem));
  if (values.json) io.out(JSON.stringify(analyses.map(cardJson), null, 2));
  else io.out(analyses.map((a) => cardText(a)).join('\n\n'));
  return analyses.some((a) => a.diagnostics.some((d) => d.severity === 'error')) ? 1 : 0;
}

function cmdCheck(args: string[], io: CliIO): number {
  const { values, positionals } = parse(args, { format: { type: 'string' } });
  const format = values.format ?? 'text';
  if (format !== 'text' && format !== 'json' && format !== 'sarif') throw new UsageError(`unknown format '${format}' (use text, json or sarif)`);
  if (positionals.length === 0) throw new UsageError('check needs at least one file or folder');
  const problems: FileProblem[] = [];
  const files = loadFiles(positionals, io, problems);
  const results = files.map((f) => ({ path: f.path, diagnostics: documentDiagnostics(f.doc) }));
  const display = (p: string) => relative(io.cwd, resolve(io.cwd, p)) || p;
  if (format === 'json') {
    io.out(JSON.stringify(results.flatMap((r) => r.diagnostics.map((d) => ({ file: display(r.path), ...d }))), null, 2));
  } else if (format === 'sarif') {
    io.out(JSON.stringify(toSarif(results.map((r) => ({ path: display(r.path), diagnostics: r.diagnostics }))), null, 2));
  } else {
    let errors = 0;
    let warnings = 0;
    for (const r of results) {
      for (const d of r.diagnostics) {
        if (d.severity === 1) errors++;
        if (d.severity === 2) warnings++;
        io.out(`${display(r.path)}:${d.range.start.line + 1}:${d.range.start.character + 1}: ${SEVERITY_WORD[d.severity]} [${d.code}] ${d.message}`);
      }
    }
    io.out(`${files.length} file${files.length === 1 ? '' : 's'} checked: ${errors} error${errors === 1 ? '' : 's'}, ${warnings} warning${warnings === 1 ? '' : 's'}.`);
  }
  for (const p of problems) io.err(`ionwright: ${display(p.path)}: ${p.message}`);
  if (problems.length) return 2;
  return results.some((r) => r.diagnostics.some((d: LspDiagnostic) => d.severity === 1)) ? 1 : 0;
}

export function run(argv: string[], io: CliIO = nodeIO): number {
  try {
    const [command, ...rest] = argv;
    switch (command) {
      case 'card':
        return cmdCard(rest, io);
      case 'check':
        return cmdCheck(rest, io);
      case undefined:
      case '--help':
      case '-h':
      case 'help':
        io.out(USAGE);
        return command === undefined ? 2 : 0;
      case '--version':
        io.out('ionwright 0.1.0');
        return 0;
      default: {
        const extra = extraCommands[command];
        if (extra) return extra(rest, io);
        throw new UsageError(`unknown command '${command}' (try: ionwright --help)`);
      }
    }
  } catch (e) {
    if (e instanceof UsageError) {
      io.err(`ionwright: ${e.message}`);
      return 2;
    }
    io.err(`ionwright: internal error: ${(e as Error)?.message ?? String(e)}`);
    return 2;
  }
}
