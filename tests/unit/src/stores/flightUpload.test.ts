import { beforeEach, describe, expect, it, vi } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import * as flightsApi from '@/api/flights'
import { useFlightUploadStore } from '@/stores/flightUpload'

vi.mock('@/api/flights')
vi.mock('@/api/columnMappings', () => ({ listColumnMappings: vi.fn(async () => ({ items: [], total: 0 })) }))

describe('useFlightUploadStore with a GPX track and a separate signal log', () => {
  beforeEach(() => {
    setActivePinia(createPinia())
    vi.mocked(flightsApi.createFlight).mockResolvedValue({ id: 9, status: 'queued' })
    vi.mocked(flightsApi.getFlightStatus).mockResolvedValue({ id: 9, status: 'ready' } as never)
  })

  it('sends the signal log mapping as signalMapping and no track mapping', async () => {
    const upload = useFlightUploadStore()
    await upload.chooseFile(new File(['<gpx version="1.1"></gpx>'], 'pass.gpx'))
    await upload.chooseSignalFile(new File(['time_ms,rssi_dbm,lq\n0,-60,100\n100,-61,100\n'], 'rx.csv'))
    expect(upload.mappingIssues).toEqual([])
    await upload.submit({ courseId: 3, setupId: 4, name: 'Ridge pass', flownOn: '2026-05-16', notes: '' })
    const [fields, , signalFile] = vi.mocked(flightsApi.createFlight).mock.calls[0]!
    expect(fields.mapping).toBeNull()
    expect(signalFile?.name).toBe('rx.csv')
    const roles = Object.fromEntries(fields.signalMapping!.columns.map((c) => [c.name, c.role]))
    expect(roles).toMatchObject({ time_ms: 'time', rssi_dbm: 'rssi1' })
    expect(upload.phase).toBe('ready')
  })
})
