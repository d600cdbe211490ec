/**
 * What the command line prints: control characters made visible, one finding's line, JSON text, and a
 * writer that hands output over in chunks and waits when the stream asks it to.
 *
 * Control characters: a note's text and a file's name may hold terminal control sequences (ESC, as in
 * CSI colour codes and OSC 52 clipboard or OSC 8 hyperlink escapes; BEL, backspace, CR). Text output
 * shows each C0 control and DEL as its Unicode control picture (U+2400–U+241F, U+2421: ESC prints as
 * ␛, BEL as ␇, CR as ␍) and each C1 control (U+0080–U+009F, which have no pictures) as `\x9b`-style
 * hex; newline and tab are kept in multi-line text. Bidirectional formatting characters (U+061C, U+200E,
 * U+200F, U+202A–U+202E, U+2066–U+2069), which reorder what a terminal shows around them, print as
 * `\u202e`-style escapes. JSON output escapes them as JSON does
 * (`\u001b`; DEL and C1 too, which JSON.stringify leaves raw), so a JSON reader gets the text as written.
 */
import type { LspDiagnostic } from '../service/diagnostics';

const picture = (c: string): string => {
  const code = c.charCodeAt(0);
  if (code < 0x20) return String.fromCharCode(0x2400 + code);
  if (code === 0x7f) return '\u2421';
  if (code > 0xff) return `\\u${code.toString(16).padStart(4, '0')}`;
  return `\\x${code.toString(16)}`;
};

const CONTROLS_BUT_LINES = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069]/g;
const CONTROLS = /[\u0000-\u001f\u007f-\u009f\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069]/g;
const RAW_IN_JSON = /[\u007f-\u009f]/g;

/** Multi-line text for a terminal: every control character visible, newlines and tabs kept. */
export function visibleText(text: string): string {
  CONTROLS_BUT_LINES.lastIndex = 0;
  return CONTROLS_BUT_LINES.test(text) ? text.replace(CONTROLS_BUT_LINES, picture) : text;
}

/** One line for a terminal (a file name, a message): every control character visible, newlines too. */
export function visibleLine(text: string): string {
  CONTROLS.lastIndex = 0;
  return CONTROLS.test(text) ? text.replace(CONTROLS, picture) : text;
}

/** JSON.stringify with two-space indentation, DEL and C1 controls escaped as well (the same value to a JSON reader). */
export function jsonText(value: unknown): string {
  const text = JSON.stringify(value, null, 2);
  RAW_IN_JSON.lastIndex = 0;
  return RAW_IN_JSON.test(text) ? text.replace(RAW_IN_JSON, (c) => `\\u00${c.charCodeAt(0).toString(16)}`) : text;
}

export const SEVERITY_WORD = { 1: 'error', 2: 'warning', 3: 'info', 4: 'hint' } as const;

/** `file:line:col severity code message` (1-based line and column), as check and demo print a finding. */
export function findingLine(file: string, d: LspDiagnostic): string {
  return visibleLine(`${file}:${d.range.start.line + 1}:${d.range.start.character + 1} ${SEVERITY_WORD[d.severity]} ${d.code} ${d.message}`);
}

/** Characters gathered before a chunk is handed to the output. */
export const CHUNK = 1 << 16;

/**
 * Output in chunks of whole lines. `line` returns a promise only when it handed a chunk over and the
 * output asked to wait (backpressure): callers await it then, and only then.
 */
export class OutputWriter {
  private parts: string[] = [];
  private size = 0;
  constructor(
    /** Writes lines, adding the final newline (CliIO.out). */
    private readonly out: (text: string) => void | Promise<void>,
    private readonly chunk = CHUNK,
  ) {}

  /** One line (or several), without the final newline. */
  line(text: string): void | Promise<void> {
    this.parts.push(text);
    this.size += text.length + 1;
    if (this.size >= this.chunk) return this.flush();
  }

