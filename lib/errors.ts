import type { StoredInputProblem } from "@/lib/results/stored-input-problems";

// Typed errors that route handlers and actions map onto HTTP statuses and form messages.
// "Not found" is also what a caller gets for a record outside their scope, so that nobody can
// learn that another account's records exist.
export class NotFoundError extends Error {
  readonly status = 404;
  constructor(what = "Not found") {
    super(what);
    this.name = "NotFoundError";
  }
}

export class UnauthorizedError extends Error {
  readonly status = 401;
  constructor(message = "Sign in to continue") {
    super(message);
    this.name = "UnauthorizedError";
  }
}

export class ForbiddenError extends Error {
  readonly status = 403;
  constructor(message = "Your role may not do this") {
    super(message);
    this.name = "ForbiddenError";
  }
}

export class ConflictError extends Error {
  readonly status = 409;
  constructor(message: string) {
    super(message);
    this.name = "ConflictError";
  }
}

/**
 * A case built from stored rows that the engine's bounds refuse (a value saved before the bounds
 * existed): a conflict between what is stored and what is allowed, answered with every problem —
 * machine, axis, field, allowed range and the page to fix it on — instead of a bare 422.
 */
export class StoredInputError extends ConflictError {
  constructor(
    message: string,
    readonly problems: readonly StoredInputProblem[],
  ) {
    super(message);
    this.name = "StoredInputError";
  }
}
