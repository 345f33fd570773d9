import { describe, expect, it } from 'vitest'
import { RecordError, RecordSplitter, splitQuoted } from '../../../../shared/import/recordSplitter.js'

function split(chunks: string[], delimiter: ',' | ';' = ',', maxRecordChars?: number): Array<[number, string[]]> {
  const out: Array<[number, string[]]> = []
  const s = new RecordSplitter({ delimiter, maxRecordChars }, (f, row) => out.push([row, f]))
  for (const c of chunks) s.push(c)
  s.end()
  return out
}

describe('RecordSplitter', () => {
  it('joins records cut across chunks and strips CR from CRLF', () => {
    expect(split(['a,b\r\n1,', '2\r', '\n3,4'])).toEqual([
      [1, ['a', 'b']],
      [2, ['1', '2']],
      [3, ['3', '4']],
    ])
  })
  it('drops a leading byte-order mark', () => {
    expect(split(['\uFEFFt;x\n1;2\n'], ';')[0]).toEqual([1, ['t', 'x']])
  })
  it('skips blank lines but keeps counting them', () => {
    expect(split(['a\n\n\nb\n'])).toEqual([
      [1, ['a']],
      [4, ['b']],
    ])
  })
  it('reads lone-CR line ends', () => {
    expect(split(['a,b\r1,2\r'])).toEqual([
      [1, ['a', 'b']],
      [2, ['1', '2']],
    ])
  })
  it('keeps delimiters and line breaks inside quotes, reporting the starting line', () => {
    expect(split(['n,v\n"x, ""y""\nz",5\n'])).toEqual([
      [1, ['n', 'v']],
      [2, ['x, "y"\nz', '5']],
    ])
  })
  it('stops on a record longer than the limit, naming its row', () => {
    const s = new RecordSplitter({ delimiter: ',', maxRecordChars: 100 }, () => undefined)
    s.push('a,b\n')
    expect(() => s.push('x'.repeat(150))).toThrow(RecordError)
    try {
      s.push('y')
    } catch (e) {
      expect((e as RecordError).row).toBe(2)
    }
  })
  it('refuses a quote that never closes', () => {
    expect(() => split(['a\n"open,1\n'])).toThrow(/Row 2 has a quote/)
  })
})

describe('splitQuoted', () => {
  it('keeps an empty trailing field', () => {
    expect(splitQuoted('"a",b,', ',')).toEqual(['a', 'b', ''])
  })
})
