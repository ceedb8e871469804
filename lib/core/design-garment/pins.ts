// The maker's pinned pairs: "knit these two colours in rounds from–to of this part", stored in a
// design chart's options (`options.pins`) and honoured by the garment's round planner. Checked here
// before they are saved, against the garment's round-by-round reading, so the maker reads what is
// wrong with the round named rather than a price that silently ignores the pin.
import type { RoundPinInput, RoundReading } from "../garment";

export interface PinProblem {
  /** the pin's place in the list */
  index: number;
  message: string;
}

export interface PinContext {
  /** the garment's rounds, first piece (a pair's pieces are worked alike) */
  rounds: Pick<RoundReading, "piece" | "part" | "round" | "colours">[];
  /** the design's colours, in palette order */
  palette: { key: string; name?: string }[];
  /** colours duplicate-stitched everywhere (the maker's or the colour plan's choice): never knitted */
  darn: string[];
}

/** The parts of the first piece, each with its number of rounds (for the pin form). */
export function pinParts(rounds: Pick<RoundReading, "piece" | "part" | "round">[]): { part: string; rounds: number }[] {
  const first = rounds[0]?.piece;
  const out: { part: string; rounds: number }[] = [];
  for (const r of rounds) {
    if (r.piece !== first) continue;
    const p = out.find((q) => q.part === r.part);
    if (p) p.rounds = Math.max(p.rounds, r.round);
    else out.push({ part: r.part, rounds: r.round });
  }
  return out;
}

const list = (names: string[]) => (names.length <= 1 ? names.join("") : `${names.slice(0, -1).join(", ")} and ${names[names.length - 1]}`);

/**
 * What is wrong with each pin, in the maker's words (an empty list: every pin can be saved). A pin
 * names exactly two different colours of the design, a part of the garment and rounds within it;
 * a round is pinned to one pair only; and a pinned colour must be one that is knitted, since a
 * darned colour knitted as well would leave a round of three colours with nothing darned.
 */
export function checkPins(pins: RoundPinInput[], ctx: PinContext): PinProblem[] {
  const problems: PinProblem[] = [];
  const parts = pinParts(ctx.rounds);
  const name = (key: string) => ctx.palette.find((c) => c.key === key)?.name || key;
  const taken = new Map<string, { pair: string; index: number }>();
  pins.forEach((pin, index) => {
    const say = (message: string) => problems.push({ index, message });
    const partName = pin.part ?? parts[0]?.part;
    const part = parts.find((p) => p.part === partName);
    if (!part) return say(`There is no part “${pin.part}” to pin (the parts are ${list(parts.map((p) => p.part))}).`);
    if (!Array.isArray(pin.pair) || pin.pair.length !== 2) return say("A pin names exactly two colours: at most two colours are knitted in a round.");
    const [a, b] = pin.pair;
    const unknown = pin.pair.filter((k) => !ctx.palette.some((c) => c.key === k));
    if (unknown.length) return say(`Colour ${list(unknown)} is not in the design's palette.`);
    if (a === b) return say("Choose two different colours: a pin says which two are knitted.");
    if (!Number.isInteger(pin.fromRound) || !Number.isInteger(pin.toRound) || pin.fromRound < 1 || pin.toRound > part.rounds || pin.toRound < pin.fromRound) {
      return say(`Rounds ${pin.fromRound}–${pin.toRound} are not rounds of the ${part.part}: choose from 1 to ${part.rounds}, the first no higher than the last.`);
    }
    const darned = pin.pair.filter((k) => ctx.darn.includes(k));
    if (darned.length) {
      // Name the first round of the range where the pin would knit three colours and darn none.
      const three = ctx.rounds.find(
        (r) => r.piece === ctx.rounds[0]?.piece && r.part === part.part && r.round >= pin.fromRound && r.round <= pin.toRound && (r.colours?.length ?? 0) >= 3,
      );
      const why = `${list(darned.map(name))} ${darned.length > 1 ? "are" : "is"} darned in this design`;
      if (three) {
        return say(
          `Round ${three.round} of the ${part.part} holds ${list((three.colours ?? []).map(name))}: pinning ${name(a)} and ${name(b)} there would knit three colours with nothing darned (${why}). Pin two of the colours that are knitted, or choose the knitted pair by hand.`,
        );
      }
      return say(`${why}, so it cannot be pinned as knitted. Pin two of the colours that are knitted.`);
    }
    const pair = [a, b].sort().join("+");
    for (let r = pin.fromRound; r <= pin.toRound; r++) {
      const at = `${part.part}#${r}`;
      const was = taken.get(at);
      if (was && was.pair !== pair) return say(`Round ${r} of the ${part.part} is already pinned by pin ${was.index + 1}; a round keeps one pair.`);
    }
    for (let r = pin.fromRound; r <= pin.toRound; r++) taken.set(`${part.part}#${r}`, { pair, index });
  });
  return problems;
}

/** Pins as a chart's options store them (unknown shapes dropped; `checkPins` says what is wrong with the rest). */
export function storedPins(v: unknown): RoundPinInput[] {
  if (!Array.isArray(v)) return [];
  return v.flatMap((p): RoundPinInput[] => {
    if (!p || typeof p !== "object") return [];
    const o = p as Record<string, unknown>;
    const pair = o.pair;
    if (!Number.isInteger(o.fromRound) || !Number.isInteger(o.toRound) || !Array.isArray(pair) || pair.length !== 2 || !pair.every((k) => typeof k === "string")) return [];
    return [
      {
        fromRound: o.fromRound as number,
        toRound: o.toRound as number,
        pair: [pair[0] as string, pair[1] as string],
        ...(typeof o.piece === "string" ? { piece: o.piece } : {}),
        ...(typeof o.part === "string" ? { part: o.part } : {}),
      },
    ];
  });
}
