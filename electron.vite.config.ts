import { resolve } from 'node:path';
import { defineConfig } from 'electron-vite';
import { svelte } from '@sveltejs/vite-plugin-svelte';

export default defineConfig({
  main: {
    build: { rollupOptions: { input: { index: resolve('src/main/index.ts') } } },
  },
  preload: {
    // A sandboxed preload cannot load ESM: build it as CommonJS (out/preload/index.cjs).
    build: { rollupOptions: { input: { index: resolve('src/preload/index.ts') }, output: { format: 'cjs' } } },
  },
  renderer: {
    root: resolve('src/renderer'),
    build: { rollupOptions: { input: { index: resolve('src/renderer/index.html') } } },
    plugins: [svelte({ configFile: resolve('svelte.config.js') })],
    worker: { format: 'es' },
  },
});
