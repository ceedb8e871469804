import Link from "next/link";
import { buttonClass } from "@/components/ui/button";

export default function Landing() {
  return (
    <div className="flex flex-col gap-10">
      <section className="max-w-3xl">
        <h1 className="text-4xl leading-tight sm:text-5xl">Personalised knitwear, from request to parcel.</h1>
        <p className="mt-4 text-xl text-bark">
          Darnwell is where a small knitting studio turns a client’s wish — mittens with initials, a hat with a band of
          stars — into a chart, a price with a deposit, an approved proof, logged hours and a paid invoice.
        </p>
        <div className="mt-6 flex flex-wrap gap-3">
          <Link className={buttonClass()} href="/sign-in">
            Sign in
          </Link>
          <Link className={buttonClass("secondary")} href="/studios/hollin-knitworks">
            Visit a studio
          </Link>
        </div>
      </section>
      <section aria-labelledby="how" className="grid gap-6 sm:grid-cols-2 lg:grid-cols-4">
        <h2 id="how" className="sr-only">
          How it works
        </h2>
        {[
          ["Request", "The client describes the piece, the size and the letters to knit in."],
          ["Quote", "Stitch counts, yarn and hours per stage become a price and a deposit."],
          ["Proof", "The client approves the chart at its true size before knitting starts."],
          ["Make", "Knitting, duplicate stitch, blocking and finishing, with real hours logged."],
        ].map(([t, d]) => (
          <div key={t} className="rounded-lg border border-bark/20 bg-white p-5">
            <h3 className="text-xl">{t}</h3>
            <p className="mt-2 text-bark">{d}</p>
          </div>
        ))}
      </section>
    </div>
  );
}
