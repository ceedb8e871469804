// Messages between a studio and a client about one commission.
import { z } from "zod";
import { safeString } from "./common";

export const postMessageSchema = z
  .object({
    body: safeString().trim().max(4000, "Keep a message to 4000 characters."),
    /** the sender's own id for the message: a retried send with the same key is stored once */
    clientKey: z.string().regex(/^[A-Za-z0-9_-]{8,64}$/, "clientKey must be 8–64 letters, digits, - or _."),
    uploadIds: z.array(z.string().uuid()).max(6, "Attach at most 6 photos to one message.").default([]),
  })
  .refine((m) => m.body.length > 0 || m.uploadIds.length > 0, { path: ["body"], message: "Write a message or attach a photo." });
export type PostMessageInput = z.output<typeof postMessageSchema>;

export const threadQuerySchema = z.object({ as: z.enum(["studio", "client"]).default("studio") });

export interface ThreadMessage {
  id: string;
  clientKey: string | null;
  body: string;
  authorName: string;
  authorRole: "owner" | "assistant" | "client" | "system";
  mine: boolean;
  createdAt: string;
  attachments: { id: string; thumbUrl: string; url: string; width: number; height: number }[];
}

export interface Thread {
  messages: ThreadMessage[];
  /** how many were unread before this fetch */
  unread: number;
}
