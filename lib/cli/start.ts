import { ensureBuild, prepareDatabase, spawnNext } from "./app-server";
import { startLocalPayments } from "./payment-fake";
import { prepareRuntimeEnv } from "./runtime-env";

// `npm start`: everything on one machine with no configuration — database migrated and seeded,
// a production build made when missing or stale, the local fake payment API, then the server on
// PORT. `--dev` runs next dev.
const dev = process.argv.includes("--dev");
const env = prepareRuntimeEnv();

async function main() {
  if (prepareDatabase(env.DATABASE_PATH!))
    console.log("Seeded the demo data into an empty database.");
  if (!dev) ensureBuild(env);

  const payments = await startLocalPayments(env);
  if (payments) console.log(`Test payment service (local fake) on ${payments.url}`);

  const server = spawnNext(env, dev ? "dev" : "start");
  console.log(`Loopshift on ${env.NEXTAUTH_URL} (database ${env.DATABASE_PATH})`);
  for (const signal of ["SIGINT", "SIGTERM"] as const)
    process.on(signal, () => server.kill(signal));
  server.on("exit", async (code) => {
    await payments?.close();
    process.exit(code ?? 0);
  });
}

void main();
