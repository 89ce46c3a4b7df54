import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import { readFileSync } from 'node:fs';
import { defineConfig } from 'vite';

const version = (JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')) as { version: string }).version;

const rendererRoot = fileURLToPath(new URL('.', import.meta.url));
const outDir = fileURLToPath(new URL('../dist/renderer', import.meta.url));

/**
 * The renderer build: one static folder (dist/renderer) that Electron serves
 * from its app:// protocol and the preview server serves over loopback.
 * Relative asset paths so either origin works.
 */
export default defineConfig({
  root: rendererRoot,
  base: './',
  plugins: [react()],
  define: { __APP_VERSION__: JSON.stringify(version) },
  build: { outDir, emptyOutDir: true, sourcemap: false, chunkSizeWarningLimit: 1500 },
  logLevel: 'warn',
});
