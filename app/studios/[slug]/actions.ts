"use server";
// The request form's actions. Saving a draft needs no account (the draft is keyed by a random
// cookie token); sending the request needs one, so a signed-out visitor marks the draft as sent
// and it becomes the commission once they have confirmed their address (see /welcome).
import { cookies } from "next/headers";
import type { ActionState } from "@/lib/action-state";
import { env } from "@/lib/env";
import { toErrorState } from "@/lib/server/action";
import { getActor, requireActor } from "@/lib/server/authz";
import { getStudioBySlug } from "@/lib/server/clients";
import { AppError, notFound, validationError } from "@/lib/server/errors";
import { assertSafeInput } from "@/lib/server/input-guard";
import { createCommissionFromRequest, draftCookieName, loadDraft, newDraftToken, saveDraft } from "@/lib/server/requests";
import { studioSlugSchema } from "@/lib/schemas/common";
import { requestSchema } from "@/lib/schemas/request";

// These actions are called from the browser with (slug, values): any other shape is refused as a state, never thrown.
const badShape = () => new AppError(400, "bad_request", "This form was sent in a shape we do not accept. Reload the page and try again.");

function readArgs(args: unknown[], withValues: boolean): { slug: string; values: Record<string, unknown> } {
  if (args.length !== (withValues ? 2 : 1)) throw badShape();
  const slug = studioSlugSchema.safeParse(args[0]);
  if (!slug.success) throw notFound("That studio");
  const values = withValues ? args[1] : {};
  if (values === null || typeof values !== "object" || Array.isArray(values)) throw badShape();
  assertSafeInput(values);
  return { slug: slug.data, values: values as Record<string, unknown> };
}

async function studioAndToken(slug: string, create: boolean) {
  const studio = await getStudioBySlug(slug);
  if (!studio) throw notFound("That studio");
  const jar = await cookies();
  let token = jar.get(draftCookieName(slug))?.value;
  if (!token && create) {
    token = newDraftToken();
    jar.set(draftCookieName(slug), token, {
      httpOnly: true,
      sameSite: "lax",
      secure: env.BETTER_AUTH_URL.startsWith("https:"),
      path: "/",
      maxAge: 60 * 60 * 24 * 30,
    });
  }
  return { studio, token };
}

/** Makes sure this browser has a draft token for the studio (before the first save or photo). */
export async function ensureRequestDraft(...args: unknown[]): Promise<ActionState<{ ok: true }>> {
  try {
    const { slug } = readArgs(args, false);
    await studioAndToken(slug, true);
    return { status: "ok", data: { ok: true } };
  } catch (err) {
    return toErrorState(err);
  }
}

/** Saves every valid field; `invalid` names the fields that were not saved and why. */
export async function saveRequestDraft(...args: unknown[]): Promise<ActionState<{ savedAt: string; invalid: Record<string, string[]> }>> {
  try {
    const { slug, values } = readArgs(args, true);
    const { studio, token } = await studioAndToken(slug, true);
    const actor = await getActor();
    const previous = await loadDraft(studio.id, token);
    const data = { ...values, submitted: previous?.data.submitted ?? false };
    const saved = await saveDraft(studio.id, token!, data, actor?.userId ?? null);
    return { status: "ok", data: { savedAt: new Date().toISOString(), invalid: saved.invalid } };
  } catch (err) {
    return toErrorState(err);
  }
}

/** Signed out: the request is complete and kept as "sent"; it is created when the account is confirmed. */
export async function holdRequestForSignUp(...args: unknown[]): Promise<ActionState<{ held: true }>> {
  try {
    const { slug, values } = readArgs(args, true);
    const parsed = requestSchema.safeParse(values);
    if (!parsed.success) throw validationError(parsed.error);
    const { studio, token } = await studioAndToken(slug, true);
    await saveDraft(studio.id, token!, { ...values, submitted: true }, null);
    return { status: "ok", data: { held: true } };
  } catch (err) {
    return toErrorState(err);
  }
}

export async function submitRequest(...args: unknown[]): Promise<ActionState<{ id: string; number: number }>> {
  try {
    const { slug, values } = readArgs(args, true);
    const actor = await requireActor();
    const { studio, token } = await studioAndToken(slug, false);
    const draft = await loadDraft(studio.id, token);
    const c = await createCommissionFromRequest(actor, studio, values, {
      draftId: draft && (!draft.userId || draft.userId === actor.userId) ? draft.id : undefined,
      draftUploadIds: draft && (!draft.userId || draft.userId === actor.userId) ? draft.uploadIds : [],
    });
    return { status: "ok", data: { id: c.id, number: c.number } };
  } catch (err) {
    return toErrorState(err);
  }
}
