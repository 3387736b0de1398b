import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

const alias = {
  "@": fileURLToPath(new URL(".", import.meta.url)),
  // "server-only" throws outside a React Server Component bundle; tests import server modules directly.
  "server-only": fileURLToPath(new URL("./lib/cli/server-only-stub.ts", import.meta.url)),
};

// Unit tests (pure modules) and integration tests (queries on a fresh migrated SQLite file).
// End-to-end tests against the built app have their own config, vitest.e2e.config.mts.
export default defineConfig({
  resolve: { alias },
  test: {
    environment: "node",
    pool: "forks",
    testTimeout: 30000,
    projects: [
      { extends: true, test: { name: "unit", include: ["tests/unit/**/*.test.ts"] } },
      {
        extends: true,
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          setupFiles: ["tests/support/fresh-database.ts"],
        },
      },
    ],
  },
});
