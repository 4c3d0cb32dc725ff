/* eslint-disable vue/one-component-per-file -- two tiny render-function shells for mounting */
import { defineComponent, h } from 'vue'
import { mount, flushPromises } from '@vue/test-utils'
import { createPinia, setActivePinia } from 'pinia'
import { createMemoryHistory, createRouter, RouterView } from 'vue-router'
import { NDialogProvider, NMessageProvider } from 'naive-ui'
import type { Role } from '@shared/schemas/auth'
import { useAuthStore } from '@/stores/auth'

/** Signs a user of `role` in (no request) in a fresh Pinia. */
export function signedIn(role: Role, id = 7) {
  const pinia = createPinia()
  setActivePinia(pinia)
  const auth = useAuthStore()
  auth.user = {
    id,
    email: 'someone@example.org',
    displayName: 'Some One',
    role,
    active: true,
    lastSignInAt: null,
    createdAt: '2026-01-01T00:00:00Z',
  }
  auth.loaded = true
  return pinia
}

const Empty = defineComponent({ render: () => h('div', { 'data-test': 'elsewhere' }) })

/** Mounts the app's profile routes at `path`, inside the naive-ui providers, with charts stubbed. */
export async function mountAt(path: string, role: Role = 'analyst', userId = 7) {
  const pinia = signedIn(role, userId)
  const router = createRouter({
    history: createMemoryHistory(),
    routes: [
      { path: '/profiles', name: 'profiles', component: Empty },
      {
        path: '/profiles/new',
        name: 'profile-new',
        component: () => import('@/views/ProfileEditorView.vue'),
      },
      {
        path: '/profiles/upload',
        name: 'profile-upload',
        component: () => import('@/views/SoundingUploadView.vue'),
      },
      {
        path: '/profiles/:id(\\d+)',
        name: 'profile',
        component: () => import('@/views/ProfileEditorView.vue'),
      },
    ],
  })
  await router.push(path)
  await router.isReady()
  const Root = defineComponent({
    render: () => h(NMessageProvider, () => h(NDialogProvider, () => h(RouterView))),
  })
  const wrapper = mount(Root, {
    attachTo: document.body,
    global: { plugins: [pinia, router], stubs: { VChart: true } },
  })
  await flushPromises()
  await flushPromises()
  return { wrapper, router }
}
