import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import type { Area, PublicUser, SignInInput } from '@shared/schemas/auth'
import { canSeeArea } from '@shared/schemas/auth'
import * as authApi from '@/api/auth'

/** The signed-in user and what they may see. */
export const useAuthStore = defineStore('auth', () => {
  const user = ref<PublicUser | null>(null)
  const loaded = ref(false)

  const isSignedIn = computed(() => user.value !== null)

  async function load(force = false) {
    if (loaded.value && !force) return
    user.value = await authApi.fetchCurrentUser()
    loaded.value = true
  }

  async function signIn(input: SignInInput) {
    user.value = await authApi.signIn(input)
    loaded.value = true
  }

  async function signOut() {
    try {
      await authApi.signOut()
    } finally {
      user.value = null
    }
  }

  /** Forget the user locally (the server said the session is gone). */
  function clear() {
    user.value = null
  }

  function can(area: Area): boolean {
    return user.value !== null && canSeeArea(user.value.role, area)
  }

  return { user, loaded, isSignedIn, load, signIn, signOut, clear, can }
})
