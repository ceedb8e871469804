import "server-only";
// The one wrapper for JSON route handlers: session → zod parse → call → typed error mapping.
// Authorisation of the resource itself happens in the query the handler calls.
import { z } from "zod";
import { requireActor, type Actor } from "./authz";
import { BUSY_RETRY_AFTER_SECONDS, busyError } from "./db-busy";
import { AppError, validationError } from "./errors";
import { refuseCrossSite } from "./request-guard";

type Ctx<P, B, Q> = { req: Request; actor: Actor; params: P; body: B; query: Q };

interface RouteSpec<P extends z.ZodType, B extends z.ZodType, Q extends z.ZodType> {
  params?: P;
  body?: B;
  query?: Q;
}

export function errorResponse(err: unknown): Response {
  const busy = busyError(err); // the pool is exhausted: fail fast, the client retries
  if (busy) return Response.json({ error: { code: busy.code, message: busy.message } }, { status: 503, headers: { "retry-after": String(BUSY_RETRY_AFTER_SECONDS) } });
  if (err instanceof AppError) {
    return Response.json(
      { error: { code: err.code, message: err.message, fieldErrors: err.fieldErrors } },
      // 413: the rest of the body was not read, so the connection cannot carry another request.
      { status: err.status, headers: err.status === 413 ? { connection: "close" } : undefined },
    );
  }
  if (err instanceof z.ZodError) return errorResponse(validationError(err));
  console.error(err);
  return Response.json(
    { error: { code: "internal", message: "Something went wrong on our side. Please try again." } },
    { status: 500 },
  );
}

export function route<
  P extends z.ZodType = z.ZodType<Record<string, string>>,
  B extends z.ZodType = z.ZodUnknown,
  Q extends z.ZodType = z.ZodType<Record<string, string>>,
>(
  spec: RouteSpec<P, B, Q>,
  handler: (ctx: Ctx<z.output<P>, z.output<B>, z.output<Q>>) => Promise<unknown>,
) {
  return async (req: Request, context: { params: Promise<Record<string, string | string[]>> }) => {
    const refused = refuseCrossSite(req, { jsonBody: Boolean(spec.body) });
    if (refused) return refused;
    try {
      const actor = await requireActor(req.headers);
      const rawParams = context?.params ? await context.params : {};
      const params = spec.params ? spec.params.parse(rawParams) : rawParams;
      const query = spec.query
        ? spec.query.parse(Object.fromEntries(new URL(req.url).searchParams))
        : Object.fromEntries(new URL(req.url).searchParams);
      let body: unknown = undefined;
      if (spec.body) {
        let raw: unknown;
        try {
          raw = await req.json();
        } catch {
          throw new AppError(400, "bad_json", "The request body is not valid JSON.");
        }
        body = spec.body.parse(raw);
      }
      const result = await handler({
        req,
        actor,
        params: params as z.output<P>,
        body: body as z.output<B>,
        query: query as z.output<Q>,
      });
      return result instanceof Response ? result : Response.json(result);
    } catch (err) {
      return errorResponse(err);
    }
  };
}
