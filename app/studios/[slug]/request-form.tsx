"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import { useForm } from "react-hook-form";
import { SignUpForm } from "@/components/auth/sign-up-form";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { CharCount } from "@/components/ui/char-count";
import { useUnsavedChanges } from "@/components/ui/use-unsaved-changes";
import { CautionList } from "@/components/safety/caution-list";
import { WEARER_BANDS, getAgeBand, getCautions, type CautionGarment } from "@/lib/core/safety";
import {
  MAX_REFERENCE_PHOTOS,
  MAX_REQUEST_NOTES,
  MEASUREMENT_LABELS,
  REQUEST_MEASUREMENTS,
  requestSchema,
  type RequestFormValues,
  type RequestInput,
} from "@/lib/schemas/request";
import { ensureRequestDraft, holdRequestForSignUp, saveRequestDraft, submitRequest } from "./actions";

const GARMENT_NAMES: Record<string, string> = { mittens: "Mittens", hat: "Hat", pullover: "Pullover" };
// Labelled in the words of the age bands the cautions go by (lib/core/safety).
const WEARER_ORDER = ["adult", "teen", "child", "baby"] as const;

const DRAFT_FIELD_NAMES: Record<string, string> = {
  garment: "what to knit",
  wearer: "who it is for",
  units: "the units",
  sizeLabel: "the size",
  yarnIds: "the colours",
  colourNotes: "the colour wishes",
  lettering: "the initials or name",
  motifIds: "the motifs",
  neededBy: "the date you need it by",
  budget: "the budget",
  notes: "the notes",
  uploadIds: "the photos",
};
/** A draft field's path ("lettering", "measurements.handLength") in the words the form uses. */
function draftFieldName(path: string): string {
  const [top, sub] = path.split(".");
  if (top === "measurements" && sub) return `the ${(MEASUREMENT_LABELS[sub as keyof typeof MEASUREMENT_LABELS] ?? "measurement").toLowerCase()}`;
  return DRAFT_FIELD_NAMES[top!] ?? "a field";
}

export interface RequestFormProps {
  slug: string;
  studioName: string;
  currency: string;
  makes: string[];
  colours: { id: string; colourName: string; hex: string; fibre: string }[];
  motifs: { id: string; name: string; kind: string }[];
  initial: RequestFormValues;
  initialPhotos: { id: string; thumbUrl: string }[];
  signedIn: boolean;
  heldForSignUp: boolean;
  localInbox: boolean;
}

function ErrorText({ id, message }: { id: string; message?: string }) {
  if (!message) return null;
  return (
    <p id={id} className="text-sm font-semibold text-madder-dark" role="alert">
      {message}
    </p>
  );
}

