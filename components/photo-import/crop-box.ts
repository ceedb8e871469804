// The crop box of the photo import, as plain functions (no DOM): its aspect is the target area's true
// shape at the gauge (a stitch is wider than it is tall), it stays inside the photo, and the keyboard
// moves and resizes it. Coordinates are in pixels of the working image, x from the left, y from the top.

export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface GaugeLike {
  stitchesPer10cm: number;
  rowsPer10cm: number;
}

/**
 * Width ÷ height of the knitted area: (stitches ÷ stitches per cm) ÷ (rows ÷ rows per cm).
 * 40 stitches by 40 rows at 32 sts and 36 rows per 10 cm is 12.5 cm by 11.1 cm: 1.125.
 */
export function trueAspect(stitches: number, rows: number, gauge: GaugeLike): number {
  if (!(stitches > 0 && rows > 0 && gauge.stitchesPer10cm > 0 && gauge.rowsPer10cm > 0)) throw new RangeError("stitches, rows and the gauge must be positive");
  return (stitches / gauge.stitchesPer10cm) / (rows / gauge.rowsPer10cm);
}

/** The largest box of that aspect centred in the image (whole pixels, at least 1 × 1). */
export function centredBox(imageW: number, imageH: number, aspect: number): Box {
  let width = imageW;
  let height = width / aspect;
  if (height > imageH) {
    height = imageH;
    width = height * aspect;
  }
  const w = Math.max(1, Math.min(imageW, Math.round(width)));
  const h = Math.max(1, Math.min(imageH, Math.round(height)));
  return { x: Math.floor((imageW - w) / 2), y: Math.floor((imageH - h) / 2), width: w, height: h };
}

const clamp = (v: number, lo: number, hi: number) => Math.max(lo, Math.min(hi, v));

/** Moves the box by (dx, dy), kept inside the image. */
export function moveBox(box: Box, dx: number, dy: number, imageW: number, imageH: number): Box {
  return { ...box, x: clamp(Math.round(box.x + dx), 0, imageW - box.width), y: clamp(Math.round(box.y + dy), 0, imageH - box.height) };
}

/**
 * Resizes the box to a new width at the locked aspect, keeping its centre where it can and staying
 * inside the image; never smaller than `minWidth` pixels across (nor than the image allows).
 */
export function resizeBox(box: Box, newWidth: number, aspect: number, imageW: number, imageH: number, minWidth = 8): Box {
  const maxW = Math.min(imageW, imageH * aspect);
  const w = clamp(newWidth, Math.min(minWidth, maxW), maxW);
  const width = Math.max(1, Math.round(w));
  const height = Math.max(1, Math.min(imageH, Math.round(w / aspect)));
  const cx = box.x + box.width / 2;
  const cy = box.y + box.height / 2;
  return {
    width,
    height,
    x: clamp(Math.round(cx - width / 2), 0, imageW - width),
    y: clamp(Math.round(cy - height / 2), 0, imageH - height),
  };
}

/**
 * A box dragged from an anchor corner to a pointer: as wide as the drag asks (or as tall, whichever
 * is larger at the aspect), on the side the pointer is, clipped to the image.
 */
export function boxFromDrag(anchorX: number, anchorY: number, toX: number, toY: number, aspect: number, imageW: number, imageH: number, minWidth = 8): Box {
  const dx = toX - anchorX;
  const dy = toY - anchorY;
  const left = dx < 0;
  const up = dy < 0;
  // room from the anchor towards the pointer
  const roomW = left ? anchorX : imageW - anchorX;
  const roomH = up ? anchorY : imageH - anchorY;
  let w = Math.max(Math.abs(dx), Math.abs(dy) * aspect, minWidth);
  w = Math.min(w, roomW, roomH * aspect);
  const width = Math.max(1, Math.round(w));
  const height = Math.max(1, Math.round(w / aspect));
  const x = clamp(Math.round(left ? anchorX - width : anchorX), 0, Math.max(0, imageW - width));
  const y = clamp(Math.round(up ? anchorY - height : anchorY), 0, Math.max(0, imageH - height));
  return { x, y, width, height };
}

/**
 * What a key does to the box: arrows move it by `step` pixels, Shift+arrows resize it (right and up
 * grow, left and down shrink), by `step` pixels across. Null for any other key.
 */
export function boxForKey(box: Box, key: string, shift: boolean, step: number, aspect: number, imageW: number, imageH: number): Box | null {
  const moves: Record<string, [number, number]> = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, -1], ArrowDown: [0, 1] };
  const m = moves[key];
  if (!m) return null;
  if (shift) {
    const grow = key === "ArrowRight" || key === "ArrowUp" ? 1 : -1;
    return resizeBox(box, box.width + grow * step * 2, aspect, imageW, imageH);
  }
  return moveBox(box, m[0] * step, m[1] * step, imageW, imageH);
}

/**
 * The pixel size to scale a crop to before quantising: about `times` the target in each direction,
 * one scale for both (so the proportions stay), never scaled up.
 */
export function workingSize(crop: Pick<Box, "width" | "height">, stitches: number, rows: number, times = 4): { width: number; height: number } {
  const scale = Math.min(1, Math.max((stitches * times) / crop.width, (rows * times) / crop.height));
  return { width: Math.max(1, Math.round(crop.width * scale)), height: Math.max(1, Math.round(crop.height * scale)) };
}
