"use client";
// Tax categories (standard, reduced, zero-rated, exempt) with the studio's own labels, the default
// category per kind of quote line, and the seller details printed on invoices.
import { useActionState, useRef, startTransition } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { errorsOf, useZodForm } from "@/components/auth/use-zod-form";
import { idleState, type ActionState } from "@/lib/action-state";
import { taxRateWarning, taxSettingsFormSchema } from "@/lib/schemas/tax-settings";
import { saveTaxSettingsAction } from "./tax-actions";

const KINDS: [string, string][] = [
  ["labour", "Labour"],
  ["material", "Materials (yarn, buttons)"],
  ["design", "Design fee"],
  ["rush", "Rush fee"],
  ["fee", "Extras and fees"],
  ["shipping", "Shipping"],
];

const select = "rounded-md border border-bark/40 bg-white px-3 py-2";

export function TaxSettingsForm({ defaults }: { defaults: Record<string, string> }) {
  const form = useZodForm(taxSettingsFormSchema, defaults as never);
  const ref = useRef<HTMLFormElement>(null);
  const [state, run, pending] = useActionState<ActionState<{ saved: boolean; warnings: string[] }>, FormData>(saveTaxSettingsAction, idleState);
  const e = form.formState.errors as Record<string, { message?: string } | undefined>;
  const server = state.status === "error" ? state.fieldErrors : undefined;
  const errs = (name: string) => errorsOf(e[name]) ?? server?.[name];
  const standardRate = form.watch("standardRate" as never) as unknown as string | undefined;
  const reducedRate = form.watch("reducedRate" as never) as unknown as string | undefined;
  const onSubmit = form.handleSubmit(() => {
    const fd = new FormData(ref.current!);
    startTransition(() => run(fd));
  });
  const warn = (v: string | undefined) => (v ? taxRateWarning(v) : null);
  return (
    <form ref={ref} onSubmit={onSubmit} noValidate aria-label="Tax categories and invoice details" className="mt-10 flex flex-col gap-6">
      {state.status === "error" ? <Notice tone="error">{state.message}</Notice> : null}
      {state.status === "ok" ? <Notice tone="success">{state.message}</Notice> : null}
      {state.status === "ok" && state.data.warnings.length ? <Notice tone="caution">{state.data.warnings.join(" ")}</Notice> : null}
      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-xl">Tax categories</legend>
        <p className="text-sm text-bark sm:col-span-2">
          Each line of a quote carries a category. Zero-rated and exempt are both 0 % but are shown apart on invoices (in the UK, young children&apos;s clothing is
          zero-rated: VAT Notice 714). Leave a label empty if you do not use that category. Follow the rules where you sell.
        </p>
        <Field label="Standard rate: label" {...form.register("standardLabel" as never)} errors={errs("standardLabel")} />
        <Field label="Standard rate (%)" inputMode="decimal" hint={warn(standardRate) ?? undefined} {...form.register("standardRate" as never)} errors={errs("standardRate")} />
        <Field label="Reduced rate: label" {...form.register("reducedLabel" as never)} errors={errs("reducedLabel")} />
        <Field label="Reduced rate (%)" inputMode="decimal" hint={warn(reducedRate) ?? undefined} {...form.register("reducedRate" as never)} errors={errs("reducedRate")} />
        <Field label="Zero-rated: label (0 %)" hint="e.g. Zero-rated (young children's clothing)" {...form.register("zeroLabel" as never)} errors={errs("zeroLabel")} />
        <Field label="Exempt: label (no tax)" {...form.register("exemptLabel" as never)} errors={errs("exemptLabel")} />
      </fieldset>
      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 text-xl">Default category per kind of line</legend>
        {KINDS.map(([k, label]) => (
          <div key={k} className="flex flex-col gap-1">
            <label htmlFor={`default_${k}`} className="font-semibold">
              {label}
            </label>
            <select id={`default_${k}`} className={select} aria-describedby={errs(`default_${k}`) ? `default_${k}-error` : undefined} {...form.register(`default_${k}` as never)}>
              <option value="standard">Standard</option>
              <option value="reduced">Reduced</option>
              <option value="zero">Zero-rated</option>
              <option value="exempt">Exempt</option>
            </select>
            {errs(`default_${k}`) ? (
              <p id={`default_${k}-error`} className="text-sm font-semibold text-madder-dark" role="alert">
                {errs(`default_${k}`)!.join(" ")}
              </p>
            ) : null}
          </div>
        ))}
      </fieldset>
      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-xl">Seller details on invoices</legend>
        <Field label="Legal name (if not the studio name)" {...form.register("legalName" as never)} errors={errs("legalName")} />
        <Field label="VAT / tax registration number" {...form.register("taxNumber" as never)} errors={errs("taxNumber")} />
        <Field label="Address" className="sm:col-span-2" {...form.register("address" as never)} errors={errs("address")} />
      </fieldset>
      <div>
        <Button type="submit" disabled={pending}>
          Save tax and invoice details
        </Button>
      </div>
    </form>
  );
}
