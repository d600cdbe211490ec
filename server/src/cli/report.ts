/** `ionwright report <path> --html <out.html>`: the HTML report of one notes file (service/report.ts). */
import MarkdownIt from 'markdown-it';
import { basename } from 'node:path';
import PREVIEW_CSS from '../../../media/preview.css';
import { documentDiagnostics } from '../service/diagnostics';
import { reportHtml } from '../service/report';
import { VERSION } from './version';
import { loadFiles, parse, UsageError, type CliIO, type FileProblem } from './io';

export function report(args: string[], io: CliIO): number {
  const { values, positionals } = parse(args, { html: { type: 'string' } });
  if (positionals.length !== 1) throw new UsageError('report needs exactly one notes file, e.g. ionwright report notes/trial.md --html trial.html');
  const problems: FileProblem[] = [];
  const files = loadFiles(positionals, io, problems);
  if (problems.length) throw new UsageError(`${problems[0].path}: ${problems[0].message}`);
  if (files.length !== 1) throw new UsageError(`${positionals[0]}: report takes one notes file, not a folder`);
  const [file] = files;
  const html = reportHtml(file.doc, {
    title: basename(file.path),
    css: PREVIEW_CSS,
    markdownIt: () => new MarkdownIt(),
    generator: `Ionwright ${VERSION}, ${new Date().toISOString().slice(0, 10)}`,
  });
  const out = values.html as string | undefined;
  if (out === undefined || out === '-') io.out(html);
  else {
    if (!io.writeFile) throw new UsageError('report cannot write files here; use --html - for standard output');
    try {
      io.writeFile(out, html);
    } catch (e) {
      throw new UsageError(`${out}: cannot be written (${(e as NodeJS.ErrnoException).code ?? 'error'})`);
    }
    io.err(`ionwright: wrote ${out}`);
  }
  return documentDiagnostics(file.doc).some((d) => d.severity === 1) ? 1 : 0;
}
