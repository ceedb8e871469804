import "server-only";
// The one wrapper for JSON route handlers: session → zod parse → call → typed error mapping.
// Authorisation of the resource itself happens in the query the handler calls.
import { z } from "zod";
import { requireActor, type Actor } from "./authz";
import { BUSY_RETRY_AFTER_SECONDS, busyError } from "./db-busy";
import { AppError, validationError } from "./errors";
import { assertSafeInput, dataExceptionAsInputError, readJsonBody } from "./input-guard";
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
  const input = dataExceptionAsInputError(err);
  if (input) return errorResponse(input);
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
  const handle = async (req: Request, context: { params: Promise<Record<string, string | string[]>> }) => {
    const refused = refuseCrossSite(req, { jsonBody: Boolean(spec.body) });
    if (refused) return refused;
    try {
      const actor = await requireActor(req.headers);
      const rawParams = context?.params ? await context.params : {};
      const rawQuery = Object.fromEntries(new URL(req.url).searchParams);
      assertSafeInput(rawParams, "address");
      assertSafeInput(rawQuery, "query");
      const params = spec.params ? spec.params.parse(rawParams) : rawParams;
      const query = spec.query ? spec.query.parse(rawQuery) : rawQuery;
      let body: unknown = undefined;
      if (spec.body) {
        // Limit (413), content type (415), UTF-8 and JSON (400) while reading; depth and text before zod.
        const raw = await readJsonBody(req);
        assertSafeInput(raw);
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
  // The spec travels with the handler so the fuzz test can generate inputs from its schemas.
  return Object.assign(handle, { spec });
}
