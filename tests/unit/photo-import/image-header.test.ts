import sharp from "sharp";
import { describe, expect, test } from "vitest";
import { checkPhotoHeader, MAX_PHOTO_BYTES, photoSize, sniffPhoto } from "@/components/photo-import/image-header";

const solid = (width: number, height: number) => sharp({ create: { width, height, channels: 3, background: { r: 200, g: 40, b: 40 } } });

describe("a picked photo's header", () => {
  test.each([
    ["png", () => solid(301, 157).png().toBuffer()],
    ["jpeg", () => solid(301, 157).jpeg().toBuffer()],
    ["jpeg progressive", () => solid(301, 157).jpeg({ progressive: true }).toBuffer()],
    ["webp lossy", () => solid(301, 157).webp().toBuffer()],
    ["webp lossless", () => solid(301, 157).webp({ lossless: true }).toBuffer()],
  ])("%s: the size comes from the header", async (_name, make) => {
    const bytes = new Uint8Array(await make());
    const size = photoSize(bytes.subarray(0, 65536));
    expect(size && { width: size.width, height: size.height }).toEqual({ width: 301, height: 157 });
  });

  test("a JPEG with EXIF before its frame is read past the EXIF", async () => {
    const bytes = new Uint8Array(await solid(64, 48).jpeg().withMetadata({ exif: { IFD0: { Copyright: "x".repeat(2000) } } }).toBuffer());
    expect(photoSize(bytes)).toMatchObject({ type: "jpeg", width: 64, height: 48 });
  });

  test("text, a GIF and a file named .png are refused by their bytes", () => {
    expect(sniffPhoto(new TextEncoder().encode("<svg xmlns='http://www.w3.org/2000/svg'/>"))).toBeNull();
    expect(checkPhotoHeader(new TextEncoder().encode("GIF89a\x01\x00\x01\x00"), 10)).toEqual({ ok: false, message: expect.stringContaining("not a JPEG, PNG or WebP") });
    expect(checkPhotoHeader(new Uint8Array(0), 0)).toEqual({ ok: false, message: "That file is empty." });
  });

  test("a photo over the pixel limit is refused before decoding, with its size in the message", () => {
    // a PNG header claiming 20,000 × 20,000 pixels (the body is never read)
    const head = new Uint8Array(33);
    head.set([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
    head.set(new TextEncoder().encode("IHDR"), 12);
    new DataView(head.buffer).setUint32(16, 20_000);
    new DataView(head.buffer).setUint32(20, 20_000);
    const r = checkPhotoHeader(head, 1000);
    expect(r.ok).toBe(false);
    expect(!r.ok && r.message).toContain("20000 × 20000 pixels (400 megapixels)");
    expect(checkPhotoHeader(head, 1000, 400_000_000).ok).toBe(true);
  });

  test("a file over the byte limit is refused unread", () => {
    expect(checkPhotoHeader(new Uint8Array(8), MAX_PHOTO_BYTES + 1).ok).toBe(false);
  });

  test("a truncated PNG header cannot be read", () => {
    expect(checkPhotoHeader(new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), 8)).toEqual({ ok: false, message: "That photo could not be read; it may be damaged." });
  });
});
