"use server";
import { revalidatePath } from "next/cache";
import { inviteSchema } from "@/lib/schemas/auth";
import { formAction } from "@/lib/server/action";
import { inviteMember } from "@/lib/server/invitations";
import { notFound } from "@/lib/server/errors";

export const inviteAssistantAction = formAction(
  inviteSchema,
  async ({ email }, actor) => {
    const studio = actor.memberships[0];
    if (!studio) throw notFound();
    const result = await inviteMember(actor, studio.studioId, email);
    revalidatePath("/studio/team");
    return result;
  },
  { message: "Invitation sent." },
);
