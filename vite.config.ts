import path from "node:path";
import { fileURLToPath } from "node:url";
import { defineConfig, type Plugin } from "vitest/config";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";
import { VitePWA } from "vite-plugin-pwa";

const apiPort = process.env.PORT ?? "3000";
const e2e = process.env.E2E === "1";
const root = fileURLToPath(new URL(".", import.meta.url));

/**
 * Writes dist/.vite/chunk-modules.json: every emitted JS chunk with the source modules bundled into it. The
 * manifest names a source only for entry and route chunks; this also says what the shared chunks hold, so the
 * route-splitting browser test can tell whether the portal downloads any staff code (and the reverse).
 * Like the manifest it is not served: express.static ignores dot-folders.
 */
function chunkModules(): Plugin {
  return {
    name: "coatwright:chunk-modules",
    apply: "build",
    generateBundle(_options, bundle) {
      const map: Record<string, string[]> = {};
      for (const out of Object.values(bundle)) {
        if (out.type !== "chunk") continue;
        map[out.fileName] = out.moduleIds.map((id) => path.relative(root, id.replace(/\0/g, "")).split(path.sep).join("/"));
      }
      this.emitFile({ type: "asset", fileName: ".vite/chunk-modules.json", source: JSON.stringify(map, null, 1) });
    },
  };
}

/**
 * Installable on the booth tablet: the web app manifest, and a service worker (Workbox, generated at build) that
 * precaches the app shell (index.html, the built JS and CSS, the Latin font file, the icons) so the booth card opens
 * with no network. API answers are never precached or cached by the worker: the painter's booth cards are kept by the
 * app itself (src/lib/offline), per user, and wiped at sign-out. The page registers the worker (src/lib/service-worker.ts).
 */
const pwa = VitePWA({
  injectRegister: null,
  registerType: "autoUpdate",
  includeAssets: ["favicon.svg", "apple-touch-icon.png"],
  manifest: {
    name: "Coatwright",
    short_name: "Coatwright",
    description: "Jobs, finishes and mixes for custom paint shops; the booth card works without Wi-Fi.",
    start_url: "/booth",
    scope: "/",
    display: "standalone",
    orientation: "any",
    background_color: "#0b1020",
    theme_color: "#0b1020",
    icons: [
      { src: "/icon-192.png", sizes: "192x192", type: "image/png" },
      { src: "/icon-512.png", sizes: "512x512", type: "image/png" },
      { src: "/icon-maskable-512.png", sizes: "512x512", type: "image/png", purpose: "maskable" },
    ],
  },
  workbox: {
    globPatterns: ["**/*.{js,css,html,woff2,svg,png,webmanifest}"],
    // Only the Latin font file: the screens' text is Latin, and the other scripts' files are fetched only if needed.
    globIgnores: ["**/node_modules/**", "**/.vite/**", "**/inter-{cyrillic,cyrillic-ext,greek,greek-ext,vietnamese,latin-ext}-*"],
    navigateFallback: "/index.html",
    navigateFallbackDenylist: [/^\/api\//],
    cleanupOutdatedCaches: true,
    clientsClaim: true,
    skipWaiting: true,
    runtimeCaching: [],
  },
});

export default defineConfig({
  plugins: [react(), tailwindcss(), chunkModules(), pwa],
  resolve: {
    alias: [
      { find: "@", replacement: fileURLToPath(new URL("./src", import.meta.url)) },
      { find: "@shared", replacement: fileURLToPath(new URL("./shared", import.meta.url)) },
      // In the browser, zod runs jitless so it never tries `new Function` under the CSP (see src/lib/zod-jitless.ts).
      // Tests (VITEST) import the real zod, as the server does.
      ...(process.env.VITEST ? [] : [{ find: /^zod$/, replacement: fileURLToPath(new URL("./src/lib/zod-jitless.ts", import.meta.url)) }]),
    ],
  },
  // changeOrigin stays off so the API sees the page's own Host and its same-origin check lets the dev UI's writes through.
  server: { proxy: { "/api": { target: `http://localhost:${apiPort}`, changeOrigin: false } } },
  // The manifest (dist/.vite/manifest.json) maps the entry and route chunks to their source modules; the
  // route-splitting browser test reads it. It is not served (express.static ignores dot-folders, and a test checks
  // that), and would give away only the chunk map of the public JS anyway.
  build: {
    outDir: "dist",
    sourcemap: false,
    manifest: true,
    rolldownOptions: {
      // Small shared pieces (an icon, a formatter) are copied into the chunks that use them instead of each being a
      // file of its own: a screen loads about a dozen files instead of fifty, which matters on a phone's round
      // trips. The bundler keeps one copy of each module's state at run time. Style modules stay files.
      preserveEntrySignatures: false,
      output: { codeSplitting: { experimentalInlineCommonChunks: { maxSize: 8192, exclude: /\.css(\?|$)/ } } },
    },
  },
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
