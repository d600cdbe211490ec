/**
 * Finding things across notes: workspace symbols (LSP `workspace/symbol`: the batches of every note by
 * name) and go-to-definition (LSP `textDocument/definition`).
 *
 * Each note is summed up once per version (`noteSummary`: its named batches with their ranges, and its
 * vocabulary for completion); the caller — the server, which knows the open notes and the workspace folder —
 * hands the summaries in. Nothing here reads a file.
 *
 * Definitions come from definition sources, tried in order (`DEFINITION_SOURCES`): a shelf label on a
 * batch line leads to its entry on the shelf (the note's own shelf block, or the workspace's shelf file);
 * a batch's name written anywhere in a note (prose, a code span, a comment, another batch, a
 * `from batch "…"` stock reference) leads to the batch of that name, in any note of the workspace. A name
 * counts where it stands as a whole (not inside a longer word) and the cursor is on it; names are compared
 * exactly, as they are written in the batch.
 */
import { shelfEntry } from '../chem/reagents';
import type { AnalysedDocument, BatchOccurrence } from './document';
import { targetAt } from './lookup';
import type { Range } from './positions';
import { documentVocabulary, type Vocabulary } from './vocabulary';

/** LSP SymbolKind.Struct: what the outline calls a batch too. */
const STRUCT = 23;

export interface NamedBatch {
  name: string;
  uri: string;
  /** The whole block. */
  range: Range;
  /** The name as written (on the opening line or in `name:`), else the opening line. */
  selectionRange: Range;
  /** The section the batch is in, if any. */
  section?: string;
}

export interface NoteSummary {
  uri: string;
  batches: NamedBatch[];
  vocabulary: Vocabulary;
}

export interface Location {
  uri: string;
  range: Range;
}

export interface WorkspaceSymbol {
  name: string;
  kind: number;
  location: Location;
  containerName?: string;
}

