// The PDF font setup prints any name or note: Greek, Cyrillic, CJK and symbols through the fallback
// fonts, emoji as their names. Set PDF_SAMPLE_OUT=/tmp/x.pdf to keep the rendered card for a look.
import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { getCareCard } from "@/lib/core/production";
import { renderPdf } from "@/lib/server/pdf";
import { CareCardDocument } from "@/templates/pdf/care-card";

function hasPdftotext(): boolean {
  try {
    execFileSync("pdftotext", ["-v"], { stdio: "ignore" });
    return true;
  } catch {
    return false;
  }
}

describe("PDF fonts and emoji", () => {
  it("prints a care card whose names mix scripts, symbols and emoji", async () => {
    const card = getCareCard({ fibres: ["Wool (100 %, non-superwash)"], wearer: "child", garment: "pullover" });
    const pdf = await renderPdf(
      CareCardDocument({
        studio: { name: "Fadenwerk 🧶 Studio", contactEmail: "hello@example.test", brandHex: "#7A3E2B" },
        piece: {
          title: "Mittens for Zoë ❤️ 🎄 Ελένη 王小明 さくら 김민준 ✓ ★ € ½ → 𝓜𝓪𝓻𝔂 👩‍💻 🇬🇧",
          clientName: "Ольга Петрова 😀",
          yarns: ["Merino Ωmega, Forest 🌲 (wool)"],
        },
        card,
      }),
    );
    const file = process.env.PDF_SAMPLE_OUT ?? path.join(mkdtempSync(path.join(tmpdir(), "pdf-")), "card.pdf");
    writeFileSync(file, pdf);
    const raw = pdf.toString("latin1");
    // The fallback fonts are embedded (as subsets) because the text needed them.
    expect(raw).toMatch(/DejaVuSans/);
    expect(raw).toMatch(/DroidSansFallback/);
    if (!hasPdftotext()) return;
    const text = execFileSync("pdftotext", ["-enc", "UTF-8", file, "-"]).toString("utf8").replace(/\s+/g, " ");
    for (const words of ["Ольга Петрова [grinning face]", "[red heart] [Christmas tree]", "Ελένη", "王小明", "さくら", "김민준", "✓ ★ € ½ →", "Mary", "[woman laptop]", "[flag GB]", "[yarn]"]) {
      expect(text).toContain(words);
    }
  });
});
