// Paths whose percent-encoding is not UTF-8 are 400 in the proxy (Next would answer its own 500 while
// decoding a dynamic segment); every decodable path passes.
import { describe, expect, test } from "vitest";
import { malformedPathResponse } from "@/lib/path-guard";

describe("malformed percent-encodings in the path", () => {
  test.each(["/studio/pieces/%ED%A0%80", "/api/commissions/%FF/uploads", "/portal/commissions/%C0%80", "/x/%E0%A4", "/%", "/a/%zz"])("%s → 400", (p) => {
    expect(malformedPathResponse(p)?.status).toBe(400);
  });
  test.each(["/", "/studio/pieces/0b0e0c1a-0000-4000-8000-000000000001", "/studios/caf%C3%A9", "/x/%2F%20%41", "/api/health"])("%s passes", (p) => {
    expect(malformedPathResponse(p)).toBeNull();
  });
});
