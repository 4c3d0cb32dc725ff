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

app.mount('#app')
