import { defineStore } from 'pinia'
import { computed, ref, watch } from 'vue'

export type ThemeName = 'light' | 'dark'
const STORAGE_KEY = 'tauline.theme'

function initialTheme(): ThemeName {
  const saved = localStorage.getItem(STORAGE_KEY)
  if (saved === 'light' || saved === 'dark') return saved
  return window.matchMedia?.('(prefers-color-scheme: dark)').matches ? 'dark' : 'light'
}

/** Light or dark, remembered per browser, first guess from the system setting. */
export const useThemeStore = defineStore('theme', () => {
  const name = ref<ThemeName>(initialTheme())
  const isDark = computed(() => name.value === 'dark')
  watch(
    name,
    (value) => {
      localStorage.setItem(STORAGE_KEY, value)
      document.documentElement.dataset.theme = value
    },
    { immediate: true },
  )
  function toggle() {
    name.value = isDark.value ? 'light' : 'dark'
  }
  return { name, isDark, toggle }
})
