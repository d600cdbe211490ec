/**
 * Memory under long use, measured in a process of its own (so nothing else shares its heap). Each probe
 * prints one JSON line of megabytes: resident memory (RSS) at its start, at its peak and at its end, and,
 * when run with --expose-gc, the heap still in use after a full collection (what is really retained).
 *
 * A third argument sets the note's size in bytes (default 1,000,000).
 *
 *   node --expose-gc dist/memory-probes.js document [versions]   every version of a 1 MB note analysed
 *                                                                  incrementally, as the server does
 *   node --expose-gc dist/memory-probes.js preview [renders]     the preview plugin re-rendering a 1 MB
 *                                                                  note after every edit, as VS Code does
 *   node --expose-gc dist/memory-probes.js plain [renders]       the same renders without the plugin
 *                                                                  (the host's own share)
 */
import MarkdownIt from 'markdown-it';
import { analyseDocument, updateDocument } from '../server/src/service/document';
import { ionwrightPreview } from '../server/src/service/preview';
import { generateNotes } from './generate';

const MB = 1024 * 1024;
const rss = () => process.memoryUsage().rss / MB;
const gc = (globalThis as { gc?: () => void }).gc;
const retained = () => {
  if (!gc) return null;
  gc();
  gc();
  return process.memoryUsage().heapUsed / MB;
};

/**
 * A clean paragraph near the middle of the note, where the keystrokes go: by turns at the end of a prose
 * word (one text token, with bare formulas) and inside a code span (a formula that changes every time).
 */
const PARAGRAPH = 'Rinse log the panel with NaCl then KCl was clear and the stock `CuSO4·5H2O`';
function withParagraph(text: string): string {
  const at = text.indexOf('\n\n', text.length >> 1) + 2;
  return text.slice(0, at) + PARAGRAPH + '\n\n' + text.slice(at);
}
/** The text after keystroke `i` (a new, distinct string each time, as an editor makes). */
function keystroke(text: string, i: number): { text: string; at: number } {
  const p = text.indexOf('Rinse log the panel');
  const at = i % 2 === 0 ? text.indexOf(' and the stock', p) : text.indexOf('`', text.indexOf('`', p) + 1);
  return { text: text.slice(0, at) + 'x' + text.slice(at), at };
}

export function probe(mode: string, n: number, bytes = 1_000_000) {
  let text = withParagraph(generateNotes(bytes, 9));
  let peak = 0;
  const t0 = Date.now();
  let start: number;
  let startHeap: number | null;
  if (mode === 'document') {
    let doc = analyseDocument(text, 'markdown');
    startHeap = retained();
    start = rss();
    for (let i = 0; i < n; i++) {
      const k = keystroke(text, i);
      text = k.text;
      doc = updateDocument(doc, text, { start: k.at, oldEnd: k.at, newEnd: k.at + 1 });
      if (doc.diagnostics.length < 0) throw new Error('unreachable');
      peak = Math.max(peak, rss());
    }
  } else {
    const md = new MarkdownIt();
    if (mode === 'preview') md.use(ionwrightPreview);
    md.render(text, {});
    startHeap = retained();
    start = rss();
    for (let i = 0; i < n; i++) {
      text = keystroke(text, i).text;
      md.render(text, {});
      peak = Math.max(peak, rss());
    }
  }
  const ms = (Date.now() - t0) / n;
  const end = rss();
  return { mode, n, startMB: start, peakMB: peak, endMB: end, startHeapMB: startHeap, retainedHeapMB: retained(), msEach: ms };
}

if (require.main === module) {
  const [mode = 'preview', count, bytes] = process.argv.slice(2);
  process.stdout.write(JSON.stringify(probe(mode, Number(count ?? (mode === 'document' ? 1000 : 200)), bytes ? Number(bytes) : undefined)) + '\n');
}
