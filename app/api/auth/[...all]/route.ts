import { getAuth } from "@/lib/server/auth";
import { guardAuthRequest } from "@/lib/server/input-guard";
import { errorResponse } from "@/lib/server/route";

export const dynamic = "force-dynamic";

// Input is checked before better-auth sees it (size, JSON, storable text, same-origin callbacks).
export async function GET(req: Request) {
  try {
    return await getAuth().handler(await guardAuthRequest(req));
  } catch (err) {
    return errorResponse(err);
  }
}

export async function POST(req: Request) {
  try {
    return await getAuth().handler(await guardAuthRequest(req));
  } catch (err) {
    return errorResponse(err);
  }
}