export function RequestForm(props: RequestFormProps) {
  const router = useRouter();
  const form = useForm<RequestFormValues, unknown, RequestInput>({
    resolver: zodResolver(requestSchema),
    mode: "onBlur",
    defaultValues: props.initial,
  });
  const { register, formState, watch, setValue, setError, handleSubmit } = form;
  const errors = formState.errors;
  const [step, setStep] = useState<"form" | "account">(props.heldForSignUp && !props.signedIn ? "account" : "form");
  const [saved, setSaved] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [photos, setPhotos] = useState(props.initialPhotos);
  const [photoError, setPhotoError] = useState<string | null>(null);
  const [uploading, setUploading] = useState(0);
  const ready = useRef<Promise<unknown> | null>(null);
  const garment = watch("garment");
  const wearer = watch("wearer");
  const units = watch("units");
  const yarnIds = watch("yarnIds");
  const notesLength = (watch("notes") ?? "").length;
  // The chosen colours' fibres; with none chosen yet, every fibre the studio offers.
  const chosen = props.colours.filter((c) => (yarnIds ?? []).includes(c.id));
  const fibres = [...new Set((chosen.length ? chosen : props.colours).map((c) => c.fibre))];
  const cautions = (GARMENT_NAMES[garment] ? getCautions({ garment: garment as CautionGarment, ageBand: getAgeBand({ wearer }), fibres }) : []);

  const draftReady = () => (ready.current ??= ensureRequestDraft(props.slug));

  // Fields the last draft save could not keep (marked on the field; cleared once they read well).
  const draftMarked = useRef<string[]>([]);
  const [unsaved, setUnsaved] = useState(false);
  useUnsavedChanges(unsaved || uploading > 0);

  /** Saves the draft now: every valid field is kept; the invalid ones are marked and named. */
  async function saveDraftNow(values: unknown) {
    setSaved("Saving…");
    setUnsaved(true);
    let r: Awaited<ReturnType<typeof saveRequestDraft>>;
    try {
      await draftReady();
      r = await saveRequestDraft(props.slug, values);
    } catch {
      setSaved("Draft not saved: the connection dropped. It is saved again as soon as you type.");
      return;
    }
    if (r.status !== "ok" || !r.data) {
      setSaved(`Draft not saved: ${r.status === "error" ? r.message : "please try again."}`);
      return;
    }
    const invalid = r.data.invalid;
    for (const path of draftMarked.current) if (!invalid[path]) form.clearErrors(path as keyof RequestFormValues);
    draftMarked.current = Object.keys(invalid);
    for (const [path, msgs] of Object.entries(invalid)) setError(path as keyof RequestFormValues, { type: "draft", message: msgs.join(" ") });
    const names = Object.keys(invalid).map(draftFieldName);
    setUnsaved(names.length > 0);
    setSaved(
      names.length
        ? `Draft saved, except ${names.join(", ")}: ${names.length === 1 ? "it needs" : "they need"} a correction (marked below).`
        : "Draft saved.",
    );
  }

  // Keep a draft on the server while the visitor types (debounced), so nothing is lost.
  useEffect(() => {
    let timer: ReturnType<typeof setTimeout> | undefined;
    const sub = watch((values) => {
      clearTimeout(timer);
      setUnsaved(true);
      timer = setTimeout(() => void saveDraftNow(values), 700);
    });
    return () => {
      clearTimeout(timer);
      sub.unsubscribe();
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [watch, props.slug]);

  async function addPhotos(files: File[]) {
    if (!files.length) return;
    setPhotoError(null);
    await draftReady();
    let list = photos;
    for (const file of files) {
      if (list.length >= MAX_REFERENCE_PHOTOS) {
        setPhotoError(`You can add at most ${MAX_REFERENCE_PHOTOS} photos.`);
        break;
      }
      setUploading((n) => n + 1);
      try {
        const body = new FormData();
        body.append("file", file);
        const res = await fetch(`/api/studios/${props.slug}/request-photos`, { method: "POST", body });
        const json = (await res.json()) as { upload?: { id: string; thumbUrl: string }; error?: { message: string } };
        if (!res.ok || !json.upload) {
          setPhotoError(`${file.name}: ${json.error?.message ?? "the upload failed."}`);
        } else {
          list = [...list, { id: json.upload.id, thumbUrl: json.upload.thumbUrl }];
          setPhotos(list);
          setValue("uploadIds", list.map((p) => p.id), { shouldDirty: true });
          await saveNow();
        }
      } catch {
        setPhotoError(`${file.name}: the upload failed; check your connection and try again.`);
      } finally {
        setUploading((n) => n - 1);
      }
    }
  }

  function removePhoto(id: string) {
    const list = photos.filter((p) => p.id !== id);
    setPhotos(list);
    setValue("uploadIds", list.map((p) => p.id), { shouldDirty: true });
    void saveNow();
  }

  // Photos are not typed fields, so they are saved at once rather than through the watcher.
  async function saveNow() {
    await saveDraftNow(form.getValues());
  }

  const onSubmit = handleSubmit(async (_parsed) => {
    setMessage(null);
    const values = form.getValues();
    const r = props.signedIn ? await submitRequest(props.slug, values) : await holdRequestForSignUp(props.slug, values);
    if (r.status === "error") {
      setMessage(r.message);
      for (const [key, msgs] of Object.entries(r.fieldErrors ?? {})) setError(key as keyof RequestFormValues, { message: msgs.join(" ") });
      return;
    }
    if (r.status === "ok" && r.data && "id" in r.data) {
      router.push(`/portal/commissions/${r.data.id}?requested=1`);
      return;
    }
    setStep("account");
  });

  if (step === "account") {
    return (
      <div className="flex flex-col gap-4">
        <Notice tone="success" title="Your request is kept">
          Create an account so {props.studioName} can reply to you. Once you confirm your e-mail address, your request is sent
          just as you filled it in.
        </Notice>
        <SignUpForm
          callbackURL={`/welcome?studio=${encodeURIComponent(props.slug)}&request=1`}
          studioName={props.studioName}
          localInbox={props.localInbox}
        />
        <p>
          Already have an account?{" "}
          <Link href={`/sign-in?next=${encodeURIComponent(`/studios/${props.slug}#request`)}`}>Sign in</Link> and send it from
          here.
        </p>
        <p>
          <Button variant="quiet" onClick={() => setStep("form")}>
            Back to my request
          </Button>
        </p>
      </div>
    );
  }

  const mErr = (name: string) => (errors.measurements as Record<string, { message?: string }> | undefined)?.[name]?.message;
  const tomorrow = new Date(Date.now() + 86_400_000).toISOString().slice(0, 10);

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-6" aria-label="Request a commission">
      {message ? <Notice tone="error">{message}</Notice> : null}

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-semibold">What would you like knitted?</legend>
        <div className="flex flex-wrap gap-4">
          {props.makes.map((g) => (
            <label key={g} className="flex items-center gap-2">
              <input type="radio" value={g} {...register("garment")} /> {GARMENT_NAMES[g] ?? g}
            </label>
          ))}
        </div>
        <ErrorText id="garment-error" message={errors.garment?.message} />
      </fieldset>

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-semibold">Who is it for?</legend>
        <div className="flex flex-wrap gap-4">
          {WEARER_ORDER.map((w) => (
            <label key={w} className="flex items-center gap-2">
              <input type="radio" value={w} {...register("wearer")} /> {WEARER_BANDS[w].label}
            </label>
          ))}
        </div>
        <CautionList
          cautions={cautions}
          title={wearer === "adult" ? "Good to know" : "Safety notes for this piece"}
          intro="They follow the garment, the wearer and the colours you choose."
        />
      </fieldset>

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1 font-semibold">Size</legend>
        <Field
          label="Size, if you know it"
          hint="For example Woman M, Child 4–6 years. Or give measurements below."
          {...register("sizeLabel")}
          errors={errors.sizeLabel?.message ? [errors.sizeLabel.message] : undefined}
        />
        <div className="flex flex-wrap items-center gap-4" role="radiogroup" aria-label="Units for measurements">
          <span className="text-sm font-semibold">Units:</span>
          <label className="flex items-center gap-2">
            <input type="radio" value="cm" {...register("units")} /> centimetres
          </label>
          <label className="flex items-center gap-2">
            <input type="radio" value="in" {...register("units")} /> inches
          </label>
        </div>
        <div className="grid gap-3 sm:grid-cols-2">
          {(REQUEST_MEASUREMENTS[garment as keyof typeof REQUEST_MEASUREMENTS] ?? []).map((name) => (
            <Field
              key={`${garment}-${name}`}
              label={`${MEASUREMENT_LABELS[name] ?? name} (${units === "in" ? "in" : "cm"})`}
              inputMode="decimal"
              {...register(`measurements.${name}`)}
              errors={mErr(name) ? [mErr(name)!] : undefined}
            />
          ))}
        </div>
      </fieldset>

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-semibold">Colours</legend>
        {props.colours.length ? (
          <div className="flex flex-wrap gap-3">
            {props.colours.map((y) => (
              <label key={y.id} className="flex items-center gap-2 rounded-md border border-bark/30 px-2 py-1">
                <input type="checkbox" value={y.id} {...register("yarnIds")} />
                <span aria-hidden="true" className="inline-block h-4 w-4 rounded-sm border border-bark/40" style={{ background: y.hex }} />
                {y.colourName}
              </label>
            ))}
          </div>
        ) : null}
        <ErrorText id="yarns-error" message={errors.yarnIds?.message} />
        <Field
          label="Colour wishes in your own words"
          hint="Two colours are knitted in; small details in other colours are added by duplicate stitch."
          {...register("colourNotes")}
          errors={errors.colourNotes?.message ? [errors.colourNotes.message] : undefined}
        />
      </fieldset>

      <Field
        label="Initials or a name to knit in"
        hint="Up to 24 characters, for example E.B. or AOIFE."
        {...register("lettering")}
        errors={errors.lettering?.message ? [errors.lettering.message] : undefined}
      />

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-semibold">Motifs you like (up to 4)</legend>
        <div className="flex flex-wrap gap-3">
          {props.motifs.map((m) => (
            <label key={m.id} className="flex items-center gap-2">
              <input type="checkbox" value={m.id} {...register("motifIds")} /> {m.name}
            </label>
          ))}
        </div>
        <ErrorText id="motifs-error" message={errors.motifIds?.message} />
      </fieldset>

      <div className="grid gap-4 sm:grid-cols-2">
        <Field
          label="Needed by (optional)"
          type="date"
          min={tomorrow}
          {...register("neededBy")}
          errors={errors.neededBy?.message ? [errors.neededBy.message] : undefined}
        />
        <Field
          label={`Budget in ${props.currency} (optional)`}
          inputMode="decimal"
          {...register("budget")}
          errors={errors.budget?.message ? [errors.budget.message] : undefined}
        />
      </div>

      <div className="flex flex-col gap-1">
        <label htmlFor="request-notes" className="font-semibold">
          Anything else
        </label>
        <textarea
          id="request-notes"
          rows={4}
          className="rounded-md border border-bark/40 bg-white px-3 py-2"
          aria-invalid={errors.notes ? true : undefined}
          aria-describedby={[notesLength >= 1500 ? "notes-count" : "", errors.notes ? "notes-error" : ""].filter(Boolean).join(" ") || undefined}
          {...register("notes")}
        />
        <CharCount id="notes-count" length={notesLength} max={MAX_REQUEST_NOTES} showFrom={1500} />
        <ErrorText id="notes-error" message={errors.notes?.message} />
      </div>

      <div className="flex flex-col gap-2">
        <label htmlFor="request-photos" className="font-semibold">
          Reference photos (up to {MAX_REFERENCE_PHOTOS}, JPEG, PNG or WebP, 10 MB each)
        </label>
        <p className="text-sm text-bark" id="request-photos-hint">
          Location and camera details are removed from every photo before it is stored.
        </p>
        <input
          id="request-photos"
          type="file"
          accept="image/jpeg,image/png,image/webp"
          multiple
          aria-describedby="request-photos-hint"
          disabled={photos.length >= MAX_REFERENCE_PHOTOS}
          onChange={(e) => {
            // Copy the list first: clearing the input empties the live FileList.
            void addPhotos(Array.from(e.currentTarget.files ?? []));
            e.currentTarget.value = "";
          }}
        />
        {uploading > 0 ? <p role="status">Uploading…</p> : null}
        {photoError ? <Notice tone="error">{photoError}</Notice> : null}
        {photos.length ? (
          <ul className="flex flex-wrap gap-3" aria-label="Photos added">
            {photos.map((p, i) => (
              <li key={p.id} className="flex flex-col items-center gap-1">
                {/* eslint-disable-next-line @next/next/no-img-element */}
                <img src={p.thumbUrl} alt={`Reference photo ${i + 1}`} className="h-24 w-24 rounded-md border border-bark/30 object-cover" />
                <Button variant="quiet" onClick={() => removePhoto(p.id)}>
                  Remove photo {i + 1}
                </Button>
              </li>
            ))}
          </ul>
        ) : null}
      </div>

      <div className="flex flex-wrap items-center gap-4">
        <Button type="submit" disabled={formState.isSubmitting || uploading > 0}>
          {formState.isSubmitting ? "Sending…" : props.signedIn ? "Send my request" : "Continue: create an account"}
        </Button>
        <p className="text-sm text-bark" role="status" aria-live="polite">
          {saved}
        </p>
      </div>
    </form>
  );
}
