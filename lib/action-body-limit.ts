// Server actions over the framework's body limit would be answered 500 by Next itself (it throws
// inside the action handler). The proxy answers them 413 first, from the declared length.
// Kept free of framework imports so the proxy can call it and tests can table it.

/** Next's default `serverActions.bodySizeLimit` (1 MB); keep both the same if either changes. */
export const MAX_ACTION_BYTES = 1024 * 1024;

/** A 413 for a server-action POST that declares more than the limit, else null. */
export function oversizedActionResponse(method: string, headers: Headers, limit = MAX_ACTION_BYTES): Response | null {
  if (method !== "POST" || !headers.has("next-action")) return null;
  const declared = Number(headers.get("content-length"));
  if (!Number.isFinite(declared) || declared <= limit) return null;
  return Response.json(
    { error: { code: "too_large", message: `The form is larger than ${Math.round(limit / 1024)} KB; send less.` } },
    { status: 413 },
  );
}
