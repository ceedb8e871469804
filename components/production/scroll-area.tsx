import type { ReactNode } from "react";

/** A horizontally scrolling area that keyboard users can reach and scroll (tables on narrow screens). */
export function ScrollArea({ label, children, className = "overflow-x-auto" }: { label: string; children: ReactNode; className?: string }) {
  return (
    <div className={`${className} focus-visible:outline-2 focus-visible:outline-loch`} tabIndex={0} role="region" aria-label={label}>
      {children}
    </div>
  );
}
