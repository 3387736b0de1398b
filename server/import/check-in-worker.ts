import "server-only";
import os from "node:os";
import path from "node:path";
import { Worker } from "node:worker_threads";
import { ImportFileError } from "@/lib/import/errors";
import type { checkImportFile } from "@/lib/import/run-import";
import type { CheckFileReply, CheckFileRequest } from "@/lib/import/worker/check-file-worker";

/**
 * Uploads are read in worker threads, never on the thread that answers requests: a large
 * workbook then costs its own thread time and memory while everyone else is still served
 * (issue 13, finding 4). At most PARSE_LIMITS.workers files are read at once, the next few wait
 * their turn, and more than that are turned away with a 503; each worker's heap is capped, and
 * one that runs out of it or takes too long is ended and the file refused with a 413.
 */
export const PARSE_LIMITS = {
  /** One core is left to the thread that answers requests. */
  workers: Math.max(1, os.availableParallelism() - 1),
  waiting: 8,
  /** Old-generation heap of one worker; a 20,000-row workbook of every column needs ~150 MB. */
  heapMb: 384,
  timeoutMs: 60_000,
  /** An idle worker is kept this long for the next upload, then ended to give its memory back. */
  idleMs: 30_000,
} as const;

type Checked = Awaited<ReturnType<typeof checkImportFile>>;
type Options = Parameters<typeof checkImportFile>[2];

// The worker's code is TypeScript that imports the rest of lib/import; tsx compiles it as it
// loads, in the worker itself, so the same files run under `npm start`, `npm run dev`, the tests
// and the bench without a separate build. The path is found from the project root (the npm
// scripts and the tests all run from it) at run time, so the app's bundler leaves it alone.
const workerSource = () => {
  const entry = path.join(process.cwd(), "lib", "import", "worker", "check-file-worker.ts");
  return [
    'const { createRequire } = require("node:module");',
    `const load = createRequire(${JSON.stringify(entry)});`,
    'load("tsx/cjs/api").register();',
    `load(${JSON.stringify(entry)});`,
  ].join("\n");
};

const idle: { worker: Worker; timer: NodeJS.Timeout }[] = [];
let reading = 0;
const queue: (() => void)[] = [];

async function takeTurn(fileName: string): Promise<void> {
  if (reading < PARSE_LIMITS.workers) {
    reading++;
    return;
  }
  if (queue.length >= PARSE_LIMITS.waiting) {
    throw new ImportFileError(
      503,
      `"${fileName}" was not read: the server is already reading ${PARSE_LIMITS.workers + PARSE_LIMITS.waiting} uploads; try again in a minute`,
    );
  }
  await new Promise<void>((resolve) => queue.push(resolve));
}

function endTurn(): void {
  const next = queue.shift();
  if (next) next();
  else reading--;
}

function startWorker(): Worker {
  const worker = new Worker(workerSource(), {
    eval: true,
    resourceLimits: { maxOldGenerationSizeMb: PARSE_LIMITS.heapMb, maxYoungGenerationSizeMb: 48 },
    stdout: false,
    stderr: false,
  });
  // A worker that ends while parked (it should not) is never handed another file.
  worker.on("exit", () => {
    const at = idle.findIndex((w) => w.worker === worker);
    if (at >= 0) {
      clearTimeout(idle[at]!.timer);
      idle.splice(at, 1);
    }
  });
  return worker;
}

function park(worker: Worker): void {
  worker.unref();
  const timer = setTimeout(() => {
    const at = idle.findIndex((w) => w.worker === worker);
    if (at >= 0) idle.splice(at, 1);
    void worker.terminate();
  }, PARSE_LIMITS.idleMs);
  timer.unref();
  idle.push({ worker, timer });
}

function takeWorker(): Worker {
  const parked = idle.pop();
  if (!parked) return startWorker();
  clearTimeout(parked.timer);
  parked.worker.ref();
  return parked.worker;
}

const tooMuchMemory = (fileName: string) =>
  new ImportFileError(
    413,
    `"${fileName}" needs more memory to read than one upload may use (${PARSE_LIMITS.heapMb} MB); save only the sheet to import, as .xlsx or as CSV UTF-8, or split the file`,
  );

const tooSlow = (fileName: string) =>
  new ImportFileError(
    413,
    `"${fileName}" took longer than ${PARSE_LIMITS.timeoutMs / 1000} s to read and was stopped; save only the sheet to import, as .xlsx or as CSV UTF-8, or split the file`,
  );

function readOnWorker(bytes: Uint8Array, fileName: string, options: Options): Promise<Checked> {
  // The file's bytes move to the worker rather than being copied; a view into a larger buffer
  // (a pooled Buffer) is copied out first so that nothing else goes with it.
  const own =
    bytes.byteOffset === 0 &&
    bytes.byteLength === bytes.buffer.byteLength &&
    bytes.buffer instanceof ArrayBuffer
      ? bytes
      : bytes.slice();
  const worker = takeWorker();
  return new Promise<Checked>((resolve, reject) => {
    const done = () => {
      clearTimeout(timer);
      worker.off("message", onMessage);
      worker.off("error", onError);
      worker.off("exit", onExit);
    };
    const timer = setTimeout(() => {
      done();
      void worker.terminate();
      reject(tooSlow(fileName));
    }, PARSE_LIMITS.timeoutMs);
    const onMessage = (reply: CheckFileReply) => {
      done();
      park(worker);
      if (reply.ok) resolve(reply.value);
      else if ("refusal" in reply)
        reject(new ImportFileError(reply.refusal.status, reply.refusal.message));
      else reject(new Error(`The import worker failed: ${reply.failure}`));
    };
    const onError = (error: Error & { code?: string }) => {
      done();
      void worker.terminate();
      reject(error.code === "ERR_WORKER_OUT_OF_MEMORY" ? tooMuchMemory(fileName) : error);
    };
    const onExit = (code: number) => {
      done();
      reject(
        new Error(`The import worker stopped (exit code ${code}) while reading "${fileName}"`),
      );
    };
    worker.on("message", onMessage);
    worker.on("error", onError);
    worker.on("exit", onExit);
    const request: CheckFileRequest = { bytes: own, fileName, options };
    worker.postMessage(request, [own.buffer as ArrayBuffer]);
  });
}

/**
 * checkImportFile (lib/import/run-import.ts) in a worker thread: the same result, or the same
 * ImportFileError, plus a 413 when the file needs more memory or time than an upload may take,
 * and a 503 when too many uploads are being read already. `bytes` is handed over to the worker
 * and is empty afterwards.
 */
export async function checkImportFileInWorker(
  bytes: Uint8Array,
  fileName: string,
  options: Options,
): Promise<Checked> {
  await takeTurn(fileName);
  try {
    return await readOnWorker(bytes, fileName, {
      sheet: options.sheet,
      mapping: options.mapping,
      // Only what validation reads: the site row holds more than the worker needs.
      site: { hoursPerYear: options.site.hoursPerYear, ambientC: options.site.ambientC },
    });
  } finally {
    endTurn();
  }
}
