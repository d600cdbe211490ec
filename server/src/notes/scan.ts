/**
 * The notes scanner: finds formulas, equations and batch blocks in Markdown and `.fnote` documents,
 * with exact offsets. It knows nothing of LSP.
 *
 * Markdown is read block by block with the CommonMark rules that decide what is prose, inline code and
 * fenced code: fenced blocks (``` or ~~~, closed by a fence of the same character at least as long),
 * indented code blocks (four spaces, not inside a paragraph), ATX and setext headings, HTML comments,
 * and paragraphs (inline content). Container blocks (block quotes, list items) are read as paragraphs,
 * so a fence inside a list item is not seen as a fence (a documented limit; test/scan.commonmark.test.ts
 * compares the scanner with markdown-it).
 */
import { scanInline } from './inline';
import {
  DEFAULT_SCAN_OPTIONS,
  type BatchRef,
  type LineRef,
  type NoteItem,
  type NotesLanguage,
  type ScanOptions,
  type ScanResult,
  type SectionRef,
  type ShelfRef,
} from './types';

export interface Line {
  start: number;
  /** End of the content, before the line ending. */
  end: number;
  /** Start of the next line. */
  next: number;
}

/** Split into lines on \n, \r\n and \r (as LSP and CommonMark do). */
export function splitLines(text: string, from = 0, to = text.length): Line[] {
  const lines: Line[] = [];
  let s = from;
  for (let i = from; i < to; i++) {
    const c = text.charCodeAt(i);
    if (c === 10) {
      lines.push({ start: s, end: i, next: i + 1 });
      s = i + 1;
    } else if (c === 13) {
      const crlf = text.charCodeAt(i + 1) === 10;
      lines.push({ start: s, end: i, next: i + (crlf ? 2 : 1) });
      if (crlf) i++;
      s = i + 1;
    }
  }
  if (s < to || lines.length === 0 || s === to) lines.push({ start: s, end: to, next: to });
  return lines;
}

export function scanDocument(text: string, language: NotesLanguage, options: ScanOptions = DEFAULT_SCAN_OPTIONS): ScanResult {
  return language === 'fnote' ? scanFnote(text, options) : scanMarkdown(text, options);
}

/** Leading indentation in columns (tabs to the next multiple of 4) and the offset of the first non-blank. */
function indentOf(text: string, line: Line): { cols: number; at: number } {
  let cols = 0;
  let i = line.start;
  for (; i < line.end; i++) {
    const c = text.charCodeAt(i);
    if (c === 32) cols++;
    else if (c === 9) cols += 4 - (cols % 4);
    else break;
  }
  return { cols, at: i };
}

interface Fence {
  char: number;
  len: number;
  info: string;
  infoStart: number;
  open: Line;
  lines: Line[];
}

const isBlankLine = (text: string, l: Line) => {
  for (let i = l.start; i < l.end; i++) {
    const c = text.charCodeAt(i);
    if (c !== 32 && c !== 9) return false;
  }
  return true;
};

function fenceOpen(text: string, l: Line, at: number): Omit<Fence, 'open' | 'lines'> | undefined {
  const ch = text.charCodeAt(at);
  if (ch !== 96 && ch !== 126) return undefined;
  let j = at;
  while (j < l.end && text.charCodeAt(j) === ch) j++;
  const len = j - at;
  if (len < 3) return undefined;
  let infoStart = j;
  while (infoStart < l.end && (text.charCodeAt(infoStart) === 32 || text.charCodeAt(infoStart) === 9)) infoStart++;
  const info = text.slice(infoStart, l.end).trimEnd();
  if (ch === 96 && info.includes('`')) return undefined;
  return { char: ch, len, info, infoStart };
}

function isFenceClose(text: string, l: Line, f: Fence): boolean {
  const { cols, at } = indentOf(text, l);
  if (cols > 3) return false;
  let j = at;
  while (j < l.end && text.charCodeAt(j) === f.char) j++;
  if (j - at < f.len) return false;
  for (; j < l.end; j++) {
    const c = text.charCodeAt(j);
    if (c !== 32 && c !== 9) return false;
  }
  return true;
}

const lineRef = (text: string, l: Line): LineRef => ({ text: text.slice(l.start, l.end), start: l.start, end: l.end });

