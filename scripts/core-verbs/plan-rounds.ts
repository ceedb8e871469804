// plan-rounds: { "piece": { "rounds": [[key | index, …] | "string of one-character keys", …] (bottom
// round first, each in knitting order from the start of the round), "palette": [{ "key", "hex",
// "name"? }], "gauge": { "stitchesPer10cm", "rowsPer10cm" } }, "options"?: { "darn"?, "pins"?:
// [{ "fromRound", "toRound", "pair" }], "inTheRound"?, "floatLimitStitches"?, "floatLimitCm"?,
// "carryLimitCm"?, "rates"? } } → per round the held pair, what is knitted and darned and why;
// totals; the darning route per colour; the best single pair for comparison.
import { z } from "zod";
import { parseWithMessages } from "@/lib/core/chart/zod-messages";
import { planRoundPairs } from "@/lib/core/colourwork/round-pairs";

const requestSchema = z
  .object({
    piece: z.unknown().refine((v) => v !== undefined, { error: "piece is missing" }),
    options: z.unknown().optional(),
  })
  .strict();

export function run(input: unknown): unknown {
  const request = parseWithMessages(requestSchema, input, "plan-rounds input");
  const piece = request.piece as { rounds?: unknown } | null;
  // Rounds drawn as strings of one-character keys read more easily by hand.
  if (piece && typeof piece === "object" && Array.isArray(piece.rounds)) {
    piece.rounds = piece.rounds.map((r: unknown) => (typeof r === "string" ? Array.from(r) : r));
  }
  return planRoundPairs(piece, request.options ?? {});
}
