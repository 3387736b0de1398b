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

// The body of an import worker (lib/import/check-in-worker.ts): it reads one file at a time, off
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
