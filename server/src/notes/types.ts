/** What the notes scanner finds in a document. All offsets are absolute UTF-16 offsets into the document. */
export type NotesLanguage = 'markdown' | 'fnote';

/**
 * Prose detection: `off` reads formulas only in code spans, formula lines, batches and reactions;
 * `conservative` (default) also reads bare formulas that cannot be ordinary words; `eager` also reads
 * all-capital tokens such as `CO` or `NO` that would otherwise be taken for words.
 */
export type ProseMode = 'off' | 'conservative' | 'eager';

export interface FormulaRef {
  kind: 'formula';
  text: string;
  start: number;
  end: number;
  /** `code`: an inline code span; `prose`: a bare formula in text; `line`: a `.fnote` formula line. */
  source: 'code' | 'prose' | 'line';
}

export interface ReactionRef {
  kind: 'reaction';
  text: string;
  start: number;
  end: number;
  /** `code`: inline code span; `fence`: a line of a fenced reaction block; `line`: a `.fnote` reaction line. */
  source: 'code' | 'fence' | 'line';
}

export interface LineRef {
  text: string;
  start: number;
  end: number;
}

export interface BatchRef {
  kind: 'batch';
  /** Start of the opening line (the fence or `batch`). */
  start: number;
  /** End of the closing line (or of the document when unclosed). */
  end: number;
  /** The opening line. */
  open: LineRef;
  /** Name given on the opening line (```` ```batch Rinse A ```` or `batch Rinse A`), if any. */
  openName?: LineRef;
  /** The lines between the opening and the closing line. */
  lines: LineRef[];
  closed: boolean;
}

/**
 * A shelf block: the lab's reagents as they stand (```` ```shelf ```` in Markdown, `shelf` … `end` in
 * `.fnote`). Its body is handed to the shelf parser with its offset.
 */
export interface ShelfRef {
  kind: 'shelf';
  /** Start of the opening line; end of the closing line (or of the document when unclosed). */
  start: number;
  end: number;
  open: LineRef;
  /** The lines between the opening and the closing line, as one text (empty with its offset where there are none). */
  body: LineRef;
  closed: boolean;
}

export type NoteItem = FormulaRef | ReactionRef | BatchRef | ShelfRef;

export interface SectionRef {
  title: string;
  level: number;
  /** Start of the heading line. */
  start: number;
  /** End of the heading line. */
  headingEnd: number;
  /** Start of the next heading, or the end of the document. */
  end: number;
}

export interface ScanResult {
  language: NotesLanguage;
  /** Items in document order. */
  items: NoteItem[];
  sections: SectionRef[];
}

export interface ScanOptions {
  prose: ProseMode;
}

export const DEFAULT_SCAN_OPTIONS: ScanOptions = Object.freeze({ prose: 'conservative' as ProseMode });