function atxHeading(text: string, l: Line, at: number): { level: number; titleStart: number; titleEnd: number } | undefined {
  let j = at;
  while (j < l.end && text.charCodeAt(j) === 35) j++;
  const level = j - at;
  if (level < 1 || level > 6) return undefined;
  if (j < l.end && text.charCodeAt(j) !== 32 && text.charCodeAt(j) !== 9) return undefined;
  let s = j;
  while (s < l.end && (text.charCodeAt(s) === 32 || text.charCodeAt(s) === 9)) s++;
  let e = l.end;
  while (e > s && (text.charCodeAt(e - 1) === 32 || text.charCodeAt(e - 1) === 9)) e--;
  // Optional closing sequence of #s preceded by a space.
  let k = e;
  while (k > s && text.charCodeAt(k - 1) === 35) k--;
  if (k < e && (k === s || text.charCodeAt(k - 1) === 32 || text.charCodeAt(k - 1) === 9)) {
    e = k;
    while (e > s && (text.charCodeAt(e - 1) === 32 || text.charCodeAt(e - 1) === 9)) e--;
  }
  return { level, titleStart: s, titleEnd: e };
}

function isSetextUnderline(text: string, l: Line, at: number): 1 | 2 | 0 {
  const ch = text.charCodeAt(at);
  if (ch !== 61 && ch !== 45) return 0;
  let j = at;
  while (j < l.end && text.charCodeAt(j) === ch) j++;
  for (; j < l.end; j++) {
    const c = text.charCodeAt(j);
    if (c !== 32 && c !== 9) return 0;
  }
  return ch === 61 ? 1 : 2;
}

/** A line that starts a new block inside a run of paragraph lines (list item, block quote, table row). */
function startsContainer(text: string, at: number, end: number): boolean {
  const c = text.charCodeAt(at);
  if (c === 62) return true; // >
  if ((c === 45 || c === 42 || c === 43) && (at + 1 === end || text.charCodeAt(at + 1) === 32)) return true; // - * +
  if (c >= 48 && c <= 57) {
    let j = at;
    while (j < end && j - at < 9 && text.charCodeAt(j) >= 48 && text.charCodeAt(j) <= 57) j++;
    const d = text.charCodeAt(j);
    if ((d === 46 || d === 41) && (j + 1 === end || text.charCodeAt(j + 1) === 32)) return true;
  }
  return false;
}

/** A block of a Markdown document, the unit the scanner (and its cache) works on. */
export interface MdBlock {
  kind: 'paragraph' | 'heading' | 'fence' | 'code' | 'html';
  start: number;
  end: number;
  /** For headings. */
  level?: number;
  titleStart?: number;
  titleEnd?: number;
  fence?: Fence;
}

const shiftLineSpan = (l: Line, by: number): Line => ({ start: l.start + by, end: l.end + by, next: l.next + by });

/**
 * A block moved by `by` characters, with its own copy of the info string: used to scan a block on its
 * own text (`text.slice(b.start, b.end)` with `by = -b.start`).
 */
export function shiftMdBlock(b: MdBlock, by: number, copy: (s: string) => string = (s) => s): MdBlock {
  const out: MdBlock = { kind: b.kind, start: b.start + by, end: b.end + by };
  if (b.level !== undefined) out.level = b.level;
  if (b.titleStart !== undefined) out.titleStart = b.titleStart + by;
  if (b.titleEnd !== undefined) out.titleEnd = b.titleEnd + by;
  if (b.fence) {
    const f = b.fence as Fence & { closed?: boolean };
    const moved: Fence & { closed?: boolean } = {
      char: f.char,
      len: f.len,
      info: copy(f.info),
      infoStart: f.infoStart + by,
      open: shiftLineSpan(f.open, by),
      lines: f.lines.map((l) => shiftLineSpan(l, by)),
    };
    if (f.closed !== undefined) moved.closed = f.closed;
    out.fence = moved;
  }
  return out;
}

