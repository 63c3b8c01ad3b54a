import { defineConfig } from "vite";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";

/** API server the dev server forwards /api to (the Express process of packages/server). */
const API_TARGET = process.env.LOOPYARD_API_URL ?? "http://127.0.0.1:4470";

export default defineConfig({
  plugins: [react(), tailwindcss()],
  server: {
    host: "127.0.0.1",
    proxy: {
      "/api": { target: API_TARGET, changeOrigin: false },
    },
  },
  preview: {
    host: "127.0.0.1",
    proxy: {
      "/api": { target: API_TARGET, changeOrigin: false },
    },
  },
  build: {
    outDir: "dist",
    emptyOutDir: true,
    chunkSizeWarningLimit: 5000,
    // dist/.vite/manifest.json: the server reads the plotting bundle's file name from it (http/web-app.ts).
    manifest: true,
  },
});
