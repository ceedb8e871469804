// What a person can be told about, in their words, and the settings form that chooses which
// kinds also come by e-mail. Shared by lib/server/notifications.ts and the settings pages.
import { z } from "zod";

/** Told to the studio (the owner; assistants only where it is their work, see notifications.ts). */
export const STUDIO_KINDS = ["request", "quote_accepted", "quote_changes", "payment", "proof_approved", "proof_changes", "client_message"] as const;
/** Told to the client. */
export const CLIENT_KINDS = ["quote_sent", "proof_sent", "shipped", "studio_message"] as const;

export type StudioKind = (typeof STUDIO_KINDS)[number];
export type ClientKind = (typeof CLIENT_KINDS)[number];
export type NotificationKind = StudioKind | ClientKind;
export type Audience = "studio" | "client";

/** The label of each kind on the settings pages ("E-mail me when …"). */
export const KIND_LABELS: Record<Audience, Record<string, string>> = {
  studio: {
    request: "a new commission request arrives",
    quote_accepted: "a client accepts a quote",
    quote_changes: "a client asks for changes to a quote",
    payment: "a deposit or balance is paid",
    proof_approved: "a client approves a proof",
    proof_changes: "a client asks for changes to a proof",
    client_message: "a client sends a message (several within a few minutes come as one e-mail)",
  },
  client: {
    quote_sent: "the studio sends me a quote",
    proof_sent: "the studio sends me a chart to check",
    shipped: "my piece is posted",
    studio_message: "the studio sends me a message (several within a few minutes come as one e-mail)",
  },
};

/** The settings form: one checkbox per kind, named `email_<kind>`; a box left unticked is absent. */
export const notificationSettingsFormSchema = (audience: Audience) => {
  const kinds: readonly string[] = audience === "studio" ? STUDIO_KINDS : CLIENT_KINDS;
  return z
    .record(z.string().max(64), z.string().max(16))
    .transform((raw) => Object.fromEntries(kinds.map((k) => [k, raw[`email_${k}`] === "on"])) as Record<string, boolean>);
};

export const audienceSchema = z.enum(["studio", "client"]);
