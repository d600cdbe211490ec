/** The commands beyond card and check: balance, batch, table, demo. */
import { createLanguageService } from '../service/languageService';
import { displayPath, reportInputs } from './check';
import { report } from './report';
import { emptyReport, loadFiles, parse, UsageError, type CliIO, type LoadedFile } from './io';
import { findingLine, jsonText, OutputWriter, visibleLine, writeJsonArray } from './text';

export type Command = (args: string[], io: CliIO) => number | Promise<number>;

const hasErrors = (diags: Array<{ severity: number }>) => diags.some((d) => d.severity === 1);
/** The command line reads notes with the default settings. */
const service = createLanguageService();

/**
 * The notes files of batch and table: every file the paths name, folders recursively, as check reads
 * them. `many` is true when the paths could name more than one file (a folder, or several paths): the
 * text output then heads each file's part with its path.
 */
function notesFiles(positionals: string[], io: CliIO, command: string) {
  if (positionals.length === 0) throw new UsageError(`${command} needs a notes file or a folder`);
  const inputs = emptyReport();
  const files = loadFiles(positionals, io, inputs);
  if (files.length === 0 && inputs.problems.length === 0) throw new UsageError(`${positionals.join(', ')}: no notes files found`);
  const many = positionals.length > 1 || files.some((f) => !positionals.includes(f.path));
  const display = displayPath(io);
  /** Exit status as check's: 2 when a file could not be read, else 1 for error-severity findings. */
  const status = () => {
    reportInputs(io, inputs, display);
    if (inputs.problems.length) return 2;
    return files.some((f) => hasErrors(service.diagnostics(f.doc))) ? 1 : 0;
  };
  return { files, many, display, status };
}

/** The line that heads one file's part of the output. */
const heading = (display: (p: string) => string, f: LoadedFile) => `════ ${visibleLine(display(f.path))}`;

/** Text mode: status line, the equation once (balanced, or as written where it is already), then what the message adds. */
const balance: Command = (args, io) => {
  const { values, positionals } = parse(args, { json: { type: 'boolean' } });
  if (positionals.length !== 1) throw new UsageError('balance needs one equation in quotes, e.g. ionwright balance "H2 + O2 -> H2O"');
  const input = positionals[0].trim();
  const r = service.reaction(input);
  const b = r.balance;
  if (values.json) {
    io.out(
      jsonText({
        input: positionals[0],
        status: b.status,
        balanced: b.balancedText,
        coefficients: b.coefficients,
        message: b.message,
        differences: b.differences,
        charge: b.charge,
        diagnostics: r.diagnostics,
      }),
    );
  } else {
    const shown = b.status === 'already-balanced' ? input : (b.balancedText ?? input);
    const lines = [`${b.status}: ${shown}`];
    // "Balanced: <equation>" says again what the first line says.
    if (b.message && !b.message.includes(shown) && !(b.status === 'balanced' && b.balancedDisplay && b.message.includes(b.balancedDisplay)))
      lines.push(b.message);
    for (const d of r.parsed.diagnostics) lines.push(`  ${d.severity} [${d.code}] col ${d.start + 1}: ${d.message}`);
    io.out(lines.join('\n'));
  }
  return r.parsed.diagnostics.some((d) => d.severity === 'error') ? 1 : 0;
};

const batch: Command = async (args, io) => {
  const { values, positionals } = parse(args, { json: { type: 'boolean' } });
  const { files, many, display, status } = notesFiles(positionals, io, 'batch');
  const w = new OutputWriter((t) => io.out(t));
  if (values.json) {
    const items = files.flatMap((f) => service.batchesJson(f.doc).map((b) => ({ file: display(f.path), ...b })));
    await writeJsonArray(w, items);
  } else {
    for (const [i, f] of files.entries()) {
      const body = service.batchTexts(f.doc).join('\n\n') || 'No batch blocks in this file.';
      const p = w.line(many ? `${i ? '\n' : ''}${heading(display, f)}\n\n${body}` : body);
      if (p) await p;
    }
  }
  await w.flush();
  return status();
};

const table: Command = async (args, io) => {
  const { positionals } = parse(args, {});
  const { files, many, display, status } = notesFiles(positionals, io, 'table');
  const w = new OutputWriter((t) => io.out(t));
  for (const [i, f] of files.entries()) {
    const body = service.tables(f.doc) || '_No formulas or batches in this file._';
    const p = w.line(many ? `${i ? '\n' : ''}${heading(display, f)}\n\n${body}` : body);
    if (p) await p;
  }
  await w.flush();
  return status();
};

const demo: Command = async (args, io) => {
  const { positionals } = parse(args, {});
  const inputs = emptyReport();
  const files = loadFiles(positionals.length ? positionals : ['examples'], io, inputs);
  if (files.length === 0 && inputs.problems.length === 0) throw new UsageError('no notes files found');
  const display = displayPath(io);
  for (const f of files) {
    // Pieces as separate lines would print them: each ends with a newline.
    const pieces: string[] = [];
    const put = (t: string) => pieces.push(t.endsWith('\n') ? t : t + '\n');
    put(`\n${heading(display, f)}\n`);
    put('── Cards of the formulas in the notes\n');
    const seen = new Set<string>();
    for (const occ of f.doc.formulas) {
      if (seen.has(occ.analysis.ascii) || !occ.analysis.ok) continue;
      seen.add(occ.analysis.ascii);
      put(service.cardText(occ.analysis.input) + '\n');
    }
    const diags = service.diagnostics(f.doc);
    put(`── ${diags.length} finding${diags.length === 1 ? '' : 's'}\n`);
    const file = display(f.path);
    for (const d of diags) put(findingLine(file, d));
    put('\n── Tables (what "Insert tables" writes into the report)\n');
    put(service.tables(f.doc));
    await io.out(pieces.join(''));
  }
  reportInputs(io, inputs, display);
  return inputs.problems.length ? 2 : 0;
};

export const extraCommands: Record<string, Command> = { balance, batch, table, demo, report };
