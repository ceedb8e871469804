// Which labour figure a quote charges, said in words a client understands. The studio chooses it
// in settings (pricePolicy); P80 is the default, and every quote, its PDF and the client's view say so.
import type { LabourPolicy, Quote } from "./build-quote";

export const LABOUR_LEVEL_NAMES: Readonly<Record<LabourPolicy, string>> = {
  p80: "cautious (P80)",
  p50: "typical (P50)",
};

/** One sentence for the client; null when the quote charges no labour. */
export function labourLevelNote(quote: Pick<Quote, "labourPolicy" | "lines">): string | null {
  if (!quote.lines.some((l) => l.kind === "labour")) return null;
  return quote.labourPolicy === "p50"
    ? "Labour is priced at the time a piece like this typically takes us: about half take less and half take longer."
    : "Labour is priced at the time we finish four pieces in five by, so the price already allows for a slower knit.";
}

/** For the studio's own screens: which figure prices its quotes, and that it is a setting. */
export function labourLevelForStudio(policy: LabourPolicy): string {
  return policy === "p80"
    ? "Quotes charge the cautious (P80) labour figure, the time four pieces in five are finished by."
    : "Quotes charge the typical (P50) labour figure, the time half of the pieces are finished by.";
}
