import { createRouter, createWebHistory, type RouteLocationNormalized } from 'vue-router'
import type { Role } from '@shared/types/api'
import HomeView from '@/views/HomeView.vue'
import { useAuthStore } from '@/stores/auth'
import { useFlightDetailStore } from '@/stores/flightDetail'
import { useMapConfigStore } from '@/stores/mapConfig'
import { estimatedChartWidthPx } from '@/lib/sampleWindow'

declare module 'vue-router' {
  interface RouteMeta {
    /** Reachable without signing in. */
    public?: boolean
    /** Only for signed-out visitors (sign in, sign up): signed-in users go home. */
    guestOnly?: boolean
    /** Roles allowed; absent means any signed-in role. */
    roles?: Role[]
    /** Rendered without the signed-in frame (sign-in, invite and password pages). */
    bare?: boolean
    /** Page title shown in the browser tab. */
    title?: string
  }
}

export const router = createRouter({
  history: createWebHistory(),
  routes: [
    { path: '/', name: 'home', component: HomeView, meta: { title: 'Overview' } },
    {
      path: '/sign-in',
      name: 'sign-in',
      component: () => import('@/views/SignInView.vue'),
      meta: { public: true, guestOnly: true, bare: true, title: 'Sign in' },
    },
    {
      path: '/sign-up',
      name: 'sign-up',
      component: () => import('@/views/SignUpView.vue'),
      meta: { public: true, guestOnly: true, bare: true, title: 'Create an account' },
    },
    {
      path: '/forgot-password',
      name: 'forgot-password',
      component: () => import('@/views/ForgotPasswordView.vue'),
      meta: { public: true, bare: true, title: 'Forgot password' },
    },
    {
      path: '/reset-password',
      name: 'reset-password',
      component: () => import('@/views/ResetPasswordView.vue'),
      props: (route) => ({ token: String(route.query.token ?? '') }),
      meta: { public: true, bare: true, title: 'Choose a new password' },
    },
    {
      path: '/accept-invite',
      name: 'accept-invite',
      alias: ['/invites/accept'],
      component: () => import('@/views/AcceptInviteView.vue'),
      props: (route) => ({ token: String(route.query.token ?? '') }),
      meta: { public: true, bare: true, title: 'Join a team' },
    },
    {
      path: '/courses',
      name: 'courses',
      component: () => import('@/views/CoursesView.vue'),
      props: true,
      meta: { title: 'Courses' },
    },
    {
      path: '/courses/:courseId',
      name: 'course-detail',
      component: () => import('@/views/CourseDetailView.vue'),
      props: true,
      meta: { title: 'Course' },
    },
    {
      path: '/setups',
      name: 'setups',
      component: () => import('@/views/SetupsView.vue'),
      props: true,
      meta: { title: 'Link setups' },
    },
    {
      path: '/setups/:setupId',
      name: 'setup-detail',
      component: () => import('@/views/SetupDetailView.vue'),
      props: true,
      meta: { title: 'Link setup' },
    },
    {
      path: '/flights',
      name: 'flights',
      component: () => import('@/views/FlightsView.vue'),
      props: true,
      meta: { title: 'Flights' },
    },
    {
      path: '/flights/new',
      name: 'flight-new',
      component: () => import('@/views/FlightUploadView.vue'),
      props: true,
      meta: { roles: ['admin', 'instructor', 'pilot'], title: 'New flight' },
    },
    {
      path: '/flights/:flightId',
      name: 'flight-detail',
      component: () => import('@/views/FlightDetailView.vue'),
      props: true,
      meta: { title: 'Flight' },
      // the flight and its overview load while the screen's code downloads
      beforeEnter: (to) => prefetchFlightScreen(to),
    },
    {
      path: '/compare',
      name: 'compare',
      component: () => import('@/views/CompareView.vue'),
      props: (route) => ({
        flightIds: typeof route.query.flightIds === 'string' ? route.query.flightIds : undefined,
        baselineId: typeof route.query.baselineId === 'string' ? route.query.baselineId : undefined,
      }),
      meta: { title: 'Compare flights' },
    },
    {
      path: '/comparisons',
      name: 'comparisons',
      component: () => import('@/views/ComparisonsView.vue'),
      props: true,
      meta: { title: 'Saved comparisons' },
    },
    {
      path: '/comparisons/:comparisonId',
      name: 'comparison-detail',
      component: () => import('@/views/CompareView.vue'),
      props: true,
      meta: { title: 'Comparison' },
    },
    {
      path: '/plan',
      name: 'planner',
      component: () => import('@/views/PlannerView.vue'),
      props: (route) => ({
        flightId: typeof route.query.flightId === 'string' ? route.query.flightId : undefined,
        setupId: typeof route.query.setupId === 'string' ? route.query.setupId : undefined,
        courseId: typeof route.query.courseId === 'string' ? route.query.courseId : undefined,
      }),
      meta: { title: 'Plan a link' },
    },
    {
      path: '/account',
      name: 'account',
      component: () => import('@/views/AccountView.vue'),
      meta: { title: 'My account' },
    },
    {
      path: '/team/members',
      name: 'team-members',
      component: () => import('@/views/TeamMembersView.vue'),
      meta: { title: 'Team members' },
    },
    {
      path: '/dev/outbox',
      name: 'dev-outbox',
      component: () => import('@/views/DevOutboxView.vue'),
      meta: { roles: ['admin'], title: 'Sent e-mail (dev)' },
    },
    {
      path: '/:pathMatch(.*)*',
      name: 'not-found',
      component: () => import('@/views/NotFoundView.vue'),
      meta: { public: true, title: 'Page not found' },
    },
  ],
})

/** Where a navigation must go instead, or true to let it through. */
export async function authGuard(to: RouteLocationNormalized) {
  const auth = useAuthStore()
  try {
    await auth.ensureLoaded()
  } catch {
    // server unreachable: public pages still open, the rest goes to sign-in which shows the error
  }
  if (to.meta.public) {
    return to.meta.guestOnly && auth.isSignedIn ? safeRedirect(to.query.redirect) : true
  }
  if (!auth.isSignedIn) return { name: 'sign-in', query: { redirect: to.fullPath } }
  if (to.meta.roles && (auth.role === null || !to.meta.roles.includes(auth.role))) {
    return { name: 'home' }
  }
  return true
}

/** Starts the flight screen's requests for a signed-in visitor; never blocks the navigation. */
function prefetchFlightScreen(to: RouteLocationNormalized): true {
  const id = Number(to.params.flightId)
  if (useAuthStore().isSignedIn && Number.isInteger(id) && id > 0) {
    useFlightDetailStore().prefetch(id, estimatedChartWidthPx(window.innerWidth))
    void useMapConfigStore().ensureLoaded()
  }
  return true
}

/** Only same-app paths: `?redirect=https://elsewhere` must not send a user away. */
export function safeRedirect(raw: unknown): string {
  return typeof raw === 'string' && raw.startsWith('/') && !raw.startsWith('//') ? raw : '/'
}

router.beforeEach(authGuard)
router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Ellipsoid` : 'Ellipsoid'
})

export default router
