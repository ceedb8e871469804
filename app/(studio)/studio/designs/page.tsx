import Link from "next/link";
import { PageTitle } from "@/components/ui/card";
import { ListFilter, matchesSearch, searchParam } from "@/components/ui/list-filter";
import { listDesignsFor } from "@/lib/server/designs";
import { requireStudioMember } from "@/lib/server/page-guards";

export const metadata = { title: "Designs" };

export default async function DesignsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { actor, membership } = await requireStudioMember("/studio/designs");
  const sp = await searchParams;
  const q = searchParam(sp.q);
  const status = ["locked", "open"].includes(searchParam(sp.status)) ? searchParam(sp.status) : "";
  const all = (await listDesignsFor(actor)).filter((d) => d.studioId === membership.studioId);
  const rows = all.filter((d) => matchesSearch(q, d.title) && (!status || (status === "locked") === Boolean(d.lockedVersionId)));
  return (
    <>
      <PageTitle title="Designs" lead="Every commission's charts. Start a design from its commission's page." />
      {all.length > 0 ? (
        <ListFilter
          action="/studio/designs"
          label="Find designs"
          q={q}
          placeholder="Title"
          select={{
            name: "status",
            label: "State",
            value: status,
            options: [
              { value: "", label: "Any state" },
              { value: "open", label: "In progress" },
              { value: "locked", label: "Approved (locked)" },
            ],
          }}
        />
      ) : null}
      {rows.length === 0 ? (
        <p>{all.length === 0 ? "No designs yet." : "No design matches; try fewer words or any state."}</p>
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
