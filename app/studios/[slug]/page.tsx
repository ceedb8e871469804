import Link from "next/link";
import { notFound } from "next/navigation";
import { buttonClass } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { GARMENT_LABELS } from "@/lib/format";
import { getActor } from "@/lib/server/authz";
import { getStudioBySlug } from "@/lib/server/clients";

export async function generateMetadata({ params }: { params: Promise<{ slug: string }> }) {
  const studio = await getStudioBySlug((await params).slug);
  return { title: studio?.name ?? "Studio not found" };
}

export default async function StudioPublicPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const studio = await getStudioBySlug(slug);
  if (!studio) notFound();
  const actor = await getActor();
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
            {actor ? (
              <Link className={buttonClass()} href="/portal">
                Go to my commissions
              </Link>
            ) : (
              <Link className={buttonClass()} href={`/sign-up?studio=${studio.slug}`}>
                Create an account to request
              </Link>
            )}
          </div>
        </Card>
      </div>
    </article>
  );
}
