"use client";
// The chart drawn on a canvas at the true stitch shape of its gauge: rasterizeChart + putImageData,
// then row numbers (from the bottom, on the right) and stitch numbers (from the right, below).
import { useEffect, useRef, type KeyboardEvent, type PointerEvent } from "react";
import { getRowPx, rasterizeChart, type Chart, type Point, type Rect } from "@/lib/core/chart";

export const GUTTER_RIGHT = 34;
export const GUTTER_BOTTOM = 22;
const GRID: readonly [number, number, number, number] = [60, 50, 40, 90];

export interface CellMark {
  x: number;
  y: number;
  /** a short label drawn in the cell (a step number), else a quiet bar under the stitch */
  label?: string;
}

export interface ChartCanvasProps {
  chart: Chart;
  /** pixels per stitch across */
  zoom: number;
  selection?: Rect | null;
  /** float marks or a route step, drawn over the stitches */
  marks?: CellMark[];
  cursor?: Point | null;
  /** the area's shape (1 = a real stitch, row-major from the bottom); cells at 0 are drawn hatched: never knitted */
  shape?: Uint8Array | null;
  label: string;
  onCellDown?: (p: Point, e: PointerEvent<HTMLCanvasElement>) => void;
  onCellMove?: (p: Point, e: PointerEvent<HTMLCanvasElement>) => void;
  onCellUp?: (p: Point, e: PointerEvent<HTMLCanvasElement>) => void;
  onKeyDown?: (e: KeyboardEvent<HTMLCanvasElement>) => void;
  touchAction?: "none" | "auto";
}

function labelStep(px: number, need: number): number {
  for (const step of [1, 5, 10, 20, 50, 100]) if (step * px >= need) return step;
  return 100;
}

export function chartPixelSize(chart: Chart, zoom: number) {
  const rowPx = getRowPx(chart, zoom, "gauge");
  return { rowPx, width: chart.width * zoom + GUTTER_RIGHT, height: chart.height * rowPx + GUTTER_BOTTOM };
}

