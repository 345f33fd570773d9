import type { Delimiter } from './mapping.js'

/** A record the splitter could not cut out of the text; fatal for the whole file. */
export class RecordError extends Error {
  constructor(
    public row: number,
    message: string,
  ) {
    super(message)
  }
}

export interface RecordSplitterOptions {
  delimiter: Delimiter
  /** Longest record accepted, characters; a longer one stops the file (a runaway line or a binary blob). */
  maxRecordChars?: number
}

/** Called with each non-blank record's fields and the file line (1-based) it starts on. */
export type RecordSink = (fields: string[], row: number) => void

const QUOTE = '"'

/**
 * Cuts streamed text into delimited records: LF, CRLF or lone-CR line ends, a leading byte-order mark, RFC 4180
 * quoting (doubled quotes, delimiters and line breaks inside quotes). Unquoted lines take a fast split path.
 */
export class RecordSplitter {
  private rest = ''
  private pending: string | null = null
  private pendingRow = 0
  private line = 0
  private sep: '\n' | '\r' | null = null
  private readonly maxChars: number
  private readonly delimiter: Delimiter

  /**
   * @param options delimiter and record length limit (default 65,536 characters)
   * @param sink receives every record
   */
  constructor(
    options: RecordSplitterOptions,
    private readonly sink: RecordSink,
  ) {
    this.delimiter = options.delimiter
    this.maxChars = options.maxRecordChars ?? 65_536
  }

  /** Lines seen so far. */
  get linesSeen(): number {
    return this.line
  }

  /**
   * Feeds the next piece of decoded text.
   * @throws RecordError when a record grows past the length limit
   */
  push(text: string): void {
    if (this.sep === null) {
      if (this.line === 0 && this.rest === '' && text.charCodeAt(0) === 0xfeff) text = text.slice(1)
      // Look at everything held so far: the first line end may have come in an earlier, small piece.
      const seen = this.rest + text
      const nl = seen.indexOf('\n')
      const cr = seen.indexOf('\r')
      if (nl >= 0) this.sep = '\n'
      else if (cr >= 0 && cr < seen.length - 1) this.sep = '\r'
      else {
        this.rest += text
        this.checkLength()
        return
      }
    }
    const buf = this.rest.length ? this.rest + text : text
    // One native split per chunk is much cheaper than finding and slicing each line.
    const lines = buf.split(this.sep)
    const last = lines.length - 1
    for (let i = 0; i < last; i++) this.onLine(lines[i]!)
    this.rest = lines[last]!
    this.checkLength()
  }

  /**
   * Flushes the last line (a file without a final line break).
   * @throws RecordError when a quoted field never closes
   */
  end(): void {
    if (this.rest.length) {
      const last = this.rest
      this.rest = ''
      this.onLine(last)
    }
    if (this.pending !== null) throw new RecordError(this.pendingRow, `Row ${this.pendingRow} has a quote that never closes`)
  }

  private checkLength(): void {
    const len = this.rest.length + (this.pending?.length ?? 0)
    if (len > this.maxChars) {
      const row = this.pending !== null ? this.pendingRow : this.line + 1
      throw new RecordError(row, `Row ${row} is longer than ${this.maxChars} characters`)
    }
  }

  private onLine(raw: string): void {
    this.line++
    const line = raw.length && raw.charCodeAt(raw.length - 1) === 13 ? raw.slice(0, -1) : raw
    if (this.pending !== null) {
      this.pending += '\n' + line
      this.checkLength()
      if (countQuotes(this.pending) % 2 === 0) {
        const rec = this.pending
        this.pending = null
        this.sink(splitQuoted(rec, this.delimiter), this.pendingRow)
      }
      return
    }
    if (line.length === 0 || (line.length < 8 && line.trim() === '')) return
    if (line.indexOf(QUOTE) < 0) {
      this.sink(line.split(this.delimiter), this.line)
      return
    }
    if (countQuotes(line) % 2 === 1) {
      this.pending = line
      this.pendingRow = this.line
      return
    }
    this.sink(splitQuoted(line, this.delimiter), this.line)
  }
}

/** How many double quotes a text holds (an odd count leaves a quoted field open). */
export function countQuotes(s: string): number {
  let n = 0
  for (let i = s.indexOf(QUOTE); i >= 0; i = s.indexOf(QUOTE, i + 1)) n++
  return n
}

/**
 * Splits one record with RFC 4180 quoting.
 * @param rec the record text (may contain line breaks inside quotes)
 * @param delimiter field delimiter
 * @returns the unquoted field values
 */
export function splitQuoted(rec: string, delimiter: string): string[] {
  const out: string[] = []
  let i = 0
  const n = rec.length
  while (i <= n) {
    if (rec[i] === QUOTE) {
      let val = ''
      i++
      for (;;) {
        const q = rec.indexOf(QUOTE, i)
        if (q < 0) {
          val += rec.slice(i)
          i = n
          break
        }
        val += rec.slice(i, q)
        if (rec[q + 1] === QUOTE) {
          val += QUOTE
          i = q + 2
        } else {
          i = q + 1
          break
        }
      }
      // Anything between the closing quote and the delimiter is kept as written.
      const d = rec.indexOf(delimiter, i)
      const tail = d < 0 ? rec.slice(i) : rec.slice(i, d)
      out.push(val + tail)
      if (d < 0) break
      i = d + 1
    } else {
      const d = rec.indexOf(delimiter, i)
      if (d < 0) {
        out.push(rec.slice(i))
        break
      }
      out.push(rec.slice(i, d))
      i = d + 1
    }
  }
  return out
}