/** The line that starts at `pos` (\n, \r\n and \r end a line). */
export function readLine(text: string, pos: number): Line {
  for (let i = pos; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 10) return { start: pos, end: i, next: i + 1 };
    if (c === 13) return { start: pos, end: i, next: text.charCodeAt(i + 1) === 10 ? i + 2 : i + 1 };
  }
  return { start: pos, end: text.length, next: text.length };
}

/** Split a Markdown document into blocks. */
export function markdownBlocks(text: string): MdBlock[] {
  return markdownBlocksFrom(text, 0).blocks;
}

/**
 * Split into blocks from `from` (a line start after a blank line, or 0). `stopAt(pos)` is asked at every
 * line start where the state is clean (no open paragraph, the previous line blank); when it says yes,
 * splitting stops there and `stoppedAt` says where.
 */
export function markdownBlocksFrom(text: string, from: number, stopAt?: (pos: number) => boolean): { blocks: MdBlock[]; stoppedAt: number | null } {
  const blocks: MdBlock[] = [];
  let para: { start: number; end: number } | undefined;
  const endPara = () => {
    if (para) blocks.push({ kind: 'paragraph', start: para.start, end: para.end });
    para = undefined;
  };
  let pos = from;
  let prevBlank = true;
  while (pos < text.length) {
    if (stopAt && !para && prevBlank && pos > from && stopAt(pos)) return { blocks, stoppedAt: pos };
    const l = readLine(text, pos);
    const blank = isBlankLine(text, l);
    if (blank) {
      endPara();
      prevBlank = true;
      pos = l.next;
      continue;
    }
    prevBlank = false;
    const { cols, at } = indentOf(text, l);
    if (cols >= 4 && !para) {
      // Indented code block: runs over following indented or blank lines.
      let last = l;
      let p = l.next;
      while (p < text.length) {
        const nl = readLine(text, p);
        if (!isBlankLine(text, nl) && indentOf(text, nl).cols < 4) break;
        if (!isBlankLine(text, nl)) last = nl;
        p = nl.next;
      }
      blocks.push({ kind: 'code', start: l.start, end: last.end });
      pos = last.next;
      continue;
    }
    if (cols <= 3) {
      const f = fenceOpen(text, l, at);
      if (f) {
        endPara();
        const fence: Fence = { ...f, open: l, lines: [] };
        let end = l.end;
        let closed = false;
        let p = l.next;
        let next = l.next;
        while (p < text.length) {
          const nl = readLine(text, p);
          next = nl.next;
          end = nl.end;
          if (isFenceClose(text, nl, fence)) {
            closed = true;
            break;
          }
          fence.lines.push(nl);
          p = nl.next;
        }
        blocks.push({ kind: 'fence', start: l.start, end, fence: Object.assign(fence, { closed }) });
        pos = next;
        continue;
      }
      const h = atxHeading(text, l, at);
      if (h) {
        endPara();
        blocks.push({ kind: 'heading', start: l.start, end: l.end, ...h });
        pos = l.next;
        continue;
      }
      if (para) {
        const lvl = isSetextUnderline(text, l, at);
        if (lvl) {
          blocks.push({
            kind: 'heading',
            start: para.start,
            end: l.end,
            level: lvl,
            titleStart: indentOf(text, { start: para.start, end: para.end, next: para.end }).at,
            titleEnd: para.end,
          });
          para = undefined;
          pos = l.next;
          continue;
        }
      }
      if (text.startsWith('<!--', at)) {
        endPara();
        const close = text.indexOf('-->', at + 4);
        let last = l;
        while (last.next < text.length && (close < 0 || last.end < close)) last = readLine(text, last.next);
        blocks.push({ kind: 'html', start: l.start, end: last.end });
        pos = last.next;
        continue;
      }
      if (para && startsContainer(text, at, l.end)) endPara();
    }
    if (para) para.end = l.end;
    else para = { start: l.start, end: l.end };
    pos = l.next;
  }
  endPara();
  return { blocks, stoppedAt: null };
}

