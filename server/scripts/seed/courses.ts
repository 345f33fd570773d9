// Demo course and link setups for the invented "Heron Moor" field: flat open farmland, a tree line across
// the course about 600 m out, and a hangar beside the ground station.
import type { AuthContext } from '../../types/express.js'
import type { CourseInput } from '../../../shared/schemas/course.js'
import type { SetupInput, RxAntennaInput } from '../../../shared/schemas/setup.js'
import { createCourse } from '../../services/courses.js'
import { createSetup } from '../../services/setups.js'

/** Ids created by the demo seed. */
export interface DemoCoursesAndSetups {
  courseId: number
  setupIds: {
    /** 868 MHz, 25 mW, omni receive antenna. */
    lowOmni: number
    /** 868 MHz, 250 mW (ten times the power), omni receive antenna. */
    highOmni: number
    /** 868 MHz, 25 mW, directional receive antenna pointed along the course. */
    directional: number
    /** 868 MHz, 25 mW, diversity: omni + directional. */
    diversity: number
    /** 2.4 GHz control link, 100 mW, omni. */
    secondBand: number
  }
}

/** Bearing of the course from the station, degrees true; the directional antenna points this way. */
export const DEMO_COURSE_BEARING_DEG = 60

export const DEMO_COURSE: CourseInput = {
  name: 'Heron Moor strip',
  notes:
    'Grass strip in flat open farmland. The course runs east-north-east from the ground station for about 2.4 km. ' +
    'A tree line crosses it about 600 m out; the club hangar stands south-west of the station.',
  stationLat: 52.8712,
  stationLon: -0.0563,
  antennaHeightM: 2,
  groundElevM: 2,
  route: {
    type: 'LineString',
    coordinates: [
      [-0.0549, 52.8717],
      [-0.0408, 52.8766],
      [-0.0254, 52.882],
    ],
  },
  obstacles: [
    {
      id: 'tree-line',
      label: 'Tree line (poplars)',
      kind: 'line',
      heightM: 14,
      coordinates: [
        [-0.04972, 52.87507],
        [-0.04748, 52.87273],
      ],
    },
    {
      id: 'hangar',
      label: 'Club hangar',
      kind: 'polygon',
      heightM: 7,
      coordinates: [
        [-0.05726, 52.86981],
        [-0.05686, 52.86981],
        [-0.05686, 52.87005],
        [-0.05726, 52.87005],
      ],
    },
  ],
}

const omni = (label: string, gainDbi = 2.15): RxAntennaInput => ({
  label,
  type: 'dipole',
  kind: 'omni',
  gainDbi,
  beamwidthDeg: null,
  azimuthDeg: null,
  elevationDeg: null,
  polarisation: 'vertical',
})
const patch = (label: string): RxAntennaInput => ({
  label,
  type: 'patch',
  kind: 'directional',
  gainDbi: 8,
  beamwidthDeg: null,
  azimuthDeg: DEMO_COURSE_BEARING_DEG,
  elevationDeg: 5,
  polarisation: 'vertical',
})

const LONG_RANGE: Omit<SetupInput, 'name' | 'txPowerDbm' | 'rxAntennas' | 'notes'> = {
  band: '868 MHz',
  freqMHz: 868,
  channel: null,
  txAntenna: { type: 'dipole', gainDbi: 2.15 },
  cableLossDb: 1,
  sensitivityDbm: -112,
  floorDbm: -130,
}

// 10·log10(25) = 13.98 dBm; 10·log10(250) = 23.98 dBm; 10·log10(100) = 20 dBm
const DBM_25_MW = 10 * Math.log10(25)

export const DEMO_SETUPS: Record<keyof DemoCoursesAndSetups['setupIds'], SetupInput> = {
  lowOmni: { ...LONG_RANGE, name: '868 long range, 25 mW, omni', txPowerDbm: DBM_25_MW, rxAntennas: [omni('Omni')], notes: 'Baseline.' },
  highOmni: {
    ...LONG_RANGE,
    name: '868 long range, 250 mW, omni',
    txPowerDbm: 10 * Math.log10(250),
    rxAntennas: [omni('Omni')],
    notes: 'Ten times the baseline power (+10 dB). Check your licence and regional EIRP limit before flying this.',
  },
  directional: {
    ...LONG_RANGE,
    name: '868 long range, 25 mW, patch on the ground',
    txPowerDbm: DBM_25_MW,
    rxAntennas: [patch('Patch')],
    notes: 'Baseline power with an 8 dBi patch at the ground station pointed along the course.',
  },
  diversity: {
    ...LONG_RANGE,
    name: '868 long range, 25 mW, diversity',
    txPowerDbm: DBM_25_MW,
    rxAntennas: [omni('Omni'), patch('Patch')],
    notes: 'Diversity receiver: one omni and one patch pointed along the course.',
  },
  secondBand: {
    name: '2.4 GHz control, 100 mW, omni',
    band: '2.4 GHz',
    freqMHz: 2440,
    channel: null,
    txPowerDbm: 20,
    txAntenna: { type: 'dipole', gainDbi: 2.15 },
    rxAntennas: [omni('Omni')],
    cableLossDb: 1,
    sensitivityDbm: -105,
    floorDbm: -128,
    notes: 'The short-range control link, same course.',
  },
}

/**
 * Seeds the demo course (station, route, a tree line and a hangar) and five link setups for a team.
 * @param teamId the demo team
 * @param userId the member recorded as creator (the demo pilot, say)
 * @returns the ids of the course and of each setup
 */
export async function seedDemoCoursesAndSetups(teamId: number, userId: number): Promise<DemoCoursesAndSetups> {
  const auth: AuthContext = { teamId, userId, role: 'admin' }
  const course = await createCourse(auth, DEMO_COURSE)
  const setupIds = {} as DemoCoursesAndSetups['setupIds']
  // in this order, so "oldest first" lists start with the baseline
  for (const key of ['lowOmni', 'highOmni', 'directional', 'diversity', 'secondBand'] as const) {
    setupIds[key] = (await createSetup(auth, DEMO_SETUPS[key])).id
  }
  return { courseId: course.id, setupIds }
}
