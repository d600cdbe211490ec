/** The commands beyond card and check: balance, batch, table, demo. */
import { analyseFormula } from '../chem/analyse';
import { cardText } from '../service/card';
import { documentDiagnostics } from '../service/diagnostics';
import { DEFAULT_SETTINGS } from '../service/settings';
import { loadFiles, parse, UsageError, type CliIO, type FileProblem } from './io';

export type Command = (args: string[], io: CliIO) => number;

const demo: Command = (args, io) => {
  const { positionals } = parse(args, {});
  const problems: FileProblem[] = [];
  const files = loadFiles(positionals.length ? positionals : ['examples'], io, problems);
  for (const f of files) {
    io.out(`\n=== ${f.path}\n`);
    const seen = new Set<string>();
    for (const occ of f.doc.formulas) {
      if (seen.has(occ.ref.text)) continue;
      seen.add(occ.ref.text);
      io.out(cardText(analyseFormula(occ.ref.text, DEFAULT_SETTINGS.chem)) + '\n');
    }
    const diags = documentDiagnostics(f.doc);
    io.out(`--- ${diags.length} finding${diags.length === 1 ? '' : 's'}`);
    for (const d of diags) io.out(`${f.path}:${d.range.start.line + 1}:${d.range.start.character + 1}: [${d.code}] ${d.message}`);
  }
  for (const p of problems) io.err(`ionwright: ${p.path}: ${p.message}`);
  if (files.length === 0) throw new UsageError('no notes files found');
  return problems.length ? 2 : 0;
};

export const extraCommands: Record<string, Command> = { demo };
