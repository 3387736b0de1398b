import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import type { TestProject } from "vitest/node";
import { ensureBuild, prepareDatabase, spawnNext, startLocalMail } from "../../lib/cli/app-server";
import { startLocalPayments } from "../../lib/cli/payment-fake";
import { prepareRuntimeEnv } from "../../lib/cli/runtime-env";

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    /** The SQLite file the server uses, for checks of what a request changed. */
    databasePath: string;
    /** The local fake payment API and the keys the server was given for it. */
    payments: { host: string; port: number; secretKey: string; webhookSecret: string };
  }
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.listen(0, "127.0.0.1", () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
    srv.on("error", reject);
  });
}

async function waitForServer(url: string, timeoutMs: number) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      const res = await fetch(url, { redirect: "manual" });
      if (res.status < 500) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`the app did not answer at ${url} within ${timeoutMs} ms`);
}

// Builds the app when needed and serves it on a free port over a fresh, seeded database file,
// with the local fake SMTP server catching its mail into the outbox table and the local fake
// payment API taking its checkouts.
export default async function setup(project: TestProject) {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "loopshift-e2e-"));
  const port = await freePort();
  const env = prepareRuntimeEnv({
    ...process.env,
    PORT: String(port),
    DATABASE_PATH: path.join(dir, "e2e.db"),
    NEXTAUTH_URL: `http://localhost:${port}`,
    LOOPSHIFT_DEMO: "on",
    SMTP_URL: "",
    STRIPE_FAKE: "on",
  });
  ensureBuild(env);
  prepareDatabase(env.DATABASE_PATH!);
  const mail = await startLocalMail(env);
  const payments = (await startLocalPayments(env))!;
  const server = spawnNext(env, "start", "pipe");
  let log = "";
  server.stdout?.on("data", (d) => (log += d));
  server.stderr?.on("data", (d) => (log += d));
  try {
    await waitForServer(`${env.NEXTAUTH_URL}/sign-in`, 60_000);
  } catch (error) {
    server.kill();
    await payments.close();
    await mail.close();
    console.error(log);
    throw error;
  }
  project.provide("baseUrl", env.NEXTAUTH_URL!);
  project.provide("databasePath", env.DATABASE_PATH!);
  project.provide("payments", {
    host: payments.host,
    port: payments.port,
    secretKey: env.STRIPE_SECRET_KEY!,
    webhookSecret: env.STRIPE_WEBHOOK_SECRET!,
  });
  return async () => {
    server.kill();
    await payments.close();
    await mail.close();
    if (process.env.E2E_SERVER_LOG) fs.writeFileSync(process.env.E2E_SERVER_LOG, log);
  };
}
