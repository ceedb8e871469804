// Decoding a reference photo for the photo → chart core, at the edge: only PNG and JPEG, checked by
// their own bytes (never the name), refused when something else is fastened to them (a polyglot),
// limited in pixels before any decoding, and decoded strictly by sharp into 8-bit sRGB RGBA with the
// camera's orientation applied. Without "server-only" so the `from-photo` CLI verb can use it too;
// it imports sharp, so it never reaches a browser bundle.
import sharp from "sharp";
import type { RgbaImage } from "@/lib/core/photo";

/** 50 megapixels: more than any phone camera; refuses decompression bombs before decoding. */
export const MAX_PHOTO_PIXELS = 50_000_000;

export class PhotoDecodeError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "PhotoDecodeError";
  }
}

export type PhotoKind = "png" | "jpeg";

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

/** PNG or JPEG by the first bytes, or null. */
export function sniffPhoto(bytes: Uint8Array): PhotoKind | null {
  if (bytes.length >= 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return "jpeg";
  if (bytes.length >= 8 && PNG_SIGNATURE.every((b, i) => bytes[i] === b)) return "png";
  return null;
}

// Markers of documents that browsers, PDF readers or interpreters would run or show if the same
// bytes were opened as something else. Random compressed data holds one of these 5-to-9-byte
// strings with a chance far below one in a million per file.
const FOREIGN = ["<script", "<html", "<?php", "<svg", "<!doctype", "%PDF-", "<?xml"].map((s) => Buffer.from(s, "latin1"));

/** Why the bytes are more than one plain PNG/JPEG, or null when they are just that. */
export function findPolyglot(bytes: Buffer, kind: PhotoKind): string | null {
  if (kind === "png") {
    // Walk the chunks: the file must end exactly after IEND.
    let at = 8;
    for (;;) {
      if (at + 12 > bytes.length) return "the PNG's chunks are cut short";
      const length = bytes.readUInt32BE(at);
      const type = bytes.toString("latin1", at + 4, at + 8);
      if (!/^[A-Za-z]{4}$/.test(type)) return "the PNG holds a chunk that is not a PNG chunk";
      at += 12 + length;
      if (at > bytes.length) return "the PNG's chunks are cut short";
      if (type === "IEND") break;
    }
    if (at !== bytes.length) return `${bytes.length - at} bytes of something else follow the end of the PNG`;
  } else {
    let end = bytes.length;
    if (bytes[end - 2] !== 0xff || bytes[end - 1] !== 0xd9) return "the JPEG does not end with its end-of-image marker (something else follows it, or it is cut short)";
    end -= 2;
  }
  const lower = Buffer.from(bytes.toString("latin1").toLowerCase(), "latin1");
  for (const marker of FOREIGN) {
    const needle = Buffer.from(marker.toString("latin1").toLowerCase(), "latin1");
    if (lower.indexOf(needle) >= 0) return `it also holds a document of another kind (${marker.toString("latin1")}…)`;
  }
  return null;
}

/** Checks and decodes a PNG or JPEG into RGBA pixels; throws PhotoDecodeError with a reason a person can act on. */
export async function decodePhoto(bytes: Buffer, options: { maxPixels?: number } = {}): Promise<RgbaImage> {
  const maxPixels = options.maxPixels ?? MAX_PHOTO_PIXELS;
  if (bytes.length === 0) throw new PhotoDecodeError("the image file is empty");
  const kind = sniffPhoto(bytes);
  if (!kind) throw new PhotoDecodeError("the file is not a PNG or JPEG image (checked by its content, not its name)");
  const polyglot = findPolyglot(bytes, kind);
  if (polyglot) throw new PhotoDecodeError(`the file is refused: ${polyglot}`);
  let meta: Awaited<ReturnType<ReturnType<typeof sharp>["metadata"]>>;
  try {
    meta = await sharp(bytes, { limitInputPixels: false, failOn: "warning" }).metadata();
  } catch {
    throw new PhotoDecodeError(`the ${kind.toUpperCase()} image could not be read; it may be damaged`);
  }
  if (meta.format !== kind || !meta.width || !meta.height) throw new PhotoDecodeError(`the ${kind.toUpperCase()} image could not be read; it may be damaged`);
  const pixels = meta.width * meta.height;
  if (pixels > maxPixels) {
    throw new PhotoDecodeError(
      `the image is ${meta.width} × ${meta.height} pixels (${(pixels / 1e6).toFixed(1)} megapixels); at most ${maxPixels / 1e6} megapixels are accepted — scale it down first`,
    );
  }
  try {
    const { data, info } = await sharp(bytes, { limitInputPixels: maxPixels, failOn: "warning" })
      .rotate()
      .toColourspace("srgb")
      .ensureAlpha()
      .raw({ depth: "uchar" })
      .toBuffer({ resolveWithObject: true });
    if (info.channels !== 4) throw new Error(`unexpected ${info.channels} channels`);
    return { width: info.width, height: info.height, data: new Uint8Array(data.buffer, data.byteOffset, data.length) };
  } catch {
    throw new PhotoDecodeError(`the ${kind.toUpperCase()} image could not be decoded; it may be damaged or cut short`);
  }
}
