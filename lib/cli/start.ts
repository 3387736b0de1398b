import { ensureBuild, prepareDatabase, spawnNext } from "./app-server";
import { prepareRuntimeEnv } from "./runtime-env";

// `npm start`: everything on one machine with no configuration — database migrated and seeded,
// a production build made when missing or stale, then the server on PORT. `--dev` runs next dev.
const dev = process.argv.includes("--dev");
const env = prepareRuntimeEnv();

if (prepareDatabase(env.DATABASE_PATH!))
  console.log("Seeded the demo data into an empty database.");
if (!dev) ensureBuild(env);

const server = spawnNext(env, dev ? "dev" : "start");
console.log(`Loopshift on ${env.NEXTAUTH_URL} (database ${env.DATABASE_PATH})`);
for (const signal of ["SIGINT", "SIGTERM"] as const) process.on(signal, () => server.kill(signal));
server.on("exit", (code) => process.exit(code ?? 0));
