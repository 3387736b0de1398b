import { ensureBuild, prepareDatabase, spawnNext, startLocalMail } from "./app-server";
import { PaymentConfigError } from "../../server/payments/config";
import { startLocalPayments } from "./payment-fake";
import { prepareRuntimeEnv } from "./runtime-env";

// `npm start`: everything on one machine with no configuration — database migrated and seeded,
// a production build made when missing or stale, a local fake SMTP server unless SMTP_URL names a
// real one, the local fake payment API unless a real provider's key is set, then the server on
// PORT. `--dev` runs next dev.
async function main() {
  const dev = process.argv.includes("--dev");
  const env = prepareRuntimeEnv();

  if (prepareDatabase(env.DATABASE_PATH!))
    console.log("Seeded the demo data into an empty database.");
  if (!dev) ensureBuild(env);

  const mail = await startLocalMail(env, { retry: true });
  console.log(
    mail.fake
      ? `Mail: local fake SMTP server on ${mail.fake.url}; messages land in /admin/outbox`
      : "Mail: sent through SMTP_URL",
  );
  const payments = await startLocalPayments(env);
  if (payments) console.log(`Test payment service (local fake) on ${payments.url}`);

  const server = spawnNext(env, dev ? "dev" : "start");
  console.log(`Loopshift on ${env.NEXTAUTH_URL} (database ${env.DATABASE_PATH})`);
  for (const signal of ["SIGINT", "SIGTERM"] as const)
    process.on(signal, () => server.kill(signal));
  server.on("exit", (code) => {
    void Promise.allSettled([payments?.close(), mail.close()]).finally(() =>
      process.exit(code ?? 0),
    );
  });
}

main().catch((error) => {
  // A configuration mistake gets its message alone, without a stack trace to read past.
  console.error(
    error instanceof PaymentConfigError ? `Loopshift cannot start: ${error.message}` : error,
  );
  process.exit(1);
});
