import "server-only";
// Request bodies read with a byte limit enforced while reading: a declared Content-Length over the
// limit is refused before anything is read, and a body without one (or with a false one) is
// counted chunk by chunk and refused the moment it passes the limit. Never more than `limit`
// bytes are held, so a large or endless upload cannot grow the server.
import { AppError } from "./errors";

export function tooLarge(message: string): AppError {
  return new AppError(413, "too_large", message);
}

/**
 * The whole body as bytes, at most `limit` of them; otherwise a 413 with `message`. On refusal the
 * rest of the body is left unread (the 413 answer closes the connection: see errorResponse).
 */
export async function readBodyLimited(req: Request, limit: number, message: string): Promise<Buffer> {
  const declared = req.headers.get("content-length");
  if (declared !== null && /^\s*\d+\s*$/.test(declared) && Number(declared) > limit) throw tooLarge(message);
  if (!req.body) return Buffer.alloc(0);
  let reader: ReadableStreamDefaultReader<Uint8Array>;
  try {
    reader = req.body.getReader();
  } catch {
    throw new AppError(400, "bad_body", "The request body could not be read.");
  }
  const chunks: Uint8Array[] = [];
  let total = 0;
  try {
    for (;;) {
      let step: ReadableStreamReadResult<Uint8Array>;
      try {
        step = await reader.read();
      } catch {
        // The client went away or sent a broken stream.
        throw new AppError(400, "bad_body", "The request body could not be read.");
      }
      if (step.done) break;
      total += step.value.byteLength;
      if (total > limit) {
        chunks.length = 0;
        throw tooLarge(message);
      }
      chunks.push(step.value);
    }
  } finally {
    reader.releaseLock();
  }
  return Buffer.concat(chunks, total);
}

/** The body as text (UTF-8), at most `limit` bytes; otherwise a 413. */
export async function readTextLimited(req: Request, limit: number, message: string): Promise<string> {
  return (await readBodyLimited(req, limit, message)).toString("utf8");
}
