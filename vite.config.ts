/// <reference types="vitest/config" />
import { fileURLToPath, URL } from 'node:url';
import { defineConfig } from 'vite';
import vue from '@vitejs/plugin-vue';
import { quasar, transformAssetUrls } from '@quasar/vite-plugin';

const r = (p: string) => fileURLToPath(new URL(p, import.meta.url));

export default defineConfig({
  plugins: [vue({ template: { transformAssetUrls } }), quasar({ sassVariables: r('./src/css/quasar-variables.sass') })],
  resolve: {
    // vue-konva imports the whole of Konva for one global flag; the board registers the
    // shapes it draws itself (src/components/konvaNodes.ts), so Konva's core is enough.
    alias: [{ find: /^konva$/, replacement: 'konva/lib/Core' }],
  },
  build: { outDir: 'dist', chunkSizeWarningLimit: 900 },
  server: {
    proxy: { '/api': 'http://localhost:3000' },
  },
  test: {
    include: ['tests/unit/**/*.test.ts', 'tests/api/**/*.test.ts', 'tests/reference/**/*.test.ts'],
    environment: 'node',
    testTimeout: 20000,
    hookTimeout: 30000,
    pool: 'forks',
  },
});
