"use client";
// The quote builder: every change is priced at once in the browser by the same pure core the
// server uses (composeQuote), with a note of what changed since the last saved version.
import { useRouter } from "next/navigation";
import { useEffect, useMemo, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { CharCount } from "@/components/ui/char-count";
import { useUnsavedChanges } from "@/components/ui/use-unsaved-changes";
import { fieldErrorsOf, MAX_QUOTE_MESSAGE, quoteDraftSchema } from "@/lib/schemas/quotes";
import { quoteBuilderFieldName } from "./quote-field-names";
import { GuardRailNote } from "./guard-rail-note";
import { getGuardRailWarnings } from "@/lib/core/pricing/guard-rails";
import { DesignYarnPanel, type DesignYarnPanelData } from "./design-yarn-panel";
import { FEATURE_FIELDS } from "./feature-fields";
import type { PieceFeatures } from "@/lib/core/labour/piece-features";
import { composeQuote, type QuoteDraft, type QuotePolicy } from "@/lib/core/pricing/compose-quote";
import { isProviderCurrency, withProviderDeposit } from "@/lib/core/pricing/provider-currency";
import { diffQuotes } from "@/lib/core/pricing/diff-quotes";
import { explainChange } from "@/lib/core/pricing/explain-change";
import { formatMoney, minorToDecimalString } from "@/lib/core/pricing/format-money";
import { labourLevelForStudio, labourLevelNote } from "@/lib/core/pricing/labour-level";
import { majorToMinor } from "@/lib/schemas/money";
import { formatRatePpm, type TaxCategory } from "@/lib/core/pricing/tax";
import { formatMinutes } from "@/lib/core/production/time-entries";

interface YarnOption {
  id: string;
  name: string;
  colourName: string;
  priceMinor: number;
}

type MoneyText = { designFee: string; shipping: string; discount: string; rushFee: string; extras: { label: string; amount: string; taxCategory?: TaxCategory | null }[] };

/** A line's tax category: "" follows the studio's default for that kind of line. */
function TaxCategorySelect(props: { id: string; label: string; value: TaxCategory | null | undefined; policy: QuotePolicy; onChange: (v: TaxCategory | null) => void }) {
  const cats = props.policy.taxCategories ?? [];
  if (!cats.length) return null;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={props.id} className="font-semibold">
        {props.label}
      </label>
      <select id={props.id} className="rounded-md border border-bark/40 bg-white px-3 py-2" value={props.value ?? ""} onChange={(e) => props.onChange((e.target.value || null) as TaxCategory | null)}>
        <option value="">Studio default</option>
        {cats.map((c) => (
          <option key={c.id} value={c.id}>
            {c.label ?? c.id}
          </option>
        ))}
      </select>
    </div>
  );
}
/** What the builder holds as typed (kept on this device until saved). */
interface BuilderState {
  pieces: PieceFeatures[];
  materials: { yarnId: string; skeins: number; taxCategory?: TaxCategory | null }[];
  money: MoneyText;
  requestedDate: string;
  earliestDate: string;
  validUntil: string;
  message: string;
}
/** the money text boxes → the field names the server reports on */
const MONEY_FIELD: Record<string, string> = { designFee: "designFeeMinor", shipping: "shippingMinor", discount: "discountMinor", rushFee: "rushFeeMinor" };

