// The demo scenario's flights, generated from the physics model in shared/demo (never typed by hand).
// Fixed seeds: the same rows on every run.
import { generateFlight, type GeneratedFlight, type GeneratorCourse, type GeneratorSetup } from '../../../shared/demo/generateFlight.js'
import type { PropagationTruth } from '../../../shared/demo/signalModel.js'
import type { ColumnMapping, ColumnRole } from '../../../shared/import/mapping.js'
import type { CourseDto } from '../../../shared/types/course.js'
import type { LinkSetupDto } from '../../../shared/types/setup.js'
import { toCoreObstacles } from '../../services/flights/analysisInput.js'

/** One demo flight ready to import. */
export interface DemoFlightPlan {
  key: 'low-omni' | 'high-omni' | 'directional' | 'tree-line' | 'diversity' | 'second-band'
  name: string
  notes: string
  flownOn: string
  setupId: number
  csv: string
  mapping: ColumnMapping
  rowCount: number
}

/** The demo course's shadowing field: one seed per course, so every flight sees the same shadows. */
const COURSE_SHADOW_SEED = 20261202

function truthFor(freqMHz: number): PropagationTruth {
  // grass field with scattered trees: n a little above free space, more at the higher band
  return {
    exponent: freqMHz > 2000 ? 2.5 : 2.6,
    shadowSigmaDb: 4,
    shadowCorrelationM: 40,
    shadowFieldSeed: COURSE_SHADOW_SEED,
    flightShadowSigmaDb: 1.5,
    tailShadowDb: 5,
  }
}

/** Course DTO as the generator's input. */
export function generatorCourse(course: CourseDto): GeneratorCourse {
  return {
    stationLatDeg: course.stationLat,
    stationLonDeg: course.stationLon,
    antennaHeightM: course.antennaHeightM,
    routeLonLat: course.route?.coordinates ?? null,
    obstacles: toCoreObstacles(course.obstacles),
  }
}

/** Setup DTO as the generator's input. */
export function generatorSetup(s: LinkSetupDto): GeneratorSetup {
  return {
    freqMHz: s.freqMHz,
    txPowerDbm: s.txPowerDbm,
    txGainDbi: s.txAntenna.gainDbi,
    rxAntennas: s.rxAntennas.map((a) => ({
      kind: a.kind,
      gainDbi: a.gainDbi,
      beamwidthDeg: a.beamwidthDeg,
      azimuthDeg: a.azimuthDeg,
      elevationDeg: a.elevationDeg,
    })),
    cableLossDb: s.cableLossDb,
    sensitivityDbm: s.sensitivityDbm,
    floorDbm: s.floorDbm,
  }
}

/** The log layout the demo writes, and its column mapping. */
export function demoMapping(twoSignals: boolean): ColumnMapping {
  const names = ['time_ms', 'lat', 'lon', 'alt_m', 'rssi1_dbm', ...(twoSignals ? ['rssi2_dbm'] : []), 'lq', 'snr_db']
  const roles: ColumnRole[] = ['time', 'lat', 'lon', 'alt', 'rssi1', ...(twoSignals ? (['rssi2'] as const) : []), 'lq', 'snr']
  return {
    delimiter: ',',
    decimalComma: false,
    columns: names.map((name, index) => ({ index, name, role: roles[index]! })),
    altUnit: 'm',
    altReference: 'agl',
    signalUnit: 'dbm',
    percentMap: null,
    timeFormat: 'ms-from-start',
  }
}

/**
 * Writes a generated flight as CSV text with a header row.
 * @param f the generated arrays
 * @returns CSV text, LF line ends
 */
export function generatedFlightCsv(f: GeneratedFlight): string {
  const two = f.rssiDbm.length === 2
  const lines = [demoMapping(two).columns.map((c) => c.name).join(',')]
  for (let i = 0; i < f.timeMs.length; i++) {
    const cells = [
      f.timeMs[i]!.toFixed(0),
      f.latDeg[i]!.toFixed(7),
      f.lonDeg[i]!.toFixed(7),
      f.altM[i]!.toFixed(1),
      f.rssiDbm[0]![i]!.toFixed(0),
      ...(two ? [f.rssiDbm[1]![i]!.toFixed(0)] : []),
      f.lqPct[i]!.toFixed(0),
      f.snrDb[i]!.toFixed(2),
    ]
    lines.push(cells.join(','))
  }
  return lines.join('\n') + '\n'
}

/** The demo setups by the role each plays in the scenario. */
export interface DemoSetups {
  lowOmni: LinkSetupDto
  highOmni: LinkSetupDto
  directional: LinkSetupDto
  diversity: LinkSetupDto
  secondBand: LinkSetupDto
}

/**
 * Generates the six demo flights on the demo course.
 * @param course the demo course
 * @param s the demo setups by role
 * @returns the plans with CSV text, in flying order
 */
export function demoFlightPlans(course: CourseDto, s: DemoSetups): DemoFlightPlan[] {
  const gc = generatorCourse(course)
  const cruise = { speedMps: 15, cruiseAltM: 60, sampleHz: 10 }
  const specs: Array<Omit<DemoFlightPlan, 'csv' | 'mapping' | 'rowCount'> & { setup: LinkSetupDto; seed: number; profile: typeof cruise & { altWanderM?: number }; gaps?: { atFraction: number; durationMs: number }[] }> = [
    { key: 'low-omni', name: 'Baseline: low power, omni', setup: s.lowOmni, setupId: s.lowOmni.id, seed: 101, flownOn: '2026-10-03', profile: cruise,
      notes: 'Out and back along the course at 60 m. Reference flight for the power and antenna tests.' },
    { key: 'high-omni', name: 'Ten times the power, omni', setup: s.highOmni, setupId: s.highOmni.id, seed: 102, flownOn: '2026-10-03', profile: cruise,
      notes: 'Same course and height; only the transmit power changed (+10 dB).' },
    { key: 'directional', name: 'Low power, directional receive antenna', setup: s.directional, setupId: s.directional.id, seed: 103, flownOn: '2026-10-03', profile: cruise,
      notes: 'Low power again, with the directional antenna on the ground station pointed along the course.' },
    { key: 'tree-line', name: 'Low pass behind the tree line', setup: s.highOmni, setupId: s.highOmni.id, seed: 104, flownOn: '2026-10-10',
      profile: { speedMps: 12, cruiseAltM: 7, sampleHz: 10, altWanderM: 1 },
      notes: 'Deliberately low (about 7 m) so the tree line enters the first Fresnel zone.' },
    { key: 'diversity', name: 'Diversity: omni + directional', setup: s.diversity, setupId: s.diversity.id, seed: 105, flownOn: '2026-10-10', profile: cruise,
      gaps: [{ atFraction: 0.37, durationMs: 2400 }],
      notes: 'Two receive antennas logged separately; one telemetry gap from a loose connector.' },
    { key: 'second-band', name: 'Second band, omni', setup: s.secondBand, setupId: s.secondBand.id, seed: 106, flownOn: '2026-10-17', profile: cruise,
      notes: 'The long-range control link on its own band, same course.' },
  ]
  return specs.map(({ setup, seed, profile, gaps, ...rest }) => {
    const f = generateFlight(gc, generatorSetup(setup), { seed, profile, truth: truthFor(setup.freqMHz), gaps })
    return { ...rest, csv: generatedFlightCsv(f), mapping: demoMapping(f.rssiDbm.length === 2), rowCount: f.timeMs.length }
  })
}
