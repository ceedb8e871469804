import { describe, expect, it } from "vitest";
import { printableText } from "@/lib/core/text/printable";

describe("printableText", () => {
  it("leaves plain text and letters our fonts draw as they are", () => {
    expect(printableText("Mittens, size 6-8 (queued)")).toBe("Mittens, size 6-8 (queued)");
    expect(printableText("Zoë Ελένη Ольга 王小明 さくら 김민준")).toBe("Zoë Ελένη Ольга 王小明 さくら 김민준");
    expect(printableText("© ™ ★ ✓ € ½ → ☀")).toBe("© ™ ★ ✓ € ½ → ☀");
    expect(printableText("two\nlines\tand a tab")).toBe("two\nlines\tand a tab");
  });

  it("writes emoji as their names", () => {
    expect(printableText("Thank you 😀")).toBe("Thank you [grinning face]");
    expect(printableText("❤️🧶")).toBe("[red heart][yarn]");
    expect(printableText("👍🏽 ok")).toBe("[thumbs up] ok"); // the skin tone goes with its emoji
    expect(printableText("👩‍💻")).toBe("[woman laptop]");
    expect(printableText("🇬🇧 🇯🇵")).toBe("[flag GB] [flag JP]");
    expect(printableText("1️⃣")).toBe("[keycap 1]");
    expect(printableText("☀️")).toBe("[sun]"); // asks for emoji presentation
  });

  it("writes unknown emoji and undrawable characters as [symbol], drops controls", () => {
    expect(printableText("🦩")).toBe("[symbol]");
    expect(printableText("a\u0000b\u0007c")).toBe("abc");
    expect(printableText("x\uE000y")).toBe("x[symbol]y");
    expect(printableText("\u{20000}")).toBe("[symbol]");
    expect(printableText("\uD800")).toBe("[symbol]");
  });

  it("turns mathematical 'fancy' letters into plain ones", () => {
    expect(printableText("𝓜𝓪𝓻𝔂")).toBe("Mary");
  });
});
