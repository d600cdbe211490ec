/** The commands beyond card and check: balance, batch, table, demo. */
import { analyseReaction } from '../chem/equation';
import { cardText } from '../service/card';
import { documentDiagnostics } from '../service/diagnostics';
import { batchJson } from '../service/batchJson';
import { batchTable, documentTables } from '../service/tables';
import { DEFAULT_SETTINGS } from '../service/settings';
import { report } from './report';
import { loadFiles, parse, UsageError, type CliIO, type FileProblem } from './io';

export type Command = (args: string[], io: CliIO) => number;

const hasErrors = (diags: Array<{ severity: number }>) => diags.some((d) => d.severity === 1);

/** Read exactly one notes file (for batch and table). */
function oneFile(args: string[], io: CliIO, command: string, options: Parameters<typeof parse>[1]) {
  const { values, positionals } = parse(args, options);
  if (positionals.length !== 1) throw new UsageError(`${command} needs exactly one file`);
  const problems: FileProblem[] = [];
  const files = loadFiles(positionals, io, problems);
  if (problems.length) throw new UsageError(`${problems[0].path}: ${problems[0].message}`);
  if (files.length === 0) throw new UsageError(`${positionals[0]}: no notes files found`);
  return { values, files };
}

const balance: Command = (args, io) => {
  const { values, positionals } = parse(args, { json: { type: 'boolean' } });
  if (positionals.length !== 1) throw new UsageError('balance needs one equation in quotes, e.g. ionwright balance "H2 + O2 -> H2O"');
  const r = analyseReaction(positionals[0].trim());
  const b = r.balance;
  if (values.json) {
    io.out(JSON.stringify({ input: positionals[0], status: b.status, balanced: b.balancedText, coefficients: b.coefficients, message: b.message, differences: b.differences, charge: b.charge, diagnostics: r.diagnostics }, null, 2));
  } else {
    io.out(`${b.status}: ${b.balancedText ?? positionals[0]}`);
    if (b.message) io.out(b.message);
    for (const d of r.parsed.diagnostics) io.out(`  ${d.severity} [${d.code}] col ${d.start + 1}: ${d.message}`);
  }
  return r.parsed.diagnostics.some((d) => d.severity === 'error') ? 1 : 0;
};

const batch: Command = (args, io) => {
  const { values, files } = oneFile(args, io, 'batch', { json: { type: 'boolean' } });
  const doc = files[0].doc;
  if (values.json) io.out(JSON.stringify(doc.batches.map((b) => batchJson(doc, b)), null, 2));
  else io.out(doc.batches.map((b) => batchTable(b.analysis, DEFAULT_SETTINGS)).join('\n\n') || 'No batch blocks in this file.');
  return hasErrors(documentDiagnostics(doc)) ? 1 : 0;
};

const table: Command = (args, io) => {
  const { files } = oneFile(args, io, 'table', {});
  const doc = files[0].doc;
  io.out(documentTables(doc) || '_No formulas or batches in this file._');
  return hasErrors(documentDiagnostics(doc)) ? 1 : 0;
};

const demo: Command = (args, io) => {
  const { positionals } = parse(args, {});
  const problems: FileProblem[] = [];
  const files = loadFiles(positionals.length ? positionals : ['examples'], io, problems);
  if (files.length === 0) throw new UsageError('no notes files found');
  for (const f of files) {
    io.out(`\n════ ${f.path}\n`);
    const seen = new Set<string>();
    io.out('── Cards of the formulas in the notes\n');
    for (const occ of f.doc.formulas) {
      if (seen.has(occ.analysis.ascii) || !occ.analysis.ok) continue;
      seen.add(occ.analysis.ascii);
      io.out(cardText(occ.analysis, DEFAULT_SETTINGS) + '\n');
    }
    const diags = documentDiagnostics(f.doc);
    io.out(`── ${diags.length} finding${diags.length === 1 ? '' : 's'}\n`);
    for (const d of diags) io.out(`${f.path}:${d.range.start.line + 1}:${d.range.start.character + 1}: [${d.code}] ${d.message}`);
    io.out('\n── Tables (what "Insert tables" writes into the report)\n');
    io.out(documentTables(f.doc));
  }
  for (const p of problems) io.err(`ionwright: ${p.path}: ${p.message}`);
  return problems.length ? 2 : 0;
};

export const extraCommands: Record<string, Command> = { balance, batch, table, demo, report };
