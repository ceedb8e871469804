// The one check for "come back here" targets (?next=, callbackURL to better-auth, after sign-in or
// sign-up, invitation flows): a path on this site, or the fallback. Pure, so forms and pages share it.

const BASE = "http://same-origin.invalid";

/**
 * A same-origin path, re-encoded as plain ASCII, or `fallback`. Refused: anything not a string,
 * not starting with exactly one "/", "//" (another host), backslashes (read as "/" by browsers),
 * control characters (tab and newline are dropped by URL parsers, so "/\t/evil" becomes "//evil",
 * and a newline breaks the Location header) and anything over 2,000 characters.
 */
export function safeNext(value: unknown, fallback = "/home"): string {
  if (typeof value !== "string" || value.length === 0 || value.length > 2000) return fallback;
  if (!value.startsWith("/") || value.startsWith("//")) return fallback;
  if (/[\\\u0000-\u001f\u007f-\u009f\u2028\u2029]/.test(value)) return fallback;
  // A lone surrogate cannot be encoded into a URL.
  if (/[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/.test(value)) return fallback;
  let url: URL;
  try {
    url = new URL(value, BASE);
  } catch {
    return fallback;
  }
  if (url.origin !== BASE) return fallback;
  return `${url.pathname}${url.search}${url.hash}`;
}

/** Like safeNext, but says whether the value was acceptable as it came (for refusing, not replacing). */
export function isSafeNext(value: unknown): boolean {
  return safeNext(value, "\u0000") !== "\u0000";
}
