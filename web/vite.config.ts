import { defineConfig } from 'vite';

export default defineConfig({
  build: {
    // elkjs (auto layout) is about 1.5 MB on its own.
    chunkSizeWarningLimit: 3000,
    rolldownOptions: {
      // The "use client" directive in @xyflow/react is harmless in a client-only bundle.
      onwarn(w, warn) {
        if (w.code !== 'MODULE_LEVEL_DIRECTIVE') warn(w);
      },
    },
  },
  worker: { format: 'es' },
  server: { host: '127.0.0.1', port: 4173, strictPort: true },
  preview: { host: '127.0.0.1', port: 4173, strictPort: true },
});
