"use client";
// The client's answer to a quote: accept (name typed) or ask for changes. Typed text is kept on errors.
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { idleState, type ActionState } from "@/lib/action-state";
import { acceptQuoteAction, requestChangesAction } from "./money-actions";

export function QuoteAnswerForms({ quoteId, deposit }: { quoteId: string; deposit: string }) {
  const [accept, runAccept, accepting] = useActionState<ActionState<{ quoteId: string }>, FormData>(acceptQuoteAction, idleState);
  const [changes, runChanges, asking] = useActionState<ActionState<{ quoteId: string }>, FormData>(requestChangesAction, idleState);
  const aErr = accept.status === "error" ? accept : null;
  const cErr = changes.status === "error" ? changes : null;
  return (
    <div className="mt-4 grid gap-6 md:grid-cols-2">
      <form action={runAccept} aria-label="Accept the quote" className="flex flex-col gap-3">
        <h3 className="text-lg">Accept</h3>
        <input type="hidden" name="quoteId" value={quoteId} />
        <Field label="Your full name" name="name" autoComplete="name" defaultValue={aErr?.values?.name ?? ""} errors={aErr?.fieldErrors?.name} />
        <label className="flex items-start gap-2">
          <input type="checkbox" name="agree" className="mt-1" defaultChecked={aErr?.values?.agree === "on"} aria-describedby={aErr?.fieldErrors?.agree ? "agree-error" : undefined} />
          <span>I accept this quote. A deposit of {deposit} books the work; the balance is due when it is ready.</span>
        </label>
        {aErr?.fieldErrors?.agree ? (
          <p id="agree-error" role="alert" className="text-sm font-semibold text-madder-dark">
            {aErr.fieldErrors.agree.join(" ")}
          </p>
        ) : null}
        {aErr && !aErr.fieldErrors ? <Notice tone="error">{aErr.message}</Notice> : null}
        {accept.status === "ok" ? <Notice tone="success">{accept.message}</Notice> : null}
        <div>
          <Button type="submit" disabled={accepting}>
            Accept the quote
          </Button>
        </div>
      </form>
      <form action={runChanges} aria-label="Ask for changes" className="flex flex-col gap-3">
        <h3 className="text-lg">Ask for changes</h3>
        <input type="hidden" name="quoteId" value={quoteId} />
        <div className="flex flex-col gap-1">
          <label htmlFor="changes" className="font-semibold">
            What would you like changed?
          </label>
          <textarea
            id="changes"
            name="changes"
            rows={3}
            className="rounded-md border border-bark/40 px-3 py-2"
            defaultValue={cErr?.values?.changes ?? ""}
            aria-invalid={cErr?.fieldErrors?.changes ? true : undefined}
            aria-describedby={cErr?.fieldErrors?.changes ? "changes-error" : undefined}
          />
          {cErr?.fieldErrors?.changes ? (
            <p id="changes-error" role="alert" className="text-sm font-semibold text-madder-dark">
              {cErr.fieldErrors.changes.join(" ")}
            </p>
          ) : null}
        </div>
        {cErr && !cErr.fieldErrors ? <Notice tone="error">{cErr.message}</Notice> : null}
        {changes.status === "ok" ? <Notice tone="success">{changes.message}</Notice> : null}
        <div>
          <Button type="submit" variant="secondary" disabled={asking}>
            Send my note
          </Button>
        </div>
      </form>
    </div>
  );
}