  flush(): void | Promise<void> {
    if (this.parts.length === 0) return;
    const text = this.parts.join('\n');
    this.parts = [];
    this.size = 0;
    return this.out(text);
  }
}

/** What JSON.stringify escapes in a string, what jsonText escapes too, and surrogates (left to JSON.stringify, which escapes lone ones). */
const ESCAPED_IN_JSON = /["\\\u0000-\u001f\u007f-\u009f\ud800-\udfff]/;

/** A string as JSON, as `jsonText` writes it. */
export function jsonString(text: string): string {
  if (!ESCAPED_IN_JSON.test(text)) return `"${text}"`;
  const t = JSON.stringify(text);
  RAW_IN_JSON.lastIndex = 0;
  return RAW_IN_JSON.test(t) ? t.replace(RAW_IN_JSON, (c) => `\\u00${c.charCodeAt(0).toString(16)}`) : t;
}

/** A number as JSON writes it (whole numbers, the usual case, without a call). */
export const jsonNumber = (n: number): string => (Number.isSafeInteger(n) && !Object.is(n, -0) ? `${n}` : JSON.stringify(n));

/** A value as an array item at indentation `inner`: `jsonText(value)` with every line indented. */
export const indentedJson = (value: unknown, inner: string): string => inner + jsonText(value).replace(/\n/g, '\n' + inner);

/**
 * A JSON array written item by item, the same text as `jsonText(array)` nested at `indent` (the
 * indentation of the line the array starts on): `open` is written before the `[`, `close` after the `]`.
 * `render` writes one item at its indentation (default `indentedJson`; a faster one must give the same text).
 */
export async function writeJsonArray<T>(
  w: OutputWriter,
  items: Iterable<T>,
  options: { indent?: string; open?: string; close?: string; render?: (item: T, inner: string) => string } = {},
): Promise<void> {
  const indent = options.indent ?? '';
  const open = options.open ?? '';
  const close = options.close ?? '';
  const render = options.render ?? indentedJson;
  const inner = indent + '  ';
  let pending: string | undefined;
  for (const item of items) {
    const p = w.line(pending === undefined ? open + '[' : pending + ',');
    if (p) await p;
    pending = render(item, inner);
  }
  if (pending === undefined) {
    const p = w.line(open + '[]' + close);
    if (p) await p;
  } else {
    const p = w.line(pending);
    if (p) await p;
    const q = w.line(indent + ']' + close);
    if (q) await q;
  }
}

/** JSON of the few strings that recur in every finding (file names, codes, the source). */
const recurring = new Map<string, string>();
export const recurringJson = (text: string): string => {
  let j = recurring.get(text);
  if (j === undefined) {
    if (recurring.size > 10_000) recurring.clear();
    j = jsonString(text);
    recurring.set(text, j);
  }
  return j;
};

/**
 * `indentedJson({file, ...d}, inner)` written directly, for a finding without `data` (the json output
 * of millions of findings spends most of its time here). A test holds it to indentedJson on the
 * findings the analysis makes.
 */
export function diagnosticJson(file: string, d: LspDiagnostic, inner: string): string {
  if (d.data !== undefined) return indentedJson({ file, ...d }, inner);
  const { start, end } = d.range;
  const i1 = inner + '  ';
  const i2 = i1 + '  ';
  const i3 = i2 + '  ';
  return (
    `${inner}{\n${i1}"file": ${recurringJson(file)},\n${i1}"range": {\n` +
    `${i2}"start": {\n${i3}"line": ${jsonNumber(start.line)},\n${i3}"character": ${jsonNumber(start.character)}\n${i2}},\n` +
    `${i2}"end": {\n${i3}"line": ${jsonNumber(end.line)},\n${i3}"character": ${jsonNumber(end.character)}\n${i2}}\n${i1}},\n` +
    `${i1}"severity": ${jsonNumber(d.severity)},\n${i1}"code": ${recurringJson(d.code)},\n${i1}"message": ${jsonString(d.message)},\n${i1}"source": ${recurringJson(d.source)}\n${inner}}`
  );
}
