import { spawn, spawnSync } from "node:child_process";
import path from "node:path";
import { openDatabase } from "../../db/client";
import { migrateDatabase } from "../../db/migrate";
import { seedDatabase } from "../../db/seed";
import { startRetryLoop } from "../../server/mail/delivery";
import { startFakeSmtpServer } from "../../server/mail/fake-smtp-server";
import { needsBuild } from "./build-check";

// Commands run from the project root (npm scripts, tests, the bundled benchmarks).
export const ROOT = process.cwd();
const NEXT_BIN = path.join(ROOT, "node_modules", "next", "dist", "bin", "next");
// Gives the server each request's peer address for the sign-in throttle (server/auth/client-address.ts).
const PEER_PRELOAD = path.join(ROOT, "lib", "cli", "peer-address.mjs");

// Applies the migrations and seeds the demo scenario into an empty database.
export function prepareDatabase(file: string): boolean {
  const db = openDatabase(file);
  try {
    migrateDatabase(db);
    return seedDatabase(db);
  } finally {
    db.$client.close();
  }
}

// Makes a production build when there is none or a source is newer than it.
export function ensureBuild(env: NodeJS.ProcessEnv) {
  if (!needsBuild(ROOT)) return;
  console.log("Building the app (first start or changed sources)…");
  const build = spawnSync(process.execPath, [NEXT_BIN, "build"], {
    cwd: ROOT,
    stdio: "inherit",
    env: { ...env, NODE_ENV: "production", NEXT_TELEMETRY_DISABLED: "1" },
  });
  if (build.status !== 0) throw new Error(`next build failed with exit code ${build.status}`);
}

export function spawnNext(
  env: NodeJS.ProcessEnv,
  mode: "start" | "dev",
  stdio: "inherit" | "pipe" = "inherit",
) {
  return spawn(process.execPath, [NEXT_BIN, mode, "-p", env.PORT!], {
    cwd: ROOT,
    stdio,
    env: {
      ...env,
      // NODE_OPTIONS rather than an argument: it reaches any worker process Next.js forks too.
      NODE_OPTIONS: [env.NODE_OPTIONS, `--import ${JSON.stringify(PEER_PRELOAD)}`]
        .filter(Boolean)
        .join(" "),
      NODE_ENV: mode === "dev" ? "development" : "production",
      NEXT_TELEMETRY_DISABLED: "1",
    },
  });
}

/**
 * Mail for a local run: unless SMTP_URL names a real server, a fake SMTP server on loopback
 * catches every message into the outbox table, and env.SMTP_URL points the app at it.
 * `retry` also keeps a loop here that retries queued messages every 30 s.
 */
export async function startLocalMail(env: NodeJS.ProcessEnv, { retry = false } = {}) {
  const db = openDatabase(env.DATABASE_PATH!);
  const fake = env.SMTP_URL
    ? null
    : await startFakeSmtpServer(db, { port: Number(env.FAKE_SMTP_PORT || 0) });
  if (fake) env.SMTP_URL = fake.url;
  const stopRetry = retry ? startRetryLoop(db) : () => {};
  return {
    fake,
    async close() {
      stopRetry();
      await fake?.close();
      db.$client.close();
    },
  };
}
