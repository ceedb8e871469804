"use client";
import { magicLinkClient } from "better-auth/client/plugins";
import { createAuthClient } from "better-auth/react";

// Same origin as the page: no base URL needed.
export const authClient = createAuthClient({ plugins: [magicLinkClient()] });
