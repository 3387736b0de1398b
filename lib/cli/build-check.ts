import fs from "node:fs";
import path from "node:path";

const SOURCES = [
  "app",
  "components",
  "lib",
  "db",
  "public",
  "proxy.ts",
  "next.config.mjs",
  "tailwind.config.ts",
  "postcss.config.mjs",
  "package-lock.json",
];

function newestMtime(entry: string): number {
  if (!fs.existsSync(entry)) return 0;
  const stat = fs.statSync(entry);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = 0;
  for (const child of fs.readdirSync(entry))
    newest = Math.max(newest, newestMtime(path.join(entry, child)));
  return newest;
}

// A production build is needed when there is none, or when any source is newer than it.
export function needsBuild(root: string): boolean {
  const stamp = path.join(root, ".next", "BUILD_ID");
  if (!fs.existsSync(stamp)) return true;
  const built = fs.statSync(stamp).mtimeMs;
  return SOURCES.some((s) => newestMtime(path.join(root, s)) > built);
}