export function ChartCanvas(props: ChartCanvasProps) {
  const { chart, zoom, selection, marks, cursor, shape } = props;
  const ref = useRef<HTMLCanvasElement>(null);
  const rowPx = getRowPx(chart, zoom, "gauge");
  const size = chartPixelSize(chart, zoom);

  useEffect(() => {
    const canvas = ref.current;
    const ctx = canvas?.getContext("2d");
    if (!canvas || !ctx) return;
    const img = rasterizeChart(chart, { pxPerStitch: zoom, aspect: "gauge", grid: zoom >= 4 ? GRID : undefined });
    ctx.fillStyle = "#FBF8F2";
    ctx.fillRect(0, 0, canvas.width, canvas.height);
    ctx.putImageData(new ImageData(img.data as Uint8ClampedArray<ArrayBuffer>, img.width, img.height), 0, 0);
    // Every fifth and tenth line a little darker, as on printed charts.
    if (zoom >= 4) {
      ctx.fillStyle = "rgba(40,30,20,0.55)";
      for (let x = 0; x <= chart.width; x++) if ((chart.width - x) % 10 === 0) ctx.fillRect(x * zoom, 0, 1, chart.height * rowPx);
      for (let r = 0; r <= chart.height; r++) if (r % 10 === 0) ctx.fillRect(0, (chart.height - r) * rowPx, chart.width * zoom, 1);
    }
    // Numbers: rows from the bottom on the right, stitches from the right below.
    ctx.fillStyle = "#3B2F26";
    ctx.font = "10px system-ui, sans-serif";
    ctx.textBaseline = "middle";
    const rowStep = labelStep(rowPx, 12);
    for (let row = 1; row <= chart.height; row++) {
      if (row !== 1 && row % rowStep !== 0) continue;
      ctx.fillText(String(row), chart.width * zoom + 4, (chart.height - row + 0.5) * rowPx);
    }
    const stStep = labelStep(zoom, 20);
    ctx.textAlign = "center";
    for (let st = 1; st <= chart.width; st++) {
      if (st !== 1 && st % stStep !== 0) continue;
      ctx.fillText(String(st), (chart.width - st + 0.5) * zoom, chart.height * rowPx + 11);
    }
    ctx.textAlign = "start";
    const cellRect = (x: number, y: number) => [x * zoom, (chart.height - 1 - y) * rowPx, zoom, rowPx] as const;
    // Outside the area's shape (a narrowing top, a crown sector's end): greyed and hatched, not knitted.
    if (shape && shape.length === chart.width * chart.height) {
      for (let y = 0; y < chart.height; y++) {
        for (let x = 0; x < chart.width; x++) {
          if (shape[y * chart.width + x]) continue;
          const [cx, cy, cw, ch] = cellRect(x, y);
          ctx.fillStyle = "rgba(120,120,120,0.72)";
          ctx.fillRect(cx, cy, cw, ch);
          if (cw >= 5) {
            ctx.strokeStyle = "rgba(255,255,255,0.8)";
            ctx.lineWidth = 1;
            ctx.beginPath();
            ctx.moveTo(cx, cy + ch);
            ctx.lineTo(cx + cw, cy);
            ctx.stroke();
          }
        }
      }
    }
    if (marks?.length) {
      ctx.lineWidth = Math.max(1, Math.round(zoom / 6));
      for (const m of marks) {
        const [cx, cy, cw, ch] = cellRect(m.x, m.y);
        if (m.label !== undefined) {
          ctx.fillStyle = "rgba(255,255,255,0.85)";
          ctx.fillRect(cx + 1, cy + 1, cw - 2, ch - 2);
          ctx.fillStyle = "#1B1B1B";
          ctx.font = `${Math.max(7, Math.min(12, Math.floor(Math.min(cw, ch) * 0.6)))}px system-ui, sans-serif`;
          ctx.textAlign = "center";
          ctx.fillText(m.label, cx + cw / 2, cy + ch / 2);
          ctx.textAlign = "start";
        } else {
          // Float marks are quiet: a thin translucent bar along the bottom of each stitch of the
          // float, so a chart with many long floats stays readable (the plan panel turns them off).
          ctx.fillStyle = "rgba(212,20,90,0.55)";
          ctx.fillRect(cx, cy + ch - Math.max(2, Math.round(ch / 5)), cw, Math.max(2, Math.round(ch / 5)));
        }
      }
    }
    if (selection) {
      const x = selection.x * zoom;
      const y = (chart.height - selection.y - selection.height) * rowPx;
      ctx.setLineDash([4, 3]);
      ctx.strokeStyle = "#111";
      ctx.lineWidth = 1;
      ctx.strokeRect(x + 0.5, y + 0.5, selection.width * zoom - 1, selection.height * rowPx - 1);
      ctx.setLineDash([]);
    }
    if (cursor) {
      const [cx, cy, cw, ch] = cellRect(cursor.x, cursor.y);
      ctx.strokeStyle = "#0B5FFF";
      ctx.lineWidth = 2;
      ctx.strokeRect(cx + 1, cy + 1, cw - 2, ch - 2);
    }
  }, [chart, zoom, rowPx, selection, marks, cursor, shape, size.width, size.height]);

  const toCell = (e: PointerEvent<HTMLCanvasElement>): Point => {
    const r = e.currentTarget.getBoundingClientRect();
    const x = Math.floor((e.clientX - r.left) / zoom);
    const y = chart.height - 1 - Math.floor((e.clientY - r.top) / rowPx);
    return { x: Math.max(0, Math.min(chart.width - 1, x)), y: Math.max(0, Math.min(chart.height - 1, y)) };
  };

  return (
    <canvas
      ref={ref}
      width={size.width}
      height={size.height}
      tabIndex={0}
      aria-label={props.label}
      data-testid="chart-canvas"
      data-zoom={zoom}
      data-row-px={rowPx}
      data-outside-cells={shape ? shape.length - shape.reduce((s, v) => s + v, 0) : 0}
      className="block focus-visible:outline focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-loch"
      style={{ touchAction: props.touchAction ?? "none", width: size.width, height: size.height }}
      onKeyDown={props.onKeyDown}
      onPointerDown={(e) => {
        if (e.button !== 0 && e.pointerType === "mouse") return;
        e.currentTarget.setPointerCapture(e.pointerId);
        props.onCellDown?.(toCell(e), e);
      }}
      onPointerMove={(e) => props.onCellMove?.(toCell(e), e)}
      onPointerUp={(e) => props.onCellUp?.(toCell(e), e)}
      onPointerCancel={(e) => props.onCellUp?.(toCell(e), e)}
    />
  );
}