/** Scan one Markdown block; items have absolute offsets. */
export function scanMarkdownBlock(text: string, b: MdBlock, options: ScanOptions, out: NoteItem[]) {
  if (b.kind === 'paragraph') scanInline(text, b.start, b.end, options.prose, out);
  else if (b.kind === 'heading') scanInline(text, b.titleStart as number, b.titleEnd as number, options.prose, out);
  else if (b.kind === 'fence') {
    const f = b.fence as Fence & { closed: boolean };
    const word = f.info.split(/\s+/, 1)[0].toLowerCase();
    if (word === 'batch') {
      const nameStart = f.infoStart + word.length;
      const rest = text.slice(nameStart, f.open.end);
      const lead = rest.length - rest.trimStart().length;
      const name = rest.trim();
      const batch: BatchRef = {
        kind: 'batch',
        start: b.start,
        end: b.end,
        open: lineRef(text, f.open),
        lines: f.lines.map((l) => lineRef(text, l)),
        closed: f.closed,
        ...(name ? { openName: { text: name, start: nameStart + lead, end: nameStart + lead + name.length } } : {}),
      };
      out.push(batch);
    } else if (word === 'shelf' && f.info.trim().toLowerCase() === 'shelf') {
      const first = f.lines[0];
      const last = f.lines[f.lines.length - 1];
      const bodyStart = first ? first.start : f.open.next;
      const bodyEnd = last ? last.end : bodyStart;
      out.push({
        kind: 'shelf',
        start: b.start,
        end: b.end,
        open: lineRef(text, f.open),
        body: { text: text.slice(bodyStart, bodyEnd), start: bodyStart, end: bodyEnd },
        closed: f.closed,
      });
    } else if (word === 'reaction' || word === 'reactions') {
      for (const l of f.lines) {
        const r = reactionLine(text, l.start, l.end);
        if (r) out.push(r);
      }
    }
  }
}

/** A line of a reaction block: the equation, with comments (`#`) and surrounding space cut off. */
function reactionLine(text: string, start: number, end: number): NoteItem | undefined {
  let e = end;
  // Only this line is searched: a search to the end of the text would make a block of many lines quadratic.
  for (let i = start; i < end; i++) {
    if (text.charCodeAt(i) === 35) {
      e = i;
      break;
    }
  }
  let s = start;
  while (s < e && /\s/.test(text[s])) s++;
  while (e > s && /\s/.test(text[e - 1])) e--;
  if (s === e) return undefined;
  return { kind: 'reaction', text: text.slice(s, e), start: s, end: e, source: 'fence' };
}

function headingsToSections(text: string, heads: Array<{ title: string; level: number; start: number; headingEnd: number }>): SectionRef[] {
  return heads.map((h, k) => ({ ...h, end: k + 1 < heads.length ? heads[k + 1].start : text.length }));
}

export function scanMarkdown(text: string, options: ScanOptions = DEFAULT_SCAN_OPTIONS): ScanResult {
  const items: NoteItem[] = [];
  const heads: Array<{ title: string; level: number; start: number; headingEnd: number }> = [];
  for (const b of markdownBlocks(text)) {
    scanMarkdownBlock(text, b, options, items);
    if (b.kind === 'heading')
      heads.push({ title: text.slice(b.titleStart, b.titleEnd).replace(/\s+/g, ' '), level: b.level as number, start: b.start, headingEnd: b.end });
  }
  return { language: 'markdown', items, sections: headingsToSections(text, heads) };
}

/** Keywords are lower case; `section`, `reaction` and `formula` take a colon, `batch` and `end` stand first on their line. */
const FNOTE_KEYWORD = /^(?:(section|reaction|formulas?):|(batch|end)(?=[\s:]|$):?)/;

/** Does this `.fnote` line (leading space removed) open a shelf block: `shelf` (or `shelf:`) alone on its line? */
export function opensFnoteShelf(body: string): boolean {
  return /^shelf:?\s*$/.test(body);
}

/** Does this `.fnote` line (leading space removed) open a batch block? */
export function opensFnoteBatch(body: string): boolean {
  return FNOTE_KEYWORD.exec(body)?.[2] === 'batch';
}

/** Does this `.fnote` line (leading space removed) close a batch block: `end`, alone on its line? */
export function closesFnoteBatch(body: string): boolean {
  const kw = FNOTE_KEYWORD.exec(body);
  return kw?.[2] === 'end' && body.slice(kw[0].length).trim() === '';
}

