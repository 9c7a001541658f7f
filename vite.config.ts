/// <reference types="vitest/config" />
import { fileURLToPath } from "node:url";
import { defineConfig } from "vite";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";

const here = (path: string) => fileURLToPath(new URL(path, import.meta.url));

export default defineConfig({
  plugins: [react(), tailwindcss()],
  resolve: {
    alias: {
      "@/": here("./src/"),
      "@shared/": here("./shared/"),
      "@server/": here("./server/"),
    },
  },
  server: {
    // In development the API runs on its own port; Vite forwards /api to it.
    proxy: { "/api": `http://127.0.0.1:${process.env.PORT ?? "3000"}` },
  },
  build: { outDir: "dist", sourcemap: false },
  test: {
    include: ["tests/**/*.test.ts"],
    globalSetup: ["tests/support/global-setup.ts"],
    // API, job and browser tests share one database cluster.
    fileParallelism: false,
    pool: "forks",
    testTimeout: 30_000,
    hookTimeout: 120_000,
  },
});
