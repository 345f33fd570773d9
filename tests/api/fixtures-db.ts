// Course and link-setup rows for flight suites, made through the models (the courses feature owns their API).
import { sequelize } from '../../server/db.js'
import { Course } from '../../server/models/Course.js'
import { LinkSetup } from '../../server/models/LinkSetup.js'

/** The fixture logs' ground station (see server/scripts/fixtures/make-logs.ts). */
export const FIXTURE_STATION = { latDeg: 52.0412, lonDeg: -1.3127, groundElevM: 118 }

/** A course at the fixture station in `teamId`. */
export async function makeCourse(teamId: number, createdBy: number | null, over: Partial<{ stationLat: number; stationLon: number; name: string }> = {}) {
  sequelize()
  return Course.create({
    teamId,
    createdBy,
    name: over.name ?? 'Heron Moor east field',
    stationLat: over.stationLat ?? FIXTURE_STATION.latDeg,
    stationLon: over.stationLon ?? FIXTURE_STATION.lonDeg,
    antennaHeightM: 2,
    groundElevM: FIXTURE_STATION.groundElevM,
    route: null,
    obstacles: [],
  })
}

/** A 2.4 GHz control-link setup with one omni receive antenna in `teamId`. */
export async function makeSetup(teamId: number, createdBy: number | null) {
  sequelize()
  const s = await LinkSetup.create({
    teamId,
    createdBy,
    lineageId: 0,
    version: 1,
    isCurrent: true,
    name: '2.4 GHz control, 100 mW',
    band: '2.4 GHz',
    freqMhz: 2440,
    channel: null,
    txPowerDbm: 20,
    txAntenna: { type: 'dipole', gainDbi: 2 },
    rxAntennas: [
      { label: 'A', type: 'dipole', kind: 'omni', gainDbi: 2, beamwidthDeg: null, beamwidthEstimated: false, azimuthDeg: null, elevationDeg: null, polarisation: 'vertical' },
    ],
    cableLossDb: 1,
    sensitivityDbm: -105,
    floorDbm: -120,
    notes: '',
  })
  await s.update({ lineageId: s.id })
  return s
}
