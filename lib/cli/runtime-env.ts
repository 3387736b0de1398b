import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { DEFAULT_DATABASE_PATH } from "../../db/client";
import { assertPaymentEnv } from "../../server/payments/config";

// Fills in the environment the server needs when nothing is set: a port, the database file,
// the public URL and a session secret kept beside the database so sessions survive a restart.
// Refuses a real payment key without its webhook secret before anything else starts.
export function prepareRuntimeEnv(env: NodeJS.ProcessEnv = process.env) {
  assertPaymentEnv(env);
  env.PORT ||= "3000";
  env.DATABASE_PATH = path.resolve(env.DATABASE_PATH || DEFAULT_DATABASE_PATH);
  env.NEXTAUTH_URL ||= `http://localhost:${env.PORT}`;
  if (!env.NEXTAUTH_SECRET) {
    const secretFile = path.join(path.dirname(env.DATABASE_PATH), ".session-secret");
    fs.mkdirSync(path.dirname(secretFile), { recursive: true });
    if (!fs.existsSync(secretFile)) {
      fs.writeFileSync(secretFile, crypto.randomBytes(32).toString("base64url"), { mode: 0o600 });
    }
    env.NEXTAUTH_SECRET = fs.readFileSync(secretFile, "utf8").trim();
  }
  return env;
}
