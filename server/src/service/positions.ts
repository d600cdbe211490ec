/** Offsets ↔ LSP positions (0-based line, UTF-16 character), with \n, \r\n and \r as line endings. */
export interface Position {
  line: number;
  character: number;
}
export interface Range {
  start: Position;
  end: Position;
}

export class LineIndex {
  /** Offsets at which each line starts. */
  readonly starts: number[];
  constructor(readonly text: string) {
    const starts = [0];
    for (let i = 0; i < text.length; i++) {
      const c = text.charCodeAt(i);
      if (c === 13) {
        if (text.charCodeAt(i + 1) === 10) i++;
        starts.push(i + 1);
      } else if (c === 10) starts.push(i + 1);
    }
    this.starts = starts;
  }

  get lineCount(): number {
    return this.starts.length;
  }

  positionAt(offset: number): Position {
    const o = Math.max(0, Math.min(offset, this.text.length));
    let lo = 0;
    let hi = this.starts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (this.starts[mid] <= o) lo = mid;
      else hi = mid - 1;
    }
    return { line: lo, character: o - this.starts[lo] };
  }

  /** Offset of a position; positions past a line's end clamp to the end of its content, past the last line to the text's end. */
  offsetAt(p: Position): number {
    if (!Number.isFinite(p.line) || p.line < 0) return 0;
    if (p.line >= this.starts.length) return this.text.length;
    const start = this.starts[p.line];
    const next = p.line + 1 < this.starts.length ? this.starts[p.line + 1] : this.text.length;
    let contentEnd = next;
    if (contentEnd > start && this.text.charCodeAt(contentEnd - 1) === 10) contentEnd--;
    if (contentEnd > start && this.text.charCodeAt(contentEnd - 1) === 13) contentEnd--;
    const ch = Number.isFinite(p.character) ? Math.max(0, p.character) : 0;
    return Math.min(start + ch, contentEnd);
  }

  range(start: number, end: number): Range {
    return { start: this.positionAt(start), end: this.positionAt(end) };
  }
}
