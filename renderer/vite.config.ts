// Vite config for the renderer on its own: the browser build and the dev server the browser tests
// drive. electron.vite.config.ts reuses these settings for the Electron build.
import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import { defineConfig, type Plugin, type UserConfig } from 'vite';

export const RENDERER_ROOT = fileURLToPath(new URL('.', import.meta.url));
export const REPO_ROOT = fileURLToPath(new URL('..', import.meta.url));
/** Fixed so the browser tests and a bookmarked dev tab find the app; strictPort fails fast if taken. */
export const DEV_PORT = 5317;

// Built pages get a strict policy: only our own scripts, no network, images from blobs and data
// URLs (the preview and glyph thumbnails). The dev server injects inline scripts, so it goes without.
const CONTENT_SECURITY_POLICY = [
  "default-src 'self'",
  "script-src 'self'",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' blob: data:",
  "font-src 'self' data:",
  "worker-src 'self' blob:",
  "connect-src 'self' blob: data:",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'none'",
].join('; ');

function contentSecurityPolicy(): Plugin {
  return {
    name: 'tallyglyph-csp',
    apply: 'build',
    transformIndexHtml: () => [{ tag: 'meta', attrs: { 'http-equiv': 'Content-Security-Policy', content: CONTENT_SECURITY_POLICY }, injectTo: 'head-prepend' }],
  };
}

export const rendererConfig: UserConfig = {
  root: RENDERER_ROOT,
  base: './',
  plugins: [react(), contentSecurityPolicy()],
  worker: { format: 'es' },
  server: { host: '127.0.0.1', port: DEV_PORT, strictPort: true, fs: { allow: [REPO_ROOT] } },
  preview: { host: '127.0.0.1', port: DEV_PORT, strictPort: true },
  build: { outDir: fileURLToPath(new URL('../out/web', import.meta.url)), emptyOutDir: true, target: 'es2022', chunkSizeWarningLimit: 2048 },
  clearScreen: false,
};

export default defineConfig(rendererConfig);
