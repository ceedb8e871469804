"use client";
// A PDF download that shows it is working: the file is fetched (which can take a couple of
// seconds while the server draws it), then saved under the server's file name. A refusal shows
// the server's words instead of a broken download.
import { useState } from "react";
import { buttonClass } from "./button";
import { Spinner } from "./skeleton";

function fileNameOf(res: Response, fallback: string): string {
  const m = /filename="([^"]+)"/.exec(res.headers.get("content-disposition") ?? "");
  return m?.[1] ?? fallback;
}

export function PdfDownload({ href, label, fallbackName = "document.pdf" }: { href: string; label: string; fallbackName?: string }) {
  const [state, setState] = useState<{ kind: "idle" } | { kind: "working" } | { kind: "error"; message: string }>({ kind: "idle" });
  const working = state.kind === "working";

  const download = async (e: React.MouseEvent<HTMLAnchorElement>) => {
    // Modified clicks (new tab, save link as) keep the plain link.
    if (e.metaKey || e.ctrlKey || e.shiftKey || e.altKey || e.button !== 0) return;
    e.preventDefault();
    if (working) return;
    setState({ kind: "working" });
    try {
      const res = await fetch(href, { cache: "no-store" });
      if (!res.ok) {
        const body = (await res.json().catch(() => ({}))) as { error?: { message?: string } };
        setState({ kind: "error", message: body.error?.message ?? `The PDF could not be made (${res.status}).` });
        return;
      }
      const url = URL.createObjectURL(await res.blob());
      const a = document.createElement("a");
      a.href = url;
      a.download = fileNameOf(res, fallbackName);
      document.body.appendChild(a);
      a.click();
      a.remove();
      setTimeout(() => URL.revokeObjectURL(url), 10_000);
      setState({ kind: "idle" });
    } catch {
      setState({ kind: "error", message: "The PDF could not be fetched: the connection dropped. Try again." });
    }
  };

  return (
    <span className="inline-flex flex-wrap items-center gap-2">
      <a className={buttonClass("secondary")} href={href} onClick={(e) => void download(e)} aria-busy={working} aria-disabled={working}>
        {working ? <Spinner /> : null}
        {label}
      </a>
      <span role="status" aria-live="polite" className="text-sm text-bark" data-testid="pdf-progress">
        {working ? "Preparing the PDF…" : state.kind === "error" ? <span className="font-semibold text-madder-dark">{state.message}</span> : ""}
      </span>
    </span>
  );
}
