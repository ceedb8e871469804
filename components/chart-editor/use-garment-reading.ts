"use client";
// Reads the garment for the live price without blocking the editor: edits are debounced, each
// reading is numbered and posted to a module worker (garment-worker.ts), and only the answer to the
// latest request is kept (older answers are dropped). While a reading is pending the last one stays
// on screen. Where no worker can be started (no Worker, a refused script, a failed clone) the same
// reading runs on the page, one task later.
import { useCallback, useEffect, useRef, useState } from "react";
import type { ChartPiece } from "@/lib/core/pricing/live-price";
import type { SizingResult } from "@/lib/core/sizing";
import { answer, type GarmentAnswer, type GarmentRead, type GarmentRequest, type LivePricing } from "./garment-reading";

const DEBOUNCE_MS = 300;

export interface GarmentReading {
  /** the latest reading answered (kept while a newer one is pending) */
  read: GarmentRead | null;
  /** a newer reading has been asked for and not yet answered */
  pending: boolean;
  /** the reading of the charts as they were when `baselineKey` last changed (null until answered) */
  baseline: { key: string; read: GarmentRead } | null;
}

export function useGarmentReading(sizing: SizingResult | null, charts: ChartPiece[], pricing: LivePricing, baselineKey: string): GarmentReading {
  const [read, setRead] = useState<GarmentRead | null>(null);
  const [pending, setPending] = useState(true);
  const [baseline, setBaseline] = useState<GarmentReading["baseline"]>(null);

  const worker = useRef<Worker | null>(null);
  const seq = useRef(0);
  const latest = useRef(0);
  /** requests posted and not yet answered, to redo on the page if the worker fails */
  const inFlight = useRef(new Map<number, GarmentRequest>());
  /** the request whose answer becomes the baseline, and for which key */
  const baselineAsk = useRef<{ seq: number; key: string } | null>(null);
  const asked = useRef<{ sizing: SizingResult | null; charts: ChartPiece[]; pricing: LivePricing } | null>(null);

  const deliver = useCallback((a: GarmentAnswer) => {
    if (!inFlight.current.delete(a.seq)) return; // answered already (by the page after a worker failure)
    const b = baselineAsk.current;
    if (b && b.seq === a.seq) {
      baselineAsk.current = null;
      setBaseline({ key: b.key, read: a.read });
    }
    if (a.seq !== latest.current) return; // stale: a newer reading is on its way
    setRead(a.read);
    setPending(false);
  }, []);

  const onPage = useCallback((req: GarmentRequest) => setTimeout(() => deliver(answer(req)), 0), [deliver]);

  const ask = useCallback(
    (req: Omit<GarmentRequest, "seq">): number => {
      const r: GarmentRequest = { ...req, seq: ++seq.current };
      latest.current = r.seq;
      asked.current = req;
      inFlight.current.set(r.seq, r);
      setPending(true);
      const w = worker.current;
      if (w) {
        try {
          w.postMessage(r);
          return r.seq;
        } catch {
          // a value that cannot be cloned: read it here instead
        }
      }
      onPage(r);
      return r.seq;
    },
    [onPage],
  );

  // The worker lives as long as the editor. Declared first so that it exists before the first ask.
  useEffect(() => {
    if (typeof Worker === "undefined") return;
    let w: Worker;
    try {
      w = new Worker(new URL("./garment-worker.ts", import.meta.url), { type: "module" });
    } catch {
      return;
    }
    const fail = () => {
      if (worker.current !== w) return;
      worker.current = null;
      w.terminate();
      for (const req of inFlight.current.values()) onPage(req);
    };
    w.onmessage = (e: MessageEvent<GarmentAnswer>) => deliver(e.data);
    w.onerror = fail;
    w.onmessageerror = fail;
    worker.current = w;
    return () => {
      worker.current = null;
      w.terminate();
    };
  }, [deliver, onPage]);

  // Another version opened (and the first render): read it at once; its answer is the baseline.
  useEffect(() => {
    baselineAsk.current = { seq: ask({ sizing, charts, pricing }), key: baselineKey };
    // charts/sizing/pricing are read as they are when the key changes, on purpose
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [baselineKey, ask]);

  // Edits: once editing pauses, unless these very charts were just asked for.
  useEffect(() => {
    const a = asked.current;
    if (a && a.charts === charts && a.sizing === sizing && a.pricing === pricing) return;
    const t = setTimeout(() => ask({ sizing, charts, pricing }), DEBOUNCE_MS);
    return () => clearTimeout(t);
  }, [charts, sizing, pricing, ask]);

  return { read, pending, baseline };
}
