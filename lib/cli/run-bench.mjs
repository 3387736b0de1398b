// `npm run bench`: bundles lib/cli/bench.ts with esbuild, as the production build bundles the
// engine, and runs it with plain Node. Timing through tsx instead would measure its per-module
// CommonJS wrappers on every call between engine modules, which the shipped app does not pay.
import { build } from "esbuild";
import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import path from "node:path";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
const outfile = path.join(root, "node_modules", ".cache", "loopshift", "bench.mjs");
await build({
  entryPoints: [path.join(root, "lib/cli/bench.ts")],
  bundle: true,
  platform: "node",
  format: "esm",
  outfile,
  alias: { "@": root },
  logLevel: "warning",
});
const run = spawnSync(process.execPath, ["--expose-gc", outfile, ...process.argv.slice(2)], {
  stdio: "inherit",
});
process.exit(run.status ?? 1);
