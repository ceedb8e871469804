"use client";
// A commission's message thread, fetched with react-query from app/api. Sending is optimistic; each
// message carries a key made here, so "Try again" after a failed answer is stored once.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import type { Thread, ThreadMessage } from "@/lib/schemas/messages";

interface Outgoing {
  body: string;
  clientKey: string;
  attachments: { id: string; thumbUrl: string }[];
}

const newKey = () =>
  typeof crypto !== "undefined" && "randomUUID" in crypto ? crypto.randomUUID() : `k${Date.now().toString(36)}${Math.random().toString(36).slice(2, 10)}`;

async function readError(res: Response, fallback: string): Promise<string> {
  try {
    const json = (await res.json()) as { error?: { message?: string; fieldErrors?: Record<string, string[]> } };
    return json.error?.fieldErrors?.body?.[0] ?? json.error?.message ?? fallback;
  } catch {
    return fallback;
  }
}

const timeFmt = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

function MessageItem({ m, state, onRetry }: { m: Pick<ThreadMessage, "body" | "authorName" | "mine" | "createdAt" | "attachments">; state?: "sending" | "failed"; onRetry?: () => void }) {
  return (
    <li className={`flex flex-col gap-1 rounded-lg border p-3 ${m.mine ? "ml-6 border-loch/30 bg-loch/5" : "mr-6 border-bark/20 bg-white"}`}>
      <p className="text-sm text-bark">
        <span className="font-semibold text-peat">{m.mine ? "You" : m.authorName}</span> · <time dateTime={m.createdAt}>{timeFmt.format(new Date(m.createdAt))}</time>
        {state === "sending" ? " · sending…" : null}
      </p>
      {m.body ? <p className="whitespace-pre-wrap">{m.body}</p> : null}
      {m.attachments.length ? (
        <ul className="flex flex-wrap gap-2" aria-label="Photos">
          {m.attachments.map((a, i) => (
            <li key={a.id}>
              <a href={a.url}>
                {/* eslint-disable-next-line @next/next/no-img-element */}
                <img src={a.thumbUrl} alt={`Photo ${i + 1} from ${m.mine ? "you" : m.authorName}`} className="h-20 w-20 rounded-md border border-bark/30 object-cover" />
              </a>
            </li>
          ))}
        </ul>
      ) : null}
      {state === "failed" ? (
        <div className="flex flex-wrap items-center gap-2">
          <span className="text-sm font-semibold text-madder-dark">Not sent.</span>
          <Button variant="quiet" onClick={onRetry}>
            Try again
          </Button>
        </div>
      ) : null}
    </li>
  );
}

