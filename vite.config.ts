import { fileURLToPath, URL } from 'node:url'
import { defineConfig } from 'vite'
import vue from '@vitejs/plugin-vue'

const apiPort = process.env.PORT ?? '3000'

export default defineConfig({
  plugins: [vue()],
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('./src', import.meta.url)),
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
    },
  },
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: { '/api': { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false } },
  },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    chunkSizeWarningLimit: 1200,
    rolldownOptions: {
      output: {
        // Keep the big UI and chart libraries in their own cacheable chunks.
        codeSplitting: {
          groups: [
            { name: 'naive-ui', test: /node_modules[\\/](naive-ui|vueuc|vooks|css-render|@css-render|seemly|evtd|treemate|date-fns)/ },
            { name: 'echarts', test: /node_modules[\\/](echarts|zrender|vue-echarts)/ },
            { name: 'vue', test: /node_modules[\\/](@vue|vue|vue-router|pinia)[\\/]/ },
          ],
        },
      },
    },
  },
})
