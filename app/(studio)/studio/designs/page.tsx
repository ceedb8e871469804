import Link from "next/link";
import { PageTitle } from "@/components/ui/card";
import { listDesignsFor } from "@/lib/server/designs";
import { requireStudioMember } from "@/lib/server/page-guards";

export const metadata = { title: "Designs" };

export default async function DesignsPage() {
  const { actor, membership } = await requireStudioMember("/studio/designs");
  const rows = (await listDesignsFor(actor)).filter((d) => d.studioId === membership.studioId);
  return (
    <>
      <PageTitle title="Designs" lead="Every commission's charts. Start a design from its commission's page." />
      {rows.length === 0 ? (
        <p>No designs yet.</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full text-left">
            <caption className="sr-only">Designs, most recently changed first</caption>
            <thead>
              <tr className="border-b border-bark/30">
                <th scope="col" className="py-2 pr-4">Design</th>
                <th scope="col" className="py-2 pr-4">Version</th>
                <th scope="col" className="py-2 pr-4">State</th>
                <th scope="col" className="py-2">Changed</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((d) => (
                <tr key={d.id} className="border-b border-bark/10">
                  <th scope="row" className="py-2 pr-4 font-normal">
                    <Link href={`/studio/designs/${d.id}`}>{d.title}</Link>
                  </th>
                  <td className="py-2 pr-4">{d.headNumber ?? "–"}</td>
                  <td className="py-2 pr-4">{d.lockedVersionId ? "Approved (locked)" : "In progress"}</td>
                  <td className="py-2">{d.updatedAt.toISOString().slice(0, 10)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </>
  );
}
