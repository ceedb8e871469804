"use client";
// The chart editor: one chart per decorated piece, pure core operations for every tool, undo and
// redo as values, and autosave as new versions through the API (a race keeps both versions).
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { useCallback, useEffect, useMemo, useRef, useState, type KeyboardEvent, type PointerEvent } from "react";
import {
  ANCHORS,
  canRedo,
  canUndo,
  cloneChart,
  copyRegion,
  createHistory,
  drawLine,
  drawRect,
  flipHorizontal,
  flipVertical,
  floodFill,
  getLinePoints,
  getStitchCounts,
  layoutText,
  LetteringError,
  measureText,
  MOTIFS,
  moveRegion,
  placeLettering,
  placeMotif,
  redo,
  renderPreviewSvg,
  resizeChart,
  stampChart,
  tileRepeat,
  undo,
  parseChart,
  type Anchor,
  type Chart,
  type ChartV1,
  type Point,
  type Rect,
} from "@/lib/core/chart";
import { Button } from "@/components/ui/button";
import type { ChartArea, SizingResult } from "@/lib/core/sizing";
import type { RoundPinInput, RoundReading } from "@/lib/core/garment";
import { areaShapeMask, chartDarn, hasOutsideCells, matchArea, outsideMessage, storedPins } from "@/lib/core/design-garment";
import { Notice } from "@/components/ui/notice";
import { useUnsavedChanges } from "@/components/ui/use-unsaved-changes";
import { ChartCanvas, type CellMark } from "./chart-canvas";
import {
  autosaveDelay,
  commitEdit,
  layersOf,
  offChartProblem,
  mirrorForPair,
  nextFreeKey,
  pairArea,
  toEditorEntries,
  toPlacement,
  toStored,
  type EditorEntry,
  type LayerBook,
  type LetteringLayer,
  type StoredEntry,
} from "./editor-model";
import { LivePrice, type LivePricing } from "./live-price";
import { PhotoImport, type ImportTarget, type PhotoChoice } from "@/components/photo-import/photo-import";
import { PlanPanel } from "./plan-panel";

type Tool = "paint" | "fill" | "line" | "rect" | "select" | "eyedropper" | "motif" | "lettering" | "paste" | "pan";

const TOOLS: { id: Tool; label: string; hint: string }[] = [
  { id: "paint", label: "Paint", hint: "Click or drag to colour stitches" },
  { id: "fill", label: "Fill", hint: "Fill an area of one colour" },
  { id: "line", label: "Line", hint: "Drag from one stitch to another" },
  { id: "rect", label: "Rectangle", hint: "Drag a rectangle" },
  { id: "select", label: "Select", hint: "Drag to select; drag inside the selection to move it" },
  { id: "eyedropper", label: "Pick colour", hint: "Click a stitch to use its colour" },
  { id: "motif", label: "Motif", hint: "Click where the motif's bottom-left stitch goes" },
  { id: "lettering", label: "Lettering", hint: "Drag the box the text is centred in" },
  { id: "paste", label: "Paste", hint: "Click where the copied stitches' bottom-left goes" },
  { id: "pan", label: "Pan", hint: "Drag to move the view" },
];

export interface YarnColour {
  id: string;
  name: string;
  colourName: string;
  hex: string;
}

export interface PlanDefaults {
  carryLimitCm: number;
  floatLimitStitches: number;
  floatLimitCm: number;
}

export interface ChartEditorProps {
  designId: string;
  headVersionId: string | null;
  headNumber: number | null;
  entries: StoredEntry[];
  yarns: YarnColour[];
  locked: boolean;
  planDefaults: PlanDefaults;
  /** the studio's pricing, for the live price (left out when the design has no commission) */
  livePricing?: LivePricing;
  inTheRound: boolean;
  /** the commission's sizing (saved, else the brief, else a standard size): the garment the live price reads and the areas' shapes */
  sizing?: SizingResult | null;
  /** said beside the price when the sizing is a stand-in */
  sizingNote?: string | null;
  /** the commission's photos, offered by "Import from a photo" */
  photos?: PhotoChoice[];
}

/** The sizing's chart area an entry is drawn for, when its size still matches. */
function areaFor(sizing: SizingResult | null | undefined, slug: string, chart: Pick<Chart, "width" | "height">): ChartArea | null {
  if (!sizing) return null;
  const found = matchArea({ chartAreas: sizing.charts.map((c) => c.area) }, slug);
  const area = found ? sizing.charts.find((c) => c.area === found.area) : undefined;
  return area && area.width === chart.width && area.height === chart.height ? area : null;
}

/** The first cell an edit paints outside the shape (changed and not background), or null. */
function newPaintOutside(before: Chart, next: Chart, shape: Uint8Array | null): { x: number; y: number } | null {
  if (!shape || shape.length !== next.cells.length) return null;
  const same = before.width === next.width && before.height === next.height;
  for (let i = 0; i < next.cells.length; i++) {
    if (shape[i] || next.cells[i] === 0) continue;
    if (same && before.cells[i] === next.cells[i]) continue;
    return { x: i % next.width, y: Math.floor(i / next.width) };
  }
  return null;
}

type SaveState =
  | { kind: "saved"; number: number | null }
  | { kind: "dirty" }
  | { kind: "saving" }
  | { kind: "conflict"; message: string; savedVersionId: string; savedNumber: number; headVersionId: string | null }
  | { kind: "locked"; message: string }
  | { kind: "error"; message: string };

interface VersionRow {
  id: string;
  number: number;
  parentVersionId: string | null;
  note: string;
  createdAt: string;
  createdByName: string | null;
}

const rectFrom = (a: Point, b: Point): Rect => ({
  x: Math.min(a.x, b.x),
  y: Math.min(a.y, b.y),
  width: Math.abs(a.x - b.x) + 1,
  height: Math.abs(a.y - b.y) + 1,
});
const inside = (r: Rect | null, p: Point) => !!r && p.x >= r.x && p.y >= r.y && p.x < r.x + r.width && p.y < r.y + r.height;


