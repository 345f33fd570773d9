import type { FlightInput, FlightSamples } from '../../../shared/analysis/types.js'
import type { Obstacle } from '../../../shared/fresnel/obstacles.js'
import type { CourseObstacle, LonLat } from '../../../shared/types/course.js'
import type { Course } from '../../models/Course.js'
import type { LinkSetup } from '../../models/LinkSetup.js'

const toPoint = ([lon, lat]: LonLat) => ({ latDeg: lat, lonDeg: lon })

/** Course obstacles (GeoJSON order) as the shared core's obstacles. */
export function toCoreObstacles(list: readonly CourseObstacle[]): Obstacle[] {
  return list.map((o): Obstacle => {
    if (o.kind === 'point') return { kind: 'point', label: o.label, heightM: o.heightM, position: toPoint(o.coordinates) }
    if (o.kind === 'line') return { kind: 'line', label: o.label, heightM: o.heightM, path: o.coordinates.map(toPoint) }
    return { kind: 'polygon', label: o.label, heightM: o.heightM, ring: o.coordinates.map(toPoint) }
  })
}

/**
 * Builds the shared core's input from stored rows: altitudes are stored above ground, so the reference is AGL.
 * @param samples collected arrays
 * @param course the flight's course
 * @param setup the flight's link setup version
 * @param terrain elevation lookup (m AMSL) or null
 */
export function buildFlightInput(
  samples: FlightSamples,
  course: Course,
  setup: LinkSetup,
  terrain: ((latDeg: number, lonDeg: number) => number) | null,
): FlightInput {
  return {
    samples,
    station: {
      latDeg: course.stationLat,
      lonDeg: course.stationLon,
      antennaHeightM: course.antennaHeightM,
      groundElevM: course.groundElevM,
    },
    altitudeReference: 'AGL',
    setup: {
      freqMHz: setup.freqMhz,
      txPowerDbm: setup.txPowerDbm,
      txGainDbi: setup.txAntenna.gainDbi,
      rxAntennas: setup.rxAntennas.map((a) => ({
        gainDbi: a.gainDbi,
        kind: a.kind,
        ...(a.beamwidthDeg !== null ? { beamwidthDeg: a.beamwidthDeg } : {}),
        ...(a.azimuthDeg !== null ? { azimuthDeg: a.azimuthDeg } : {}),
        ...(a.elevationDeg !== null ? { elevationDeg: a.elevationDeg } : {}),
      })),
      cableLossDb: setup.cableLossDb,
      sensitivityDbm: setup.sensitivityDbm,
      floorDbm: setup.floorDbm,
    },
    obstacles: toCoreObstacles(course.obstacles ?? []),
    ...(terrain ? { terrain: { elevationAmslM: terrain } } : {}),
  }
}
