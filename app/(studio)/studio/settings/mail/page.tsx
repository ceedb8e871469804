import { notFound } from "next/navigation";
import { Card, PageTitle } from "@/components/ui/card";
import { Notice } from "@/components/ui/notice";
import { can } from "@/lib/server/authz";
import { requireStudioMember } from "@/lib/server/page-guards";
import { listUndeliveredMail } from "@/lib/server/queries/outbox";
import { RetryButton } from "./retry-button";

export const metadata = { title: "Mail that did not go out" };

const fmt = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" });

export default async function MailSettingsPage() {
  const { actor, membership } = await requireStudioMember("/studio/settings/mail");
  if (!can(actor, "studio.settings", membership.studioId)) notFound();
  const rows = await listUndeliveredMail(actor, membership.studioId);
  const failed = rows.filter((r) => r.status === "failed");
  return (
    <>
      <PageTitle
        title="Mail that did not go out"
        lead="Every e-mail waits in an outbox and is retried with growing pauses when the mail server does not take it. Here is what failed after every try, and what is still being retried."
      />
      {rows.length === 0 ? (
        <Notice tone="success" title="All mail delivered">
          Nothing is waiting or failed.
        </Notice>
      ) : (
        <Card>
          <p className="mb-3">
            {failed.length} failed, {rows.length - failed.length} still being retried.
          </p>
          <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Undelivered mail (scrolls sideways)">
            <table className="w-full text-left">
              <caption className="sr-only">Undelivered mail</caption>
              <thead>
                <tr className="border-b border-bark/30">
                  <th scope="col" className="py-2 pr-3">To</th>
                  <th scope="col" className="py-2 pr-3">Subject</th>
                  <th scope="col" className="py-2 pr-3">Status</th>
                  <th scope="col" className="py-2 pr-3">Tries</th>
                  <th scope="col" className="py-2 pr-3">Last error</th>
                  <th scope="col" className="py-2">
                    <span className="sr-only">Action</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {rows.map((r) => (
                  <tr key={r.id} className="border-b border-bark/10 align-top">
                    <td className="py-2 pr-3 break-all">{r.to}</td>
                    <td className="py-2 pr-3">
                      {r.subject}
                      <br />
                      <span className="text-sm text-bark">queued {fmt.format(r.createdAt)} UTC</span>
                    </td>
                    <td className="py-2 pr-3">
                      {r.status === "failed" ? <strong className="text-madder-dark">Failed</strong> : `Retrying (next ${fmt.format(r.nextAttemptAt)} UTC)`}
                    </td>
                    <td className="py-2 pr-3">{r.attempts}</td>
                    <td className="py-2 pr-3 font-mono text-sm break-all">{r.lastError ?? "—"}</td>
                    <td className="py-2">{r.status === "failed" ? <RetryButton id={r.id} subject={r.subject} /> : null}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </Card>
      )}
    </>
  );
}
