import type { Role } from '@shared/types/api'

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  instructor: 'Instructor',
  pilot: 'Pilot',
  viewer: 'Viewer',
}

/** What each role may do, in the words shown beside role pickers. */
export const ROLE_DESCRIPTIONS: Record<Role, string> = {
  admin: 'Everything in the team, including members and their roles.',
  instructor: 'Everything a pilot can do, and can invite viewers.',
  pilot: 'Creates and edits courses, setups and flights.',
  viewer: 'Can look at everything in the team but change nothing.',
}

/** Plain-language labels and descriptions for team roles. */
export function useRoleText() {
  return {
    roleLabel: (role: Role | null | undefined) => (role ? ROLE_LABELS[role] : ''),
    roleDescription: (role: Role | null | undefined) => (role ? ROLE_DESCRIPTIONS[role] : ''),
  }
}
