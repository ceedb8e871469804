import Link from "next/link";
import { redirect } from "next/navigation";
import { PageTitle } from "@/components/ui/card";
import { Notice } from "@/components/ui/notice";
import { safeNext } from "@/lib/schemas/auth";
import { getActor, homePathFor, loadActor } from "@/lib/server/authz";
import { cookies } from "next/headers";
import { joinStudioAsClient } from "@/lib/server/clients";
import { draftCookieName, finishDraft } from "@/lib/server/requests";

export const metadata = { title: "Welcome" };

// Where the e-mail confirmation link lands (better-auth signs the person in first).
export default async function WelcomePage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const sp = await searchParams;
  if (sp.error) {
    return (
      <>
        <PageTitle title="That link did not work" />
        <Notice tone="error">
          The confirmation link has expired (links last 24 hours) or was already used.{" "}
          <Link href="/sign-in">Sign in</Link> and we will send you a fresh one.
        </Notice>
      </>
    );
  }
  let actor = await getActor();
  if (!actor) {
    const back = new URLSearchParams();
    if (sp.studio) back.set("studio", sp.studio);
    if (sp.request) back.set("request", "1");
    redirect(`/sign-in?next=${encodeURIComponent(`/welcome${back.size ? `?${back}` : ""}`)}`);
  }
  if (sp.studio) {
    const joined = await joinStudioAsClient(actor, sp.studio).catch(() => null);
    actor = (await loadActor(actor.userId)) ?? actor;
    // A request filled in before signing up becomes the commission now (the draft is this browser's).
    if (joined && sp.request) {
      const made = await finishDraft(actor, joined.studio.id, (await cookies()).get(draftCookieName(joined.studio.slug))?.value);
      if (made) redirect(`/portal/commissions/${made.id}?requested=1`);
      redirect(`/studios/${joined.studio.slug}#request`);
    }
  }
  redirect(sp.next ? safeNext(sp.next) : homePathFor(actor));
}
