// electron-vite builds the three parts of the desktop app: the main process and the preload from
// main/electron, and the renderer with the same settings as the browser build (renderer/vite.config.ts).
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'electron-vite';
import { rendererConfig } from './renderer/vite.config';

const here = (p: string) => fileURLToPath(new URL(p, import.meta.url));

export default defineConfig({
  main: {
    build: {
      outDir: here('out/main'),
      rollupOptions: { input: { index: here('main/electron/main.ts') } },
    },
  },
  preload: {
    // A sandboxed preload cannot load modules from disk: bundle zod and the contract into it, as CommonJS.
    build: {
      outDir: here('out/preload'),
      externalizeDeps: false,
      rollupOptions: { input: { index: here('main/electron/preload.ts') }, output: { format: 'cjs', entryFileNames: '[name].cjs' } },
    },
  },
  renderer: {
    ...rendererConfig,
    build: { ...rendererConfig.build, outDir: here('out/renderer'), rollupOptions: { input: here('renderer/index.html') } },
  },
});
