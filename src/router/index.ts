import { createRouter, createWebHistory, type RouteRecordRaw } from 'vue-router'
import type { Area } from '@shared/schemas/auth'
import { useAuthStore } from '@/stores/auth'
import SignInView from '@/views/SignInView.vue'

declare module 'vue-router' {
  interface RouteMeta {
    /** Reachable without signing in. */
    public?: boolean
    /** The navigation area this page belongs to; the role check uses it. */
    area?: Area
  }
}

export const ROUTE = {
  signIn: 'sign-in',
  dashboard: 'dashboard',
  area: 'area',
  admin: 'admin',
  help: 'help',
  forbidden: 'forbidden',
  notFound: 'not-found',
} as const

const AreaView = () => import('@/views/AreaView.vue')

const workAreas: Area[] = ['observations']

export const routes: RouteRecordRaw[] = [
  { path: '/sign-in', name: ROUTE.signIn, component: SignInView, meta: { public: true } },
  {
    path: '/',
    component: () => import('@/layouts/TheAppLayout.vue'),
    children: [
      { path: '', name: ROUTE.dashboard, component: () => import('@/views/DashboardView.vue'), meta: { area: 'dashboard' } },
      { path: 'profiles', name: 'profiles', component: () => import('@/views/ProfilesView.vue'), meta: { area: 'profiles' } },
      { path: 'profiles/new', name: 'profile-new', component: () => import('@/views/ProfileEditorView.vue'), meta: { area: 'profiles' } },
      { path: 'profiles/upload', name: 'profile-upload', component: () => import('@/views/SoundingUploadView.vue'), meta: { area: 'profiles' } },
      { path: 'profiles/:id(\\d+)', name: 'profile', component: () => import('@/views/ProfileEditorView.vue'), meta: { area: 'profiles' } },
      ...workAreas.map((area) => ({
        path: area,
        name: area,
        component: AreaView,
        props: { area },
        meta: { area },
      })),
      { path: 'comparisons', name: 'comparisons', component: () => import('@/views/ComparisonsView.vue'), meta: { area: 'comparisons' } },
      { path: 'reviews', name: 'reviews', component: () => import('@/views/ReviewsView.vue'), meta: { area: 'reviews' } },
      { path: 'runs', name: 'runs', component: () => import('@/views/RunsView.vue'), meta: { area: 'runs' } },
      { path: 'runs/new', name: 'run-new', component: () => import('@/views/NewRunView.vue'), meta: { area: 'runs' } },
      { path: 'runs/:id(\\d+)', name: 'run', component: () => import('@/views/RunView.vue'), props: true, meta: { area: 'runs' } },
      { path: 'sweeps/:id(\\d+)', name: 'sweep', component: () => import('@/views/SweepView.vue'), props: true, meta: { area: 'runs' } },
      { path: 'mixtures', name: 'mixtures', component: () => import('@/views/MixturesView.vue'), meta: { area: 'mixtures' } },
      { path: 'catalogues', name: 'catalogues', component: () => import('@/views/CataloguesView.vue'), meta: { area: 'catalogues' } },
      { path: 'catalogues/:id(builtin|\\d+)', name: 'catalogue', component: () => import('@/views/CatalogueView.vue'), props: true, meta: { area: 'catalogues' } },
      { path: 'admin', name: ROUTE.admin, component: () => import('@/views/AdminView.vue'), meta: { area: 'admin' } },
      { path: 'help', name: ROUTE.help, component: () => import('@/views/HelpView.vue'), meta: { area: 'help' } },
      { path: 'forbidden', name: ROUTE.forbidden, component: () => import('@/views/ForbiddenView.vue') },
      { path: ':pathMatch(.*)*', name: ROUTE.notFound, component: () => import('@/views/NotFoundView.vue') },
    ],
  },
]

export const router = createRouter({ history: createWebHistory(), routes })

router.beforeEach(async (to) => {
  const auth = useAuthStore()
  await auth.load()
  if (to.meta.public) {
    return to.name === ROUTE.signIn && auth.isSignedIn ? { name: ROUTE.dashboard } : true
  }
  if (!auth.isSignedIn) {
    return { name: ROUTE.signIn, query: to.fullPath !== '/' ? { redirect: to.fullPath } : {} }
  }
  if (to.meta.area && !auth.can(to.meta.area)) {
    return { name: ROUTE.forbidden, query: { from: to.fullPath } }
  }
  return true
})
