// The demo scenario: an invented club at an invented field. Filled in by the features that own its parts.
import type { Role } from '../../../shared/types/api.js'

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

/** Seeds the demo when the database holds no users; returns true when it did. */
export async function seedDemoIfEmpty(): Promise<boolean> {
  return false
}
