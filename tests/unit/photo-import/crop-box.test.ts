import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { boxForKey, boxFromDrag, centredBox, resizeBox, trueAspect, workingSize, type Box } from "@/components/photo-import/crop-box";

const inside = (b: Box, w: number, h: number) => b.x >= 0 && b.y >= 0 && b.x + b.width <= w && b.y + b.height <= h && b.width >= 1 && b.height >= 1;

describe("the crop box", () => {
  test("its aspect is the area's true shape at the gauge (a stitch is wider than tall)", () => {
    // 40 sts × 40 rows at 32 sts and 36 rows per 10 cm: 12.5 cm × 11.11 cm
    expect(trueAspect(40, 40, { stitchesPer10cm: 32, rowsPer10cm: 36 })).toBeCloseTo(1.125, 10);
    // square gauge: the box is the chart's own shape
    expect(trueAspect(60, 80, { stitchesPer10cm: 20, rowsPer10cm: 20 })).toBeCloseTo(0.75, 10);
    expect(() => trueAspect(0, 10, { stitchesPer10cm: 20, rowsPer10cm: 20 })).toThrow(RangeError);
  });

  test("starts as the largest centred box of that aspect", () => {
    expect(centredBox(1000, 500, 1)).toEqual({ x: 250, y: 0, width: 500, height: 500 });
    expect(centredBox(400, 1000, 2)).toEqual({ x: 0, y: 400, width: 400, height: 200 });
  });

  test("arrows move it, Shift+arrows resize it at the same aspect, always inside the photo", () => {
    const b = { x: 10, y: 10, width: 100, height: 50 };
    expect(boxForKey(b, "ArrowRight", false, 5, 2, 300, 200)).toEqual({ ...b, x: 15 });
    expect(boxForKey(b, "ArrowUp", false, 50, 2, 300, 200)).toEqual({ ...b, y: 0 });
    expect(boxForKey(b, "ArrowRight", true, 5, 2, 300, 200)).toEqual({ x: 5, y: 8, width: 110, height: 55 });
    expect(boxForKey(b, "Enter", false, 5, 2, 300, 200)).toBeNull();
  });

  test("property: any sequence of keys and drags keeps the box inside the image at the locked aspect", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 20, max: 3000 }),
        fc.integer({ min: 20, max: 3000 }),
        fc.double({ min: 0.2, max: 5, noNaN: true }),
        fc.array(fc.tuple(fc.constantFrom("ArrowLeft", "ArrowRight", "ArrowUp", "ArrowDown"), fc.boolean(), fc.integer({ min: 1, max: 500 })), { maxLength: 30 }),
        fc.tuple(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: -0.5, max: 1.5, noNaN: true }), fc.double({ min: -0.5, max: 1.5, noNaN: true })),
        (w, h, aspect, keys, [ax, ay, tx, ty]) => {
          let b = centredBox(w, h, aspect);
          for (const [k, shift, step] of keys) b = boxForKey(b, k, shift, step, aspect, w, h)!;
          expect(inside(b, w, h)).toBe(true);
          const d = boxFromDrag(ax * w, ay * h, tx * w, ty * h, aspect, w, h);
          expect(inside(d, w, h)).toBe(true);
          // rounding to whole pixels is all that bends the aspect
          if (b.width >= 20 && b.height >= 20) expect(Math.abs(b.width / b.height - aspect) / aspect).toBeLessThan(0.1);
        },
      ),
    );
  });

  test("resizing never grows past the photo", () => {
    expect(resizeBox({ x: 0, y: 0, width: 10, height: 10 }, 5000, 1, 300, 200)).toEqual({ x: 0, y: 0, width: 200, height: 200 });
  });

  test("a large crop is scaled to a few times the chart before quantising, a small one is left alone", () => {
    expect(workingSize({ width: 3000, height: 4000 }, 60, 80)).toEqual({ width: 240, height: 320 });
    expect(workingSize({ width: 100, height: 120 }, 60, 80)).toEqual({ width: 100, height: 120 });
    // a crop smaller than the chart is not stretched in one direction only
    expect(workingSize({ width: 30, height: 20 }, 60, 80)).toEqual({ width: 30, height: 20 });
  });
});
