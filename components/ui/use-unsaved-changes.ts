"use client";
// Asks before work is lost: `beforeunload` for reloads, closing the tab and typed addresses, and a
// capture-phase click listener on internal links for in-app navigation (the App Router has no
// route-change event to cancel). `onLeave` runs when the page is hidden or left anyway, so a pending
// autosave can be flushed (pagehide / visibilitychange).
import { useEffect, useRef } from "react";

export const LEAVE_QUESTION = "You have changes that are not saved yet. Leave this page and lose them?";

/** True when a click on this anchor would navigate this tab to another page of the app. */
export function isInternalNavigation(a: HTMLAnchorElement, event: MouseEvent, here: Location): boolean {
  if (event.button !== 0 || event.metaKey || event.ctrlKey || event.shiftKey || event.altKey) return false;
  if (a.hasAttribute("download")) return false;
  const target = a.getAttribute("target");
  if (target && target !== "_self") return false;
  let url: URL;
  try {
    url = new URL(a.href, here.href);
  } catch {
    return false;
  }
  if (url.origin !== here.origin) return false;
  // A jump within the same page loses nothing.
  if (url.pathname === here.pathname && url.search === here.search && url.hash) return false;
  return true;
}

export function useUnsavedChanges(dirty: boolean, opts: { onLeave?: () => void; question?: string } = {}): void {
  const state = useRef({ dirty, ...opts });
  state.current = { dirty, ...opts };

  useEffect(() => {
    const onBeforeUnload = (e: BeforeUnloadEvent) => {
      state.current.onLeave?.();
      if (!state.current.dirty) return;
      e.preventDefault();
      // Older browsers need returnValue set to show the question.
      e.returnValue = "";
    };
    const onClick = (e: MouseEvent) => {
      if (!state.current.dirty || e.defaultPrevented) return;
      const a = (e.target as Element | null)?.closest?.("a[href]");
      if (!(a instanceof HTMLAnchorElement) || !isInternalNavigation(a, e, window.location)) return;
      if (window.confirm(state.current.question ?? LEAVE_QUESTION)) {
        state.current.onLeave?.();
        return;
      }
      e.preventDefault();
      e.stopPropagation();
    };
    const onHide = () => state.current.onLeave?.();
    const onVisibility = () => {
      if (document.visibilityState === "hidden") state.current.onLeave?.();
    };
    window.addEventListener("beforeunload", onBeforeUnload);
    document.addEventListener("click", onClick, true);
    window.addEventListener("pagehide", onHide);
    document.addEventListener("visibilitychange", onVisibility);
    return () => {
      window.removeEventListener("beforeunload", onBeforeUnload);
      document.removeEventListener("click", onClick, true);
      window.removeEventListener("pagehide", onHide);
      document.removeEventListener("visibilitychange", onVisibility);
    };
  }, []);
}
