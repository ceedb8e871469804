import { Card, PageTitle } from "@/components/ui/card";
import { can } from "@/lib/server/authz";
import { requireStudioMember } from "@/lib/server/page-guards";
import { getTeam } from "@/lib/server/queries/team";
import { InviteForm } from "./invite-form";

export const metadata = { title: "Team" };

export default async function TeamPage() {
  const { actor, membership } = await requireStudioMember("/studio/team");
  const team = await getTeam(actor, membership.studioId);
  const owner = can(actor, "studio.team", membership.studioId);
  return (
    <>
      <PageTitle title="Team" lead="The owner sets prices and takes payments; assistants knit, darn, finish and log their hours." />
      <div className="grid gap-6 md:grid-cols-2">
        <Card>
          <h2 className="mb-3 text-xl">Members</h2>
          <ul className="flex flex-col gap-2">
            {team.members.map((m) => (
              <li key={m.id}>
                <span className="font-semibold">{m.name}</span> · {m.email} · {m.role === "owner" ? "Owner" : "Assistant"}
              </li>
            ))}
          </ul>
          {team.pending.length ? (
            <>
              <h3 className="mb-2 mt-5 text-lg">Invited</h3>
              <ul className="flex flex-col gap-1">
                {team.pending.map((p) => (
                  <li key={p.id}>
                    {p.email} <span className="text-sm text-bark">(until {p.expiresAt.toISOString().slice(0, 10)})</span>
                  </li>
                ))}
              </ul>
            </>
          ) : null}
        </Card>
        <Card>
          <h2 className="mb-3 text-xl">Invite an assistant</h2>
          {owner ? <InviteForm /> : <p className="text-bark">Only the studio owner can invite people.</p>}
        </Card>
      </div>
    </>
  );
}
