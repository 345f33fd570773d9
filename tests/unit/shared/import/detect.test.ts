import { describe, expect, it } from 'vitest'
import { detectDecimalComma, detectDelimiter, detectLayout } from '../../../../shared/import/detect.js'

describe('detectDelimiter', () => {
  it('picks the comma for a comma-separated log', () => {
    expect(detectDelimiter('t,lat,lon,rssi\n0,51.1,-1.2,-60\n100,51.1,-1.2,-61\n')).toBe(',')
  })
  it('picks the semicolon when commas are decimal separators', () => {
    expect(detectDelimiter('t;lat;lon\n0;51,1;-1,2\n1;51,2;-1,3\n')).toBe(';')
  })
  it('picks the tab for a tab-separated log', () => {
    expect(detectDelimiter('t\tlat\tlon\n0\t51.1\t-1.2\n')).toBe('\t')
  })
})

describe('detectDecimalComma', () => {
  it('is true for semicolon files with comma decimals', () => {
    expect(detectDecimalComma('t;lat\n0;51,125\n1;51,126\n', ';')).toBe(true)
  })
  it('is false for point decimals', () => {
    expect(detectDecimalComma('t,lat\n0,51.125\n', ',')).toBe(false)
  })
})

describe('detectLayout', () => {
  it('reports a byte-order mark and CRLF line ends', () => {
    expect(detectLayout('\uFEFFt,lat\r\n0,1.5\r\n')).toEqual({ hasBom: true, lineEnding: 'crlf', delimiter: ',', decimalComma: false })
  })
  it('reports lone CR line ends', () => {
    expect(detectLayout('t,lat\r0,1.5\r').lineEnding).toBe('cr')
  })
})
