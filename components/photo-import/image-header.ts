// What a picked file is, read from its first bytes before the browser decodes it: the type by its
// magic number (never the name or the declared type) and its size in pixels from the header, so a
// file that is not a photo, or a photo too large to decode safely, is refused before decoding.

export type PhotoType = "jpeg" | "png" | "webp";

/** 40 megapixels: more than any phone camera (the same limit as uploads on the server). */
export const MAX_PHOTO_PIXELS = 40_000_000;
/** Picked files larger than this are refused unread. */
export const MAX_PHOTO_BYTES = 25 * 1024 * 1024;

export function sniffPhoto(b: Uint8Array): PhotoType | null {
  if (b.length >= 3 && b[0] === 0xff && b[1] === 0xd8 && b[2] === 0xff) return "jpeg";
  if (b.length >= 8 && [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a].every((v, i) => b[i] === v)) return "png";
  if (b.length >= 12 && ascii(b, 0, 4) === "RIFF" && ascii(b, 8, 4) === "WEBP") return "webp";
  return null;
}

function ascii(b: Uint8Array, at: number, n: number): string {
  let s = "";
  for (let i = 0; i < n && at + i < b.length; i++) s += String.fromCharCode(b[at + i]);
  return s;
}

const u16be = (b: Uint8Array, i: number) => (b[i] << 8) | b[i + 1];
const u16le = (b: Uint8Array, i: number) => b[i] | (b[i + 1] << 8);
const u24le = (b: Uint8Array, i: number) => b[i] | (b[i + 1] << 8) | (b[i + 2] << 16);
const u32be = (b: Uint8Array, i: number) => ((b[i] << 24) >>> 0) + ((b[i + 1] << 16) | (b[i + 2] << 8) | b[i + 3]);

/**
 * Width and height from the header (PNG IHDR, JPEG start-of-frame, WebP VP8/VP8L/VP8X), or null
 * when the header cannot be read from these bytes. Give it the first 64 KB or so of the file.
 */
export function photoSize(b: Uint8Array): { type: PhotoType; width: number; height: number } | null {
  const type = sniffPhoto(b);
  if (type === "png") {
    if (b.length < 24 || ascii(b, 12, 4) !== "IHDR") return null;
    return { type, width: u32be(b, 16), height: u32be(b, 20) };
  }
  if (type === "webp") {
    const chunk = ascii(b, 12, 4);
    if (chunk === "VP8 " && b.length >= 30) return { type, width: u16le(b, 26) & 0x3fff, height: u16le(b, 28) & 0x3fff };
    if (chunk === "VP8L" && b.length >= 25) {
      const bits = b[21] | (b[22] << 8) | (b[23] << 16) | (b[24] << 24);
      return { type, width: (bits & 0x3fff) + 1, height: ((bits >>> 14) & 0x3fff) + 1 };
    }
    if (chunk === "VP8X" && b.length >= 30) return { type, width: u24le(b, 24) + 1, height: u24le(b, 27) + 1 };
    return null;
  }
  if (type === "jpeg") {
    let i = 2;
    while (i + 9 < b.length) {
      if (b[i] !== 0xff) return null;
      const marker = b[i + 1];
      if (marker === 0xff) {
        i++;
        continue;
      }
      // start of frame: C0–CF except C4 (huffman), C8 (reserved) and CC (arithmetic coding)
      if (marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc) {
        return { type, width: u16be(b, i + 7), height: u16be(b, i + 5) };
      }
      if (marker === 0xd8 || (marker >= 0xd0 && marker <= 0xd7) || marker === 0x01) {
        i += 2;
        continue;
      }
      i += 2 + u16be(b, i + 2);
    }
    return null;
  }
  return null;
}

export type PhotoCheck = { ok: true; type: PhotoType; width: number; height: number } | { ok: false; message: string };

/** Checks a picked file's first bytes and byte count: the message is for the maker. */
export function checkPhotoHeader(head: Uint8Array, bytes: number, maxPixels = MAX_PHOTO_PIXELS): PhotoCheck {
  if (bytes === 0) return { ok: false, message: "That file is empty." };
  if (bytes > MAX_PHOTO_BYTES) return { ok: false, message: `That file is larger than ${MAX_PHOTO_BYTES / 1024 / 1024} MB; please choose a smaller photo.` };
  const size = photoSize(head);
  if (!size) {
    return sniffPhoto(head)
      ? { ok: false, message: "That photo could not be read; it may be damaged." }
      : { ok: false, message: "That file is not a JPEG, PNG or WebP photo (we check the file itself, not its name)." };
  }
  if (size.width === 0 || size.height === 0) return { ok: false, message: "That photo has no pixels." };
  if (size.width * size.height > maxPixels) {
    const mp = (size.width * size.height) / 1_000_000;
    return {
      ok: false,
      message: `That photo is ${size.width} × ${size.height} pixels (${mp.toFixed(0)} megapixels); photos up to ${maxPixels / 1_000_000} megapixels can be imported. Please scale it down first.`,
    };
  }
  return { ok: true, ...size };
}
