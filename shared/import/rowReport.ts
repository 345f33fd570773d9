/** One refused row as reported to the user. */
export interface RowErrorEntry {
  /** Line in the file, 1-based (the header is line 1). */
  row: number
  column: string
  reason: string
}

/** The bad-row report kept beside a flight and returned with a refusal. */
export interface RowReportDto {
  goodRows: number
  badRows: number
  /** Leading rows without a GPS fix (0, 0), skipped without counting as bad. */
  noFixRows: number
  /** The first rows in full. */
  first: RowErrorEntry[]
  /** Counts by `column: reason`. */
  byReason: Record<string, number>
}

/** How many refused rows are kept in full. */
export const ROW_ERRORS_KEPT = 50

/** Collects bad rows while a file streams past. */
export class RowReport {
  goodRows = 0
  badRows = 0
  noFixRows = 0
  readonly first: RowErrorEntry[] = []
  readonly byReason: Record<string, number> = {}

  /** Records one refused row. */
  bad(row: number, column: string, reason: string): void {
    this.badRows++
    if (this.first.length < ROW_ERRORS_KEPT) this.first.push({ row, column, reason })
    const key = `${column}: ${reason}`
    this.byReason[key] = (this.byReason[key] ?? 0) + 1
  }

  /**
   * Whether the file should be refused: no usable rows, or more bad rows than the allowed share.
   * @param maxBadShare allowed share of bad rows among good + bad, [0, 1]
   */
  refused(maxBadShare: number): boolean {
    if (this.goodRows === 0) return true
    return this.badRows > maxBadShare * (this.goodRows + this.badRows)
  }

  /** A short sentence saying why the file was refused. */
  refusalMessage(maxBadShare: number): string {
    if (this.goodRows === 0) {
      return this.badRows === 0 ? 'The file has no data rows' : `No usable rows: all ${this.badRows} data rows are bad`
    }
    const pct = (100 * this.badRows) / (this.goodRows + this.badRows)
    return `${this.badRows} of ${this.goodRows + this.badRows} rows are bad (${pct.toFixed(1)} %, more than the ${(
      maxBadShare * 100
    ).toFixed(1)} % allowed)`
  }

  /** Plain JSON form. */
  toDto(): RowReportDto {
    return {
      goodRows: this.goodRows,
      badRows: this.badRows,
      noFixRows: this.noFixRows,
      first: [...this.first],
      byReason: { ...this.byReason },
    }
  }
}
