// `npm run bench`: bundles lib/cli/bench.ts with esbuild, as the production build bundles the
// engine, and runs it with plain Node. Timing through tsx instead would measure its per-module
// CommonJS wrappers on every call between engine modules, which the shipped app does not pay.
import { build } from "esbuild";
import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import path from "node:path";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
const outDir = path.join(root, "node_modules", ".cache", "loopshift");
let failed = 0;
for (const [name, title] of [
  ["bench", "Engine"],
  ["bench-installed-base", "Installed base and import"],
  ["bench-cases", "Cases: workbook and result route"],
  ["bench-dossier", "Dossier: 500 axes, 1,000 draws, workbook"],
  ["bench-hostile-upload", "Hostile workbook uploads: time, server memory, other requests"],
  ["bench-pipeline", "Pipeline: 2,000 frozen quotes"],
]) {
  // `npm run bench -- bench-cases` runs one of them.
  if (process.argv[2] && process.argv[2] !== name) continue;
  const outfile = path.join(outDir, `${name}.cjs`);
  await build({
    entryPoints: [path.join(root, `lib/cli/${name}.ts`)],
    bundle: true,
    platform: "node",
    format: "cjs",
    outfile,
    // A native addon and a load generator with worker files: both stay require()s from node_modules.
    external: ["better-sqlite3", "autocannon"],
    alias: { "@": root, "server-only": path.join(root, "lib/cli/server-only-stub.ts") },
    logLevel: "warning",
  });
  console.log(`\n${title}`);
  const run = spawnSync(process.execPath, ["--expose-gc", outfile], {
    stdio: "inherit",
    cwd: root,
  });
  if (run.status !== 0) failed++;
}
process.exit(failed ? 1 : 0);
