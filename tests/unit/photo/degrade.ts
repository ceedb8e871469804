// Makes a drawn chart look photographed: Gaussian blur (sharp), additive Gaussian noise from a
// seeded PRNG, then JPEG compression (sharp, 4:2:0 chroma as by default) — decoded again by the
// same edge decoder the verb uses.
import sharp from "sharp";
import { decodePhoto } from "@/lib/server/photo-decode";
import { seededRandom, type RgbaImage } from "@/lib/core/photo";

export interface Degradation {
  sigma: number;
  /** standard deviation of the noise in sRGB steps (0–255) */
  noise: number;
  quality: number;
  seed: number;
  /** scale the picture by this factor (non-whole pixels per stitch) before blurring; default 1 */
  scale?: number;
}

export async function degradeToJpeg(image: RgbaImage, d: Degradation): Promise<Buffer> {
  let pipeline = sharp(Buffer.from(image.data.buffer, image.data.byteOffset, image.data.length), {
    raw: { width: image.width, height: image.height, channels: 4 },
  });
  let width = image.width;
  let height = image.height;
  if (d.scale && d.scale !== 1) {
    width = Math.round(image.width * d.scale);
    height = Math.round(image.height * d.scale);
    pipeline = pipeline.resize(width, height, { fit: "fill" });
  }
  const blurred = await pipeline.removeAlpha().blur(d.sigma).raw().toBuffer();
  const random = seededRandom(d.seed);
  const gauss = () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
  for (let i = 0; i < blurred.length; i++) blurred[i] = Math.max(0, Math.min(255, Math.round(blurred[i] + d.noise * gauss())));
  return sharp(blurred, { raw: { width, height, channels: 3 } }).jpeg({ quality: d.quality }).toBuffer();
}

export async function degrade(image: RgbaImage, d: Degradation): Promise<RgbaImage> {
  return decodePhoto(await degradeToJpeg(image, d));
}
