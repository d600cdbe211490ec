/**
 * Inline content: code spans (CommonMark rules: a backtick run closes only with a run of the same length,
 * a backslash escapes an opening backtick, line endings inside count as spaces, one space is stripped on
 * both sides) and the prose between them. Linear in the length of the text: closing runs are found with a
 * per-length pointer, never by rescanning.
 */
import { findArrow } from '../chem/equation/arrows';
import { scanProse } from './prose';
import type { NoteItem, ProseMode } from './types';

interface Run {
  pos: number;
  len: number;
  /** Preceded by an odd number of backslashes. */
  escaped: boolean;
}

/** The first run after index `after` with `len` backticks, by a plain scan (few runs: the usual paragraph). */
function nearestRunOfLen(runs: readonly Run[]) {
  return (len: number, after: number): number => {
    for (let q = after + 1; q < runs.length; q++) if (runs[q].len === len) return q;
    return -1;
  };
}

/** The same, linear over all the runs: candidates by length, with a pointer per length that only moves forward. */
function pointerByLen(runs: readonly Run[]) {
  const byLen = new Map<number, number[]>();
  runs.forEach((r, k) => {
    const list = byLen.get(r.len);
    if (list) list.push(k);
    else byLen.set(r.len, [k]);
  });
  const ptr = new Map<number, number>();
  return (len: number, after: number): number => {
    const list = byLen.get(len);
    if (!list) return -1;
    let p = ptr.get(len) ?? 0;
    while (p < list.length && list[p] <= after) p++;
    ptr.set(len, p);
    return p < list.length ? list[p] : -1;
  };
}

export function scanInline(text: string, start: number, end: number, prose: ProseMode, out: NoteItem[]) {
  const runs: Run[] = [];
  for (let i = start; i < end;) {
    if (text.charCodeAt(i) !== 96) {
      i++;
      continue;
    }
    let j = i;
    while (j < end && text.charCodeAt(j) === 96) j++;
    let bs = 0;
    for (let k = i - 1; k >= start && text.charCodeAt(k) === 92; k--) bs++;
    runs.push({ pos: i, len: j - i, escaped: bs % 2 === 1 });
    i = j;
  }
  if (runs.length === 0) {
    scanProse(text, start, end, prose, out);
    return;
  }
  const nextRunOfLen = runs.length <= 32 ? nearestRunOfLen(runs) : pointerByLen(runs);

  // Raw HTML tags and autolinks take a backtick inside them out of play when they start first.
  const opaque = opaqueRanges(text, start, end);
  let op = 0;
  let proseFrom = start;
  for (let k = 0; k < runs.length; k++) {
    const r = runs[k];
    const openPos = r.escaped ? r.pos + 1 : r.pos;
    const openLen = r.escaped ? r.len - 1 : r.len;
    if (openLen === 0) continue;
    while (op < opaque.length && (opaque[op][1] <= openPos || opaque[op][0] < proseFrom)) op++;
    if (op < opaque.length && opaque[op][0] < openPos) continue;
    const close = nextRunOfLen(openLen, k);
    if (close < 0) continue;
    const closeRun = runs[close];
    scanProse(text, proseFrom, openPos, prose, out);
    addCodeSpan(text, openPos + openLen, closeRun.pos, out);
    proseFrom = closeRun.pos + closeRun.len;
    k = close;
  }
  scanProse(text, proseFrom, end, prose, out);
}

const AUTOLINK = /<[A-Za-z][A-Za-z0-9+.-]{1,31}:[^\s<>]{0,2000}>/y;
const HTML_TAG =
  /<\/?[A-Za-z][A-Za-z0-9-]{0,40}(?:\s+[A-Za-z_:][A-Za-z0-9_.:-]{0,80}(?:\s*=\s*(?:[^\s"'=<>`]{1,500}|'[^']{0,500}'|"[^"]{0,500}"))?){0,40}\s*\/?>/y;

/** [start, end) of raw HTML tags and autolinks, in order (bounded patterns: no backtracking blow-up). */
function opaqueRanges(text: string, start: number, end: number): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  for (let i = start; i < end; i++) {
    if (text.charCodeAt(i) !== 60) continue;
    for (const re of [AUTOLINK, HTML_TAG]) {
      re.lastIndex = i;
      const m = re.exec(text);
      if (m && i + m[0].length <= end) {
        out.push([i, i + m[0].length]);
        i += m[0].length - 1;
        break;
      }
    }
  }
  return out;
}

function isBlank(c: number) {
  return c === 32 || c === 10 || c === 13 || c === 9;
}

/** Record a code span's content, with CommonMark's one-space stripping, as a formula or an equation. */
export function addCodeSpan(text: string, s: number, e: number, out: NoteItem[]) {
  let a = s;
  let b = e;
  // CommonMark: strip one space (or line ending) from each side if both are present and the content is not all spaces.
  if (b - a >= 2 && isBlank(text.charCodeAt(a)) && isBlank(text.charCodeAt(b - 1))) {
    let allBlank = true;
    for (let i = a; i < b; i++)
      if (!isBlank(text.charCodeAt(i))) {
        allBlank = false;
        break;
      }
    if (!allBlank) {
      a += text.charCodeAt(a) === 13 && text.charCodeAt(a + 1) === 10 ? 2 : 1;
      b -= text.charCodeAt(b - 1) === 10 && text.charCodeAt(b - 2) === 13 ? 2 : 1;
    }
  }
  // Surrounding white space beyond that is not part of a formula.
  while (a < b && isBlank(text.charCodeAt(a))) a++;
  while (b > a && isBlank(text.charCodeAt(b - 1))) b--;
  if (a === b) return;
  const content = text.slice(a, b);
  if (findArrow(content)) out.push({ kind: 'reaction', text: content, start: a, end: b, source: 'code' });
  else out.push({ kind: 'formula', text: content, start: a, end: b, source: 'code' });
}