export function MessageThread({ commissionId, as }: { commissionId: string; as: "studio" | "client" }) {
  const qc = useQueryClient();
  const key = ["messages", commissionId, as];
  const url = `/api/commissions/${commissionId}/messages?as=${as}`;
  const thread = useQuery({
    queryKey: key,
    queryFn: async (): Promise<Thread> => {
      const res = await fetch(url, { cache: "no-store" });
      if (!res.ok) throw new Error(await readError(res, "The messages could not be loaded."));
      return (await res.json()) as Thread;
    },
    refetchInterval: 20_000,
  });
  const [body, setBody] = useState("");
  const [attachments, setAttachments] = useState<{ id: string; thumbUrl: string }[]>([]);
  const [uploading, setUploading] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const [sending, setSending] = useState<Outgoing[]>([]);
  const [failed, setFailed] = useState<Outgoing[]>([]);

  const send = useMutation({
    mutationFn: async (m: Outgoing) => {
      const res = await fetch(url, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ body: m.body, clientKey: m.clientKey, uploadIds: m.attachments.map((a) => a.id) }),
      });
      if (!res.ok) throw new Error(await readError(res, "The message was not sent."));
      return m;
    },
    onMutate: (m) => {
      setFailed((list) => list.filter((x) => x.clientKey !== m.clientKey));
      setSending((list) => [...list, m]);
    },
    onError: (err, m) => {
      setFailed((list) => [...list, m]);
      setFormError((err as Error).message);
    },
    onSettled: async (_d, _e, m) => {
      await qc.invalidateQueries({ queryKey: key });
      setSending((list) => list.filter((x) => x.clientKey !== m.clientKey));
    },
  });

  async function attach(files: File[]) {
    if (!files.length) return;
    setFormError(null);
    setUploading(true);
    try {
      for (const file of files.slice(0, 6 - attachments.length)) {
        const data = new FormData();
        data.append("file", file);
        const res = await fetch(`/api/commissions/${commissionId}/uploads?kind=message&as=${as}`, { method: "POST", body: data });
        if (!res.ok) {
          setFormError(`${file.name}: ${await readError(res, "the upload failed.")}`);
          continue;
        }
        const json = (await res.json()) as { upload: { id: string; thumbUrl: string } };
        setAttachments((list) => [...list, { id: json.upload.id, thumbUrl: json.upload.thumbUrl }]);
      }
    } finally {
      setUploading(false);
    }
  }

  function submit(e: React.FormEvent) {
    e.preventDefault();
    setFormError(null);
    if (!body.trim() && !attachments.length) {
      setFormError("Write a message or attach a photo.");
      return;
    }
    send.mutate({ body: body.trim(), clientKey: newKey(), attachments });
    setBody("");
    setAttachments([]);
  }

  const known = new Set((thread.data?.messages ?? []).map((m) => m.clientKey));
  const now = new Date().toISOString();
  const pendingView = (list: Outgoing[]) =>
    list
      .filter((m) => !known.has(m.clientKey))
      .map((m) => ({ m, view: { body: m.body, authorName: "You", mine: true, createdAt: now, attachments: m.attachments.map((a) => ({ ...a, url: a.thumbUrl, width: 0, height: 0 })) } }));

  return (
    <div className="flex flex-col gap-4">
      {thread.isPending ? <p role="status">Loading messages…</p> : null}
      {thread.isError ? (
        <Notice tone="error" title="The messages could not be loaded">
          {thread.error.message}{" "}
          <Button variant="quiet" onClick={() => void thread.refetch()}>
            Try again
          </Button>
        </Notice>
      ) : null}
      {thread.data ? (
        <>
          {thread.data.unread > 0 ? (
            <p className="font-semibold" role="status">
              {thread.data.unread} new message{thread.data.unread === 1 ? "" : "s"} since you last looked.
            </p>
          ) : null}
          <ol className="flex flex-col gap-3" aria-label="Messages" aria-live="polite">
            {thread.data.messages.length === 0 && !sending.length && !failed.length ? <li className="text-bark">No messages yet.</li> : null}
            {thread.data.messages.map((m) => (
              <MessageItem key={m.id} m={m} />
            ))}
            {pendingView(sending).map(({ m, view }) => (
              <MessageItem key={`s-${m.clientKey}`} m={view} state="sending" />
            ))}
            {pendingView(failed).map(({ m, view }) => (
              <MessageItem key={`f-${m.clientKey}`} m={view} state="failed" onRetry={() => send.mutate(m)} />
            ))}
          </ol>
        </>
      ) : null}
      <form onSubmit={submit} className="flex flex-col gap-2" aria-label="Write a message">
        <label htmlFor={`msg-${commissionId}`} className="font-semibold">
          Your message
        </label>
        <textarea id={`msg-${commissionId}`} rows={3} maxLength={4000} value={body} onChange={(e) => setBody(e.target.value)} className="rounded-md border border-bark/40 px-2 py-2" />
        <label htmlFor={`msg-photo-${commissionId}`} className="text-sm font-semibold">
          Attach photos (JPEG, PNG or WebP, up to 10 MB; location data is removed)
        </label>
        <input id={`msg-photo-${commissionId}`} type="file" accept="image/jpeg,image/png,image/webp" multiple onChange={(e) => { void attach(Array.from(e.currentTarget.files ?? [])); e.currentTarget.value = ""; }} />
        {uploading ? <p role="status">Uploading…</p> : null}
        {attachments.length ? (
          <ul className="flex flex-wrap gap-2" aria-label="Photos to send">
            {attachments.map((a, i) => (
              <li key={a.id}>
                {/* eslint-disable-next-line @next/next/no-img-element */}
                <img src={a.thumbUrl} alt={`Photo ${i + 1} to send`} className="h-16 w-16 rounded-md border border-bark/30 object-cover" />
              </li>
            ))}
          </ul>
        ) : null}
        {formError ? <Notice tone="error">{formError}</Notice> : null}
        <div>
          <Button type="submit" disabled={uploading}>
            Send message
          </Button>
        </div>
      </form>
    </div>
  );
}
