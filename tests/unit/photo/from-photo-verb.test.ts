// The from-photo verb: PNG and JPEG files decoded strictly at the edge, paths relative to the input
// file or the current directory, and refusals of everything that is not one plain picture.
import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { crc32 } from "node:zlib";
import sharp from "sharp";
import { beforeAll, describe, expect, test } from "vitest";
import { chartToPixels } from "@/lib/core/photo";
import { run } from "@/scripts/core-verbs/from-photo";
import { degradeToJpeg } from "./degrade";
import { agreementMatched, makeCase } from "./synth";

const gauge = { stitchesPer10cm: 24, rowsPer10cm: 30 };
const palette = [
  { key: ".", name: "Oat", hex: "#EFE6D2" },
  { key: "X", name: "Rowan red", hex: "#9E2B25" },
];
const chart = { version: 1 as const, width: 6, height: 4, gauge, palette, rows: ["X....X", ".X..X.", "..XX..", "XXXXXX"] };

let dir = "";
const at = (name: string) => path.join(dir, name);

async function png(image: { width: number; height: number; data: Uint8Array | Uint8ClampedArray }): Promise<Buffer> {
  return sharp(Buffer.from(image.data), { raw: { width: image.width, height: image.height, channels: 4 } }).png().toBuffer();
}

/** A PNG whose header claims width × height pixels (its pixel data is never reached). */
function pngHeaderOnly(width: number, height: number): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const len = Buffer.alloc(4);
    len.writeUInt32BE(data.length);
    const body = Buffer.concat([Buffer.from(type, "latin1"), data]);
    const crc = Buffer.alloc(4);
    crc.writeUInt32BE(crc32(body));
    return Buffer.concat([len, body, crc]);
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr.set([8, 2, 0, 0, 0], 8);
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk("IHDR", ihdr), chunk("IDAT", Buffer.from([0x78, 0x9c, 0x03, 0x00, 0x00, 0x00, 0x00, 0x01])), chunk("IEND", Buffer.alloc(0))]);
}

