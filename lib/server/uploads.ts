import "server-only";
// Photo uploads: checked by their bytes (never the name or the declared type), limited in size and
// pixel count, re-encoded with sharp so EXIF and GPS data are gone, and stored with a thumbnail.
import { randomUUID } from "node:crypto";
import { and, eq, inArray, isNull } from "drizzle-orm";
import sharp from "sharp";
import { db, type Tx } from "@/db";
import { uploads, type Upload } from "@/db/schema";
import { readBodyLimited } from "./body-limit";
import { AppError } from "./errors";
import { putObject, signedDownloadUrl } from "./storage";

export const MAX_UPLOAD_BYTES = 10 * 1024 * 1024;
/** A multipart body may carry this much beside the photo (boundaries, headers, small fields). */
export const MAX_UPLOAD_BODY_BYTES = MAX_UPLOAD_BYTES + 64 * 1024;
const TOO_LARGE = "That photo is larger than 10 MB; please send a smaller one.";

/** 40 megapixels: more than any phone camera; refuses decompression bombs. */
export const MAX_UPLOAD_PIXELS = 40_000_000;
const MAX_EDGE = 2400;
const THUMB_EDGE = 360;

type Sniffed = "jpeg" | "png" | "webp";

/** The image type by its first bytes (magic numbers), or null. */
export function sniffImage(bytes: Uint8Array): Sniffed | null {
  if (bytes.length >= 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return "jpeg";
  if (bytes.length >= 8 && [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a].every((b, i) => bytes[i] === b)) return "png";
  if (
    bytes.length >= 12 &&
    String.fromCharCode(...bytes.subarray(0, 4)) === "RIFF" &&
    String.fromCharCode(...bytes.subarray(8, 12)) === "WEBP"
  ) {
    return "webp";
  }
  return null;
}

const refuse = (message: string) => new AppError(422, "bad_upload", message);

export interface CleanImage {
  main: Buffer;
  thumb: Buffer;
  width: number;
  height: number;
}

/** Checks and re-encodes one image; throws a 422 with the reason when it is refused. */
export async function cleanImage(bytes: Buffer): Promise<CleanImage> {
  if (bytes.length === 0) throw refuse("That file is empty.");
  if (bytes.length > MAX_UPLOAD_BYTES) throw refuse(TOO_LARGE);
  const kind = sniffImage(bytes);
  if (!kind) throw refuse("That file is not a JPEG, PNG or WebP photo (we check the file itself, not its name).");
  let meta: Awaited<ReturnType<ReturnType<typeof sharp>["metadata"]>>;
  try {
    meta = await sharp(bytes, { limitInputPixels: MAX_UPLOAD_PIXELS }).metadata();
  } catch {
    throw refuse("That photo could not be read; it may be damaged or too large in pixels.");
  }
  if (meta.format !== kind || !meta.width || !meta.height) throw refuse("That photo could not be read; it may be damaged.");
  if (meta.width * meta.height > MAX_UPLOAD_PIXELS) throw refuse("That photo has more than 40 megapixels; please send a smaller one.");
  try {
    // rotate() applies the camera's orientation; without withMetadata() sharp writes no EXIF, GPS or XMP.
    const base = sharp(bytes, { limitInputPixels: MAX_UPLOAD_PIXELS }).rotate().flatten({ background: "#ffffff" });
    const { data: main, info } = await base
      .clone()
      .resize({ width: MAX_EDGE, height: MAX_EDGE, fit: "inside", withoutEnlargement: true })
      .jpeg({ quality: 85 })
      .toBuffer({ resolveWithObject: true });
    const thumb = await base.clone().resize({ width: THUMB_EDGE, height: THUMB_EDGE, fit: "inside" }).jpeg({ quality: 78 }).toBuffer();
    return { main, thumb, width: info.width, height: info.height };
  } catch {
    throw refuse("That photo could not be read; it may be damaged.");
  }
}

export interface StoreUploadInput {
  studioId: string;
  commissionId: string | null;
  kind: Upload["kind"];
  uploadedBy: string | null;
  messageId?: string | null;
  /** progress photos: the piece and work stage they show, and whether the client may see them */
  pieceId?: string | null;
  stage?: string | null;
  sharedWithClient?: boolean;
  bytes: Buffer;
}

/** Cleans and stores an image and its thumbnail; returns the row. */
export async function storeUpload(input: StoreUploadInput): Promise<Upload> {
  const img = await cleanImage(input.bytes);
  const id = randomUUID();
  const objectKey = `uploads/${input.studioId}/${id}.jpg`;
  const thumbKey = `uploads/${input.studioId}/${id}-thumb.jpg`;
  await putObject(objectKey, img.main, "image/jpeg");
  await putObject(thumbKey, img.thumb, "image/jpeg");
  const [row] = await db
    .insert(uploads)
    .values({
      id,
      studioId: input.studioId,
      commissionId: input.commissionId,
      messageId: input.messageId ?? null,
      pieceId: input.pieceId ?? null,
      stage: input.stage ?? null,
      ...(input.sharedWithClient !== undefined ? { sharedWithClient: input.sharedWithClient } : {}),
      kind: input.kind,
      objectKey,
      thumbKey,
      contentType: "image/jpeg",
      bytes: img.main.length,
      width: img.width,
      height: img.height,
      uploadedBy: input.uploadedBy,
    })
    .returning();
  return row;
}

/** Reads the one file of a multipart body (field "file"), refusing anything over the limit first. */
export async function readUploadedFile(req: Request): Promise<Buffer> {
  return (await readUploadedForm(req)).bytes;
}

/**
 * Like readUploadedFile, also giving the form's other fields. The body is streamed with the limit
 * enforced while reading (413 at MAX_UPLOAD_BODY_BYTES, with or without a Content-Length), and only
 * then parsed, so no upload ever holds more than the limit in memory.
 */
export async function readUploadedForm(req: Request): Promise<{ bytes: Buffer; form: FormData }> {
  const contentType = req.headers.get("content-type") ?? "";
  if (!/^multipart\/form-data\s*;/i.test(contentType)) {
    throw new AppError(400, "bad_upload", "Send the photo as a form upload with the field name “file”.");
  }
  const raw = await readBodyLimited(req, MAX_UPLOAD_BODY_BYTES, TOO_LARGE);
  let form: FormData;
  try {
    form = await new Response(new Uint8Array(raw.buffer as ArrayBuffer, raw.byteOffset, raw.byteLength), { headers: { "content-type": contentType } }).formData();
  } catch {
    throw new AppError(400, "bad_upload", "Send the photo as a form upload with the field name “file”.");
  }
  const file = form.get("file");
  if (!file || typeof file === "string") throw new AppError(400, "bad_upload", "Choose a photo to upload.");
  if (file.size > MAX_UPLOAD_BYTES) throw refuse(TOO_LARGE);
  return { bytes: Buffer.from(await file.arrayBuffer()), form };
}

/** Attaches uploads that are not yet attached to anything (draft photos) to a commission. */
export async function attachUploads(tx: Tx, studioId: string, ids: string[], commissionId: string, messageId?: string) {
  if (!ids.length) return;
  await tx
    .update(uploads)
    .set({ commissionId, ...(messageId ? { messageId } : {}) })
    .where(
      and(
        inArray(uploads.id, ids),
        eq(uploads.studioId, studioId),
        messageId ? eq(uploads.commissionId, commissionId) : isNull(uploads.commissionId),
        ...(messageId ? [isNull(uploads.messageId)] : []),
      ),
    );
}

export async function uploadUrl(row: Pick<Upload, "objectKey" | "thumbKey">, size: "full" | "thumb", seconds = 120) {
  return signedDownloadUrl(size === "thumb" ? row.thumbKey : row.objectKey, seconds);
}
