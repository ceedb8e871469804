import type { Tx } from "../index";

/** What the base demo scenario created, for each area's seed part to build on. */
export interface SeedContext {
  studioId: string;
  /** demo-owner, demo-assistant, demo-priya … keyed "owner", "assistant", "priya", "elias", "saoirse" */
  userIds: Record<string, string>;
  /** studio_clients ids keyed "priya", "elias", "saoirse" */
  clientIds: Record<string, string>;
  /** keyed "priya-mittens", "elias-hat", "saoirse-baby", "priya-pullover", "elias-reindeer" */
  commissionIds: Record<string, string>;
  /** keyed by colour name ("Gull white", "Peat brown", "Rowanberry", "Loch blue", "Gorse", "Lichen green") */
  yarnIds: Record<string, string>;
}

export type SeedPart = (tx: Tx, ctx: SeedContext) => Promise<void>;
