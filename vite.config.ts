import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";

const apiPort = process.env.PORT ?? "3000";
const e2e = process.env.E2E === "1";

export default defineConfig({
  plugins: [react(), tailwindcss()],
  resolve: {
    alias: {
      "@": fileURLToPath(new URL("./src", import.meta.url)),
      "@shared": fileURLToPath(new URL("./shared", import.meta.url)),
    },
  },
  server: { proxy: { "/api": `http://localhost:${apiPort}` } },
  build: { outDir: "dist", sourcemap: false },
  // `npm test` runs unit and API tests; `npm run test:e2e` (E2E=1) runs the browser specs against the built app.
  test: e2e
    ? {
        include: ["tests/e2e/**/*.spec.ts"],
        globalSetup: ["tests/e2e/global-setup.ts"],
        environment: "node",
        fileParallelism: false,
        testTimeout: 60_000,
        hookTimeout: 120_000,
      }
    : {
        include: ["tests/**/*.test.ts", "shared/**/*.test.ts"],
        exclude: ["tests/e2e/**", "node_modules/**"],
        environment: "node",
        testTimeout: 20_000,
        hookTimeout: 30_000,
      },
});
