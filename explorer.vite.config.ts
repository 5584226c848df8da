// Builds the explorer's browser script (src/explorer/browser/app.ts) into one file,
// dist/explorer/explorer.iife.js, which `tileflux explorer` inlines into its page (and which
// the page also starts as its Web Worker). Run by `npm run build` after tsc.
import { defineConfig } from 'vite';

export default defineConfig({
  logLevel: 'warn',
  build: {
    outDir: 'dist/explorer',
    emptyOutDir: false,
    copyPublicDir: false,
    target: 'es2022',
    minify: true,
    lib: {
      entry: 'src/explorer/browser/app.ts',
      name: 'tilefluxExplorer',
      formats: ['iife'],
      fileName: () => 'explorer.iife.js',
    },
  },
});
