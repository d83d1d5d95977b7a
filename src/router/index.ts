import { createRouter, createWebHistory, type RouteRecordRaw } from 'vue-router'
import HomeView from '../views/HomeView.vue'

export type Role = 'skater' | 'coach' | 'technician' | 'shop_admin' | 'admin'

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
  { path: '/hollow', name: 'hollow', component: () => import('../views/HollowView.vue'), meta: { title: 'Hollow' } },
  { path: '/mailbox', name: 'mailbox', component: () => import('../views/MailboxView.vue'), meta: { title: 'Mailbox' } },
  { path: '/forbidden', name: 'forbidden', component: () => import('../views/ForbiddenView.vue'), meta: { title: 'No access' } },
  { path: '/:pathMatch(.*)*', name: 'not-found', component: () => import('../views/NotFoundView.vue'), meta: { title: 'Not found' } },
]

export const router = createRouter({ history: createWebHistory(), routes })

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Rockerbook` : 'Rockerbook'
})