export function QuoteBuilder(props: {
  commissionId: string;
  policy: QuotePolicy;
  yarns: YarnOption[];
  initial: QuoteDraft;
  /** the last saved or sent version's draft, to say what changed */
  baseline: QuoteDraft | null;
  initialValidUntil: string;
  initialMessage: string;
  featuresFromDesign: boolean;
  /** where the garment's pieces come from (lib/server/garment.ts): sizing source, stand-in note, charts left off */
  garment?: { sizedFrom: string; note: string | null; problems: string | null };
  /** yarn per studio yarn from the design the quote prices (lib/server/design-yarn.ts) */
  yarnEstimate?: DesignYarnPanelData | null;
  /** the schedule's earliest promise date for this garment (lib/server/schedule.ts) */
  scheduleEarliest?: string | null;
}) {
  const { policy } = props;
  const cur = policy.currency;
  const toText = (minor: number | null | undefined) => (minor ? minorToDecimalString(minor, cur) : "");
  const router = useRouter();
  const [pieces, setPieces] = useState<PieceFeatures[]>(props.initial.pieces);
  const [materials, setMaterials] = useState<{ yarnId: string; skeins: number; taxCategory?: TaxCategory | null }[]>(
    props.initial.materials.map((m) => ({ yarnId: m.yarnId, skeins: m.skeins, taxCategory: m.taxCategory ?? null })),
  );
  const [labourTaxCategory, setLabourTaxCategory] = useState<TaxCategory | null>(props.initial.labourTaxCategory ?? null);
  const [money, setMoney] = useState<MoneyText>({
    designFee: toText(props.initial.designFeeMinor),
    shipping: toText(props.initial.shippingMinor),
    discount: toText(props.initial.discountMinor),
    rushFee: toText(props.initial.rushFeeMinor),
    extras: props.initial.extras.map((e) => ({ label: e.label, amount: toText(e.amountMinor), taxCategory: e.taxCategory ?? null })),
  });
  const [requestedDate, setRequestedDate] = useState(props.initial.requestedDate ?? "");
  const [earliestDate, setEarliestDate] = useState(props.initial.earliestDate ?? "");
  const [validUntil, setValidUntil] = useState(props.initialValidUntil);
  const [message, setMessage] = useState(props.initialMessage);
  const [status, setStatus] = useState<{ tone: "error" | "success"; text: string; fieldErrors?: Record<string, string[]> } | null>(null);
  const [busy, setBusy] = useState(false);
  /** a quote kept on this device that was never saved, offered back once */
  const [kept, setKept] = useState<{ at: string; state: BuilderState } | null>(null);
  const formRef = useRef<HTMLFormElement>(null);

  const parse = (text: string) => (text.trim() === "" ? 0 : majorToMinor(text, cur));
  const moneyErrors: Record<string, string> = {};
  for (const [k, v] of [["designFee", money.designFee], ["shipping", money.shipping], ["discount", money.discount], ["rushFee", money.rushFee]] as const) {
    if (parse(v) === null) moneyErrors[k] = "Enter an amount like 12 or 12.50.";
  }
  money.extras.forEach((e, i) => {
    if (parse(e.amount) === null) moneyErrors[`extras.${i}.amountMinor`] = "Enter an amount like 4 or 4.50.";
  });

  const yarnById = useMemo(() => new Map(props.yarns.map((y) => [y.id, y])), [props.yarns]);
  // What the server will check, checked here first with the same schema: the live price waits for it.
  const body = { ...draftBody(), materials, validUntil: validUntil || null, messageToClient: message };
  const checked = quoteDraftSchema.safeParse(body);
  const clientErrors: Record<string, string[]> = checked.success ? {} : fieldErrorsOf(checked.error);
  for (const [k, v] of Object.entries(moneyErrors)) clientErrors[MONEY_FIELD[k] ?? k] = [v];
  const inputReady = Object.keys(clientErrors).length === 0;

  function draftBody(): QuoteDraft {
    return {
      pieces,
      materials: materials
        .filter((m) => yarnById.has(m.yarnId))
        .map((m) => {
          const y = yarnById.get(m.yarnId)!;
          return { yarnId: y.id, label: `${y.name}, ${y.colourName} (skeins)`, skeins: m.skeins, unitPriceMinor: y.priceMinor, taxCategory: m.taxCategory ?? null };
        }),
      extras: money.extras.map((e) => ({ label: e.label, amountMinor: parse(e.amount) ?? 0, taxCategory: e.taxCategory ?? null })),
      labourTaxCategory,
      designFeeMinor: parse(money.designFee) ?? 0,
      shippingMinor: parse(money.shipping) ?? 0,
      discountMinor: parse(money.discount) ?? 0,
      requestedDate: requestedDate || null,
      earliestDate: earliestDate || null,
      rushFeeMinor: money.rushFee.trim() ? (parse(money.rushFee) ?? null) : null,
    };
  }
  const draft = draftBody();

  let preview: ReturnType<typeof composeQuote> | null = null;
  let previewError: string | null = null;
  // The deposit as the server will store it: fitted to what the payment provider can charge.
  let depositNote: string | null = null;
  // Nothing is priced until every field reads correctly (no "£15.7 M" from a half-typed count).
  if (inputReady) {
    try {
      preview = composeQuote(draft, policy);
      const fitted = withProviderDeposit(preview.quote);
      preview = { ...preview, quote: fitted.quote };
      depositNote = fitted.note;
      if (fitted.problem && isProviderCurrency(preview.quote.currency)) previewError = fitted.problem;
    } catch (err) {
      previewError = (err as Error).message;
      // A pricing refusal that belongs to one field (the discount) is shown on it.
      const field = (err as { field?: string }).field;
      if (field) clientErrors[field] = [previewError];
    }
  }
  let changeNote: string | null = null;
  let diffNote: string | null = null;
  if (preview && props.baseline) {
    try {
      changeNote = explainChange(props.baseline.pieces, pieces, {
        currency: cur,
        hourlyRateMinor: policy.hourlyRateMinor,
        rates: policy.rates,
        labourPolicy: policy.labourPolicy,
      }).text;
      diffNote = diffQuotes(composeQuote(props.baseline, policy).quote, preview.quote).summary;
    } catch {
      changeNote = null;
    }
  }
  const m = (n: number) => formatMoney(n, cur);
  // A typed rush fee above the labour it speeds up is allowed, with a word (lib/core/pricing/guard-rails.ts).
  const typedRushMinor = money.rushFee.trim() ? parse(money.rushFee) : null;
  const labourMinor = preview ? preview.quote.lines.filter((l) => l.kind === "labour").reduce((sum, l) => sum + l.amountMinor, 0) : null;
  const depositWarnings = preview ? getGuardRailWarnings({ depositPpm: preview.quote.depositPpm }) : [];
  const rushWarnings = typedRushMinor !== null && labourMinor !== null ? getGuardRailWarnings({ rushFee: { feeMinor: typedRushMinor, labourMinor } }) : [];

  const setFeature = (i: number, key: keyof PieceFeatures, value: string | boolean) =>
    setPieces((ps) => ps.map((p, j) => (j === i ? { ...p, [key]: typeof value === "boolean" ? value : value === "" ? 0 : Math.max(0, Number(value)) } : p)));

  // The state as typed, to tell unsaved changes and to keep a copy on this device.
  const state: BuilderState = { pieces, materials, money, requestedDate, earliestDate, validUntil, message };
  const stateJson = JSON.stringify(state);
  const [savedJson, setSavedJson] = useState(stateJson);
  const dirty = stateJson !== savedJson;
  useUnsavedChanges(dirty);
  const keepKey = `darnwell:quote-draft:${props.commissionId}`;
  // Offer back a quote left unsaved on this device (once, on opening).
  useEffect(() => {
    try {
      const raw = window.localStorage.getItem(keepKey);
      if (!raw) return;
      const k = JSON.parse(raw) as { at: string; state: BuilderState };
      const st = k?.state;
      // Only a copy of the shape this builder keeps (an older or damaged one is dropped).
      const usable =
        typeof k?.at === "string" && Array.isArray(st?.pieces) && st.pieces.length > 0 && Array.isArray(st.materials) &&
        Array.isArray(st.money?.extras) && typeof st.message === "string" && typeof st.validUntil === "string";
      if (usable && JSON.stringify(k.state) !== savedJson) setKept(k);
      else window.localStorage.removeItem(keepKey);
    } catch {
      /* storage unavailable or unreadable: nothing to offer */
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);
  // Keep every unsaved change on this device, so a closed tab or a crash loses nothing.
  useEffect(() => {
    if (!dirty || kept) return;
    const t = setTimeout(() => {
      try {
        window.localStorage.setItem(keepKey, JSON.stringify({ at: new Date().toISOString(), state: JSON.parse(stateJson) }));
      } catch {
        /* full or unavailable: the leave-page question still guards */
      }
    }, 400);
    return () => clearTimeout(t);
  }, [dirty, kept, keepKey, stateJson]);

  function restore(k: BuilderState) {
    setPieces(k.pieces);
    setMaterials(k.materials);
    setMoney(k.money);
    setRequestedDate(k.requestedDate);
    setEarliestDate(k.earliestDate);
    setValidUntil(k.validUntil);
    setMessage(k.message);
    setKept(null);
  }
  function discardKept() {
    window.localStorage.removeItem(keepKey);
    setKept(null);
  }

  /** Shows errors on their fields, says which in the status (announced), and scrolls to the first. */
  function showFieldErrors(text: string, fieldErrors: Record<string, string[]>) {
    const names = [...new Set(Object.keys(fieldErrors).map(quoteBuilderFieldName))];
    setStatus({ tone: "error", text: names.length ? `${text} Check ${names.join(", ")}.` : text, fieldErrors });
    requestAnimationFrame(() => {
      const first = formRef.current?.querySelector<HTMLElement>('[aria-invalid="true"]');
      if (first) {
        first.scrollIntoView({ block: "center" });
        first.focus({ preventScroll: true });
      }
    });
  }

  async function save(send: boolean) {
    if (!inputReady || !preview) {
      if (Object.keys(clientErrors).length) showFieldErrors("Some fields need a correction before the quote can be saved.", clientErrors);
      else setStatus({ tone: "error", text: previewError ?? "The quote cannot be priced yet." });
      return;
    }
    setBusy(true);
    setStatus(null);
    const sentJson = stateJson;
    try {
      const res = await fetch(`/api/commissions/${props.commissionId}/quotes`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify(body),
      });
      const answer = (await res.json()) as { version?: { id: string; number: number }; error?: { message: string; fieldErrors?: Record<string, string[]> } };
      if (!res.ok || !answer.version) {
        const fieldErrors = answer.error?.fieldErrors ?? {};
        if (Object.keys(fieldErrors).length) showFieldErrors(answer.error?.message ?? "The quote could not be saved.", fieldErrors);
        else setStatus({ tone: "error", text: answer.error?.message ?? "The quote could not be saved." });
        return;
      }
      const saved = answer.version;
      setSavedJson(sentJson);
      try {
        window.localStorage.removeItem(keepKey);
      } catch {
        /* nothing kept */
      }
      if (send) {
        const sent = await fetch(`/api/quotes/${saved.id}/send`, { method: "POST" });
        const sb = (await sent.json()) as { error?: { message: string } };
        if (!sent.ok) {
          setStatus({ tone: "error", text: sb.error?.message ?? "The quote was saved but not sent." });
          return;
        }
        setStatus({ tone: "success", text: `Version ${saved.number} sent to the client.` });
      } else {
        setStatus({ tone: "success", text: `Draft version ${saved.number} saved.` });
      }
      router.refresh();
    } catch {
      setStatus({ tone: "error", text: "The connection dropped; nothing was sent. Please try again." });
    } finally {
      setBusy(false);
    }
  }

  // Errors as typed (checked here) first; the server's last answer for what only it can tell.
  const fe: Record<string, string[] | undefined> = { ...(status?.fieldErrors ?? {}), ...clientErrors };
  const saveBlocked = busy ? null : !inputReady ? "Correct the marked fields to save." : !preview ? (previewError ?? "The quote cannot be priced yet.") : null;
  return (
    <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
      <form
        aria-label="Quote builder"
        ref={formRef}
        className="flex flex-col gap-6"
        onSubmit={(e) => {
          e.preventDefault();
          void save(false);
        }}
      >
        {kept ? (
          <Notice tone="info" title="A quote you did not save">
            <p>
              Changes made on this device on {new Date(kept.at).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" })} were never saved.
            </p>
            <div className="mt-2 flex flex-wrap gap-3">
              <Button variant="secondary" onClick={() => restore(kept.state)}>
                Restore those changes
              </Button>
              <Button variant="quiet" onClick={discardKept}>
                Discard them
              </Button>
            </div>
          </Notice>
        ) : null}
        <fieldset className="flex flex-col gap-4">
          <legend className="mb-2 text-xl">Pieces and their work</legend>
          <p className="text-sm text-bark">
            {props.featuresFromDesign
              ? "Every stitch of every piece, counted from the garment with the commission's design on it; adjust where the chart does not tell the whole story."
              : "No design yet: every stitch of every piece of the plain garment; the charts add colourwork once the design has them."}
            {props.garment ? ` Sized from the ${props.garment.sizedFrom}.` : ""}
          </p>
          {props.garment?.note ? (
            <p className="text-sm font-semibold" data-testid="garment-note">
              {props.garment.note}
            </p>
          ) : null}
          {props.garment?.problems ? (
            <p role="status" className="text-sm font-semibold text-madder-dark" data-testid="garment-problems">
              {props.garment.problems}
            </p>
          ) : null}
          {pieces.map((p, i) => (
            <fieldset key={i} className="rounded-md border border-bark/30 p-3">
              <legend className="px-1 font-semibold">{p.label || `Piece ${i + 1}`}</legend>
              <div className="grid grid-cols-2 gap-3 sm:grid-cols-3">
                <Field label="Name" value={p.label ?? ""} onChange={(e) => setPieces((ps) => ps.map((x, j) => (j === i ? { ...x, label: e.target.value } : x)))} errors={fe[`pieces.${i}.label`]} />
                {FEATURE_FIELDS.map((f) => (
                  <Field
                    key={f.key}
                    label={f.label}
                    type="number"
                    min={0}
                    step={f.step ?? "1"}
                    inputMode="decimal"
                    value={String(p[f.key] ?? 0)}
                    onChange={(e) => setFeature(i, f.key, e.target.value)}
                    errors={fe[`pieces.${i}.${f.key}`]}
                  />
                ))}
              </div>
              <div className="mt-3 flex flex-wrap items-center gap-4">
                <label className="flex items-center gap-2">
                  <input type="checkbox" checked={p.newDesign ?? true} onChange={(e) => setFeature(i, "newDesign", e.target.checked)} /> New design (not a repeat of another piece)
                </label>
                <label className="flex items-center gap-2">
                  <input type="checkbox" checked={p.blocked ?? true} onChange={(e) => setFeature(i, "blocked", e.target.checked)} /> Wet-blocked
                </label>
                {pieces.length > 1 ? (
                  <Button variant="quiet" onClick={() => setPieces((ps) => ps.filter((_, j) => j !== i))}>
                    Remove {p.label || `piece ${i + 1}`}
                  </Button>
                ) : null}
              </div>
            </fieldset>
          ))}
          <div>
            <Button variant="secondary" onClick={() => setPieces((ps) => [...ps, { label: `Piece ${ps.length + 1}`, newDesign: false, proofRounds: 0 }])}>
              Add a piece
            </Button>
          </div>
        </fieldset>

        <fieldset className="flex flex-col gap-3">
          <legend className="mb-2 text-xl">Yarn</legend>
          {props.yarnEstimate ? <DesignYarnPanel data={props.yarnEstimate} onUse={(ms) => setMaterials(ms)} /> : null}
          {materials.map((mat, i) => (
            <div key={i} className="flex flex-wrap items-end gap-3">
              <div className="flex flex-col gap-1">
                <label htmlFor={`yarn-${i}`} className="font-semibold">
                  Yarn {i + 1}
                </label>
                <select
                  id={`yarn-${i}`}
                  className="rounded-md border border-bark/40 bg-white px-3 py-2"
                  value={mat.yarnId}
                  aria-invalid={fe[`materials.${i}.yarnId`] ? true : undefined}
                  aria-describedby={fe[`materials.${i}.yarnId`] ? `yarn-${i}-error` : undefined}
                  onChange={(e) => setMaterials((ms) => ms.map((x, j) => (j === i ? { ...x, yarnId: e.target.value } : x)))}
                >
                  {props.yarns.map((y) => (
                    <option key={y.id} value={y.id}>
                      {y.name}, {y.colourName} ({m(y.priceMinor)} a skein)
                    </option>
                  ))}
                </select>
                {fe[`materials.${i}.yarnId`] ? (
                  <p id={`yarn-${i}-error`} className="text-sm font-semibold text-madder-dark" role="alert">
                    {fe[`materials.${i}.yarnId`]!.join(" ")}
                  </p>
                ) : null}
              </div>
              <Field
                label={`Skeins of yarn ${i + 1}`}
                type="number"
                min={0}
                step="1"
                value={String(mat.skeins)}
                onChange={(e) => setMaterials((ms) => ms.map((x, j) => (j === i ? { ...x, skeins: Math.max(0, Math.round(Number(e.target.value) || 0)) } : x)))}
                errors={fe[`materials.${i}.skeins`]}
              />
              <TaxCategorySelect
                id={`yarn-tax-${i}`}
                label={`Tax on yarn ${i + 1}`}
                policy={policy}
                value={mat.taxCategory}
                onChange={(v) => setMaterials((ms) => ms.map((x, j) => (j === i ? { ...x, taxCategory: v } : x)))}
              />
              <Button variant="quiet" onClick={() => setMaterials((ms) => ms.filter((_, j) => j !== i))}>
                Remove yarn {i + 1}
              </Button>
            </div>
          ))}
          {props.yarns.length ? (
            <div>
              <Button variant="secondary" onClick={() => setMaterials((ms) => [...ms, { yarnId: props.yarns[0].id, skeins: 1 }])}>
                Add a yarn
              </Button>
            </div>
          ) : (
            <p className="text-bark">The studio has no yarns listed yet.</p>
          )}
        </fieldset>

        <fieldset className="grid gap-3 sm:grid-cols-2">
          <legend className="mb-2 text-xl">Fees, shipping and discount ({cur})</legend>
          <TaxCategorySelect id="labour-tax" label="Tax on the labour (all stages)" policy={policy} value={labourTaxCategory} onChange={setLabourTaxCategory} />
          <Field label="Design fee" inputMode="decimal" value={money.designFee} onChange={(e) => setMoney({ ...money, designFee: e.target.value })} errors={fe.designFeeMinor} />
          <Field label="Shipping" inputMode="decimal" value={money.shipping} onChange={(e) => setMoney({ ...money, shipping: e.target.value })} errors={fe.shippingMinor} />
          <Field label="Discount" hint="Off the work and materials, not shipping." inputMode="decimal" value={money.discount} onChange={(e) => setMoney({ ...money, discount: e.target.value })} errors={fe.discountMinor} />
          {money.extras.map((x, i) => (
            <div key={i} className="flex flex-wrap items-end gap-2 sm:col-span-2">
              <Field label={`Extra ${i + 1}`} errors={fe[`extras.${i}.label`]} value={x.label} onChange={(e) => setMoney({ ...money, extras: money.extras.map((y, j) => (j === i ? { ...y, label: e.target.value } : y)) })} />
              <Field
                label={`Price of extra ${i + 1}`}
                inputMode="decimal"
                value={x.amount}
                onChange={(e) => setMoney({ ...money, extras: money.extras.map((y, j) => (j === i ? { ...y, amount: e.target.value } : y)) })}
                errors={fe[`extras.${i}.amountMinor`]}
              />
              <TaxCategorySelect
                id={`extra-tax-${i}`}
                label={`Tax on extra ${i + 1}`}
                policy={policy}
                value={x.taxCategory}
                onChange={(v) => setMoney({ ...money, extras: money.extras.map((y, j) => (j === i ? { ...y, taxCategory: v } : y)) })}
              />
              <Button variant="quiet" onClick={() => setMoney({ ...money, extras: money.extras.filter((_, j) => j !== i) })}>
                Remove extra {i + 1}
              </Button>
            </div>
          ))}
          <div className="sm:col-span-2">
            <Button variant="secondary" onClick={() => setMoney({ ...money, extras: [...money.extras, { label: "Gift wrap", amount: "" }] })}>
              Add an extra
            </Button>
          </div>
        </fieldset>

        <fieldset className="grid gap-3 sm:grid-cols-3">
          <legend className="mb-2 text-xl">Dates</legend>
          <Field label="Client needs it by" type="date" errors={fe.requestedDate} value={requestedDate} onChange={(e) => setRequestedDate(e.target.value)} />
          <Field
            label="Earliest date we can offer"
            hint={`A rush fee applies when the client needs it sooner.${props.scheduleEarliest ? ` The schedule can promise ${props.scheduleEarliest} after the work already booked (shipping not included).` : ""}`}
            type="date" errors={fe.earliestDate} value={earliestDate} onChange={(e) => setEarliestDate(e.target.value)} />
          <Field
            label={`Rush fee (${cur})`}
            hint={
              <>
                Empty: a quarter of the labour.
                <GuardRailNote field="rushFee" warnings={rushWarnings} />
              </>
            }
            inputMode="decimal" value={money.rushFee} onChange={(e) => setMoney({ ...money, rushFee: e.target.value })} errors={fe.rushFeeMinor} />
          <Field label="Quote valid until" hint="Empty: the studio's default." type="date" value={validUntil} onChange={(e) => setValidUntil(e.target.value)} errors={fe.validUntil} />
        </fieldset>

        <div className="flex flex-col gap-1">
          <label htmlFor="quote-message" className="font-semibold">
            Message to the client
          </label>
          <textarea
            id="quote-message"
            rows={3}
            className={`rounded-md border px-3 py-2 ${fe.messageToClient ? "border-madder" : "border-bark/40"}`}
            value={message}
            aria-invalid={fe.messageToClient ? true : undefined}
            aria-describedby={fe.messageToClient ? "quote-message-count quote-message-error" : "quote-message-count"}
            onChange={(e) => setMessage(e.target.value)}
          />
          <CharCount id="quote-message-count" length={message.trim().length} max={MAX_QUOTE_MESSAGE} />
          {fe.messageToClient ? (
            <p id="quote-message-error" className="text-sm font-semibold text-madder-dark" role="alert">
              {fe.messageToClient.join(" ")}
            </p>
          ) : null}
        </div>

        <div aria-live="polite" role="status" data-testid="quote-status">
          {status ? <Notice tone={status.tone}>{status.text}</Notice> : null}
        </div>
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit" variant="secondary" disabled={busy} aria-describedby={saveBlocked ? "quote-save-blocked" : undefined}>
            Save draft
          </Button>
          <Button disabled={busy} aria-describedby={saveBlocked ? "quote-save-blocked" : undefined} onClick={() => void save(true)}>
            Save and send to the client
          </Button>
          {saveBlocked ? (
            <p id="quote-save-blocked" className="text-sm font-semibold text-madder-dark" data-testid="quote-save-blocked">
              {saveBlocked}
            </p>
          ) : dirty ? (
            <p className="text-sm text-bark">Not saved yet.</p>
          ) : null}
        </div>
      </form>

      <aside aria-labelledby="live-price" className="self-start rounded-lg border border-bark/20 bg-white p-4 lg:sticky lg:top-4">
        <h2 id="live-price" className="mb-2 text-xl">
          Live price
        </h2>
        <div aria-live="polite">
          {previewError ? <Notice tone="error">{previewError}</Notice> : null}
          {!inputReady ? (
            <p className="text-bark" data-testid="quote-total-waiting">
              <span aria-hidden="true">— </span>The price shows once the marked fields are corrected.
            </p>
          ) : null}
          {preview ? (
            <>
              {changeNote ? (
                <p className="mb-2 rounded-md bg-fleece p-2 text-sm" data-testid="price-change">
                  Since the last version: {changeNote}
                </p>
              ) : null}
              {diffNote && diffNote !== "no change" ? <p className="mb-2 text-sm text-bark">{diffNote}</p> : null}
              <table className="w-full text-sm">
                <caption className="sr-only">Quote lines</caption>
                <thead>
                  <tr>
                    <th scope="col" className="text-left">
                      Line
                    </th>
                    <th scope="col" className="text-right">
                      Amount
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {preview.quote.lines.map((l, i) => (
                    <tr key={i} className="border-t border-bark/10">
                      <td className="py-1">{l.label}</td>
                      <td className="py-1 text-right tabular-nums">{m(l.amountMinor)}</td>
                    </tr>
                  ))}
                </tbody>
                <tfoot>
                  {!preview.quote.pricesIncludeTax ? (
                    <tr className="border-t border-bark/30">
                      <th scope="row" className="text-left font-normal">
                        Subtotal
                      </th>
                      <td className="text-right tabular-nums">{m(preview.quote.subtotalMinor)}</td>
                    </tr>
                  ) : null}
                  {(preview.quote.taxByRate.length > 1 ? preview.quote.taxByRate : []).map((r) => (
                    <tr key={r.category}>
                      <th scope="row" className="text-left font-normal">
                        {r.label} ({formatRatePpm(r.ratePpm)}) on {m(r.netMinor)}
                      </th>
                      <td className="text-right tabular-nums">{m(r.taxMinor)}</td>
                    </tr>
                  ))}
                  <tr>
                    <th scope="row" className="text-left font-normal">
                      {preview.quote.pricesIncludeTax ? "Tax included" : "Tax"}
                      {preview.quote.taxByRate.length > 1 ? " (all rates)" : ` (${formatRatePpm(preview.quote.taxRatePpm)})`}
                    </th>
                    <td className="text-right tabular-nums">{m(preview.quote.taxMinor)}</td>
                  </tr>
                  <tr className="border-t border-bark/30 font-semibold">
                    <th scope="row" className="text-left">
                      Total
                    </th>
                    <td className="text-right tabular-nums" data-testid="quote-total">
                      {m(preview.quote.totalMinor)}
                    </td>
                  </tr>
                  <tr>
                    <th scope="row" className="text-left font-normal">
                      Deposit
                    </th>
                    <td className="text-right tabular-nums">{m(preview.quote.depositMinor)}</td>
                  </tr>
                  {depositWarnings.length ? (
                    <tr>
                      <td colSpan={2} className="text-sm">
                        <GuardRailNote field="depositPercent" warnings={depositWarnings} /> (The deposit share is set in the studio settings.)
                      </td>
                    </tr>
                  ) : null}
                  <tr>
                    <th scope="row" className="text-left font-normal">
                      Balance
                    </th>
                    <td className="text-right tabular-nums">{m(preview.quote.balanceMinor)}</td>
                  </tr>
                </tfoot>
              </table>
              {depositNote ? (
                <p className="mt-3 text-sm" data-testid="quote-deposit-note">
                  {depositNote}
                </p>
              ) : null}
              <p className="mt-3 text-sm text-bark" data-testid="quote-labour-level">
                Labour {preview.estimate.totals.p50Hours} h typical (P50), {preview.estimate.totals.p80Hours} h cautious (P80). {labourLevelForStudio(policy.labourPolicy)}{" "}
                The client sees: &ldquo;{labourLevelNote(preview.quote) ?? "no labour on this quote"}&rdquo; <a href="/studio/settings#pricePolicy">Change in settings</a>.
              </p>
              {/* Per piece, rounded as production rounds each piece's estimate, so the board shows the same figures. */}
              <p className="mt-1 text-sm tabular-nums" data-testid="quote-knitting">
                Knitting (typical): {preview.estimate.pieces.map((p, i) => `${p.label || `piece ${i + 1}`} ${formatMinutes(p.p50Minutes.knitting)}`).join(", ")} (total{" "}
                {formatMinutes(preview.estimate.pieces.reduce((s, p) => s + p.p50Minutes.knitting, 0))})
              </p>
            </>
          ) : null}
        </div>
      </aside>
    </div>
  );
}
