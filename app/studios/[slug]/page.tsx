import Link from "next/link";
import { cookies } from "next/headers";
import { notFound } from "next/navigation";
import { buttonClass } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { MOTIFS, getMotifKind } from "@/lib/core/chart/motifs";
import { usesLocalMail } from "@/lib/env";
import { GARMENT_LABELS } from "@/lib/format";
import { MAX_REFERENCE_PHOTOS, emptyRequest, requestFields, type RequestFormValues } from "@/lib/schemas/request";
import { getActor } from "@/lib/server/authz";
import { getStudioBySlug } from "@/lib/server/clients";
import { draftCookieName, listStudioColours, loadDraft } from "@/lib/server/requests";
import { RequestForm } from "./request-form";

export async function generateMetadata({ params }: { params: Promise<{ slug: string }> }) {
  const studio = await getStudioBySlug((await params).slug);
  return { title: studio?.name ?? "Studio not found" };
}

export default async function StudioPublicPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const studio = await getStudioBySlug(slug);
  if (!studio) notFound();
  const actor = await getActor();
  const isMember = Boolean(actor?.memberships.some((m) => m.studioId === studio.id));
  const draft = await loadDraft(studio.id, (await cookies()).get(draftCookieName(studio.slug))?.value);
  const firstMake = (studio.makes[0] ?? "mittens") as RequestFormValues["garment"];
  // Restore each field of the draft that still reads as valid; the rest starts empty.
  const initial: RequestFormValues = { ...emptyRequest(firstMake) };
  for (const [k, v] of Object.entries(draft?.data ?? {})) {
    const field = requestFields.shape[k as keyof typeof requestFields.shape];
    if (field && field.safeParse(v).success) (initial as Record<string, unknown>)[k] = v;
  }
  // The photos the form last listed; when no save has listed them yet, the ones this draft uploaded.
  const listed = draft?.data.uploadIds ? (initial.uploadIds ?? []) : (draft?.uploadIds.slice(-MAX_REFERENCE_PHOTOS) ?? []);
  const photoIds = listed.filter((id) => draft?.uploadIds.includes(id));
  initial.uploadIds = photoIds;
  const colours = await listStudioColours(studio.id);
  return (
    <article>
      <header className="mb-8">
        <h1 className="text-4xl" style={{ color: studio.brandHex }}>
          {studio.name}
        </h1>
        <p className="mt-2 text-xl text-bark">{studio.tagline}</p>
      </header>
      <div className="grid gap-6 md:grid-cols-[2fr_1fr]">
        <Card>
          <h2 className="mb-2 text-xl">About the studio</h2>
          <p className="max-w-prose">{studio.about}</p>
          <h2 className="mb-2 mt-6 text-xl">What we make</h2>
          <ul className="list-inside list-disc">
            {studio.makes.map((m) => (
              <li key={m}>{GARMENT_LABELS[m] ?? m}, with your initials or a name knitted in</li>
            ))}
          </ul>
        </Card>
        <Card>
          <h2 className="mb-2 text-xl">Commission a piece</h2>
          <p>
            Current lead time: about <strong>{studio.leadTimeWeeks} weeks</strong> from your approval of the chart.
          </p>
          <p className="mt-2 text-sm text-bark">
            You will get a quote with a deposit, then a proof of your chart to approve before we knit a stitch.
          </p>
          <div className="mt-4">
            {isMember ? (
              <Link className={buttonClass()} href="/studio">
                Go to the studio
              </Link>
            ) : (
              <a className={buttonClass()} href="#request">
                Fill in a request
              </a>
            )}
          </div>
        </Card>
      </div>
      {isMember ? null : (
        <Card className="mt-6">
          <h2 id="request" className="mb-1 scroll-mt-6 text-2xl">
            Request a commission
          </h2>
          <p className="mb-5 max-w-prose text-bark">
            {actor
              ? "Tell us what you would like. Your answers are kept as you type, so you can come back later."
              : "Tell us what you would like. Your answers are kept as you type; at the end you create an account so we can reply, and nothing you entered is lost."}
          </p>
          <RequestForm
            slug={studio.slug}
            studioName={studio.name}
            currency={studio.currency}
            makes={studio.makes}
            colours={colours.map((c) => ({ id: c.id, colourName: c.colourName, hex: c.hex, fibre: c.fibre }))}
            motifs={MOTIFS.map((m) => ({ id: m.id, name: m.name, kind: getMotifKind(m) }))}
            initial={initial}
            initialPhotos={photoIds.map((id) => ({ id, thumbUrl: `/api/uploads/${id}?size=thumb` }))}
            signedIn={Boolean(actor)}
            heldForSignUp={Boolean(draft?.data.submitted)}
            localInbox={usesLocalMail()}
          />
        </Card>
      )}
    </article>
  );
}
