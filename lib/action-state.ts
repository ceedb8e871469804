// Types for server-action state, importable from client components (no server code here).
export type FieldErrors = Record<string, string[]>;

export type ActionState<T = undefined> =
  | { status: "idle" }
  | { status: "ok"; data: T; message?: string }
  | { status: "error"; message: string; fieldErrors?: FieldErrors; values?: Record<string, string> };

export const idleState = { status: "idle" } as const;
