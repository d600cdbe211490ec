/**
 * Hostile text in the notes — markup, quotes, ampersands — in formulas, batch names, batch lines (whose
 * messages quote them), equations and prose never reaches the preview's or the report's HTML unescaped:
 * a fast-check property over both (the HTML is built by service/html.ts, which escapes every value).
 */
import { load } from 'cheerio';
import fc from 'fast-check';
import MarkdownIt from 'markdown-it';
import { describe, expect, it } from 'vitest';
import { analyseDocument } from '../../server/src/service/document';
import { html, trusted } from '../../server/src/service/html';
import { ionwrightPreview } from '../../server/src/service/preview';
import { reportHtml } from '../../server/src/service/report';

const HOSTILE = [
  '<script>alert(1)</script>',
  '<img src=x onerror=alert(1)>',
  '"><b id="pwn">',
  "' onmouseover='alert(1)",
  '&amp;',
  '&',
  '&lt;',
  '<!--',
  ']]>',
  '`',
  '|',
  '\\',
  '</td></tr></table>',
  '<svg onload=alert(1)>',
];
const CHEM = ['NaCl', 'CuSO4·5H2O', 'SO4^2-', 'Xx', 'Ca(NO3', 'H2 + O2 -> H2O', '1 g', '2 M', 'mL', '@ 99%'];

const text = fc.array(fc.constantFrom(...HOSTILE, ...CHEM, ' '), { minLength: 1, maxLength: 6 }).map((p) => p.join(''));
const line = text.map((t) => t.replace(/[\r\n]/g, ' '));

/** A note with the hostile text in every place a user writes. */
const note = fc
  .record({ heading: line, name: line, formula: line, batchLine: line, equation: line, prose: line, code: line.map((t) => t.replace(/`/g, '')) })
  .map((n) =>
    [
      `# ${n.heading}`,
      '',
      `Prose: ${n.prose} with \`${n.code}\` and NaCl.`,
      '',
      '```batch',
      `name: ${n.name}`,
      'volume: 1 L',
      `${n.formula} 1 g`,
      n.batchLine,
      'NaCl 2 g',
      '```',
      '',
      '```reaction',
      n.equation,
      `${n.formula} -> H2O`,
      '```',
      '',
    ].join('\n'),
  );

/** Every `&` starts an entity; no element or attribute came from the notes' text. */
function expectEscaped(page: string) {
  const body = page.replace(/<style>[\s\S]*?<\/style>/g, '');
  expect(body).not.toMatch(/&(?![a-zA-Z]+;|#\d+;|#x[0-9a-fA-F]+;)/);
  const $ = load(page);
  expect($('script, img, iframe, object, embed, b#pwn, svg[onload]').length).toBe(0);
  $('*').each((_, e) => {
    for (const name of Object.keys((e as { attribs?: Record<string, string> }).attribs ?? {})) expect(name.startsWith('on'), `attribute ${name}`).toBe(false);
  });
}

describe('hostile text never reaches the HTML unescaped', () => {
  it('the html builder escapes every value and keeps what is marked safe', () => {
    const v = '<script>"&\'</script>';
    expect(html`<p title="${v}">${v}</p>`.value).toBe(
      '<p title="&lt;script&gt;&quot;&amp;&#39;&lt;/script&gt;">&lt;script&gt;&quot;&amp;&#39;&lt;/script&gt;</p>',
    );
    expect(html`<p>${trusted('<b>ok</b>')}${[v, html`<i>x</i>`]}${null}${false}</p>`.value).toBe(
      '<p><b>ok</b>&lt;script&gt;&quot;&amp;&#39;&lt;/script&gt;<i>x</i></p>',
    );
  });

  it('in the preview (property)', () => {
    fc.assert(
      fc.property(note, (src) => {
        expectEscaped(new MarkdownIt().use(ionwrightPreview).render(src));
      }),
      { numRuns: 150 },
    );
  });

  it('in the report (property), whose title is the file name', () => {
    fc.assert(
      fc.property(note, line, (src, title) => {
        const page = reportHtml(analyseDocument(src, 'markdown'), { title, css: '', markdownIt: () => new MarkdownIt() });
        expectEscaped(page);
        // The title and the batch name read back as written.
        const $ = load(page);
        expect($('header h1').text()).toBe(title);
      }),
      { numRuns: 60 },
    );
  });

  it('a batch name and a formula with markup read back as text', () => {
    const src = '```batch\nname: <b id="pwn">R&D</b> "1"\nvolume: 1 L\n<script>x</script> 1 g\nNaCl 1 g\n```\n';
    const page = reportHtml(analyseDocument(src, 'markdown'), { title: 'x', css: '', markdownIt: () => new MarkdownIt() });
    const $ = load(page);
    expect($('#batches ~ figure.iw-batch .iw-batch-name').first().text()).toBe('<b id="pwn">R&D</b> "1"');
    expect($('#batches ~ figure.iw-batch tr.iw-skipped code').first().text()).toBe('<script>x</script> 1 g');
    expectEscaped(page);
  });
});
