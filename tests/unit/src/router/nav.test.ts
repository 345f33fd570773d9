import { describe, expect, it } from 'vitest'
import { NAV_ENTRIES, visibleNav, type NavEntry } from '@/router/nav'

const ENTRIES: NavEntry[] = [
  { routeName: 'home', label: 'Overview' },
  { routeName: 'courses', label: 'Courses', roles: ['admin', 'pilot'] },
  { routeName: 'dev-outbox', label: 'Outbox', roles: ['admin'], feature: 'devOutbox' },
  { routeName: 'planned', label: 'Not built yet' },
]
const existing = new Set(['home', 'courses', 'dev-outbox'])
const hasRoute = (n: string) => existing.has(n)
const names = (list: NavEntry[]) => list.map((e) => e.routeName)

describe('visibleNav', () => {
  it('hides entries whose route does not exist', () => {
    expect(names(visibleNav(ENTRIES, { role: 'admin', hasRoute }))).not.toContain('planned')
  })

  it('hides role-restricted entries from other roles', () => {
    expect(names(visibleNav(ENTRIES, { role: 'viewer', hasRoute }))).toEqual(['home'])
    expect(names(visibleNav(ENTRIES, { role: 'pilot', hasRoute }))).toEqual(['home', 'courses'])
  })

  it('shows a feature entry only while the feature is on', () => {
    expect(names(visibleNav(ENTRIES, { role: 'admin', hasRoute }))).toEqual(['home', 'courses'])
    const on = new Set(['devOutbox'])
    expect(names(visibleNav(ENTRIES, { role: 'admin', hasRoute, features: on }))).toEqual([
      'home',
      'courses',
      'dev-outbox',
    ])
  })

  it('shows no role-restricted entry when the role is unknown', () => {
    expect(names(visibleNav(ENTRIES, { role: null, hasRoute }))).toEqual(['home'])
  })

  it('keeps the dev outbox entry admin-only in the real nav list', () => {
    const outbox = NAV_ENTRIES.find((e) => e.routeName === 'dev-outbox')
    expect(outbox).toMatchObject({ roles: ['admin'], feature: 'devOutbox' })
  })
})
