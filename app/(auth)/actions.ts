"use server";
import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { getAuth } from "@/lib/server/auth";

export async function signOut() {
  // Signing out twice (or signed out already) is not an error: either way the browser goes home.
  await getAuth()
    .api.signOut({ headers: await headers() })
    .catch(() => undefined);
  redirect("/");
}
