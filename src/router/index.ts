import { createRouter, createWebHistory, type RouteRecordRaw } from 'vue-router'
import type { Role } from '../../shared/schemas/auth'
import { useSessionStore } from '../stores/session'
import HomeView from '../views/HomeView.vue'

export type { Role }

declare module 'vue-router' {
  interface RouteMeta {
    title?: string
    requiresAuth?: boolean
    roles?: Role[]
  }
}

const routes: RouteRecordRaw[] = [
  { path: '/', name: 'home', component: HomeView, meta: { title: 'Home' } },
  { path: '/sign-in', name: 'sign-in', component: () => import('../views/SignInView.vue'), meta: { title: 'Sign in' } },
  { path: '/sign-up', name: 'sign-up', component: () => import('../views/SignUpView.vue'), meta: { title: 'Create an account' } },
  { path: '/verify', name: 'verify', component: () => import('../views/VerifyView.vue'), meta: { title: 'Confirm your e-mail' } },
  { path: '/forgot-password', name: 'forgot-password', component: () => import('../views/ForgotPasswordView.vue'), meta: { title: 'Forgot password' } },
  { path: '/reset-password', name: 'reset-password', component: () => import('../views/ResetPasswordView.vue'), meta: { title: 'New password' } },
  { path: '/account', name: 'account', component: () => import('../views/AccountView.vue'), meta: { title: 'Account', requiresAuth: true } },
  { path: '/sharing', name: 'sharing', component: () => import('../views/SharingView.vue'), meta: { title: 'Sharing', requiresAuth: true } },
  { path: '/skaters', name: 'skaters', component: () => import('../views/SkatersView.vue'), meta: { title: 'Skaters', requiresAuth: true } },
  { path: '/roster', name: 'roster', component: () => import('../views/RosterView.vue'), meta: { title: 'Roster', requiresAuth: true, roles: ['coach'] } },
  { path: '/bench', name: 'bench', component: () => import('../views/BenchView.vue'), meta: { title: 'Bench', requiresAuth: true, roles: ['technician', 'shop_admin'] } },
  { path: '/shop', name: 'shop', component: () => import('../views/ShopView.vue'), meta: { title: 'Shop', requiresAuth: true } },
  { path: '/admin', name: 'admin', component: () => import('../views/AdminUsersView.vue'), meta: { title: 'Users', requiresAuth: true, roles: ['admin'] } },
  { path: '/blades', name: 'blades', component: () => import('../views/BladesView.vue'), meta: { title: 'Blades', requiresAuth: true } },
  { path: '/blades/:bladeId', name: 'blade', component: () => import('../views/BladeView.vue'), props: true, meta: { title: 'Blade', requiresAuth: true } },
  { path: '/blades/:bladeId/capture', name: 'capture', component: () => import('../views/CaptureView.vue'), props: true, meta: { title: 'Capture', requiresAuth: true } },
  { path: '/analyses/:id', name: 'analysis', component: () => import('../views/AnalysisView.vue'), props: true, meta: { title: 'Analysis', requiresAuth: true } },
  { path: '/compare', name: 'compare', component: () => import('../views/CompareView.vue'), meta: { title: 'Compare', requiresAuth: true } },
  { path: '/hollow', name: 'hollow', component: () => import('../views/HollowView.vue'), meta: { title: 'Hollow' } },
  { path: '/mailbox', name: 'mailbox', component: () => import('../views/MailboxView.vue'), meta: { title: 'Mailbox' } },
  { path: '/forbidden', name: 'forbidden', component: () => import('../views/ForbiddenView.vue'), meta: { title: 'No access' } },
  { path: '/:pathMatch(.*)*', name: 'not-found', component: () => import('../views/NotFoundView.vue'), meta: { title: 'Not found' } },
]

export const router = createRouter({ history: createWebHistory(), routes })

/** A courtesy only (the server enforces access): sign in first, with the way back; wrong role, the 403 page. */
router.beforeEach(async (to) => {
  const session = useSessionStore()
  await session.load()
  if (!to.meta.requiresAuth && !to.meta.roles) return true
  if (!session.isSignedIn) return { name: 'sign-in', query: { redirect: to.fullPath } }
  if (to.meta.roles && !session.hasRole(...to.meta.roles)) return { name: 'forbidden' }
  return true
})

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Rockerbook` : 'Rockerbook'
})
