import type { RouteRecordRaw, RouteRecordSingleView } from 'vue-router'
import {
  admins,
  auditReaders,
  everyone,
  fieldWorkers,
  only,
  planners,
  runFollowers,
  stockUsers,
  type Role,
} from '../../shared/roles'

declare module 'vue-router' {
  interface RouteMeta {
    /** Who may open the route. Absent only on public routes (`public: true`). */
    roles?: readonly Role[]
    /** Reachable without an account (sign-in, invitations, public fault reports). */
    public?: boolean
    /** Shown only when the server runs in demo mode with its mail fake. */
    demoOnly?: boolean
    /** Page title in the header and the browser tab. */
    title?: string
  }
}

// Each page is loaded on first visit so a crew phone on weak signal downloads only its own screens.
const privateRoutes: RouteRecordRaw[] = [
  // The guard sends `/` to the signed-in user's own home before anything renders.
  { path: '', name: 'home', component: { render: () => null }, meta: { roles: everyone } },

  // crew
  route('/run', 'run', "Tonight's run", only.crew, () => import('../pages/run/RunPage.vue')),
  route('/map', 'map', 'Map', runFollowers, () => import('../pages/map/MapPage.vue')),
  route('/outbox', 'outbox', 'Outbox', fieldWorkers, () => import('../pages/outbox/OutboxPage.vue')),
  route(
    '/calculator',
    'calculator',
    'Calculator',
    everyone,
    () => import('../pages/calculator/CalculatorPage.vue'),
  ),

  // strings, visits and labels
  route('/strings/:id', 'string', 'String', everyone, () => import('../pages/string/StringPage.vue')),
  route(
    '/strings/:id/visit',
    'log-visit',
    'Log a visit',
    fieldWorkers,
    () => import('../pages/visit/LogVisitPage.vue'),
  ),
  route(
    '/strings/:id/commission',
    'commission',
    'Commission',
    fieldWorkers,
    () => import('../pages/season/CommissioningPage.vue'),
  ),
  route(
    '/strings/:id/store-inspection',
    'store-inspection',
    'Inspect in store',
    fieldWorkers,
    () => import('../pages/season/CommissioningPage.vue'),
  ),
  route(
    '/strings/:id/take-down',
    'take-down',
    'Take down',
    fieldWorkers,
    () => import('../pages/season/TakeDownPage.vue'),
  ),
  route('/scan', 'scan', 'Scan a label', fieldWorkers, () => import('../pages/scan/ScanPage.vue')),
  route(
    '/runs/print',
    'run-sheet',
    'Run sheet',
    runFollowers,
    () => import('../pages/plan/RunSheetPage.vue'),
  ),

  // supervisor
  route('/queue', 'queue', 'Queue', only.supervisor, () => import('../pages/queue/QueuePage.vue')),
  route('/plan', 'plan', 'Plan runs', only.supervisor, () => import('../pages/plan/PlanPage.vue')),
  route(
    '/crews',
    'crews',
    'Crews & platforms',
    only.supervisor,
    () => import('../pages/crews/CrewsPage.vue'),
  ),

  // the estate: clients … platforms (supervisors see crews and platforms only; see components/estate/kinds.ts)
  route('/estate/:kind', 'estate', 'Estate', planners, () => import('../pages/estate/EstatePage.vue')),

  // lamp stock: crews their own van, planners every place
  route('/stock', 'stock', 'Stock', stockUsers, () => import('../pages/stock/StockPage.vue')),
  route(
    '/stock/load-out',
    'load-out',
    'Load-out sheet',
    stockUsers,
    () => import('../pages/stock/LoadOutPage.vue'),
  ),

  // manager
  route('/overdue', 'overdue', 'Overdue', only.manager, () => import('../pages/overdue/OverduePage.vue')),
  route(
    '/register',
    'register',
    'Register',
    only.manager,
    () => import('../pages/register/RegisterPage.vue'),
  ),
  route('/energy', 'energy', 'Energy', only.manager, () => import('../pages/energy/EnergyPage.vue')),
  route('/reports', 'reports', 'Reports', only.manager, () => import('../pages/reports/ReportsPage.vue')),

  // safety officer
  route(
    '/isolations',
    'isolations',
    'Isolations',
    only.safety,
    () => import('../pages/isolations/IsolationsPage.vue'),
  ),
  route(
    '/certificates',
    'certificates',
    'Certificates',
    only.safety,
    () => import('../pages/certificates/CertificatesPage.vue'),
  ),

  // managers, safety officers and admins
  route('/audit', 'audit', 'Audit log', auditReaders, () => import('../pages/audit/AuditPage.vue')),

  // admin
  route('/users', 'users', 'Users', only.admin, () => import('../pages/users/UsersPage.vue')),
  route('/settings', 'settings', 'Settings', only.admin, () => import('../pages/settings/SettingsPage.vue')),

  // demo mode: the local mail fake's catch, invitation links included, so for admins only
  {
    path: '/mail/:id?',
    name: 'mail',
    component: () => import('../pages/mail/MailPage.vue'),
    meta: { title: 'Mail outbox', roles: admins, demoOnly: true },
  },
]

const publicRoutes: RouteRecordRaw[] = [
  publicRoute('/sign-in', 'sign-in', 'Sign in', () => import('../pages/auth/SignInPage.vue')),
  publicRoute(
    '/accept-invite',
    'accept-invite',
    'Accept invitation',
    () => import('../pages/auth/AcceptInvitePage.vue'),
  ),
  publicRoute('/report', 'report', 'Report a fault', () => import('../pages/report/ReportFaultPage.vue')),
  publicRoute(
    '/forgot-password',
    'forgot-password',
    'Forgot password',
    () => import('../pages/auth/ForgotPasswordPage.vue'),
  ),
  publicRoute(
    '/reset-password',
    'reset-password',
    'Choose a new password',
    () => import('../pages/auth/ResetPasswordPage.vue'),
  ),
]

export const routes: RouteRecordRaw[] = [
  { path: '/', component: () => import('../layouts/MainLayout.vue'), children: privateRoutes },
  { path: '/', component: () => import('../layouts/PublicLayout.vue'), children: publicRoutes },
  {
    path: '/:pathMatch(.*)*',
    component: () => import('../layouts/PublicLayout.vue'),
    children: [{ path: '', name: 'not-found', component: () => import('../pages/NotFoundPage.vue') }],
    meta: { public: true, title: 'Not found' },
  },
]

type Loader = RouteRecordSingleView['component']

function route(
  path: string,
  name: string,
  title: string,
  roles: readonly Role[],
  component: Loader,
): RouteRecordRaw {
  return { path, name, component, meta: { title, roles } }
}

function publicRoute(path: string, name: string, title: string, component: Loader): RouteRecordRaw {
  return { path, name, component, meta: { title, public: true } }
}
