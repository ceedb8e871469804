import { redirect } from "next/navigation";
import { getActor, homePathFor } from "@/lib/server/authz";

// Sends each person to their own area: studio members to the studio, clients to the portal.
export default async function HomeRedirect() {
  const actor = await getActor();
  redirect(actor ? homePathFor(actor) : "/sign-in");
}
