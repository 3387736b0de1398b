import fs from "node:fs";
import os from "node:os";
import { parentPort } from "node:worker_threads";
import { ImportFileError } from "../errors";
import { checkImportFile } from "../run-import";

/** What the request thread sends: one upload to read, map and validate. */
export interface CheckFileRequest {
  bytes: Uint8Array;
  fileName: string;
  options: Parameters<typeof checkImportFile>[2];
}

export type CheckFileReply =
  | { ok: true; value: Awaited<ReturnType<typeof checkImportFile>> }
  | { ok: false; refusal: { status: ImportFileError["status"]; message: string } }
  | { ok: false; failure: string };

// A somewhat lower scheduling priority for this thread alone (Linux gives each thread its own
// nice value, and /proc/thread-self names it): when the cores are busy, requests are answered
// first. Nice 5 rather than more: the machine's other work must not starve the read past its
// time limit. Elsewhere the worker keeps the process's priority.
try {
  const threadId = Number(fs.readlinkSync("/proc/thread-self").split("/").pop());
  if (threadId > 0) os.setPriority(threadId, 5);
} catch {
  // not Linux, or not allowed: no change
}

// The body of an import worker (server/import/check-in-worker.ts): it reads one file at a time, off
// the thread that answers requests, and replies with the result or the refusal's message.
parentPort?.on("message", async (request: CheckFileRequest) => {
  let reply: CheckFileReply;
  try {
    reply = {
      ok: true,
      value: await checkImportFile(request.bytes, request.fileName, request.options),
    };
  } catch (error) {
    reply =
      error instanceof ImportFileError
        ? { ok: false, refusal: { status: error.status, message: error.message } }
        : {
            ok: false,
            failure: error instanceof Error ? (error.stack ?? error.message) : String(error),
          };
  }
  parentPort!.postMessage(reply);
});
