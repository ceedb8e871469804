"use client";
// The sizing form of a commission: measurements (or a standard size), ease, the studio's measured
// gauge and the motif repeat. Stitch counts, chart sizes and the recipe follow every keystroke,
// worked out in the browser by the same pure core the server saves with.
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useId, useMemo, useState } from "react";
import { useForm } from "react-hook-form";
import { useUnsavedChanges } from "@/components/ui/use-unsaved-changes";
import { ApiError, api } from "@/components/production/api";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { CautionList } from "@/components/safety/caution-list";
import { getAgeBand, getCautions } from "@/lib/core/safety";
import { EASE_CATEGORIES, MEASUREMENT_SPECS, STANDARD_SIZES, cmToIn, getStandardMeasurements, type SizingResult } from "@/lib/core/sizing";
import { YARN_WEIGHTS, getNeedleSize } from "@/lib/core/yarn";
import { coreGarment, lengthFields, sizeForm, sizingFormSchema, type SizingFormValues } from "@/lib/schemas/sizing";

const words = (key: string) => key.replace(/([a-z])([A-Z0-9])/g, "$1 $2").toLowerCase();
const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
const range = (r: { min: number | null; max: number | null }, unit: string) =>
  r.min === null ? `up to ${r.max} ${unit}` : r.max === null ? `${r.min} ${unit} or more` : `${r.min}–${r.max} ${unit}`;

function sizeRangeText(garment: "mitten" | "hat" | "pullover", key: string): string {
  if (garment === "mitten") {
    const s = STANDARD_SIZES.mitten.sizes.find((x) => x.key === key);
    return s ? `knuckles ${s.knuckleIn.min}–${s.knuckleIn.max} in` : "";
  }
  if (garment === "hat") {
    const s = STANDARD_SIZES.hat.sizes.find((x) => x.key === key);
    return s ? `head ${s.headIn.min}–${s.headIn.max} in` : "";
  }
  const s = STANDARD_SIZES.pullover.sizes.find((x) => x.key === key);
  return s ? `chest ${s.chestIn.min}–${s.chestIn.max} in` : "";
}

function needleText(mm: number | null): string {
  if (mm === null) return "";
  const n = getNeedleSize(mm);
  return `${mm} mm (US ${n.us}, old UK ${n.ukOld})`;
}

/** Converts a typed length between units: to the mm in cm, to 0.01 in in inches. */
function convert(text: string, to: "cm" | "in"): string {
  const t = text.trim().replace(",", ".");
  if (t === "" || !Number.isFinite(Number(t))) return text;
  const v = Number(t);
  return to === "in" ? String(Math.round(cmToIn(v) * 100) / 100) : String(Math.round(v * 25.4) / 10);
}

