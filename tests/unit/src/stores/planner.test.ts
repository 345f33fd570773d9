import { beforeEach, describe, expect, it, vi } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import type { LinkSetupDto } from '@shared/types/setup'
import { usePlannerStore } from '@/stores/planner'
import * as setupsApi from '@/api/setups'
import * as coursesApi from '@/api/courses'
import * as flightsApi from '@/api/flights'

vi.mock('@/api/setups')
vi.mock('@/api/courses')
vi.mock('@/api/flights')

const setup = (over: Partial<LinkSetupDto> = {}): LinkSetupDto => ({
  id: 7, teamId: 1, createdBy: 1, lineageId: 7, version: 1, isCurrent: true, name: '868 patch', band: '868 MHz',
  freqMHz: 868, channel: null, txPowerDbm: 14, txPowerMw: 25, txAntenna: { type: 'dipole', gainDbi: 2.15 },
  rxAntennas: [
    { label: 'Omni', type: 'dipole', kind: 'omni', gainDbi: 2.15, beamwidthDeg: 78, beamwidthEstimated: true, azimuthDeg: null, elevationDeg: null, polarisation: 'vertical' },
    { label: 'Patch', type: 'patch', kind: 'directional', gainDbi: 8, beamwidthDeg: 64, beamwidthEstimated: false, azimuthDeg: 60, elevationDeg: 5, polarisation: 'vertical' },
  ],
  cableLossDb: 1, sensitivityDbm: -112, floorDbm: -130, notes: '', eirpDbm: 16.15, inUse: true, createdAt: '2026-10-01T00:00:00Z',
  ...over,
})

beforeEach(() => {
  setActivePinia(createPinia())
  vi.mocked(setupsApi.listSetups).mockResolvedValue({ items: [setup()], total: 1 })
  vi.mocked(setupsApi.getSetup).mockResolvedValue(setup())
  vi.mocked(coursesApi.listCourses).mockResolvedValue({ items: [], total: 0 })
})

describe('usePlannerStore', () => {
  it('plans on the better antenna of a diversity setup and picks the preset of its band', async () => {
    const s = usePlannerStore()
    await s.init({ setupId: 7 })
    expect(s.radio.rxGainDbi).toBe(8)
    expect(s.radio.rxKind).toBe('directional')
    expect(s.presetId).toBe('eu-868-g1')
    expect(s.plan!.beam!.beamwidthDeg).toBe(64)
  })

  it('starts from a flight model and shifts it with the power', async () => {
    vi.mocked(flightsApi.getFlight).mockResolvedValue({
      id: 3, setupId: 7, courseId: 2, name: 'low pass',
      analysis: { model: { source: 'fit', interceptDbm: -30, exponent: 2.8, referenceDistanceM: 1 } },
    } as unknown as flightsApi.FlightDto)
    const s = usePlannerStore()
    await s.init({ flightId: 3 })
    expect(s.useFlightModel).toBe(true)
    expect(s.plan!.modelSource).toBe('flight')
    const before = s.plan!.rangeM
    s.radio = { ...s.radio, txPowerDbm: s.radio.txPowerDbm + 10 }
    // log-distance model: +10 dB at n = 2.8 is 10^(10/28) times the range
    expect(s.plan!.rangeM / before).toBeCloseTo(10 ** (10 / 28), 9)
  })

  it('warns once the power passes the preset limit', async () => {
    const s = usePlannerStore()
    await s.init({ setupId: 7 })
    expect(s.plan!.exceedsLimit).toBe(false)
    s.radio = { ...s.radio, txPowerDbm: 20 }
    expect(s.plan!.exceedsLimit).toBe(true)
    expect(s.plan!.limitChecks[0]!.basis).toBe('erp')
  })

  it('reports an impossible input as an error instead of a plan', async () => {
    const s = usePlannerStore()
    await s.init({})
    s.targetRangeM = 0
    expect(s.plan).toBeNull()
    expect(s.planError).toMatch(/targetRangeM/)
  })
})
