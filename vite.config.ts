import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

// The client is served by Vite in development and proxies /api to the Express app.
const webPort = Number(process.env.PULSEKEEPER_WEB_PORT ?? 5173);
const apiPort = Number(process.env.PULSEKEEPER_API_PORT ?? 4400);

export default defineConfig({
  plugins: [react(), tailwindcss()],
  // No inlined data: URLs (small fonts would be): the API's Content-Security-Policy allows only 'self'.
  // Plotly (~4.6 MB minified) is one lazily loaded chunk by design, so the size warning is raised past it.
  build: { outDir: 'dist', emptyOutDir: true, assetsInlineLimit: 0, chunkSizeWarningLimit: 5000 },
  server: {
    host: '127.0.0.1',
    port: webPort,
    strictPort: true,
    proxy: { '/api': { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false } },
  },
  preview: { host: '127.0.0.1' },
});
