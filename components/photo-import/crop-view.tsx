"use client";
// The crop box over the photo: drag inside it to move it, drag its corner handle to resize it, drag
// elsewhere to draw a new one; its aspect is locked to the target's true proportions. Keyboard: the
// box is focusable; arrows move it, Shift+arrows resize it (Alt for fine steps).
import { useEffect, useRef, type KeyboardEvent, type PointerEvent } from "react";
import { boxForKey, boxFromDrag, resizeBox, moveBox, type Box } from "./crop-box";
import type { WorkingImage } from "./decode";

export interface CropViewProps {
  image: WorkingImage;
  box: Box;
  aspect: number;
  onChange: (box: Box) => void;
  /** id of the element describing the box's use (keys) */
  describedBy?: string;
  invalid?: boolean;
}

const DISPLAY_MAX = 520;

export function CropView({ image, box, aspect, onChange, describedBy, invalid }: CropViewProps) {
  const canvas = useRef<HTMLCanvasElement>(null);
  const frame = useRef<HTMLDivElement>(null);
  const drag = useRef<{ kind: "move" | "resize" | "new"; startX: number; startY: number; box: Box } | null>(null);
  const scale = Math.min(1, DISPLAY_MAX / Math.max(image.width, image.height));
  const dw = Math.round(image.width * scale);
  const dh = Math.round(image.height * scale);

  useEffect(() => {
    const c = canvas.current;
    const ctx = c?.getContext("2d");
    if (!c || !ctx) return;
    c.width = dw;
    c.height = dh;
    ctx.imageSmoothingQuality = "high";
    ctx.drawImage(image.canvas, 0, 0, dw, dh);
  }, [image, dw, dh]);

  /** The pointer in working-image pixels. */
  const at = (e: PointerEvent) => {
    const r = frame.current!.getBoundingClientRect();
    return { x: Math.max(0, Math.min(image.width, (e.clientX - r.left) / scale)), y: Math.max(0, Math.min(image.height, (e.clientY - r.top) / scale)) };
  };

  const onDown = (e: PointerEvent<HTMLDivElement>) => {
    const p = at(e);
    const target = e.target as HTMLElement;
    const kind = target.dataset.handle ? "resize" : p.x >= box.x && p.x <= box.x + box.width && p.y >= box.y && p.y <= box.y + box.height ? "move" : "new";
    drag.current = { kind, startX: p.x, startY: p.y, box };
    frame.current?.setPointerCapture(e.pointerId);
    e.preventDefault();
  };
  const onMove = (e: PointerEvent<HTMLDivElement>) => {
    const d = drag.current;
    if (!d) return;
    const p = at(e);
    if (d.kind === "move") onChange(moveBox(d.box, p.x - d.startX, p.y - d.startY, image.width, image.height));
    else if (d.kind === "resize") onChange(boxFromDrag(d.box.x, d.box.y, p.x, p.y, aspect, image.width, image.height));
    else if (Math.abs(p.x - d.startX) + Math.abs(p.y - d.startY) > 3) onChange(boxFromDrag(d.startX, d.startY, p.x, p.y, aspect, image.width, image.height));
  };
  const onUp = (e: PointerEvent<HTMLDivElement>) => {
    drag.current = null;
    frame.current?.releasePointerCapture(e.pointerId);
  };

  const onKey = (e: KeyboardEvent<HTMLDivElement>) => {
    const step = Math.max(1, Math.round(Math.max(image.width, image.height) / (e.altKey ? 200 : 50)));
    const next = boxForKey(box, e.key, e.shiftKey, step, aspect, image.width, image.height);
    if (next) {
      e.preventDefault();
      onChange(next);
    } else if (e.key === "Home") {
      e.preventDefault();
      onChange(resizeBox(box, image.width, aspect, image.width, image.height));
    }
  };

  const pct = (v: number, of: number) => `${(v / of) * 100}%`;
  return (
    <div
      ref={frame}
      className="relative inline-block touch-none select-none overflow-hidden"
      style={{ width: dw, height: dh }}
      onPointerDown={onDown}
      onPointerMove={onMove}
      onPointerUp={onUp}
      onPointerCancel={onUp}
    >
      <canvas ref={canvas} aria-hidden="true" className="block" style={{ width: dw, height: dh }} />
      <div
        role="slider"
        tabIndex={0}
        aria-label="Crop box"
        aria-valuemin={0}
        aria-valuemax={image.width}
        aria-valuenow={box.x}
        aria-valuetext={`${box.width} × ${box.height} pixels, ${box.x} from the left and ${box.y} from the top of the photo`}
        aria-describedby={describedBy}
        aria-invalid={invalid || undefined}
        data-testid="crop-box"
        data-box={`${box.x},${box.y},${box.width},${box.height}`}
        data-image={`${image.width},${image.height}`}
        onKeyDown={onKey}
        className="absolute cursor-move border-2 border-white outline outline-2 outline-peat focus-visible:outline-4 focus-visible:outline-loch"
        style={{ left: pct(box.x, image.width), top: pct(box.y, image.height), width: pct(box.width, image.width), height: pct(box.height, image.height), boxShadow: "0 0 0 9999px rgba(31,26,23,0.45)" }}
      >
        <span data-handle="resize" aria-hidden="true" className="absolute bottom-0 right-0 h-4 w-4 cursor-nwse-resize rounded-sm border-2 border-white bg-peat" />
      </div>
    </div>
  );
}
