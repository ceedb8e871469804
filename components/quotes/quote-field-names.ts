// The quote builder's field paths (as the server and the schema report them) in the builder's words.
import { FEATURE_FIELDS } from "./feature-fields";

const NAMES: Record<string, string> = {
  designFeeMinor: "the design fee",
  shippingMinor: "the shipping",
  discountMinor: "the discount",
  rushFeeMinor: "the rush fee",
  requestedDate: "the date the client needs it by",
  earliestDate: "the earliest date",
  validUntil: "the validity date",
  messageToClient: "the message to the client",
  pieces: "the pieces",
  materials: "the yarn",
  extras: "the extras",
};

/** "pieces.1.ends" → "piece 2: ends"; "messageToClient" → "the message to the client". */
export function quoteBuilderFieldName(path: string): string {
  const [top, index, leaf] = path.split(".");
  const n = index !== undefined && /^\d+$/.test(index) ? Number(index) + 1 : null;
  if (top === "pieces" && n) {
    if (leaf === "label") return `the name of piece ${n}`;
    const f = FEATURE_FIELDS.find((x) => x.key === leaf);
    return `piece ${n}: ${f ? f.label.toLowerCase() : "a count"}`;
  }
  if (top === "materials" && n) return `the skeins of yarn ${n}`;
  if (top === "extras" && n) return leaf === "label" ? `the name of extra ${n}` : `the price of extra ${n}`;
  return NAMES[top ?? ""] ?? "a field";
}
