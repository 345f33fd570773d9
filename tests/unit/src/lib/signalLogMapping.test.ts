import { describe, expect, it } from 'vitest'
import type { ColumnMapping } from '@shared/import/mapping'
import { signalLogMappingIssues, toSignalLogMapping } from '@/lib/signalLogMapping'

const edited: ColumnMapping = {
  delimiter: ';',
  decimalComma: true,
  altUnit: 'm',
  altReference: 'agl',
  signalUnit: 'dbm',
  percentMap: null,
  timeFormat: 'unix-ms',
  columns: [
    { index: 0, name: 'ts', role: 'time' },
    { index: 1, name: 'lat', role: 'lat' },
    { index: 2, name: 'rssi_a', role: 'rssi1' },
    { index: 3, name: 'rssi_b', role: 'rssi2' },
    { index: 4, name: 'note', role: 'extra' },
  ],
}

describe('toSignalLogMapping', () => {
  it('keeps time and signal columns and ignores position and extra columns', () => {
    expect(toSignalLogMapping(edited)).toEqual({
      delimiter: ';',
      decimalComma: true,
      timeFormat: 'unix-ms',
      columns: [
        { index: 0, name: 'ts', role: 'time' },
        { index: 1, name: 'lat', role: 'ignore' },
        { index: 2, name: 'rssi_a', role: 'rssi1' },
        { index: 3, name: 'rssi_b', role: 'rssi2' },
        { index: 4, name: 'note', role: 'ignore' },
      ],
    })
    expect(signalLogMappingIssues(edited)).toEqual([])
  })

  it('names a missing signal column and a percentage signal', () => {
    const noSignal = { ...edited, signalUnit: 'percent' as const, columns: edited.columns.filter((c) => c.role !== 'rssi1') }
    expect(signalLogMappingIssues(noSignal)).toEqual(['Choose one rssi1 column', 'A separate signal log must give the signal in dBm'])
  })
})
