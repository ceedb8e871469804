// One error type for the server: a status, a machine code and a message a person can act on.
import { z } from "zod";

export type FieldErrors = Record<string, string[]>;

export class AppError extends Error {
  constructor(
    readonly status: 400 | 401 | 403 | 404 | 409 | 413 | 415 | 422 | 429 | 500 | 502 | 503,
    readonly code: string,
    message: string,
    readonly fieldErrors?: FieldErrors,
  ) {
    super(message);
    this.name = "AppError";
  }
}

export const unauthenticated = () =>
  new AppError(401, "unauthenticated", "Please sign in to continue.");
export const forbidden = (message = "You do not have permission to do that.") =>
  new AppError(403, "forbidden", message);
export const notFound = (what = "That page") => new AppError(404, "not_found", `${what} was not found.`);
export const conflict = (message: string) => new AppError(409, "conflict", message);

/** zod issues → { "field.path": ["message", …] } */
export function fieldErrorsOf(error: z.ZodError): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_form";
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

export function validationError(error: z.ZodError): AppError {
  return new AppError(422, "invalid_input", "Some fields need attention.", fieldErrorsOf(error));
}

/** For `.catch(nullIfNotFound)`: a 404 becomes null; anything else (a busy database, a bug) is rethrown. */
export function nullIfNotFound(err: unknown): null {
  if (err instanceof AppError && err.status === 404) return null;
  throw err;
}
