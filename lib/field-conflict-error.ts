import { ConflictError } from "@/lib/errors";

// A conflict that belongs to one field of a form (a name already taken, an owner that must be
// chosen): forms show it beside that field, everything else treats it as a plain conflict.
export class FieldConflictError extends ConflictError {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = "FieldConflictError";
  }
}
