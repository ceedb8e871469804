"use client";
import { useActionState, useRef, startTransition } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { GuardRailNote } from "@/components/quotes/guard-rail-note";
import { errorsOf, useZodForm } from "@/components/auth/use-zod-form";
import { idleState, type ActionState } from "@/lib/action-state";
import { getGuardRailWarnings } from "@/lib/core/pricing/guard-rails";
import { settingsFormSchema } from "@/lib/schemas/settings-form";
import { taxRateWarning } from "@/lib/schemas/tax-settings";
import { saveSettingsAction } from "./actions";

const RATE_LABELS: Record<string, string> = {
  designBaseMinutes: "Design: minutes per new design",
  minutesPerProofRound: "Design: minutes per proof round",
  plainStitchesPerMinute: "Knitting: plain stitches per minute",
  strandedStitchesPerMinute: "Knitting: stranded stitches per minute",
  minutesPerShapingRound: "Knitting: minutes per shaping round",
  minutesPerThumb: "Knitting: minutes per thumb",
  secondsPerFloatCatch: "Knitting: seconds per float catch",
  secondsPerDuplicateStitch: "Embroidery: seconds per duplicate stitch",
  minutesPerEnd: "Embroidery: minutes per end woven in",
  secondsPerCarryCm: "Embroidery: seconds per cm of carry",
  blockingMinutesPerPiece: "Blocking: hands-on minutes per piece",
  dryingHoursPerPiece: "Blocking: drying hours per piece (calendar, not labour)",
  finishingMinutesPerPiece: "Finishing and packing: minutes per piece",
};

export function SettingsForm({ currency, defaults, rates }: { currency: string; defaults: Record<string, string>; rates: { key: string; basis: string; note: string }[] }) {
  const schema = settingsFormSchema(currency);
  const form = useZodForm(schema, defaults as never);
  const ref = useRef<HTMLFormElement>(null);
  const [state, run, pending] = useActionState<ActionState<{ saved: boolean }>, FormData>(saveSettingsAction, idleState);
  const e = form.formState.errors as Record<string, { message?: string } | undefined>;
  const server = state.status === "error" ? state.fieldErrors : undefined;
  const errs = (name: string) => errorsOf(e[name]) ?? server?.[name];
  const onSubmit = form.handleSubmit(() => {
    const fd = new FormData(ref.current!);
    startTransition(() => run(fd));
  });
  return (
    <form ref={ref} onSubmit={onSubmit} noValidate aria-label="Studio settings" className="flex flex-col gap-6">
      {state.status === "error" ? <Notice tone="error">{state.message}</Notice> : null}
      {state.status === "ok" ? <Notice tone="success">{state.message}</Notice> : null}
      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-xl">Prices</legend>
        <Field label={`Hourly rate (${currency})`} inputMode="decimal" {...form.register("hourlyRate")} errors={errs("hourlyRate")} />
        <div className="flex flex-col gap-1">
          <label htmlFor="pricePolicy" className="font-semibold">
            Labour figure that prices a quote
          </label>
          <select id="pricePolicy" aria-describedby="pricePolicy-help" className="rounded-md border border-bark/40 bg-white px-3 py-2" {...form.register("pricePolicy")}>
            <option value="p80">Cautious (P80: four jobs in five finish within it), the default</option>
            <option value="p50">Typical (P50: half finish within it)</option>
          </select>
          <p id="pricePolicy-help" className="text-sm text-bark">
            A new studio charges the cautious figure until it chooses. Every quote, its PDF and the client&apos;s page say which figure it charges. The
            cautious margin per stage comes from your calibration once you accept one (Insights), otherwise P50 × 1.25.
          </p>
        </div>
        <Field label={`Design fee (${currency})`} inputMode="decimal" {...form.register("designFee")} errors={errs("designFee")} />
        <Field label="Quotes are valid for (days)" inputMode="numeric" {...form.register("quoteValidDays")} errors={errs("quoteValidDays")} />
      </fieldset>
      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-xl">Tax and deposit</legend>
        <Field
          label="Tax rate (%)"
          hint={taxRateWarning(String(form.watch("taxRatePercent") ?? "")) ?? "The standard rate; other categories are set below."}
          inputMode="decimal"
          {...form.register("taxRatePercent")}
          errors={errs("taxRatePercent")}
        />
        <div className="flex flex-col gap-1">
          <label htmlFor="pricesIncludeTax" className="font-semibold">
            Prices
          </label>
          <select id="pricesIncludeTax" className="rounded-md border border-bark/40 bg-white px-3 py-2" {...form.register("pricesIncludeTax")}>
            <option value="yes">include tax</option>
            <option value="no">exclude tax (tax added on top)</option>
          </select>
        </div>
        <Field
          label="Deposit (% of the total)"
          hint={<GuardRailNote field="depositPercent" warnings={getGuardRailWarnings({ depositPercent: form.watch("depositPercent") as string | undefined })} />}
          inputMode="decimal"
          {...form.register("depositPercent")}
          errors={errs("depositPercent")}
        />
        <Field
          label="Deposit refunded if cancelled before knitting (%)"
          hint="Once knitting starts the deposit is kept; from blocking on, the full price."
          inputMode="decimal"
          {...form.register("depositRefundBeforeKnittingPercent")}
          errors={errs("depositRefundBeforeKnittingPercent")}
        />
      </fieldset>
      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-xl">Labour rates</legend>
        <p className="text-sm text-bark sm:col-span-2">Hand-knitting speeds vary widely: none of these is a standard. Each starting value says where it comes from.</p>
        {rates.map((r) => (
          <Field
            key={r.key}
            label={RATE_LABELS[r.key] ?? r.key}
            hint={`Starting value: ${r.basis}. ${r.note}`}
            inputMode="decimal"
            {...form.register(`rate_${r.key}` as never)}
            errors={errs(`rate_${r.key}`)}
          />
        ))}
      </fieldset>
      <div>
        <Button type="submit" disabled={pending}>
          Save settings
        </Button>
      </div>
    </form>
  );
}
