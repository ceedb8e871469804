import { CLIENT_ADDRESS_HEADER, requestClientAddress } from "@/lib/server/client-address";
import { getAuth } from "@/lib/server/auth";

export const dynamic = "force-dynamic";

// better-auth keys its per-address limits on CLIENT_ADDRESS_HEADER: set here from the one helper
// (TRUSTED_PROXIES), replacing anything a client sent.
function withClientAddress(req: Request): Request {
  const headers = new Headers(req.headers);
  headers.set(CLIENT_ADDRESS_HEADER, requestClientAddress(req.headers));
  return new Request(req, { headers });
}

export function GET(req: Request) {
  return getAuth().handler(withClientAddress(req));
}

export function POST(req: Request) {
  return getAuth().handler(withClientAddress(req));
}
