import type { Role } from '@shared/types/api'

/** One side-navigation entry. Later features append theirs to NAV_ENTRIES. */
export interface NavEntry {
  /** Name of the route it opens; entries whose route does not exist are hidden. */
  routeName: string
  label: string
  /** Roles that see it; absent means every signed-in role. */
  roles?: Role[]
  /** Shown only while this runtime feature is on (e.g. 'devOutbox' when the local mail sink runs). */
  feature?: string
}

export const NAV_ENTRIES: NavEntry[] = [
  { routeName: 'home', label: 'Overview' },
  { routeName: 'courses', label: 'Courses' },
  { routeName: 'setups', label: 'Link setups' },
  { routeName: 'flights', label: 'Flights' },
  { routeName: 'compare', label: 'Compare' },
  { routeName: 'planner', label: 'Plan a link' },
  { routeName: 'team-members', label: 'Team members' },
  { routeName: 'account', label: 'My account' },
  { routeName: 'dev-outbox', label: 'Sent e-mail (dev)', roles: ['admin'], feature: 'devOutbox' },
]

export interface NavContext {
  role: Role | null
  hasRoute: (routeName: string) => boolean
  features?: ReadonlySet<string>
}

/** The entries a user sees: route exists, role fits, required feature is on. */
export function visibleNav(entries: readonly NavEntry[], ctx: NavContext): NavEntry[] {
  return entries.filter((e) => {
    if (!ctx.hasRoute(e.routeName)) return false
    if (e.roles && (ctx.role === null || !e.roles.includes(ctx.role))) return false
    if (e.feature && !ctx.features?.has(e.feature)) return false
    return true
  })
}
