// Loading placeholders: grey blocks in the shape of the page to come, announced once to screen
// readers. The pulse is off for people who ask for reduced motion.
export function SkeletonBlock({ className = "" }: { className?: string }) {
  return <div aria-hidden="true" className={`rounded-md bg-fleece motion-safe:animate-pulse ${className}`} />;
}

export function PageSkeleton({ label, children }: { label: string; children?: React.ReactNode }) {
  return (
    <div role="status" aria-live="polite" aria-busy="true" className="space-y-4" data-testid="page-skeleton">
      <p className="text-sm font-semibold text-bark">
        <Spinner /> {label}
      </p>
      <SkeletonBlock className="h-9 w-2/3" />
      <SkeletonBlock className="h-5 w-1/2" />
      {children ?? (
        <>
          <SkeletonBlock className="h-40 w-full" />
          <SkeletonBlock className="h-24 w-full" />
        </>
      )}
    </div>
  );
}

/** A small turning ring beside a "working…" text (still, with reduced motion). */
export function Spinner() {
  return <span aria-hidden="true" className="mr-1 inline-block h-3.5 w-3.5 rounded-full border-2 border-bark/30 border-t-loch align-[-2px] motion-safe:animate-spin" />;
}
