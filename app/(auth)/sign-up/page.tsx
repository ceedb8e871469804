import Link from "next/link";
import { SignUpForm } from "@/components/auth/sign-up-form";
import { PageTitle } from "@/components/ui/card";
import { usesLocalMail } from "@/lib/env";
import { safeNext } from "@/lib/schemas/auth";
import { getStudioBySlug } from "@/lib/server/clients";
import { lookupInvitation } from "@/lib/server/invitations";

export const metadata = { title: "Create an account" };

export default async function SignUpPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const sp = await searchParams;
  const studio = sp.studio ? await getStudioBySlug(sp.studio) : null;
  const invitation = sp.invite ? await lookupInvitation(sp.invite) : null;
  const params = new URLSearchParams();
  if (studio) params.set("studio", studio.slug);
  if (sp.next) params.set("next", safeNext(sp.next));
  const callbackURL = invitation?.status === "valid" ? `/invitations/${sp.invite}` : `/welcome${params.size ? `?${params}` : ""}`;
  return (
    <>
      <PageTitle
        title="Create an account"
        lead={
          invitation?.status === "valid"
            ? `You are joining ${invitation.studioName} as an assistant.`
            : studio
              ? `Create an account to commission work from ${studio.name} and follow it from chart to parcel.`
              : "Create an account to follow your commissions, approve proofs and pay securely."
        }
      />
      <SignUpForm
        callbackURL={callbackURL}
        presetEmail={invitation?.status === "valid" ? invitation.email : undefined}
        studioName={studio?.name}
        localInbox={usesLocalMail()}
      />
      <p className="mt-6">
        Already have an account? <Link href="/sign-in">Sign in</Link>.
      </p>
    </>
  );
}
