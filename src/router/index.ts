import {
  createRouter,
  createWebHistory,
  type RouteLocationNormalized,
  type RouteLocationRaw,
} from 'vue-router'
import { useAppConfigStore } from '../stores/app-config'
import { useAuthStore } from '../stores/auth'
import { homePath, safeNext } from './nav'
import { routes } from './routes'
import { preloadNamed, preloadViews } from './preload'

export const router = createRouter({
  history: createWebHistory(import.meta.env.BASE_URL),
  routes,
  scrollBehavior: (_to, _from, saved) => saved ?? { top: 0 },
})

/**
 * Decides where a navigation may go: unknown session → sign-in (remembering where it was going),
 * wrong role → the user's own home, signed-in user on the sign-in page → home.
 * Exported for tests; the server still checks every API call, this only keeps the UI honest.
 */
export async function guard(to: RouteLocationNormalized): Promise<true | RouteLocationRaw> {
  const auth = useAuthStore()
  const appConfig = useAppConfigStore()
  // The page's code downloads beside the session and config answers, not after them (issue 14). At `/`
  // before the first answer, the likeliest next screen is the sign-in page.
  if (to.meta.public) preloadViews(to)
  else if (to.name === 'home' && !auth.loaded) preloadNamed(routes, 'sign-in')
  else void auth.ensureLoaded().then(() => auth.user && preloadViews(to))
  await Promise.all([auth.ensureLoaded(), appConfig.ensureLoaded()])
  const user = auth.user

  if (to.meta.public) {
    if (to.name === 'sign-in' && user) return safeNext(to.query.next) ?? homePath(user.role)
    return true
  }
  if (!user) {
    return to.name === 'home' ? { name: 'sign-in' } : { name: 'sign-in', query: { next: to.fullPath } }
  }
  if (to.name === 'home') return homePath(user.role)
  const roles = to.meta.roles
  if (!roles || !roles.includes(user.role)) return homePath(user.role)
  if (to.meta.demoOnly && !appConfig.showMail) return homePath(user.role)
  return true
}

router.beforeEach(guard)

router.afterEach((to) => {
  const appName = useAppConfigStore().appName
  document.title = to.meta.title ? `${to.meta.title} · ${appName}` : appName
})
