// from-photo: { "image": "<path to a PNG or JPEG>", "width", "height", "gauge": { "stitchesPer10cm",
// "rowsPer10cm" }, "palette": [ { "key", "name", "hex" } ] | "colours": n, "crop"?: { "x", "y",
// "width", "height" } (pixels), "cleanup"?: { "removeIsolated"?: boolean } } → a chart v1. A relative
// image path is looked up beside the input file first, then from the directory `npm run` was started
// in (INIT_CWD; npm moves to the project's folder), then from the current directory.
import { existsSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { z } from "zod";
import { parseWithMessages } from "@/lib/core/chart/zod-messages";
import { photoToChart } from "@/lib/core/photo";
import { decodePhoto } from "@/lib/server/photo-decode";

/** Larger files are refused before reading (a 50-megapixel JPEG or PNG is far smaller). */
const MAX_FILE_BYTES = 200_000_000;

const colour = z.object({ key: z.string(), name: z.string(), hex: z.string() });

const requestSchema = z.object({
  image: z.string().min(1, { error: "image must be the path of a PNG or JPEG file" }),
  width: z.number(),
  height: z.number(),
  gauge: z.object({ stitchesPer10cm: z.number(), rowsPer10cm: z.number() }),
  palette: z.array(colour).optional(),
  colours: z.number().optional(),
  crop: z.object({ x: z.number(), y: z.number(), width: z.number(), height: z.number() }).optional(),
  cleanup: z.object({ removeIsolated: z.boolean().optional() }).optional(),
});

function resolveImage(image: string, file: string | undefined): string {
  if (path.isAbsolute(image)) return image;
  const candidates = [
    ...(file && file !== "-" ? [path.resolve(path.dirname(file), image)] : []),
    ...(process.env.INIT_CWD ? [path.resolve(process.env.INIT_CWD, image)] : []),
    path.resolve(image),
  ];
  return candidates.find((p) => existsSync(p)) ?? candidates[0];
}

export async function run(input: unknown, context: { file?: string } = {}): Promise<unknown> {
  const request = parseWithMessages(requestSchema, input, "from-photo input");
  const where = resolveImage(request.image, context.file);
  let bytes: Buffer;
  try {
    const size = statSync(where).size;
    if (size > MAX_FILE_BYTES) {
      throw new Error(`from-photo input: image ${JSON.stringify(request.image)} is ${(size / 1e6).toFixed(0)} MB; at most ${MAX_FILE_BYTES / 1e6} MB are read`);
    }
    bytes = readFileSync(where);
  } catch (e) {
    if ((e as Error).message.startsWith("from-photo input:")) throw e;
    throw new Error(`from-photo input: image ${JSON.stringify(request.image)} cannot be read (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
  }
  let pixels;
  try {
    pixels = await decodePhoto(bytes);
  } catch (e) {
    throw new Error(`from-photo input: image ${JSON.stringify(request.image)}: ${(e as Error).message}`);
  }
  const { chart } = photoToChart(pixels, {
    width: request.width,
    height: request.height,
    gauge: request.gauge,
    palette: request.palette,
    colours: request.colours,
    crop: request.crop,
    cleanup: request.cleanup,
  });
  return chart;
}
