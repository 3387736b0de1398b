import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

const config = [
  ...nextVitals,
  ...nextTs,
  {
    rules: {
      // Leaving fields out by destructuring (`const { id: _id, ...rest } = row`) is intended.
      "@typescript-eslint/no-unused-vars": [
        "warn",
        { argsIgnorePattern: "^_", varsIgnorePattern: "^_", ignoreRestSiblings: true },
      ],
    },
  },
  // Floors: each folder imports only from the floors below it (DEVELOPERS.md, "Which folder may
  // import which"): app/ -> server/ -> db/ -> lib/, and components/ beside app/. An import running
  // up a floor fails the lint, and `tests/run-all.sh` runs the lint before the tests.
  {
    files: ["lib/**/*.{ts,tsx,mts,mjs}"],
    // lib/cli holds the command-line entry points (start, seed, bench): they open the database and
    // start the mail and payment fakes, so they sit above every floor and are exempt.
    ignores: ["lib/cli/**"],
    rules: {
      "@typescript-eslint/no-restricted-imports": [
        "error",
        {
          patterns: [
            {
              group: [
                "@/db",
                "@/db/*",
                "**/db",
                "**/db/*",
                "@/server",
                "@/server/*",
                "**/server/*",
              ],
              message:
                "lib/ is pure: no database and no server code. Pass the data in, or move the code to server/.",
            },
            {
              group: ["server-only"],
              message: "lib/ is pure and runs anywhere; server-only belongs in server/.",
            },
          ],
        },
      ],
    },
  },
  {
    files: ["db/**/*.ts"],
    rules: {
      "@typescript-eslint/no-restricted-imports": [
        "error",
        {
          patterns: [
            {
              group: ["@/server", "@/server/*", "**/server/*"],
              message:
                "db/ holds schema and scoped queries; services that use them live in server/.",
            },
            {
              group: ["@/lib/mail/*", "**/lib/mail/*"],
              message: "db/ sends no mail: compose and queue it in server/ (server/mail).",
            },
          ],
        },
      ],
    },
  },
  {
    files: ["components/**/*.{ts,tsx}"],
    rules: {
      "@typescript-eslint/no-restricted-imports": [
        "error",
        {
          patterns: [
            {
              group: ["@/app", "@/app/*", "**/app/*"],
              message: "components/ serve the routes in app/, never the other way round.",
            },
            {
              // A row type is erased at build and names what a screen shows; the database itself
              // is reached only through server actions and route handlers.
              group: ["@/db", "@/db/*", "**/db", "**/db/*"],
              allowTypeImports: true,
              message:
                "components/ reach data through server/ (actions) or app/ (routes), not db/.",
            },
          ],
        },
      ],
    },
  },
  {
    ignores: [
      ".next/**",
      "node_modules/**",
      "data/**",
      "drizzle/**",
      "test-results/**",
      "next-env.d.ts",
    ],
  },
];

export default config;
