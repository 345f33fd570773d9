import { fileURLToPath, URL } from 'node:url'
import { defineConfig } from 'vitest/config'
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
    proxy: { '/api': `http://127.0.0.1:${apiPort}`, '/tiles': `http://127.0.0.1:${apiPort}` },
  },
  build: { chunkSizeWarningLimit: 4000 },
  test: {
    include: ['tests/unit/**/*.test.ts', 'tests/reference/**/*.test.ts', 'tests/api/**/*.test.ts'],
    environment: 'node',
    globalSetup: ['tests/api/globalSetup.ts'],
    fileParallelism: false,
    testTimeout: 30000,
    hookTimeout: 60000,
    server: { deps: { inline: ['@vue-leaflet/vue-leaflet', 'element-plus'] } },
  },
})
