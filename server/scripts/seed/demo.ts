// The demo scenario: an invented club at an invented field. Filled in by the features that own its parts.
import type { Role } from '../../../shared/types/api.js'
import { countUsers, createTeamWithMembers } from '../../services/members.js'
import { seedDemoCoursesAndSetups } from './courses.js'
import { seedDemoFlightsAndComparison } from './flights.js'

export interface DemoUser {
  email: string
  name: string
  role: Role
  password: string
}

export const DEMO_PASSWORD = 'heron-field-demo'

export const DEMO_USERS: DemoUser[] = [
  { email: 'admin@heronmoor.example.test', name: 'Ada Quarrie', role: 'admin', password: DEMO_PASSWORD },
  { email: 'instructor@heronmoor.example.test', name: 'Ines Calder', role: 'instructor', password: DEMO_PASSWORD },
  { email: 'pilot@heronmoor.example.test', name: 'Piet Harrow', role: 'pilot', password: DEMO_PASSWORD },
  { email: 'viewer@heronmoor.example.test', name: 'Vera Linney', role: 'viewer', password: DEMO_PASSWORD },
]

export const DEMO_TEAM_NAME = 'Heron Moor Model Flyers'

/** Ids of the seeded demo team and its users, keyed by role, for the later seed steps. */
export interface DemoTeamIds {
  teamId: number
  userIds: Record<Role, number>
}

/** Creates the demo club with one user per role (bcrypt cost from config). */
export async function seedDemoTeam(): Promise<DemoTeamIds> {
  const { teamId, userIds } = await createTeamWithMembers(DEMO_TEAM_NAME, DEMO_USERS)
  const byRole = Object.fromEntries(DEMO_USERS.map((u, i) => [u.role, userIds[i]!])) as Record<Role, number>
  return { teamId, userIds: byRole }
}

/** Seeds the demo when the database holds no users; returns true when it did. */
export async function seedDemoIfEmpty(): Promise<boolean> {
  if ((await countUsers()) > 0) return false
  const team = await seedDemoTeam()
  const refs = await seedDemoCoursesAndSetups(team.teamId, team.userIds.admin)
  // generated flights go through the real import pipeline, then the "Power vs antenna" comparison is saved
  await seedDemoFlightsAndComparison(team.teamId, team.userIds.pilot, refs)
  return true
}