/** Where a batch's name is written: the opening line's name, the `name:` header's value, else the opening line. */
function nameSpan(b: BatchOccurrence): { start: number; end: number } {
  const r = b.ref;
  if (r.openName) return r.openName;
  const name = b.analysis.name;
  if (name)
    for (const l of r.lines) {
      const m = /^(\s*name\s*:\s*)(.*?)\s*(?:#.*)?$/i.exec(l.text);
      if (m && m[2] === name) return { start: l.start + m[1].length, end: l.start + m[1].length + m[2].length };
    }
  return r.open;
}

const summaries = new WeakMap<AnalysedDocument, Map<string, NoteSummary>>();

/** The named batches and the vocabulary of a note (memoised per analysed version and URI). */
export function noteSummary(doc: AnalysedDocument, uri: string): NoteSummary {
  let byUri = summaries.get(doc);
  const hit = byUri?.get(uri);
  if (hit) return hit;
  const sections = doc.sections;
  const sectionAt = (offset: number) => {
    let lo = 0;
    let hi = sections.length - 1;
    let ans: string | undefined;
    while (lo <= hi) {
      const mid = (lo + hi) >> 1;
      if (sections[mid].start <= offset) {
        ans = sections[mid].title;
        lo = mid + 1;
      } else hi = mid - 1;
    }
    return ans;
  };
  const batches: NamedBatch[] = [];
  // Read from the blocks (block-relative offsets): no batch is copied to absolute offsets for this.
  for (const blk of doc.blocks)
    for (const b of blk.rel.batches) {
      const name = b.analysis.name;
      if (!name) continue;
      const span = nameSpan(b);
      const at = blk.start;
      const section = sectionAt(at + b.ref.start);
      batches.push({
        name,
        uri,
        range: doc.lines.range(at + b.ref.start, at + b.ref.end),
        selectionRange: doc.lines.range(at + span.start, at + span.end),
        ...(section ? { section } : {}),
      });
    }
  const summary: NoteSummary = { uri, batches, vocabulary: documentVocabulary(doc) };
  if (!byUri) summaries.set(doc, (byUri = new Map()));
  byUri.set(uri, summary);
  return summary;
}

/** The query's characters appear in the name in order, ignoring case (an empty query matches all). */
export function fuzzyMatch(name: string, query: string): boolean {
  if (!query) return true;
  const n = name.toLowerCase();
  const q = query.toLowerCase();
  let i = 0;
  for (let k = 0; k < n.length && i < q.length; k++) if (n[k] === q[i]) i++;
  return i === q.length;
}

/** Most symbols in one answer. */
export const MAX_SYMBOLS = 1000;

/** The batches of the notes whose names match `query`, in the order of the notes and of their text. */
export function workspaceSymbols(notes: Iterable<NoteSummary>, query: string): WorkspaceSymbol[] {
  const out: WorkspaceSymbol[] = [];
  for (const n of notes)
    for (const b of n.batches) {
      if (!fuzzyMatch(b.name, query)) continue;
      out.push({ name: b.name, kind: STRUCT, location: { uri: b.uri, range: b.selectionRange }, ...(b.section ? { containerName: b.section } : {}) });
      if (out.length >= MAX_SYMBOLS) return out;
    }
  return out;
}

/** What a definition source is given: the note, the cursor's offset, and the workspace's notes. */
export interface DefinitionContext {
  doc: AnalysedDocument;
  offset: number;
  notes: readonly NoteSummary[];
  /** The note's own URI (for a definition in the same note). */
  uri?: string;
}

export type DefinitionSource = (ctx: DefinitionContext) => Location[] | undefined;

const isWordChar = (c: string | undefined) => c !== undefined && /[\p{L}\p{N}_]/u.test(c);

/** A batch's name under the cursor → the batches of that name. */
export const batchNameDefinition: DefinitionSource = ({ doc, offset, notes }) => {
  const p = doc.lines.positionAt(offset);
  const starts = doc.lines.starts;
  const lineStart = starts[p.line];
  const lineEnd = p.line + 1 < starts.length ? starts[p.line + 1] : doc.text.length;
  const line = doc.text.slice(lineStart, lineEnd);
  const at = offset - lineStart;
  const byName = new Map<string, NamedBatch[]>();
  for (const n of notes)
    for (const b of n.batches) {
      const list = byName.get(b.name);
      if (list) list.push(b);
      else byName.set(b.name, [b]);
    }
  let best: { length: number; batches: NamedBatch[] } | undefined;
  for (const [name, batches] of byName) {
    if (name.length < 2 || (best && name.length <= best.length)) continue;
    for (let i = line.indexOf(name); i >= 0; i = line.indexOf(name, i + 1)) {
      if (i > at) break;
      const end = i + name.length;
      if (at > end) continue;
      if (isWordChar(line[i - 1]) && isWordChar(name[0])) continue;
      if (isWordChar(line[end]) && isWordChar(name[name.length - 1])) continue;
      best = { length: name.length, batches };
      break;
    }
  }
  return best?.batches.map((b) => ({ uri: b.uri, range: b.selectionRange }));
};

/** A shelf label on a batch line → its entry on the shelf (the note's own shelf block, or the workspace's shelf file). */
export const shelfLabelDefinition: DefinitionSource = ({ doc, offset, uri }) => {
  const t = targetAt(doc, offset);
  const i = t?.kind === 'batch-line' ? t.ingredient : undefined;
  const shelf = doc.shelf;
  if (!i?.shelf || i.via !== 'shelf' || offset < i.formulaStart || offset > i.formulaEnd || !shelf) return undefined;
  const entry = shelfEntry(shelf.shelf, i.shelf.label);
  if (!entry) return undefined;
  if (shelf.source === 'document') return uri ? [{ uri, range: doc.lines.range(entry.labelSpan.start, entry.labelSpan.end) }] : undefined;
  const ws = doc.options.workspaceShelf;
  return ws?.rangeOf ? [{ uri: ws.source, range: ws.rangeOf(entry.labelSpan.start, entry.labelSpan.end) }] : undefined;
};

/** The definition sources, tried in order; the first that answers wins. */
export const DEFINITION_SOURCES: readonly DefinitionSource[] = [shelfLabelDefinition, batchNameDefinition];

export function definition(ctx: DefinitionContext): Location[] {
  for (const source of DEFINITION_SOURCES) {
    const found = source(ctx);
    if (found && found.length) return found;
  }
  return [];
}
