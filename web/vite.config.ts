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
        // Libraries change less often than the app: separate files cache longer.
        codeSplitting: {
          groups: [
            { name: 'chakra', test: /node_modules[\\/](@chakra-ui|@ark-ui|@zag-js|@emotion|@pandacss)/ },
            // The label renderer's libraries load with the Labels page's preview only (import()), never with the app.
            {
              name: 'label-renderer',
              test: /node_modules[\\/](pdfmake|bwip-js|fontkit|brotli|dfa|restructure|tiny-inflate|unicode-properties|unicode-trie)[\\/]/,
              priority: 2,
            },
            { name: 'vendor', test: /node_modules/ },
          ],
        },
      },
    },
  },
});
