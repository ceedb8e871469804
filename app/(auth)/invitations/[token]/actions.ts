"use server";
import { redirect } from "next/navigation";
import { z } from "zod";
import { formAction } from "@/lib/server/action";
import { acceptInvitation } from "@/lib/server/invitations";

export const acceptInvitationAction = formAction(z.object({ token: z.string().min(10).max(200) }), async ({ token }, actor) => {
  await acceptInvitation(actor, token);
  redirect("/studio");
});
