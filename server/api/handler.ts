import "server-only";
import { NextResponse } from "next/server";
import { ZodError } from "zod";
import { NonFiniteResultError } from "@/lib/engine/evaluate";
import {
  ConflictError,
  ForbiddenError,
  NotFoundError,
  StoredInputError,
  UnauthorizedError,
} from "@/lib/errors";
import { isCrossSiteWrite } from "./same-origin";

export class PayloadTooLargeError extends Error {
  readonly status = 413;
}

export function jsonError(status: number, error: string, extra: Record<string, unknown> = {}) {
  return NextResponse.json({ error, ...extra }, { status });
}

// Wraps a route handler's body: a cookie-authenticated write from another site is refused before
// the handler runs (every handler gets it, none can forget it); typed errors become their JSON
// status, anything unexpected a 500 whose details stay in the server log.
export function withApi<Args extends unknown[]>(handler: (...args: Args) => Promise<Response>) {
  return async (...args: Args): Promise<Response> => {
    const request = args[0];
    if (request instanceof Request && isCrossSiteWrite(request)) {
      return jsonError(403, "This request did not come from Loopshift's own pages");
    }
    try {
      return await handler(...args);
    } catch (error) {
      if (error instanceof ZodError) {
        return jsonError(422, "The request is not valid", {
          issues: error.issues.map((i) => ({ path: i.path, message: i.message })),
        });
      }
      if (error instanceof StoredInputError) {
        return jsonError(error.status, error.message, {
          problems: error.problems.map((p) => p.text),
          issues: error.problems,
        });
      }
      if (
        error instanceof UnauthorizedError ||
        error instanceof ForbiddenError ||
        error instanceof NotFoundError ||
        error instanceof ConflictError ||
        error instanceof PayloadTooLargeError ||
        error instanceof NonFiniteResultError
      ) {
        return jsonError(error.status, error.message);
      }
      console.error(error);
      return jsonError(500, "Something went wrong on our side");
    }
  };
}

// Reads a JSON body with a size cap, before parsing, so a huge upload is refused cheaply.
export async function readJsonBody(request: Request, maxBytes: number): Promise<unknown> {
  const declared = Number(request.headers.get("content-length") ?? "0");
  if (declared > maxBytes)
    throw new PayloadTooLargeError(`The body is larger than ${maxBytes / 1024 / 1024} MB`);
  const text = await request.text();
  if (Buffer.byteLength(text) > maxBytes) {
    throw new PayloadTooLargeError(`The body is larger than ${maxBytes / 1024 / 1024} MB`);
  }
  try {
    return JSON.parse(text);
  } catch {
    throw new ZodError([
      { code: "custom", path: [], message: "The body is not valid JSON", input: text.slice(0, 40) },
    ]);
  }
}
