import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

// End-to-end: one production server of the built app on a fresh database, real HTTP through the
// route handlers, and Debian's Chromium driven by playwright-core. Files run one after another
// because they share the server (and its sign-in throttle).
export default defineConfig({
  resolve: { alias: { "@": fileURLToPath(new URL(".", import.meta.url)) } },
  test: {
    include: ["tests/e2e/**/*.test.ts"],
    environment: "node",
    globalSetup: ["tests/e2e/global-setup.ts"],
    fileParallelism: false,
    testTimeout: 60000,
    hookTimeout: 120000,
  },
});