beforeAll(async () => {
  dir = mkdtempSync(path.join(tmpdir(), "from-photo-"));
  const picture = await png(chartToPixels(chart, 10, 8));
  writeFileSync(at("chart.png"), picture);
  writeFileSync(at("notes.txt"), "not a picture at all\n");
  writeFileSync(at("with-page.png"), Buffer.concat([picture, Buffer.from("<html><script>alert(1)</script></html>")]));
  const jpeg = await sharp(picture).jpeg({ quality: 80 }).toBuffer();
  writeFileSync(at("chart.jpg"), jpeg);
  writeFileSync(at("with-zip.jpg"), Buffer.concat([jpeg, Buffer.from("PK\x03\x04 an archive follows", "latin1")]));
  writeFileSync(at("cut.jpg"), jpeg.subarray(0, Math.floor(jpeg.length / 2)));
  writeFileSync(at("huge.png"), pngHeaderOnly(20000, 20000));
  writeFileSync(at("picture.gif"), Buffer.from("GIF89a\x01\x00\x01\x00\x00\x00\x00;", "latin1"));
  // A PNG that carries a script in a text chunk before its end.
  const text = Buffer.from("Comment\0<script>fetch('x')</script>", "latin1");
  const len = Buffer.alloc(4);
  len.writeUInt32BE(text.length);
  const body = Buffer.concat([Buffer.from("tEXt", "latin1"), text]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  writeFileSync(at("script-inside.png"), Buffer.concat([picture.subarray(0, 33), len, body, crc, picture.subarray(33)]));
});

const request = (image: string, extra: object = {}) => ({ image, width: 6, height: 4, gauge, palette, ...extra });

describe("from-photo", () => {
  test("a PNG drawn from a chart gives the chart back, exactly as chart v1", async () => {
    expect(await run(request(at("chart.png")))).toEqual(chart);
  });

  test("a JPEG with only the number of colours gives two colours of its own", async () => {
    const out = (await run({ image: at("chart.jpg"), width: 6, height: 4, gauge, colours: 2 })) as typeof chart;
    expect(out.palette.map((p) => p.key)).toEqual(["A", "B"]);
    expect(agreementMatched(chart, out)).toBe(1);
  });

  test("a relative path is found beside the input file, then from the current directory", async () => {
    expect(await run(request("chart.png"), { file: at("input.json") })).toEqual(chart);
    expect(await run(request(path.relative(process.cwd(), at("chart.png"))), { file: "-" })).toEqual(chart);
  });

  test("a photographed chart with 4 colours through the verb: at least 95 % after one-to-one matching", async () => {
    const synth = makeCase(7, 4);
    writeFileSync(at("photo.jpg"), await degradeToJpeg(chartToPixels(synth.chart, synth.cellWidth, synth.cellHeight), { sigma: 1.5, noise: 8, quality: 75, seed: 7 }));
    const out = (await run({ image: at("photo.jpg"), width: 60, height: 80, gauge: synth.chart.gauge, colours: 4 })) as typeof chart;
    expect(agreementMatched(synth.chart, out)).toBeGreaterThanOrEqual(0.95);
  });

  test.each<[string, object, RegExp]>([
    ["not an image", request("notes.txt"), /not a PNG or JPEG image \(checked by its content, not its name\)/],
    ["a GIF", request("picture.gif"), /not a PNG or JPEG image/],
    ["a PNG with a page after it", request("with-page.png"), /refused: \d+ bytes of something else follow the end of the PNG/],
    ["a PNG with a script inside", request("script-inside.png"), /refused: it also holds a document of another kind \(<script/],
    ["a JPEG with an archive after it", request("with-zip.jpg"), /refused: the JPEG does not end with its end-of-image marker/],
    ["a JPEG cut short", request("cut.jpg"), /refused: the JPEG does not end with its end-of-image marker/],
    ["a 20,000 × 20,000 image", request("huge.png"), /20000 × 20000 pixels \(400\.0 megapixels\); at most 50 megapixels are accepted/],
    ["a missing file", request("nowhere.png"), /image "nowhere.png" cannot be read \(ENOENT\)/],
    ["a crop outside the image", request("chart.png", { crop: { x: 50, y: 0, width: 20, height: 10 } }), /crop: the box x 50, y 0, 20 × 10 pixels is not inside the image \(60 × 32 pixels\)/],
    ["zero colours", { ...request("chart.png"), palette: undefined, colours: 0 }, /colours: must be at least 2/],
    ["one colour", { ...request("chart.png"), palette: undefined, colours: 1 }, /colours: must be at least 2/],
    ["a palette of one", request("chart.png", { palette: [palette[0]] }), /palette: has 1 colour; a chart from a photo needs at least 2/],
    ["17 colours", { ...request("chart.png"), palette: undefined, colours: 17 }, /colours: must be at most 16, the most a chart allows/],
    ["a chart too wide", request("chart.png", { width: 401 }), /width: must be from 1 to 400/],
    ["no image", { width: 6, height: 4, gauge, colours: 2 }, /from-photo input: image is missing/],
  ])("refuses %s", async (_, input, message) => {
    await expect(run(input, { file: at("input.json") })).rejects.toThrow(message);
  });

  test("through the command line: the chart on stdout, or the reason on stderr with exit code 2", () => {
    writeFileSync(at("good.json"), JSON.stringify(request("chart.png")));
    writeFileSync(at("bad.json"), JSON.stringify(request("with-page.png")));
    const cli = (file: string) => spawnSync(process.execPath, ["--import", "tsx", "scripts/core.ts", "from-photo", file], { encoding: "utf8" });
    const good = cli(at("good.json"));
    expect(good.status).toBe(0);
    expect(JSON.parse(good.stdout)).toEqual(chart);
    const bad = cli(at("bad.json"));
    expect(bad.status).toBe(2);
    expect(bad.stdout).toBe("");
    expect(bad.stderr).toMatch(/follow the end of the PNG/);
  });
});
