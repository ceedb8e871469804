"use client";
// A piece's labour features after set-up: the maker corrects them (a design changed, more darning
// than planned) and the stage estimates follow, with the studio's rates, on the server.
import { zodResolver } from "@hookform/resolvers/zod";
import { useQueryClient } from "@tanstack/react-query";
import { useId, useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { pieceFeaturesEditSchema } from "@/lib/schemas/production";
import { FEATURE_FIELDS } from "@/components/quotes/feature-fields";
import { api, ApiError } from "./api";

const schema = pieceFeaturesEditSchema.shape.features;
type In = z.input<typeof schema>;
type Out = z.output<typeof schema>;

export function PieceFeaturesForm(props: { pieceId: string; initial: Record<string, number | boolean>; canEdit: boolean }) {
  const base = useId();
  const qc = useQueryClient();
  const [status, setStatus] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(schema), defaultValues: schema.safeParse(props.initial).data ?? schema.parse({}) });
  const errs = form.formState.errors;

  const submit = form.handleSubmit(async (features) => {
    setStatus(null);
    try {
      await api(`/api/production/pieces/${props.pieceId}`, { method: "PATCH", body: { features } });
      setStatus({ tone: "success", text: "Saved. The stage estimates above are worked out again from these." });
      await qc.invalidateQueries({ queryKey: ["production"] });
    } catch (err) {
      if (err instanceof ApiError && err.fieldErrors) {
        for (const [k, m] of Object.entries(err.fieldErrors)) form.setError(k.replace(/^features\./, "") as keyof In, { message: m.join(" ") });
      }
      setStatus({ tone: "error", text: (err as Error).message });
    }
  });

  return (
    <section aria-labelledby={`${base}-h`} className="mt-6 rounded-lg border border-bark/20 bg-white p-4">
      <h2 id={`${base}-h`} className="mb-1 text-xl">What the estimate counts</h2>
      <p className="mb-3 text-sm text-bark">Correct these when the piece turns out different from its set-up; logged hours stay as they are.</p>
      {status ? <Notice tone={status.tone}>{status.text}</Notice> : null}
      <form onSubmit={submit} noValidate className="mt-2 grid gap-3 sm:grid-cols-3">
        {FEATURE_FIELDS.map((f) => {
          const id = `${base}-${f.key}`;
          const e = errs[f.key]?.message;
          return (
            <div key={f.key} className="flex flex-col gap-1">
              <label htmlFor={id} className="font-semibold">{f.label}</label>
              <input
                id={id}
                type="number"
                min={0}
                step={f.step ?? "1"}
                disabled={!props.canEdit}
                className={`rounded-md border bg-white px-3 py-2 ${e ? "border-madder" : "border-bark/40"}`}
                aria-invalid={e ? true : undefined}
                aria-describedby={e ? `${id}-e` : undefined}
                {...form.register(f.key, { valueAsNumber: true })}
              />
              {e ? <p id={`${id}-e`} className="text-sm font-semibold text-madder-dark">{String(e)}</p> : null}
            </div>
          );
        })}
        <label className="flex items-center gap-2 self-end">
          <input type="checkbox" disabled={!props.canEdit} {...form.register("newDesign")} /> A new design (first of its kind)
        </label>
        <label className="flex items-center gap-2 self-end">
          <input type="checkbox" disabled={!props.canEdit} {...form.register("blocked")} /> Wet-blocked
        </label>
        {props.canEdit ? (
          <div className="sm:col-span-3">
            <Button type="submit" disabled={form.formState.isSubmitting}>Save the features</Button>
          </div>
        ) : null}
      </form>
    </section>
  );
}
