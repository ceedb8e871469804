"use client";
// "Import from a photo" on the design page: pick one of the commission's photos or a file, crop it
// with a box at the target area's true proportions, choose the target size and the colours, and see
// the chart, the knitted preview, stitches per colour, the nearest studio yarns, the darning the
// colour plan would need and the price change before accepting. Nothing changes until Accept; the
// editor then commits the chart as one undo step, which autosaves as a new design version.
import { useQuery } from "@tanstack/react-query";
import { useCallback, useEffect, useId, useMemo, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { getStitchCounts, parseChart, renderChartSvg, renderPreviewSvg, type ChartV1 } from "@/lib/core/chart";
import { MAX_PALETTE } from "@/lib/core/chart/model";
import { getColourDifference } from "@/lib/core/colourwork/ciede2000";
import type { ColourPlan } from "@/lib/core/colourwork/colour-plan";
import type { DarningPlan } from "@/lib/core/colourwork/darning-plan";
import { DEFAULT_MAX_SPECK_STITCHES, MAX_SPECK_STITCHES, type PhotoToChartOptions } from "@/lib/core/photo";
import { formatMoney } from "@/lib/core/pricing/format-money";
import { livePrice, type ChartPiece } from "@/lib/core/pricing/live-price";
import type { ChartArea, SizingResult } from "@/lib/core/sizing";
import type { LivePricing } from "../chart-editor/garment-reading";
import { boxFromDrag, centredBox, trueAspect, workingSize, type Box, type GaugeLike } from "./crop-box";
import { CropView } from "./crop-view";
import { cropPixels, decodePhoto, PhotoError, type WorkingImage } from "./decode";
import { runPhotoJob, type PhotoJob, type PhotoJobAnswer, type RoundsCleanup } from "./photo-job";

export interface PhotoChoice {
  id: string;
  kind: string;
  width: number;
  height: number;
}

export interface ImportTarget {
  /** the editor entry the chart replaces */
  index: number;
  label: string;
  /** the garment's area for this entry, when the sizing has it */
  area: ChartArea | null;
  width: number;
  height: number;
  /** the chart's gauge: the crop box keeps the area's true proportions at it */
  gauge: GaugeLike;
}

export interface StudioYarn {
  id: string;
  name: string;
  colourName: string;
  hex: string;
}

export interface PhotoImportProps {
  targets: ImportTarget[];
  active: number;
  yarns: StudioYarn[];
  photos: PhotoChoice[];
  /** hex colours of the open chart: those studio yarns are ticked to start with */
  currentHexes: string[];
  locked: boolean;
  inTheRound: boolean;
  /** the garment and the design's charts, to price before and after */
  garment: { sizing: SizingResult; charts: ChartPiece[]; pricing: LivePricing } | null;
  onAccept: (index: number, chart: ChartV1) => void;
}

type Field = "photo" | "crop" | "size" | "colours" | "result";
type Errors = Partial<Record<Field, string>>;

const MAX_SIDE = 400;

/** The form field a core message is about. */
function fieldOf(coreField: string | null): Field {
  if (!coreField) return "result";
  if (coreField.startsWith("crop") || coreField === "image") return "crop";
  if (coreField === "width" || coreField === "height") return "size";
  if (coreField.startsWith("palette") || coreField.startsWith("colours") || coreField.startsWith("yarns")) return "colours";
  return "result";
}
const KEYS = "ABCDEFGHIJKLMNOPQRSTUVWXYZ";

interface PlanResponse {
  colours: ColourPlan;
  darning: DarningPlan;
}

export function PhotoImport(props: PhotoImportProps) {
  const dialog = useRef<HTMLDialogElement>(null);
  const [open, setOpen] = useState(false);
  const ids = useId();
  const id = (s: string) => `${ids}-${s}`;

  const [photoId, setPhotoId] = useState<string>("");
  const [image, setImage] = useState<WorkingImage | null>(null);
  const [loading, setLoading] = useState(false);
  const [box, setBox] = useState<Box | null>(null);
  const [targetIndex, setTargetIndex] = useState(props.active);
  const target = props.targets.find((t) => t.index === targetIndex) ?? props.targets[0];
  const gauge = target?.gauge ?? { stitchesPer10cm: 20, rowsPer10cm: 20 };
  const [sizeMode, setSizeMode] = useState<"area" | "custom">(target?.area ? "area" : "custom");
  const [customW, setCustomW] = useState(String(target?.width ?? 40));
  const [customH, setCustomH] = useState(String(target?.height ?? 40));
  const [colourMode, setColourMode] = useState<"yarns" | "count">(props.yarns.length >= 2 ? "yarns" : "count");
  const [chosenYarns, setChosenYarns] = useState<string[]>([]);
  const [count, setCount] = useState("3");
  const [cleanup, setCleanup] = useState(true);
  const [limitRounds, setLimitRounds] = useState(false);
  const [speck, setSpeck] = useState("3");
  const [errors, setErrors] = useState<Errors>({});
  const [working, setWorking] = useState(false);
  const [answer, setAnswer] = useState<Extract<PhotoJobAnswer, { ok: true }> | null>(null);
  const previewHeading = useRef<HTMLHeadingElement>(null);

  // ---- the target's size and true proportions ------------------------------------------------
  const size = useMemo((): { ok: true; width: number; height: number } | { ok: false; message: string } => {
    if (sizeMode === "area" && target?.area) return { ok: true, width: target.area.width, height: target.area.height };
    const w = Number(customW);
    const h = Number(customH);
    if (!Number.isInteger(w) || !Number.isInteger(h) || w < 2 || h < 2) return { ok: false, message: "Give the width in stitches and the height in rows as whole numbers, at least 2 each." };
    if (w > MAX_SIDE || h > MAX_SIDE) return { ok: false, message: `A chart can be at most ${MAX_SIDE} stitches wide and ${MAX_SIDE} rows high.` };
    return { ok: true, width: w, height: h };
  }, [sizeMode, target, customW, customH]);
  const aspect = size.ok ? trueAspect(size.width, size.height, gauge) : null;

  // Keep the box at the locked aspect whenever the target changes (same centre, same width where it fits).
  useEffect(() => {
    if (!image || !aspect) return;
    setBox((b) => {
      if (!b) return centredBox(image.width, image.height, aspect);
      const cx = b.x + b.width / 2;
      const cy = b.y + b.height / 2;
      const w = Math.min(b.width, image.width, image.height * aspect);
      return boxFromDrag(Math.max(0, cx - w / 2), Math.max(0, cy - w / aspect / 2), cx + w / 2, cy + w / aspect / 2, aspect, image.width, image.height);
    });
  }, [image, aspect]);

  // ---- opening and closing -------------------------------------------------------------------
  const reset = useCallback(() => {
    setAnswer(null);
    setErrors({});
    setWorking(false);
  }, []);
  const show = () => {
    setTargetIndex(props.active);
    const t = props.targets.find((x) => x.index === props.active);
    setSizeMode(t?.area ? "area" : "custom");
    setCustomW(String(t?.width ?? 40));
    setCustomH(String(t?.height ?? 40));
    const wanted = new Set(props.currentHexes.map((h) => h.toLowerCase()));
    const ticked = props.yarns.filter((y) => wanted.has(y.hex.toLowerCase())).map((y) => y.id);
    setChosenYarns(ticked.length >= 2 ? ticked : props.yarns.slice(0, 2).map((y) => y.id));
    reset();
    setOpen(true);
  };
  // Opened once its content is there, so the browser focuses the first control inside it.
  useEffect(() => {
    const d = dialog.current;
    if (open && d && !d.open) d.showModal();
  }, [open]);
  const close = () => {
    dialog.current?.close();
  };
  const onClosed = () => {
    setOpen(false);
    jobSeq.current++;
    reset();
  };

  // ---- photos --------------------------------------------------------------------------------
  const load = async (blob: Blob | Promise<Blob>) => {
    setLoading(true);
    setImage(null);
    setBox(null);
    reset();
    try {
      const img = await decodePhoto(await blob);
      setImage(img);
    } catch (e) {
      setErrors({ photo: e instanceof PhotoError ? e.message : "That photo could not be read; it may be damaged." });
    } finally {
      setLoading(false);
    }
  };
  const pickReference = (pid: string) => {
    setPhotoId(pid);
    void load(
      fetch(`/api/uploads/${pid}?bytes=1`).then(async (res) => {
        if (!res.ok) throw new PhotoError(res.status === 404 ? "That photo is no longer there." : `The photo could not be fetched (${res.status}).`);
        return res.blob();
      }),
    );
  };
  const pickFile = (file: File | undefined) => {
    setPhotoId("");
    if (!file) return;
    void load(file);
  };

  // ---- colours -------------------------------------------------------------------------------
  const palette = useMemo(
    () => props.yarns.filter((y) => chosenYarns.includes(y.id)).map((y, i) => ({ key: KEYS[i], name: y.colourName, hex: y.hex })),
    [props.yarns, chosenYarns],
  );
  const colourProblem = (): string | null => {
    if (colourMode === "yarns") {
      if (palette.length < 2) return "Tick at least two yarns: a chart of one colour has no pattern.";
      if (palette.length > MAX_PALETTE) return `Tick at most ${MAX_PALETTE} yarns: a chart holds at most ${MAX_PALETTE} colours.`;
      return null;
    }
    const n = Number(count);
    if (!Number.isInteger(n) || n < 2) return "Choose at least 2 colours: a chart of one colour has no pattern.";
    if (n > MAX_PALETTE) return `Choose at most ${MAX_PALETTE} colours: a chart holds at most ${MAX_PALETTE}.`;
    return null;
  };

  // ---- the worker ----------------------------------------------------------------------------
  const worker = useRef<Worker | null>(null);
  const jobSeq = useRef(0);
  useEffect(() => {
    if (!open || typeof Worker === "undefined") return;
    let w: Worker;
    try {
      w = new Worker(new URL("./photo-worker.ts", import.meta.url), { type: "module" });
    } catch {
      return;
    }
    worker.current = w;
    return () => {
      worker.current = null;
      w.terminate();
    };
  }, [open]);

  const runJob = (job: PhotoJob): Promise<PhotoJobAnswer> =>
    new Promise((resolve) => {
      const onPage = () => setTimeout(() => resolve(runPhotoJob(job)), 0);
      const w = worker.current;
      if (!w) return onPage();
      const done = (e: MessageEvent<PhotoJobAnswer>) => {
        if (e.data.seq !== job.seq) return;
        w.removeEventListener("message", done);
        w.removeEventListener("error", failed);
        resolve(e.data);
      };
      const failed = () => {
        w.removeEventListener("message", done);
        w.removeEventListener("error", failed);
        onPage();
      };
      w.addEventListener("message", done);
      w.addEventListener("error", failed);
      try {
        w.postMessage(job);
      } catch {
        failed();
      }
    });

  const make = async () => {
    const next: Errors = {};
    if (!image || !box) next.photo = "Choose a photo first.";
    if (!size.ok) next.size = size.message;
    const cp = colourProblem();
    if (cp) next.colours = cp;
    setErrors(next);
    setAnswer(null);
    if (Object.keys(next).length || !image || !box || !size.ok || !target) return;
    setWorking(true);
    const seq = ++jobSeq.current;
    let pixels: ReturnType<typeof cropPixels>;
    try {
      pixels = cropPixels(image, box, workingSize(box, size.width, size.height));
    } catch (e) {
      setWorking(false);
      setErrors({ crop: e instanceof Error ? e.message : String(e) });
      return;
    }
    const options: PhotoToChartOptions = {
      width: size.width,
      height: size.height,
      gauge: { stitchesPer10cm: gauge.stitchesPer10cm, rowsPer10cm: gauge.rowsPer10cm },
      // with a number of colours, the nearest studio yarns are found here (any number of yarns)
      ...(colourMode === "yarns" ? { palette } : { colours: Number(count) }),
      ...(cleanup ? { cleanup: { removeIsolated: true } } : {}),
    };
    const shape = sizeMode === "area" && target.area ? target.area : null;
    const g = props.garment;
    const result = await runJob({
      seq,
      image: pixels,
      options,
      shape,
      limitRounds: limitRounds ? { maxStitches: Math.max(1, Math.min(MAX_SPECK_STITCHES, Math.round(Number(speck)) || DEFAULT_MAX_SPECK_STITCHES)), inTheRound: props.inTheRound } : null,
      garment: g ? { sizing: g.sizing, charts: g.charts, index: target.index, pricing: g.pricing } : null,
    });
    if (seq !== jobSeq.current) return; // cancelled or superseded
    setWorking(false);
    if (!result.ok) {
      setErrors({ [fieldOf(result.field)]: `The chart could not be made: ${result.message}` });
      return;
    }
    setAnswer(result);
    setTimeout(() => previewHeading.current?.focus(), 0);
  };

  const accept = () => {
    if (!answer || props.locked || !target) return;
    props.onAccept(target.index, answer.chart);
    close();
  };

  // ---- the preview -----------------------------------------------------------------------------
  const chart = useMemo(() => (answer ? parseChart(answer.chart) : null), [answer]);
  const chartSvg = useMemo(() => (chart ? `data:image/svg+xml;charset=utf-8,${encodeURIComponent(renderChartSvg(chart, { cellPx: Math.max(4, Math.min(12, Math.floor(440 / chart.width))), showKey: false }))}` : null), [chart]);
  const knitSvg = useMemo(() => (chart ? `data:image/svg+xml;charset=utf-8,${encodeURIComponent(renderPreviewSvg(chart, { stitchPx: Math.max(3, Math.min(8, Math.floor(440 / chart.width))) }))}` : null), [chart]);
  const counts = useMemo(() => (chart ? getStitchCounts(chart) : []), [chart]);
  const nearest = useMemo(() => {
    if (!chart) return [];
    return chart.palette.map((c) => {
      let best: { yarn: StudioYarn; delta: number } | null = null;
      for (const y of props.yarns) {
        const d = getColourDifference(c.hex, y.hex);
        if (!best || d < best.delta) best = { yarn: y, delta: d };
      }
      return best;
    });
  }, [chart, props.yarns]);

  const plan = useQuery({
    queryKey: ["photo-import-plan", answer ? JSON.stringify(answer.chart) : "", props.inTheRound],
    enabled: !!answer,
    queryFn: async (): Promise<PlanResponse> => {
      const res = await fetch("/api/colourwork/plan", {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ chart: answer!.chart, options: { inTheRound: props.inTheRound } }),
      });
      const body = await res.json();
      if (!res.ok) throw new Error(body.error?.message ?? `The plan could not be made (${res.status}).`);
      return body;
    },
  });

  const price = useMemo(() => {
    const g = props.garment;
    if (!answer || !g) return null;
    const { before, after } = answer;
    if (!before || !after) return null;
    if (after.error) return { ok: false as const, message: after.error };
    if (before.error) return { ok: false as const, message: before.error };
    try {
      const p = livePrice(before.pieces, after.pieces, g.pricing.policy, g.pricing.designFeeMinor);
      return { ok: true as const, value: p, problems: after.problems };
    } catch (e) {
      return { ok: false as const, message: e instanceof Error ? e.message : String(e) };
    }
  }, [answer, props.garment]);
  const money = (minor: number, signed = false) => (props.garment ? formatMoney(minor, props.garment.pricing.policy.currency, "en-GB", signed ? { signDisplay: "exceptZero" } : {}) : "");

  const err = (f: Field) =>
    errors[f] ? (
      <p id={id(`${f}-error`)} className="text-sm font-semibold text-madder-dark" role="alert">
        {errors[f]}
      </p>
    ) : null;
  const describedBy = (f: Field, hint?: string) => [hint, errors[f] ? id(`${f}-error`) : undefined].filter(Boolean).join(" ") || undefined;

  return (
    <>
      <Button variant="secondary" className="!px-3 !py-1.5 text-sm" onClick={show} disabled={props.locked} aria-describedby={props.locked ? id("locked") : undefined}>
        Import from a photo…
      </Button>
      {props.locked ? (
        <span id={id("locked")} className="text-sm text-bark">
          (locked: an approved design cannot import a photo)
        </span>
      ) : null}
      <dialog
        ref={dialog}
        aria-labelledby={id("title")}
        onClose={onClosed}
        className="w-[min(72rem,96vw)] max-w-none rounded-md border border-bark/40 bg-paper p-0 text-peat backdrop:bg-peat/50"
        data-testid="photo-import"
      >
        {open ? (
          <div className="space-y-4 p-4">
            <div className="flex items-start justify-between gap-4">
              <h2 id={id("title")} className="text-xl">
                Import from a photo
              </h2>
              <Button variant="secondary" className="!px-3 !py-1.5 text-sm" onClick={close}>
                Cancel
              </Button>
            </div>
            <p className="text-sm text-bark">Nothing in the design changes until you accept the chart. Cancel or Escape leaves it as it was.</p>

            <fieldset className="rounded-md border border-bark/30 bg-white p-3" aria-describedby={describedBy("photo")}>
              <legend className="px-1 font-semibold">1. The photo</legend>
              {props.photos.length ? (
                <div role="radiogroup" aria-label="The commission's photos" className="flex flex-wrap gap-3">
                  {props.photos.map((p, i) => (
                    <label key={p.id} className={`flex cursor-pointer flex-col items-center gap-1 rounded-md border-2 p-1 text-sm ${photoId === p.id ? "border-peat" : "border-transparent"}`}>
                      {/* eslint-disable-next-line @next/next/no-img-element */}
                      <img src={`/api/uploads/${p.id}?size=thumb`} alt="" className="h-20 w-20 object-cover" />
                      <span className="flex items-center gap-1">
                        <input type="radio" name={id("photo")} checked={photoId === p.id} onChange={() => pickReference(p.id)} />
                        {p.kind === "reference" ? "Reference photo" : "Photo"} {i + 1} ({p.width} × {p.height})
                      </span>
                    </label>
                  ))}
                </div>
              ) : (
                <p className="text-sm">The commission has no photos yet.</p>
              )}
              <label className="mt-3 flex flex-col gap-1 text-sm">
                <span className="font-semibold">Or choose a file (JPEG, PNG or WebP, up to 40 megapixels)</span>
                <input
                  type="file"
                  accept="image/jpeg,image/png,image/webp"
                  aria-invalid={errors.photo ? true : undefined}
                  aria-describedby={describedBy("photo")}
                  onChange={(e) => pickFile(e.target.files?.[0])}
                />
              </label>
              {loading ? <p role="status">Reading the photo…</p> : null}
              {err("photo")}
            </fieldset>

            {image && box && aspect ? (
              <div className="grid gap-4 lg:grid-cols-[auto_1fr]">
                <fieldset className="rounded-md border border-bark/30 bg-white p-3">
                  <legend className="px-1 font-semibold">2. Crop</legend>
                  <p id={id("crop-hint")} className="mb-2 max-w-prose text-sm text-bark">
                    The box keeps the knitted area&apos;s true shape ({size.ok ? `${size.width} stitches by ${size.height} rows` : "choose a size"} at {gauge.stitchesPer10cm} stitches and{" "}
                    {gauge.rowsPer10cm} rows per 10 cm). Drag it to move it, drag its corner to resize it. Keyboard: arrows move it; Shift with right or up makes it larger, with left or down smaller; Alt for small steps.
                  </p>
                  <CropView image={image} box={box} aspect={aspect} onChange={setBox} describedBy={id("crop-hint")} invalid={!!errors.crop} />
                  <p className="text-sm" aria-live="polite" data-testid="crop-size">
                    Crop: {box.width} × {box.height} pixels of a {image.naturalWidth} × {image.naturalHeight} photo
                    {image.width !== image.naturalWidth ? ` (shown at ${image.width} × ${image.height})` : ""}.
                  </p>
                  {err("crop")}
                </fieldset>

                <div className="space-y-4">
                  <fieldset className="rounded-md border border-bark/30 bg-white p-3">
                    <legend className="px-1 font-semibold">3. Where it goes</legend>
                    {props.targets.length > 1 ? (
                      <label className="flex flex-col text-sm">
                        Chart
                        <select className="rounded-md border border-bark/40 px-2 py-1" value={targetIndex} onChange={(e) => {
                          const t = props.targets.find((x) => x.index === Number(e.target.value));
                          setTargetIndex(Number(e.target.value));
                          setSizeMode(t?.area ? "area" : "custom");
                          if (t) {
                            setCustomW(String(t.width));
                            setCustomH(String(t.height));
                          }
                          setAnswer(null);
                        }}>
                          {props.targets.map((t) => (
                            <option key={t.index} value={t.index}>
                              {t.label}
                            </option>
                          ))}
                        </select>
                      </label>
                    ) : (
                      <p className="text-sm">Chart: {target?.label}</p>
                    )}
                    <div role="radiogroup" aria-label="Size of the chart" className="mt-2 space-y-1 text-sm">
                      {target?.area ? (
                        <label className="flex items-center gap-2">
                          <input type="radio" name={id("size")} checked={sizeMode === "area"} onChange={() => setSizeMode("area")} />
                          The garment&apos;s {target.area.area}: {target.area.width} stitches by {target.area.height} rows
                        </label>
                      ) : (
                        <p>The garment has no area of this chart&apos;s size; give a width and height.</p>
                      )}
                      <label className="flex items-center gap-2">
                        <input type="radio" name={id("size")} checked={sizeMode === "custom"} onChange={() => setSizeMode("custom")} />
                        A width and height of my own
                      </label>
                    </div>
                    {sizeMode === "custom" ? (
                      <div className="mt-2 flex flex-wrap gap-3">
                        <label className="flex flex-col text-sm">
                          Width (stitches)
                          <input className="w-24 rounded-md border border-bark/40 px-2 py-1" type="number" min={2} max={MAX_SIDE} value={customW} onChange={(e) => setCustomW(e.target.value)} aria-invalid={errors.size ? true : undefined} aria-describedby={describedBy("size")} />
                        </label>
                        <label className="flex flex-col text-sm">
                          Height (rows)
                          <input className="w-24 rounded-md border border-bark/40 px-2 py-1" type="number" min={2} max={MAX_SIDE} value={customH} onChange={(e) => setCustomH(e.target.value)} aria-invalid={errors.size ? true : undefined} aria-describedby={describedBy("size")} />
                        </label>
                      </div>
                    ) : null}
                    {err("size")}
                  </fieldset>

                  <fieldset className="rounded-md border border-bark/30 bg-white p-3">
                    <legend className="px-1 font-semibold">4. Colours</legend>
                    <div role="radiogroup" aria-label="How the colours are chosen" className="space-y-1 text-sm">
                      <label className="flex items-center gap-2">
                        <input type="radio" name={id("colours")} checked={colourMode === "yarns"} onChange={() => setColourMode("yarns")} disabled={props.yarns.length < 2} />
                        The studio&apos;s yarns I tick
                      </label>
                      <label className="flex items-center gap-2">
                        <input type="radio" name={id("colours")} checked={colourMode === "count"} onChange={() => setColourMode("count")} />
                        A number of colours chosen from the photo
                      </label>
                    </div>
                    {colourMode === "yarns" ? (
                      <fieldset className="mt-2" aria-describedby={describedBy("colours")}>
                        <legend className="text-sm font-semibold">Yarns to use</legend>
                        <ul className="grid max-h-56 gap-1 overflow-auto text-sm sm:grid-cols-2">
                          {props.yarns.map((y) => (
                            <li key={y.id}>
                              <label className="flex items-center gap-2">
                                <input
                                  type="checkbox"
                                  checked={chosenYarns.includes(y.id)}
                                  onChange={(e) => setChosenYarns((all) => (e.target.checked ? [...all, y.id] : all.filter((x) => x !== y.id)))}
                                />
                                <span aria-hidden="true" className="inline-block h-4 w-4 rounded border border-bark/50" style={{ background: y.hex }} />
                                {y.colourName} ({y.name})
                              </label>
                            </li>
                          ))}
                        </ul>
                      </fieldset>
                    ) : (
                      <label className="mt-2 flex flex-col text-sm">
                        Number of colours
                        <input className="w-24 rounded-md border border-bark/40 px-2 py-1" type="number" min={2} max={MAX_PALETTE} value={count} onChange={(e) => setCount(e.target.value)} aria-invalid={errors.colours ? true : undefined} aria-describedby={describedBy("colours")} />
                      </label>
                    )}
                    {err("colours")}
                    <label className="mt-3 flex items-center gap-2 text-sm">
                      <input type="checkbox" checked={cleanup} onChange={(e) => setCleanup(e.target.checked)} /> Clean up: remove single stray stitches
                    </label>
                    <div className="mt-1 flex flex-wrap items-center gap-2 text-sm">
                      <label className="flex items-center gap-2">
                        <input type="checkbox" checked={limitRounds} onChange={(e) => setLimitRounds(e.target.checked)} data-testid="photo-import-limit-rounds" /> Two knitted colours per round: fold specks of other colours of up to
                      </label>
                      <input
                        className="w-16 rounded-md border border-bark/40 px-2 py-0.5"
                        type="number"
                        min={1}
                        max={MAX_SPECK_STITCHES}
                        value={speck}
                        onChange={(e) => setSpeck(e.target.value)}
                        disabled={!limitRounds}
                        aria-label="Largest speck folded, in stitches"
                      />
                      <span>stitches into the nearer knitted colour (larger areas stay darned)</span>
                    </div>
                  </fieldset>

                  <div className="flex flex-wrap items-center gap-3">
                    <Button onClick={() => void make()} disabled={working}>
                      {answer ? "Make the chart again" : "Make the chart"}
                    </Button>
                    <span role="status" className="text-sm">
                      {working ? "Making the chart…" : ""}
                    </span>
                  </div>
                  {err("result")}
                </div>
              </div>
            ) : null}

            {answer && chart ? (
              <section aria-labelledby={id("preview")} className="space-y-3 rounded-md border border-bark/30 bg-white p-3" data-testid="photo-import-preview">
                <h3 id={id("preview")} ref={previewHeading} tabIndex={-1} className="text-lg">
                  Preview: {chart.width} stitches by {chart.height} rows for {target?.label}
                </h3>
                <div className="flex flex-wrap gap-4">
                  <figure>
                    {/* eslint-disable-next-line @next/next/no-img-element */}
                    <img src={chartSvg!} alt={`The chart made from the photo, ${chart.width} by ${chart.height}`} className="max-w-full" data-testid="photo-import-chart" />
                    <figcaption className="text-sm text-bark">Chart</figcaption>
                  </figure>
                  <figure>
                    {/* eslint-disable-next-line @next/next/no-img-element */}
                    <img src={knitSvg!} alt="Knitted preview at true proportions" className="max-w-full" />
                    <figcaption className="text-sm text-bark">Knitted preview (true proportions)</figcaption>
                  </figure>
                </div>
                {answer.report.notes.length ? (
                  <ul className="list-disc pl-5 text-sm" data-testid="photo-import-notes">
                    {answer.report.notes.map((n) => {
                      const said = n.replace(/; cropForGauge .*$/, ""); // the box here always keeps the true proportions
                      return <li key={n}>{said.charAt(0).toUpperCase() + said.slice(1)}.</li>;
                    })}
                  </ul>
                ) : null}
                {answer.report.isolatedReplaced ? <p className="text-sm">Clean-up changed {answer.report.isolatedReplaced} single stray stitches.</p> : null}
                {answer.rounds ? <RoundsCleanupNote rounds={answer.rounds} palette={chart.palette} /> : null}
                {answer.cellsOutside ? <p className="text-sm">{answer.cellsOutside} stitches outside the area&apos;s shape are never knitted; they are left in the first colour.</p> : null}
                <div className="overflow-x-auto">
                  <table className="w-full text-sm [&_td]:px-2 [&_th]:px-2" data-testid="photo-import-colours">
                    <caption className="mb-1 text-left font-semibold">Stitches per colour</caption>
                    <thead>
                      <tr className="border-b border-bark/30 text-left">
                        <th scope="col">Colour</th>
                        <th scope="col" className="text-right">
                          Stitches
                        </th>
                        <th scope="col">Nearest studio yarn</th>
                        <th scope="col" className="text-right">
                          ΔE (CIEDE2000)
                        </th>
                      </tr>
                    </thead>
                    <tbody>
                      {chart.palette.map((c, i) => (
                        <tr key={c.key} className="border-b border-bark/10">
                          <th scope="row" className="text-left font-normal">
                            <span aria-hidden="true" className="mr-2 inline-block h-4 w-4 rounded border border-bark/50 align-middle" style={{ background: c.hex }} />
                            {c.key} · {c.name || c.hex}
                          </th>
                          <td className="text-right tabular-nums">{counts[i]}</td>
                          <td>{nearest[i] ? `${nearest[i]!.yarn.colourName} (${nearest[i]!.yarn.name})` : "no studio yarns"}</td>
                          <td className="text-right tabular-nums">{nearest[i] ? `${nearest[i]!.delta.toFixed(1)}${nearest[i]!.delta < 1 ? " (the same)" : nearest[i]!.delta > 10 ? " (far)" : ""}` : "–"}</td>
                        </tr>
                      ))}
                    </tbody>
                  </table>
                </div>
                <div aria-busy={plan.isFetching}>
                  <h4 className="font-semibold">Colour plan</h4>
                  {plan.isPending ? <p className="text-sm">Working out the plan…</p> : null}
                  {plan.isError ? (
                    <p role="alert" className="text-sm font-semibold text-madder-dark">
                      {(plan.error as Error).message}
                    </p>
                  ) : null}
                  {plan.data ? (
                    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm" data-testid="photo-import-plan">
                      <dt>Knitted</dt>
                      <dd>{plan.data.colours.knit.map((k) => chart.palette.find((c) => c.key === k)?.name ?? k).join(" and ")}</dd>
                      <dt>Darned stitches</dt>
                      <dd>{plan.data.darning.totals.stitches}</dd>
                      <dt>Ends to weave in</dt>
                      <dd>{plan.data.darning.totals.ends}</dd>
                      <dt>Darning time</dt>
                      <dd>{plan.data.darning.totals.minutes.toLocaleString("en-GB", { maximumFractionDigits: 0 })} minutes</dd>
                    </dl>
                  ) : null}
                </div>
                <div>
                  <h4 className="font-semibold">Price</h4>
                  {!props.garment ? <p className="text-sm">No live price: the design has no commission garment to price.</p> : null}
                  {price && !price.ok ? <p className="text-sm font-semibold text-madder-dark">The price could not be worked out: {price.message}</p> : null}
                  {price && price.ok ? (
                    <div className="text-sm" data-testid="photo-import-price">
                      <p className="font-semibold">
                        {price.value.change.changes.length === 0 ? "No change to the price." : `Price change: ${money(price.value.totalDeltaMinor, true)}. ${price.value.change.text}`}
                      </p>
                      <p>New total: {money(price.value.composed.quote.totalMinor)}</p>
                      {price.problems.length ? <p className="font-semibold text-madder-dark">Not counted: {price.problems.map((p) => `${p.label} (${p.message})`).join("; ")}</p> : null}
                    </div>
                  ) : null}
                </div>
                <div className="flex flex-wrap gap-3">
                  <Button onClick={accept} disabled={props.locked}>
                    Accept as a new version
                  </Button>
                  <Button variant="secondary" onClick={close}>
                    Cancel
                  </Button>
                </div>
              </section>
            ) : null}
          </div>
        ) : null}
      </dialog>
    </>
  );
}

