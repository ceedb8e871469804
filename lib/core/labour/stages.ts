// The production stages a commission's labour is estimated and logged against, in working order.
export const STAGES = ["design", "knitting", "embroidery", "blocking", "finishing"] as const;

export type Stage = (typeof STAGES)[number];

export function isStage(value: string): value is Stage {
  return (STAGES as readonly string[]).includes(value);
}
