import type { Delimiter } from './mapping.js'

/** What the first lines of a delimited log reveal about its layout. */
export interface LayoutGuess {
  hasBom: boolean
  lineEnding: 'lf' | 'crlf' | 'cr'
  delimiter: Delimiter
  decimalComma: boolean
}

const CANDIDATES: readonly Delimiter[] = [',', ';', '\t', '|']

/** Splits sample text into lines, whatever the line ending. */
function sampleLines(text: string): string[] {
  return text.split(/\r\n|\n|\r/).filter((l) => l.trim().length > 0)
}

/**
 * Picks the delimiter that splits the sample lines into the same, largest number of fields.
 * @param text the first few kilobytes of the file, decoded
 * @returns the most consistent delimiter; ',' when nothing splits
 */
export function detectDelimiter(text: string): Delimiter {
  const lines = sampleLines(text.replace(/^\uFEFF/, '')).slice(0, 20)
  let best: Delimiter = ','
  let bestScore = 0
  for (const d of CANDIDATES) {
    const counts = lines.map((l) => l.split(d).length)
    const first = counts[0] ?? 1
    if (first < 2) continue
    const same = counts.filter((c) => c === first).length
    const score = (same / counts.length) * 1000 + first
    if (score > bestScore) {
      bestScore = score
      best = d
    }
  }
  return best
}

/**
 * Whether numbers in the data rows use a decimal comma (e.g. `-72,5`); only possible when the delimiter is not a comma
 * or the fields are quoted.
 * @param text sample text, decoded
 * @param delimiter the detected delimiter
 * @returns true when comma decimals outnumber point decimals among data cells
 */
export function detectDecimalComma(text: string, delimiter: Delimiter): boolean {
  const lines = sampleLines(text.replace(/^\uFEFF/, '')).slice(1, 50)
  let comma = 0
  let point = 0
  for (const line of lines) {
    for (const raw of line.split(delimiter)) {
      const cell = raw.trim().replace(/^"|"$/g, '')
      if (/^[+-]?\d+,\d+$/.test(cell)) comma++
      else if (/^[+-]?\d+\.\d+$/.test(cell)) point++
    }
  }
  return comma > point
}

/**
 * Guesses BOM, line ending, delimiter and decimal separator from the start of a file.
 * @param text the first few kilobytes, decoded as UTF-8 (BOM kept)
 * @returns the layout guess
 */
export function detectLayout(text: string): LayoutGuess {
  const hasBom = text.charCodeAt(0) === 0xfeff
  const lineEnding = text.includes('\r\n') ? 'crlf' : !text.includes('\n') && text.includes('\r') ? 'cr' : 'lf'
  const delimiter = detectDelimiter(text)
  return { hasBom, lineEnding, delimiter, decimalComma: detectDecimalComma(text, delimiter) }
}
