import { describe, expect, it } from 'vitest'
import type { FlightStatusDto } from '@shared/types/flight'
import { importProgress } from '@/lib/importProgress'

const base: FlightStatusDto = { id: 1, status: 'queued', progress: { bytesDone: 0, bytesTotal: 0, rowsDone: 0 }, failure: null, stored: false }

describe('importProgress', () => {
  it('fills the first 30 % while the file is sent', () =>
    expect(importProgress(0.5, null)).toEqual({ percent: 15, label: 'Sending the file… 50 %', state: 'active' }))
  it('moves through the import share by bytes read', () => {
    const v = importProgress(1, { ...base, status: 'importing', progress: { bytesDone: 50, bytesTotal: 100, rowsDone: 12345 } })
    expect(v.percent).toBe(60)
    expect(v.label).toBe('Reading and storing rows… 12,345 so far')
  })
  it('reaches 100 % and success when ready', () =>
    expect(importProgress(1, { ...base, status: 'ready' })).toMatchObject({ percent: 100, state: 'success' }))
  it('says how many rows were stored when ready', () =>
    expect(importProgress(1, { ...base, status: 'ready', progress: { bytesDone: 9, bytesTotal: 9, rowsDone: 3640 } }).label).toBe(
      'Ready: 3,640 rows stored and analysed',
    ))
  it('shows the failure reason', () =>
    expect(importProgress(1, { ...base, status: 'failed', failure: { status: 422, code: 'UNPROCESSABLE', message: 'Too many bad rows' } })).toMatchObject({
      label: 'Too many bad rows',
      state: 'exception',
    }))
  it('clamps a sent fraction above 1', () => expect(importProgress(3, null).percent).toBe(30))
})
