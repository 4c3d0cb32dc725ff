import { createApp } from 'vue'
import { createPinia } from 'pinia'
import '@fontsource/inter/400.css'
import '@fontsource/inter/500.css'
import '@fontsource/inter/600.css'
import '@fontsource/inter/700.css'
import './styles/base.css'
import App from './App.vue'
import { setUnauthenticatedHandler } from './api/http'
import { ROUTE, router } from './router'
import { useAuthStore } from './stores/auth'

const app = createApp(App).use(createPinia()).use(router)

// A session that ended on the server (expired, account disabled) sends the user back to sign in.
setUnauthenticatedHandler(() => {
  useAuthStore().clear()
  const current = router.currentRoute.value
  if (!current.meta.public) void router.push({ name: ROUTE.signIn, query: { redirect: current.fullPath } })
})

// After a new version is deployed, an open tab may ask for page chunks that are gone. Load the
// page afresh once (common practice for code-split apps); a second failure in a row is not retried.
const RELOADED_FOR = 'tauline.reloadedForChunk'
router.onError((error: unknown, to) => {
  const message = error instanceof Error ? error.message : String(error)
  if (!/dynamically imported module|Importing a module script failed/i.test(message)) return
  if (sessionStorage.getItem(RELOADED_FOR) === to.fullPath) return
  sessionStorage.setItem(RELOADED_FOR, to.fullPath)
  window.location.assign(to.fullPath)
})
router.afterEach(() => sessionStorage.removeItem(RELOADED_FOR))

app.mount('#app')
