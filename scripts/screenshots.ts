/**
 * The README's pictures, from the real service output: the hover card of a formula, a diagnostic with its
 * quick fixes, the Markdown preview and the HTML report, rendered in headless Chromium (Debian's chromium at
 * /usr/bin/chromium via playwright-core) and written to docs/images/. The editor frame around the hover and
 * the quick fixes is a plain one of our own, not a copy of any editor's.
 *
 *   npm run screenshots
 */
import MarkdownIt from 'markdown-it';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { chromium } from 'playwright-core';
import { codeActions } from '../server/src/service/actions';
import { documentDiagnostics } from '../server/src/service/diagnostics';
import { analyseDocument } from '../server/src/service/document';
import { hover } from '../server/src/service/hover';
import { ionwrightPreview } from '../server/src/service/preview';
import { reportHtml } from '../server/src/service/report';
import { escapeHtml } from '../server/src/service/typeset';

const OUT = 'docs/images';
const CSS = readFileSync('media/preview.css', 'utf8');

const FRAME_CSS = `
body { margin: 0; padding: 0; background: #eef0f3; font: 14px/1.45 system-ui, sans-serif; color: #1d2126; }
.shot { display: inline-block; padding: 18px; background: #eef0f3; }
.editor { background: #ffffff; border: 1px solid #c9ced6; border-radius: 6px; width: 760px; padding: 10px 0 14px; position: relative; overflow: hidden; }
.line { font: 13.5px/1.7 ui-monospace, Menlo, Consolas, monospace; white-space: pre; padding-left: 52px; position: relative; }
.line::before { content: attr(data-n); position: absolute; left: 0; width: 38px; text-align: right; color: #9aa1ab; }
.squiggle { text-decoration: underline wavy #c27803; text-underline-offset: 3px; }
.squiggle.err { text-decoration-color: #c62828; }
.popup { position: relative; margin: 4px 0 0 120px; width: 560px; background: #fbfbfc; border: 1px solid #b9c0ca; border-radius: 5px;
  box-shadow: 0 4px 14px rgba(30, 40, 60, 0.16); padding: 8px 14px; font-size: 13.5px; }
.popup p { margin: 0.35em 0; } .popup hr { border: 0; border-top: 1px solid #d6dae0; margin: 0.5em 0; }
.popup code { font: 12.5px ui-monospace, Menlo, Consolas, monospace; background: #eef0f3; padding: 0 3px; border-radius: 3px; }
.popup pre { background: #eef0f3; padding: 4px 8px; border-radius: 3px; }
.menu { margin: 6px 0 0 120px; width: 380px; background: #fbfbfc; border: 1px solid #b9c0ca; border-radius: 5px; box-shadow: 0 4px 14px rgba(30,40,60,.16); padding: 4px 0; }
.menu div { padding: 3px 12px; } .menu div.first { background: #dfe9f7; } .menu .kind { color: #6b7380; font-size: 12px; margin-left: 8px; }
.caption { font-size: 12.5px; color: #5b6470; margin: 8px 2px 0; }
`;

const page = (body: string, extraCss = '') =>
  `<!doctype html><html><head><meta charset="utf-8"><style>${FRAME_CSS}</style><style>${extraCss}</style></head><body><div class="shot">${body}</div></body></html>`;

function editorLines(text: string, first: number, count: number, decorate: (line: number, html: string) => string): string {
  return text
    .split('\n')
    .slice(first, first + count)
    .map((l, k) => `<div class="line" data-n="${first + k + 1}">${decorate(first + k, escapeHtml(l)) || ' '}</div>`)
    .join('');
}

