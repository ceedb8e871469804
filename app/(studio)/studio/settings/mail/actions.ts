"use server";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { formAction } from "@/lib/server/action";
import { primaryStudio } from "@/lib/server/authz";
import { notFound } from "@/lib/server/errors";
import { retryMail } from "@/lib/server/queries/outbox";

export const retryMailAction = formAction(
  z.object({ id: z.string().uuid() }),
  async (input, actor) => {
    const studio = primaryStudio(actor);
    if (!studio) throw notFound();
    await retryMail(actor, studio.studioId, input.id);
    revalidatePath("/studio/settings/mail");
    return { id: input.id };
  },
  { message: "Queued again; it goes out within a minute if the mail server accepts it." },
);
