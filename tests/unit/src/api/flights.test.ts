import { beforeEach, describe, expect, it, vi } from 'vitest'
import * as client from '@/api/client'
import { createFlight, type NewFlightFields } from '@/api/flights'
import type { SignalLogMapping } from '@shared/import/signalLog'

vi.mock('@/api/client', () => ({ upload: vi.fn(async () => ({ id: 1, status: 'queued' })) }))

const FIELDS: NewFlightFields = { courseId: 3, setupId: 4, name: 'Ridge pass', flownOn: '2026-05-16', notes: '', mapping: null }
const SIGNAL: SignalLogMapping = {
  delimiter: ',',
  decimalComma: false,
  timeFormat: 'iso',
  columns: [
    { index: 0, name: 'time', role: 'time' },
    { index: 1, name: 'rssi', role: 'rssi1' },
  ],
}
const sentForm = () => vi.mocked(client.upload).mock.calls.at(-1)![1]

describe('createFlight', () => {
  beforeEach(() => vi.mocked(client.upload).mockClear())

  it('sends a GPX track with its separate signal log and the log mapping as the JSON field signalMapping', async () => {
    const track = new File(['<gpx/>'], 'pass.gpx')
    const log = new File(['time,rssi\n'], 'rx.csv')
    await createFlight({ ...FIELDS, signalMapping: SIGNAL }, track, log)
    const form = sentForm()
    expect(JSON.parse(String(form.get('signalMapping')))).toEqual(SIGNAL)
    expect(form.get('mapping')).toBeNull()
    expect((form.get('signalFile') as File).name).toBe('rx.csv')
    expect((form.get('file') as File).name).toBe('pass.gpx')
  })

  it('sends no signalMapping without a signal log', async () => {
    await createFlight({ ...FIELDS, signalMapping: SIGNAL }, new File(['<gpx/>'], 'pass.gpx'), null)
    expect(sentForm().has('signalMapping')).toBe(false)
  })
})