async function main() {
  mkdirSync(OUT, { recursive: true });
  const md = new MarkdownIt();
  const note = readFileSync('examples/rinse-trials.md', 'utf8');
  const doc = analyseDocument(note, 'markdown');

  // 1. A hover card: the pentahydrate in the sealing step.
  const at = note.indexOf('CuSO4.5H2O') + 3;
  const h = hover(doc, at)!;
  const hoverLine = doc.lines.positionAt(at).line;
  const hoverHtml = page(`<div class="editor">${editorLines(note, hoverLine - 1, 3, (_n, l) => l)}<div class="popup">${md.render(h.markdown)}</div></div>
    <p class="caption">Hovering <code>CuSO4.5H2O</code> in examples/rinse-trials.md (the card is the server's hover, rendered as Markdown).</p>`);

  // 2. A diagnostic with its quick fixes: the old label Al(OH)2.
  const diag = documentDiagnostics(doc).find((d) => d.code === 'charge-imbalance')!;
  const start = doc.lines.offsetAt(diag.range.start);
  const end = doc.lines.offsetAt(diag.range.end);
  const actions = codeActions(doc, start, end).filter((a) => a.kind === 'quickfix' || a.kind.startsWith('refactor'));
  const l = diag.range.start.line;
  const fixHtml = page(`<div class="editor">${editorLines(note, l - 1, 3, (n, html) => {
    if (n !== l) return html;
    const raw = note.split('\n')[n];
    return (
      escapeHtml(raw.slice(0, diag.range.start.character)) +
      `<span class="squiggle">${escapeHtml(raw.slice(diag.range.start.character, diag.range.end.character))}</span>` +
      escapeHtml(raw.slice(diag.range.end.character))
    );
  })}<div class="popup"><p><strong>warning</strong> <code>${escapeHtml(diag.code)}</code>: ${escapeHtml(diag.message)}</p></div>
    <div class="menu">${actions.map((a, k) => `<div class="${k === 0 ? 'first' : ''}">${escapeHtml(a.title)}<span class="kind">${a.kind === 'quickfix' ? 'quick fix' : 'refactor'}</span></div>`).join('')}</div></div>
    <p class="caption">The warning on <code>Al(OH)2</code> and the code actions the server offers there (the first is preferred).</p>`);

  // 3. The Markdown preview of the demo notes, light.
  const previewHtml = `<!doctype html><html><head><meta charset="utf-8"><style>body{font:14px/1.5 system-ui,sans-serif;max-width:880px;padding:10px 24px;color:#1d2126;background:#fff}code{font-size:.92em}</style><style>${CSS}</style></head><body>${new MarkdownIt().use(ionwrightPreview).render(note)}</body></html>`;

  // 4. The HTML report.
  const report = reportHtml(doc, { title: 'rinse-trials.md', css: CSS, markdownIt: () => new MarkdownIt() });

  const browser = await chromium.launch({
    executablePath: process.env.IONWRIGHT_CHROMIUM ?? '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
  });
  try {
    const shoot = async (html: string, file: string, width: number, clip?: string, scheme: 'light' | 'dark' = 'light') => {
      const p = await browser.newPage({ viewport: { width, height: 600 }, deviceScaleFactor: 1, colorScheme: scheme });
      await p.setContent(html);
      if (clip)
        await p
          .locator(clip)
          .first()
          .screenshot({ path: join(OUT, file) });
      else await p.screenshot({ path: join(OUT, file), fullPage: true });
      await p.close();
    };
    await shoot(hoverHtml, 'hover-card.png', 840, '.shot');
    await shoot(fixHtml, 'quick-fix.png', 840, '.shot');
    await shoot(previewHtml, 'preview.png', 940);
    await shoot(report, 'report.png', 1100, 'figure.iw-chart');
    await shoot(report, 'report-page.png', 1100, undefined, 'dark');
  } finally {
    await browser.close();
  }
  writeFileSync(
    join(OUT, 'README.md'),
    '# Pictures for the README\n\nWritten by `npm run screenshots` (scripts/screenshots.ts) from the demo notes; do not edit by hand.\n',
  );
  console.log(`pictures written to ${OUT}/`);
}

main().catch((e) => {
  console.error(`screenshots: ${(e as Error).message}`);
  process.exitCode = 1;
});