/** What the round clean-up folded and what it saves, from the round-by-round plan of this chart. */
function RoundsCleanupNote({ rounds, palette }: { rounds: RoundsCleanup; palette: { key: string; name: string }[] }) {
  const { before: b, after: a, changed, groups } = rounds;
  const name = (key: string) => palette.find((p) => p.key === key)?.name || key;
  const min = (m: number) => m.toLocaleString("en-GB", { maximumFractionDigits: 0 });
  return (
    <div className="text-sm" data-testid="photo-import-rounds">
      <p>
        Two knitted colours per round: {changed.length ? `${groups.folded} speck${groups.folded === 1 ? "" : "s"} folded (${changed.length} stitch${changed.length === 1 ? "" : "es"} changed)` : "nothing to fold"}
        {groups.kept ? `; ${groups.kept} larger darned area${groups.kept === 1 ? "" : "s"} kept` : ""}
        {groups.keptDearer ? `; ${groups.keptDearer} kept because folding cost more` : ""}.
      </p>
      <p>
        Round-by-round plan of this chart, before → after: darned stitches {b.darnedStitches} → {a.darnedStitches}, ends {b.ends} → {a.ends}, about {min(b.minutes)} → {min(a.minutes)} minutes, rounds with more than two colours {b.roundsOverTwo} → {a.roundsOverTwo}.
      </p>
      {changed.length ? (
        <details>
          <summary>Stitches changed (row from the bottom, stitch from the right)</summary>
          <ul className="max-h-40 overflow-auto pl-5">
            {changed.map((c) => (
              <li key={`${c.row}-${c.stitch}`}>
                Row {c.row}, stitch {c.stitch}: {name(c.from)} → {name(c.to)}
              </li>
            ))}
          </ul>
        </details>
      ) : null}
    </div>
  );
}
