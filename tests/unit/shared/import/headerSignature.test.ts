import { describe, expect, it } from 'vitest'
import { headerSignature } from '../../../../shared/import/headerSignature.js'

describe('headerSignature', () => {
  it('ignores case, spaces and a byte-order mark', () => {
    expect(headerSignature(['\uFEFFTime ', 'Lat', 'LON'])).toBe(headerSignature(['time', 'lat', 'lon']))
  })
  it('changes when the column order changes', () => {
    expect(headerSignature(['lat', 'lon'])).not.toBe(headerSignature(['lon', 'lat']))
  })
  it('carries the column count', () => {
    expect(headerSignature(['a', 'b', 'c'])).toMatch(/^h3-[0-9a-f]{8}$/)
  })
})
