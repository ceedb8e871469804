import Link from "next/link";
import { PageTitle } from "@/components/ui/card";
import { Notice } from "@/components/ui/notice";
import { getActor } from "@/lib/server/authz";
import { lookupInvitation } from "@/lib/server/invitations";
import { AcceptInvitationForm } from "./accept-form";

export const metadata = { title: "Invitation" };

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation = await lookupInvitation(token);
  if (invitation.status !== "valid") {
    return (
      <>
        <PageTitle title="Invitation" />
        <Notice tone="error">{invitation.message}</Notice>
      </>
    );
  }
  const actor = await getActor();
  const here = `/invitations/${token}`;
  return (
    <>
      <PageTitle
        title={`Join ${invitation.studioName}`}
        lead={`This invitation is for ${invitation.email}. As an assistant you will see the studio's commissions, move pieces between stages and log hours; prices and payments stay with the owner.`}
      />
      {actor ? (
        actor.email.toLowerCase() === invitation.email ? (
          <AcceptInvitationForm token={token} studioName={invitation.studioName} />
        ) : (
          <Notice tone="error">
            You are signed in as {actor.email}. Sign out, then sign in or create an account with {invitation.email}.
          </Notice>
        )
      ) : (
        <ul className="flex flex-col gap-2">
          <li>
            New to Darnwell? <Link href={`/sign-up?invite=${encodeURIComponent(token)}`}>Create your account</Link>.
          </li>
          <li>
            Already have one? <Link href={`/sign-in?next=${encodeURIComponent(here)}`}>Sign in</Link>.
          </li>
        </ul>
      )}
    </>
  );
}
