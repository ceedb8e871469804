// The commission page's Sizing card: the saved cast-on and charts at the studio's gauge, or a start.
import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import type { Actor } from "@/lib/server/authz";
import { getCommissionSizing, sizedCommission } from "@/lib/server/sizing";

export async function SizingSection({ actor, commissionId }: { actor: Actor; commissionId: string }) {
  const { commission, values, saved } = await getCommissionSizing(actor, commissionId);
  const result = saved ? sizedCommission({ garment: commission.garment, sizing: values }) : null;
  const href = `/studio/commissions/${commissionId}/sizing`;
  return (
    <Card className="mt-6">
      <h2 className="mb-3 text-xl">Sizing</h2>
      {result ? (
        <div className="flex flex-col gap-2">
          <p>
            Cast on {result.castOn} sts at {Math.round(result.gauge.stitchesPer10cm * 10) / 10} sts and {Math.round(result.gauge.rowsPer10cm * 10) / 10} rnds per 10 cm
            {result.size ? `, size ${result.size}` : ""}; finished {(() => {
              const main = result.finished.circumference ?? result.finished.handCircumference ?? result.finished.chest;
              return main ? `${main.cm} cm (${main.in} in) around` : "to the measurements";
            })()}.
          </p>
          <p className="text-sm text-bark">Charts: {result.charts.map((c) => `${c.area} ${c.width} × ${c.height}`).join("; ")}.</p>
          <p>
            <Link className={buttonClass("secondary")} href={href}>Sizing and recipe</Link>
          </p>
        </div>
      ) : (
        <p className="flex flex-wrap items-center gap-3">
          <span>Not worked out yet: stitch counts and chart sizes come from the measurements and your swatch gauge.</span>
          <Link className={buttonClass("secondary")} href={href}>Work out the sizing</Link>
        </p>
      )}
    </Card>
  );
}
