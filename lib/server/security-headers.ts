// Security headers for every response, set by proxy.ts. Pages get a Content-Security-Policy with a
// nonce made fresh for each request (Next.js reads it from the request's CSP header and puts it on its
// own scripts; every page is rendered per request, see app/layout.tsx). No "server-only": proxy.ts
// imports it.
//
// What the policy allows, and why:
// - scripts: only ours carrying this request's nonce, and what they load ('strict-dynamic'); no inline
//   handlers, no eval (except `next dev`, whose React needs eval for its debugging aids).
// - workers: same-origin scripts only (`worker-src 'self'`, no blob: or data:). Said outright because a
//   worker would otherwise fall back to script-src, where 'strict-dynamic' makes browsers ignore
//   'self'. The chart editor reads the garment in a module worker that the bundler emits under
//   /_next/static (its chunks load with importScripts from the same origin).
// - style elements and stylesheets: ours ('self' and the nonce). Style ATTRIBUTES are allowed inline
//   (`style-src-attr 'unsafe-inline'`): React's `style={…}` props, the chart editor's and proofs' SVG
//   and the charts library set them in server-rendered markup, and a style attribute cannot run script.
// - images: ours, data:/blob: (chart previews and photo previews made in the browser) and the photo
//   storage, to which /api/uploads/[id] redirects with a signed URL.
// - fonts: ours (next/font/local serves them from /_next/static). Fetches and base URI: ours only.
// - forms: ours, and the payment provider's checkout (a pay button's server action redirects there,
//   and Chromium applies form-action to a form's redirects when the page is not yet hydrated).
// - nothing may frame a page (frame-ancestors 'none'); no plugins (object-src 'none').

export interface HeaderOptions {
  nonce: string;
  /** BETTER_AUTH_URL: https turns on HSTS and upgrade-insecure-requests */
  appUrl: string;
  /** S3_ENDPOINT when set; otherwise the public AWS endpoints of the bucket's region */
  storageOrigins: string[];
  /** the payment provider's hosted checkout, to which the pay buttons' form is redirected */
  checkoutOrigins: string[];
  dev: boolean;
  /** JSON, PDFs and CSV from /api: no page policy, only framing and sniffing rules */
  api: boolean;
}

export const PERMISSIONS_POLICY =
  "camera=(), microphone=(), geolocation=(), payment=(), usb=(), display-capture=(), fullscreen=(self)";

export function contentSecurityPolicy(o: Pick<HeaderOptions, "nonce" | "appUrl" | "storageOrigins" | "checkoutOrigins" | "dev">): string {
  const https = new URL(o.appUrl).protocol === "https:";
  const nonce = `'nonce-${o.nonce}'`;
  return [
    "default-src 'self'",
    `script-src 'self' ${nonce} 'strict-dynamic'${o.dev ? " 'unsafe-eval'" : ""}`,
    "worker-src 'self'",
    `style-src 'self' ${nonce}`,
    `style-src-elem 'self' ${nonce}`,
    "style-src-attr 'unsafe-inline'",
    ["img-src 'self' data: blob:", ...o.storageOrigins].join(" "),
    "font-src 'self'",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    ["form-action 'self'", ...o.checkoutOrigins].join(" "),
    "frame-ancestors 'none'",
    ...(https ? ["upgrade-insecure-requests"] : []),
  ].join("; ");
}

/** Every header for one response. */
export function securityHeaders(o: HeaderOptions): Record<string, string> {
  const out: Record<string, string> = {
    "Content-Security-Policy": o.api ? "frame-ancestors 'none'" : contentSecurityPolicy(o),
    "X-Frame-Options": "DENY",
    "X-Content-Type-Options": "nosniff",
    "Referrer-Policy": "strict-origin-when-cross-origin",
    "Permissions-Policy": PERMISSIONS_POLICY,
  };
  // Only over https: a browser would otherwise refuse plain http to the host for two years.
  if (new URL(o.appUrl).protocol === "https:") out["Strict-Transport-Security"] = "max-age=63072000; includeSubDomains";
  return out;
}

/** The hosted checkout: the local payments fake when STRIPE_API_URL is set, otherwise Stripe's. */
export function checkoutOrigins(apiUrl: string | undefined): string[] {
  return apiUrl ? [new URL(apiUrl).origin] : ["https://checkout.stripe.com"];
}

/** Where photos are served from (the signed URLs of lib/server/storage.ts). */
export function storageOrigins(endpoint: string | undefined, bucket: string, region: string): string[] {
  if (endpoint) return [new URL(endpoint).origin];
  return [`https://${bucket}.s3.${region}.amazonaws.com`, `https://s3.${region}.amazonaws.com`];
}
