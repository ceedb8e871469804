import { headers } from "next/headers";
import { notFound } from "next/navigation";
import { PageTitle } from "@/components/ui/card";
import { env } from "@/lib/env";
import { requestClientAddress } from "@/lib/server/client-address";
import { localInboxRefusal } from "@/lib/server/local-inbox-gate";

export const dynamic = "force-dynamic";
export const metadata = { title: "Local inbox" };

interface Caught {
  id: string;
  receivedAt: string;
  to: string;
  subject: string;
  text: string;
  links: string[];
}

// Exists only while mail goes to the local mail service (the default of `npm start`), the app runs on
// a loopback address and the request comes from this machine (lib/server/local-inbox-gate.ts).
export default async function LocalInbox() {
  const h = await headers();
  const api = env.LOCAL_MAIL_API;
  if (!api || localInboxRefusal({ localMailApi: api, appUrl: env.BETTER_AUTH_URL, client: requestClientAddress(h), host: h.get("host") })) notFound();
  let messages: Caught[] = [];
  let failed = false;
  try {
    const res = await fetch(`${api}/messages`, { cache: "no-store" });
    messages = (await res.json()) as Caught[];
  } catch {
    failed = true;
  }
  return (
    <>
      <PageTitle
        title="Local inbox"
        lead="Every e-mail Darnwell sent while it runs with the local mail service, newest first. With a real mail server configured this page does not exist."
      />
      {failed ? <p role="alert">The local mail service does not answer. Is `npm start` still running?</p> : null}
      {messages.length === 0 && !failed ? <p>No mail yet.</p> : null}
      <ul className="flex flex-col gap-4">
        {messages.map((m) => (
          <li key={m.id} className="rounded-lg border border-bark/20 bg-white p-4">
            <p className="font-semibold">{m.subject}</p>
            <p className="text-sm text-bark">
              To {m.to} · {new Date(m.receivedAt).toLocaleString("en-GB", { timeZone: "UTC" })} UTC
            </p>
            <details className="mt-2">
              <summary className="cursor-pointer">Show the message</summary>
              <pre className="mt-2 whitespace-pre-wrap font-sans text-sm">{m.text}</pre>
            </details>
            {m.links.length ? (
              <ul className="mt-2 flex flex-col gap-1">
                {m.links.map((l) => (
                  <li key={l}>
                    <a href={l} className="break-all">
                      {l}
                    </a>
                  </li>
                ))}
              </ul>
            ) : null}
          </li>
        ))}
      </ul>
    </>
  );
}