/**
 * The `.fnote` notes format (Ionwright's own, line based):
 *   # a comment
 *   section: Buffer trials            starts a section
 *   formula: NaCl, KH2PO4             formulas to analyse, separated by commas or spaces
 *   reaction: 2 H2 + O2 -> 2 H2O      an equation
 *   batch Rinse A  …  end             a batch block (same lines as a Markdown batch block)
 *   shelf  …  end                     the lab's reagents, one a line (`shelf` alone on its line)
 * Any other line is prose: `code spans` and bare formulas are read in it.
 */
export function scanFnote(text: string, options: ScanOptions = DEFAULT_SCAN_OPTIONS): ScanResult {
  const items: NoteItem[] = [];
  const heads: Array<{ title: string; level: number; start: number; headingEnd: number }> = [];
  const lines = splitLines(text);
  let batch: BatchRef | undefined;
  let shelf: { ref: ShelfRef; first?: Line; last?: Line } | undefined;
  const closeShelf = (closed: boolean) => {
    const s = shelf as NonNullable<typeof shelf>;
    const bodyStart = s.first ? s.first.start : s.ref.open.end;
    const bodyEnd = s.last ? s.last.end : bodyStart;
    s.ref.body = { text: text.slice(bodyStart, bodyEnd), start: bodyStart, end: bodyEnd };
    s.ref.closed = closed;
    items.push(s.ref);
    shelf = undefined;
  };
  for (const l of lines) {
    const { at } = indentOf(text, l);
    const body = text.slice(at, l.end);
    const kw = FNOTE_KEYWORD.exec(body);
    const keyword = kw ? (kw[1] ?? kw[2]) : '';
    if (shelf) {
      if (closesFnoteBatch(body)) {
        shelf.ref.end = l.end;
        closeShelf(true);
      } else {
        shelf.first ??= l;
        shelf.last = l;
        shelf.ref.end = l.end;
      }
      continue;
    }
    if (!batch && opensFnoteShelf(body)) {
      shelf = { ref: { kind: 'shelf', start: l.start, end: l.end, open: lineRef(text, l), body: { text: '', start: l.end, end: l.end }, closed: false } };
      continue;
    }
    if (batch) {
      if (closesFnoteBatch(body)) {
        batch.end = l.end;
        batch.closed = true;
        items.push(batch);
        batch = undefined;
      } else {
        batch.lines.push(lineRef(text, l));
        batch.end = l.end;
      }
      continue;
    }
    if (body.startsWith('#') || body.trim() === '') continue;
    let restStart = at + (kw ? kw[0].length : 0);
    while (restStart < l.end && (text[restStart] === ' ' || text[restStart] === '\t')) restStart++;
    let restEnd = l.end;
    while (restEnd > restStart && /\s/.test(text[restEnd - 1])) restEnd--;
    if (keyword === 'section') {
      heads.push({ title: text.slice(restStart, restEnd), level: 1, start: l.start, headingEnd: l.end });
    } else if (keyword === 'reaction') {
      const r = reactionLine(text, restStart, restEnd);
      if (r) items.push({ ...r, source: 'line' } as NoteItem);
    } else if (keyword === 'formula' || keyword === 'formulas') {
      let i = restStart;
      const e = text.indexOf('#', restStart) >= 0 && text.indexOf('#', restStart) < restEnd ? text.indexOf('#', restStart) : restEnd;
      while (i < e) {
        while (i < e && (text[i] === ',' || text[i] === ' ' || text[i] === '\t' || text[i] === ';')) i++;
        const s = i;
        while (i < e && text[i] !== ',' && text[i] !== ' ' && text[i] !== '\t' && text[i] !== ';') i++;
        if (i > s) items.push({ kind: 'formula', text: text.slice(s, i), start: s, end: i, source: 'line' });
      }
    } else if (keyword === 'batch') {
      batch = { kind: 'batch', start: l.start, end: l.end, open: lineRef(text, l), lines: [], closed: false };
      if (restEnd > restStart) batch.openName = { text: text.slice(restStart, restEnd), start: restStart, end: restEnd };
    } else {
      scanInline(text, l.start, l.end, options.prose, items);
    }
  }
  if (batch) items.push(batch);
  if (shelf) closeShelf(false);
  return { language: 'fnote', items, sections: headingsToSections(text, heads) };
}
