"use client";
// Starts a design: chart sizes offered by the sizing core (or chosen by hand), two yarns to knit.
import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import type { SizeOffer } from "@/lib/server/design-sizes";

interface Yarn {
  id: string;
  name: string;
  colourName: string;
  hex: string;
}

const FALLBACK = [
  { key: "A", name: "Main", hex: "#F2EEE4" },
  { key: "B", name: "Contrast", hex: "#2E5A7A" },
];

export function NewDesignForm(props: {
  commissionId: string;
  defaultTitle: string;
  offers: SizeOffer[];
  sizeNote: string;
  gauge: { stitchesPer10cm: number; rowsPer10cm: number };
  yarns: Yarn[];
}) {
  const router = useRouter();
  const [title, setTitle] = useState(props.defaultTitle);
  // One chart per decorated area of the garment, at the area's size (the maker unticks what stays plain).
  const [picked, setPicked] = useState<string[]>(props.offers.map((o) => o.area));
  const [width, setWidth] = useState("30");
  const [height, setHeight] = useState("40");
  const [sts, setSts] = useState(String(props.gauge.stitchesPer10cm));
  const [rows, setRows] = useState(String(props.gauge.rowsPer10cm));
  const [main, setMain] = useState(props.yarns[0]?.id ?? "");
  const [contrast, setContrast] = useState(props.yarns[3]?.id ?? props.yarns[1]?.id ?? "");
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  const palette = () => {
    const m = props.yarns.find((y) => y.id === main);
    const c = props.yarns.find((y) => y.id === contrast);
    if (!m || !c) return FALLBACK;
    return [
      { key: "A", name: m.colourName, hex: m.hex },
      { key: "B", name: c.colourName, hex: c.hex },
    ];
  };

  const blank = (w: number, h: number) => ({
    version: 1,
    width: w,
    height: h,
    gauge: { stitchesPer10cm: Number(sts), rowsPer10cm: Number(rows) },
    palette: palette(),
    rows: Array.from({ length: h }, () => "A".repeat(w)),
  });

  async function submit(e: FormEvent) {
    e.preventDefault();
    setErrors({});
    setMessage(null);
    if (main && contrast && main === contrast) {
      setErrors({ contrast: ["Choose two different yarns."] });
      return;
    }
    const chosen = props.offers.filter((o) => picked.includes(o.area));
    const charts = chosen.length
      ? chosen.map((o) => ({ area: o.area, label: o.label, chart: blank(o.width, o.height) }))
      : [{ area: "chart", label: "Chart", chart: blank(Math.round(Number(width)), Math.round(Number(height))) }];
    setPending(true);
    try {
      const res = await fetch("/api/designs", {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ commissionId: props.commissionId, title, charts }),
      });
      const body = await res.json();
      if (res.status === 201) {
        router.push(`/studio/designs/${body.design.id}`);
        return;
      }
      setMessage(body.error?.message ?? "The design could not be created.");
      const fe: Record<string, string[]> = {};
      for (const [k, v] of Object.entries((body.error?.fieldErrors ?? {}) as Record<string, string[]>)) {
        if (k === "title") fe.title = v;
        else if (/width/.test(k)) fe.width = v;
        else if (/height/.test(k)) fe.height = v;
        else if (/gauge/.test(k)) fe.gauge = v;
      }
      setErrors(fe);
    } finally {
      setPending(false);
    }
  }

  return (
    <form onSubmit={submit} className="flex max-w-2xl flex-col gap-4" aria-label="New design" noValidate>
      {message ? <Notice tone="error">{message}</Notice> : null}
      <Field label="Title" name="title" value={title} onChange={(e) => setTitle(e.target.value)} errors={errors.title} required />
      <fieldset className="rounded-md border border-bark/30 p-3">
        <legend className="px-1 font-semibold">Charts</legend>
        <p className="mb-2 text-sm text-bark">{props.sizeNote}</p>
        {props.offers.length ? (
          <ul className="space-y-1">
            {props.offers.map((o) => (
              <li key={o.area}>
                <label className="flex items-start gap-2">
                  <input
                    type="checkbox"
                    className="mt-1"
                    checked={picked.includes(o.area)}
                    onChange={(e) => setPicked((p) => (e.target.checked ? [...p, o.area] : p.filter((a) => a !== o.area)))}
                  />
                  <span>
                    {o.label}: {o.width} stitches × {o.height} rows <span className="block text-sm text-bark">{o.note}</span>
                  </span>
                </label>
              </li>
            ))}
          </ul>
        ) : null}
        {picked.length === 0 ? (
          <div className="mt-2 flex flex-wrap gap-3">
            <Field label="Width (stitches)" name="width" type="number" min={1} max={400} value={width} onChange={(e) => setWidth(e.target.value)} errors={errors.width} />
            <Field label="Height (rows)" name="height" type="number" min={1} max={400} value={height} onChange={(e) => setHeight(e.target.value)} errors={errors.height} />
          </div>
        ) : null}
        <div className="mt-2 flex flex-wrap gap-3">
          <Field label="Stitches per 10 cm" name="sts" type="number" step="0.5" value={sts} onChange={(e) => setSts(e.target.value)} errors={errors.gauge} />
          <Field label="Rows per 10 cm" name="rows" type="number" step="0.5" value={rows} onChange={(e) => setRows(e.target.value)} />
        </div>
      </fieldset>
      {props.yarns.length ? (
        <fieldset className="flex flex-wrap gap-3 rounded-md border border-bark/30 p-3">
          <legend className="px-1 font-semibold">Yarns to start with</legend>
          <label className="flex flex-col">
            <span className="font-semibold">Main colour</span>
            <select className="rounded-md border border-bark/40 px-3 py-2" value={main} onChange={(e) => setMain(e.target.value)}>
              {props.yarns.map((y) => (
                <option key={y.id} value={y.id}>
                  {y.colourName}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col">
            <span className="font-semibold">Contrast</span>
            <select className="rounded-md border border-bark/40 px-3 py-2" value={contrast} onChange={(e) => setContrast(e.target.value)} aria-invalid={errors.contrast ? true : undefined}>
              {props.yarns.map((y) => (
                <option key={y.id} value={y.id}>
                  {y.colourName}
                </option>
              ))}
            </select>
            {errors.contrast ? <span role="alert" className="text-sm font-semibold text-madder-dark">{errors.contrast.join(" ")}</span> : null}
          </label>
        </fieldset>
      ) : null}
      <div>
        <Button type="submit" disabled={pending}>
          {pending ? "Creating…" : "Create design"}
        </Button>
      </div>
    </form>
  );
}
