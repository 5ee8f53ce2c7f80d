const SPACE = 32;
const TAB = 9;
const CR = 13;
const VT = 11;
const FF = 12;
const HASH = 35;
const NEWLINE = 10;

/**
 * Whitespace-separated tokens of a text, line by line, with `#` starting a
 * comment that runs to the end of the line (OBJ, OFF). Lines end in LF or
 * CRLF, or in CR alone when the text has no LF at all.
 *
 * The text is scanned in place: no array of lines and no substring per token
 * is made, because mesh files run to tens of megabytes and splitting them
 * would double the memory and dominate the time. The current token is the
 * range [start, end) of `text`.
 */
export class LineTokens {
  /** 1-based number of the current line; 0 before the first call to {@link nextLine}. */
  line = 0;
  /** Start of the current token in `text`. */
  start = 0;
  /** End (exclusive) of the current token in `text`. */
  end = 0;
  private pos = 0;
  private lineEnd = 0;
  private following = 0;
  private readonly separator: string;

  constructor(readonly text: string) {
    // A byte order mark would otherwise stick to the first token.
    if (text.charCodeAt(0) === 0xfeff) this.following = 1;
    // Classic Mac OS line ends: without this the whole file would be one line.
    this.separator = text.indexOf('\n') < 0 && text.indexOf('\r') >= 0 ? '\r' : '\n';
  }

  /** Where the next line starts in `text` (progress through the file). */
  get offset(): number {
    return this.following;
  }

  /** Move to the next line; false when the text is exhausted. */
  nextLine(): boolean {
    const text = this.text;
    if (this.following > text.length || (this.following === text.length && this.line > 0)) return false;
    let nl = text.indexOf(this.separator, this.following);
    if (nl < 0) nl = text.length;
    this.pos = this.following;
    this.lineEnd = nl;
    this.following = nl + 1;
    this.line++;
    return true;
  }

  /** Move to the next token on the current line; false when the line has no more. */
  next(): boolean {
    const text = this.text;
    const lineEnd = this.lineEnd;
    let p = this.pos;
    let c = 0;
    while (p < lineEnd && isSpace((c = text.charCodeAt(p)))) p++;
    if (p >= lineEnd || c === HASH) {
      this.pos = lineEnd;
      return false;
    }
    const start = p;
    while (p < lineEnd && !isSpace((c = text.charCodeAt(p))) && c !== HASH) p++;
    this.start = start;
    this.end = p;
    this.pos = p;
    return true;
  }

  /** The current token as a string (allocates; for messages and rare keywords). */
  token(): string {
    return this.text.slice(this.start, this.end);
  }

  /** Whether the current token is exactly `word`. */
  is(word: string): boolean {
    const n = word.length;
    if (this.end - this.start !== n) return false;
    for (let i = 0; i < n; i++) if (this.text.charCodeAt(this.start + i) !== word.charCodeAt(i)) return false;
    return true;
  }
}

function isSpace(c: number): boolean {
  return c === SPACE || c === TAB || c === CR || c === VT || c === FF || c === NEWLINE;
}
