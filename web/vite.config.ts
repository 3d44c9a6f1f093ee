import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import { defaultClientConditions, defineConfig } from 'vite';

export default defineConfig({
  plugins: [react()],
  resolve: {
    alias: { '@': fileURLToPath(new URL('./src', import.meta.url)) },
    // Read @crumbproof/shared from its TypeScript source rather than a built copy.
    conditions: ['source', ...defaultClientConditions],
  },
  server: {
    proxy: {
      '/api': { target: 'http://127.0.0.1:3000', changeOrigin: false },
    },
  },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    rolldownOptions: {
      output: {
        // A page's own file is named after its feature and route (page-recipes-recipe-editor-…js),
        // so what a page downloads can be read from the file names.
        chunkFileNames: (chunk) => {
          const route = chunk.facadeModuleId?.match(/src\/features\/([^/]+)\/routes\/([^/.]+)\.tsx$/);
          return route ? `assets/page-${route[1]}-${route[2]}-[hash].js` : 'assets/[name]-[hash].js';
        },
        codeSplitting: {
          groups: [
            // The label renderer's libraries load with the Labels page's preview only (import()), never with the app.
            {
              name: 'label-renderer',
              test: /node_modules[\\/](pdfmake|bwip-js|fontkit|brotli|dfa|restructure|tiny-inflate|unicode-properties|unicode-trie)[\\/]/,
              priority: 2,
            },
            // What every page needs changes less often than the app: its own file caches longer.
            {
              name: 'framework',
              test: /node_modules[\\/](react|react-dom|scheduler|react-router|react-router-dom|@tanstack[\\/](query-core|react-query))[\\/]/,
              priority: 1,
            },
            // zod and the switch to its jitless mode, together: the mode must be set before any
            // chunk builds a schema, and the Content-Security-Policy allows no eval.
            { name: 'zod', test: /node_modules[\\/]zod[\\/]|src[\\/]lib[\\/]zod-jitless\.ts$/, priority: 1 },
            // Every other library goes with the pages that import it (the counter's motion, the tables' engine).
          ],
        },
      },
    },
  },
});
