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
  readonly starts: Uint32Array;
  readonly text: string;

  constructor(text: string, starts?: Uint32Array) {
    this.text = text;
    if (starts) {
      this.starts = starts;
      return;
    }
    let buf = new Uint32Array(1024);
    let n = 1;
    const push = (x: number) => {
      if (n === buf.length) {
        const b = new Uint32Array(buf.length * 2);
        b.set(buf);
        buf = b;
      }
      buf[n++] = x;
    };
    for (let i = 0; i < text.length; i++) {
      const c = text.charCodeAt(i);
      if (c === 13) {
        if (text.charCodeAt(i + 1) === 10) i++;
        push(i + 1);
      } else if (c === 10) push(i + 1);
    }
    this.starts = buf.slice(0, n);
  }

  /**
   * The index of a new version of the text in which [start, oldEnd) of this text became [start, newEnd):
   * line starts before the edit are kept, those after it moved, and only the edited stretch is scanned.
   */
  update(text: string, start: number, oldEnd: number, newEnd: number): LineIndex {
    const delta = newEnd - oldEnd;
    const old = this.starts;
    // Keep starts up to just before the edit (a \r\n may straddle its start), scan from there, move the rest.
    const scanFrom = Math.max(0, start - 1);
    let k = 0;
    let lo = 0;
    let hi = old.length - 1;
    while (lo <= hi) {
      const mid = (lo + hi) >> 1;
      if (old[mid] <= scanFrom) {
        k = mid + 1;
        lo = mid + 1;
      } else hi = mid - 1;
    }
    const middle: number[] = [];
    let last = old[k - 1];
    const scanTo = Math.min(text.length, newEnd + 1);
    for (let i = scanFrom; i < scanTo; i++) {
      const c = text.charCodeAt(i);
      if (c === 13) {
        if (text.charCodeAt(i + 1) === 10) i++;
        if (i + 1 > last) middle.push((last = i + 1));
      } else if (c === 10 && i + 1 > last) middle.push((last = i + 1));
    }
    let m = k;
    while (m < old.length && (old[m] < oldEnd + 1 || old[m] + delta <= last)) m++;
    const out = new Uint32Array(k + middle.length + (old.length - m));
    out.set(old.subarray(0, k), 0);
    for (let j = 0; j < middle.length; j++) out[k + j] = middle[j];
    let o = k + middle.length;
    for (let j = m; j < old.length; j++) out[o++] = old[j] + delta;
    return new LineIndex(text, out);
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
