import { describe, expect, it } from 'vitest'
import { parseDateTimeCells, parseIsoCell, parseNumberCell, parseTimeCell } from '../../../../shared/import/cellValues.js'

describe('parseNumberCell', () => {
  it('reads plain decimals, signs and exponents', () => {
    expect([parseNumberCell('-72.5', false), parseNumberCell('+3', false), parseNumberCell('1e3', false)]).toEqual([-72.5, 3, 1000])
  })
  it('reads a decimal comma when asked', () => {
    expect(parseNumberCell('51,125', true)).toBe(51.125)
  })
  it('reads plain decimals exactly as Number() does (fast path), across signs, lengths and precisions', () => {
    let seed = 7
    const rnd = () => ((seed = (Math.imul(seed, 1664525) + 1013904223) >>> 0) / 2 ** 32)
    for (let i = 0; i < 20_000; i++) {
      const v = (rnd() - 0.5) * 10 ** Math.floor(rnd() * 8)
      const s = v.toFixed(Math.floor(rnd() * 10))
      expect(parseNumberCell(s, false)).toBe(Number(s))
    }
    for (const s of ['-0', '.5', '5.', '+7.25', '123456789012345', '1234567890123456789', '0.1000000000000000055511']) {
      expect(Object.is(parseNumberCell(s, false), Number(s)), s).toBe(true)
    }
  })
  it('refuses blanks, hex, Infinity and text', () => {
    for (const s of ['', ' ', '0x10', 'Infinity', '1e309', 'abc', '12abc', '0b1', '.', '-', '1.2.3', '--1']) {
      expect(parseNumberCell(s, false), s).toBeNaN()
    }
  })
})

describe('parseIsoCell', () => {
  it('takes a zone-less timestamp as UTC', () => {
    expect(parseIsoCell('2026-05-01 10:00:01.250')).toBe(Date.UTC(2026, 4, 1, 10, 0, 1, 250))
  })
  it('honours an explicit offset', () => {
    expect(parseIsoCell('2026-05-01T12:00:00+02:00')).toBe(Date.UTC(2026, 4, 1, 10))
  })
  it('refuses a bare number', () => expect(parseIsoCell('12345')).toBeNaN())
})

describe('parseDateTimeCells', () => {
  it('reads ISO and dotted dates with fractional seconds', () => {
    expect(parseDateTimeCells('2026-05-01', '10:00:01.5')).toBe(Date.UTC(2026, 4, 1, 10, 0, 1, 500))
    expect(parseDateTimeCells('01.05.2026', '9:00:00')).toBe(Date.UTC(2026, 4, 1, 9))
  })
  it('refuses an unreadable time', () => expect(parseDateTimeCells('2026-05-01', 'noon')).toBeNaN())
})

describe('parseTimeCell', () => {
  it('scales seconds to milliseconds', () => {
    expect(parseTimeCell('1.25', 's-from-start', false)).toBe(1250)
    expect(parseTimeCell('1700000000', 'unix-s', false)).toBe(1.7e12)
  })
})
