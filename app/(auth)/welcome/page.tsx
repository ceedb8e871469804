import Link from "next/link";
import { redirect } from "next/navigation";
import { PageTitle } from "@/components/ui/card";
import { Notice } from "@/components/ui/notice";
import { safeNext } from "@/lib/schemas/auth";
import { getActor, homePathFor, loadActor } from "@/lib/server/authz";
import { joinStudioAsClient } from "@/lib/server/clients";

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
  if (!actor) redirect(`/sign-in?next=${encodeURIComponent(`/welcome${sp.studio ? `?studio=${sp.studio}` : ""}`)}`);
  if (sp.studio) {
    await joinStudioAsClient(actor, sp.studio).catch(() => null);
    actor = (await loadActor(actor.userId)) ?? actor;
  }
  redirect(sp.next ? safeNext(sp.next) : homePathFor(actor));
}
