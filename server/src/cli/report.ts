/** `ionwright report <path> [--html <out.html>]`: the HTML report of one notes file (service/report.ts). */
import MarkdownIt from 'markdown-it';
import { basename } from 'node:path';
import PREVIEW_CSS from '../../../media/preview.css';
import { createLanguageService } from '../service/languageService';
import { reportHtml } from '../service/report';
import { VERSION } from './version';
import { emptyReport, guardOutputPath, loadFiles, parse, reasonOf, UsageError, type CliIO } from './io';
import { visibleText } from './text';

export async function report(args: string[], io: CliIO): Promise<number> {
  const { values, positionals } = parse(args, { html: { type: 'string' } });
  if (positionals.length !== 1) throw new UsageError('report needs exactly one notes file, e.g. ionwright report notes/trial.md --html trial.html');
  const out = values.html as string | undefined;
  const toFile = out !== undefined && out !== '-';
  // Before any work: the page must not land on what the user wrote.
  if (toFile) guardOutputPath(out, positionals, io);
  const inputs = emptyReport();
  const files = loadFiles(positionals, io, inputs);
  if (inputs.problems.length) throw new UsageError(`${inputs.problems[0].path}: ${inputs.problems[0].message}`);
  if (files.length !== 1) throw new UsageError(`${positionals[0]}: report takes one notes file, not a folder`);
  const [file] = files;
  // Control characters of the notes are shown as pictures on the page too, as in every text output.
  const html = visibleText(
    reportHtml(file.doc, {
      title: basename(file.path),
      css: PREVIEW_CSS,
      markdownIt: () => new MarkdownIt(),
      generator: `Ionwright ${VERSION}, ${new Date().toISOString().slice(0, 10)}`,
    }),
  );
  if (!toFile) await io.out(html);
  else {
    if (!io.writeFile) throw new UsageError('report cannot write files here; use --html - for standard output');
    try {
      io.writeFile(out, html);
    } catch (e) {
      throw new UsageError(`${out}: cannot be written: ${reasonOf(e)}`);
    }
    io.err(`ionwright: wrote ${out}`);
  }
  return createLanguageService()
    .diagnostics(file.doc)
    .some((d) => d.severity === 1)
    ? 1
    : 0;
}
