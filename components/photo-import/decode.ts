// Decoding a photo in the browser for the import: its header is checked first (type by its bytes,
// pixel count) so that nothing too large or not a photo is ever decoded; then the browser decodes it,
// scaled down on the way to a working image of at most WORKING_EDGE pixels along its longer side.
// The crop is then drawn from the working image at a few times the chart's size (canvas resampling).
import type { Box } from "./crop-box";
import { checkPhotoHeader } from "./image-header";

/** The working image's longer side: enough for a crop a few times a 400-stitch chart, light to hold. */
export const WORKING_EDGE = 1600;

export interface WorkingImage {
  /** the decoded photo at working size, drawn into a canvas */
  canvas: HTMLCanvasElement;
  width: number;
  height: number;
  /** the photo's own size in pixels */
  naturalWidth: number;
  naturalHeight: number;
}

export class PhotoError extends Error {}

export async function decodePhoto(blob: Blob): Promise<WorkingImage> {
  const head = new Uint8Array(await blob.slice(0, 256 * 1024).arrayBuffer());
  const check = checkPhotoHeader(head, blob.size);
  if (!check.ok) throw new PhotoError(check.message);
  const scale = Math.min(1, WORKING_EDGE / Math.max(check.width, check.height));
  const width = Math.max(1, Math.round(check.width * scale));
  const height = Math.max(1, Math.round(check.height * scale));
  let source: CanvasImageSource;
  let close = () => undefined as void;
  try {
    if (typeof createImageBitmap === "function") {
      const bitmap = await createImageBitmap(blob, { resizeWidth: width, resizeHeight: height, resizeQuality: "high", imageOrientation: "from-image" });
      source = bitmap;
      close = () => bitmap.close();
    } else {
      source = await loadImg(blob);
    }
  } catch {
    throw new PhotoError("That photo could not be read; it may be damaged.");
  }
  const canvas = document.createElement("canvas");
  canvas.width = width;
  canvas.height = height;
  const ctx = canvas.getContext("2d");
  if (!ctx) throw new PhotoError("This browser cannot draw the photo (no canvas).");
  ctx.imageSmoothingEnabled = true;
  ctx.imageSmoothingQuality = "high";
  ctx.drawImage(source, 0, 0, width, height);
  close();
  return { canvas, width, height, naturalWidth: check.width, naturalHeight: check.height };
}

function loadImg(blob: Blob): Promise<HTMLImageElement> {
  const url = URL.createObjectURL(blob);
  return new Promise((resolve, reject) => {
    const img = new Image();
    img.onload = () => {
      URL.revokeObjectURL(url);
      resolve(img);
    };
    img.onerror = () => {
      URL.revokeObjectURL(url);
      reject(new Error("not decoded"));
    };
    img.src = url;
  });
}

/** The crop's pixels (RGBA, top row first), resampled by the canvas to `size`. */
export function cropPixels(image: WorkingImage, crop: Box, size: { width: number; height: number }): { width: number; height: number; data: Uint8ClampedArray } {
  const canvas = document.createElement("canvas");
  canvas.width = size.width;
  canvas.height = size.height;
  const ctx = canvas.getContext("2d", { willReadFrequently: true });
  if (!ctx) throw new PhotoError("This browser cannot draw the photo (no canvas).");
  ctx.imageSmoothingEnabled = true;
  ctx.imageSmoothingQuality = "high";
  ctx.drawImage(image.canvas, crop.x, crop.y, crop.width, crop.height, 0, 0, size.width, size.height);
  const data = ctx.getImageData(0, 0, size.width, size.height).data;
  return { width: size.width, height: size.height, data };
}
