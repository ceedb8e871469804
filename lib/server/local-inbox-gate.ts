// Who may see the local inbox (app/local-inbox): it shows every sign-in, reset and invitation link,
// so it exists only on a developer's own machine. Each condition has its own refusal (tested).
import { isIP } from "node:net";

export interface InboxRequest {
  /** LOCAL_MAIL_API: set only while mail goes to the local mail service */
  localMailApi: string | undefined;
  /** BETTER_AUTH_URL */
  appUrl: string;
  /** clientAddress() of the request */
  client: string;
  /** the Host header as sent */
  host: string | null;
}

export type InboxRefusal = "no_local_mail" | "app_not_loopback" | "client_not_loopback" | "foreign_host";

export function isLoopbackAddress(a: string): boolean {
  const bare = a.replace(/^\[|\]$/g, "");
  if (isIP(bare) === 4) return bare.startsWith("127.");
  if (isIP(bare) === 6) return bare === "::1" || /^::ffff:127\./i.test(bare);
  return false;
}

const isLoopbackHost = (hostname: string) => hostname === "localhost" || isLoopbackAddress(hostname);

/** null when the inbox may be shown; otherwise why not (the page then answers 404). */
export function localInboxRefusal(r: InboxRequest): InboxRefusal | null {
  if (!r.localMailApi) return "no_local_mail";
  let app: URL;
  try {
    app = new URL(r.appUrl);
  } catch {
    return "app_not_loopback";
  }
  if (!isLoopbackHost(app.hostname)) return "app_not_loopback";
  if (!isLoopbackAddress(r.client)) return "client_not_loopback";
  // A page of another site whose name resolves to 127.0.0.1 (DNS rebinding) sends its own Host.
  if (r.host?.toLowerCase() !== app.host.toLowerCase()) return "foreign_host";
  return null;
}
