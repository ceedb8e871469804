// A path whose percent-encoding is not UTF-8 (a lone surrogate %ED%A0%80, %FF, an overlong %C0%80)
// makes Next.js fail to decode the dynamic segment and answer its own 500 (its 400 page does not
// exist in an app-router project). proxy.ts answers such a path 400 first.
// Kept free of framework imports so the proxy can call it and tests can table it.

/** A 400 when a segment of the (still encoded) path does not decode, else null. */
export function malformedPathResponse(pathname: string): Response | null {
  if (!pathname.includes("%")) return null;
  for (const segment of pathname.split("/")) {
    try {
      decodeURIComponent(segment);
    } catch {
      return Response.json({ error: { code: "bad_path", message: "This address is not valid." } }, { status: 400 });
    }
  }
  return null;
}
