// Runs before every request (Next 16 proxy). Only a cheap header check lives here: the session is
// checked for real in each page, action and route.
import { NextResponse, type NextRequest } from "next/server";
import { oversizedActionResponse } from "@/lib/action-body-limit";

export function proxy(req: NextRequest) {
  // A server action declaring more than the limit: 413 here, not a 500 from inside the framework.
  return oversizedActionResponse(req.method, req.headers) ?? NextResponse.next();
}

export const config = { matcher: ["/((?!_next/static|_next/image|favicon.ico).*)"] };
