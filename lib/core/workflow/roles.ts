// Who can act on a commission. `system` is never a person: verified payment webhooks and timers.
export const ROLES = ["owner", "assistant", "client", "system"] as const;
export type Role = (typeof ROLES)[number];

/** How a refusal names a role to a person; `system` is named by the move itself. */
export const ROLE_NAMES: Record<Role, string> = {
  owner: "the studio owner",
  assistant: "a studio assistant",
  client: "the client",
  system: "the system",
};

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLES as readonly string[]).includes(value);
}
