import { CLIENT_ADDRESS_HEADER, requestClientAddress } from "@/lib/server/client-address";
import { getAuth } from "@/lib/server/auth";
import { guardAuthRequest } from "@/lib/server/input-guard";
import { errorResponse } from "@/lib/server/route";

export const dynamic = "force-dynamic";

// better-auth keys its per-address limits on CLIENT_ADDRESS_HEADER: set here from the one helper
// (TRUSTED_PROXIES), replacing anything a client sent.
function withClientAddress(req: Request): Request {
  const headers = new Headers(req.headers);
  headers.set(CLIENT_ADDRESS_HEADER, requestClientAddress(req.headers));
  return new Request(req, { headers });
}

// Input is checked before better-auth sees it (size, JSON, storable text, same-origin callbacks).
export async function GET(req: Request) {
  try {
    return await getAuth().handler(withClientAddress(await guardAuthRequest(req)));
  } catch (err) {
    return errorResponse(err);
  }
}

export async function POST(req: Request) {
  try {
    return await getAuth().handler(withClientAddress(await guardAuthRequest(req)));
  } catch (err) {
    return errorResponse(err);
  }
}
