import "server-only";
// A saturated database (no pooled connection free within DB_CONNECT_TIMEOUT_MS, or a statement past
// DB_STATEMENT_TIMEOUT_MS) is a 503 the client may retry shortly, not a fault of ours or theirs.
import { isDatabaseBusy } from "@/db";
import { AppError } from "./errors";

export const BUSY_RETRY_AFTER_SECONDS = 2;

export function busyError(err: unknown): AppError | null {
  if (!isDatabaseBusy(err)) return null;
  return new AppError(503, "busy", "The server is very busy right now. Please try again in a few seconds.");
}
