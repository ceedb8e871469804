import { CommissionTable } from "@/components/commission/commission-table";
import { PageTitle } from "@/components/ui/card";
import { ListFilter, matchesSearch, searchParam } from "@/components/ui/list-filter";
import { ACTIVE_STATES, STATE_LABELS, type CommissionState } from "@/lib/core/workflow/states";
import { requireStudioMember } from "@/lib/server/page-guards";
import { listCommissionsFor } from "@/lib/server/queries/commissions";

export const metadata = { title: "Studio" };

export default async function StudioHome({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { actor, membership } = await requireStudioMember("/studio");
  const sp = await searchParams;
  const q = searchParam(sp.q);
  const stateParam = searchParam(sp.state);
  const state = stateParam in STATE_LABELS ? (stateParam as CommissionState) : "";
  const all = await listCommissionsFor(actor, { studioId: membership.studioId });
  // Search by client, number or title; filter by state (the list itself stays in the URL).
  const rows = all.filter((r) => (!state || r.state === state) && matchesSearch(q.replace(/^#/, ""), r.title, r.clientName, r.number));
  const active = rows.filter((r) => (ACTIVE_STATES as readonly string[]).includes(r.state));
  const other = rows.filter((r) => !(ACTIVE_STATES as readonly string[]).includes(r.state));
  const filtered = q !== "" || state !== "";
  return (
    <>
      <PageTitle
        title="Commissions"
        lead={`${active.length} open, ${other.length} paused or finished${filtered ? ` (of ${all.length}, filtered)` : ""}. Soonest needed first.`}
      />
      <ListFilter
        action="/studio"
        label="Find commissions"
        q={q}
        placeholder="Client, number or title"
        select={{
          name: "state",
          label: "Status",
          value: state,
          options: [{ value: "", label: "Any status" }, ...Object.entries(STATE_LABELS).map(([value, label]) => ({ value, label }))],
        }}
      />
      {filtered && rows.length === 0 ? <p className="mb-6">No commission matches; try fewer words or any status.</p> : null}
      <h2 className="mb-3 text-xl">Open</h2>
      <CommissionTable rows={active} hrefFor={(id) => `/studio/commissions/${id}`} show="client" caption="Open commissions" />
      <h2 className="mb-3 mt-10 text-xl">Paused and finished</h2>
      <CommissionTable rows={other} hrefFor={(id) => `/studio/commissions/${id}`} show="client" caption="Paused and finished commissions" />
    </>
  );
}