export function ChartEditor(props: ChartEditorProps) {
  const queryClient = useQueryClient();
  const book = useRef<LayerBook>(new WeakMap());
  const [entries, setEntries] = useState<EditorEntry[]>(() => toEditorEntries(props.entries, book.current));
  const [active, setActive] = useState(0);
  const [tool, setTool] = useState<Tool>("paint");
  /** on a touch screen nothing is painted until a tool has been chosen (a tap meant to scroll paints nothing) */
  const [toolChosen, setToolChosen] = useState(false);
  const chooseTool = (t: Tool) => {
    setTool(t);
    setToolChosen(true);
  };
  const touchEdit = useRef(false);
  const dirtySince = useRef<number | null>(null);
  const [colour, setColour] = useState(1);
  const [background, setBackground] = useState(0);
  const [zoom, setZoom] = useState(() => {
    const w = (props.entries[0]?.chart as { width?: number } | undefined)?.width ?? 30;
    // Small charts large, big charts small enough that a repaint stays well inside a frame.
    return Math.max(3, Math.min(14, Math.floor(840 / w)));
  });
  const [preview, setPreview] = useState<Chart | null>(null);
  const [selection, setSelection] = useState<Rect | null>(null);
  const [clipboard, setClipboard] = useState<Chart | null>(null);
  const [copyOnMove, setCopyOnMove] = useState(false);
  const [filledRect, setFilledRect] = useState(false);
  const [motifId, setMotifId] = useState(MOTIFS.find((m) => m.id === "snowflake-small")?.id ?? MOTIFS[0].id);
  const [motifBackground, setMotifBackground] = useState(false);
  const [text, setText] = useState("");
  const [font, setFont] = useState<"5x7" | "3x5">("5x7");
  const [letterBox, setLetterBox] = useState<Rect | null>(null);
  const [rounds, setRounds] = useState<RoundReading[] | null>(null);
  const [message, setMessage] = useState<{ tone: "error" | "success" | "info"; text: string } | null>(null);
  const [cursor, setCursor] = useState<Point | null>(null);
  const [marks, setMarks] = useState<CellMark[]>([]);
  const [parentId, setParentId] = useState<string | null>(props.headVersionId);
  const [revision, setRevision] = useState(0);
  /** bumped when another version is opened, so the live price compares from there */
  const [openedVersion, setOpenedVersion] = useState(0);
  const [save, setSave] = useState<SaveState>(props.locked ? { kind: "locked", message: "The client approved this design, so it is locked." } : { kind: "saved", number: props.headNumber });
  const [resizeW, setResizeW] = useState(String(props.entries[0] ? (props.entries[0].chart as { width: number }).width : 20));
  const [resizeH, setResizeH] = useState(String(props.entries[0] ? (props.entries[0].chart as { height: number }).height : 20));
  const [anchor, setAnchor] = useState<Anchor>("bottom");
  const [yarnToAdd, setYarnToAdd] = useState(props.yarns[0]?.id ?? "");
  const drag = useRef<{ start: Point; last: Point; base: Chart; cells?: Uint8Array; moving?: Rect; preview?: Chart } | null>(null);
  const scroller = useRef<HTMLDivElement>(null);
  const pan = useRef<{ x: number; y: number; left: number; top: number } | null>(null);

  const entry = entries[active];
  const present = entry.history.present;
  const shown = preview ?? present;
  const readOnly = save.kind === "locked";

  useEffect(() => {
    setResizeW(String(present.width));
    setResizeH(String(present.height));
  }, [present.width, present.height]);

  useEffect(() => {
    if (colour >= present.palette.length) setColour(present.palette.length - 1);
    if (background >= present.palette.length) setBackground(0);
  }, [present.palette.length, colour, background]);

  const counts = useMemo(() => getStitchCounts(present), [present]);
  const priceCharts = useMemo(() => entries.map((e) => ({ area: e.area, label: e.label, chart: e.history.present, options: e.options })), [entries]);
  // Pinned pairs live in the first chart's options (the garment reads every chart's pins) and are
  // saved with the version like any edit.
  const firstEntry = entries[0];
  const pins = useMemo(() => storedPins(firstEntry?.options?.pins), [firstEntry]);
  const setPins = useCallback(
    (next: RoundPinInput[]) => {
      if (readOnly) return;
      setEntries((all) =>
        all.map((e, i) => {
          if (i !== 0) return e;
          const { pins: _old, ...rest } = e.options ?? {};
          void _old;
          return { ...e, options: next.length ? { ...rest, pins: next } : rest };
        }),
      );
      setRevision((r) => r + 1);
    },
    [readOnly],
  );
  const pinDarn = useCallback(() => [...new Set(priceCharts.flatMap((c) => chartDarn(c)))], [priceCharts]);
  const area = useMemo(() => areaFor(props.sizing, entry.area, present), [props.sizing, entry.area, present]);
  const shape = useMemo(() => (area && hasOutsideCells(area) ? areaShapeMask(area) : null), [area]);

  /** Replaces the active chart with an edited one (one undo step); paint outside the area's shape is refused. */
  const apply = useCallback(
    (next: Chart, layers?: LetteringLayer[]): boolean => {
      if (readOnly) return false;
      const outside = newPaintOutside(present, next, shape && next.width === present.width && next.height === present.height ? shape : null);
      if (outside) {
        setPreview(null);
        setMessage({ tone: "error", text: `Not painted: ${outsideMessage(next, outside.x, outside.y)}.` });
        return false;
      }
      setEntries((all) => all.map((e, i) => (i === active ? commitEdit(book.current, e, next, layers) : e)));
      setRevision((r) => r + 1);
      return true;
    },
    [active, readOnly, present, shape],
  );

  const run = useCallback(
    (fn: () => Chart | { chart: Chart; layers: LetteringLayer[] }) => {
      try {
        const out = fn();
        const applied = "cells" in out ? apply(out) : apply(out.chart, out.layers);
        if (applied) setMessage(null);
      } catch (e) {
        setMessage({ tone: "error", text: e instanceof Error ? e.message : String(e) });
      }
    },
    [apply],
  );

  const doUndo = useCallback(() => {
    setPreview(null);
    setEntries((all) => all.map((e, i) => (i === active && canUndo(e.history) ? { ...e, history: undo(e.history) } : e)));
    setRevision((r) => r + 1);
  }, [active]);
  const doRedo = useCallback(() => {
    setPreview(null);
    setEntries((all) => all.map((e, i) => (i === active && canRedo(e.history) ? { ...e, history: redo(e.history) } : e)));
    setRevision((r) => r + 1);
  }, [active]);

  // ---- import from a photo: the accepted chart replaces one entry's as one undo step (autosaved) ----
  const importTargets = useMemo(
    (): ImportTarget[] =>
      entries.map((e, i) => {
        const c = e.history.present;
        const found = props.sizing ? matchArea({ chartAreas: props.sizing.charts.map((a) => a.area) }, e.area) : null;
        const garmentArea = found ? (props.sizing?.charts.find((a) => a.area === found.area) ?? null) : null;
        return { index: i, label: e.label, area: garmentArea, width: c.width, height: c.height, gauge: c.gauge };
      }),
    [entries, props.sizing],
  );
  const acceptImport = useCallback(
    (index: number, doc: ChartV1) => {
      if (readOnly) return;
      const chart = parseChart(doc);
      setPreview(null);
      setSelection(null);
      setLetterBox(null);
      setEntries((all) => all.map((e, i) => (i === index ? commitEdit(book.current, e, chart, []) : e)));
      setActive(index);
      setRevision((r) => r + 1);
      setMessage({
        tone: "success",
        text: `The photo's chart (${chart.width} × ${chart.height}) replaced ${entries[index]?.label ?? "the chart"}; it is saved as a new version. Undo brings the previous chart back.`,
      });
    },
    [readOnly, entries],
  );

  // ---- saving ---------------------------------------------------------------------------
  const entriesRef = useRef(entries);
  entriesRef.current = entries;
  const parentRef = useRef(parentId);
  parentRef.current = parentId;
  const savingRef = useRef(false);
  const againRef = useRef(false);
  const revisionRef = useRef(revision);
  revisionRef.current = revision;
  const saveRef = useRef(save);
  saveRef.current = save;
  const saveNowRef = useRef<() => Promise<void>>(async () => undefined);

  const saveNow = useCallback(async () => {
    // One request at a time; an edit made while saving is saved right after.
    if (savingRef.current) {
      againRef.current = true;
      return;
    }
    savingRef.current = true;
    againRef.current = false;
    const rev = revisionRef.current;
    setSave({ kind: "saving" });
    try {
      const res = await fetch(`/api/designs/${props.designId}/versions`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ parentVersionId: parentRef.current, charts: toStored(book.current, entriesRef.current) }),
      });
      const body = await res.json();
      if (res.status === 200 || res.status === 201) {
        setParentId(body.version.id);
        parentRef.current = body.version.id;
        if (revisionRef.current !== rev) againRef.current = true;
        setSave(againRef.current ? { kind: "dirty" } : { kind: "saved", number: body.version.number });
      } else if (res.status === 409 && body.error?.code === "version_conflict") {
        againRef.current = false;
        setSave({ kind: "conflict", message: body.error.message, savedVersionId: body.savedVersionId, savedNumber: body.version.number, headVersionId: body.headVersionId });
      } else if (res.status === 409 && body.error?.code === "design_locked") {
        againRef.current = false;
        setSave({ kind: "locked", message: body.error.message });
      } else {
        againRef.current = false;
        setSave({ kind: "error", message: body.error?.message ?? `Saving failed (${res.status}).` });
      }
    } catch {
      againRef.current = false;
      setSave({ kind: "error", message: "Saving failed: the connection dropped. Your changes are still here; save again when you are back online." });
    } finally {
      savingRef.current = false;
      void queryClient.invalidateQueries({ queryKey: ["design-versions", props.designId] });
      if (againRef.current) void saveNowRef.current();
    }
  }, [props.designId, queryClient]);
  useEffect(() => {
    saveNowRef.current = saveNow;
  }, [saveNow]);

  useEffect(() => {
    if (revision === 0) return;
    const blocked = () => saveRef.current.kind === "conflict" || saveRef.current.kind === "locked";
    if (!blocked()) setSave({ kind: "dirty" });
    // Quick edits make one version: the wait restarts with each edit (longer after taps), up to a maximum.
    const now = Date.now();
    dirtySince.current ??= now;
    const t = setTimeout(() => {
      dirtySince.current = null;
      if (!blocked()) void saveNow();
    }, autosaveDelay({ touch: touchEdit.current, dirtySinceMs: dirtySince.current, nowMs: now }));
    return () => clearTimeout(t);
  }, [revision, saveNow]);
  // An edit still within the autosave delay (or not saved): ask before leaving, and save it at once
  // when the page is hidden or left (pagehide / visibilitychange).
  useUnsavedChanges(["dirty", "saving", "error", "conflict"].includes(save.kind), {
    onLeave: () => {
      if (saveRef.current.kind === "dirty" && !savingRef.current) void saveNowRef.current();
    },
  });

  const versions = useQuery({
    queryKey: ["design-versions", props.designId],
    queryFn: async (): Promise<VersionRow[]> => {
      const res = await fetch(`/api/designs/${props.designId}/versions`);
      if (!res.ok) throw new Error("Could not load the versions.");
      return (await res.json()).versions;
    },
  });

  const loadVersion = useCallback(
    async (versionId: string, makeHead: boolean) => {
      if (makeHead) {
        const put = await fetch(`/api/designs/${props.designId}/head`, {
          method: "PUT",
          headers: { "content-type": "application/json" },
          body: JSON.stringify({ versionId }),
        });
        if (!put.ok) {
          setMessage({ tone: "error", text: (await put.json()).error?.message ?? "Could not open that version." });
          return;
        }
      }
      const res = await fetch(`/api/designs/${props.designId}/versions/${versionId}`);
      const body = await res.json();
      if (!res.ok) {
        setMessage({ tone: "error", text: body.error?.message ?? "Could not open that version." });
        return;
      }
      book.current = new WeakMap();
      setEntries(toEditorEntries(body.version.charts, book.current));
      setActive(0);
      setParentId(versionId);
      parentRef.current = versionId;
      setSelection(null);
      // Viewing an older version of a locked design keeps it locked.
      setSave(saveRef.current.kind === "locked" ? saveRef.current : { kind: "saved", number: body.version.number });
      setOpenedVersion((n) => n + 1);
      void queryClient.invalidateQueries({ queryKey: ["design-versions", props.designId] });
    },
    [props.designId, queryClient],
  );

  const keepMine = useCallback(async () => {
    if (save.kind !== "conflict") return;
    await loadVersion(save.savedVersionId, true);
  }, [save, loadVersion]);

  // ---- keyboard shortcuts -----------------------------------------------------------------
  useEffect(() => {
    const onKey = (e: globalThis.KeyboardEvent) => {
      const target = e.target as HTMLElement | null;
      if (target && (target.tagName === "INPUT" || target.tagName === "TEXTAREA" || target.tagName === "SELECT")) return;
      const mod = e.ctrlKey || e.metaKey;
      if (!mod) return;
      const k = e.key.toLowerCase();
      if (k === "z" && !e.shiftKey) {
        e.preventDefault();
        doUndo();
      } else if ((k === "z" && e.shiftKey) || k === "y") {
        e.preventDefault();
        doRedo();
      } else if (k === "s") {
        e.preventDefault();
        void saveNow();
      } else if (k === "c" && selection) {
        e.preventDefault();
        setClipboard(copyRegion(present, selection));
      }
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [doUndo, doRedo, saveNow, selection, present]);

  // ---- pointer tools ----------------------------------------------------------------------
  const motif = MOTIFS.find((m) => m.id === motifId) ?? MOTIFS[0];

  const ghostAt = useCallback(
    (p: Point): Chart | null => {
      try {
        if (tool === "motif") return placeMotif(present, motif, p, { pattern: colour, ...(motifBackground ? { background } : {}) });
        if (tool === "paste" && clipboard) return stampChart(present, clipboard, p);
      } catch {
        return null;
      }
      return null;
    },
    [tool, present, motif, colour, motifBackground, background, clipboard],
  );

  /** Places the motif or the copied stitches with their bottom-left at `p`; refused with a message when they would not fit. */
  const placeAt = (p: Point) => {
    const size = tool === "motif" ? motif : clipboard;
    if (!size) {
      setMessage({ tone: "info", text: "Copy a selection first, then click where it goes." });
      return;
    }
    const problem = offChartProblem(present, size, p, tool === "motif" ? `motif “${motif.name}”` : "copied block");
    if (problem) {
      setMessage({ tone: "error", text: problem });
      return;
    }
    const g = ghostAt(p);
    if (g && apply(g)) setMessage(null);
  };

  /** The stroke's chart so far: shown at once, committed as one undo step on release. */
  const showStroke = (chart: Chart) => {
    if (drag.current) drag.current.preview = chart;
    setPreview(chart);
  };

  const onDown = (p: Point, e: PointerEvent<HTMLCanvasElement>) => {
    if (tool === "pan") {
      const s = scroller.current;
      if (s) pan.current = { x: e.clientX, y: e.clientY, left: s.scrollLeft, top: s.scrollTop };
      return;
    }
    if (readOnly) return;
    if (e.pointerType === "touch" && !toolChosen) {
      setMessage({ tone: "info", text: "Choose a tool above the chart first (Paint, Fill, …): a tap on the chart paints only after that. Drag with Pan to move around." });
      return;
    }
    touchEdit.current = e.pointerType === "touch";
    setCursor(null);
    switch (tool) {
      case "paint": {
        const cells = present.cells.slice();
        cells[p.y * present.width + p.x] = colour;
        drag.current = { start: p, last: p, base: present, cells };
        showStroke(cloneChart(present, cells.slice()));
        return;
      }
      case "fill":
        run(() => floodFill(present, p, colour));
        return;
      case "eyedropper":
        setColour(present.cells[p.y * present.width + p.x]);
        chooseTool("paint");
        return;
      case "line":
      case "rect":
        drag.current = { start: p, last: p, base: present };
        showStroke(tool === "line" ? drawLine(present, p, p, colour) : drawRect(present, rectFrom(p, p), colour, { filled: filledRect }));
        return;
      case "select":
        drag.current = { start: p, last: p, base: present, moving: inside(selection, p) ? (selection ?? undefined) : undefined };
        if (!drag.current.moving) setSelection({ x: p.x, y: p.y, width: 1, height: 1 });
        return;
      case "lettering":
        drag.current = { start: p, last: p, base: present };
        setLetterBox({ x: p.x, y: p.y, width: 1, height: 1 });
        return;
      case "motif":
      case "paste":
        placeAt(p);
        setPreview(null);
        return;
    }
  };

  const onMove = (p: Point, e: PointerEvent<HTMLCanvasElement>) => {
    if (tool === "pan" && pan.current && scroller.current) {
      scroller.current.scrollLeft = pan.current.left - (e.clientX - pan.current.x);
      scroller.current.scrollTop = pan.current.top - (e.clientY - pan.current.y);
      return;
    }
    const d = drag.current;
    if (!d) {
      if (tool === "motif" || tool === "paste") setPreview(ghostAt(p));
      return;
    }
    if (d.last.x === p.x && d.last.y === p.y) return;
    switch (tool) {
      case "paint": {
        if (!d.cells) return;
        for (const q of getLinePoints(d.last, p)) d.cells[q.y * present.width + q.x] = colour;
        showStroke(cloneChart(d.base, d.cells.slice()));
        break;
      }
      case "line":
        showStroke(drawLine(d.base, d.start, p, colour));
        break;
      case "rect":
        showStroke(drawRect(d.base, rectFrom(d.start, p), colour, { filled: filledRect }));
        break;
      case "select":
        if (d.moving) {
          const to = { x: d.moving.x + p.x - d.start.x, y: d.moving.y + p.y - d.start.y };
          showStroke(copyOnMove ? stampChart(d.base, copyRegion(d.base, d.moving), to) : moveRegion(d.base, d.moving, to, { fill: background }));
          setSelection({ ...d.moving, ...to });
        } else setSelection(rectFrom(d.start, p));
        break;
      case "lettering":
        setLetterBox(rectFrom(d.start, p));
        break;
    }
    d.last = p;
  };

  const onUp = () => {
    pan.current = null;
    const d = drag.current;
    drag.current = null;
    if (!d) return;
    if ((tool === "paint" || tool === "line" || tool === "rect" || (tool === "select" && d.moving)) && d.preview) {
      apply(d.preview);
    }
    setPreview(null);
  };

  /** Keyboard use of the grid: arrows move a cursor; Enter or Space applies the tool there. */
  const onGridKey = (e: KeyboardEvent<HTMLCanvasElement>) => {
    const c = cursor ?? { x: present.width - 1, y: 0 };
    const moves: Record<string, [number, number]> = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, 1], ArrowDown: [0, -1] };
    const m = moves[e.key];
    if (m) {
      e.preventDefault();
      setCursor({ x: Math.max(0, Math.min(present.width - 1, c.x + m[0])), y: Math.max(0, Math.min(present.height - 1, c.y + m[1])) });
      return;
    }
    if ((e.key === "Enter" || e.key === " ") && !readOnly) {
      e.preventDefault();
      if (tool === "fill") run(() => floodFill(present, c, colour));
      else if (tool === "eyedropper") setColour(present.cells[c.y * present.width + c.x]);
      else if (tool === "motif" || tool === "paste") placeAt(c);
      else run(() => cloneChart(present, (() => { const cells = present.cells.slice(); cells[c.y * present.width + c.x] = colour; return cells; })()));
      setCursor(c);
    }
  };

  // ---- actions ------------------------------------------------------------------------------
  const placeText = () => {
    const box = letterBox ?? selection;
    if (!text.trim()) {
      setMessage({ tone: "error", text: "Type the lettering first." });
      return;
    }
    let target: Rect;
    try {
      const need = measureText(text, font);
      target = box ?? {
        x: Math.max(0, Math.floor((present.width - need.width) / 2)),
        y: Math.max(0, Math.floor((present.height - need.height) / 2)),
        width: Math.min(present.width, need.width + 2),
        height: Math.min(present.height, need.height + 2),
      };
      layoutText(text, font, target);
    } catch (e) {
      setMessage({ tone: "error", text: e instanceof LetteringError || e instanceof Error ? e.message : String(e) });
      return;
    }
    const layer: LetteringLayer = {
      text: text.trim(),
      font,
      box: { ...target },
      key: present.palette[colour].key,
      backgroundKey: present.palette[background].key,
    };
    run(() => ({ chart: placeLettering(present, toPlacement(present, layer)), layers: [...layersOf(book.current, present), layer] }));
    setLetterBox(null);
  };

  const makePair = () => {
    if (readOnly) return;
    const { area, suffix } = pairArea(entry.area);
    try {
      const mirrored = mirrorForPair(present, layersOf(book.current, present));
      const existing = entries.findIndex((e) => e.area === area);
      if (existing >= 0) {
        setEntries((all) => all.map((e, i) => (i === existing ? commitEdit(book.current, e, mirrored.chart, mirrored.layers) : e)));
      } else {
        const history = createHistory(mirrored.chart, 200);
        book.current.set(mirrored.chart, mirrored.layers);
        setEntries((all) => [...all, { area, label: `${entry.label.replace(/ \((left|right)\)$/, "")} (${suffix})`, options: entry.options, history }]);
      }
      setRevision((r) => r + 1);
      setMessage({ tone: "success", text: `The ${suffix} piece is ready: the pattern is mirrored and the lettering still reads left to right.` });
    } catch (e) {
      setMessage({ tone: "error", text: (e as Error).message });
    }
  };

  const addYarn = () => {
    const y = props.yarns.find((x) => x.id === yarnToAdd);
    if (!y) return;
    if (present.palette.length >= 16) {
      setMessage({ tone: "error", text: "A chart holds at most 16 colours." });
      return;
    }
    if (present.palette.some((c) => c.hex.toUpperCase() === y.hex.toUpperCase())) {
      setMessage({ tone: "info", text: `${y.colourName} is already in the chart's palette.` });
      return;
    }
    const next = cloneChart(present);
    next.palette.push({ key: nextFreeKey(present), name: y.colourName, hex: y.hex.toUpperCase() });
    apply(next);
    setColour(next.palette.length - 1);
  };

  const tileSelection = () => {
    if (!selection) return;
    run(() => {
      const repeat = copyRegion(present, selection);
      const band = tileRepeat(repeat, present.width, selection.height, { x: selection.x, y: 0 });
      return stampChart(present, band, { x: 0, y: selection.y });
    });
  };

  const doResize = () => {
    const w = Number(resizeW);
    const h = Number(resizeH);
    run(() => resizeChart(present, w, h, anchor, background));
    setSelection(null);
  };

  const saveLabel = (() => {
    switch (save.kind) {
      case "saved":
        return save.number ? `All changes saved (version ${save.number})` : "All changes saved";
      case "dirty":
        return "Unsaved changes…";
      case "saving":
        return "Saving…";
      case "conflict":
        return "Saved as a separate version";
      case "locked":
        return "Locked";
      case "error":
        return "Not saved";
    }
  })();

  // The knitted preview is slow to draw for big charts (hundreds of ms at 300 × 200), so it follows
  // the chart a second after editing pauses, and only on request for very large charts.
  const big = present.width * present.height > 20_000;
  const [previewOf, setPreviewOf] = useState<Chart | null>(big ? null : present);
  useEffect(() => {
    if (big) return;
    const t = setTimeout(() => setPreviewOf(present), 1000);
    return () => clearTimeout(t);
  }, [present, big]);
  const previewSvg = useMemo(() => {
    if (!previewOf) return null;
    const svg = renderPreviewSvg(previewOf, { stitchPx: Math.max(3, Math.min(8, Math.floor(480 / previewOf.width))) });
    return `data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`;
  }, [previewOf]);

  const toolHint = readOnly ? "The design is locked: the tools are off; Pan and the version list still work" : (TOOLS.find((t) => t.id === tool)?.hint ?? "");

  return (
    <div className="grid gap-6 lg:grid-cols-[1fr_20rem]">
      <div className="min-w-0 space-y-4">
        <div className="flex flex-wrap items-center gap-3">
          {entries.length > 1 ? (
            <div role="group" aria-label="Charts in this design" className="flex flex-wrap gap-2">
              {entries.map((e, i) => (
                <Button
                  key={e.area}
                  variant={i === active ? "primary" : "secondary"}
                  aria-pressed={i === active}
                  onClick={() => {
                    setActive(i);
                    setSelection(null);
                    setPreview(null);
                  }}
                >
                  {e.label}
                </Button>
              ))}
            </div>
          ) : (
            <p className="font-semibold">{entry.label}</p>
          )}
          <p className="text-sm text-bark">
            {present.width} stitches × {present.height} rows · {present.gauge.stitchesPer10cm} sts and {present.gauge.rowsPer10cm} rows per 10 cm
          </p>
          <PhotoImport
            targets={importTargets}
            active={active}
            yarns={props.yarns}
            photos={props.photos ?? []}
            currentHexes={present.palette.map((c) => c.hex)}
            locked={readOnly}
            inTheRound={props.inTheRound}
            garment={props.livePricing && props.sizing ? { sizing: props.sizing, charts: priceCharts, pricing: props.livePricing } : null}
            onAccept={acceptImport}
          />
          <p role="status" aria-live="polite" data-testid="save-state" data-state={save.kind} className="ml-auto text-sm font-semibold">
            {saveLabel}
          </p>
        </div>

        {save.kind === "conflict" ? (
          <Notice tone="caution" title="Another tab saved a newer version">
            <p>{save.message}</p>
            <div className="mt-2 flex flex-wrap gap-2">
              <Button variant="secondary" onClick={() => void keepMine()}>
                Keep mine (version {save.savedNumber}) as current
              </Button>
              {save.headVersionId ? (
                <Button variant="secondary" onClick={() => void loadVersion(save.headVersionId!, false)}>
                  Open the newer version
                </Button>
              ) : null}
            </div>
          </Notice>
        ) : null}
        {save.kind === "locked" ? <Notice tone="info" title="This design is locked">{save.message}</Notice> : null}
        {save.kind === "error" ? (
          <Notice tone="error" title="Not saved">
            {save.message}{" "}
            <Button variant="quiet" onClick={() => void saveNow()}>
              Try again
            </Button>
          </Notice>
        ) : null}
        {message ? <Notice tone={message.tone === "error" ? "error" : message.tone === "success" ? "success" : "info"}>{message.text}</Notice> : null}

        <div role="toolbar" aria-label="Tools" className="flex flex-wrap gap-2">
          {TOOLS.map((t) => (
            <button
              key={t.id}
              type="button"
              aria-pressed={tool === t.id && !(readOnly && t.id !== "pan")}
              title={readOnly && t.id !== "pan" ? "The design is locked" : t.hint}
              disabled={readOnly && t.id !== "pan"}
              onClick={() => {
                chooseTool(t.id);
                setPreview(null);
              }}
              className={`rounded-md border px-3 py-1.5 text-sm font-semibold focus-visible:outline focus-visible:outline-2 focus-visible:outline-loch disabled:cursor-not-allowed disabled:border-dashed disabled:bg-fleece disabled:text-bark ${tool === t.id && !(readOnly && t.id !== "pan") ? "border-peat bg-peat text-white" : "border-bark/40 bg-white text-peat hover:bg-fleece"}`}
            >
              {t.label}
            </button>
          ))}
          <span className="mx-1 border-l border-bark/30" aria-hidden="true" />
          <Button variant="secondary" className="!px-3 !py-1.5 text-sm" onClick={doUndo} disabled={readOnly || !canUndo(entry.history)} aria-keyshortcuts="Control+Z Meta+Z">
            Undo
          </Button>
          <Button variant="secondary" className="!px-3 !py-1.5 text-sm" onClick={doRedo} disabled={readOnly || !canRedo(entry.history)} aria-keyshortcuts="Control+Shift+Z Control+Y">
            Redo
          </Button>
          <span className="mx-1 border-l border-bark/30" aria-hidden="true" />
          <Button variant="secondary" className="!px-3 !py-1.5 text-sm" onClick={() => setZoom((z) => Math.max(2, z - 2))} aria-label="Zoom out">
            −
          </Button>
          <span className="self-center text-sm" aria-live="polite">
            {zoom} px per stitch
          </span>
          <Button variant="secondary" className="!px-3 !py-1.5 text-sm" onClick={() => setZoom((z) => Math.min(40, z + 2))} aria-label="Zoom in">
            +
          </Button>
        </div>
        <p className="text-sm text-bark">
          {toolHint}. Keyboard: Tab to the chart, arrows move, Enter applies. Ctrl or ⌘ Z undoes, Shift Z or Ctrl Y redoes, Ctrl S saves now.
        </p>

        <div ref={scroller} className="max-h-[70vh] overflow-auto rounded-md border border-bark/30 bg-paper p-2">
          <ChartCanvas
            chart={shown}
            zoom={zoom}
            selection={tool === "lettering" ? letterBox : selection}
            marks={marks}
            cursor={cursor}
            shape={shape}
            label={`Chart ${entry.label}, ${present.width} stitches by ${present.height} rows. Tool: ${TOOLS.find((t) => t.id === tool)?.label}.${cursor ? ` Row ${cursor.y + 1}, stitch ${present.width - cursor.x}.` : ""}`}
            onCellDown={onDown}
            onCellMove={onMove}
            onCellUp={onUp}
            onKeyDown={onGridKey}
          />
        </div>
        {cursor ? (
          <p className="text-sm" aria-live="polite">
            Row {cursor.y + 1}, stitch {present.width - cursor.x}
            {shape && !shape[cursor.y * present.width + cursor.x] ? " (outside the shape: not knitted)" : ""}
          </p>
        ) : null}
        {shape ? (
          <p className="text-sm text-bark" data-testid="shape-note">
            Grey hatched cells lie outside the {area?.area}&apos;s shape ({area?.note}): they are never knitted and cannot be painted.
          </p>
        ) : null}

        <div className="grid gap-4 md:grid-cols-2">
          <fieldset className="rounded-md border border-bark/30 p-3 disabled:opacity-60" disabled={readOnly}>
            <legend className="px-1 font-semibold">Shape and repeat</legend>
            <div className="flex flex-wrap gap-2">
              <Button variant="secondary" className="!px-3 !py-1.5 text-sm" onClick={() => run(() => flipHorizontal(present, selection ?? undefined))}>
                Flip left–right{selection ? " (selection)" : ""}
              </Button>
              <Button variant="secondary" className="!px-3 !py-1.5 text-sm" onClick={() => run(() => flipVertical(present, selection ?? undefined))}>
                Flip top–bottom{selection ? " (selection)" : ""}
              </Button>
              <Button variant="secondary" className="!px-3 !py-1.5 text-sm" onClick={makePair}>
                Make mirrored pair
              </Button>
            </div>
            <div className="mt-3 flex flex-wrap items-end gap-2">
              <label className="flex flex-col text-sm">
                Width (stitches)
                <input className="w-24 rounded-md border border-bark/40 px-2 py-1" type="number" min={1} max={400} value={resizeW} onChange={(e) => setResizeW(e.target.value)} />
              </label>
              <label className="flex flex-col text-sm">
                Height (rows)
                <input className="w-24 rounded-md border border-bark/40 px-2 py-1" type="number" min={1} max={400} value={resizeH} onChange={(e) => setResizeH(e.target.value)} />
              </label>
              <label className="flex flex-col text-sm">
                Keep in place
                <select className="rounded-md border border-bark/40 px-2 py-1" value={anchor} onChange={(e) => setAnchor(e.target.value as Anchor)}>
                  {ANCHORS.map((a) => (
                    <option key={a} value={a}>
                      {a}
                    </option>
                  ))}
                </select>
              </label>
              <Button variant="secondary" className="!px-3 !py-1.5 text-sm" onClick={doResize}>
                Resize
              </Button>
            </div>
            <p className="mt-3 text-sm text-bark">{selection ? `Selection: ${selection.width} × ${selection.height} stitches.` : "Select stitches with the Select tool to copy, crop or tile them."}</p>
            <div className="mt-2 flex flex-wrap gap-2">
              <Button variant="secondary" className="!px-3 !py-1.5 text-sm" disabled={!selection} onClick={() => selection && setClipboard(copyRegion(present, selection))}>
                Copy selection
              </Button>
              <Button variant="secondary" className="!px-3 !py-1.5 text-sm" disabled={!selection} onClick={() => {
                if (!selection) return;
                run(() => copyRegion(present, selection));
                setSelection(null);
              }}>
                Crop to selection
              </Button>
              <Button variant="secondary" className="!px-3 !py-1.5 text-sm" disabled={!selection} onClick={tileSelection}>
                Tile selection across
              </Button>
              <Button variant="secondary" className="!px-3 !py-1.5 text-sm" disabled={!selection} onClick={() => setSelection(null)}>
                Clear selection
              </Button>
            </div>
            <label className="mt-2 flex items-center gap-2 text-sm">
              <input type="checkbox" checked={copyOnMove} onChange={(e) => setCopyOnMove(e.target.checked)} /> Dragging a selection copies it (instead of moving)
            </label>
            <label className="mt-1 flex items-center gap-2 text-sm">
              <input type="checkbox" checked={filledRect} onChange={(e) => setFilledRect(e.target.checked)} /> Filled rectangles
            </label>
          </fieldset>

          <fieldset className="rounded-md border border-bark/30 p-3 disabled:opacity-60" disabled={readOnly}>
            <legend className="px-1 font-semibold">Motifs and lettering</legend>
            <div className="flex flex-wrap items-end gap-2">
              <label className="flex flex-col text-sm">
                Motif
                <select className="rounded-md border border-bark/40 px-2 py-1" value={motifId} onChange={(e) => setMotifId(e.target.value)}>
                  {MOTIFS.map((m) => (
                    <option key={m.id} value={m.id}>
                      {m.name} ({m.width} × {m.height})
                    </option>
                  ))}
                </select>
              </label>
              <Button variant="secondary" className="!px-3 !py-1.5 text-sm" onClick={() => chooseTool("motif")}>
                Place motif
              </Button>
            </div>
            <label className="mt-1 flex items-center gap-2 text-sm">
              <input type="checkbox" checked={motifBackground} onChange={(e) => setMotifBackground(e.target.checked)} /> Paint the motif&apos;s background too
            </label>
            <div className="mt-3 flex flex-wrap items-end gap-2">
              <label className="flex flex-col text-sm">
                Lettering
                <input className="w-32 rounded-md border border-bark/40 px-2 py-1" value={text} maxLength={60} onChange={(e) => setText(e.target.value)} />
              </label>
              <label className="flex flex-col text-sm">
                Font
                <select className="rounded-md border border-bark/40 px-2 py-1" value={font} onChange={(e) => setFont(e.target.value as "5x7" | "3x5")}>
                  <option value="5x7">5 × 7</option>
                  <option value="3x5">3 × 5 (compact)</option>
                </select>
              </label>
              <Button variant="secondary" className="!px-3 !py-1.5 text-sm" onClick={placeText}>
                Place lettering
              </Button>
            </div>
            <p className="mt-2 text-sm text-bark">
              {letterBox
                ? `Box: ${letterBox.width} × ${letterBox.height} stitches.`
                : "Drag a box with the Lettering tool, or the text is centred on the chart."}{" "}
              Ink is the chosen colour, the box is filled with the background colour.
            </p>
          </fieldset>
        </div>

        <section aria-labelledby="preview-heading" className="rounded-md border border-bark/30 bg-white p-3">
          <h2 id="preview-heading" className="mb-2 text-lg">
            Knitted preview (true proportions)
          </h2>
          {big ? (
            <Button variant="secondary" className="mb-2 !px-3 !py-1.5 text-sm" onClick={() => setPreviewOf(present)}>
              {previewSvg ? "Redraw the preview" : "Draw the preview"}
            </Button>
          ) : null}
          {previewSvg ? (
            // eslint-disable-next-line @next/next/no-img-element
            <img src={previewSvg} alt={`Knitted preview of ${entry.label}`} className="max-w-full" />
          ) : null}
        </section>

        <PlanPanel
          chart={present}
          defaults={props.planDefaults}
          inTheRound={props.inTheRound}
          onMarks={setMarks}
          rounds={rounds}
          pinning={
            firstEntry
              ? { pins, palette: firstEntry.history.present.palette.map((c) => ({ key: c.key, name: c.name || c.key })), darn: pinDarn, onChange: setPins, readOnly }
              : undefined
          }
        />
        {props.livePricing ? <LivePrice charts={priceCharts} pricing={props.livePricing} baselineKey={String(openedVersion)} sizing={props.sizing ?? null} sizingNote={props.sizingNote ?? null} onRounds={setRounds} /> : null}
      </div>

      <aside className="space-y-4">
        <fieldset className="rounded-md border border-bark/30 bg-white p-3" disabled={readOnly}>
          <legend className="px-1 font-semibold">Colours</legend>
          <ul className="space-y-1">
            {present.palette.map((c, i) => (
              <li key={c.key} className="flex items-center gap-2">
                <input
                  id={`colour-${c.key}`}
                  type="radio"
                  name="paint-colour"
                  checked={colour === i}
                  onChange={() => setColour(i)}
                />
                <label htmlFor={`colour-${c.key}`} className="flex flex-1 items-center gap-2">
                  <span aria-hidden="true" className="inline-block h-5 w-5 rounded border border-bark/50" style={{ background: c.hex }} />
                  <span className="font-mono text-sm">{c.key}</span>
                  <span>{c.name}</span>
                  <span className="ml-auto text-sm tabular-nums text-bark" data-testid={`count-${c.key}`}>
                    {counts[i]} sts
                  </span>
                </label>
              </li>
            ))}
          </ul>
          <label className="mt-3 flex flex-col text-sm">
            Background (moves, resizes, lettering box)
            <select className="rounded-md border border-bark/40 px-2 py-1" value={background} onChange={(e) => setBackground(Number(e.target.value))}>
              {present.palette.map((c, i) => (
                <option key={c.key} value={i}>
                  {c.key} · {c.name}
                </option>
              ))}
            </select>
          </label>
          {props.yarns.length ? (
            <div className="mt-3 flex items-end gap-2">
              <label className="flex flex-1 flex-col text-sm">
                Add a studio yarn
                <select className="rounded-md border border-bark/40 px-2 py-1" value={yarnToAdd} onChange={(e) => setYarnToAdd(e.target.value)}>
                  {props.yarns.map((y) => (
                    <option key={y.id} value={y.id}>
                      {y.colourName} ({y.name})
                    </option>
                  ))}
                </select>
              </label>
              <Button variant="secondary" className="!px-3 !py-1.5 text-sm" onClick={addYarn}>
                Add
              </Button>
            </div>
          ) : null}
        </fieldset>

        <section aria-labelledby="versions-heading" className="rounded-md border border-bark/30 bg-white p-3">
          <h2 id="versions-heading" className="mb-2 text-lg">
            Versions
          </h2>
          <Button variant="secondary" className="mb-2 !px-3 !py-1.5 text-sm" onClick={() => void saveNow()} disabled={readOnly || save.kind === "saving"}>
            Save now
          </Button>
          {versions.isPending ? <p className="text-sm">Loading versions…</p> : null}
          {versions.isError ? <p className="text-sm text-madder-dark">Could not load the versions.</p> : null}
          {/* Focusable so the list scrolls from the keyboard even when no button is in it (a locked design). */}
          <ol className="max-h-72 space-y-1 overflow-auto text-sm focus-visible:outline focus-visible:outline-2 focus-visible:outline-loch" data-testid="version-list" tabIndex={0} aria-labelledby="versions-heading">
            {(versions.data ?? []).map((v) => (
              <li key={v.id} className="flex items-center gap-2">
                <span>
                  Version {v.number}
                  {v.id === parentId ? " (open)" : ""}
                  <span className="block text-bark">
                    {new Date(v.createdAt).toLocaleString("en-GB", { dateStyle: "short", timeStyle: "short" })}
                    {v.createdByName ? ` · ${v.createdByName}` : ""}
                  </span>
                </span>
                {v.id !== parentId && !readOnly ? (
                  <Button variant="quiet" className="ml-auto !px-1 !py-0 text-sm" onClick={() => void loadVersion(v.id, true)} aria-label={`Open version ${v.number} as current`}>
                    Open
                  </Button>
                ) : null}
                {v.id !== parentId && readOnly ? (
                  <Button variant="quiet" className="ml-auto !px-1 !py-0 text-sm" onClick={() => void loadVersion(v.id, false)} aria-label={`View version ${v.number} (the design stays locked)`}>
                    View
                  </Button>
                ) : null}
              </li>
            ))}
          </ol>
        </section>
      </aside>
    </div>
  );
}