export function SizingForm(props: {
  commissionId: string;
  garment: "mittens" | "hat" | "pullover";
  wearer: "adult" | "teen" | "child" | "baby";
  /** the fibres of the commission's yarns (or the studio's), for the fibre cautions */
  fibres: string[];
  initial: SizingFormValues;
  saved: boolean;
  canEdit: boolean;
}) {
  const garment = coreGarment(props.garment);
  const router = useRouter();
  const base = useId();
  const form = useForm<SizingFormValues>({ resolver: zodResolver(sizingFormSchema), defaultValues: props.initial });
  const values = form.watch();
  const [status, setStatus] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  const [serverErrors, setServerErrors] = useState<Record<string, string[]>>({});
  const live = useMemo(() => sizeForm(garment, values), [garment, JSON.stringify(values)]); // eslint-disable-line react-hooks/exhaustive-deps
  // Unsaved edits: what the form holds now against what was last saved (as first shown).
  const valuesJson = JSON.stringify(values);
  const [savedJson, setSavedJson] = useState(valuesJson);
  useUnsavedChanges(valuesJson !== savedJson);
  const errorsFor = (name: string): string[] | undefined => serverErrors[name] ?? live.fieldErrors[name];
  const unit = values.unit;
  const sizes = STANDARD_SIZES[garment];

  const submit = form.handleSubmit(async (v) => {
    setStatus(null);
    setServerErrors({});
    const sentJson = JSON.stringify(form.getValues());
    try {
      await api(`/api/commissions/${props.commissionId}/sizing`, { method: "PUT", body: v });
      setSavedJson(sentJson);
      setStatus({ tone: "success", text: "Sizing saved. New designs open at these chart sizes, and the yarn estimate uses them." });
      router.refresh();
    } catch (err) {
      if (err instanceof ApiError && err.fieldErrors) setServerErrors(err.fieldErrors);
      setStatus({ tone: "error", text: (err as Error).message });
    }
  });

  const switchUnit = (to: "cm" | "in") => {
    if (to === values.unit) return;
    for (const { name } of lengthFields(garment)) {
      const t = values.lengths[name];
      if (t) form.setValue(`lengths.${name}`, convert(t, to));
    }
    if (values.ease) form.setValue("ease", convert(values.ease, to));
    form.setValue("unit", to);
  };

  const input = "rounded-md border bg-white px-3 py-2 text-base";
  // A standard size's own value, shown in an empty field so the maker sees what a blank stands for.
  const standard = values.size ? getStandardMeasurements(garment, values.size) : null;
  const standardText = (name: string) => {
    const cm = standard?.[`${name}Cm`];
    if (cm === undefined) return undefined;
    return `${unit === "cm" ? Math.round(cm * 10) / 10 : Math.round(cmToIn(cm) * 100) / 100} (size)`;
  };
  const text = (name: string, label: string, hint?: string, extra: Record<string, unknown> = {}) => {
    const id = `${base}-${name.replace(/\./g, "-")}`;
    const e = errorsFor(name);
    return (
      <div className="flex flex-col gap-1" key={name}>
        <label htmlFor={id} className="font-semibold">{label}</label>
        {hint ? <p id={`${id}-h`} className="text-sm text-bark">{hint}</p> : null}
        <input
          id={id}
          inputMode="decimal"
          disabled={!props.canEdit}
          className={`${input} ${e ? "border-madder" : "border-bark/40"}`}
          aria-invalid={e ? true : undefined}
          aria-describedby={[hint ? `${id}-h` : "", e ? `${id}-e` : ""].filter(Boolean).join(" ") || undefined}
          {...form.register(name as "stitches")}
          {...extra}
        />
        {e ? <p id={`${id}-e`} className="text-sm font-semibold text-madder-dark">{e.join(" ")}</p> : null}
      </div>
    );
  };

  const weight = values.yarnCategory === "" ? null : YARN_WEIGHTS.categories.find((c) => String(c.category) === values.yarnCategory) ?? null;
  // The wearer's band, made stricter by a child's standard size when one is chosen.
  const cautions = getCautions({ garment, ageBand: getAgeBand({ wearer: props.wearer, sizeKey: values.size }), fibres: props.fibres });

  return (
    <div className="grid gap-6 lg:grid-cols-2">
      <form onSubmit={submit} noValidate className="flex min-w-0 flex-col gap-5" aria-labelledby={`${base}-form`}>
        <h2 id={`${base}-form`} className="text-xl">Measurements, ease and gauge</h2>
        {status ? <Notice tone={status.tone}>{status.text}</Notice> : null}
        {!props.canEdit ? <Notice tone="info">You can look at the sizing; only the studio's makers change it.</Notice> : null}

        <fieldset className="flex flex-col gap-3">
          <legend className="mb-1 text-lg">Size</legend>
          <div className="flex flex-col gap-1">
            <label htmlFor={`${base}-size`} className="font-semibold">Standard size</label>
            <p id={`${base}-size-h`} className="text-sm text-bark">Measurements typed below take the place of the size&apos;s own. Source: {sizes.source}.</p>
            <select id={`${base}-size`} aria-describedby={`${base}-size-h`} disabled={!props.canEdit} className={`${input} w-full max-w-full border-bark/40`} {...form.register("size")}>
              <option value="">None: use the measurements</option>
              {sizes.sizes.map((s) => (
                <option key={s.key} value={s.key}>{s.label} ({sizeRangeText(garment, s.key)})</option>
              ))}
            </select>
            {errorsFor("size") ? <p className="text-sm font-semibold text-madder-dark">{errorsFor("size")!.join(" ")}</p> : null}
          </div>
          <div role="radiogroup" aria-label="Units" className="flex gap-4">
            {(["cm", "in"] as const).map((u) => (
              <label key={u} className="flex items-center gap-2">
                <input type="radio" name={`${base}-unit`} checked={unit === u} disabled={!props.canEdit} onChange={() => switchUnit(u)} />
                {u === "cm" ? "Centimetres" : "Inches"}
              </label>
            ))}
          </div>
          <div className="grid gap-3 sm:grid-cols-2">
            {lengthFields(garment).map(({ name, kind }) => {
              const spec = MEASUREMENT_SPECS[name as keyof typeof MEASUREMENT_SPECS];
              const label = `${cap(spec.noun)} (${unit})${kind === "required" ? "" : kind === "optional" ? ", optional" : ", garment length, optional"}`;
              const fromSize = standardText(name);
              return text(`lengths.${name}`, label, spec.how, fromSize ? { placeholder: fromSize } : {});
            })}
          </div>
        </fieldset>

        <fieldset className="flex flex-col gap-3">
          <legend className="mb-1 text-lg">Ease</legend>
          <div className="flex flex-wrap gap-4">
            {([["default", "The usual for this garment"], ["category", "A fit category"], ["value", `A measured amount (${unit})`]] as const).map(([v, l]) => (
              <label key={v} className="flex items-center gap-2">
                <input type="radio" value={v} disabled={!props.canEdit} {...form.register("easeMode")} />
                {l}
              </label>
            ))}
          </div>
          {values.easeMode === "category" ? (
            <div className="flex flex-col gap-1">
              <label htmlFor={`${base}-ease-cat`} className="font-semibold">Fit</label>
              <select id={`${base}-ease-cat`} disabled={!props.canEdit} className={`${input} w-full max-w-full border-bark/40`} {...form.register("easeCategory")}>
                {EASE_CATEGORIES.categories.map((c) => (
                  <option key={c.key} value={c.key}>{c.label}: {range(c.rangeCm, "cm")} ({range(c.rangeIn, "in")})</option>
                ))}
              </select>
            </div>
          ) : null}
          {values.easeMode === "value" ? text("ease", `Ease (${unit})`, "Added to the body measurement; negative for a garment smaller than the body, as hats usually are.") : null}
          {errorsFor("ease") && values.easeMode !== "value" ? <p className="text-sm font-semibold text-madder-dark">{errorsFor("ease")!.join(" ")}</p> : null}
          <table className="text-sm">
            <caption className="text-left text-bark">Ease categories for body garments. Source: {EASE_CATEGORIES.source}.</caption>
            <thead>
              <tr><th scope="col" className="pr-3 text-left">Fit</th><th scope="col" className="pr-3 text-left">cm</th><th scope="col" className="text-left">in</th></tr>
            </thead>
            <tbody>
              {EASE_CATEGORIES.categories.map((c) => (
                <tr key={c.key}><th scope="row" className="pr-3 text-left font-normal">{c.label}</th><td className="pr-3">{range(c.rangeCm, "cm")}</td><td>{range(c.rangeIn, "in")}</td></tr>
              ))}
            </tbody>
          </table>
        </fieldset>

        <fieldset className="flex flex-col gap-3">
          <legend className="mb-1 text-lg">Gauge, yarn and repeat</legend>
          <div className="flex flex-col gap-1">
            <label htmlFor={`${base}-over`} className="font-semibold">Gauge measured over</label>
            <select id={`${base}-over`} disabled={!props.canEdit} className={`${input} w-full max-w-full border-bark/40`} {...form.register("gaugeOver")}>
              <option value="10cm">10 cm</option>
              <option value="4in">4 in</option>
            </select>
          </div>
          <div className="grid gap-3 sm:grid-cols-2">
            {text("stitches", `Stitches over ${values.gaugeOver === "10cm" ? "10 cm" : "4 in"}`, "Counted on the washed, blocked swatch, in the stranded pattern.")}
            {text("rows", `Rounds over ${values.gaugeOver === "10cm" ? "10 cm" : "4 in"}`, "Leave empty to assume relaxed plain-knit proportions.")}
          </div>
          <div className="flex flex-col gap-1">
            <label htmlFor={`${base}-weight`} className="font-semibold">Yarn weight</label>
            <p id={`${base}-weight-h`} className="text-sm text-bark">The gauge is checked against the category. Source: {YARN_WEIGHTS.source}.</p>
            <select id={`${base}-weight`} aria-describedby={`${base}-weight-h`} disabled={!props.canEdit} className={`${input} w-full max-w-full border-bark/40`} {...form.register("yarnCategory")}>
              <option value="">Not given</option>
              {YARN_WEIGHTS.categories.map((c) => (
                <option key={c.category} value={String(c.category)}>
                  {c.category} {c.name} ({c.typicalYarns.join(", ")}): {range(c.stitchesPer10cm, "sts")} per 10 cm
                </option>
              ))}
            </select>
            {weight ? (
              <p className="text-sm">
                Needles for {weight.name}: {[needleText(weight.needleMm.min), needleText(weight.needleMm.max)].filter(Boolean).join(" to ")}.
              </p>
            ) : null}
          </div>
          {text("repeat", "Motif repeat (stitches)", "The cast-on is a whole number of repeats. Leave empty for none.", { inputMode: "numeric" })}
          {garment === "mitten" ? (
            <div className="flex flex-col gap-1">
              <label htmlFor={`${base}-thumb`} className="font-semibold">Thumb</label>
              <select id={`${base}-thumb`} disabled={!props.canEdit} className={`${input} w-full max-w-full border-bark/40`} {...form.register("thumb")}>
                <option value="gusset">Gusset</option>
                <option value="afterthought">Afterthought (waste-yarn) thumb</option>
              </select>
            </div>
          ) : null}
          {garment === "pullover" ? (
            <div className="flex flex-col gap-1">
              <label htmlFor={`${base}-style`} className="font-semibold">Colourwork</label>
              <select id={`${base}-style`} disabled={!props.canEdit} className={`${input} w-full max-w-full border-bark/40`} {...form.register("style")}>
                <option value="yoke">Round yoke</option>
                <option value="bands">Bands on body and sleeves</option>
              </select>
              <label className="flex items-start gap-2">
                <input type="checkbox" className="mt-1" disabled={!props.canEdit} {...form.register("backNeckShortRows")} />
                <span>Raise the back neck with short rows (about 2.5 cm, worked below the neckband)</span>
              </label>
            </div>
          ) : null}
          {garment === "hat" ? (
            <div className="flex flex-col gap-1">
              <label htmlFor={`${base}-hat-style`} className="font-semibold">Style</label>
              <p id={`${base}-hat-style-h`} className="text-sm text-bark">Taller and folded hats use the Craft Yarn Council hat heights (child 8½ in, teen 10, woman 11, man 11½).</p>
              <select id={`${base}-hat-style`} aria-describedby={`${base}-hat-style-h`} disabled={!props.canEdit} className={`${input} w-full max-w-full border-bark/40`} {...form.register("style")}>
                <option value="beanie">Fitted beanie</option>
                <option value="tall">Taller, with some slouch</option>
                <option value="folded-brim">Folded brim</option>
              </select>
            </div>
          ) : null}
        </fieldset>
        {errorsFor("form") ? <Notice tone="error">{errorsFor("form")!.join(" ")}</Notice> : null}
        {props.canEdit ? (
          <div>
            <Button type="submit" disabled={form.formState.isSubmitting}>{props.saved ? "Save the sizing" : "Save this sizing"}</Button>
          </div>
        ) : null}
      </form>

      <section aria-labelledby={`${base}-out`} aria-live="polite" className="flex min-w-0 flex-col gap-4">
        <h2 id={`${base}-out`} className="text-xl">What to knit</h2>
        <CautionList cautions={cautions} title="Cautions for this piece" />
        {live.result ? <SizingOutput result={live.result} unit={unit} /> : <p className="text-bark">Fill in the fields marked above to see the stitch counts.</p>}
      </section>
    </div>
  );
}

function SizingOutput({ result, unit }: { result: SizingResult; unit: "cm" | "in" }) {
  const len = (l: { cm: number; in: number }) => (unit === "cm" ? `${l.cm} cm (${l.in} in)` : `${l.in} in (${l.cm} cm)`);
  const [first, second] = unit === "cm" ? [result.recipe.metric, result.recipe.imperial] : [result.recipe.imperial, result.recipe.metric];
  return (
    <>
      <p className="text-2xl" data-testid="sizing-cast-on">
        Cast on <strong>{result.castOn}</strong> sts
      </p>
      {result.warnings.length ? (
        <Notice tone="info" title="Worth a look">
          <ul className="list-disc pl-5">
            {result.warnings.map((w) => <li key={w}>{cap(w)}</li>)}
          </ul>
        </Notice>
      ) : null}
      <table className="text-sm">
        <caption className="text-left font-semibold">Stitch counts and rounds</caption>
        <tbody>
          {Object.entries(result.counts).map(([k, v]) => (
            <tr key={`c-${k}`}><th scope="row" className="pr-3 text-left font-normal">{cap(words(k))}</th><td>{v} sts</td></tr>
          ))}
          {Object.entries(result.rows).map(([k, v]) => (
            <tr key={`r-${k}`}><th scope="row" className="pr-3 text-left font-normal">{cap(words(k))}</th><td>{v} rnds</td></tr>
          ))}
          <tr>
            <th scope="row" className="pr-3 text-left font-normal">Ease</th>
            <td>
              {result.ease.cm > 0 ? "+" : ""}
              {len(result.ease)}
              {result.ease.percent !== null ? ` (${result.ease.percent} %)` : ""}
            </td>
          </tr>
          {Object.entries(result.finished).map(([k, v]) => (
            <tr key={`f-${k}`}><th scope="row" className="pr-3 text-left font-normal">Finished {words(k)}</th><td>{len(v)}</td></tr>
          ))}
        </tbody>
      </table>
      <table className="text-sm" aria-label="Chart sizes">
        <caption className="text-left font-semibold">Charts the design needs</caption>
        <thead>
          <tr><th scope="col" className="pr-3 text-left">Area</th><th scope="col" className="pr-3 text-left">Stitches × rounds</th><th scope="col" className="text-left">Note</th></tr>
        </thead>
        <tbody>
          {result.charts.map((c) => (
            <tr key={`${c.piece}-${c.area}`}>
              <th scope="row" className="pr-3 text-left font-normal">{cap(c.area)}</th>
              <td className="pr-3">{c.width} × {c.height}{c.repeats > 1 ? `, ${c.repeats} times around` : ""}</td>
              <td>{c.note}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <div>
        <h3 className="text-lg">Recipe ({unit === "cm" ? "metric" : "imperial"})</h3>
        <ol className="list-decimal pl-5" data-testid="sizing-recipe">
          {first.map((l, i) => <li key={i}>{l}</li>)}
        </ol>
        <details className="mt-2">
          <summary>The same in {unit === "cm" ? "inches" : "centimetres"}</summary>
          <ol className="list-decimal pl-5">
            {second.map((l, i) => <li key={i}>{l}</li>)}
          </ol>
        </details>
      </div>
      <details className="text-sm text-bark">
        <summary>Sources and rules used</summary>
        <ul className="list-disc pl-5">
          {result.sources.map((s) => <li key={s}>{s}</li>)}
        </ul>
      </details>
    </>
  );
}
