import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import { ensureBuild, prepareDatabase, spawnNext } from "./app-server";
import { hostileWorkbook } from "./hostile-workbook";
import { prepareRuntimeEnv } from "./runtime-env";

// Issue 13, finding 4, measured against the production server over real HTTP: the time and the
// server's peak memory for one hostile upload (8.9 MB unpacking to 195 MB, lib/cli/hostile-
// workbook.ts) and for three at once, and how long another signed-in request waits meanwhile.
// Before the fix one took 8 s and 750 MB, three 2.4 GB, and other requests waited 7 s.
const TARGETS = { oneMs: 5_000, threeMs: 15_000, peakMb: 500, otherMedianMs: 250, otherMs: 2_000 };

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "loopshift-bench-upload-"));

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

/** The process and its descendants, from /proc (Linux). */
function processTree(root: number): number[] {
  const children = new Map<number, number[]>();
  for (const name of fs.readdirSync("/proc")) {
    if (!/^\d+$/.test(name)) continue;
    try {
      const stat = fs.readFileSync(`/proc/${name}/stat`, "utf8");
      const ppid = Number(stat.slice(stat.lastIndexOf(")") + 2).split(" ")[1]);
      children.set(ppid, [...(children.get(ppid) ?? []), Number(name)]);
    } catch {
      // gone meanwhile
    }
  }
  const all: number[] = [];
  const visit = (pid: number) => {
    all.push(pid);
    for (const child of children.get(pid) ?? []) visit(child);
  };
  visit(root);
  return all;
}

/** Resident memory of the given processes (worker threads count with their process). */
function rssBytes(pids: readonly number[]): number {
  let total = 0;
  for (const pid of pids) {
    try {
      const status = fs.readFileSync(`/proc/${pid}/status`, "utf8");
      total += Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0) * 1024;
    } catch {
      // gone meanwhile
    }
  }
  return total;
}

const percentile = (values: number[], p: number) => {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor((sorted.length * p) / 100))]!;
};

class Jar {
  private cookies = new Map<string, string>();
  store(res: Response) {
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const i = pair.indexOf("=");
      this.cookies.set(pair.slice(0, i), pair.slice(i + 1));
    }
  }
  header = () => [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
}

async function main() {
  // Made before any connection is open: the 9 s it blocks this thread would outlast the
  // server's keep-alive, and a request on a socket the server has closed fails.
  const bytes = new Uint8Array(hostileWorkbook());
  const port = await freePort();
  const env = prepareRuntimeEnv({
    ...process.env,
    PORT: String(port),
    DATABASE_PATH: path.join(dir, "bench.db"),
    NEXTAUTH_URL: `http://localhost:${port}`,
    SMTP_URL: "smtp://127.0.0.1:9",
    STRIPE_FAKE: "off",
  });
  prepareDatabase(env.DATABASE_PATH!);
  ensureBuild(env);
  const server = spawnNext(env, "start", "pipe");
  let log = "";
  server.stdout?.on("data", (d) => (log += d));
  server.stderr?.on("data", (d) => (log += d));
  const base = env.NEXTAUTH_URL!;
  try {
    for (let until = Date.now() + 60_000; ;) {
      try {
        if ((await fetch(`${base}/sign-in`, { redirect: "manual" })).status < 500) break;
      } catch {
        // not listening yet
      }
      if (Date.now() > until) throw new Error(`the app did not answer at ${base}`);
      await new Promise((r) => setTimeout(r, 200));
    }
    const send = async (jar: Jar, route: string, init: RequestInit = {}) => {
      const headers = new Headers(init.headers);
      headers.set("cookie", jar.header());
      if (init.method === "POST") headers.set("origin", base);
      const res = await fetch(`${base}${route}`, { ...init, headers, redirect: "manual" });
      jar.store(res);
      return res;
    };
    const signIn = async (email: string) => {
      const jar = new Jar();
      const { csrfToken } = (await (await send(jar, "/api/auth/csrf")).json()) as {
        csrfToken: string;
      };
      await send(jar, "/api/auth/callback/credentials", {
        method: "POST",
        headers: { "content-type": "application/x-www-form-urlencoded" },
        body: new URLSearchParams({ csrfToken, email, password: "loopshift-demo", json: "true" }),
      });
      return jar;
    };
    const manager = await signIn("manager@example.com");
    const engineer = await signIn("engineer@example.com");
    const { sites } = (await (await send(manager, "/api/v1/sites")).json()) as {
      sites: { id: number }[];
    };
    const uploadOnce = async (n: number) => {
      const form = new FormData();
      form.set("file", new File([bytes], `hostile-${n}.xlsx`));
      const res = await send(manager, `/api/v1/sites/${sites[0]!.id}/imports`, {
        method: "POST",
        body: form,
      });
      return res.status;
    };
    const otherRequest = async () => {
      const start = performance.now();
      const res = await send(engineer, "/api/v1/sites");
      await res.arrayBuffer();
      return performance.now() - start;
    };

    // The first upload after a start also starts a worker; the figures below are for a warm one.
    await uploadOnce(0);
    const idle: number[] = [];
    for (let i = 0; i < 20; i++) idle.push(await otherRequest());
    idle.sort((a, b) => a - b);
    console.log(`another signed-in request, server idle: median ${idle[10]!.toFixed(0)} ms`);

    const measure = async (uploads: number) => {
      global.gc?.();
      await new Promise((r) => setTimeout(r, 1000));
      const pids = processTree(server.pid!);
      const before = rssBytes(pids);
      let peak = before;
      const sampler = setInterval(() => (peak = Math.max(peak, rssBytes(pids))), 25);
      const start = performance.now();
      let running = true;
      const all = Promise.all(Array.from({ length: uploads }, (_, i) => uploadOnce(i + 1))).then(
        (statuses) => {
          running = false;
          return statuses;
        },
      );
      const waits: number[] = [];
      while (running) waits.push(await otherRequest());
      const statuses = await all;
      const ms = performance.now() - start;
      clearInterval(sampler);
      const peakMb = (peak - before) / 1_000_000;
      const worst = Math.max(...waits);
      const median = percentile(waits, 50);
      console.log(
        `${uploads} hostile upload${uploads > 1 ? "s at once" : ""}: all answered in ${ms.toFixed(0)} ms (${statuses.join(", ")}); server memory peak ${peakMb.toFixed(0)} MB above ${(before / 1_000_000).toFixed(0)} MB; ${waits.length} other requests meanwhile: median ${median.toFixed(0)} ms, 95th percentile ${percentile(waits, 95).toFixed(0)} ms, slowest ${worst.toFixed(0)} ms`,
      );
      return { ms, peakMb, worst, median, refused: statuses.every((s) => s === 422) };
    };
    const one = await measure(1);
    const three = await measure(3);
    const met =
      one.refused &&
      three.refused &&
      one.ms < TARGETS.oneMs &&
      three.ms < TARGETS.threeMs &&
      three.peakMb < TARGETS.peakMb &&
      Math.max(one.median, three.median) < TARGETS.otherMedianMs &&
      Math.max(one.worst, three.worst) < TARGETS.otherMs;
    console.log(
      `hostile upload targets (one < ${TARGETS.oneMs} ms, three < ${TARGETS.threeMs} ms, peak < ${TARGETS.peakMb} MB, other requests median < ${TARGETS.otherMedianMs} ms and slowest < ${TARGETS.otherMs} ms): ${met ? "met" : "NOT met"}`,
    );
    process.exitCode = met ? 0 : 1;
  } catch (error) {
    console.error(log);
    throw error;
  } finally {
    server.kill("SIGKILL");
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

void main();
