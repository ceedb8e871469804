// The body limit of server actions, shared by the proxy's action guard (lib/action-request-guard.ts)
// and its tests. Kept free of framework imports.

/** Next's default `serverActions.bodySizeLimit` (1 MB); keep both the same if either changes. */
export const MAX_ACTION_BYTES = 1024 * 1024;
